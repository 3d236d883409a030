package view

import (
	"bytes"
	"context"
	"strings"
	"testing"

	"golang.org/x/net/html"

	"raytable/optics"
)

// TestBlurTable lays out blur rows: values in micrometres, arriving rays as "n of m", a row wider
// than its Airy radius marked, and a row with no finite image showing a dash for the Airy radius.
func TestBlurTable(t *testing.T) {
	airy, efl := 0.016, 100.0
	// A focusing system: a collimated or virtual image would show no Airy radius at all.
	focusing := optics.SystemValues{PlaneValues: optics.PlaneValues{Cardinal: optics.Cardinal{EFLMM: &efl}}, Optical: true}
	r := &optics.Report{System: focusing, Blur: []optics.Blur{
		{Element: "CAM", Field: "0 deg", WavelengthNM: 632.8, Rays: 21, Traced: 21, RMSMM: 0.0092, PeakMM: 0.0223, AiryRadiusMM: &airy},
		{Element: "CAM", Field: "0 deg", WavelengthNM: 532, Rays: 18, Traced: 21, RMSMM: 0.0657, PeakMM: 0.1177, AiryRadiusMM: &airy},
		{Element: "CARD", Field: "1 mm", WavelengthNM: 532, Rays: 21, Traced: 21, RMSMM: 0.5, PeakMM: 0.9},
	}}
	var buf bytes.Buffer
	if err := ResultFragment(Result{Numbers: NumbersPanel(r)}).Render(context.Background(), &buf); err != nil {
		t.Fatal(err)
	}
	var table *html.Node
	walk(parse(t, buf.String()), func(n *html.Node) {
		if v, _ := attrOf(n, "data-testid"); v == "blur" {
			table = n
		}
	})
	if table == nil {
		t.Fatal("no blur table in the numbers panel")
	}
	var rows []string
	var marked []bool
	walk(table, func(n *html.Node) {
		if n.Type == html.ElementNode && n.Data == "tr" && n.Parent != nil && n.Parent.Data == "tbody" {
			var cells []string
			for c := n.FirstChild; c != nil; c = c.NextSibling {
				if c.Type == html.ElementNode && c.Data == "td" {
					cells = append(cells, textOf(c))
				}
			}
			rows = append(rows, strings.Join(cells, "|"))
			cls, _ := attrOf(n, "class")
			marked = append(marked, strings.Contains(cls, "marked"))
		}
	})
	want := []string{
		"CAM|0 deg|632.8|21 of 21|9.2|22.3|16",
		"CAM|0 deg|532|18 of 21|65.7|117.7|16",
		"CARD|1 mm|532|21 of 21|500|900|—",
	}
	if strings.Join(rows, "\n") != strings.Join(want, "\n") {
		t.Errorf("rows\n%s\nwant\n%s", strings.Join(rows, "\n"), strings.Join(want, "\n"))
	}
	if len(marked) != 3 || marked[0] || !marked[1] || marked[2] {
		t.Errorf("marked %v, want only the 532 nm row at CAM", marked)
	}
}

// TestCompareRowsBlurAndSpacing: the compare page pairs the blur and the gap tolerances of two
// designs and marks the ones that changed.
func TestCompareRowsBlurAndSpacing(t *testing.T) {
	tol := func(v float64) *float64 { return &v }
	a := &optics.Report{
		Blur:    []optics.Blur{{Element: "CAM", Field: "0 deg", WavelengthNM: 632.8, RMSMM: 0.010}},
		Spacing: []optics.SpacingTolerance{{ID: "L2", ToleranceMM: tol(0.2)}},
	}
	b := &optics.Report{
		Blur:    []optics.Blur{{Element: "CAM", Field: "0 deg", WavelengthNM: 632.8, RMSMM: 0.004}},
		Spacing: []optics.SpacingTolerance{{ID: "L2", ToleranceMM: tol(0.2)}},
	}
	rows, _ := CompareRows(a, b)
	got := map[string]CompareRow{}
	for _, r := range rows {
		got[r.Label] = r
	}
	blur, ok := got["blur at CAM, 0 deg, 632.8 nm RMS (µm)"]
	if !ok || blur.A != "10" || blur.B != "4" || !blur.Changed {
		t.Errorf("blur row %+v (found %v), want 10 -> 4 marked", blur, ok)
	}
	gap, ok := got["L2 gap tolerance ± (mm)"]
	if !ok || gap.A != "0.2" || gap.Changed {
		t.Errorf("tolerance row %+v (found %v), want 0.2 unchanged", gap, ok)
	}
}
