package beam

import (
	"math"
	"testing"

	"raytable/optics/internal/approx"
)

const (
	hene = 632.8
	nd   = 1064.0
)

// The Rayleigh range of a beam, zR = π w0² / (M² λ) (Siegman, Lasers, 1986, ch. 17, chapter from
// memory; embedded Gaussian with M²). Checked against hand values and against the waist entry Propagate reports.
func TestRayleighRange(t *testing.T) {
	cases := []struct {
		name            string
		w0, lambda, m2  float64
		wantRayleighMM  float64
		wantWaistPathMM float64
	}{
		// π (0.5 mm)² / 632.8e-6 mm = 1241.1 mm (from the formula, by hand)
		{"HeNe 0.5 mm", 0.5, hene, 1, math.Pi * 0.25 / 632.8e-6, 0},
		// M² = 2 halves it
		{"M2 2", 0.5, hene, 2, math.Pi * 0.25 / (2 * 632.8e-6), 0},
		{"1064 nm 1 mm", 1, nd, 1.3, math.Pi / (1.3 * 1064e-6), 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			if got := RayleighRangeMM(c.w0, c.lambda, c.m2); !approx.Rel(got, c.wantRayleighMM, approx.VeryClose) {
				t.Fatalf("RayleighRangeMM = %v, want %v", got, c.wantRayleighMM)
			}
			p := buildPath(c.lambda, plane("S", 500, 0))
			rep, _ := Propagate(beamBench(c.lambda, c.w0, 0, c.m2), p)
			if len(rep.Waists) != 1 {
				t.Fatalf("waists = %d, want the source's own", len(rep.Waists))
			}
			w := rep.Waists[0]
			if w.After != nil || w.PathMM != c.wantWaistPathMM || !approx.Rel(*w.RadiusTMM, c.w0, approx.VeryClose) ||
				!approx.Rel(*w.RayleighTMM, c.wantRayleighMM, approx.VeryClose) || !approx.Rel(*w.RayleighSMM, c.wantRayleighMM, approx.VeryClose) {
				t.Fatalf("waist %+v", w)
			}
		})
	}
}

// Free space: w(z) = w0 sqrt(1 + (z/zR)²) and R(z) = z (1 + (zR/z)²) (Kogelnik and Li 1966,
// section on the fundamental Gaussian beam), z measured from the waist; M² enters through zR.
func TestFreeSpace(t *testing.T) {
	const w0, waistAt, m2 = 0.4, -300.0, 1.2
	zR := math.Pi * w0 * w0 / (m2 * hene * 1e-6)
	p := buildPath(hene, plane("A", 200, 0), plane("B", 700, 0), plane("C", 1500, 0))
	rep, warns := Propagate(beamBench(hene, w0, waistAt, m2), p)
	if len(warns) != 0 {
		t.Fatalf("warnings %v", warns)
	}
	for _, e := range rep.Elements {
		var z float64
		for i := range p.Surfaces {
			if p.Surfaces[i].ID == e.ID {
				z = p.Surfaces[i].PathMM - waistAt
			}
		}
		wantW := w0 * math.Sqrt(1+(z/zR)*(z/zR))
		wantR := z * (1 + (zR/z)*(zR/z))
		if !approx.Rel(e.WTMM, wantW, approx.VeryClose) || !approx.Rel(e.WSMM, wantW, approx.VeryClose) || !approx.Rel(e.ArrivingWTMM, wantW, approx.VeryClose) {
			t.Errorf("%s: w = %v/%v, want %v", e.ID, e.WTMM, e.WSMM, wantW)
		}
		if e.RTMM == nil || !approx.Rel(*e.RTMM, wantR, approx.VeryClose) || !approx.Rel(*e.RSMM, wantR, approx.VeryClose) {
			t.Errorf("%s: R = %v, want %v", e.ID, e.RTMM, wantR)
		}
		if e.Transmitted != 1 {
			t.Errorf("%s: transmitted %v without a clear aperture", e.ID, e.Transmitted)
		}
	}
	// Samples: the same law at every sample, in order, reaching past the last element.
	if len(rep.Samples) < SampleCount {
		t.Fatalf("%d samples", len(rep.Samples))
	}
	for i, s := range rep.Samples {
		z := s.PathMM - waistAt
		if want := w0 * math.Sqrt(1+(z/zR)*(z/zR)); !approx.Rel(s.WTMM, want, approx.VeryClose) {
			t.Fatalf("sample %d at %v: w %v, want %v", i, s.PathMM, s.WTMM, want)
		}
		if i > 0 && s.PathMM <= rep.Samples[i-1].PathMM {
			t.Fatalf("samples not increasing at %d", i)
		}
	}
	if last := rep.Samples[len(rep.Samples)-1].PathMM; last <= 2400 {
		t.Errorf("samples end at %v, before the tail past 2400", last)
	}
	// No waist: the only one is upstream of the source.
	if len(rep.Waists) != 0 {
		t.Errorf("waists %v, want none (the waist is upstream of the source)", rep.Waists)
	}
}

// At a waist the wavefront is flat: R is null (Kogelnik and Li 1966, 1/R = 0 at the waist).
func TestCurvatureNullAtWaist(t *testing.T) {
	p := buildPath(hene, plane("A", 100, 0), plane("B", 100, 0))
	rep, _ := Propagate(beamBench(hene, 0.3, 100, 1), p)
	a := row(rep, "A")
	if a.RTMM != nil || a.RSMM != nil {
		t.Errorf("R at the waist = %v, %v, want null", a.RTMM, a.RSMM)
	}
	// Converging before the waist would be negative; B lies beyond it, diverging.
	if b := row(rep, "B"); b.RTMM == nil || *b.RTMM <= 0 {
		t.Errorf("R beyond the waist = %v, want positive", b.RTMM)
	}
}

func TestNoBeam(t *testing.T) {
	b := beamBench(hene, 1, 0, 1)
	b.Source.Beam = nil
	if rep, w := Propagate(b, buildPath(hene, plane("A", 10, 0))); rep != nil || w != nil {
		t.Fatalf("got %v %v without a beam", rep, w)
	}
	bad := beamBench(hene, -1, 0, 1)
	if rep, w := Propagate(bad, buildPath(hene, plane("A", 10, 0))); rep != nil || len(w) != 1 || w[0].Code != CodeBeamInvalid {
		t.Fatalf("negative waist: %v %v", rep, w)
	}
}
