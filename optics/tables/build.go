package tables

import (
	"math"

	"raytable/optics"
)

// Build lays a report out as tables. It reads the report only; sections without anything to show
// for this bench (a second wavelength, spacing, blur, a beam, placement, media) are left out.
func Build(r *optics.Report) *Report {
	t := &Report{Title: r.Title, Warnings: r.Warnings, beamFirst: r.Beam != nil}
	for _, w := range r.WavelengthsNM {
		t.Wavelengths = append(t.Wavelengths, val(w))
	}
	t.add(systemSection(r))
	if len(r.Chromatic) > 1 {
		t.add(chromaticSection(r.Chromatic))
	}
	t.add(elementsSection(r.Elements, onAxisOnly(&r.System)))
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
		t.add(blurSection(r.Blur, !collimated(&r.System.PlaneValues) && !virtualImage(&r.System.PlaneValues)))
	}
	if r.Beam != nil {
		t.add(beamSection(r.Beam))
		t.add(waistSection(r.Beam.Waists))
		if len(r.Beam.GlassWaists) > 0 {
			t.add(glassWaistSection(r.Beam.GlassWaists))
		}
		if r.Beam.Output != nil {
			t.add(outputSection(r.Beam.Output))
		}
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
	// focal is a value that a (nearly) afocal plane does not have: the text report and the page
	// say the output is collimated instead of quoting a length of 10⁶ mm; the compare page keeps
	// the number.
	focal := func(name string, u Unit, from *Origin, get func(p *optics.PlaneValues) *float64) {
		value(name, u, from, Compare, get)
		quantity(same(name), u, from, Text|Page, func(p *optics.PlaneValues) Cell {
			if collimated(p) {
				return text(Words{Page: "collimated output", Text: "collimated"})
			}
			return optVal(get(p))
		})
	}
	// finiteImage is a value that an image at infinity does not have (an f-number, an image NA).
	finiteImage := func(name string, in Layout, get func(p *optics.PlaneValues) *float64) {
		value(name, NoUnit, nil, in&Compare, get)
		quantity(same(name), NoUnit, nil, in&(Text|Page), func(p *optics.PlaneValues) Cell {
			if collimated(p) {
				return absent(Undefined)
			}
			return optVal(get(p))
		})
	}
	quantity(same("afocal"), NoUnit, nil, Text, func(p *optics.PlaneValues) Cell { return say(yesNo(p.Afocal)) })
	focal("EFL", MM, nil, func(p *optics.PlaneValues) *float64 { return p.EFLMM })
	focal("BFL", MM, nil, func(p *optics.PlaneValues) *float64 { return p.BFLMM })
	focal("FFL", MM, nil, func(p *optics.PlaneValues) *float64 { return p.FFLMM })
	focal("front principal plane", MM, usualFirst, func(p *optics.PlaneValues) *float64 { return p.FrontPrincipalMM })
	focal("rear principal plane", MM, usualLast, func(p *optics.PlaneValues) *float64 { return p.RearPrincipalMM })
	focal("image distance", MM, usualLast, func(p *optics.PlaneValues) *float64 { return p.ImageDistanceMM })
	value("magnification", NoUnit, nil, Everywhere, func(p *optics.PlaneValues) *float64 { return p.Magnification })
	value("angular magnification", NoUnit, nil, Text|Page, func(p *optics.PlaneValues) *float64 { return p.AngularMagnification })
	if r.Beam != nil && r.Beam.Output != nil && (collimated(&s.PlaneValues) || collimated(&s.Sagittal)) {
		out := r.Beam.Output
		quantity(same("output beam divergence"), MRad, nil, Text|Page, func(p *optics.PlaneValues) Cell {
			w := out.T
			if p == &s.Sagittal {
				w = out.S
			}
			return val(w.DivergenceRad * 1000)
		})
	}
	quantity(same("aperture stop"), NoUnit, nil, Everywhere, func(p *optics.PlaneValues) Cell { return say(p.ApertureStop) })
	finiteImage("f-number", Everywhere, func(p *optics.PlaneValues) *float64 { return p.FNumber })
	finiteImage("working f-number", Text|Page, func(p *optics.PlaneValues) *float64 { return p.WorkingFNumber })
	finiteImage("image-side NA", Everywhere, func(p *optics.PlaneValues) *float64 { return p.ImageNA })
	value("entrance pupil", MM, firstVertex, Text|Page, func(p *optics.PlaneValues) *float64 { return p.EntrancePupilMM })
	value("entrance pupil radius", MM, nil, Text|Page, func(p *optics.PlaneValues) *float64 { return p.EntrancePupilRadiusMM })
	value("exit pupil", MM, lastVertex, Text|Page, func(p *optics.PlaneValues) *float64 { return p.ExitPupilMM })
	value("exit pupil radius", MM, nil, Text|Page, func(p *optics.PlaneValues) *float64 { return p.ExitPupilRadiusMM })
	value("image height", MM, nil, Page, func(p *optics.PlaneValues) *float64 { return p.ImageHeightMM })
	lagrange := Text | Page
	if onAxisOnly(s) {
		lagrange = 0 // no chief ray, so no invariant to speak of
	}
	value("Lagrange invariant", MM, nil, lagrange, func(p *optics.PlaneValues) *float64 { return p.LagrangeInvariant })
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

// NearlyAfocalEFLMM is the focal length beyond which the text report and the page treat a plane
// as afocal, |power| below 1e-6 per mm: a longer one is a collimated output on any table, and the
// validation's largest length (optics.MaxLengthMM).
const NearlyAfocalEFLMM = optics.MaxLengthMM

// collimated says the plane sends parallel light out: afocal, or an EFL beyond NearlyAfocalEFLMM.
func collimated(p *optics.PlaneValues) bool {
	return p.Afocal || p.EFLMM == nil || !(math.Abs(*p.EFLMM) < NearlyAfocalEFLMM)
}

// virtualImage says the image lies upstream of the last vertex.
func virtualImage(p *optics.PlaneValues) bool {
	return p.ImageDistanceMM != nil && *p.ImageDistanceMM < 0
}

// onAxisOnly says the bench's only field is on axis: the chief ray is a unit ray that only locates
// the pupils, and the Lagrange invariant is 0 (see optics/paraxial).
func onAxisOnly(s *optics.SystemValues) bool {
	return s.Optical && s.LagrangeInvariant != nil && *s.LagrangeInvariant == 0
}

func yesNo(b bool) string {
	if b {
		return "yes"
	}
	return "no"
}
