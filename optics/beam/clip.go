package beam

import (
	"math"
)

// PassFraction is the transmission below which a clear aperture is said to clip the beam (common
// practice: an aperture should pass 99 % of a Gaussian beam).
const PassFraction = 0.99

// PassRadiusPerW is the radius of the centred circle that passes PassFraction of a round Gaussian
// beam, in units of its 1/e² radius w: 1 − exp(−2a²/w²) = 0.99 gives a = w·√(ln 100 / 2) ≈ 1.52 w.
// The clip rule and the mount-in-beam check both take the beam to be this wide.
var PassRadiusPerW = math.Sqrt(-math.Log(1-PassFraction) / 2)

// FractionInCircle is the fraction of the power of a centred Gaussian beam with 1/e² radii wxMM and
// wyMM (along two perpendicular axes) that a circle of radius aMM passes. A round beam gives
// 1 - exp(-2a²/w²); otherwise the integral
//
//	1 - (2/π) ∫₀^{π/2} exp(-2a² / (wx² cos²φ + wy² sin²φ)) dφ
//
// is evaluated by the trapezoidal rule, doubling the nodes until two estimates agree to 1e-12
// (exponential convergence for a smooth periodic integrand: Trefethen and Weideman 2014). The
// form follows from integrating the intensity over r in closed form in polar coordinates and
// substituting tan θ = (wy/wx) tan φ.
func FractionInCircle(aMM, wxMM, wyMM float64) float64 {
	switch {
	case math.IsInf(aMM, 1):
		return 1
	case !(aMM > 0) || math.IsNaN(wxMM) || math.IsNaN(wyMM):
		return 0
	case !(wxMM > 0) || !(wyMM > 0):
		return 1 // a beam of no width passes whole
	}
	if math.Abs(wxMM-wyMM) <= 1e-12*math.Max(wxMM, wyMM) {
		return -math.Expm1(-2 * aMM * aMM / (wxMM * wxMM))
	}
	a2, wx2, wy2 := 2*aMM*aMM, wxMM*wxMM, wyMM*wyMM
	f := func(phi float64) float64 {
		c, s := math.Cos(phi), math.Sin(phi)
		return math.Exp(-a2 / (wx2*c*c + wy2*s*s))
	}
	// Trapezoid on [0, π/2] for an even, π-periodic integrand: endpoints weigh one half.
	const tol = 1e-12
	n := 16
	h := math.Pi / 2 / float64(n)
	sum := (f(0) + f(math.Pi/2)) / 2
	for j := 1; j < n; j++ {
		sum += f(float64(j) * h)
	}
	est := sum * h
	for n < 1<<22 {
		// Halve the step: the new nodes are the midpoints of the old ones.
		for j := 0; j < n; j++ {
			sum += f((float64(j) + 0.5) * h)
		}
		n *= 2
		h /= 2
		next := sum * h
		if math.Abs(next-est) <= tol {
			est = next
			break
		}
		est = next
	}
	return 1 - 2/math.Pi*est
}

// footprint is the beam on one clear aperture of radius aMM: tangential and sagittal 1/e² radii
// measured on the optic (a tilted mirror stretches the tangential one by 1/cos i).
type footprint struct{ aMM, wtMM, wsMM float64 }

// passed is the fraction of the beam that passes all of an element's clear apertures together:
// the fraction inside their intersection, not the product of each face's fraction, which would
// count a ring clipped at one face again at the next. The apertures are coaxial circles on the
// element's faces and the beam between them scales nearly alike in both planes, so measured in
// beam radii they are nested: the one that passes least bounds all the others, and governs
// (README "Power"). A tilted face keeps its footprint, the ellipse of FractionInCircle.
func passed(faces []footprint) float64 {
	t := 1.0
	for _, f := range faces {
		t = math.Min(t, FractionInCircle(f.aMM, f.wtMM, f.wsMM))
	}
	return t
}

// passedWith is passed with every clear radius set to aMM.
func passedWith(faces []footprint, aMM float64) float64 {
	t := 1.0
	for _, f := range faces {
		t = math.Min(t, FractionInCircle(aMM, f.wtMM, f.wsMM))
	}
	return t
}

// clearDiameterFor is the smallest clear diameter (the same on every face) that passes the
// fraction want of the beam. A round beam on one face needs 2·w·sqrt(ln(1/(1-want))/2); the
// general case is solved by bisection, since the passed fraction grows with the radius.
func clearDiameterFor(faces []footprint, want float64) float64 {
	if len(faces) == 1 && faces[0].wtMM == faces[0].wsMM {
		return 2 * faces[0].wtMM * math.Sqrt(math.Log(1/(1-want))/2)
	}
	hi := 0.0
	for _, f := range faces {
		hi = math.Max(hi, math.Max(f.wtMM, f.wsMM))
	}
	if hi == 0 || math.IsNaN(hi) || math.IsInf(hi, 0) {
		return math.NaN() // no usable beam size: no advice rather than a loop that never ends
	}
	lo := 0.0
	// Each doubling at least doubles the aperture against a finite beam; 64 of them cover every
	// float64 scale, so the loop ends even if passedWith misbehaves.
	for range 64 {
		if passedWith(faces, hi) >= want {
			break
		}
		lo, hi = hi, 2*hi
	}
	for range 200 {
		mid := (lo + hi) / 2
		if passedWith(faces, mid) < want {
			lo = mid
		} else {
			hi = mid
		}
		if hi-lo <= 1e-9*hi {
			break
		}
	}
	return 2 * hi
}
