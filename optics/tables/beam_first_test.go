package tables

import (
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/optics/benchtest"
)

// A bench with a Gaussian beam opens with the beam in the text report and on the page and keeps
// the lens-design values for last; a bench without one keeps the old order (README, report).
func TestBeamLeads(t *testing.T) {
	cases := []struct {
		bench            string
		textLead, design Name // first section of each part; "" for no design part
	}{
		{"demo-bench.json", Beam, System},
		{"relay-bench.json", System, ""},
	}
	for _, c := range cases {
		b := benchtest.Load(t, c.bench)
		tb := Build(analysis.RunValid(b))
		for _, l := range []Layout{Text, Page} {
			lead, design := tb.Lead(l), tb.Design(l)
			if lead[0].Name != c.textLead {
				t.Errorf("%s layout %d opens with %s, want %s", c.bench, l, lead[0].Name, c.textLead)
			}
			if c.design == "" && len(design) != 0 || c.design != "" && (len(design) == 0 || design[0].Name != c.design) {
				t.Errorf("%s layout %d: lens-design part %v, want it to open with %q", c.bench, l, design, c.design)
			}
		}
		if got := tb.In(Compare); got[0].Name != System {
			t.Errorf("%s: the compare page keeps its order, opens with %s", c.bench, got[0].Name)
		}
	}
}

// A plane counts as collimated when afocal or when |power| is below 1e-6 per mm: an expander
// whose EFL is -1.0e6 mm reads "collimated output" and has no f-number (a value of 628149 has no
// meaning on a table), while the compare page keeps the number.
func TestNearlyAfocalWords(t *testing.T) {
	f := func(v float64) *float64 { return &v }
	cases := []struct {
		name      string
		efl       *float64
		afocal    bool
		collimate bool
	}{
		{"expander, EFL -1.0e6 mm", f(-1.000001e6), false, true},
		{"long lens, EFL 9e5 mm", f(9e5), false, false},
		{"afocal", nil, true, true},
	}
	for _, c := range cases {
		pv := optics.PlaneValues{Cardinal: optics.Cardinal{Afocal: c.afocal, EFLMM: c.efl}, FNumber: f(628149), WorkingFNumber: f(3.6e16)}
		r := &optics.Report{WavelengthsNM: []float64{632.8}, System: optics.SystemValues{PlaneValues: pv, Sagittal: pv, Optical: true}}
		sec := systemSection(r)
		words := map[string]string{}
		for _, row := range sec.RowsIn(Text) {
			words[row.QuantityLabel(Text)] = row.Cells[0].In(Text)
		}
		wantEFL, wantF := "-", "-"
		if c.collimate {
			wantEFL = "collimated"
		} else {
			wantEFL, wantF = "900000", "628149"
		}
		if words["EFL mm"] != wantEFL || words["f-number"] != wantF || (c.collimate && words["working f-number"] != "-") {
			t.Errorf("%s: EFL %q f-number %q working %q, want %q %q", c.name, words["EFL mm"], words["f-number"], words["working f-number"], wantEFL, wantF)
		}
		for _, row := range sec.RowsIn(Compare) {
			if row.Label.In(Compare) == "f-number" && row.Cells[0].In(Compare) != "628150" {
				t.Errorf("%s: compare page f-number %q, want the number", c.name, row.Cells[0].In(Compare))
			}
		}
	}
}
