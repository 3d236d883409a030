package paraxial

import (
	"math"
	"testing"
)

func TestTiltedPlate(t *testing.T) {
	const tol = 1e-12
	deg := math.Pi / 180
	brewster := math.Atan(1.5)
	for _, tc := range []struct {
		name                  string
		t, n, theta           float64
		shift, tan, sag, path float64
		source                string
	}{
		{"normal incidence", 3, 1.5, 0, 0, 2, 2, 3, "plate at normal incidence: reduced thickness t/n (any optics text, from memory)"},
		{"45° fused-silica-like plate", 5, 1.45, 45 * deg,
			5 * math.Sin(45*deg) * (1 - math.Cos(45*deg)/math.Sqrt(1.45*1.45-0.5)),
			5 * 1.45 * 1.45 * 0.5 / math.Pow(1.45*1.45-0.5, 1.5), 5 / math.Sqrt(1.45*1.45-0.5), 5 * 1.45 / math.Sqrt(1.45*1.45-0.5),
			"plate shift d = t sin θ (1 - cos θ/sqrt(n² - sin² θ)), from memory"},
		{"Brewster plate", 2, 1.5, brewster,
			2 * math.Sin(brewster) * (1 - math.Cos(brewster)/math.Sqrt(2.25-math.Pow(math.Sin(brewster), 2))),
			2 * math.Sqrt(3.25) / math.Pow(1.5, 4), 2 * math.Sqrt(3.25) / 2.25, 2 * 1.5 / math.Sqrt(2.25-math.Pow(math.Sin(brewster), 2)),
			"Kogelnik, Ippen, Dienes and Shank, IEEE JQE 8, 373 (1972), from memory"},
	} {
		if got := PlateShiftMM(tc.t, tc.n, tc.theta); math.Abs(got-tc.shift) > tol {
			t.Errorf("%s: shift %v, want %v (%s)", tc.name, got, tc.shift, tc.source)
		}
		if got := PlateReducedMM(tc.t, tc.n, tc.theta, Tangential); math.Abs(got-tc.tan) > tol {
			t.Errorf("%s: tangential %v, want %v (%s)", tc.name, got, tc.tan, tc.source)
		}
		if got := PlateReducedMM(tc.t, tc.n, tc.theta, Sagittal); math.Abs(got-tc.sag) > tol {
			t.Errorf("%s: sagittal %v, want %v (%s)", tc.name, got, tc.sag, tc.source)
		}
		if got := PlateGlassPathMM(tc.t, tc.n, tc.theta); math.Abs(got-tc.path) > tol {
			t.Errorf("%s: glass path %v, want %v", tc.name, got, tc.path)
		}
	}
	// A 1 mm plate at 45°, n = 1.5: d ≈ 0.33 mm (from memory: a 1 mm splitter plate at 45° shifts the beam by about a third of its thickness).
	if got := PlateShiftMM(1, 1.5, 45*deg); math.Abs(got-0.33) > 0.005 {
		t.Errorf("1 mm plate at 45°, n 1.5: shift %.5f mm, want about 0.33 mm", got)
	}
}
