package trace

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
)

var inf = math.Inf(1)

// Tolerances of the trace tests beyond approx's shared ones (approx.Rounding for a handful of
// float64 operations on values of order 1 to 100, approx.VeryClose for closed-form geometry
// evaluated along a different route), named for what they absorb.
const (
	paraxRel = 1e-6 // exact trace at h = 0.01 mm vs a paraxial formula (aberration ~ h²)
	limitRel = 1e-4 // exact trace at small aperture vs a first-order limit with coma ~ h
	// bendingTol is the window for the exact least-aberration shape factor of a 1 mm thick lens at
	// f/25 around the thin-lens third-order one; thickness and higher orders part them by 0.003 to
	// 0.004 (measured at n = 1.5, 1.65, 1.8).
	bendingTol = 0.05
)

// Surface builders for hand-made paths. Every path has one wavelength unless a test adds more.

func face(z, curvature, nAfter float64) optics.Surface {
	return optics.Surface{ID: "L", Kind: optics.Refracting, PathMM: z, Curvature: curvature,
		SemiAperture: inf, Index: []float64{nAfter}}
}

func mirror(z, radiusMM, turnDeg float64) optics.Surface {
	c := 0.0
	if radiusMM != 0 {
		c = 1 / radiusMM
	}
	t := turnDeg * math.Pi / 180
	return optics.Surface{ID: "M", Kind: optics.Reflecting, PathMM: z, Curvature: c,
		SemiAperture: inf, Index: []float64{1}, TurnRad: t, IncidenceRad: (math.Pi - math.Abs(t)) / 2}
}

func plane(id string, z, semi float64) optics.Surface {
	return optics.Surface{ID: id, Kind: optics.Plane, PathMM: z, SemiAperture: semi, Index: []float64{1}}
}

func thin(z, focal float64) optics.Surface {
	return optics.Surface{ID: "T", Kind: optics.Thin, PathMM: z, FocalMM: focal, SemiAperture: inf,
		Index: []float64{1}}
}

func path(surfs ...optics.Surface) *optics.Path {
	for i := range surfs {
		surfs[i].Face = 0
		if i > 0 && surfs[i].ID == surfs[i-1].ID {
			surfs[i].Face = surfs[i-1].Face + 1
		}
	}
	return &optics.Path{WavelengthsNM: []float64{587.6}, Surfaces: surfs}
}

// parallel is a ray parallel to the axis at (x, y) on the source plane.
func parallel(x, y float64) Start {
	return Start{Pos: r3.Vec{X: x, Y: y, Z: 0}, Dir: r3.Vec{X: 0, Y: 0, Z: 1}}
}

// mustTrace traces and fails the test unless the ray passes with status ok.
func mustTrace(t *testing.T, p *optics.Path, s Start) Result {
	t.Helper()
	r := Trace(p, 0, s, nil)
	if r.Status != optics.RayOK {
		t.Fatalf("ray %+v: status %s at surface %d: %s", s, r.Status, r.Surface, r.Reason)
	}
	return r
}

func last(r Result) Point { return r.Points[len(r.Points)-1] }

// crossY is where the ray leaving pt meets the plane y = 0, as z from pt's vertex.
func crossY(pt Point) float64 { return pt.Pos.Z - pt.Pos.Y*pt.Dir.Z/pt.Dir.Y }

// crossX is where the ray leaving pt meets the plane x = 0, as z from pt's vertex.
func crossX(pt Point) float64 { return pt.Pos.Z - pt.Pos.X*pt.Dir.Z/pt.Dir.X }
