package tables

import "raytable/optics"

// Build lays a report out as tables. It reads the report only; sections without anything to show
// for this bench (a second wavelength, spacing, blur, a beam, placement, media) are left out.
func Build(r *optics.Report) *Report {
	t := &Report{Title: r.Title, Warnings: r.Warnings}
	for _, w := range r.WavelengthsNM {
		t.Wavelengths = append(t.Wavelengths, val(w))
	}
	t.add(systemSection(r))
	if len(r.Chromatic) > 1 {
		t.add(chromaticSection(r.Chromatic))
	}
	t.add(elementsSection(r.Elements))
	if len(r.Arms) > 1 {
		t.add(armsSection(r.Arms))
		t.add(armElementsSection(r.Arms))
		t.add(meetingsSection(r.Meetings))
	}
	if len(r.Spacing) > 0 {
		t.add(spacingSection(r.Spacing, r.SpacingBasis))
	}
	t.add(rayStatusSection(r.Rays))
	t.add(stoppedRaysSection(r.Rays))
	if len(r.Blur) > 0 {
		t.add(blurSection(r.Blur))
	}
	if r.Beam != nil {
		t.add(beamSection(r.Beam))
		t.add(waistSection(r.Beam.Waists))
	}
	if len(r.Coupling) > 0 {
		t.add(couplingSection(r.Coupling))
	}
	if len(r.Placement) > 0 {
		t.add(placementSection(r.Placement))
	}
	if len(r.Media) > 0 {
		t.add(mediaSection(r.Media))
	}
	t.add(warningSection(r.Warnings))
	t.add(warningCountSection(r.Warnings))
	return t
}

// systemSection is the system values of both planes, one quantity per row. A bench without a
// lens, thin lens or mirror has no system values: its rows are only paired on the compare page.
func systemSection(r *optics.Report) Section {
	s := &r.System
	primary := absent(Undefined)
	if len(r.WavelengthsNM) > 0 {
		primary = val(r.WavelengthsNM[0])
	}
	sec := Section{
		Name:       System,
		Title:      Phrase{Words: Words{Page: "System", Text: "SYSTEM at %[1]s nm"}, Args: []Cell{primary}},
		Transposed: true,
		LabelHead:  Words{Page: "value"},
		Columns: []Column{
			{Head: Words{Page: "in the table plane", Text: "tangential"}, In: Everywhere},
			{Head: Words{Page: "across it (sagittal)", Text: "sagittal"}, Key: "sagittal", In: Everywhere},
		},
		Agree: "Both planes agree.",
	}
	shown := Everywhere
	switch {
	case !s.Optical:
		shown = Compare
		sec.Note.Words = Words{Page: "The bench has no lens, thin lens or mirror, so it has no system values.", Text: "(no lens, thin lens or mirror on the bench)"}
	case s.Afocal:
		sec.Note.Words = Words{Page: "Afocal: parallel light leaves parallel, so there is no focal length."}
	}
	firstVertex := &Origin{Point: "first vertex"}
	lastVertex := &Origin{Point: "last vertex"}
	usualFirst := &Origin{Point: "first vertex", Usual: true}
	usualLast := &Origin{Point: "last vertex", Usual: true}
	planes := []*optics.PlaneValues{&s.PlaneValues, &s.Sagittal}
	quantity := func(name Words, u Unit, from *Origin, in Layout, cell func(p *optics.PlaneValues) Cell) {
		if in &= shown; in == 0 {
			return
		}
		row := Row{Label: name, Unit: u, From: from, In: in}
		for _, p := range planes {
			row.Cells = append(row.Cells, cell(p))
		}
		sec.Rows = append(sec.Rows, row)
	}
	value := func(name string, u Unit, from *Origin, in Layout, get func(p *optics.PlaneValues) *float64) {
		quantity(same(name), u, from, in, func(p *optics.PlaneValues) Cell { return optVal(get(p)) })
	}
	quantity(same("afocal"), NoUnit, nil, Text, func(p *optics.PlaneValues) Cell { return say(yesNo(p.Afocal)) })
	value("EFL", MM, nil, Everywhere, func(p *optics.PlaneValues) *float64 { return p.EFLMM })
	value("BFL", MM, nil, Everywhere, func(p *optics.PlaneValues) *float64 { return p.BFLMM })
	value("FFL", MM, nil, Everywhere, func(p *optics.PlaneValues) *float64 { return p.FFLMM })
	value("front principal plane", MM, usualFirst, Everywhere, func(p *optics.PlaneValues) *float64 { return p.FrontPrincipalMM })
	value("rear principal plane", MM, usualLast, Everywhere, func(p *optics.PlaneValues) *float64 { return p.RearPrincipalMM })
	value("image distance", MM, usualLast, Everywhere, func(p *optics.PlaneValues) *float64 { return p.ImageDistanceMM })
	value("magnification", NoUnit, nil, Everywhere, func(p *optics.PlaneValues) *float64 { return p.Magnification })
	value("angular magnification", NoUnit, nil, Text|Page, func(p *optics.PlaneValues) *float64 { return p.AngularMagnification })
	quantity(same("aperture stop"), NoUnit, nil, Everywhere, func(p *optics.PlaneValues) Cell { return say(p.ApertureStop) })
	value("f-number", NoUnit, nil, Everywhere, func(p *optics.PlaneValues) *float64 { return p.FNumber })
	value("image-side NA", NoUnit, nil, Everywhere, func(p *optics.PlaneValues) *float64 { return p.ImageNA })
	value("entrance pupil", MM, firstVertex, Text|Page, func(p *optics.PlaneValues) *float64 { return p.EntrancePupilMM })
	value("entrance pupil radius", MM, nil, Text|Page, func(p *optics.PlaneValues) *float64 { return p.EntrancePupilRadiusMM })
	value("exit pupil", MM, lastVertex, Text|Page, func(p *optics.PlaneValues) *float64 { return p.ExitPupilMM })
	value("exit pupil radius", MM, nil, Text|Page, func(p *optics.PlaneValues) *float64 { return p.ExitPupilRadiusMM })
	value("image height", MM, nil, Page, func(p *optics.PlaneValues) *float64 { return p.ImageHeightMM })
	value("Lagrange invariant", MM, nil, Text|Page, func(p *optics.PlaneValues) *float64 { return p.LagrangeInvariant })
	// The optical part's extent along the path is one value for both planes.
	if shown.Has(Text) {
		sec.Rows = append(sec.Rows, Row{Label: same("optical part path"), Unit: MM, In: Text,
			Cells: []Cell{pair(val(s.FirstVertexPathMM), val(s.LastVertexPathMM), Range), say("")}})
	}
	return sec
}

// chromaticSection repeats the cardinal points at every wavelength (tangential plane).
func chromaticSection(cs []optics.Cardinal) Section {
	sec := Section{
		Name:  Chromatic,
		Title: Phrase{Words: Words{Page: "At each wavelength", Text: "BY WAVELENGTH (tangential)"}},
		Columns: []Column{
			{Head: Words{Page: "wavelength"}, Unit: NM, In: Text | Page},
			{Head: same("EFL"), Unit: MM, In: Text | Page},
			{Head: same("BFL"), Unit: MM, In: Text | Page},
			{Head: same("image distance"), Unit: MM, In: Text | Page},
		},
	}
	for _, c := range cs {
		sec.Rows = append(sec.Rows, Row{In: Text | Page,
			Cells: []Cell{val(c.WavelengthNM), optVal(c.EFLMM), optVal(c.BFLMM), optVal(c.ImageDistanceMM)}})
	}
	return sec
}

func yesNo(b bool) string {
	if b {
		return "yes"
	}
	return "no"
}
