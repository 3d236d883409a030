package trace

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// An iris clips every ray whose radial distance sqrt(x²+y²) exceeds its clear radius (the
// definition of a clear aperture, common practice); the ray stops there with status clipped.
func TestApertureClips(t *testing.T) {
	p := path(plane("A1", 20, 1.5), face(30, 1.0/50, 1.5), face(34, 0, 1), plane("S", 120, inf))
	cases := []struct {
		ray  Start
		want string
	}{
		{parallel(0, 1.49), optics.RayOK},
		{parallel(0, -1.49), optics.RayOK},
		{parallel(1.0, 1.0), optics.RayOK}, // r = 1.414
		{parallel(0, 1.51), optics.RayClipped},
		{parallel(1.1, 1.1), optics.RayClipped}, // r = 1.556
		{Start{Pos: r3.Vec{X: 0, Y: 0, Z: 0}, Dir: unit(r3.Vec{X: 0, Y: 0.08, Z: 1})}, optics.RayClipped}, // 1.6 mm at the iris
	}
	for _, c := range cases {
		r := Trace(p, 0, c.ray, nil)
		if r.Status != c.want {
			t.Errorf("ray %+v: %s (%s), want %s", c.ray, r.Status, r.Reason, c.want)
			continue
		}
		if c.want == optics.RayOK {
			if r.Surface != -1 || len(r.Points) != 4 {
				t.Errorf("ray %+v: surface %d and %d points, want -1 and 4", c.ray, r.Surface, len(r.Points))
			}
			continue
		}
		if r.Surface != 0 || len(r.Points) != 1 || !strings.Contains(r.Reason, "3.00 mm clear diameter of A1") {
			t.Errorf("ray %+v: stopped at %d with %d points, reason %q", c.ray, r.Surface, len(r.Points), r.Reason)
		}
	}
}

// A lens face clips at its own clear radius too, measured at the real hit point.
func TestLensFaceClips(t *testing.T) {
	f0 := face(10, 1.0/30, 1.5)
	f0.SemiAperture = 5
	p := path(f0, face(14, 0, 1))
	if r := Trace(p, 0, parallel(0, 4.99), nil); r.Status != optics.RayOK {
		t.Errorf("ray at 4.99: %s (%s)", r.Status, r.Reason)
	}
	r := Trace(p, 0, parallel(3.6, 3.6), nil) // r = 5.09
	if r.Status != optics.RayClipped || r.Surface != 0 || !strings.Contains(r.Reason, "face 0 of L") {
		t.Errorf("ray at r = 5.09: %s at %d (%s), want clipped at face 0", r.Status, r.Surface, r.Reason)
	}
}

// A line parallel to the axis at height h meets a sphere of radius R only when h <= R (sphere
// geometry); beyond, the ray misses the face, and the trace says which face.
func TestRayMissesSteepSphere(t *testing.T) {
	const radius = 5.0
	p := path(face(10, 1/radius, 1.5), face(20, 0, 1))
	r := Trace(p, 0, parallel(0, 6), nil)
	if r.Status != optics.RayMissed || r.Surface != 0 || len(r.Points) != 0 {
		t.Fatalf("ray at 6 mm: %s at %d with %d points, want missed at 0 with none", r.Status, r.Surface, len(r.Points))
	}
	if !strings.Contains(r.Reason, "face 0 of L") || !strings.Contains(r.Reason, "radius 5.00 mm") {
		t.Errorf("reason %q does not name the face and its radius", r.Reason)
	}
	// Just inside the rim the ray meets the sphere near its equator, where the sag is R - sqrt(R² - h²).
	const h = 4.9
	pt := Trace(p, 0, parallel(0, h), nil).Points[0]
	if want := radius - math.Sqrt(radius*radius-h*h); !approx.Abs(pt.Pos.Z, want, approx.Rounding) {
		t.Errorf("hit at z = %.15g, sag %.15g", pt.Pos.Z, want)
	}
}

// A ray aimed so that its line meets the sphere only past the equator (on the far hemisphere)
// does not hit the face a lens has there.
func TestRayBeyondRimMisses(t *testing.T) {
	const radius = 5.0
	p := path(face(10, 1/radius, 1.5), face(20, 0, 1))
	// The line y = 36 - 2z meets the sphere (centre z = 15) where 5z² - 174z + 1496 = 0, at
	// z = 15.51 and 19.29 (solved by hand), both behind the centre plane, where the face does not
	// exist.
	r := Trace(p, 0, Start{Pos: r3.Vec{X: 0, Y: 36, Z: 0}, Dir: unit(r3.Vec{X: 0, Y: -2, Z: 1})}, nil)
	if r.Status != optics.RayMissed || r.Surface != 0 {
		t.Fatalf("%s at %d (%s), want missed at 0", r.Status, r.Surface, r.Reason)
	}
	if !strings.Contains(r.Reason, "beyond its rim") {
		t.Errorf("reason %q does not say the ray passes the rim", r.Reason)
	}
}

func TestDumpEndsRayWithOK(t *testing.T) {
	d := plane("D1", 50, inf)
	d.Stops = true
	p := path(thin(20, 100), d, plane("S", 80, inf))
	r := Trace(p, 0, parallel(0, 2), nil)
	if r.Status != optics.RayOK || r.Surface != 1 || len(r.Points) != 2 || !strings.Contains(r.Reason, "D1") {
		t.Errorf("%s at %d with %d points (%s), want ok at the dump, 2 points", r.Status, r.Surface, len(r.Points), r.Reason)
	}
}

func TestBadStartIsMissedWithoutPanic(t *testing.T) {
	p := path(face(10, 0.02, 1.5))
	for _, s := range []Start{
		{Pos: r3.Vec{}, Dir: r3.Vec{}},
		{Pos: r3.Vec{}, Dir: r3.Vec{X: 0, Y: 0, Z: -1}},
		{Pos: r3.Vec{X: math.NaN(), Y: 0, Z: 0}, Dir: r3.Vec{X: 0, Y: 0, Z: 1}},
		{Pos: r3.Vec{}, Dir: r3.Vec{X: 0, Y: math.Inf(1), Z: 1}},
	} {
		if r := Trace(p, 0, s, nil); r.Status != optics.RayMissed || r.Reason == "" {
			t.Errorf("start %+v: %s (%q), want missed with a reason", s, r.Status, r.Reason)
		}
	}
	if r := Trace(p, 3, parallel(0, 0), nil); r.Status != optics.RayMissed {
		t.Errorf("wavelength index 3 of 1: %s, want missed", r.Status)
	}
}
