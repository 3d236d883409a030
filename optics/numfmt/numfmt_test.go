package numfmt

import (
	"math"
	"testing"
)

// Every expected string is the precision's rule applied by hand (five significant digits for
// engineering tables and the like are common practice; the rest are this package's own rules).
func TestFormat(t *testing.T) {
	negZero := math.Copysign(0, -1)
	tenth := 0.1 // a variable, so that 0.1 + 0.2 is float64 arithmetic, not an exact constant
	for _, tc := range []struct {
		p    Precision
		in   float64
		want string
	}{
		{Exact, 25.4, "25.4"}, {Exact, tenth + 0.2, "0.30000000000000004"}, {Exact, 1e-5, "1e-05"},
		{Exact, 2e9, "2000000000"}, {Exact, 1e15, "1e+15"}, {Exact, negZero, "-0"},
		{Field, 2e9, "2e+09"}, {Field, 999999999, "999999999"}, {Field, 0.0001, "0.0001"},
		{Message, 3.14159, "3.142"}, {Message, 123456, "123500"}, {Message, 2.5e-5, "2.5e-05"},
		{Brief, 25.4, "25.4"}, {Brief, 12345, "1.234e+04"}, {Brief, 0.04, "0.04"},
		{Rough, 0.00512, "0.00512"}, {Rough, 1234, "1.23e+03"},
		{Report, -41.56187, "-41.5619"}, {Report, 0.000349066, "0.000349066"}, {Report, 1234567, "1.23457e+06"},
		// Rounding noise of a length that is really 0 (common practice: no bench length is 1e-12 mm).
		{Report, math.Copysign(0, -1), "0"}, {Report, -1.4e-15, "0"}, {Report, 2e-12, "2e-12"},
		{Panel, 0, "0"}, {Panel, negZero, "0"}, {Panel, 1e-20, "1e-20"}, {Panel, 130.1749, "130.17"},
		{Panel, -41.5617, "-41.562"}, {Panel, 0.000349071, "0.00034907"}, {Panel, 123456.7, "123460"},
		{Panel, math.NaN(), "—"}, {Panel, math.Inf(1), "—"},
		{Label, 608.5, "608.5"}, {Label, 1234.5, "1235"}, {Label, 0.00012345, "0.0001235"}, {Label, 123456, "123500"},
		{Label, math.NaN(), "?"}, {Label3, 608.5, "609"}, {Label3, 12.34, "12.3"},
		{Tenth, 1.25, "1.3"}, {Tenth, -0.04, "0"}, {Tenth, 0.04, "0"}, {Tenth, math.Inf(-1), "?"},
		{Hundredth, 137.5, "137.50"}, {Hundredth, -0.001, "0.00"}, {Hundredth, -1.005, "-1.00"},
		{TenThousandth, 0.99848, "0.9985"}, {TenThousandth, 1, "1.0000"},
		{Index, 1.4570183, "1.457018"},
		// The drawings round halves away from zero; strconv, and so Panel and Message, rounds the
		// exact decimal value to even. Each output keeps the rule it has always used.
		{Label3, 604.5, "605"}, {Label3, -608.5, "-609"}, {Message, 608.5, "608.5"},
		{Panel, 60850.5, "60850"}, {Panel, 60851.5, "60852"},
	} {
		if got := tc.p.Format(tc.in); got != tc.want {
			t.Errorf("precision %d of %v = %q, want %q", tc.p, tc.in, got, tc.want)
		}
	}
}

func TestSigned(t *testing.T) {
	for _, tc := range []struct {
		p    Precision
		in   float64
		want string
	}{
		{Panel, 12.5, "+12.5"}, {Panel, -3, "-3"}, {Panel, 0, "0"}, {Panel, 1e-20, "+1e-20"},
		{Tenth, 0.04, "0"}, {Tenth, 0.06, "+0.1"}, {Tenth, -2.34, "-2.3"}, {Tenth, math.NaN(), "?"},
	} {
		if got := Signed(tc.p, tc.in); got != tc.want {
			t.Errorf("Signed(%d, %v) = %q, want %q", tc.p, tc.in, got, tc.want)
		}
	}
}

// Every precision has a rule: Format panics on an unknown one, so each named constant is tried.
func TestEveryPrecisionFormats(t *testing.T) {
	for p := Exact; p <= Index; p++ {
		if got := p.Format(1.5); got == "" {
			t.Errorf("precision %d writes nothing", p)
		}
	}
}
