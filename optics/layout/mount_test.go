package layout

import (
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

func TestFootprints(t *testing.T) {
	cases := []struct {
		name          string
		bench         *optics.Bench
		index         int
		cx, cy        float64
		width, depth  float64
		axis          float64
		corner0X, c0Y float64 // first corner: centre + depth/2 along the axis - width/2 across it
	}{
		// Common practice defaults: a 25.4 mm thin lens in a holder 15 mm wider and 18 mm deep.
		{"thin lens", bench(100, 100, 0, thin("L1", 50)), 0, 150, 100, 40.4, 18, 0, 159, 79.8},
		// A thick lens's mount is centred between its first and last vertex.
		{"thick lens", bench(100, 100, 90, optics.Element{ID: "L1", Type: optics.TypeLens, GapMM: 50,
			FacesMM: []*float64{f(40), f(-40)}, ThicknessesMM: []float64{20}, Materials: []string{"fused-silica"}, DiameterMM: f(25.4)}),
			0, 100, 160, 40.4, 26, 90, 120.2, 173},
		// A 90° fold mirror's mount is aligned with the mirror: its normal bisects the turn, heading
		// 135°. The post stands half the depth behind the surface, (200, 100) − 20.2·(−√2/2, √2/2),
		// and corner 0 lies on the surface, 20.2 mm from the vertex along it (rotation identity:
		// cos 45° = sin 45° = √2/2).
		{"fold mirror", bench(100, 100, 0, mirror("M1", 100, 90)), 0, 200 + 20.2/math.Sqrt2, 100 - 20.2/math.Sqrt2,
			40.4, 40.4, 135, 200 + 20.2/math.Sqrt2, 100 + 20.2/math.Sqrt2},
		// A -90° fold: the normal points back and down, 225°, the post behind it up and to the right.
		{"fold mirror clockwise", bench(100, 300, 0, mirror("M1", 100, -90)), 0, 200 + 20.2/math.Sqrt2, 300 + 20.2/math.Sqrt2,
			40.4, 40.4, 225, 200 - 20.2/math.Sqrt2, 300 + 20.2/math.Sqrt2},
		// A retro mirror (180°) faces straight back at the beam; its post stands 20.2 mm beyond it.
		{"retro mirror", bench(100, 100, 0, mirror("M1", 100, 180)), 0, 220.2, 100, 40.4, 40.4, 180, 200, 120.2},
		// A mount given in the bench file wins over the default.
		{"mount override", bench(100, 100, 0, func() optics.Element {
			e := thin("L1", 50)
			e.Mount = &optics.Mount{WidthMM: 60, DepthMM: 10}
			return e
		}()), 0, 150, 100, 60, 10, 0, 155, 70},
		{"iris", bench(100, 100, 0, optics.Element{ID: "A1", Type: optics.TypeAperture, GapMM: 10, DiameterMM: f(3)}), 0, 110, 100, 40, 12, 0, 116, 80},
		{"wide iris", bench(100, 100, 0, optics.Element{ID: "A1", Type: optics.TypeAperture, GapMM: 10, DiameterMM: f(30)}), 0, 110, 100, 50, 12, 0, 116, 75},
		{"screen", bench(100, 100, 0, optics.Element{ID: "S", Type: optics.TypeScreen, GapMM: 10, WidthMM: f(8.8)}), 0, 110, 100, 28.8, 30, 0, 125, 85.6},
		{"dump", bench(100, 100, 0, plane("D", optics.TypeDump, 10)), 0, 110, 100, 30, 30, 0, 125, 85},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			fp := Footprints(c.bench, Walk(c.bench))[c.index]
			if !near(fp.Center.X, c.cx, posTolMM) || !near(fp.Center.Y, c.cy, posTolMM) {
				t.Errorf("centre (%g, %g), want (%g, %g)", fp.Center.X, fp.Center.Y, c.cx, c.cy)
			}
			if fp.WidthMM != c.width || fp.DepthMM != c.depth || !near(fp.AxisDeg, c.axis, 1e-9) {
				t.Errorf("%g x %g at %g°, want %g x %g at %g°", fp.WidthMM, fp.DepthMM, fp.AxisDeg, c.width, c.depth, c.axis)
			}
			if !near(fp.Corners[0].X, c.corner0X, posTolMM) || !near(fp.Corners[0].Y, c.c0Y, posTolMM) {
				t.Errorf("corner 0 (%g, %g), want (%g, %g)", fp.Corners[0].X, fp.Corners[0].Y, c.corner0X, c.c0Y)
			}
			// Self-consistency: opposite corners are a diagonal apart, sqrt(w² + d²).
			diag := r2.Norm(r2.Sub(fp.Corners[0], fp.Corners[2]))
			if !near(diag, math.Hypot(c.width, c.depth), posTolMM) {
				t.Errorf("diagonal %g, want %g", diag, math.Hypot(c.width, c.depth))
			}
		})
	}
}

func TestConvexOverlap(t *testing.T) {
	// Geometry identity: the diamond |x| + |y| <= 10 and the square [a, a+4]² meet exactly when 2a < 10.
	diamond := []r2.Vec{{X: 10}, {Y: 10}, {X: -10}, {Y: -10}}
	sq := func(a float64) []r2.Vec {
		return []r2.Vec{{X: a, Y: a}, {X: a + 4, Y: a}, {X: a + 4, Y: a + 4}, {X: a, Y: a + 4}}
	}
	cases := []struct {
		name string
		a, b []r2.Vec
		want bool
	}{
		{"square inside the bounding box but outside the diamond", diamond, sq(6), false},
		{"square across the diamond's edge", diamond, sq(4), true},
		{"square touching the edge", diamond, sq(5), false},
		{"segment through the diamond", diamond, []r2.Vec{{X: -20, Y: 1}, {X: 20, Y: 1}}, true},
		{"segment past the tip", diamond, []r2.Vec{{X: -20, Y: 11}, {X: 20, Y: 11}}, false},
		{"point inside", diamond, []r2.Vec{{X: 1, Y: 1}}, true},
	}
	for _, c := range cases {
		if got := convexOverlap(c.a, c.b); got != c.want {
			t.Errorf("%s: overlap %v, want %v", c.name, got, c.want)
		}
		if got := convexOverlap(c.b, c.a); got != c.want {
			t.Errorf("%s (swapped): overlap %v, want %v", c.name, got, c.want)
		}
	}
}

// TestMirrorMountBehindSurface: for any turn a mirror's footprint lies wholly behind its reflecting
// surface, the optic at the front edge and the post away from the beam (README 'The breadboard'):
// two corners on the surface line, two a full depth behind it, measured along the normal.
func TestMirrorMountBehindSurface(t *testing.T) {
	for _, turn := range []float64{20, 60, 90, 135, 180, -45, -170} {
		t.Run(fmt.Sprint(turn), func(t *testing.T) {
			b := bench(100, 100, 0, mirror("M1", 100, turn))
			places := Walk(b)
			fp := Footprints(b, places)[0]
			vertex := r2.Vec{X: places[0].TableXMM, Y: places[0].TableYMM}
			n := unitDeg(mirrorNormalDeg(places[0].HeadingInDeg, places[0].HeadingOutDeg))
			var front, back int
			for _, c := range fp.Corners {
				switch d := r2.Dot(r2.Sub(c, vertex), n); {
				case near(d, 0, posTolMM):
					front++
				case near(d, -fp.DepthMM, posTolMM):
					back++
				default:
					t.Errorf("corner %v lies %g mm from the surface along its normal", c, d)
				}
			}
			if front != 2 || back != 2 {
				t.Errorf("%d corners on the surface and %d a depth behind, want 2 and 2", front, back)
			}
		})
	}
}
