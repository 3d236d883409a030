package trace

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

func ptr[T any](v T) *T { return &v }

func TestRaysCollimated(t *testing.T) {
	b := &optics.Bench{
		WavelengthsNM: []float64{632.8, 532},
		Source: optics.Source{
			Kind: optics.SourceCollimated, SemiDiameterMM: ptr(2.0), FieldAnglesDeg: []float64{0, 0.5},
			FanRays: ptr(5),
			Rays:    []optics.ExplicitRay{{HeightMM: 1, AngleDeg: 2}, {XMM: -0.5, XAngleDeg: 1, HeightMM: 0, AngleDeg: -3}},
		},
	}
	p := &optics.Path{WavelengthsNM: b.WavelengthsNM}
	rs := Rays(b, p)
	if len(rs) != 2+2*2*5 {
		t.Fatalf("%d rays, want 2 explicit + 2 fields × 2 wavelengths × 5", len(rs))
	}
	// Explicit rays: start (x, height, 0), direction ∝ (tan x_angle, tan angle, 1): each angle is
	// the slope angle in its plane of the frame of README, 'Report, format raytable/report/v1',
	// Frames (u = dy/dz = tan angle_deg).
	e1 := rs[1]
	if e1.Name != "explicit[1]" || e1.K != 0 || e1.Field != "" {
		t.Errorf("second explicit ray %+v", e1)
	}
	wantDir := unit(r3.Vec{X: math.Tan(math.Pi / 180), Y: math.Tan(-3 * math.Pi / 180), Z: 1})
	if !approx.Abs(norm(r3.Sub(e1.Start.Dir, wantDir)), 0, approx.Rounding) || e1.Start.Pos != (r3.Vec{X: -0.5, Y: 0, Z: 0}) {
		t.Errorf("explicit[1] starts %+v, want pos (-0.5, 0, 0) dir %+v", e1.Start, wantDir)
	}
	if e0 := rs[0]; e0.ParaxialY != 1 || !approx.Abs(e0.ParaxialU, math.Tan(2*math.Pi/180), approx.Rounding) {
		t.Errorf("explicit[0] paraxial (%g, %g), want (1, tan 2°)", e0.ParaxialY, e0.ParaxialU)
	}
	// Fans: field 0.5 deg, second wavelength is the 4th fan; pupil -1 .. 1 across the bundle.
	fan := rs[2+3*5 : 2+4*5]
	if fan[0].Field != "0.5 deg" || fan[0].K != 1 || fan[0].Name != "fan 0.5deg 532nm 0" {
		t.Errorf("fan ray %+v", fan[0])
	}
	u := math.Tan(0.5 * math.Pi / 180)
	for j, r := range fan {
		pupil := -1 + 0.5*float64(j)
		if !approx.Abs(r.Pupil, pupil, approx.Rounding) || !approx.Abs(r.Start.Pos.Y, 2*pupil, approx.Rounding) || r.ParaxialY != r.Start.Pos.Y {
			t.Errorf("ray %d: pupil %g at y %g, want %g at %g", j, r.Pupil, r.Start.Pos.Y, pupil, 2*pupil)
		}
		if !approx.Abs(r.Start.Dir.Y/r.Start.Dir.Z, u, approx.Rounding) || r.ParaxialU != u || r.Start.Dir.X != 0 {
			t.Errorf("ray %d: dir %+v, paraxial u %g, want slope tan 0.5° = %g", j, r.Start.Dir, r.ParaxialU, u)
		}
	}
}

func TestRaysPointSource(t *testing.T) {
	b := &optics.Bench{
		WavelengthsNM: []float64{780},
		Source: optics.Source{
			Kind: optics.SourcePoint, NA: ptr(0.1), ObjectHeightsMM: []float64{0, 1.5}, FanRays: ptr(3),
		},
	}
	rs := Rays(b, &optics.Path{WavelengthsNM: b.WavelengthsNM})
	if len(rs) != 6 {
		t.Fatalf("%d rays, want 2 heights × 3", len(rs))
	}
	top := rs[5] // height 1.5, pupil +1: the marginal ray leaves at asin(NA) (NA = n sin θ, n = 1), paraxial u = NA
	if top.Field != "1.5 mm" || top.Name != "fan 1.5mm 780nm 2" || top.Pupil != 1 {
		t.Errorf("last ray %+v", top)
	}
	if top.Start.Pos != (r3.Vec{X: 0, Y: 1.5, Z: 0}) || !approx.Abs(top.Start.Dir.Y, 0.1, approx.Rounding) ||
		!approx.Abs(top.Start.Dir.Z, math.Sqrt(0.99), approx.Rounding) {
		t.Errorf("marginal ray starts %+v, want from (0, 1.5, 0) with dir (0, 0.1, sqrt 0.99)", top.Start)
	}
	if top.ParaxialY != 1.5 || !approx.Abs(top.ParaxialU, 0.1, approx.Rounding) {
		t.Errorf("paraxial (%g, %g), want (1.5, 0.1)", top.ParaxialY, top.ParaxialU)
	}
	if mid := rs[4]; mid.Start.Dir != (r3.Vec{X: 0, Y: 0, Z: 1}) || mid.ParaxialU != 0 {
		t.Errorf("chief ray of the fan %+v, want along the axis", mid.Start)
	}
}

// A default-sized fan (21 rays) through an f = 100 thin lens meets at the paraxial focus: the
// ideal thin lens is free of aberration for a collimated beam on axis (its slope rule is exact).
func TestRaysTraceThroughThinLens(t *testing.T) {
	b := &optics.Bench{
		WavelengthsNM: []float64{587.6},
		Source:        optics.Source{Kind: optics.SourceCollimated, SemiDiameterMM: ptr(5.0)},
	}
	p := path(thin(50, 100), plane("S", 150, inf))
	rs := Rays(b, p)
	if len(rs) != optics.DefaultFanRays || rs[20].Name != "fan 0deg 587.6nm 20" {
		t.Fatalf("%d rays (last %q), want %d", len(rs), rs[len(rs)-1].Name, optics.DefaultFanRays)
	}
	buf := make([]Point, 0, len(p.Surfaces))
	for _, r := range rs {
		end := last(mustTraceK(t, p, r.K, r.Start, buf))
		if !approx.Abs(end.Pos.Y, 0, approx.Rounding) {
			t.Errorf("%s lands at y = %g on the focal plane, want 0", r.Name, end.Pos.Y)
		}
	}
}

func mustTraceK(t *testing.T, p *optics.Path, k int, s Start, buf []Point) Result {
	t.Helper()
	r := Trace(p, k, s, buf)
	if r.Status != optics.RayOK {
		t.Fatalf("status %s: %s", r.Status, r.Reason)
	}
	return r
}
