package layout

import (
	"math"
	"os"
	"strings"
	"testing"

	"raytable/optics"
)

func constRadius(r float64) func(float64) float64 { return func(float64) float64 { return r } }

func TestPlanPlacement(t *testing.T) {
	b := bench(100, 60, 0,
		thin("L1", 15),
		mirror("M1", 300, 90),
		plane("D", optics.TypeDump, 100))
	ps, _ := plan(t, b, nil)
	want := []optics.Placement{
		// (115, 60) on the common-practice metric grid: nearest hole column 5 (112.5), row 3 (62.5).
		{ID: "L1", Type: optics.TypeThinLens, TableXMM: 115, TableYMM: 60, HeadingDeg: 0, HoleColumn: 5, HoleRow: 3,
			OffsetXMM: 2.5, OffsetYMM: -2.5, MountWidthMM: 40.4, MountDepthMM: 18},
		// The mirror's vertex is at (415, 60) and its mount faces along its normal, 135°, with the
		// post half the 40.4 mm depth behind the surface: (415 + 20.2/√2, 60 − 20.2/√2) =
		// (429.28, 45.72), nearest column 18 (437.5), row 2 (37.5).
		{ID: "M1", Type: optics.TypeMirror, TableXMM: 415 + 20.2/math.Sqrt2, TableYMM: 60 - 20.2/math.Sqrt2, HeadingDeg: 135,
			HoleColumn: 18, HoleRow: 2, OffsetXMM: 415 + 20.2/math.Sqrt2 - 437.5, OffsetYMM: 60 - 20.2/math.Sqrt2 - 37.5,
			MountWidthMM: 40.4, MountDepthMM: 40.4},
		// (415, 160): row 7 (162.5).
		{ID: "D", Type: optics.TypeDump, TableXMM: 415, TableYMM: 160, HeadingDeg: 90, HoleColumn: 17, HoleRow: 7,
			OffsetXMM: 2.5, OffsetYMM: -2.5, MountWidthMM: 30, MountDepthMM: 30},
	}
	if len(ps) != len(want) {
		t.Fatalf("%d placements, want %d", len(ps), len(want))
	}
	for i, w := range want {
		g := ps[i]
		if g.ID != w.ID || g.Type != w.Type || g.HoleColumn != w.HoleColumn || g.HoleRow != w.HoleRow ||
			g.MountWidthMM != w.MountWidthMM || g.MountDepthMM != w.MountDepthMM ||
			!near(g.TableXMM, w.TableXMM, posTolMM) || !near(g.TableYMM, w.TableYMM, posTolMM) ||
			!near(g.HeadingDeg, w.HeadingDeg, 1e-9) ||
			!near(g.OffsetXMM, w.OffsetXMM, posTolMM) || !near(g.OffsetYMM, w.OffsetYMM, posTolMM) {
			t.Errorf("[%d]\n got %+v\nwant %+v", i, g, w)
		}
	}

	b.Table.Grid = optics.GridNone
	ps, _ = plan(t, b, nil)
	if ps[0].HoleColumn != 0 || ps[0].HoleRow != 0 || ps[0].OffsetXMM != 0 {
		t.Errorf("a table without a grid gave a hole: %+v", ps[0])
	}
}

func TestMountsOverlap(t *testing.T) {
	// Two 18 mm deep lens holders (common-practice default) on one axis touch when their planes are
	// 18 mm apart and collide when closer.
	cases := []struct {
		gap  float64
		want int
	}{{10, 1}, {17.9, 1}, {18, 0}, {18.5, 0}, {100, 0}}
	for _, c := range cases {
		b := bench(100, 300, 0, thin("L1", 100), thin("L2", c.gap), plane("S", optics.TypeScreen, 100))
		_, ws := plan(t, b, nil)
		got := withCode(ws, CodeMountsOverlap)
		if len(got) != c.want {
			t.Errorf("gap %g: %d overlap warnings, want %d: %v", c.gap, len(got), c.want, ws)
			continue
		}
		if c.want == 1 && (got[0].Element != "L1" || !mentions(got[0], "L1", "L2")) {
			t.Errorf("gap %g: warning does not name both mounts: %+v", c.gap, got[0])
		}
	}
}

// foldedBack is a beam that runs along +x past L1, is folded twice and comes back along -x, 60 mm
// further back than the first leg. L1 has a wide, thin mount (80 x 10 mm) reaching y = 340; the
// return leg runs at y = 360.
func foldedBack() *optics.Bench {
	l1 := thin("L1", 150)
	l1.Mount = &optics.Mount{WidthMM: 80, DepthMM: 10}
	return bench(100, 300, 0,
		l1,
		mirror("M1", 150, 90),
		mirror("M2", 60, 90),
		optics.Element{ID: "CAM", Type: optics.TypeScreen, GapMM: 300, WidthMM: f(8.8)})
}

func TestMountInBeam(t *testing.T) {
	cases := []struct {
		name   string
		radius func(float64) float64
		want   int
	}{
		// The return leg's axis passes 20 mm from L1's mount.
		{"axis only", nil, 0},
		{"beam 15 mm wide, clears", constRadius(15), 0},
		{"beam 25 mm wide, clips L1's mount", constRadius(25), 1},
		// The beam grows along the path: 25 mm by the time it reaches the return leg (path > 360).
		{"growing beam", func(p float64) float64 { return p / 15 }, 1},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, ws := plan(t, foldedBack(), c.radius)
			got := withCode(ws, CodeMountInBeam)
			if len(got) != c.want {
				t.Fatalf("%d mount-in-beam warnings, want %d: %v", len(got), c.want, ws)
			}
			if c.want == 1 && (got[0].Element != "L1" || !mentions(got[0], "L1", "M2", "CAM")) {
				t.Errorf("warning does not name L1 and the stretch M2-CAM: %+v", got[0])
			}
			if n := len(withCode(ws, CodeMountsOverlap)); n != 0 {
				t.Errorf("the mounts were laid out apart, yet %d overlap", n)
			}
		})
	}
}

func TestOwnMountNotInBeam(t *testing.T) {
	// Every element sits in its own beam; a wide beam through a straight line of parts warns nothing.
	b := bench(100, 300, 0, thin("L1", 100), optics.Element{ID: "A1", Type: optics.TypeAperture, GapMM: 100, DiameterMM: f(5)},
		mirror("M1", 100, 90), plane("D", optics.TypeDump, 100))
	_, ws := plan(t, b, constRadius(10))
	if len(ws) != 0 {
		t.Errorf("unexpected warnings: %v", ws)
	}
}

func TestOffTable(t *testing.T) {
	cases := []struct {
		name     string
		bench    *optics.Bench
		radius   func(float64) float64
		elements []string // expected off-table elements in order
		fragment string   // in the first off-table message
		beamOff  int
	}{
		{"elements beyond the right edge", bench(100, 300, 0, thin("L1", 2000), plane("D", optics.TypeDump, 10)), nil,
			[]string{"L1", "D"}, "L1 at (2100.0, 300.0) mm is off the 1200 x 600 mm table", 2},
		// Vertices on the table, mounts (40.4 and 30 mm wide) reaching over the front edge at y = 0.
		{"mounts over the front edge", bench(100, 10, 0, thin("L1", 100), plane("D", optics.TypeDump, 100)), nil,
			[]string{"L1", "D"}, "mount of L1", 0},
		// Mounts on the table, a 35 mm beam radius reaching over the front edge 30 mm away.
		{"beam over the front edge", bench(100, 30, 0, thin("L1", 100), plane("D", optics.TypeDump, 100)), constRadius(35),
			nil, "", 2},
		{"all on the table", bench(100, 300, 0, thin("L1", 100), plane("D", optics.TypeDump, 100)), constRadius(5),
			nil, "", 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, ws := plan(t, c.bench, c.radius)
			off := withCode(ws, CodeOffTable)
			if len(off) != len(c.elements) {
				t.Fatalf("off-table warnings %v, want for %v", off, c.elements)
			}
			for i, id := range c.elements {
				if off[i].Element != id || !mentions(off[i], id) {
					t.Errorf("off-table warning %+v, want one naming %s", off[i], id)
				}
			}
			if len(off) > 0 && !strings.Contains(off[0].Message, c.fragment) {
				t.Errorf("message %q does not say %q", off[0].Message, c.fragment)
			}
			if n := len(withCode(ws, CodeBeamOffTable)); n != c.beamOff {
				t.Errorf("%d beam-off-table warnings, want %d: %v", n, c.beamOff, ws)
			}
		})
	}
}

func TestNoBeamEnd(t *testing.T) {
	cases := []struct {
		name  string
		last  optics.Element
		warns bool
	}{
		{"ends on a lens", thin("L2", 100), true},
		{"ends on a mirror", mirror("M9", 100, 90), true},
		{"ends on an iris", optics.Element{ID: "A9", Type: optics.TypeAperture, GapMM: 100, DiameterMM: f(5)}, true},
		{"ends on a dump", plane("D", optics.TypeDump, 100), false},
		{"ends on a screen", plane("S", optics.TypeScreen, 100), false},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, ws := plan(t, bench(100, 300, 0, thin("L1", 100), c.last), nil)
			got := withCode(ws, CodeNoBeamEnd)
			if !c.warns {
				if len(got) != 0 {
					t.Errorf("unexpected no-beam-end: %v", got)
				}
				return
			}
			if len(got) != 1 || got[0].Element != c.last.ID || !mentions(got[0], c.last.ID) {
				t.Errorf("no-beam-end warnings %v, want one naming %s", got, c.last.ID)
			}
		})
	}
	_, ws := plan(t, bench(100, 300, 0), nil)
	if len(withCode(ws, CodeNoBeamEnd)) != 1 {
		t.Errorf("an empty bench must warn that the beam is not terminated: %v", ws)
	}
}

func TestPlanDemoBench(t *testing.T) {
	// Self-consistency: the demo bench was laid out by hand to fit its table without collisions.
	data, err := os.ReadFile("../../testdata/demo-bench.json")
	if err != nil {
		t.Skip("demo bench not present:", err)
	}
	b, err := optics.Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	ps, ws := plan(t, b, constRadius(3))
	if len(ps) != len(b.Elements) {
		t.Fatalf("%d placements for %d elements", len(ps), len(b.Elements))
	}
	for _, w := range ws {
		t.Errorf("demo bench warning: %+v", w)
	}
}

func TestPlanRobust(t *testing.T) {
	// Bad input never panics: nil bench, fewer places than elements, NaN radii.
	if ps, ws := Plan(nil, nil, nil); ps != nil || ws != nil {
		t.Error("nil bench gave results")
	}
	b := foldedBack()
	places := Walk(b)[:2]
	ps, _ := Plan(b, places, func(float64) float64 { return nan() })
	if len(ps) != 2 {
		t.Errorf("%d placements for 2 places", len(ps))
	}
}
