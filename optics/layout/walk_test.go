package layout

import (
	"math"
	"testing"

	"raytable/optics"
)

func TestWalk(t *testing.T) {
	type want struct {
		x, y, in, out, path float64
	}
	cases := []struct {
		name  string
		bench *optics.Bench
		want  []want
	}{
		{
			// Geometry identity: a straight path adds the gaps along the heading.
			name:  "straight",
			bench: bench(100, 100, 0, thin("L1", 50), plane("S", optics.TypeScreen, 70)),
			want:  []want{{150, 100, 0, 0, 50}, {220, 100, 0, 0, 120}},
		},
		{
			// Geometry identity: after a +90° fold the next element lies gap_mm along +y.
			name:  "90 degree fold",
			bench: bench(100, 100, 0, mirror("M1", 100, 90), plane("S", optics.TypeScreen, 50)),
			want:  []want{{200, 100, 0, 90, 100}, {200, 150, 90, 90, 150}},
		},
		{
			// Geometry identity: a -90° fold (clockwise) sends the beam along -y.
			name:  "minus 90 degree fold",
			bench: bench(100, 300, 0, mirror("M1", 100, -90), plane("S", optics.TypeScreen, 50)),
			want:  []want{{200, 300, 0, 270, 100}, {200, 250, 270, 270, 150}},
		},
		{
			// Geometry identity: a 180° retro fold sends the beam straight back along -x.
			name:  "180 degree retro fold",
			bench: bench(100, 100, 0, mirror("M1", 100, 180), thin("L2", 60)),
			want:  []want{{200, 100, 0, 180, 100}, {140, 100, 180, 180, 160}},
		},
		{
			// A lens's last vertex is its length (sum of thicknesses) past its first vertex;
			// path_mm counts that length too.
			name: "thick lens",
			bench: bench(100, 100, 0,
				optics.Element{ID: "L1", Type: optics.TypeLens, GapMM: 10, FacesMM: []*float64{f(50), nil, f(-80)},
					ThicknessesMM: []float64{4, 2}, Materials: []string{"fused-silica", "fused-silica"}},
				thin("L2", 20)),
			want: []want{{110, 100, 0, 0, 10}, {136, 100, 0, 0, 36}},
		},
		{
			// Headings are normalised into [0, 360): -90 is 270; three +120° turns come back to 0, not 360.
			name: "headings normalised",
			bench: bench(500, 300, -90,
				mirror("M1", 10, 120), mirror("M2", 10, 120), mirror("M3", 10, 120), plane("D", optics.TypeDump, 10)),
			want: []want{
				{500, 290, 270, 30, 10},
				{500 + 10*math.Sqrt(3)/2, 295, 30, 150, 20},
				{500, 300, 150, 270, 30},
				{500, 290, 270, 270, 40},
			},
		},
		{
			// Geometry identity: cos 30° = √3/2, sin 30° = 1/2.
			name:  "oblique heading",
			bench: bench(100, 100, 390, thin("L1", 100)),
			want:  []want{{100 + 100*math.Sqrt(3)/2, 150, 30, 30, 100}},
		},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			got := Walk(c.bench)
			if len(got) != len(c.want) {
				t.Fatalf("got %d places, want %d", len(got), len(c.want))
			}
			for i, w := range c.want {
				g := got[i]
				if g.ID != c.bench.Elements[i].ID || g.Type != c.bench.Elements[i].Type {
					t.Errorf("[%d] id/type %s/%s", i, g.ID, g.Type)
				}
				if !near(g.TableXMM, w.x, posTolMM) || !near(g.TableYMM, w.y, posTolMM) {
					t.Errorf("[%d] %s at (%.12g, %.12g), want (%g, %g)", i, g.ID, g.TableXMM, g.TableYMM, w.x, w.y)
				}
				if !near(g.HeadingInDeg, w.in, 1e-9) || !near(g.HeadingOutDeg, w.out, 1e-9) {
					t.Errorf("[%d] %s heading in/out %g/%g, want %g/%g", i, g.ID, g.HeadingInDeg, g.HeadingOutDeg, w.in, w.out)
				}
				if !near(g.PathMM, w.path, posTolMM) {
					t.Errorf("[%d] %s path %g, want %g", i, g.ID, g.PathMM, w.path)
				}
				if g.Faces != nil || g.Clearance != nil || g.MarginalYMM != 0 {
					t.Errorf("[%d] ray fields must be left for the tracer", i)
				}
			}
		})
	}
}

func TestNormDeg(t *testing.T) {
	// Definition: headings are reduced modulo 360 into [0, 360).
	for _, c := range []struct{ in, want float64 }{
		{0, 0}, {360, 0}, {-90, 270}, {450, 90}, {-720, 0}, {359.5, 359.5}, {-1e-15, 0},
	} {
		if got := NormDeg(c.in); got != c.want {
			t.Errorf("NormDeg(%g) = %g, want %g", c.in, got, c.want)
		}
	}
}

func TestWalkNil(t *testing.T) {
	if Walk(nil) != nil {
		t.Fatal("nil bench must give no places")
	}
}
