// Package approx compares computed floating-point values with their references in tests, with
// tolerances that have names. It follows the helpers of Go's own math tests (tolerance, close,
// veryclose and alike in src/math/all_test.go) and is imported only by _test.go files under optics.
// Check and CheckPtr report a failed comparison on a testing.TB, naming the quantity.
//
// Every comparison fails on NaN and on an infinity that the reference does not share, so that a
// check cannot pass by accident where a hand-written `math.Abs(got-want) > tol` would: a NaN
// difference compares false with everything.
package approx

import "math"

// Shared tolerances, named for what they absorb. A test with another bound names its own
// constant beside the check and says where the number comes from.
const (
	// Rounding is what a closed form evaluated two ways in float64 leaves on values of order
	// 1 to 1000: about 4500 ulps of 1 (2.2e-16 each), room for cancellation such as AD - BC.
	Rounding = 1e-12
	// VeryClose is for a closed form reproduced along a different route of computation:
	// a product of matrices, a surface-by-surface trace, a root found by iteration.
	VeryClose = 1e-9
	// Close is for values carried through a whole pipeline (decode, path, trace, report).
	Close = 1e-6
)

// Rel reports whether got lies within e of want relative to |want|; when want is 0 the bound e is
// absolute. Equal values always agree (so e = 0 asks for equality), as in math's tolerance.
func Rel(got, want, e float64) bool {
	if want != 0 {
		e *= math.Abs(want)
	}
	return Abs(got, want, e)
}

// Abs reports whether |got - want| <= e, a bound in the units of the values.
func Abs(got, want, e float64) bool {
	if got == want {
		return true
	}
	if math.IsInf(got, 0) || math.IsInf(want, 0) {
		return false
	}
	return math.Abs(got-want) <= e
}

// Mixed reports whether got lies within e·max(|want|, 1) of want: relative for magnitudes above 1,
// absolute below, the usual mixed absolute-relative test for a quantity that may pass through
// zero (a defocus per mm, a principal plane at the vertex).
func Mixed(got, want, e float64) bool {
	return Abs(got, want, e*math.Max(math.Abs(want), 1))
}

// Alike reports whether a and b are the same value: both NaN, or equal with the same sign, so
// that +0 and -0 differ, as in math's alike.
func Alike(a, b float64) bool {
	switch {
	case math.IsNaN(a) && math.IsNaN(b):
		return true
	case a == b:
		return math.Signbit(a) == math.Signbit(b)
	}
	return false
}
