package trace

import (
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/internal/approx"
	"raytable/optics/paraxial"
)

// A ray through a tilted plate, found by the exact trace, leaves parallel to the arriving axis,
// displaced sideways by d = t sin θ (1 - cos θ / sqrt(n² - sin² θ)) (standard plate formula,
// from memory), to the side away from the reflected port. The trace gives the exit in the
// frame of the plate's leaving axis; going back to the arriving frame undoes the two frame
// turns of the faces.
func TestPlateDisplacesTheAxis(t *testing.T) {
	const n, thick = 1.5, 5.0
	for _, turn := range []float64{90, -90, 60, -120, brewsterTurnDeg(n)} {
		for _, y0 := range []float64{0, 1.5, -2} {
			t.Run(fmt.Sprintf("turn %g y %g", turn, y0), func(t *testing.T) {
				b := armsBench(plateEl(20, turn, thick), screenEl("S", 30))
				p := optics.BuildPath(b)
				r := mustTrace(t, p, parallel(0.3, y0))
				out := r.Points[1]
				// The leaving frame of face 1: origin at the exit vertex, axes parallel to the
				// arriving ones (the two turns cancel).
				f1 := &p.Surfaces[1]
				turnIn := p.Surfaces[0].AxisTurnRad
				vertex := r3.Vec{Y: math.Sin(turnIn) * (f1.PathMM - p.Surfaces[0].PathMM), Z: math.Cos(turnIn) * (f1.PathMM - p.Surfaces[0].PathMM)}
				exit := r3.Add(vertex, out.Pos)
				// The line leaving the plate, at the plane z = vertex.Z of the arriving frame.
				yLine := exit.Y - (exit.Z-vertex.Z)*out.Dir.Y/out.Dir.Z
				inc := (180 - math.Abs(turn)) / 2 * math.Pi / 180
				s, c := math.Sincos(inc)
				d := thick * s * (1 - c/math.Sqrt(n*n-s*s))
				side := -1.0
				if turn < 0 {
					side = 1
				}
				approx.Check(t, "sideways shift", yLine-y0, side*d, 1e-12)
				approx.Check(t, "leaving dir y", out.Dir.Y, 0, 1e-15)
				approx.Check(t, "height x", out.Pos.X, 0.3, 1e-12)
				approx.Check(t, "shift against optics.PlateShiftMM", d, optics.PlateShiftMM(thick, n, inc), 1e-14)
			})
		}
	}
}

// A converging beam through a 45° plate focuses at different distances in the two planes. The
// exact trace of thin fans in each plane must put each focus where the paraxial per-plane reduced
// lengths (paraxial.PlateReducedMM) do (self-consistency); at Brewster's angle the reduced lengths
// are t sqrt(n²+1)/n⁴ in the plane of incidence and t sqrt(n²+1)/n² across it, so the foci part
// by t sqrt(n²+1)(n²-1)/n⁴ (Kogelnik, Ippen, Dienes and Shank, IEEE J. Quantum Electron. 8, 373,
// 1972, from memory).
func TestPlateAstigmatism(t *testing.T) {
	const n, thick, f, before = 1.5, 10.0, 200.0, 50.0
	const h = 0.01 // mm: thin enough that the plate's aberrations stay below 1e-6 mm
	for _, tc := range []struct {
		name         string
		turn         float64
		wantT, wantS float64 // reduced lengths in the table plane and across it; 0: compare with PlateReducedMM only
		source       string
	}{
		{"45°", 90, 0, 0, "self-consistency"},
		{"30° the other way", -120, 0, 0, "self-consistency"},
		{"Brewster", brewsterTurnDeg(n), thick * math.Sqrt(n*n+1) / (n * n * n * n), thick * math.Sqrt(n*n+1) / (n * n),
			"Kogelnik, Ippen, Dienes and Shank 1972, from memory"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			b := armsBench(thinEl(10, f), plateEl(before, tc.turn, thick), screenEl("S", 300))
			p := optics.BuildPath(b)
			exit := 2 // the plate's second face
			// The tilted plate adds coma, so one ray crosses the axis a distance of order h from the
			// focus; two rays at ±h meet at it up to h².
			tanUp := last(mustTraceTo(t, p, Start{Pos: r3.Vec{Y: h}, Dir: r3.Vec{Z: 1}}, exit))
			tanDown := last(mustTraceTo(t, p, Start{Pos: r3.Vec{Y: -h}, Dir: r3.Vec{Z: 1}}, exit))
			sag := last(mustTraceTo(t, p, Start{Pos: r3.Vec{X: h}, Dir: r3.Vec{Z: 1}}, exit))
			// Foci beyond the plate's exit vertex, and the reduced length the plate must have for them.
			zT, zS := meetY(tanUp, tanDown), crossX(sag)
			inc := (180 - math.Abs(tc.turn)) / 2 * math.Pi / 180
			redT, redS := f-before-zT, f-before-zS
			approx.Check(t, "tangential reduced length", redT, paraxial.PlateReducedMM(thick, n, inc, paraxial.Tangential), 1e-5)
			approx.Check(t, "sagittal reduced length", redS, paraxial.PlateReducedMM(thick, n, inc, paraxial.Sagittal), 1e-5)
			if tc.wantT != 0 {
				approx.Check(t, "Brewster tangential ("+tc.source+")", redT, tc.wantT, 1e-5)
				approx.Check(t, "Brewster sagittal ("+tc.source+")", redS, tc.wantS, 1e-5)
				approx.Check(t, "astigmatic focal shift ("+tc.source+")", zT-zS, thick*math.Sqrt(n*n+1)*(n*n-1)/(n*n*n*n), 1e-5)
			}
			// The paraxial trace through the path puts the foci at the same places.
			for _, pl := range []struct {
				plane paraxial.Plane
				want  float64
			}{{paraxial.Tangential, zT}, {paraxial.Sagittal, zS}} {
				r := paraxial.Trace(p, 0, pl.plane, paraxial.Ray{Y: 1})[exit]
				approx.Check(t, fmt.Sprintf("paraxial focus, plane %d", pl.plane), -r.Y/r.NU, pl.want, 1e-5)
			}
		})
	}
}

// A splitter of no thickness is a plane at its vertex: every ray leaves it as it came (by
// definition). Its clear aperture is a circle on the surface, met at incidence i: an ellipse of
// semi-axes r cos i in the table plane and r vertically across the beam.
func TestThinSplitterLeavesRaysAlone(t *testing.T) {
	bs := optics.Element{ID: "BS", Type: optics.TypeSplitter, GapMM: 40, TurnDeg: fp(90), DiameterMM: fp(20)}
	with := optics.BuildPath(armsBench(thinEl(10, 150), bs, screenEl("S", 60)))
	without := optics.BuildPath(armsBench(thinEl(10, 150), screenEl("S", 100)))
	for _, s := range []Start{parallel(0, 3), parallel(2, -4), {Pos: r3.Vec{X: 1, Y: -1}, Dir: unit(r3.Vec{X: 0.02, Y: -0.03, Z: 1})}} {
		a, b := last(mustTrace(t, with, s)), last(mustTrace(t, without, s))
		// The extra plane only rounds the positions (one more intersection step).
		if norm(r3.Sub(a.Pos, b.Pos)) > approx.Rounding || a.Dir != b.Dir {
			t.Errorf("ray %+v: at the screen %+v behind the splitter, %+v without it", s, a, b)
		}
	}
	cos45 := math.Cos(math.Pi / 4)
	for _, tc := range []struct {
		x, y float64
		want string
	}{
		{0, 0.99 * 10 * cos45, optics.RayOK}, {0, 1.01 * 10 * cos45, optics.RayClipped},
		{9.9, 0, optics.RayOK}, {10.1, 0, optics.RayClipped},
	} {
		b := optics.BuildPath(armsBench(bs, screenEl("S", 60)))
		if r := Trace(b, 0, parallel(tc.x, tc.y), nil); r.Status != tc.want {
			t.Errorf("ray at (%g, %g) on a 20 mm splitter at 45°: %s (%s), want %s", tc.x, tc.y, r.Status, r.Reason, tc.want)
		}
	}
}

// meetY is the z (from the vertex) where the rays leaving a and b cross in the y-z plane.
func meetY(a, b Point) float64 {
	sa, sb := a.Dir.Y/a.Dir.Z, b.Dir.Y/b.Dir.Z
	// a.Y + (z - a.Z) sa = b.Y + (z - b.Z) sb
	return (b.Pos.Y - a.Pos.Y + a.Pos.Z*sa - b.Pos.Z*sb) / (sa - sb)
}

// mustTraceTo traces s and checks that it reaches surface i.
func mustTraceTo(t *testing.T, p *optics.Path, s Start, i int) Result {
	t.Helper()
	r := mustTrace(t, p, s)
	r.Points = r.Points[:i+1]
	return r
}
