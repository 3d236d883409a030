package view

import (
	"bytes"
	"context"
	"strings"
	"testing"

	"golang.org/x/net/html"

	"raytable/optics/analysis"
	"raytable/optics/benchtest"
	"raytable/optics/numfmt"
)

// textOf is the text inside n, concatenated.
func textOf(n *html.Node) string {
	var sb strings.Builder
	walk(n, func(c *html.Node) {
		if c.Type == html.TextNode {
			sb.WriteString(c.Data)
		}
	})
	return sb.String()
}

// TestNumbersPanelShowsSpacing renders the demo bench's numbers and finds the spacing table in
// the numbers panel: one body row per element in bench order, the depth of focus in its note, and
// the tightest gaps marked. The values themselves are checked in optics/analysis.
func TestNumbersPanelShowsSpacing(t *testing.T) {
	b := benchtest.Load(t, "demo-bench.json")
	r, err := analysis.Run(b)
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := ResultFragment(Result{Numbers: NumbersPanel(r)}).Render(context.Background(), &buf); err != nil {
		t.Fatal(err)
	}
	doc := parse(t, buf.String())

	var panel, table *html.Node
	walk(doc, func(n *html.Node) {
		switch v, _ := attrOf(n, "data-testid"); v {
		case "numbers":
			panel = n
		case "spacing":
			table = n
		}
	})
	if panel == nil || table == nil {
		t.Fatal("no numbers panel or no spacing table in it")
	}
	inside := false
	walk(panel, func(n *html.Node) { inside = inside || n == table })
	if !inside || table.Data != "table" {
		t.Fatalf("spacing is a <%s>, inside the numbers panel: %v", table.Data, inside)
	}

	var ids []string
	var marked []string
	walk(table, func(n *html.Node) {
		if n.Type != html.ElementNode || n.Data != "tr" || n.Parent == nil || n.Parent.Data != "tbody" {
			return
		}
		var first *html.Node
		for c := n.FirstChild; c != nil && first == nil; c = c.NextSibling {
			if c.Type == html.ElementNode && c.Data == "td" {
				first = c
			}
		}
		if first == nil {
			t.Fatal("a spacing row without cells")
		}
		ids = append(ids, textOf(first))
		if cls, _ := attrOf(n, "class"); strings.Contains(cls, "marked") {
			marked = append(marked, textOf(first))
		}
	})
	var want []string
	for _, e := range b.Elements {
		want = append(want, e.ID)
	}
	if strings.Join(ids, ",") != strings.Join(want, ",") {
		t.Errorf("spacing rows %v, want one per element %v", ids, want)
	}
	// The pinhole's and L2's gaps both set the expander's collimation: the tightest two.
	if strings.Join(marked, ",") != "PH,L2" {
		t.Errorf("marked rows %v, want PH,L2", marked)
	}
	// The demo has a beam: the note gives the output waist's Rayleigh range (README, Report, spacing).
	if note := textOf(table.Parent); !strings.Contains(note, "Rayleigh range, "+numfmt.Panel.Format(*r.SpacingBasis.RayleighMM)+" mm") {
		t.Errorf("the spacing note does not give the Rayleigh range %s mm", numfmt.Panel.Format(*r.SpacingBasis.RayleighMM))
	}
}
