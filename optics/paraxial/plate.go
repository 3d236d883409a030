package paraxial

import (
	"math"

	"raytable/optics"
)

// A plane-parallel plate of thickness t and index n, tilted so that the axis meets it at an angle
// of incidence θ, does three things to a beam in air: it displaces the axis sideways, in the
// plane of incidence, by
//
//	d = t sin θ (1 - cos θ / sqrt(n² - sin² θ)),
//
// it adds the optical path of the glass, and, seen paraxially about the refracted axis, it acts
// as a stretch of air of a different length in each plane. Along the refracted axis the glass
// path is L = t / cos θ'; the sagittal plane sees the reduced length L/n = t / sqrt(n² - sin² θ),
// the plane of incidence the shorter t n² cos² θ / (n² - sin² θ)^(3/2), because its rays are
// also squeezed by cos θ / cos θ' on the way in and stretched back on the way out. At normal
// incidence both are t/n, the familiar plate; at Brewster's angle they are t sqrt(n²+1)/n² and
// t sqrt(n²+1)/n⁴ (H. W. Kogelnik, E. P. Ippen, A. Dienes and C. V. Shank, IEEE J. Quantum
// Electron. 8, 373, 1972, from memory).

// PlateShiftMM is the sideways displacement d of the axis through a tilted plate (optics.PlateShiftMM).
func PlateShiftMM(thicknessMM, n, incidenceRad float64) float64 {
	return optics.PlateShiftMM(thicknessMM, n, incidenceRad)
}

// PlateGlassPathMM is the length t / cos θ' of the axis inside the plate (optics.PlateGlassPathMM).
func PlateGlassPathMM(thicknessMM, n, incidenceRad float64) float64 {
	return optics.PlateGlassPathMM(thicknessMM, n, incidenceRad)
}

// PlateReducedMM is the reduced length (the B of the plate's ABCD matrix) the plate adds in one
// plane: Tangential is the plane of incidence.
func PlateReducedMM(thicknessMM, n, incidenceRad float64, plane Plane) float64 {
	s, c := math.Sincos(incidenceRad)
	q := n*n - s*s
	if plane == Tangential {
		return thicknessMM * n * n * c * c / (q * math.Sqrt(q))
	}
	return thicknessMM / math.Sqrt(q)
}
