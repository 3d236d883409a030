package beam

import (
	"math"
	"math/cmplx"
)

// Profile is one transverse plane of a Gaussian beam at a plane across the path: its 1/e²
// intensity radius and its wavefront radius of curvature (positive diverging, negative converging,
// ±Inf or 0 for a flat wavefront at a waist).
type Profile struct {
	RadiusMM    float64
	CurvatureMM float64
}

// Offset places the second beam relative to the first in one plane: its axis displaced by
// LateralMM and tilted by TiltRad.
type Offset struct {
	LateralMM, TiltRad float64
}

// exponent is a in E(x) = exp(-a x²): Re a = 1/w², Im a = k/(2R) with k = 2π/λ, so that the
// field's phase -k x²/(2R) is that of a spherical wave from a point R upstream (the paraxial
// form of the Gaussian beam, Kogelnik and Li 1966).
func (p Profile) exponent(kPerMM float64) complex128 {
	re := 1 / (p.RadiusMM * p.RadiusMM)
	im := 0.0
	if p.CurvatureMM != 0 && !math.IsInf(p.CurvatureMM, 0) {
		im = kPerMM / (2 * p.CurvatureMM)
	}
	return complex(re, im)
}

// OverlapPlane is the normalised amplitude overlap of two Gaussian fields in one plane,
//
//	γ = ∫ E1 E2* dx / sqrt(∫|E1|² dx ∫|E2|² dx),
//
// with E2 displaced and tilted by off, at a vacuum wavelength in nm in air. |γ| ≤ 1, with equality
// only for identical, aligned beams. The integral is closed-form: for E1 = exp(-a x²) and
// E2 = exp(-b (x-d)² + i k θ x), ∫ E1 E2* = sqrt(π/A) exp(B²/(4A) - b* d²) with A = a + b* and
// B = 2 b* d - i k θ.
func OverlapPlane(one, two Profile, off Offset, wavelengthNM float64) complex128 {
	k := 2 * math.Pi / (wavelengthNM * 1e-6)
	a, b := one.exponent(k), two.exponent(k)
	bc := cmplx.Conj(b)
	A := a + bc
	d := complex(off.LateralMM, 0)
	B := 2*bc*d - complex(0, k*off.TiltRad)
	integral := cmplx.Sqrt(complex(math.Pi, 0)/A) * cmplx.Exp(B*B/(4*A)-bc*d*d)
	norm := math.Sqrt(math.Sqrt(math.Pi/(2*real(a))) * math.Sqrt(math.Pi/(2*real(b))))
	return integral / complex(norm, 0)
}

// Overlap is the normalised amplitude overlap of two beams whose tangential and sagittal planes
// are aligned: the product of the two planes' overlaps (the fields separate in x and y).
func Overlap(oneT, oneS, twoT, twoS Profile, offT, offS Offset, wavelengthNM float64) complex128 {
	return OverlapPlane(oneT, twoT, offT, wavelengthNM) * OverlapPlane(oneS, twoS, offS, wavelengthNM)
}

// Visibility is the fringe contrast two beams of equal power give where they overlap, |γ|, and
// Coupling the fraction of one beam's power that the other's mode accepts, |γ|².
func Visibility(gamma complex128) float64 { return cmplx.Abs(gamma) }

// Coupling is the power coupling efficiency |γ|² of a beam into a mode.
func Coupling(gamma complex128) float64 {
	v := cmplx.Abs(gamma)
	return v * v
}
