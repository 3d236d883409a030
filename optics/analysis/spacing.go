package analysis

import (
	"context"
	"math"
	"slices"

	"raytable/optics"
	"raytable/optics/beam"
	"raytable/optics/paraxial"
)

// SpacingStepMM is δ, the change of one gap in the central difference (f(g+δ) - f(g-δ))/(2δ).
// Its truncation error is δ²/6 of the third derivative, about 1e-9 relative for the focal lengths
// and conjugates of a bench; its rounding error about ε·|z|/δ, 1e-11 for positions of a metre.
const SpacingStepMM = 0.01

// noiseRel is how small a difference of two computed values must be, relative to the values
// themselves, to count as rounding: far above ε (about 1e-16 per operation, accumulated over a few
// hundred surfaces) and far below any real change over ±δ.
const noiseRel = 1e-12

// SpacingTolerances computes, for every element up to the one the image is looked at, how a
// change of its gap alone moves the image or spoils the collimation, and the gap error the
// allowance permits (see optics.SpacingTolerance and optics.SpacingBasis for the definitions).
//
// p must be optics.BuildPath(b) and tan paraxial.Analyze(b, p, 0, paraxial.Tangential). Each gap
// is changed by ±SpacingStepMM in one reused copy of the path (b and p are not changed): a gap
// change only moves every surface from that element on along the path, so the copy's positions
// are shifted instead of rebuilding the path, and then recomputed: two recomputations per element. Elements after the first dump receive no light
// and get no row.
func SpacingTolerances(b *optics.Bench, p *optics.Path, tan paraxial.Result) ([]optics.SpacingTolerance, optics.SpacingBasis) {
	rows, basis, _ := spacingTolerances(context.Background(), b, p, tan) // never done: no error
	return rows, basis
}

// spacingTolerances is SpacingTolerances that stops with the EDeadline error once ctx is done,
// checked before each element's pair of steps.
func spacingTolerances(ctx context.Context, b *optics.Bench, p *optics.Path, tan paraxial.Result) ([]optics.SpacingTolerance, optics.SpacingBasis, error) {
	rows := []optics.SpacingTolerance{}
	basis := optics.SpacingBasis{Kind: optics.SpacingNone}
	if len(b.WavelengthsNM) > 0 {
		basis.WavelengthNM = b.WavelengthsNM[0]
	}
	_, last, ok := p.OpticalRange()
	if !ok || len(b.Elements) == 0 || len(b.WavelengthsNM) == 0 {
		return rows, basis, nil
	}
	ref := referenceElement(b)
	basis.Reference = b.Elements[ref].ID
	lambdaMM := b.WavelengthsNM[0] * 1e-6

	s := spacingProbe{src: &b.Source, ref: ref, last: last, start: tan.MarginalStart}
	s.focus = tan.Values.ImageDistanceMM != nil
	var allowance float64 // depth of focus (mm) or diffraction angle (rad); 0 when there is none
	switch {
	case s.focus && *tan.Values.ImageDistanceMM < 0:
		// A virtual image lies upstream of the last vertex: the output diverges and there is no
		// focus for a depth of focus to hold, so the image shifts are given without tolerances.
		basis.Kind = optics.SpacingVirtualImage
	case s.focus:
		basis.Kind = optics.SpacingDepthOfFocus
		if na := tan.Values.ImageNA; na != nil {
			basis.ImageNA = ptr(*na)
			if *na > 0 {
				allowance = lambdaMM / (2 * *na * *na)
				basis.DepthOfFocusMM = ptr(allowance)
			}
		}
	default:
		basis.Kind = optics.SpacingDiffractionAngle
		w := math.Abs(tan.Marginal[last].Y)
		basis.OutputRadiusMM = ptr(w)
		if w > 0 {
			allowance = lambdaMM / (math.Pi * w)
			basis.DivergenceRad = ptr(allowance)
		}
		s.slopeScale = slopeTermBound(p, tan.Marginal)
	}

	// With a Gaussian beam the allowance is the output beam's own Rayleigh range (see
	// beamBasis); the geometric sensitivities are still reported beside it.
	zR := s.beamBasis(b, p, &basis)

	work := *p
	work.Surfaces = slices.Clone(p.Surfaces)
	shift := func(from int, d float64) {
		for j := range work.Surfaces {
			work.Surfaces[j].PathMM = p.Surfaces[j].PathMM
			if j >= from {
				work.Surfaces[j].PathMM += d
			}
		}
	}
	s.trace = make([]paraxial.Ray, len(p.Surfaces))
	for i := 0; i <= ref; i++ {
		if err := deadlineErr(ctx); err != nil {
			return nil, basis, err
		}
		gap := b.Elements[i].GapMM
		shift(p.Spans[i].First, SpacingStepMM)
		plus := s.measure(&work)
		shift(p.Spans[i].First, -SpacingStepMM)
		minus := s.measure(&work)

		row := optics.SpacingTolerance{ID: b.Elements[i].ID, GapMM: gap}
		var sensitivity float64
		switch {
		case s.focus && plus.imaged && minus.imaged:
			shift := centralDifference(plus.zImage, minus.zImage, math.Max(math.Abs(plus.zImage), math.Abs(minus.zImage)))
			scale := math.Max(math.Max(math.Abs(plus.zImage), math.Abs(minus.zImage)), math.Max(math.Abs(plus.zRef), math.Abs(minus.zRef)))
			sensitivity = centralDifference(plus.zImage-plus.zRef, minus.zImage-minus.zRef, scale)
			row.ImageShiftPerMM = ptr(shift)
			row.DefocusPerMM = ptr(sensitivity)
		case !s.focus:
			sensitivity = centralDifference(plus.slope, minus.slope, s.slopeScale)
			row.DivergencePerMM = ptr(sensitivity)
		}
		if zR > 0 {
			sensitivity, allowance = 0, zR
			if plus.waisted && minus.waisted {
				sensitivity = centralDifference(plus.zWaist-plus.zRef, minus.zWaist-minus.zRef, math.Max(plus.scale, minus.scale))
				row.WaistShiftPerMM = ptr(sensitivity)
			}
		}
		if sensitivity != 0 && allowance > 0 {
			if tol := allowance / math.Abs(sensitivity); tol <= longestGapChangeMM(b) {
				row.ToleranceMM = ptr(tol)
			}
		}
		rows = append(rows, row)
	}
	return rows, basis, nil
}

// beamBasis sets the tolerances' allowance from the source's Gaussian beam, when it has one that
// can be followed to the last optical vertex: every gap is then held to the change that moves the
// output beam's waist by its own Rayleigh range relative to the reference element (README, Report,
// spacing). One rule serves a waist on a screen (the waist leaves the screen by its depth of
// focus) and a collimated output (its waist, near or far, moves by its own length, the
// divergence-free stretch of the beam), and it is smooth in every gap: waist position and
// Rayleigh range are smooth functions of q, which has no jump as the output passes through
// collimation, unlike the geometric image distance. It returns the Rayleigh range (0: no beam,
// the geometric basis stands) and arms s to measure the waist on every changed path.
//
// A fibre or mode target as the reference element is measured the same way: the beam's waist
// against the element it is looked at (referenceElement).
func (s *spacingProbe) beamBasis(b *optics.Bench, p *optics.Path, basis *optics.SpacingBasis) float64 {
	w, ok := beam.WaistAfter(b, p, s.last, paraxial.Tangential)
	if !ok || !(w.RayleighMM > 0) {
		return 0
	}
	basis.Kind = optics.SpacingBeamRayleigh
	basis.RayleighMM = ptr(w.RayleighMM)
	basis.WaistFromReferenceMM = ptr(p.Surfaces[s.last].PathMM + w.AfterMM - p.Surfaces[p.Spans[s.ref].First].PathMM)
	s.bench = b
	return w.RayleighMM
}

// referenceElement is the element the output is looked at: the first that stops rays (a dump),
// or else the bench's last element.
func referenceElement(b *optics.Bench) int {
	for i := range b.Elements {
		if k, ok := optics.KindOf(b.Elements[i].Type); ok && k.StopsRays {
			return i
		}
	}
	return len(b.Elements) - 1
}

// spacingProbe recomputes the quantities the tolerances are made of on a changed bench.
type spacingProbe struct {
	src        *optics.Source
	focus      bool // a finite image: measure its position; otherwise the output slope
	ref, last  int  // reference element; last optical surface (the same on every changed path)
	start      paraxial.Ray
	slopeScale float64
	trace      []paraxial.Ray // reused by every trace
	bench      *optics.Bench  // set when the tolerances come from the beam
}

// spacingSample is what one changed bench gives.
type spacingSample struct {
	imaged bool    // the image is at a finite distance
	zImage float64 // image position along the path
	zRef   float64 // reference element's position along the path
	slope  float64 // output marginal ray slope dy/dz

	waisted bool    // the beam could be followed to the last optical vertex
	zWaist  float64 // the output beam's waist position along the path
	scale   float64 // the size of zWaist and zRef, against which rounding is told
}

func (s *spacingProbe) measure(p *optics.Path) spacingSample {
	out := spacingSample{zRef: p.Surfaces[p.Spans[s.ref].First].PathMM}
	if s.bench != nil {
		if w, ok := beam.WaistAfter(s.bench, p, s.last, paraxial.Tangential); ok {
			zLast := p.Surfaces[s.last].PathMM
			out.waisted, out.zWaist = true, zLast+w.AfterMM
			out.scale = math.Max(math.Abs(zLast)+math.Abs(w.AfterMM)+w.RayleighMM, math.Abs(out.zRef))
		}
	}
	if s.focus {
		c := paraxial.Cardinals(p, 0, paraxial.Tangential, s.src)
		if c.ImageDistanceMM != nil {
			out.imaged = true
			out.zImage = p.Surfaces[s.last].PathMM + *c.ImageDistanceMM
		}
		return out
	}
	s.trace = paraxial.TraceInto(s.trace, p, 0, paraxial.Tangential, s.start)
	out.slope = s.trace[s.last].NU / p.Surfaces[s.last].Index[0]
	return out
}

// centralDifference is (plus - minus)/(2δ), or 0 when the difference is rounding noise for values
// of the given size.
func centralDifference(plus, minus, scale float64) float64 {
	d := plus - minus
	if math.Abs(d) <= noiseRel*scale {
		return 0
	}
	return d / (2 * SpacingStepMM)
}

// slopeTermBound bounds the terms summed into the output slope of the marginal ray: Σ|P·y| over
// the surfaces it crosses (the running error bound of a sum; Higham, Accuracy and Stability of
// Numerical Algorithms, 2nd ed. 2002, sec. 4.2), the size against which a change of that slope is
// told from rounding.
func slopeTermBound(p *optics.Path, marginal []paraxial.Ray) float64 {
	var sum float64
	for i := range p.Surfaces {
		sum += math.Abs(paraxial.Power(&p.Surfaces[i], p.IndexBefore(i, 0), p.Surfaces[i].Index[0], paraxial.Tangential) * marginal[i].Y)
	}
	return sum
}

// longestGapChangeMM is the largest gap error a tolerance is stated for: a spacing on the table
// cannot be off by more than the table's diagonal, so a longer tolerance means the gap does not
// matter (null, shown as "-"); without a table size the bound is MaxLengthMM.
func longestGapChangeMM(b *optics.Bench) float64 {
	if d := math.Hypot(b.Table.WidthMM, b.Table.DepthMM); d > 0 {
		return d
	}
	return optics.MaxLengthMM
}
