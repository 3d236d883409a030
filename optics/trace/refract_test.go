package trace

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// Snell's law at normal incidence (θ1 = 0 gives θ2 = 0): a ray along the normal is not bent.
func TestNormalIncidencePassesUndeviated(t *testing.T) {
	cases := []struct {
		name string
		p    *optics.Path
		ray  Start
	}{
		{"flat plate, axis", path(face(10, 0, 1.5), face(15, 0, 1)), parallel(0, 0)},
		{"flat plate, off axis", path(face(10, 0, 1.5), face(15, 0, 1)), parallel(2, -3)},
		{"biconvex, axis", path(face(10, 1.0/40, 1.7), face(16, -1.0/60, 1)), parallel(0, 0)},
		{"thin lens, axis", path(thin(10, 50)), parallel(0, 0)},
		{"concave mirror, axis", path(mirror(10, 200, 180)), parallel(0, 0)},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := mustTrace(t, c.p, c.ray)
			for _, pt := range r.Points {
				if !approx.Abs(pt.Dir.X, 0, approx.Rounding) || !approx.Abs(pt.Dir.Y, 0, approx.Rounding) || !approx.Abs(pt.Dir.Z, 1, approx.Rounding) {
					t.Errorf("surface %d: dir %+v, want (0,0,1)", pt.Surface, pt.Dir)
				}
				if !approx.Abs(pt.Pos.X, c.ray.Pos.X, approx.Rounding) || !approx.Abs(pt.Pos.Y, c.ray.Pos.Y, approx.Rounding) {
					t.Errorf("surface %d: pos %+v moved off the line of %+v", pt.Surface, pt.Pos, c.ray.Pos)
				}
			}
		})
	}
}

// Snell's law (Snell 1621 / Descartes 1637): n1 sin θ1 = n2 sin θ2, with the refracted ray in the
// plane of incidence. At a flat face normal to z, sin θ is the length of the direction's (x, y)
// part and the plane of incidence keeps the ratio dx : dy.
func TestSnellAtFlatFace(t *testing.T) {
	for _, n2 := range []float64{1.33, 1.5, 1.8, 2.4} {
		for _, deg := range []float64{1, 10, 30, 45, 60, 80} {
			for _, az := range []float64{0, 35, 90} { // azimuth: 0 meridional, else skew
				t.Run(fmt.Sprintf("n=%g/%gdeg/az%g", n2, deg, az), func(t *testing.T) {
					th, phi := deg*math.Pi/180, az*math.Pi/180
					d := r3.Vec{X: math.Sin(th) * math.Sin(phi), Y: math.Sin(th) * math.Cos(phi), Z: math.Cos(th)}
					r := mustTrace(t, path(face(10, 0, n2)), Start{Pos: r3.Vec{X: 0.5, Y: -1, Z: 0}, Dir: d})
					out := r.Points[0].Dir
					sin2 := math.Hypot(out.X, out.Y)
					if got, want := n2*sin2, 1*math.Sin(th); !approx.Abs(got, want, approx.Rounding) {
						t.Errorf("n2 sin θ2 = %.15g, n1 sin θ1 = %.15g", got, want)
					}
					if cross := out.X*d.Y - out.Y*d.X; !approx.Abs(cross, 0, approx.Rounding) {
						t.Errorf("refracted ray left the plane of incidence: %+v vs %+v", out, d)
					}
					if !approx.Abs(norm(out), 1, approx.Rounding) {
						t.Errorf("|dir| = %.15g, want 1", norm(out))
					}
				})
			}
		}
	}
}

// Total internal reflection sets in exactly at the critical angle θc = asin(n2/n1) (Hecht, Optics,
// 4th ed., §4.7, from memory). The test lens is a hemisphere whose flat back face passes through
// the centre of its curved front: a ray aimed at the centre crosses the curved face along its
// normal (unbent) and meets the flat face, on axis, at exactly the launch angle.
func TestTotalInternalReflectionBeyondCriticalAngle(t *testing.T) {
	const gap, radius = 10.0, 20.0
	const margin = 1e-7 // rad either side of θc; the path to the back face bends by ~1e-16
	for _, n := range []float64{1.45, 1.5, 1.7, 2.4} {
		p := path(face(gap, 1/radius, n), face(gap+radius, 0, 1))
		crit := math.Asin(1 / n)
		launch := func(th float64) Start {
			return Start{Pos: r3.Vec{X: 0, Y: -(gap + radius) * math.Tan(th), Z: 0}, Dir: r3.Vec{X: 0, Y: math.Sin(th), Z: math.Cos(th)}}
		}
		t.Run(fmt.Sprintf("n=%g below", n), func(t *testing.T) {
			r := mustTrace(t, p, launch(crit-margin))
			out := last(r).Dir
			// Snell again: sin θ2 = n sin θ1 just below 1, the ray leaves grazing.
			if got, want := out.Y, n*math.Sin(crit-margin); !approx.Abs(got, want, approx.Rounding) {
				t.Errorf("sin θ out = %.15g, want %.15g", got, want)
			}
		})
		t.Run(fmt.Sprintf("n=%g beyond", n), func(t *testing.T) {
			r := Trace(p, 0, launch(crit+margin), nil)
			if r.Status != optics.RayTIR || r.Surface != 1 {
				t.Fatalf("status %s at %d, want tir at surface 1 (%s)", r.Status, r.Surface, r.Reason)
			}
			if !strings.Contains(r.Reason, "total internal reflection at face 1 of L") {
				t.Errorf("reason %q does not say where", r.Reason)
			}
			if len(r.Points) != 2 {
				t.Errorf("%d points, want 2 (the front face and the face where it stopped)", len(r.Points))
			}
		})
	}
}

// The wavelength index picks the medium's index at that wavelength: the same ray bends less in
// the lower index (Snell's law again, per wavelength).
func TestWavelengthIndexSelectsMedium(t *testing.T) {
	f := face(10, 0, 0)
	f.Index = []float64{1.5, 1.6}
	p := &optics.Path{WavelengthsNM: []float64{700, 400}, Surfaces: []optics.Surface{f}}
	th := 30 * math.Pi / 180
	s := Start{Dir: r3.Vec{X: 0, Y: math.Sin(th), Z: math.Cos(th)}}
	for k, n := range f.Index {
		r := Trace(p, k, s, nil)
		if got := n * r.Points[0].Dir.Y; !approx.Abs(got, math.Sin(th), approx.Rounding) {
			t.Errorf("k=%d: n sin θ2 = %.15g, want sin 30° = 0.5", k, got)
		}
	}
}
