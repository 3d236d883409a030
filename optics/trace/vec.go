package trace

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Points and directions are gonum's r3.Vec in a surface frame: X up, Y in the table plane to the
// left of travel (before any mirror), Z along the axis, all in mm. Sums, differences, scaling and
// dot products are r3's (they inline, so the trace allocates nothing per ray). The length and the
// unit vector are our own: r3.Norm nests two math.Hypot calls, which is slower in the inner loop
// and rounds differently from the square root of the dot product that every traced number so far
// was computed with; and r3.Unit turns the zero vector into NaNs, where callers here check the
// length themselves.

// norm returns the length of v, the square root of v·v (no overflow guard: ray vectors in mm are
// far from the float64 range).
func norm(v r3.Vec) float64 { return math.Sqrt(r3.Dot(v, v)) }

// unit returns v scaled to length 1. The zero vector has no direction: unit returns it unchanged
// with NaN-free zeros, and callers that need a direction must check its norm first.
func unit(v r3.Vec) r3.Vec {
	n := norm(v)
	if n == 0 {
		return v
	}
	return r3.Scale(1/n, v)
}
