package trace

import (
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// README, 'Report, format raytable/report/v1', Rays: a concave mirror of radius 200 mm hit at
// height 10 reports z = +0.25016, its sag R - sqrt(R² - h²) measured along the leaving axis.
func TestConcaveMirrorSagInLeavingFrame(t *testing.T) {
	const r, h = 200.0, 10.0
	const quotedTol = 5e-6 // README quotes the sag to 5 decimals: half a unit of the last
	pt := mustTrace(t, path(mirror(50, r, 180)), parallel(0, h)).Points[0]
	if !approx.Abs(pt.Pos.Z, 0.25016, quotedTol) {
		t.Errorf("z = %.6f, want +0.25016", pt.Pos.Z)
	}
	if want := r - math.Sqrt(r*r-h*h); !approx.Abs(pt.Pos.Z, want, approx.Rounding) { // sphere sag, closed form
		t.Errorf("z = %.15g, want the sag %.15g", pt.Pos.Z, want)
	}
	if pt.Pos.Y != h || pt.Dir.Y >= 0 || pt.Dir.Z <= 0 {
		t.Errorf("unfolded hit %+v: want height %g kept and a ray going on downstream towards the axis", pt, h)
	}
}

// The law of reflection off a plane, unfolded through that plane, is the identity: a flat mirror
// leaves every ray on its straight line, whatever the turn (common practice of unfolding).
func TestFlatMirrorLeavesRaysUnchanged(t *testing.T) {
	rays := []Start{
		parallel(0, 0), parallel(3, -2),
		{Pos: r3.Vec{X: 1, Y: 2, Z: 0}, Dir: unit(r3.Vec{X: 0.05, Y: -0.08, Z: 1})},
		{Pos: r3.Vec{X: -4, Y: 1, Z: 0}, Dir: unit(r3.Vec{X: -0.1, Y: 0.02, Z: 1})},
	}
	const lineTol = 1e-11 // positions of order 100 mm after 140 mm of path; rounding leaves 2e-14 here
	for _, turn := range []float64{90, -90, 45, -30, 150, 180} {
		p := path(mirror(60, 0, turn), plane("S", 140, inf))
		for i, s := range rays {
			t.Run(fmt.Sprintf("turn %g ray %d", turn, i), func(t *testing.T) {
				r := mustTrace(t, p, s)
				end := last(r)
				want := r3.Add(s.Pos, r3.Scale(140/s.Dir.Z, s.Dir))
				if d := norm(r3.Sub(r3.Vec{X: end.Pos.X, Y: end.Pos.Y, Z: 140}, want)); !approx.Abs(d, 0, lineTol) {
					t.Errorf("at the screen %+v, straight line gives %+v", end.Pos, want)
				}
				if d := norm(r3.Sub(end.Dir, unit(s.Dir))); !approx.Abs(d, 0, approx.Rounding) {
					t.Errorf("dir %+v, want %+v", end.Dir, unit(s.Dir))
				}
			})
		}
	}
}

// A ray parallel to the axis at height h meets a concave sphere of radius R where sin θ = h/R
// (θ measured at the centre). It reflects at angle θ to the normal, so the reflected ray makes
// 2θ with the axis; the triangle centre - hit point - crossing is isosceles with two angles θ,
// so the crossing lies R/(2 cos θ) from the centre, i.e. R(1 - 1/(2 cos θ)) from the vertex
// (derived from the law of reflection; the paraxial limit is R/2, e.g. Hecht, Optics, 4th ed.,
// §5.4, from memory).
func TestConcaveMirrorExactAxialCrossing(t *testing.T) {
	const r = 200.0
	p := path(mirror(30, r, 180))
	for _, h := range []float64{0.5, 5, 20, 50, 80, 120, 140} {
		t.Run(fmt.Sprint("h=", h), func(t *testing.T) {
			pt := mustTrace(t, p, parallel(0, h)).Points[0]
			th := math.Asin(h / r)
			want := r * (1 - 1/(2*math.Cos(th)))
			if got := crossY(pt); !approx.Rel(got, want, approx.VeryClose) {
				t.Errorf("crosses the axis %.12g mm after the vertex, want %.12g", got, want)
			}
		})
	}
	// Past h = R sin 45° the reflected ray (at 2θ > 90° to the axis) runs back towards the source.
	if r := Trace(p, 0, parallel(0, 150), nil); r.Status != optics.RayMissed || r.Surface != 0 {
		t.Errorf("ray at 150 mm: %s at %d (%s), want missed at the mirror", r.Status, r.Surface, r.Reason)
	}
}

// Coddington's equations for a spherical mirror met at incidence i (Coddington 1829; the form
// recalled from memory and as README, 'Report, format raytable/report/v1', states it): the tangential focus lies at f·cos i and the
// sagittal at f / cos i, f = R/2. The exact trace at small aperture finds them where fans of rays in the
// table plane (tangential) and in the vertical plane (sagittal) cross the chief ray.
func TestCoddingtonFociOfTiltedConcaveMirror(t *testing.T) {
	const r, incDeg, h = 200.0, 20.0, 1e-3
	f, cosI := r/2, math.Cos(incDeg*math.Pi/180)
	for _, turn := range []float64{180 - 2*incDeg, -(180 - 2*incDeg)} {
		p := path(mirror(40, r, turn))
		t.Run(fmt.Sprint("turn ", turn), func(t *testing.T) {
			chief := mustTrace(t, p, parallel(0, 0)).Points[0]
			if !approx.Abs(norm(chief.Pos), 0, approx.Rounding) || !approx.Abs(norm(r3.Sub(chief.Dir, r3.Vec{X: 0, Y: 0, Z: 1})), 0, approx.Rounding) {
				t.Fatalf("chief ray %+v does not leave along the axis", chief)
			}
			// Coma moves the crossing of one ray by ~h; the symmetric pair cancels it.
			tan := (crossY(mustTrace(t, p, parallel(0, h)).Points[0]) + crossY(mustTrace(t, p, parallel(0, -h)).Points[0])) / 2
			sag := (crossX(mustTrace(t, p, parallel(h, 0)).Points[0]) + crossX(mustTrace(t, p, parallel(-h, 0)).Points[0])) / 2
			if !approx.Rel(tan, f*cosI, limitRel) {
				t.Errorf("tangential focus %.8g mm, Coddington f cos i = %.8g", tan, f*cosI)
			}
			if !approx.Rel(sag, f/cosI, limitRel) {
				t.Errorf("sagittal focus %.8g mm, Coddington f / cos i = %.8g", sag, f/cosI)
			}
		})
	}
}

// A beam of radius h meets a plane tilted by i in an ellipse of semi-axes h (across the tilt) and
// h / cos i (along it): the projection of a circle onto an inclined plane (common practice for
// sizing fold mirrors). So a 45° fold mirror of clear radius 10 passes a vertical offset of 9.9
// but clips a table-plane offset of 7.1 (10.04 on the mirror).
func TestTiltedMirrorClearAperture(t *testing.T) {
	m := mirror(50, 0, 90)
	m.SemiAperture = 10
	p := path(m, plane("S", 100, inf))
	cases := []struct {
		x, y float64
		want string
	}{
		{9.9, 0, optics.RayOK}, {10.1, 0, optics.RayClipped},
		{0, 7.0, optics.RayOK}, {0, -7.0, optics.RayOK}, // 9.90 on the mirror
		{0, 7.1, optics.RayClipped}, {0, -7.1, optics.RayClipped}, // 10.04 on the mirror
	}
	for _, c := range cases {
		r := Trace(p, 0, parallel(c.x, c.y), nil)
		if r.Status != c.want {
			t.Errorf("ray at (%g, %g): %s (%s), want %s", c.x, c.y, r.Status, r.Reason, c.want)
		}
		if c.want == optics.RayClipped && r.Surface != 0 {
			t.Errorf("ray at (%g, %g) stopped at surface %d, want 0", c.x, c.y, r.Surface)
		}
	}
}
