package trace

import (
	"math"
	"testing"

	"raytable/optics"
)

// cylinder is a face of the given axis.
func cylinder(z, curvature, nAfter float64, axis string) optics.Surface {
	s := face(z, curvature, nAfter)
	s.CylinderAxis = axis
	return s
}

// TestCylinderFace: a cylinder bends only across its axis. A ray off the axis in the curved
// direction crosses the axis where a sphere of the same radius sends it (the same section of the
// surface: definition of a cylinder), and a ray off in the straight direction goes on undeviated;
// a ray off in both directions is bent only in the curved one.
func TestCylinderFace(t *testing.T) {
	const c, n = 1.0 / 50, 1.5
	sphere := path(face(10, c, n), face(14, 0, 1))
	for _, tc := range []struct {
		axis   string
		curved func(x, y float64) Start // a ray off in the curved direction by h
		cross  func(Point) float64
		bent   func(Point) float64 // the leaving slope in the straight direction
	}{
		{optics.CylinderVertical, func(x, y float64) Start { return parallel(x, y) }, crossY, func(p Point) float64 { return p.Dir.X }},
		{optics.CylinderHorizontal, func(x, y float64) Start { return parallel(y, x) }, crossX, func(p Point) float64 { return p.Dir.Y }},
	} {
		cyl := path(cylinder(10, c, n, tc.axis), face(14, 0, 1))
		for _, h := range []float64{0.1, 2, 6} {
			want := tc.cross(last(mustTrace(t, sphere, tc.curved(0, h))))
			got := tc.cross(last(mustTrace(t, cyl, tc.curved(0, h))))
			if math.Abs(got-want) > 1e-9 {
				t.Errorf("%s axis, height %v: crosses at %.12f, want %.12f as the sphere's meridian section", tc.axis, h, got, want)
			}
			if d := last(mustTrace(t, cyl, tc.curved(h, 0))).Dir; d.X != 0 || d.Y != 0 {
				t.Errorf("%s axis: a ray off along the axis by %v leaves along %v, want undeviated", tc.axis, h, d)
			}
			if s := tc.bent(last(mustTrace(t, cyl, tc.curved(h, h)))); s != 0 {
				t.Errorf("%s axis: a skew ray gains slope %v along the axis, want 0", tc.axis, s)
			}
		}
	}
}

// A cylinder keeps the trace free of allocations per ray.
func TestCylinderTraceAllocatesNothing(t *testing.T) {
	p := path(cylinder(10, 1.0/50, 1.5, optics.CylinderVertical), face(14, 0, 1), plane("S", 100, 20))
	rays := benchRays(21)
	buf := make([]Point, 0, len(p.Surfaces))
	if allocs := testing.AllocsPerRun(100, func() {
		for _, s := range rays {
			Trace(p, 0, s, buf)
		}
	}); allocs != 0 {
		t.Errorf("%g allocations per fan, want 0", allocs)
	}
}
