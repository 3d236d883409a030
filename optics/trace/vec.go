package trace

import "math"

// Vec is a point or a direction in a surface frame: X up, Y in the table plane to the left of
// travel (before any mirror), Z along the axis, all in mm.
type Vec struct{ X, Y, Z float64 }

// Add returns a + b.
func Add(a, b Vec) Vec { return Vec{a.X + b.X, a.Y + b.Y, a.Z + b.Z} }

// Sub returns a - b.
func Sub(a, b Vec) Vec { return Vec{a.X - b.X, a.Y - b.Y, a.Z - b.Z} }

// Scale returns f·v.
func Scale(f float64, v Vec) Vec { return Vec{f * v.X, f * v.Y, f * v.Z} }

// Dot returns the scalar product a·b.
func Dot(a, b Vec) float64 { return a.X*b.X + a.Y*b.Y + a.Z*b.Z }

// Norm returns the length of v.
func Norm(v Vec) float64 { return math.Sqrt(Dot(v, v)) }

// Unit returns v scaled to length 1. The zero vector has no direction: Unit returns it unchanged
// with NaN-free zeros, and callers that need a direction must check Norm first.
func Unit(v Vec) Vec {
	n := Norm(v)
	if n == 0 {
		return v
	}
	return Scale(1/n, v)
}
