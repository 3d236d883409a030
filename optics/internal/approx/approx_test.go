package approx

import (
	"math"
	"testing"
)

// One table of special cases through every comparison: the helpers must fail on NaN and on a lone
// infinity, agree on equal values whatever e is, and scale e as documented.
func TestComparisons(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name            string
		got, want, e    float64
		rel, abs, mixed bool
	}{
		{"equal", 1.5, 1.5, 0, true, true, true},
		{"equal infinities", inf, inf, 0, true, true, true},
		{"opposite infinities", -inf, inf, inf, false, false, false},
		{"infinity against a number", inf, 1, inf, false, false, false},
		{"number against infinity", 1, inf, 1, false, false, false},
		{"NaN got", nan, 1, inf, false, false, false},
		{"NaN want", 1, nan, inf, false, false, false},
		{"NaN both", nan, nan, inf, false, false, false},
		{"relative inside", 1000.0005, 1000, 1e-6, true, false, true},
		{"relative outside", 1000.002, 1000, 1e-6, false, false, false},
		{"at the bound", 1.25, 1, 0.25, true, true, true},
		{"small want: absolute for Abs and Mixed", 0.0105, 0.01, 1e-3, false, true, true},
		{"zero want: every bound absolute", 1e-13, 0, Rounding, true, true, true},
		{"zero want, outside", 2e-12, 0, Rounding, false, false, false},
		{"signed zeros are equal", math.Copysign(0, -1), 0, 0, true, true, true},
	}
	for _, c := range cases {
		if got := Rel(c.got, c.want, c.e); got != c.rel {
			t.Errorf("%s: Rel(%v, %v, %v) = %v, want %v", c.name, c.got, c.want, c.e, got, c.rel)
		}
		if got := Abs(c.got, c.want, c.e); got != c.abs {
			t.Errorf("%s: Abs(%v, %v, %v) = %v, want %v", c.name, c.got, c.want, c.e, got, c.abs)
		}
		if got := Mixed(c.got, c.want, c.e); got != c.mixed {
			t.Errorf("%s: Mixed(%v, %v, %v) = %v, want %v", c.name, c.got, c.want, c.e, got, c.mixed)
		}
	}
}

func TestAlike(t *testing.T) {
	nan, inf, negZero := math.NaN(), math.Inf(1), math.Copysign(0, -1)
	cases := []struct {
		a, b float64
		want bool
	}{
		{nan, nan, true},
		{nan, 0, false},
		{0, 0, true},
		{negZero, negZero, true},
		{negZero, 0, false},
		{inf, inf, true},
		{inf, -inf, false},
		{1, 1 + 1e-16, true}, // 1 + 1e-16 rounds to 1
		{1, math.Nextafter(1, 2), false},
	}
	for _, c := range cases {
		if got := Alike(c.a, c.b); got != c.want {
			t.Errorf("Alike(%v, %v) = %v, want %v", c.a, c.b, got, c.want)
		}
	}
}
