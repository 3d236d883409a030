package beam

import (
	"math"

	"raytable/optics/paraxial"
)

// Gaussian holds what the q law needs besides q itself: the embedded-Gaussian wavelength M²λ.
type gaussian struct {
	lamMM float64 // M² times the vacuum wavelength, in mm
}

func newGaussian(wavelengthNM, m2 float64) gaussian {
	return gaussian{lamMM: m2 * wavelengthNM * 1e-6}
}

// RayleighRangeMM is π w0² / (M² λ), the distance from a waist at which the beam area doubles
// (Kogelnik and Li 1966; Siegman 1986). w0 is the real beam's 1/e² waist radius.
func RayleighRangeMM(waistRadiusMM, wavelengthNM, m2 float64) float64 {
	return math.Pi * waistRadiusMM * waistRadiusMM / (m2 * wavelengthNM * 1e-6)
}

// sourceQ is the reduced q at the source plane (air) for a waist of radius w0 at waistAtMM along
// the path: q(z) = (z - z_waist) + i zR.
func (g gaussian) sourceQ(waistRadiusMM, waistAtMM float64) complex128 {
	zR := math.Pi * waistRadiusMM * waistRadiusMM / g.lamMM
	return complex(-waistAtMM, zR)
}

// radiusMM is the 1/e² radius w of the beam with reduced parameter q: Im(1/q) = -M²λ/(π w²).
func (g gaussian) radiusMM(q complex128) float64 {
	return math.Sqrt(-g.lamMM / (math.Pi * imag(1/q)))
}

// waistRadiusMM is the radius at the waist of a beam whose reduced Rayleigh range is im = Im(q̂)
// there: w0² = M²λ·Im(q̂)/π (the reduced form needs no index here).
func (g gaussian) waistRadiusMM(im float64) float64 {
	return math.Sqrt(g.lamMM * im / math.Pi)
}

// curvatureMM is the wavefront radius R = n / Re(1/q̂) in a medium of index n, positive for a
// diverging beam, or nil at a waist (Re(1/q̂) negligible against Im(1/q̂)).
func curvatureMM(q complex128, n float64) *float64 {
	inv := 1 / q
	if math.Abs(real(inv)) <= 1e-12*math.Abs(imag(inv)) {
		return nil
	}
	r := n / real(inv)
	return &r
}

// applyABCD is the law q' = (Aq + B)/(Cq + D) for a reduced matrix and reduced q.
func applyABCD(m paraxial.Matrix, q complex128) complex128 {
	return (complex(m.A, 0)*q + complex(m.B, 0)) / (complex(m.C, 0)*q + complex(m.D, 0))
}

// advance moves a reduced q a distance d through a medium of index n: q̂ + d/n.
func advance(q complex128, d, n float64) complex128 {
	return q + complex(d/n, 0)
}
