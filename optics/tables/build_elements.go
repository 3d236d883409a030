package tables

import (
	"fmt"
	"math"

	"raytable/optics"
)

// elementsSection is where each element sits and how the rays pass it. Rows where exact rays
// reach beyond the clear aperture are marked.
// A bench whose only field is on axis has no chief ray: its column is left out.
func elementsSection(es []optics.ElementPlace, onAxis bool) Section {
	chief := Everywhere
	if onAxis {
		chief = Compare
	}
	sec := Section{
		Name:  Elements,
		Title: Phrase{Words: Words{Page: "Elements", Text: "ELEMENTS"}},
		Columns: []Column{
			{Head: Words{Page: "id"}, In: Text | Page},
			{Head: same("type"), In: Text | Page},
			{Head: Words{Page: "along the path", Text: "path", Compare: "along the path"}, Unit: MM, In: Everywhere},
			{Head: same("table x"), Unit: MM, In: Everywhere},
			{Head: same("table y"), Unit: MM, In: Everywhere},
			{Head: Words{Page: "heading in → out", Text: "heading in/out"}, Unit: Deg, In: Text | Page},
			{Head: Words{Compare: "heading out"}, Unit: Deg, In: Compare},
			{Head: Words{Page: "marginal ray", Text: "marginal y", Compare: "marginal ray"}, Unit: MM, In: Everywhere},
			{Head: Words{Page: "chief ray", Text: "chief y", Compare: "chief ray"}, Unit: MM, In: chief},
			{Head: same("largest ray"), Unit: MM, In: Everywhere},
			{Head: same("clear radius"), Unit: MM, In: Text | Page},
			{Head: Words{Page: "use of aperture", Compare: "use of aperture"}, Unit: Percent, In: Page | Compare},
		},
		Note: Phrase{Words: Words{Page: "Marked rows: exact rays reach beyond the clear aperture and are cut."}},
	}
	for _, e := range es {
		sec.Rows = append(sec.Rows, Row{
			Key: e.ID,
			Cells: []Cell{say(e.ID), say(e.Type), val(e.PathMM), val(e.TableXMM), val(e.TableYMM),
				pair(val(e.HeadingInDeg), val(e.HeadingOutDeg), InOut), val(e.HeadingOutDeg),
				val(e.MarginalYMM), val(e.ChiefYMM), val(e.MaxExactYMM), optVal(e.SemiDiameterMM),
				opt(e.Clearance, Fraction, NoAperture)},
			Marked: e.Clearance != nil && *e.Clearance > 1,
			In:     Everywhere,
		})
	}
	return sec
}

// spacingSection says how tightly each gap must be held and what allowance that is measured
// against. The tightest gaps are marked.
func spacingSection(ss []optics.SpacingTolerance, b optics.SpacingBasis) Section {
	sec := Section{Name: Spacing}
	sec.Title.Words.Page = "Spacing tolerances at %[1]s nm"
	// One list of quoted values serves the titles and the page's note.
	args := []Cell{val(b.WavelengthNM), optVal(b.DepthOfFocusMM), say(b.Reference), optVal(b.ImageNA)}
	id := Column{Head: same("id"), In: Text | Page}
	gap := Column{Head: same("gap"), Unit: MM, In: Text | Page}
	tolerance := Column{Head: Words{Page: "hold the gap within ±", Text: "hold gap within ±", Compare: "gap tolerance ±"}, Unit: MM, In: Everywhere}
	shown := Everywhere
	notCritical := "Not critical: the gap does not matter to first order, or its tolerance exceeds the table's diagonal. Marked: the tightest."
	var middle func(s optics.SpacingTolerance) []Cell
	switch b.Kind {
	case optics.SpacingDepthOfFocus:
		sec.Title.Words.Text = "SPACING at %[1]s nm: depth of focus ± %[2]s mm at %[3]s (lambda/(2 NA'^2), NA' %[4]s)"
		sec.Columns = []Column{id, gap,
			{Head: Words{Page: "image moves", Text: "image shift"}, Unit: MMPerMM, In: Text | Page},
			{Head: Words{Page: "defocus at " + b.Reference, Text: "defocus"}, Unit: MMPerMM, In: Text | Page},
			tolerance}
		middle = func(s optics.SpacingTolerance) []Cell {
			return []Cell{optVal(s.ImageShiftPerMM), optVal(s.DefocusPerMM)}
		}
		sec.Note.Words.Page = "Each gap changed alone, everything after it moving along. The tolerance keeps the image within the depth of focus ± %[2]s mm at %[3]s: λ/(2·NA'²) with image-side NA %[4]s (Rayleigh's quarter-wave criterion). " + notCritical
	case optics.SpacingDiffractionAngle:
		args = []Cell{val(b.WavelengthNM), opt(b.DivergenceRad, SmallAngle, Undefined), optVal(b.OutputRadiusMM)}
		sec.Title.Words.Text = "SPACING at %[1]s nm: collimated output: divergence allowed %[2]s rad (lambda/(pi w), w %[3]s mm)"
		sec.Columns = []Column{id, gap,
			{Head: Words{Page: "output divergence", Text: "divergence"}, Unit: RadPerMM, In: Text | Page},
			tolerance}
		middle = func(s optics.SpacingTolerance) []Cell {
			return []Cell{opt(s.DivergencePerMM, SmallAngle, Undefined)}
		}
		sec.Note.Words.Page = "The output is collimated. Each gap changed alone, everything after it moving along. The tolerance keeps the output divergence within the beam's own diffraction angle, %[2]s µrad = λ/(π·w) for an output radius w of %[3]s mm. " + notCritical
	case optics.SpacingBeamRayleigh:
		args = []Cell{val(b.WavelengthNM), optVal(b.RayleighMM), say(b.Reference), optVal(b.WaistFromReferenceMM)}
		sec.Title.Words.Text = "SPACING at %[1]s nm: from the beam: output waist %[4]s mm from %[3]s, Rayleigh range %[2]s mm"
		sec.Columns = []Column{id, gap,
			{Head: Words{Page: "waist moves against " + b.Reference, Text: "waist shift"}, Unit: MMPerMM, In: Text | Page},
			tolerance}
		middle = func(s optics.SpacingTolerance) []Cell {
			return []Cell{optVal(s.WaistShiftPerMM)}
		}
		sec.Note.Words.Page = "From the Gaussian beam. Each gap changed alone, everything after it moving along. The tolerance keeps the output beam's waist within its own Rayleigh range, %[2]s mm, of where it lies now (%[4]s mm from %[3]s). " + notCritical
	case optics.SpacingVirtualImage:
		sec.Title.Words.Text = "SPACING at %[1]s nm: the output diverges from a virtual image; no focus to hold"
		sec.Columns = []Column{id, gap,
			{Head: Words{Page: "image moves", Text: "image shift"}, Unit: MMPerMM, In: Text | Page},
			tolerance}
		middle = func(s optics.SpacingTolerance) []Cell {
			return []Cell{optVal(s.ImageShiftPerMM)}
		}
		sec.Note.Words.Page = "The output diverges from a virtual image upstream of the last element: no screen holds its focus, so no gap has a tolerance. Each gap changed alone, everything after it moving along."
	default:
		// Kind none comes with no rows; any others are only paired on the compare page.
		shown = Compare
		id.In, gap.In = 0, 0
		sec.Columns = []Column{id, gap, tolerance}
		middle = func(optics.SpacingTolerance) []Cell { return nil }
	}
	sec.Title.Args = args
	if shown != Compare {
		sec.Note.Args = args
		sec.Note.Words.Text = "(- : the gap does not matter to first order, or its tolerance exceeds the table's diagonal)"
		if b.Kind == optics.SpacingVirtualImage {
			sec.Note.Words.Text = "(no tolerances: there is no focus to hold)"
		}
	}

	tightest := math.Inf(1)
	for _, s := range ss {
		if s.ToleranceMM != nil {
			tightest = math.Min(tightest, *s.ToleranceMM)
		}
	}
	for _, s := range ss {
		cells := append([]Cell{say(s.ID), val(s.GapMM)}, middle(s)...)
		sec.Rows = append(sec.Rows, Row{
			Key:    s.ID,
			Cells:  append(cells, opt(s.ToleranceMM, Value, NotCritical)),
			Marked: s.ToleranceMM != nil && *s.ToleranceMM <= tightest*(1+1e-9),
			In:     shown,
		})
	}
	return sec
}

// placementSection is each mount's post on the breadboard and its nearest hole.
func placementSection(ps []optics.Placement) Section {
	sec := Section{
		Name:  Placement,
		Title: Phrase{Words: Words{Page: "Placement on the breadboard"}},
		Columns: []Column{
			{Head: Words{Page: "id"}, In: Page},
			{Head: Words{Page: "type"}, In: Page},
			{Head: Words{Page: "x"}, Unit: MM, In: Page},
			{Head: Words{Page: "y"}, Unit: MM, In: Page},
			{Head: Words{Page: "heading"}, Unit: Deg, In: Page},
			{Head: Words{Page: "hole column"}, In: Page},
			{Head: Words{Page: "hole row"}, In: Page},
			{Head: Words{Page: "offset x"}, Unit: MM, In: Page},
			{Head: Words{Page: "offset y"}, Unit: MM, In: Page},
			{Head: Words{Compare: "hole (column, row)"}, In: Compare},
		},
	}
	for _, p := range ps {
		col, row := absent(Undefined), absent(Undefined)
		if p.HoleColumn > 0 {
			col, row = count(p.HoleColumn), count(p.HoleRow)
		}
		sec.Rows = append(sec.Rows, Row{Key: p.ID, In: Page | Compare, Cells: []Cell{
			say(p.ID), say(p.Type), val(p.TableXMM), val(p.TableYMM), val(p.HeadingDeg), col, row,
			val(p.OffsetXMM), val(p.OffsetYMM), say(fmt.Sprintf("%d, %d", p.HoleColumn, p.HoleRow)),
		}})
	}
	return sec
}

// mediaSection is the index of every medium at every wavelength; a wavelength outside a model's
// range is marked and noted.
func mediaSection(ms []optics.MediumIndex) Section {
	sec := Section{
		Name:  Media,
		Title: Phrase{Words: Words{Page: "Media", Text: "MEDIA"}},
		Columns: []Column{
			{Head: Words{Page: "material"}, In: Text | Page},
			{Head: same("wavelength"), Unit: NM, In: Text | Page},
			{Head: same("index"), In: Text | Page},
			{Head: Words{Text: "model"}, In: Text},
			{Head: Words{Page: "within its data range"}, In: Page},
		},
	}
	for _, m := range ms {
		row := Row{In: Text | Page, Marked: !m.InRange,
			Cells: []Cell{say(m.Material), val(m.WavelengthNM), num(m.Index, Index), say(m.Model), say(yesNo(m.InRange))}}
		if !m.InRange {
			row.Note = "outside its range"
		}
		sec.Rows = append(sec.Rows, row)
	}
	return sec
}
