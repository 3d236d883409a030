package tables

import "raytable/optics"

// couplingSection is the beam's coupling into each fibre and mode target, with the offsets of the
// target that each alone lose 1 dB (README "Fibres, mode targets and cylindrical lenses"); rows
// coupling less than 80 % are marked.
func couplingSection(cs []optics.Coupling) Section {
	sec := Section{
		Name:  Coupling,
		Title: Phrase{Words: Words{Page: "Coupling into fibres and mode targets (offsets that lose 1 dB)", Text: "COUPLING (offsets that lose 1 dB)"}},
		Columns: []Column{
			{Head: Words{Page: "id"}, In: Text | Page},
			{Head: Words{Page: "power coupled", Text: "efficiency", Compare: "power coupled"}, Unit: Percent, In: Everywhere},
			{Head: Words{Page: "along the axis", Text: "axial"}, Unit: MM, In: Everywhere},
			{Head: Words{Page: "sideways in plane", Text: "lateral t"}, Unit: MM, In: Everywhere},
			{Head: Words{Page: "sideways across", Text: "lateral s"}, Unit: MM, In: Everywhere},
			{Head: Words{Page: "tilt in plane", Text: "angle t"}, Unit: MRad, In: Everywhere},
			{Head: Words{Page: "tilt across", Text: "angle s"}, Unit: MRad, In: Everywhere},
		},
	}
	for _, c := range cs {
		sec.Rows = append(sec.Rows, Row{
			Key: c.Element,
			Cells: []Cell{say(c.Element), num(c.Efficiency, Fraction), optVal(c.AxialMM), optVal(c.LateralMM),
				optVal(c.LateralVerticalMM), optVal(c.AngularMrad), optVal(c.AngularVerticalMrad)},
			Marked: c.Efficiency < 0.8,
			In:     Everywhere,
		})
	}
	return sec
}
