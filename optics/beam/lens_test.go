package beam

import (
	"math"
	"testing"

	"raytable/optics/paraxial"

	"raytable/optics/internal/approx"
)

// selfWaist is the waist behind a thin lens of focal length f for an input waist of Rayleigh range
// zR at distance s in front of it (Self, "Focusing of spherical Gaussian beams", Applied Optics 22,
// 658 (1983)): 1/(s + zR²/(s - f)) + 1/s” = 1/f, and the waist magnification
// m = 1/sqrt((1 - s/f)² + (zR/f)²).
func selfWaist(s, zR, f float64) (sOut, m float64) {
	if s == f {
		sOut = f
	} else {
		sOut = 1 / (1/f - 1/(s+zR*zR/(s-f)))
	}
	m = 1 / math.Sqrt((1-s/f)*(1-s/f)+(zR/f)*(zR/f))
	return sOut, m
}

// The waist behind a focusing thin lens: the exact q law against Self's closed form.
func TestThinLensWaistSelf(t *testing.T) {
	cases := []struct {
		name             string
		w0, sMM, fMM, m2 float64
		lambda           float64
	}{
		{"waist at the lens", 0.5, 0, 100, 1, hene},
		{"waist at the front focus", 0.5, 100, 100, 1, hene},
		{"waist at 2f", 0.2, 200, 100, 1, hene},
		{"waist far upstream, M2 1.5", 0.3, 700, 150, 1.5, nd},
		{"waist just inside f, zR >> f", 1, 30, 80, 1, nd},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			const lensAt = 1000.0
			zR := RayleighRangeMM(c.w0, c.lambda, c.m2)
			p := buildPath(c.lambda, thinLens("F", lensAt, c.fMM), plane("S", 5000, 0))
			rep, _ := Propagate(beamBench(c.lambda, c.w0, lensAt-c.sMM, c.m2), p)
			ws := waistAfter(rep, "F")
			if len(ws) != 1 {
				t.Fatalf("waists after F: %v", ws)
			}
			sOut, m := selfWaist(c.sMM, zR, c.fMM)
			w := ws[0]
			if !approx.Abs(w.PathMM-lensAt, sOut, approx.VeryClose*lensAt) { // relative to the path it is found along
				t.Errorf("waist at %v mm after the lens, Self 1983 gives %v", w.PathMM-lensAt, sOut)
			}
			if !approx.Rel(*w.RadiusTMM, m*c.w0, approx.VeryClose) || !approx.Rel(*w.RadiusSMM, m*c.w0, approx.VeryClose) {
				t.Errorf("waist radius %v, Self 1983 gives %v", *w.RadiusTMM, m*c.w0)
			}
			// The Rayleigh range scales with the square of the magnification (same M²).
			if !approx.Rel(*w.RayleighTMM, m*m*zR, approx.VeryClose) {
				t.Errorf("Rayleigh range %v, want m² zR = %v", *w.RayleighTMM, m*m*zR)
			}
		})
	}
}

// A small waist just inside the focal length gives a virtual output waist (Self 1983: s” < 0),
// which is not listed.
func TestThinLensVirtualWaist(t *testing.T) {
	const w0, s, f = 0.1, 30.0, 80.0
	zR := RayleighRangeMM(w0, nd, 1)
	if sOut, _ := selfWaist(s, zR, f); sOut >= 0 {
		t.Fatalf("test case: Self gives s'' = %v, want a virtual waist", sOut)
	}
	p := buildPath(nd, thinLens("F", 1000, f), plane("S", 5000, 0))
	rep, _ := Propagate(beamBench(nd, w0, 1000-s, 1), p)
	if ws := waistAfter(rep, "F"); len(ws) != 0 {
		t.Fatalf("virtual waist listed: %v", ws)
	}
	// The beam leaving the lens still diverges: R > 0.
	if r := row(rep, "F").RTMM; r == nil || *r <= 0 {
		t.Errorf("R leaving = %v, want positive", r)
	}
}

// With zR >> f the focused waist approaches the far-field estimate w' = M²λf/(π w) (Siegman 1986;
// Self 1983 in the limit s = 0, zR >> f); the relative difference is of order (f/zR)².
func TestThinLensFarField(t *testing.T) {
	const farFieldRel = 1e-4
	cases := []struct{ w0, f, m2, lambda float64 }{
		{2, 50, 1, nd},
		{3, 100, 1.4, hene},
	}
	for _, c := range cases {
		p := buildPath(c.lambda, thinLens("F", 100, c.f), plane("S", 400, 0))
		rep, _ := Propagate(beamBench(c.lambda, c.w0, 100, c.m2), p)
		ws := waistAfter(rep, "F")
		if len(ws) != 1 {
			t.Fatalf("waists %v", ws)
		}
		want := c.m2 * c.lambda * 1e-6 * c.f / (math.Pi * c.w0)
		if !approx.Rel(*ws[0].RadiusTMM, want, farFieldRel) {
			t.Errorf("focus radius %v, far-field estimate %v", *ws[0].RadiusTMM, want)
		}
		if !approx.Rel(ws[0].PathMM-100, c.f, farFieldRel) {
			t.Errorf("focus at %v after the lens, want about f = %v", ws[0].PathMM-100, c.f)
		}
		// Just behind a thin lens hit at its waist the wavefront is R = -f (thin-lens law
		// 1/R2 = 1/R1 - 1/f, Kogelnik and Li 1966).
		if r := row(rep, "F").RTMM; r == nil || !approx.Rel(*r, -c.f, approx.VeryClose) {
			t.Errorf("R leaving the lens %v, want %v", r, -c.f)
		}
	}
}

// A Keplerian expander f1 = 50, f2 = 300 (afocal, C = 0): Im q' = (A/D) Im q = (f2/f1)² Im q, so
// the waist grows by f2/f1 = 6 whatever the input (Kogelnik and Li 1966 ABCD law; telescope
// magnification f2/f1). With the input waist at the front focus of L1, the output waist lies at the
// back focus of L2 (Self 1983 with s = f twice).
func TestKeplerianExpander(t *testing.T) {
	const f1, f2, w0 = 50.0, 300.0, 0.25
	for _, waistAt := range []float64{50, 80, 95} {
		p := buildPath(nd, thinLens("L1", 100, f1), thinLens("L2", f1+f2, f2), plane("S", 2000, 0))
		rep, _ := Propagate(beamBench(nd, w0, waistAt, 1), p)
		ws := waistAfter(rep, "L2")
		if len(ws) != 1 {
			t.Fatalf("waist_at %v: waists after L2 %v", waistAt, ws)
		}
		if !approx.Rel(*ws[0].RadiusTMM, f2/f1*w0, approx.VeryClose) {
			t.Errorf("waist_at %v: output waist %v, want %v", waistAt, *ws[0].RadiusTMM, f2/f1*w0)
		}
		if waistAt == 50 && !approx.Abs(ws[0].PathMM, 100+f1+f2+f2, approx.VeryClose*1000) { // of a path of order 1000 mm
			t.Errorf("output waist at %v, want at the back focus of L2, %v", ws[0].PathMM, 100+f1+f2+f2)
		}
	}
}

// Through a thick lens, the q law applied once with the paraxial system matrix (product of the gap
// and surface matrices) equals the surface-by-surface propagation (self-consistency of the reduced
// form q̂ = q/n). And a wide beam focuses at the back focal length from Gullstrand's equation,
// P = P1 + P2 - (t/n) P1 P2, BFL = (1 - (t/n) P1)/P (Gullstrand; e.g. Hecht, Optics, thick lenses).
func TestThickLens(t *testing.T) {
	const r1, r2, th, n = 60.0, -40.0, 8.0, 1.6
	p := buildPath(hene, lens("L", 100, r1, r2, th, n), plane("S", 1000, 0))
	for _, src := range []struct{ w0, at float64 }{{1, -200}, {0.3, 50}, {5, 100}} {
		b := beamBench(hene, src.w0, src.at, 1)
		rep, _ := Propagate(b, p)
		g := newGaussian(hene, 1)
		sys := paraxial.Identity
		for i := 0; i < 2; i++ {
			sys = paraxial.Mul(paraxial.GapMatrix(p, i, 0, paraxial.Tangential), sys)
			sys = paraxial.Mul(paraxial.SurfaceMatrix(p, i, 0, paraxial.Tangential), sys)
		}
		q := applyABCD(sys, g.sourceQ(src.w0, src.at))
		l := row(rep, "L")
		if !approx.Rel(l.WTMM, g.radiusMM(q), approx.VeryClose) || l.RTMM == nil || !approx.Rel(*l.RTMM, *curvatureMM(q, 1), approx.VeryClose) {
			t.Errorf("w0 %v: surface by surface w %v R %v, system matrix w %v R %v", src.w0, l.WTMM, *l.RTMM, g.radiusMM(q), *curvatureMM(q, 1))
		}
	}
	// Gullstrand: a 5 mm waist at the lens is nearly a plane wave (zR = 124 m >> f). Its focus lies
	// f³/zR² ≈ 5e-6 mm short of the BFL (Self 1983 with s = 0), well inside planeWaveTol.
	const planeWaveTol = 1e-3 // mm
	p1, p2 := (n-1)/r1, (1-n)/r2
	pw := p1 + p2 - th/n*p1*p2
	bfl := (1 - th/n*p1) / pw
	rep, _ := Propagate(beamBench(hene, 5, 100, 1), p)
	ws := waistAfter(rep, "L")
	if len(ws) != 1 || !approx.Abs(ws[0].PathMM-(100+th), bfl, planeWaveTol) {
		t.Fatalf("waists %v, want one at BFL %v after the last vertex", ws, bfl)
	}
	// Inside the glass the envelope is sampled too, continuous at both faces.
	inGlass := 0
	for _, s := range rep.Samples {
		if s.PathMM > 100 && s.PathMM < 100+th {
			inGlass++
		}
	}
	if inGlass == 0 {
		t.Error("no envelope samples inside the lens")
	}
}
