package beam

import (
	"math"
	"testing"
)

// TestCouplingOffsetsClosedForms: a beam of waist w1 into a fibre mode of waist w2, both waists on
// the fibre face, offset along one of the three ways, against the closed forms of D. Marcuse,
// "Loss analysis of single-mode fiber splices", Bell System Technical Journal 56, 703 (1977), eqs.
// for lateral offset, tilt and longitudinal gap (in air): with s = w1² + w2²,
//
//	lateral d:  η = (2 w1 w2/s)² exp(-2 d²/s)
//	tilt θ:     η = (2 w1 w2/s)² exp(-2 (π θ w1 w2/λ)²/s)
//	gap z:      η = 4 / ((w1/w2 + w2/w1)² + (λ z/(π w1 w2))²)
func TestCouplingOffsetsClosedForms(t *testing.T) {
	const wl = 1550.0
	lam := wl * 1e-6
	for _, tc := range []struct {
		name           string
		w1, w2         float64 // mm
		d, theta, zGap float64 // mm, rad, mm
	}{
		{"matched 5.2 µm modes, 2 µm lateral", 0.0052, 0.0052, 0.002, 0, 0},
		{"4.5 into 5.2 µm, 1 µm lateral", 0.0045, 0.0052, 0.001, 0, 0},
		{"matched, 20 mrad tilt", 0.0052, 0.0052, 0, 0.02, 0},
		{"4.5 into 5.2 µm, 30 mrad tilt", 0.0045, 0.0052, 0, 0.03, 0},
		{"matched, 30 µm gap", 0.0052, 0.0052, 0, 0, 0.03},
		{"collimated 0.5 into 0.4 mm, 100 mm apart", 0.5, 0.4, 0, 0, 100},
	} {
		s := tc.w1*tc.w1 + tc.w2*tc.w2
		mis := math.Pow(2*tc.w1*tc.w2/s, 2)
		var want float64
		switch {
		case tc.d != 0:
			want = mis * math.Exp(-2*tc.d*tc.d/s)
		case tc.theta != 0:
			x := math.Pi * tc.theta * tc.w1 * tc.w2 / lam
			want = mis * math.Exp(-2*x*x/s)
		default:
			r := tc.w1/tc.w2 + tc.w2/tc.w1
			x := lam * tc.zGap / (math.Pi * tc.w1 * tc.w2)
			want = 4 / (r*r + x*x)
		}
		// The beam's waist is on the first face; the fibre mode's waist zGap downstream of it.
		one := flat(tc.w1)
		two := ModeProfile(tc.w2, tc.zGap, wl)
		got := Coupling(OverlapPlane(one, two, Offset{LateralMM: tc.d, TiltRad: tc.theta}, wl) * OverlapPlane(one, two, Offset{}, wl))
		if math.Abs(got-want) > 1e-12 {
			t.Errorf("%s: coupling %.15f, want %.15f (Marcuse 1977)", tc.name, got, want)
		}
	}
}

// TestOneDBOffsets: the offsets that each alone lose 1 dB (η/η0 = 0.794) against the closed forms
// that follow from Marcuse 1977 (above): lateral d = sqrt(s/2 · ln(1/0.794)), for equal waists
// w sqrt(ln(1/0.794)); tilt θ = (λ/π) sqrt(s/(2 w1² w2²) · ln(1/0.794)); gap z = (π w1 w2/λ)
// (w1/w2 + w2/w1) sqrt(1/0.794 - 1), for equal waists 2 zR sqrt(1/0.794 - 1).
func TestOneDBOffsets(t *testing.T) {
	const wl = 1064.0
	lam := wl * 1e-6
	ln := math.Log(1 / OneDBLoss)
	for _, tc := range []struct{ w1, w2 float64 }{{0.003, 0.003}, {0.0025, 0.0031}, {0.5, 0.5}, {0.8, 0.35}} {
		s := tc.w1*tc.w1 + tc.w2*tc.w2
		one, two := flat(tc.w1), flat(tc.w2)
		if got, want := LateralOneDBMM(one, two, wl), math.Sqrt(s/2*ln); math.Abs(got/want-1) > 1e-12 {
			t.Errorf("w %v/%v: lateral 1 dB %.9g mm, want %.9g (Marcuse 1977)", tc.w1, tc.w2, got, want)
		}
		if got, want := TiltOneDBRad(one, two, wl), lam/math.Pi*math.Sqrt(s/(2*tc.w1*tc.w1*tc.w2*tc.w2)*ln); math.Abs(got/want-1) > 1e-12 {
			t.Errorf("w %v/%v: tilt 1 dB %.9g rad, want %.9g (Marcuse 1977)", tc.w1, tc.w2, got, want)
		}
		g := newGaussian(wl, 1)
		q1, q2 := g.sourceQ(tc.w1, 0), g.sourceQ(tc.w2, 0)
		got, ok := AxialOneDBMM(q1, q1, q2, q2, g, g, wl)
		// Marcuse's gap formula is for the round beam, both planes at once.
		want := math.Pi * tc.w1 * tc.w2 / lam * (tc.w1/tc.w2 + tc.w2/tc.w1) * math.Sqrt(1/OneDBLoss-1)
		if !ok || math.Abs(got/want-1) > 1e-9 {
			t.Errorf("w %v/%v: axial 1 dB %.9g mm (found %v), want %.9g (Marcuse 1977)", tc.w1, tc.w2, got, ok, want)
		}
	}
	// A round lateral offset d of a round beam moves it in one plane only: the plane's lateral 1 dB
	// value with equal waists is w sqrt(ln(10^0.1)) = 0.47985 w (Marcuse 1977).
	if got := LateralOneDBMM(flat(1), flat(1), wl); math.Abs(got-0.47985) > 1e-5 {
		t.Errorf("lateral 1 dB for w = 1 mm: %.5f mm, want 0.47985 (Marcuse 1977)", got)
	}
}
