package tables

import (
	"testing"

	"raytable/optics/analysis"
	"raytable/optics/benchtest"
)

// Each layout's style of joining a name and a unit, as the text report and the pages have always
// written them.
func TestLabel(t *testing.T) {
	first, usual := &Origin{Point: "first vertex"}, &Origin{Point: "last vertex", Usual: true}
	for _, tc := range []struct {
		got, want string
	}{
		{Label("EFL", MM, Text), "EFL mm"},
		{Label("EFL", MM, Page), "EFL (mm)"},
		{Label("heading in/out", Deg, Text), "heading in/out deg"},
		{Label("heading out", Deg, Compare), "heading out (°)"},
		{Label("RMS", UM, Text), "RMS um"},
		{Label("power passed", Percent, Page), "power passed"},
		{Label("power passed", Percent, Compare), "power passed (%)"},
		{Label("", NM, Text), ""},
		{quantityLabel(same("entrance pupil"), MM, first, Page), "entrance pupil from the first vertex (mm)"},
		{quantityLabel(same("entrance pupil"), MM, first, Text), "entrance pupil mm (from first vertex)"},
		{quantityLabel(same("image distance"), MM, usual, Page), "image distance from the last vertex (mm)"},
		{quantityLabel(same("image distance"), MM, usual, Text), "image distance mm"},
		{quantityLabel(same("image distance"), MM, usual, Compare), "image distance (mm)"},
	} {
		if tc.got != tc.want {
			t.Errorf("got %q, want %q", tc.got, tc.want)
		}
	}
}

// Each layout's profile for each precision: six significant digits in text, five on the pages
// (common practice for engineering tables), fractions as percentages on the pages.
func TestCellProfiles(t *testing.T) {
	for _, tc := range []struct {
		c                   Cell
		text, page, compare string
	}{
		{val(-41.56187), "-41.5619", "-41.562", "-41.562"},
		{num(1.4570183, Index), "1.457018", "1.457018", "1.457018"},
		{num(0.99848, Fraction), "0.9985", "99.848 %", "99.848"},
		{num(4.5e-7, SmallAngle), "4.5e-07", "0.45", "0.45"},
		{count(82), "82", "82", "82"},
		{absent(NotCritical), "-", "not critical", "—"},
		{absent(Flat), "-", "flat", "—"},
		{pair(val(0), val(90), InOut), "0/90", "0 → 90", "0 → 90"},
		{pair(val(100), val(647.34), Range), "100 to 647.34", "100 to 647.34", "100 to 647.34"},
		{text(Words{Page: "the source", Text: "source"}), "source", "the source", ""},
	} {
		if got := [3]string{tc.c.In(Text), tc.c.In(Page), tc.c.In(Compare)}; got != [3]string{tc.text, tc.page, tc.compare} {
			t.Errorf("cell writes %q, want %q", got, [3]string{tc.text, tc.page, tc.compare})
		}
	}
	if v, ok := num(0.5, Fraction).Number(Compare); !ok || v != 50 {
		t.Errorf("a fraction of 0.5 pairs as %v, want 50 (percent)", v)
	}
	if !absent(NoAperture).Omitted(Compare) || absent(Undefined).Omitted(Compare) || absent(NoAperture).Omitted(Page) {
		t.Error("only a missing aperture is left out, and only on the compare page")
	}
}

func TestPhrase(t *testing.T) {
	p := Phrase{Words: Words{Page: "at %[1]s nm, ref %[2]s", Text: "%[2]s / %[1]s"}, Args: []Cell{val(632.8), say("%[1]s")}}
	if got := p.In(Page); got != "at 632.8 nm, ref %[1]s" {
		t.Errorf("page phrase %q: a quoted text must not be read as a placeholder", got)
	}
	if got := p.In(Text); got != "%[1]s / 632.8" {
		t.Errorf("text phrase %q", got)
	}
}

// TestDemoSections builds the demo bench's tables: every section is shown by some layout, every
// row has a cell for each column of the layouts it appears in, and a few values read as the
// bench's golden reports give them (testdata/golden/reports/demo-bench.txt, pages/demo.html).
func TestDemoSections(t *testing.T) {
	b := benchtest.Load(t, "demo-bench.json")
	r, err := analysis.Run(b)
	if err != nil {
		t.Fatal(err)
	}
	tb := Build(r)
	shown := map[Name]bool{}
	for _, l := range []Layout{Text, Page, Compare} {
		for _, s := range tb.In(l) {
			shown[s.Name] = true
		}
	}
	for _, s := range tb.Sections {
		if !shown[s.Name] {
			t.Errorf("section %s is built but no layout shows it", s.Name)
		}
		for _, row := range s.Rows {
			if len(row.Cells) > len(s.Columns) || (row.In&(Page|Compare) != 0 && len(row.Cells) != len(s.Columns)) {
				t.Errorf("section %s: a row has %d cells for %d columns", s.Name, len(row.Cells), len(s.Columns))
			}
		}
	}
	sys := tb.Sections[tb.byName[System]]
	efl := sys.Rows[1]
	if efl.QuantityLabel(Text) != "EFL mm" || efl.Cells[0].In(Text) != "-41.5619" || efl.Cells[0].In(Page) != "-41.562" {
		t.Errorf("EFL row reads %q %q %q", efl.QuantityLabel(Text), efl.Cells[0].In(Text), efl.Cells[0].In(Page))
	}
	beam := tb.Sections[tb.byName[Beam]]
	if got := beam.Rows[1].Cells[8]; got.In(Text) != "0.9985" || got.In(Page) != "99.848 %" {
		t.Errorf("PH passes %q / %q of the beam, want 0.9985 / 99.848 %%", got.In(Text), got.In(Page))
	}
}
