package paraxial

import (
	"math"
	"math/rand/v2"
	"testing"

	"raytable/optics/internal/approx"
)

func TestSystemDeterminantIsOne(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := 0; trial < 50; trial++ {
		p := randomPath(rng, 1+rng.IntN(30))
		for _, plane := range []Plane{Tangential, Sagittal} {
			// In the reduced-angle convention every refraction and transfer matrix has determinant 1,
			// hence so does their product (Gerrard and Burch, Introduction to Matrix Methods in
			// Optics, 1975, ch. II, from memory).
			// AD - BC cancels terms of size |AD| + |BC|, so rounding is relative to that size.
			m := System(p, 0, plane)
			size := math.Abs(m.A*m.D) + math.Abs(m.B*m.C)
			if d := m.Det(); !approx.Abs(d, 1, approx.Rounding*size) {
				t.Errorf("det = %.15g, want 1 within %g·%g", d, approx.Rounding, size)
			}
		}
	}
}

func TestTraceAgreesWithSystemMatrix(t *testing.T) {
	// Self-consistency: tracing surface by surface and applying the system matrix must agree.
	// tolChain allows for the trace and the matrix product rounding differently over up to 11
	// elements; rounding leaves below 1e-14 on these paths.
	const tolChain = 1e-10
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := 0; trial < 20; trial++ {
		p := randomPath(rng, 2+rng.IntN(10))
		first, last, ok := p.OpticalRange()
		if !ok {
			continue
		}
		start := Ray{Y: rng.Float64()*4 - 2, NU: rng.Float64()*0.2 - 0.1}
		rays := Trace(p, 0, Tangential, start)
		before := At(start, p.Surfaces[first].PathMM, 1)
		want := System(p, 0, Tangential).Apply(before)
		got := rays[last]
		if !approx.Mixed(got.Y, want.Y, tolChain) || !approx.Mixed(got.NU, want.NU, tolChain) {
			t.Errorf("trial %d: trace %+v, system matrix %+v", trial, got, want)
		}
	}
}

func TestTraceThroughThinLens(t *testing.T) {
	// A ray parallel to the axis at height h leaves a thin lens of focal length f with slope -h/f
	// and crosses the axis f behind it (Gaussian optics, Hecht, Optics, sec. 5.2, from memory).
	const f, h = 80.0, 3.0
	p := newPath().thin("L", 50, f, 0).plane("S", f, 0).path()
	rays := Trace(p, 0, Tangential, Ray{Y: h})
	approx.Check(t, "nu after lens", rays[0].NU, -h/f, approx.Rounding)
	if y := rays[1].Y; !approx.Abs(y, 0, approx.Rounding) {
		t.Errorf("height at the focal plane = %g, want 0", y)
	}
}

func TestTraceIntoReusesAndDoesNotAllocate(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 3))
	p := randomPath(rng, 20)
	dst := make([]Ray, len(p.Surfaces))
	allocs := testing.AllocsPerRun(100, func() {
		dst = TraceInto(dst, p, 0, Tangential, Ray{Y: 1, NU: 0.01})
	})
	if allocs != 0 {
		t.Errorf("TraceInto allocates %v times per call, want 0", allocs)
	}
	want := Trace(p, 0, Tangential, Ray{Y: 1, NU: 0.01})
	for i := range want {
		if dst[i] != want[i] {
			t.Fatalf("surface %d: TraceInto %+v, Trace %+v", i, dst[i], want[i])
		}
	}
	if short := TraceInto(nil, p, 0, Tangential, Ray{Y: 1}); len(short) != len(p.Surfaces) {
		t.Errorf("TraceInto(nil) returned %d rays, want %d", len(short), len(p.Surfaces))
	}
}
