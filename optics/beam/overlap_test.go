package beam

import (
	"math"
	"testing"
)

// flat is a beam at its waist.
func flat(wMM float64) Profile { return Profile{RadiusMM: wMM, CurvatureMM: math.Inf(1)} }

// atDistance is the profile of a beam of waist w0 a distance z past its waist (Kogelnik and Li,
// Applied Optics 5, 1550, 1966: w² = w0²(1 + (z/zR)²), R = z(1 + (zR/z)²)).
func atDistance(w0MM, zMM, wavelengthNM float64) Profile {
	zR := RayleighRangeMM(w0MM, wavelengthNM, 1)
	if zMM == 0 {
		return flat(w0MM)
	}
	return Profile{RadiusMM: w0MM * math.Sqrt(1+(zMM/zR)*(zMM/zR)), CurvatureMM: zMM * (1 + (zR/zMM)*(zR/zMM))}
}

func TestOverlap(t *testing.T) {
	const wl = 1064.0
	const tolerance = 1e-12
	for _, tc := range []struct {
		name       string
		oneT, twoT Profile
		oneS, twoS Profile
		offT       Offset
		want       float64 // coupling |γ|²
		source     string
	}{
		{"equal beams", flat(0.5), flat(0.5), flat(0.5), flat(0.5), Offset{}, 1, "definition"},
		{"equal diverging beams", atDistance(0.3, 200, wl), atDistance(0.3, 200, wl), atDistance(0.3, 200, wl), atDistance(0.3, 200, wl), Offset{}, 1, "definition"},
		{"waist mismatch 0.5 / 0.8 mm", flat(0.5), flat(0.8), flat(0.5), flat(0.8), Offset{},
			math.Pow(2*0.5*0.8/(0.25+0.64), 2), "Kogelnik, from memory: visibility 2 w1 w2 / (w1² + w2²)"},
		{"lateral offset 0.2 mm, w 0.5 mm", flat(0.5), flat(0.5), flat(0.5), flat(0.5), Offset{LateralMM: 0.2},
			math.Exp(-0.2 * 0.2 / (0.5 * 0.5)), "D. Marcuse, Bell Syst. Tech. J. 56, 703 (1977): exp(-d²/w²)"},
		{"tilt 0.5 mrad, w 0.5 mm", flat(0.5), flat(0.5), flat(0.5), flat(0.5), Offset{TiltRad: 5e-4},
			math.Exp(-math.Pow(math.Pi*0.5*5e-4/(wl*1e-6), 2)), "D. Marcuse, Bell Syst. Tech. J. 56, 703 (1977): exp(-(π w θ/λ)²)"},
		{"elliptical beam 0.4 x 0.9 mm into a round 0.6 mm mode", flat(0.4), flat(0.6), flat(0.9), flat(0.6), Offset{},
			(2 * 0.4 * 0.6 / (0.16 + 0.36)) * (2 * 0.9 * 0.6 / (0.81 + 0.36)), "Kogelnik, from memory: the planes separate"},
	} {
		got := Coupling(Overlap(tc.oneT, tc.oneS, tc.twoT, tc.twoS, tc.offT, Offset{}, wl))
		if math.Abs(got-tc.want) > tolerance {
			t.Errorf("%s: coupling %.15f, want %.15f (%s)", tc.name, got, tc.want, tc.source)
		}
	}
}

// TestModeMatchingSeparatedWaists compares the overlap, taken at the first beam's waist, of two
// beams whose waists are z apart with the mode-matching formula
// η = 4 / ((w1/w2 + w2/w1)² + (λ z / (π w1 w2))²) (Kogelnik, from memory).
func TestModeMatchingSeparatedWaists(t *testing.T) {
	const wl = 632.8
	for _, tc := range []struct{ w1, w2, z float64 }{
		{0.5, 0.5, 300}, {0.2, 0.35, 150}, {1.0, 0.6, -800}, {0.05, 0.05, 10},
	} {
		lam := wl * 1e-6
		x := lam * tc.z / (math.Pi * tc.w1 * tc.w2)
		r := tc.w1/tc.w2 + tc.w2/tc.w1
		want := 4 / (r*r + x*x)
		// Beam two's waist lies z downstream of beam one's, so at beam one's waist beam two is
		// z before its own waist.
		two := atDistance(tc.w2, -tc.z, wl)
		got := Coupling(Overlap(flat(tc.w1), flat(tc.w1), two, two, Offset{}, Offset{}, wl))
		if math.Abs(got-want) > 1e-12 {
			t.Errorf("w1 %v, w2 %v, z %v: coupling %.15f, want %.15f (Kogelnik, from memory)", tc.w1, tc.w2, tc.z, got, want)
		}
	}
}

// TestOverlapSymmetric: the overlap does not depend on which beam is called the first
// (self-consistency: |∫E1E2*| = |∫E2E1*|), and never exceeds 1.
func TestOverlapSymmetric(t *testing.T) {
	a, b := atDistance(0.3, 120, 800), atDistance(0.45, -60, 800)
	ab := Visibility(OverlapPlane(a, b, Offset{LateralMM: 0.1}, 800))
	ba := Visibility(OverlapPlane(b, a, Offset{LateralMM: -0.1}, 800))
	if math.Abs(ab-ba) > 1e-14 || ab > 1 || !(ab > 0) {
		t.Errorf("overlap %v one way and %v the other; want equal and in (0, 1]", ab, ba)
	}
}
