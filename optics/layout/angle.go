package layout

import "math"

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

// Point is a position on the table in millimetres.
type Point struct {
	X float64 `json:"x_mm"`
	Y float64 `json:"y_mm"`
}

func (p Point) add(q Point) Point         { return Point{p.X + q.X, p.Y + q.Y} }
func (p Point) sub(q Point) Point         { return Point{p.X - q.X, p.Y - q.Y} }
func (p Point) scale(s float64) Point     { return Point{p.X * s, p.Y * s} }
func (p Point) dot(q Point) float64       { return p.X*q.X + p.Y*q.Y }
func (p Point) norm() float64             { return math.Hypot(p.X, p.Y) }
func unitDeg(deg float64) Point           { s, c := sincosDeg(deg); return Point{c, s} }
func (p Point) perp() Point               { return Point{-p.Y, p.X} } // 90° counter-clockwise
func headingOf(p Point) float64           { return NormDeg(math.Atan2(p.Y, p.X) * 180 / math.Pi) }
func finite(v float64) bool               { return !math.IsNaN(v) && !math.IsInf(v, 0) }
func along(p Point, deg, d float64) Point { return p.add(unitDeg(deg).scale(d)) }
