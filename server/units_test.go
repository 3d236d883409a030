package server

import (
	"math"
	"strings"
	"testing"
)

// unitTolerance covers the last-bit rounding of a multiplication by a unit factor.
const unitTolerance = 1e-12

func TestQuantityParse(t *testing.T) {
	for _, tc := range []struct {
		q    quantity
		in   string
		want float64
	}{
		// Lengths: the inch is 25.4 mm exactly (international yard and pound agreement, 1959).
		{length, "25.4", 25.4},
		{length, " 25.4 mm ", 25.4},
		{length, "1 in", 25.4},
		{length, `1"`, 25.4},
		{length, "2 inches", 50.8},
		{length, "2.5 cm", 25},
		{length, "2.5cm", 25},
		{length, "0.1 m", 100},
		{length, "500 um", 0.5},
		{length, "500 µm", 0.5},
		{length, "500 μm", 0.5},
		{length, "-250", -250},
		{length, "1e3", 1000},
		{length, "1.5E-2 mm", 0.015},
		{length, "3 MM", 3},
		{length, " 3 mm ", 3},
		{length, "-0", 0},
		{length, "-0 in", 0},
		// Wavelengths in nm, or micrometres.
		{wavelength, "632.8", 632.8},
		{wavelength, "632.8 nm", 632.8},
		{wavelength, "1.064 um", 1064},
		{wavelength, "1.55 µm", 1550},
		// Angles in degrees.
		{angle, "0.5", 0.5},
		{angle, "90 deg", 90},
		{angle, "-90°", -90},
		{plain, "0.1", 0.1},
	} {
		got, err := tc.q.parse(tc.in)
		if err != nil {
			t.Errorf("%s %q: %v", tc.q.noun, tc.in, err)
			continue
		}
		if math.Signbit(got) != math.Signbit(tc.want) {
			t.Errorf("%s %q = %v, want the sign of %v (no negative zero is stored)", tc.q.noun, tc.in, got, tc.want)
		}
		if math.Abs(got-tc.want) > unitTolerance*math.Max(1, math.Abs(tc.want)) {
			t.Errorf("%s %q = %v, want %v", tc.q.noun, tc.in, got, tc.want)
		}
	}
}

func TestQuantityParseRejects(t *testing.T) {
	for _, tc := range []struct {
		q    quantity
		in   string
		want string
	}{
		{length, "abc", `"abc" is not a length; use a number in mm or a unit such as 1 in, 2.5 cm`},
		{length, "NaN", "is not a length"},
		{length, "Inf", "is not a length"},
		{length, "-Inf mm", "is not a length"},
		{length, "1e999", "too large"},
		{length, "1e13", "too large"},
		{length, "5 furlongs", "is not a length"},
		{length, "mm", "is not a length"},
		{length, "--1", "is not a length"},
		{length, "1.2.3", "is not a length"},
		{length, "0x10", "is not a length"},
		{wavelength, "632.8 mm", "is not a wavelength"},
		{angle, "1 rad", "is not an angle"},
		{plain, "0.1 mm", "is not a number"},
		// A decimal comma and fractions are refused, each with a message saying what to write.
		{length, "1,5", `"1,5" is not a length; write decimals with a point, e.g. 1.5`},
		{length, "1,5 mm", "write decimals with a point"},
		{length, "1/2 in", `"1/2 in" is not a length; fractions are not read, write a decimal such as 0.5 in`},
		{length, "", "is not a length"},
	} {
		_, err := tc.q.parse(tc.in)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s %q: error %v, want one containing %q", tc.q.noun, tc.in, err, tc.want)
		}
	}
}

func TestFormatNumberRoundTrips(t *testing.T) {
	for _, v := range []float64{0, 1, -250, 25.4, 162.5, 0.04, 1.0 / 3, 1e-7, 123456789, 2e12, 632.8} {
		s := formatNumber(v)
		if strings.ContainsAny(s, "e") && math.Abs(v) >= 1e-4 && math.Abs(v) < 1e9 {
			t.Errorf("formatNumber(%v) = %q uses an exponent for an everyday size", v, s)
		}
		back, err := plain.parse(s)
		if err != nil && math.Abs(v) <= maxMagnitude {
			t.Errorf("formatNumber(%v) = %q does not parse: %v", v, s, err)
			continue
		}
		if err == nil && back != v {
			t.Errorf("formatNumber(%v) = %q reads back as %v", v, s, back)
		}
	}
}
