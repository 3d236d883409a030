package trace

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
)

// benchPath is a small bench of every surface kind: a cemented pair, an iris, a tilted concave
// mirror, a thin lens and a screen.
func benchPath() *optics.Path {
	ap := plane("A1", 70, 6)
	return path(
		face(40, 1.0/60, 1.52), face(46, -1.0/45, 1.72), face(48, -1.0/200, 1),
		ap, mirror(150, 500, 120), thin(220, -80), plane("S", 300, 20),
	)
}

func benchRays(n int) []Start {
	rays := make([]Start, n)
	for i := range rays {
		f := float64(i)/float64(n-1)*2 - 1
		rays[i] = Start{Pos: r3.Vec{X: 0.3 * f, Y: 4 * f, Z: 0}, Dir: unit(r3.Vec{X: 0, Y: 0.01 * f, Z: 1})}
	}
	return rays
}

// The exact trace allocates nothing per ray once the caller's buffer holds every surface.
func TestTraceAllocatesNothing(t *testing.T) {
	p, rays := benchPath(), benchRays(21)
	buf := make([]Point, 0, len(p.Surfaces))
	for _, s := range rays {
		if r := Trace(p, 0, s, buf); r.Status != optics.RayOK {
			t.Fatalf("benchmark ray %+v: %s (%s)", s, r.Status, r.Reason)
		}
	}
	allocs := testing.AllocsPerRun(100, func() {
		for _, s := range rays {
			Trace(p, 0, s, buf)
		}
	})
	if allocs != 0 {
		t.Errorf("%g allocations per fan, want 0", allocs)
	}
}

func BenchmarkTrace(b *testing.B) {
	p, rays := benchPath(), benchRays(21)
	buf := make([]Point, 0, len(p.Surfaces))
	b.ReportAllocs()
	faces := 0
	for b.Loop() {
		for _, s := range rays {
			r := Trace(p, 0, s, buf)
			faces += len(r.Points)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(faces), "ns/ray-face")
}
