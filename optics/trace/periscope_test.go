package trace

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/internal/approx"
	"raytable/optics/layout"
	"raytable/optics/paraxial"
)

// A concave mirror of focal length f met at incidence i focuses the table plane at f cos i and
// the vertical plane at f / cos i (Coddington's equations, from memory). Behind a periscope that
// turns by ±90° the beam's own tangential plane (the source's table plane) is vertical, so the
// beam's tangential focus is at f / cos i and its sagittal one at f cos i, paraxially and in the
// exact trace. With an even number of such periscopes the planes are back.
func TestPeriscopeSwapsPlanes(t *testing.T) {
	const radius, h = 400.0, 0.01
	f := radius / 2
	for _, tc := range []struct {
		name    string
		scopes  []float64 // periscope turns
		swapped bool
	}{
		{"no periscope", nil, false},
		{"+90", []float64{90}, true},
		{"-90", []float64{-90}, true},
		{"+90 then -90", []float64{90, -90}, false},
		{"180", []float64{180}, false},
	} {
		for _, turn := range []float64{60, -100} {
			t.Run(fmt.Sprintf("%s mirror %g", tc.name, turn), func(t *testing.T) {
				var els []optics.Element
				for k, s := range tc.scopes {
					e := periscopeEl(30, 80, s)
					e.ID = fmt.Sprintf("P%d", k)
					els = append(els, e)
				}
				els = append(els, mirrorEl(40, radius, turn), screenEl("S", 500))
				p := optics.BuildPath(armsBench(els...))
				m := len(p.Surfaces) - 2
				cosI := math.Cos((180 - math.Abs(turn)) / 2 * math.Pi / 180)
				wantT, wantS := f*cosI, f/cosI // beam planes, no swap (Coddington)
				if tc.swapped {
					wantT, wantS = wantS, wantT
				}
				for _, pl := range []struct {
					plane paraxial.Plane
					want  float64
				}{{paraxial.Tangential, wantT}, {paraxial.Sagittal, wantS}} {
					r := paraxial.Trace(p, 0, pl.plane, paraxial.Ray{Y: 1})[m]
					approx.Check(t, fmt.Sprintf("paraxial focus, plane %d (Coddington)", pl.plane), -r.Y/r.NU, pl.want, 1e-9)
				}
				// Exact: a ray off the axis in the source's table plane (y) and one in its vertical
				// plane (x). Behind the mirror the frame is the table's (x up): the focus of each is
				// where it crosses the axis in whichever table-frame plane it now lies in.
				tan := mustTrace(t, p, parallel(0, h)).Points[m]
				sag := mustTrace(t, p, parallel(h, 0)).Points[m]
				zT, zS := crossY(tan), crossX(sag)
				if tc.swapped {
					zT, zS = crossX(tan), crossY(sag)
				}
				approx.Check(t, "exact tangential focus (Coddington)", zT, wantT, 1e-3)
				approx.Check(t, "exact sagittal focus (Coddington)", zS, wantS, 1e-3)
			})
		}
	}
}

// A periscope that does not turn changes nothing but the beam's height and the path length: its
// rays, paraxial rays and positions along the path are those of a straight gap |rise_mm| longer
// (definition).
func TestPeriscopeWithoutTurn(t *testing.T) {
	const rise = -70.0
	scope := armsBench(thinEl(10, 150), periscopeEl(40, rise, 0), screenEl("S", 60))
	straight := armsBench(thinEl(10, 150), screenEl("S", 40+math.Abs(rise)+60))
	ps, pt := optics.BuildPath(scope), optics.BuildPath(straight)
	for _, s := range []Start{parallel(0, 3), parallel(2, -4), {Pos: r3.Vec{X: 1, Y: -1}, Dir: unit(r3.Vec{X: 0.02, Y: -0.03, Z: 1})}} {
		a, b := last(mustTrace(t, ps, s)), last(mustTrace(t, pt, s))
		if norm(r3.Sub(a.Pos, b.Pos)) > approx.Rounding || norm(r3.Sub(a.Dir, b.Dir)) > approx.Rounding {
			t.Errorf("ray %+v: at the screen %+v behind the periscope, %+v without it", s, a, b)
		}
	}
	for _, plane := range []paraxial.Plane{paraxial.Tangential, paraxial.Sagittal} {
		a := paraxial.Trace(ps, 0, plane, paraxial.Ray{Y: 1, NU: 0.01})
		b := paraxial.Trace(pt, 0, plane, paraxial.Ray{Y: 1, NU: 0.01})
		approx.Check(t, "paraxial height at the screen", a[len(a)-1].Y, b[len(b)-1].Y, approx.Rounding)
	}
	approx.Check(t, "screen along the path", ps.Surfaces[len(ps.Surfaces)-1].PathMM, pt.Surfaces[len(pt.Surfaces)-1].PathMM, 0)
	approx.Check(t, "periscope length", ps.ElementLengthMM(1), math.Abs(rise), 0)
	if ps.RotatedImage {
		t.Error("a periscope without a turn marks the image rotated")
	}
	places := layout.Walk(scope)
	approx.Check(t, "height at the periscope", places[1].HeightMM, 100, 0)
	approx.Check(t, "height at the screen", places[2].HeightMM, 100+rise, 0)
	approx.Check(t, "screen on the table (x)", places[2].TableXMM, 100+10+40+60, 1e-12)
	approx.Check(t, "screen along the path", places[2].PathMM, 10+40+math.Abs(rise)+60, 0)
}

// A periscope turning by an angle that is not a multiple of 90° rotates the image: the path says
// so, and the exact trace turns a ray's transverse position by the turn (two mirrors: a rotation,
// no reflection; geometry of the two 45° mirrors, from memory).
func TestPeriscopeRotatesImage(t *testing.T) {
	for _, turn := range []float64{30, -45, 135} {
		p := optics.BuildPath(armsBench(periscopeEl(40, 50, turn), screenEl("S", 60)))
		if !p.RotatedImage {
			t.Errorf("turn %g: the image is not marked rotated", turn)
		}
		r := mustTrace(t, p, parallel(0, 2)) // 2 mm left of travel
		phi := turn * math.Pi / 180
		got := last(r).Pos
		// Seen in the new frame (x up, y left), a point left of the axis is turned with the
		// beam: up by 2 sin φ, left by 2 cos φ.
		approx.Check(t, fmt.Sprintf("turn %g: x", turn), got.X, 2*math.Sin(phi), 1e-12)
		approx.Check(t, fmt.Sprintf("turn %g: y", turn), got.Y, 2*math.Cos(phi), 1e-12)
	}
	if p := optics.BuildPath(armsBench(periscopeEl(40, 50, -90), screenEl("S", 60))); p.RotatedImage {
		t.Error("a 90° periscope marks the image rotated")
	}
}

// Random splitters, plates and periscopes never give NaN: every ray the trace returns has finite
// points, and the paraxial trace stays finite.
func TestArmsElementsNaNFree(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := range 300 {
		var els []optics.Element
		for k := range 1 + rng.IntN(5) {
			var e optics.Element
			switch rng.IntN(4) {
			case 0:
				e = plateEl(rng.Float64()*50, (rng.Float64()*2-1)*179.9, rng.Float64()*20)
			case 1:
				e = periscopeEl(rng.Float64()*50, (rng.Float64()*2-1)*200, (rng.Float64()*2-1)*180)
			case 2:
				e = mirrorEl(rng.Float64()*50, (rng.Float64()*2-1)*500, (rng.Float64()*2-1)*179)
			default:
				e = optics.Element{ID: "BS", Type: optics.TypeSplitter, GapMM: rng.Float64() * 50, TurnDeg: fp((rng.Float64()*2 - 1) * 179.9), DiameterMM: fp(rng.Float64() * 30)}
			}
			e.ID = fmt.Sprintf("E%d", k)
			els = append(els, e)
		}
		els = append(els, screenEl("S", rng.Float64()*100))
		p := optics.BuildPath(armsBench(els...))
		for range 5 {
			s := Start{Pos: r3.Vec{X: rng.NormFloat64() * 3, Y: rng.NormFloat64() * 3}, Dir: unit(r3.Vec{X: rng.NormFloat64() * 0.1, Y: rng.NormFloat64() * 0.1, Z: 1})}
			r := Trace(p, 0, s, nil)
			for _, pt := range r.Points {
				if !finite(pt.Pos) || !finite(pt.Dir) {
					t.Fatalf("trial %d: ray %+v: non-finite point %+v (%s)", trial, s, pt, r.Status)
				}
			}
		}
		for _, plane := range []paraxial.Plane{paraxial.Tangential, paraxial.Sagittal} {
			for _, r := range paraxial.Trace(p, 0, plane, paraxial.Ray{Y: 1, NU: 0.01}) {
				if math.IsNaN(r.Y) || math.IsNaN(r.NU) {
					t.Fatalf("trial %d: paraxial NaN in plane %d", trial, plane)
				}
			}
		}
		for _, pl := range layout.Walk(armsBench(els...)) {
			if math.IsNaN(pl.TableXMM + pl.TableYMM + pl.HeightMM + pl.PathMM) {
				t.Fatalf("trial %d: NaN place %+v", trial, pl)
			}
		}
	}
}

// Plates, thin splitters and periscopes keep the trace free of allocations per ray.
func TestArmsTraceAllocatesNothing(t *testing.T) {
	bs := optics.Element{ID: "BS2", Type: optics.TypeSplitter, GapMM: 20, TurnDeg: fp(-60), DiameterMM: fp(25)}
	p := optics.BuildPath(armsBench(plateEl(20, 90, 3), periscopeEl(30, 60, 37), bs, mirrorEl(40, 300, 70), screenEl("S", 100)))
	rays := benchRays(21)
	buf := make([]Point, 0, len(p.Surfaces))
	for _, s := range rays {
		if r := Trace(p, 0, s, buf); r.Status != optics.RayOK {
			t.Fatalf("ray %+v: %s (%s)", s, r.Status, r.Reason)
		}
	}
	if allocs := testing.AllocsPerRun(100, func() {
		for _, s := range rays {
			Trace(p, 0, s, buf)
		}
	}); allocs != 0 {
		t.Errorf("%g allocations per fan, want 0", allocs)
	}
}
