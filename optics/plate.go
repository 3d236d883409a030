package optics

import (
	"math"

	"raytable/optics/material"
)

// A splitter with a thickness is a plane-parallel plate met at the angle of incidence
// i = (180° - |turn_deg|)/2: its first face is the reflecting one, tilted as a mirror of the same
// turn would be. The transmitted axis refracts into the glass, runs the glass path
// L = t / cos θ' (sin θ' = sin i / n) and leaves parallel to its arriving direction, displaced
// sideways by
//
//	d = t sin i (1 - cos i / sqrt(n² - sin² i))
//
// to the side away from the reflected port (the glass normal leans that way and the axis bends
// towards it). Both follow from Snell's law at two parallel faces (any optics text, from memory).

// PlateShiftMM is the sideways displacement d of the axis through a plate of thickness t and
// index n met at incidence incidenceRad.
func PlateShiftMM(thicknessMM, n, incidenceRad float64) float64 {
	s, c := math.Sincos(incidenceRad)
	return thicknessMM * s * (1 - c/math.Sqrt(n*n-s*s))
}

// PlateGlassPathMM is the length t / cos θ' of the axis inside the plate.
func PlateGlassPathMM(thicknessMM, n, incidenceRad float64) float64 {
	s := math.Sin(incidenceRad)
	return thicknessMM * n / math.Sqrt(n*n-s*s)
}

// PlateDeviationRad is the angle i - θ' by which the axis inside the plate leans from its
// arriving direction, towards the plate's normal.
func PlateDeviationRad(n, incidenceRad float64) float64 {
	return incidenceRad - math.Asin(math.Sin(incidenceRad)/n)
}

// SplitterIncidenceRad is the angle of incidence of the axis on a splitter's surface,
// (180° - |turn_deg|)/2, or 0 when it has no turn.
func (e *Element) SplitterIncidenceRad() float64 {
	if e.TurnDeg == nil {
		return 0
	}
	return (math.Pi - math.Abs(*e.TurnDeg*math.Pi/180)) / 2
}

// PlateSide is the side of travel the axis through a splitter's plate is displaced to: +1 to the
// left (counter-clockwise, seen from above), -1 to the right; the opposite side to its reflected
// port.
func (e *Element) PlateSide() float64 {
	if e.TurnDeg != nil && *e.TurnDeg < 0 {
		return 1
	}
	return -1
}

// Plate is a splitter's plate: its thickness, its medium and its index at the primary wavelength.
type Plate struct {
	ThicknessMM float64
	Medium      material.Medium
	N           float64
}

// SplitterPlate is a splitter's plate. ok is false for a splitter of no thickness (or an element
// that is not a splitter), and when the medium cannot be resolved (validation reports that).
func SplitterPlate(b *Bench, e *Element) (pl Plate, ok bool) {
	if e.Type != TypeSplitter || e.ThicknessMM == nil || !(*e.ThicknessMM > 0) || len(b.WavelengthsNM) == 0 {
		return Plate{}, false
	}
	m, err := b.Medium(e.Material)
	if err != nil || m == nil {
		return Plate{}, false
	}
	n := m.Index(b.PrimaryWavelengthNM())
	if !(n >= 1) || math.IsInf(n, 0) {
		return Plate{}, false
	}
	return Plate{ThicknessMM: *e.ThicknessMM, Medium: m, N: n}, true
}

// PeriscopeQuarterTurns is a periscope's turn rounded to the nearest multiple of 90°, in quarter
// turns (-2..2): the paraxial and beam values take the beam's cross-section as rotated by that
// much. exact is false when the turn is not a multiple of 90° (then the image is rotated by an
// angle the two planes cannot describe).
func PeriscopeQuarterTurns(turnDeg float64) (quarters int, exact bool) {
	q := math.Round(turnDeg / 90)
	return int(q), math.Abs(turnDeg-90*q) <= quarterTolDeg
}

// quarterTolDeg is how close to a multiple of 90° a periscope's turn must be to count as one.
const quarterTolDeg = 1e-9
