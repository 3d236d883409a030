package beam

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"raytable/optics/internal/approx"
)

// clipTol bounds the error of a transmitted fraction: FractionInCircle's trapezoid rule stops when
// two estimates agree to 1e-12 (clip.go), and the references below are closed forms or a 400-node
// Gauss-Legendre integral.
const clipTol = 1e-9

// A centred circular aperture of radius a passes 1 - exp(-2a²/w²) of a round Gaussian beam
// (Siegman, Lasers, 1986, ch. 17, chapter from memory; a = w gives 86.47 %, a = 1.5w about
// 98.9 %).
func TestFractionRound(t *testing.T) {
	cases := []struct{ a, w, want float64 }{
		{1, 1, 0.8646647167633873}, // 1 - e^-2 (from the formula)
		{0.5, 1, 1 - math.Exp(-0.5)},
		{1.5, 1, 1 - math.Exp(-4.5)},
		{3, 2, 1 - math.Exp(-4.5)},
		{math.Inf(1), 1, 1},
		{0, 1, 0},
	}
	for _, c := range cases {
		if got := FractionInCircle(c.a, c.w, c.w); !approx.Abs(got, c.want, clipTol) {
			t.Errorf("a %v w %v: %v, want %v", c.a, c.w, got, c.want)
		}
		// The numerical branch (beam elliptical by 1e-10) agrees with the round formula.
		if got := FractionInCircle(c.a, c.w, c.w*(1+1e-10)); !approx.Abs(got, c.want, clipTol) {
			t.Errorf("near-round a %v w %v: %v, want %v", c.a, c.w, got, c.want)
		}
	}
}

// separable is an independent evaluation for an elliptical beam: the intensity factorises in x and
// y, so the fraction in the circle is ∫ p(x) erf(√2 sqrt(a² - x²)/wy) dx over |x| < a, with p the
// normalised x-marginal sqrt(2/π)/wx exp(-2x²/wx²). Substituting x = a sin θ makes the integrand
// smooth; gonum's Gauss-Legendre rule evaluates it.
func separable(a, wx, wy float64) float64 {
	f := func(th float64) float64 {
		x, h := a*math.Sin(th), a*math.Cos(th)
		return math.Sqrt(2/math.Pi) / wx * math.Exp(-2*x*x/(wx*wx)) * math.Erf(math.Sqrt2*h/wy) * h
	}
	return quad.Fixed(f, -math.Pi/2, math.Pi/2, 400, quad.Legendre{}, 0)
}

func TestFractionElliptical(t *testing.T) {
	cases := []struct{ a, wx, wy float64 }{
		{1, 1, 2},
		{1, 2, 1},
		{2, 1.2, 3.5},
		{0.5, 0.3, 0.1},
		{5, 40, 1}, // a strongly stretched footprint
	}
	for _, c := range cases {
		got := FractionInCircle(c.a, c.wx, c.wy)
		if want := separable(c.a, c.wx, c.wy); !approx.Abs(got, want, clipTol) {
			t.Errorf("a %v wx %v wy %v: %v, separable integral %v", c.a, c.wx, c.wy, got, want)
		}
		// Bounded by the round beams of the smaller and the larger radius.
		lo, hi := FractionInCircle(c.a, math.Max(c.wx, c.wy), math.Max(c.wx, c.wy)), FractionInCircle(c.a, math.Min(c.wx, c.wy), math.Min(c.wx, c.wy))
		if got < lo || got > hi {
			t.Errorf("a %v wx %v wy %v: %v outside [%v, %v]", c.a, c.wx, c.wy, got, lo, hi)
		}
	}
	// A line-like beam (wy -> 0): the one-dimensional fraction erf(√2 a/wx) (Gaussian integral).
	// At wy = 1e-5 mm the beam differs from the line by a correction of order wy²/a = 1e-10.
	const lineBeamTol = 1e-8
	if got, want := FractionInCircle(1, 1.3, 1e-5), math.Erf(math.Sqrt2/1.3); !approx.Abs(got, want, lineBeamTol) {
		t.Errorf("thin beam: %v, want erf %v", got, want)
	}
}

// clearDiameterFor: a round beam needs 2·w·sqrt(ln(100)/2) for 99 % (inverting 1 - exp(-2a²/w²));
// an elliptical one is found by bisection and must pass exactly 99 %.
func TestClearDiameterFor99(t *testing.T) {
	if got, want := clearDiameterFor([]footprint{{aMM: 1, wtMM: 2, wsMM: 2}}, 0.99), 2*2*math.Sqrt(math.Log(100)/2); !approx.Rel(got, want, approx.VeryClose) {
		t.Errorf("round: %v, want %v", got, want)
	}
	// The bisection stops when the diameter is known to 1e-9 of itself (clip.go), which moves the
	// fraction by less than that.
	const bisectTol = 1e-8
	faces := []footprint{{aMM: 1, wtMM: 2, wsMM: 1}, {aMM: 1, wtMM: 1.5, wsMM: 1.5}}
	d := clearDiameterFor(faces, 0.99)
	if got := passedWith(faces, d/2); !approx.Abs(got, 0.99, bisectTol) {
		t.Errorf("two faces: diameter %v passes %v, want 0.99", d, got)
	}
}

// Propagate: an aperture of radius w at the waist passes 86.47 % (Siegman 1986) and warns with
// the element, the percentage and the 99 % diameter; a lens passes what its tightest face does; a tilted mirror
// sees w_t/cos i.
func TestTransmittedAndWarning(t *testing.T) {
	const w0 = 1.0
	p := buildPath(hene, plane("A1", 100, 2*w0), plane("S", 100, 0))
	rep, warns := Propagate(beamBench(hene, w0, 100, 1), p)
	if got := row(rep, "A1").Transmitted; !approx.Abs(got, 1-math.Exp(-2), clipTol) {
		t.Fatalf("transmitted %v, want 1 - e^-2", got)
	}
	if row(rep, "S").Transmitted != 1 {
		t.Errorf("a screen has no clear aperture")
	}
	if len(warns) != 1 || warns[0].Code != CodeClipped || warns[0].Element != "A1" {
		t.Fatalf("warnings %v", warns)
	}
	// 2·w·sqrt(ln(100)/2) = 3.035 mm for w = 1 (common practice: pass 99 %).
	for _, s := range []string{"A1", "86.5 %", "3.03 mm", "2 mm", "not clipped"} {
		if !strings.Contains(warns[0].Message, s) {
			t.Errorf("message %q lacks %q", warns[0].Message, s)
		}
	}

	// A lens: the beam inside the intersection of its two faces' apertures, each with the beam
	// size there: the face that passes least governs (definition of the intersection).
	lp := buildPath(hene, lens("L", 100, 80, -80, 10, 1.5).clear(3), plane("S", 100, 0))
	lrep, _ := Propagate(beamBench(hene, 1, 0, 1), lp)
	g := newGaussian(hene, 1)
	q0 := g.sourceQ(1, 0)
	tr := trace(lp, 0, g, q0)
	f0 := FractionInCircle(1.5, g.radiusMM(tr.arrive[0]), g.radiusMM(tr.arrive[0]))
	f1 := FractionInCircle(1.5, g.radiusMM(tr.arrive[1]), g.radiusMM(tr.arrive[1]))
	if got := row(lrep, "L").Transmitted; !approx.Abs(got, math.Min(f0, f1), clipTol) || got <= f0*f1 {
		t.Errorf("lens transmitted %v, want the smaller face's %v (not the product %v)", got, math.Min(f0, f1), f0*f1)
	}

	// A flat mirror turning the beam 90° (incidence 45°): footprint w/cos 45° by w on the mirror.
	mp := buildPath(hene, mirror("M", 100, 0, 90).clear(2.5), plane("S", 100, 0))
	mrep, _ := Propagate(beamBench(hene, 1, 100, 1), mp)
	wantM := FractionInCircle(1.25, 1/math.Cos(math.Pi/4), 1)
	if got := row(mrep, "M").Transmitted; !approx.Abs(got, wantM, clipTol) || got >= FractionInCircle(1.25, 1, 1) {
		t.Errorf("tilted mirror transmitted %v, want %v (less than at normal incidence)", got, wantM)
	}
}

// TestPassRadiusPerW: the circle of radius PassRadiusPerW·w passes exactly PassFraction of a round
// beam (the Gaussian's encircled power 1 − exp(−2a²/w²)), and is the 1.52 w of common practice.
func TestPassRadiusPerW(t *testing.T) {
	if got := FractionInCircle(PassRadiusPerW*2, 2, 2); !approx.Abs(got, PassFraction, 1e-12) {
		t.Errorf("a circle of %.6f w passes %.12f, want %g", PassRadiusPerW, got, PassFraction)
	}
	if !approx.Abs(PassRadiusPerW, 1.517427, 1e-6) { // √(ln 100 / 2), by hand
		t.Errorf("PassRadiusPerW = %.7f, want 1.517427", PassRadiusPerW)
	}
}

// TestPassedUnion: two coaxial round apertures on one beam pass what the smaller passes
// (definition of the intersection of nested circles), while the product of the two fractions
// would count the ring the smaller clips once more and give less.
func TestPassedUnion(t *testing.T) {
	for _, tc := range []struct {
		name            string
		small, big, wMM float64
	}{
		{"one beam radius and twice it", 1, 2, 1},
		{"equal apertures", 1.5, 1.5, 1},
		{"a wide second aperture", 0.8, 3, 1},
	} {
		faces := []footprint{{aMM: tc.big, wtMM: tc.wMM, wsMM: tc.wMM}, {aMM: tc.small, wtMM: tc.wMM, wsMM: tc.wMM}}
		want := -math.Expm1(-2 * tc.small * tc.small / (tc.wMM * tc.wMM)) // 1 - exp(-2a²/w²) (Siegman 1986)
		got := passed(faces)
		if !approx.Abs(got, want, clipTol) {
			t.Errorf("%s: passed %v, want the smaller aperture's %v", tc.name, got, want)
		}
		if product := FractionInCircle(tc.big, tc.wMM, tc.wMM) * want; !(product < got) {
			t.Errorf("%s: the product %v should be less than the union %v", tc.name, product, got)
		}
	}
}
