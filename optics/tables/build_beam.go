package tables

import (
	"slices"

	"fmt"

	"raytable/optics"
)

// beamColumn is one column of the beam table with the cell it holds for an element's row.
type beamColumn struct {
	Column
	cell func(e optics.BeamAt) Cell
}

// beamColumns are the beam table's columns in order: the radii arriving at and leaving each
// element, the wavefront radii, and the share of the arriving power its apertures pass. Power
// columns (the share of the source's power, peak irradiance) belong at the end of this list.
var beamColumns = []beamColumn{
	{Column{Head: Words{Page: "id"}, In: Text | Page}, func(e optics.BeamAt) Cell { return say(e.ID) }},
	{Column{Head: Words{Page: "power arriving", Text: "arriving", Compare: "power arriving"}, Unit: Percent, In: Everywhere}, func(e optics.BeamAt) Cell { return num(e.PowerFraction, Fraction) }},
	{Column{Head: Words{Page: "arriving, in plane", Text: "arriving w_t"}, Unit: MM, In: Text | Page}, func(e optics.BeamAt) Cell { return val(e.ArrivingWTMM) }},
	{Column{Head: Words{Page: "arriving, across", Text: "arriving w_s"}, Unit: MM, In: Text | Page}, func(e optics.BeamAt) Cell { return val(e.ArrivingWSMM) }},
	{Column{Head: Words{Page: "leaving, in plane", Text: "w_t", Compare: "beam radius in plane"}, Unit: MM, In: Everywhere}, func(e optics.BeamAt) Cell { return val(e.WTMM) }},
	{Column{Head: Words{Page: "leaving, across", Text: "w_s", Compare: "beam radius across"}, Unit: MM, In: Everywhere}, func(e optics.BeamAt) Cell { return val(e.WSMM) }},
	{Column{Head: Words{Page: "wavefront radius in plane", Text: "R_t"}, Unit: MM, In: Text | Page}, func(e optics.BeamAt) Cell { return opt(e.RTMM, Value, Flat) }},
	{Column{Head: Words{Page: "wavefront radius across", Text: "R_s"}, Unit: MM, In: Text | Page}, func(e optics.BeamAt) Cell { return opt(e.RSMM, Value, Flat) }},
	{Column{Head: Words{Page: "power passed", Text: "transmitted", Compare: "power passed"}, Unit: Percent, In: Everywhere}, func(e optics.BeamAt) Cell { return num(e.Transmitted, Fraction) }},
}

// peakColumns are shown when the source states a power (irradiance) or pulses (fluence): the
// peak at each element, 2P/(π w_t w_s) (README "Power").
var peakColumns = []struct {
	beamColumn
	present func(e optics.BeamAt) bool
}{
	{beamColumn{Column{Head: same("peak irradiance"), Unit: WPerCM2, In: Everywhere}, func(e optics.BeamAt) Cell { return opt(e.PeakIrradianceWCM2, Value, Undefined) }},
		func(e optics.BeamAt) bool { return e.PeakIrradianceWCM2 != nil }},
	{beamColumn{Column{Head: same("peak fluence"), Unit: JPerCM2, In: Everywhere}, func(e optics.BeamAt) Cell { return opt(e.PeakFluenceJCM2, Value, Undefined) }},
		func(e optics.BeamAt) bool { return e.PeakFluenceJCM2 != nil }},
}

// columnsFor is the beam table's columns for b: beamColumns and the peaks its source gives.
func columnsFor(b *optics.BeamReport) []beamColumn {
	cols := append([]beamColumn{}, beamColumns...)
	for _, pc := range peakColumns {
		if slices.ContainsFunc(b.Elements, pc.present) {
			cols = append(cols, pc.beamColumn)
		}
	}
	return cols
}

// beamSection is the Gaussian beam at each element, its 1/e² radii arriving and leaving; elements
// passing less than 99 % of the power are marked.
func beamSection(b *optics.BeamReport) Section {
	sec := Section{
		Name: Beam,
		Title: Phrase{
			Words: Words{Page: "Laser beam at %[1]s nm, M² %[2]s: 1/e² radius at each element", Text: "BEAM at %[1]s nm, M² %[2]s"},
			Args:  []Cell{val(b.WavelengthNM), val(b.M2)},
		},
	}
	cols := columnsFor(b)
	for _, c := range cols {
		sec.Columns = append(sec.Columns, c.Column)
	}
	for _, e := range b.Elements {
		row := Row{Key: e.ID, Marked: e.Transmitted < 0.99, In: Everywhere}
		for _, c := range cols {
			row.Cells = append(row.Cells, c.cell(e))
		}
		sec.Rows = append(sec.Rows, row)
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
		sec.Note.Words.Page = "No waist in air between the source and the last element."
	}
	return sec
}

// glassWaistSection lists the waists inside glass, their depth from the face the beam entered and
// the Rayleigh range in the glass.
func glassWaistSection(ws []optics.GlassWaist) Section {
	sec := Section{
		Name:  GlassWaists,
		Title: Phrase{Words: Words{Page: "Beam waists inside glass", Text: "WAISTS IN GLASS"}},
		Columns: []Column{
			{Head: Words{Page: "element", Text: "in"}, In: Text | Page},
			{Head: Words{Page: "depth from the entry face", Text: "depth"}, Unit: MM, In: Text | Page},
			{Head: same("index"), In: Text | Page},
			{Head: Words{Page: "radius in plane", Text: "radius t"}, Unit: MM, In: Text | Page},
			{Head: Words{Page: "radius across", Text: "radius s"}, Unit: MM, In: Text | Page},
			{Head: Words{Page: "Rayleigh range in the glass, in plane", Text: "Rayleigh t"}, Unit: MM, In: Text | Page},
			{Head: Words{Page: "Rayleigh range in the glass, across", Text: "Rayleigh s"}, Unit: MM, In: Text | Page},
		},
		Note: Phrase{Words: Words{Page: "The Rayleigh range in glass of index n is π·w0²·n/(M²·λ)."}},
	}
	for _, w := range ws {
		sec.Rows = append(sec.Rows, Row{In: Text | Page, Cells: []Cell{say(w.Element), val(w.DepthMM), num(w.Index, Index),
			optVal(w.RadiusTMM), optVal(w.RadiusSMM), optVal(w.RayleighTMM), optVal(w.RayleighSMM)}})
	}
	return sec
}

// outputSection is the beam leaving the last element, one quantity per row, both planes.
func outputSection(o *optics.BeamOutput) Section {
	sec := Section{
		Name:       BeamOutput,
		Title:      Phrase{Words: Words{Page: "Output beam, leaving %[1]s", Text: "OUTPUT BEAM leaving %[1]s"}, Args: []Cell{say(o.After)}},
		Transposed: true,
		LabelHead:  Words{Page: "value"},
		Columns: []Column{
			{Head: Words{Page: "in the table plane", Text: "tangential"}, In: Text | Page},
			{Head: Words{Page: "across it (sagittal)", Text: "sagittal"}, In: Text | Page},
		},
		Note:  Phrase{Words: Words{Page: "A negative waist position is a virtual waist: the beam already spreads from a point upstream. Divergence M²·λ/(π·w0), the far-field half-angle."}},
		Agree: "Both planes agree.",
	}
	add := func(name string, u Unit, get func(w optics.OutputWaist) float64) {
		sec.Rows = append(sec.Rows, Row{Label: same(name), Unit: u, In: Text | Page,
			Cells: []Cell{val(get(o.T)), val(get(o.S))}})
	}
	add("waist beyond "+o.After, MM, func(w optics.OutputWaist) float64 { return w.FromLastMM })
	add("waist radius", MM, func(w optics.OutputWaist) float64 { return w.RadiusMM })
	add("Rayleigh range", MM, func(w optics.OutputWaist) float64 { return w.RayleighMM })
	add("far-field divergence", MRad, func(w optics.OutputWaist) float64 { return w.DivergenceRad * 1000 })
	return sec
}
