package approx

import (
	"fmt"
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

// recorder is a testing.TB that keeps the errors reported to it.
type recorder struct {
	testing.TB
	errors []string
}

func (r *recorder) Helper() {}
func (r *recorder) Errorf(format string, args ...any) {
	r.errors = append(r.errors, fmt.Sprintf(format, args...))
}

func TestCheck(t *testing.T) {
	v := 2.0000001
	cases := []struct {
		name string
		run  func(tb testing.TB)
		want string // "" for no error
	}{
		{"inside", func(tb testing.TB) { Check(tb, "x", 2.0000001, 2, Close) }, ""},
		{"outside", func(tb testing.TB) { Check(tb, "x", 2.00001, 2, Close) }, "x = 2.00001, want 2 (tolerance 1e-06)"},
		{"NaN", func(tb testing.TB) { Check(tb, "x", math.NaN(), 2, Close) }, "x = NaN, want 2 (tolerance 1e-06)"},
		{"pointer inside", func(tb testing.TB) { CheckPtr(tb, "p", &v, 2, Close) }, ""},
		{"nil pointer", func(tb testing.TB) { CheckPtr(tb, "p", nil, 2, Close) }, "p = nil, want 2"},
	}
	for _, c := range cases {
		r := &recorder{TB: t}
		c.run(r)
		switch {
		case c.want == "" && len(r.errors) != 0:
			t.Errorf("%s: errors %q, want none", c.name, r.errors)
		case c.want != "" && (len(r.errors) != 1 || r.errors[0] != c.want):
			t.Errorf("%s: errors %q, want [%q]", c.name, r.errors, c.want)
		}
	}
}
