package layout

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"
)

// NormDeg brings a heading into [0, 360).
func NormDeg(h float64) float64 {
	h = math.Mod(h, 360)
	if h < 0 {
		h += 360
	}
	if h >= 360 { // -tiny + 360 rounds to 360
		h = 0
	}
	return h
}

// sincosDeg returns sin and cos of an angle in degrees, exact at multiples of 90° so that benches
// laid out along the table's axes land on exact coordinates (no 6e-17 residues from cos(π/2)).
func sincosDeg(deg float64) (s, c float64) {
	d := NormDeg(deg)
	switch d {
	case 0:
		return 0, 1
	case 90:
		return 1, 0
	case 180:
		return 0, -1
	case 270:
		return -1, 0
	}
	return math.Sincos(d * math.Pi / 180)
}

// Positions and directions on the table are gonum's r2.Vec in millimetres (X along the width, Y
// along the depth); the free functions below add what r2 leaves out.

// unitDeg is the unit vector of a heading in degrees, exact along the table's axes.
func unitDeg(deg float64) r2.Vec { s, c := sincosDeg(deg); return r2.Vec{X: c, Y: s} }

// perp turns v by 90° counter-clockwise seen from above.
func perp(v r2.Vec) r2.Vec { return r2.Vec{X: -v.Y, Y: v.X} }

// headingOf is the heading of v in degrees, in [0, 360).
func headingOf(v r2.Vec) float64 { return NormDeg(math.Atan2(v.Y, v.X) * 180 / math.Pi) }

// along is the point d millimetres from p along heading deg.
func along(p r2.Vec, deg, d float64) r2.Vec { return r2.Add(p, r2.Scale(d, unitDeg(deg))) }

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

func finiteVec(v r2.Vec) bool { return finite(v.X) && finite(v.Y) }

// unitOr is v scaled to length 1, or fallback when v has no usable direction (shorter than 1e-12
// mm, or not finite).
func unitOr(v, fallback r2.Vec) r2.Vec {
	n := r2.Norm(v)
	if n < 1e-12 || !finite(n) {
		return fallback
	}
	return r2.Scale(1/n, v)
}
