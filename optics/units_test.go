package optics

import (
	"math"
	"strings"
	"testing"
)

// unitTolerance covers the last-bit rounding of a multiplication by a unit factor.
const unitTolerance = 1e-12

func TestQuantityParse(t *testing.T) {
	for _, tc := range []struct {
		q    *Quantity
		in   string
		want float64
	}{
		// Lengths: the inch is 25.4 mm exactly (international yard and pound agreement, 1959).
		{Length, "25.4", 25.4},
		{Length, " 25.4 mm ", 25.4},
		{Length, "1 in", 25.4},
		{Length, `1"`, 25.4},
		{Length, "2 inches", 50.8},
		{Length, "2.5 cm", 25},
		{Length, "2.5cm", 25},
		{Length, "0.1 m", 100},
		{Length, "500 um", 0.5},
		{Length, "500 µm", 0.5},
		{Length, "500 μm", 0.5},
		{Length, "-250", -250},
		{Length, "1e3", 1000},
		{Length, "1.5E-2 mm", 0.015},
		{Length, "3 MM", 3},
		{Length, " 3 mm ", 3},
		{Length, "-0", 0},
		{Length, "-0 in", 0},
		// Wavelengths in nm, or micrometres.
		{Wavelength, "632.8", 632.8},
		{Wavelength, "632.8 nm", 632.8},
		{Wavelength, "1.064 um", 1064},
		{Wavelength, "1.55 µm", 1550},
		// Angles in degrees.
		{Angle, "0.5", 0.5},
		{Angle, "90 deg", 90},
		{Angle, "-90°", -90},
		{Plain, "0.1", 0.1},
	} {
		got, err := tc.q.Parse(tc.in)
		if err != nil {
			t.Errorf("%s %q: %v", tc.q.Noun, tc.in, err)
			continue
		}
		if math.Signbit(got) != math.Signbit(tc.want) {
			t.Errorf("%s %q = %v, want the sign of %v (no negative zero is stored)", tc.q.Noun, tc.in, got, tc.want)
		}
		if math.Abs(got-tc.want) > unitTolerance*math.Max(1, math.Abs(tc.want)) {
			t.Errorf("%s %q = %v, want %v", tc.q.Noun, tc.in, got, tc.want)
		}
	}
}

func TestQuantityParseRejects(t *testing.T) {
	for _, tc := range []struct {
		q    *Quantity
		in   string
		want string
	}{
		{Length, "abc", `"abc" is not a length; use a number in mm or a unit such as 1 in, 2.5 cm`},
		{Length, "NaN", "is not a length"},
		{Length, "Inf", "is not a length"},
		{Length, "-Inf mm", "is not a length"},
		{Length, "1e999", "too large"},
		{Length, "1e13", "too large"},
		{Length, "5 furlongs", "is not a length"},
		{Length, "mm", "is not a length"},
		{Length, "--1", "is not a length"},
		{Length, "1.2.3", "is not a length"},
		{Length, "0x10", "is not a length"},
		{Wavelength, "632.8 mm", "is not a wavelength"},
		{Angle, "1 rad", "is not an angle"},
		{Plain, "0.1 mm", "is not a number"},
		// A decimal comma and fractions are refused, each with a message saying what to write.
		{Length, "1,5", `"1,5" is not a length; write decimals with a point, e.g. 1.5`},
		{Length, "1,5 mm", "write decimals with a point"},
		{Length, "1/2 in", `"1/2 in" is not a length; fractions are not read, write a decimal such as 0.5 in`},
		{Length, "", "is not a length"},
	} {
		_, err := tc.q.Parse(tc.in)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s %q: error %v, want one containing %q", tc.q.Noun, tc.in, err, tc.want)
		}
	}
}

func TestFormatNumberRoundTrips(t *testing.T) {
	for _, v := range []float64{0, 1, -250, 25.4, 162.5, 0.04, 1.0 / 3, 1e-7, 123456789, 2e12, 632.8} {
		s := FormatNumber(v)
		if strings.ContainsAny(s, "e") && math.Abs(v) >= 1e-4 && math.Abs(v) < 1e9 {
			t.Errorf("FormatNumber(%v) = %q uses an exponent for an everyday size", v, s)
		}
		back, err := Plain.Parse(s)
		if err != nil && math.Abs(v) <= MaxTypedMagnitude {
			t.Errorf("FormatNumber(%v) = %q does not parse: %v", v, s, err)
			continue
		}
		if err == nil && back != v {
			t.Errorf("FormatNumber(%v) = %q reads back as %v", v, s, back)
		}
	}
}
