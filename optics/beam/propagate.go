package beam

import (
	"fmt"
	"math"

	"raytable/optics"
	"raytable/optics/paraxial"
)

// Warning codes of this package (see optics.WarningCodes).
const (
	CodeClipped           = optics.WarnBeamClipped
	CodeBeamInvalid       = optics.WarnBeamInvalid
	CodeBackReflection    = optics.WarnBackReflectionFocus
	CodeFocusInGlass      = optics.WarnFocusInGlass
	CodeFocusNearGlass    = optics.WarnFocusNearGlass
	backReflectionReachMM = 25.0 // mm: a ghost focus this close to the source or an optic upstream is reported
	nearGlassMM           = 1.0  // mm: a focus this close to a glass surface is reported
)

// planeTrace is the reduced q of one plane just before and just after each surface's power.
type planeTrace struct {
	g             gaussian   // the plane's M²λ (a beam's vertical plane may have its own M²)
	start         complex128 // at the source plane
	arrive, leave []complex128
}

// at is the reduced q at the start of stretch i (after surface i-1, or at the source).
func (t *planeTrace) at(i int) complex128 {
	if i == 0 {
		return t.start
	}
	return t.leave[i-1]
}

// trace carries q through p in one plane at the primary wavelength, with the gap and surface
// matrices of package paraxial (reduced form: q̂ = q/n obeys the ABCD law for them).
func trace(p *optics.Path, plane paraxial.Plane, g gaussian, q0 complex128) planeTrace {
	t := planeTrace{g: g, start: q0, arrive: make([]complex128, len(p.Surfaces)), leave: make([]complex128, len(p.Surfaces))}
	q := q0
	for i := range p.Surfaces {
		q = applyABCD(paraxial.GapMatrix(p, i, 0, plane), q)
		t.arrive[i] = q
		q = applyABCD(paraxial.SurfaceMatrix(p, i, 0, plane), q)
		t.leave[i] = q
	}
	return t
}

// Propagate follows source.beam along p at the primary wavelength in both planes and reports the
// beam leaving every element, every real waist in air, the envelope for drawing, the power
// arriving at each element (README "Power"), and warnings for clipping, for beam foci in or next
// to glass and for peaks near an element's damage threshold. The report is nil when the source
// has no beam.
func Propagate(b *optics.Bench, p *optics.Path) (*optics.BeamReport, []optics.Warning) {
	rep, warns, _ := propagate(b, p)
	return rep, warns
}

// propagate is Propagate that also gives the fraction each element's clear apertures pass, by
// span (nil without a beam).
func propagate(b *optics.Bench, p *optics.Path) (*optics.BeamReport, []optics.Warning, []float64) {
	if b == nil || p == nil || b.Source.GaussianBeam() == nil {
		return nil, nil, nil
	}
	p = litPath(p) // nothing passes a dump: the beam ends at the first one
	t, s, warn := sourceTraces(b, p)
	if warn != nil {
		return nil, []optics.Warning{*warn}, nil
	}
	g, lam, m2 := t.g, p.WavelengthsNM[0], b.Source.GaussianBeam().BeamQuality()
	st := stretches(p)

	rep := &optics.BeamReport{WavelengthNM: lam, M2: m2, Elements: make([]optics.BeamAt, 0, len(p.Spans))}
	var warns []optics.Warning
	lit := litStretches(p) // surfaces before index lit reach light; nothing passes a dump
	pass := make([]float64, len(p.Spans))
	var spanOf []int // the span of each row
	for ei, sp := range p.Spans {
		pass[ei] = 1
		row, faces, ok := elementRow(p, g, &t, &s, sp)
		if !ok {
			continue
		}
		pass[ei] = row.Transmitted
		rep.Elements = append(rep.Elements, row)
		spanOf = append(spanOf, ei)
		if row.Transmitted < PassFraction && sp.First < lit {
			warns = append(warns, clipWarning(row, faces))
		}
	}
	warns = append(warns, fillPower(b, rep.Elements, spanOf, powerBudget(b, p, pass))...)
	rep.Waists = waists(p, g, st, &t, &s)
	rep.Samples = samples(p, g, st, &t, &s)
	rep.Output = outputBeam(p, g, st, &t, &s)
	rep.GlassWaists = glassWaists(p, g, st, &t, &s)
	warns = append(warns, screenFocusWarnings(b, p, &t, &s)...)
	warns = append(warns, beamFocusWarnings(p, g, st, &t, &s)...)
	return rep, warns, pass
}

// elementRow is the beam at one element: arriving at its first face, leaving its last, and the
// fraction its clear apertures pass (the product over its faces).
func elementRow(p *optics.Path, g gaussian, t, s *planeTrace, sp optics.Span) (optics.BeamAt, []footprint, bool) {
	if sp.First < 0 || sp.Last < sp.First || sp.Last >= len(p.Surfaces) {
		return optics.BeamAt{}, nil, false
	}
	last := &p.Surfaces[sp.Last]
	nOut := last.Index[0]
	row := optics.BeamAt{
		ID:           last.ID,
		WTMM:         g.radiusMM(t.leave[sp.Last]),
		WSMM:         s.g.radiusMM(s.leave[sp.Last]),
		RTMM:         curvatureMM(t.leave[sp.Last], nOut),
		RSMM:         curvatureMM(s.leave[sp.Last], nOut),
		ArrivingWTMM: g.radiusMM(t.arrive[sp.First]),
		ArrivingWSMM: s.g.radiusMM(s.arrive[sp.First]),
		Transmitted:  1,
	}
	var faces []footprint
	for i := sp.First; i <= sp.Last; i++ {
		sf := &p.Surfaces[i]
		if math.IsInf(sf.SemiAperture, 1) {
			continue
		}
		f := footprint{aMM: sf.SemiAperture, wtMM: g.radiusMM(t.arrive[i]), wsMM: s.g.radiusMM(s.arrive[i])}
		// A tilted surface meets the beam obliquely: across the plane of incidence its footprint
		// on the surface is longer by 1/cos i, while the clear aperture is a circle on it.
		if paraxial.IncidencePlane(sf, paraxial.Tangential) {
			f.wtMM /= math.Cos(sf.IncidenceRad)
		}
		if paraxial.IncidencePlane(sf, paraxial.Sagittal) {
			f.wsMM /= math.Cos(sf.IncidenceRad)
		}
		faces = append(faces, f)
	}
	row.Transmitted = passed(faces)
	return row, faces, true
}

func clipWarning(row optics.BeamAt, faces []footprint) optics.Warning {
	advice := ""
	if want := clearDiameterFor(faces, PassFraction); !math.IsNaN(want) {
		advice = fmt.Sprintf(" a clear diameter of %.3g mm or more passes 99 %%.", want)
	}
	return optics.Warning{
		Code:    CodeClipped,
		Element: row.ID,
		Message: fmt.Sprintf("%s passes %.1f %% of the arriving beam through its %.3g mm clear diameter;%s Downstream the beam is computed as if it were not clipped.",
			row.ID, 100*row.Transmitted, 2*faces[0].aMM, advice),
	}
}

// sourceTraces follows the source's beam through p in both planes at the primary wavelength, or
// gives the warning that says why it cannot.
func sourceTraces(b *optics.Bench, p *optics.Path) (t, s planeTrace, warn *optics.Warning) {
	bm := b.Source.GaussianBeam()
	m2 := bm.BeamQuality()
	_, vertical := bm.Planes()
	m2s := vertical.Quality()
	if len(p.WavelengthsNM) == 0 || !(p.WavelengthsNM[0] > 0) || !(bm.WaistRadiusMM > 0) || !(m2 > 0) ||
		!(vertical.WaistRadiusMM > 0) || !(m2s > 0) || math.IsInf(vertical.WaistRadiusMM+m2s+vertical.WaistAtMM, 0) ||
		math.IsInf(bm.WaistRadiusMM, 0) || math.IsInf(m2, 0) || math.IsNaN(bm.WaistAtMM) || math.IsInf(bm.WaistAtMM, 0) {
		return planeTrace{}, planeTrace{}, &optics.Warning{Code: CodeBeamInvalid, Message: "source.beam needs a positive finite waist_radius_mm and m2, a finite waist_at_mm and a positive wavelength; the beam was not computed"}
	}
	for i := range p.Surfaces {
		if len(p.Surfaces[i].Index) == 0 {
			return planeTrace{}, planeTrace{}, &optics.Warning{Code: CodeBeamInvalid, Element: p.Surfaces[i].ID, Message: "the path has no index for this surface; the beam was not computed"}
		}
	}
	lam := p.WavelengthsNM[0]
	g := newGaussian(lam, m2)
	gs := newGaussian(lam, m2s)
	t = trace(p, paraxial.Tangential, g, g.sourceQ(bm.WaistRadiusMM, bm.WaistAtMM))
	s = trace(p, paraxial.Sagittal, gs, gs.sourceQ(vertical.WaistRadiusMM, vertical.WaistAtMM))
	if at, angle, broke := breakdown(p, g, &t, &s); broke {
		w := notParaxialWarning(p, at, angle)
		return planeTrace{}, planeTrace{}, &w
	}
	return t, s, nil
}
