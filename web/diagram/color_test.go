package diagram

import (
	"math"
	"regexp"
	"strconv"
	"testing"
)

func rgb(t *testing.T, c string) (r, g, b int) {
	t.Helper()
	if !regexp.MustCompile(`^#[0-9a-f]{6}$`).MatchString(c) {
		t.Fatalf("colour %q is not #rrggbb", c)
	}
	v, _ := strconv.ParseUint(c[1:], 16, 32)
	return int(v >> 16), int(v >> 8 & 0xff), int(v & 0xff)
}

func TestWavelengthColorHues(t *testing.T) {
	// from memory: the visible spectrum runs violet (~400 nm), blue (~450-470), green (~520-540),
	// yellow (~580-590), orange (~600-620), red (~630-700); the dominant sRGB channel must follow.
	cases := []struct {
		nm       float64
		dominant string // "r", "g", "b" or "rg" (yellow: red and green both strong, blue weak)
	}{
		{405, "b"}, {450, "b"}, {473, "b"}, {532, "g"}, {546, "g"}, {589, "rg"}, {633, "r"}, {650, "r"}, {690, "r"},
	}
	for _, c := range cases {
		r, g, b := rgb(t, WavelengthColor(c.nm))
		var ok bool
		switch c.dominant {
		case "r":
			ok = r > g && r > b
		case "g":
			ok = g > r && g > b
		case "b":
			ok = b > r && b > g
		case "rg":
			ok = r > 2*b && g > 2*b && r > 150 && g > 150
		}
		if !ok {
			t.Errorf("%g nm -> %s (%d,%d,%d): want %s dominant", c.nm, WavelengthColor(c.nm), r, g, b, c.dominant)
		}
	}
}

func TestWavelengthColorInvisible(t *testing.T) {
	// Our own rule: outside 380-780 nm dark tones (channel sum below darkSum, well below the bright
	// middle of the spectrum), distinct for common laser lines (from memory: 266/355 nm UV,
	// 808/1064/1550 nm IR diode and solid-state lines).
	const darkSum = 300
	seen := map[string]float64{}
	for _, nm := range []float64{266, 355, 808, 1064, 1550} {
		c := WavelengthColor(nm)
		r, g, b := rgb(t, c)
		if r+g+b >= darkSum {
			t.Errorf("%g nm -> %s: want a dark tone (sum %d >= %d)", nm, c, r+g+b, darkSum)
		}
		if prev, dup := seen[c]; dup {
			t.Errorf("%g nm and %g nm share colour %s", nm, prev, c)
		}
		seen[c] = nm
	}
	for _, nm := range []float64{0, -5, math.NaN(), math.Inf(1)} {
		if c := WavelengthColor(nm); c != "#808080" {
			t.Errorf("WavelengthColor(%g) = %s, want neutral grey", nm, c)
		}
	}
}

func TestWavelengthColorContinuous(t *testing.T) {
	// Piecewise linear: 1 nm steps never jump by more than a few levels per channel (self-consistency).
	const maxStep = 12
	pr, pg, pb := rgb(t, WavelengthColor(380))
	for nm := 381.0; nm <= 780; nm++ {
		r, g, b := rgb(t, WavelengthColor(nm))
		if abs(r-pr) > maxStep || abs(g-pg) > maxStep || abs(b-pb) > maxStep {
			t.Fatalf("colour jumps at %g nm: (%d,%d,%d) -> (%d,%d,%d)", nm, pr, pg, pb, r, g, b)
		}
		pr, pg, pb = r, g, b
	}
}

func abs(v int) int {
	if v < 0 {
		return -v
	}
	return v
}
