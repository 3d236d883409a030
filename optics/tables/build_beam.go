package tables

import (
	"fmt"

	"raytable/optics"
)

// beamSection is the Gaussian beam leaving each element; elements passing less than 99 % of the
// power are marked.
func beamSection(b *optics.BeamReport) Section {
	sec := Section{
		Name: Beam,
		Title: Phrase{
			Words: Words{Page: "Laser beam at %[1]s nm, M² %[2]s (leaving each element)", Text: "BEAM at %[1]s nm, M² %[2]s"},
			Args:  []Cell{val(b.WavelengthNM), val(b.M2)},
		},
		Columns: []Column{
			{Head: Words{Page: "id"}, In: Text | Page},
			{Head: Words{Page: "radius in plane", Text: "w_t", Compare: "beam radius in plane"}, Unit: MM, In: Everywhere},
			{Head: Words{Page: "radius across", Text: "w_s", Compare: "beam radius across"}, Unit: MM, In: Everywhere},
			{Head: Words{Page: "wavefront radius in plane", Text: "R_t"}, Unit: MM, In: Text | Page},
			{Head: Words{Page: "wavefront radius across", Text: "R_s"}, Unit: MM, In: Text | Page},
			{Head: Words{Page: "power passed", Text: "transmitted", Compare: "power passed"}, Unit: Percent, In: Everywhere},
		},
	}
	for _, e := range b.Elements {
		sec.Rows = append(sec.Rows, Row{
			Key: e.ID,
			Cells: []Cell{say(e.ID), val(e.WTMM), val(e.WSMM), opt(e.RTMM, Value, Flat), opt(e.RSMM, Value, Flat),
				num(e.Transmitted, Fraction)},
			Marked: e.Transmitted < 0.99,
			In:     Everywhere,
		})
	}
	return sec
}

// waistSection lists the beam's waists. The text report writes both planes in one column and
// leaves its first column to the heading.
func waistSection(ws []optics.Waist) Section {
	sec := Section{
		Name:  Waists,
		Title: Phrase{Words: Words{Page: "Beam waists", Text: "WAISTS"}},
		Columns: []Column{
			{In: Text},
			{Head: same("after"), In: Text | Page},
			{Head: Words{Page: "along the path", Text: "path", Compare: "along the path"}, Unit: MM, In: Everywhere},
			{Head: Words{Text: "radius t/s"}, Unit: MM, In: Text},
			{Head: Words{Page: "radius in plane", Compare: "radius in plane"}, Unit: MM, In: Page | Compare},
			{Head: Words{Page: "radius across", Compare: "radius across"}, Unit: MM, In: Page | Compare},
			{Head: Words{Text: "Rayleigh range t/s"}, Unit: MM, In: Text},
			{Head: Words{Page: "Rayleigh range in plane"}, Unit: MM, In: Page},
			{Head: Words{Page: "Rayleigh range across"}, Unit: MM, In: Page},
		},
	}
	for i, w := range ws {
		after := text(Words{Page: "the source", Text: "source"})
		if w.After != nil {
			after = say(*w.After)
		}
		rt, rs, zt, zs := optVal(w.RadiusTMM), optVal(w.RadiusSMM), optVal(w.RayleighTMM), optVal(w.RayleighSMM)
		sec.Rows = append(sec.Rows, Row{
			Key:   fmt.Sprintf("waist %d", i+1),
			Cells: []Cell{say(""), after, val(w.PathMM), pair(rt, rs, Planes), rt, rs, pair(zt, zs, Planes), zt, zs},
			In:    Everywhere,
		})
	}
	if len(ws) == 0 {
		sec.Note.Words.Page = "No waist between the source and the last element."
	}
	return sec
}
