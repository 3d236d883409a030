package layout

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// boardReport is a hand-made report: a 5 mm thick lens L1 at path 50, a mirror M1 at path 150
// folding +x into +y, a screen S at path 260; the beam 1 mm in radius all the way; posts at the
// element positions (the lens's on the middle of its glass, the mirror's mount a 40 mm square
// turned to its normal at 135°).
func boardReport() *optics.Report {
	r := &optics.Report{
		Elements: []optics.ElementPlace{
			{ID: "L1", Type: optics.TypeLens, PathMM: 50, TableXMM: 100, TableYMM: 100,
				Faces: []optics.FacePlace{{PathMM: 50}, {PathMM: 55}}},
			{ID: "M1", Type: optics.TypeMirror, PathMM: 150, TableXMM: 200, TableYMM: 100, HeadingOutDeg: 90,
				Faces: []optics.FacePlace{{PathMM: 150}}},
			{ID: "S", Type: optics.TypeScreen, PathMM: 260, TableXMM: 200, TableYMM: 210, HeadingInDeg: 90, HeadingOutDeg: 90,
				Faces: []optics.FacePlace{{PathMM: 260}}},
		},
		Placement: []optics.Placement{
			{ID: "L1", TableXMM: 102.5, TableYMM: 100, HeadingDeg: 0, MountWidthMM: 40, MountDepthMM: 18},
			{ID: "M1", TableXMM: 200, TableYMM: 100, HeadingDeg: 135, MountWidthMM: 40, MountDepthMM: 40},
			{ID: "S", TableXMM: 200, TableYMM: 210, HeadingDeg: 90, MountWidthMM: 40, MountDepthMM: 20},
		},
		Holes: Holes(optics.Table{Grid: optics.GridMetric25, WidthMM: 600, DepthMM: 300}).HoleGrid,
		Beam:  &optics.BeamReport{},
	}
	for z := 0.0; z <= 300; z += 25 {
		r.Beam.Samples = append(r.Beam.Samples, optics.BeamSample{PathMM: z, WTMM: 1, WSMM: 1})
	}
	return r
}

var (
	boardTable  = optics.Table{Grid: optics.GridMetric25, WidthMM: 600, DepthMM: 300}
	boardSource = optics.Source{XMM: 50, YMM: 100}
)

func nearVec(a, b r2.Vec) bool { return near(a.X, b.X, posTolMM) && near(a.Y, b.Y, posTolMM) }

func TestBoardPath(t *testing.T) {
	bd := NewBoard(boardTable, boardSource, boardReport())
	// Geometry identity: the path runs through the source, L1's two vertices 5 mm apart along +x,
	// the mirror, then along +y to the screen.
	want := []optics.PathNode{
		{PathMM: 0, At: r2.Vec{X: 50, Y: 100}}, {PathMM: 50, At: r2.Vec{X: 100, Y: 100}}, {PathMM: 55, At: r2.Vec{X: 105, Y: 100}},
		{PathMM: 150, At: r2.Vec{X: 200, Y: 100}}, {PathMM: 260, At: r2.Vec{X: 200, Y: 210}},
	}
	if len(bd.Path) != len(want) {
		t.Fatalf("path %v, want %v", bd.Path, want)
	}
	for i, w := range want {
		if bd.Path[i].PathMM != w.PathMM || !nearVec(bd.Path[i].At, w.At) {
			t.Errorf("node %d = %v, want %v", i, bd.Path[i], w)
		}
	}
	if bd.SourceDir != (r2.Vec{X: 1}) || bd.TailDir != (r2.Vec{Y: 1}) {
		t.Errorf("source direction %v, tail %v; want +x and +y", bd.SourceDir, bd.TailDir)
	}
	// Positions along the stretches (geometry identity): 120 mm is 65 mm past L1's last vertex;
	// 180 mm is 30 mm past the fold.
	fp := foldedPath{nodes: bd.Path, tailDir: bd.TailDir}
	if p := fp.at(2, 120); !nearVec(p, r2.Vec{X: 170, Y: 100}) {
		t.Errorf("path 120 mm is at %v, want {170 100}", p)
	}
	if p := fp.at(3, 180); !nearVec(p, r2.Vec{X: 200, Y: 130}) {
		t.Errorf("path 180 mm is at %v, want {200 130}", p)
	}
	if p := fp.at(4, 300); !nearVec(p, r2.Vec{X: 200, Y: 250}) {
		t.Errorf("path 300 mm (40 mm past the screen) is at %v, want {200 250}", p)
	}
}

func TestBoardBand(t *testing.T) {
	// One outline per stretch the samples (0 to 300 mm) cover: source-L1, inside L1, L1-M1, M1-S;
	// the 40 mm past the screen the path ends on are not drawn (optics.Report.DrawnSamples), but
	// are when the path ends on an element the beam runs on past.
	open := boardReport()
	open.Elements[len(open.Elements)-1].Type = optics.TypeAperture
	if n := len(NewBoard(boardTable, boardSource, open).Band); n != 5 {
		t.Errorf("%d band outlines with an open end, want 5", n)
	}
	bd := NewBoard(boardTable, boardSource, boardReport())
	if len(bd.Band) != 4 {
		t.Fatalf("%d band outlines, want 4", len(bd.Band))
	}
	// Geometry identity: a 1 mm band along +x from the source starts 1 mm to its left (+y) and
	// comes back 1 mm to its right; the first stretch (0 to 50 mm) holds the samples at 0, 25, 50.
	first := bd.Band[0]
	if len(first) != 6 || !nearVec(first[0], r2.Vec{X: 50, Y: 101}) || !nearVec(first[2], r2.Vec{X: 100, Y: 101}) ||
		!nearVec(first[3], r2.Vec{X: 100, Y: 99}) || !nearVec(first[5], r2.Vec{X: 50, Y: 99}) {
		t.Errorf("first outline %v, want (50, 101) .. (100, 101), (100, 99) .. (50, 99)", first)
	}
	// After the fold the beam runs along +y: its left is -x.
	fold := bd.Band[3]
	if !nearVec(fold[0], r2.Vec{X: 199, Y: 100}) || !nearVec(fold[len(fold)-1], r2.Vec{X: 201, Y: 100}) {
		t.Errorf("outline after the fold starts %v and ends %v, want (199, 100) and (201, 100)", fold[0], fold[len(fold)-1])
	}
	// Fewer than two usable samples give no band.
	r := boardReport()
	r.Beam.Samples = []optics.BeamSample{{PathMM: 0, WTMM: 1}, {PathMM: 10, WTMM: math.NaN()}}
	if got := NewBoard(boardTable, boardSource, r).Band; got != nil {
		t.Errorf("band from one usable sample: %v", got)
	}
}

func TestBoardElements(t *testing.T) {
	bd := NewBoard(boardTable, boardSource, boardReport())
	if len(bd.Elements) != 3 {
		t.Fatalf("%d board elements, want 3", len(bd.Elements))
	}
	l1, m1, s := bd.Elements[0], bd.Elements[1], bd.Elements[2]
	// Geometry identity: the lens's faces lie at its vertices, 5 mm apart along the beam; its
	// faces stand across the beam.
	if len(l1.Faces) != 2 || !nearVec(l1.Faces[0], r2.Vec{X: 100, Y: 100}) || !nearVec(l1.Faces[1], r2.Vec{X: 105, Y: 100}) {
		t.Errorf("L1 faces %v, want (100, 100) and (105, 100)", l1.Faces)
	}
	if l1.In != (r2.Vec{X: 1}) || l1.Across != (r2.Vec{Y: 1}) {
		t.Errorf("L1 in %v across %v, want +x and +y", l1.In, l1.Across)
	}
	// Law of reflection: the mirror's normal is parallel to d_out - d_in = (-1, 1), so its surface
	// runs along (1, 1)/√2.
	if h := math.Sqrt2 / 2; !nearVec(m1.Across, r2.Vec{X: -h, Y: -h}) {
		t.Errorf("M1 surface direction %v, want ±(1, 1)/√2", m1.Across)
	}
	if !nearVec(s.At, r2.Vec{X: 200, Y: 210}) || s.Across != (r2.Vec{X: -1}) {
		t.Errorf("S at %v across %v, want (200, 210) and -x", s.At, s.Across)
	}
}

func TestBoardMounts(t *testing.T) {
	bd := NewBoard(boardTable, boardSource, boardReport())
	// A mirror's mount turns with its surface: a square of side 40 at 135° stands as a diamond,
	// corners on the table axes through the post at 40/√2 (geometry identity).
	d := 40 / math.Sqrt2
	for _, c := range bd.Mounts[1].Corners {
		onX := near(c.Y, 100, posTolMM) && near(math.Abs(c.X-200), d, posTolMM)
		onY := near(c.X, 200, posTolMM) && near(math.Abs(c.Y-100), d, posTolMM)
		if !onX && !onY {
			t.Errorf("mirror mount corner %v is not on an axis through the post at %g mm", c, d)
		}
	}
	// A 40 x 20 mm mount heading +y: depth 20 along y, width 40 along x, centred on the post.
	lo, hi := r2.Vec{X: math.Inf(1), Y: math.Inf(1)}, r2.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, c := range bd.Mounts[2].Corners {
		lo = r2.Vec{X: math.Min(lo.X, c.X), Y: math.Min(lo.Y, c.Y)}
		hi = r2.Vec{X: math.Max(hi.X, c.X), Y: math.Max(hi.Y, c.Y)}
	}
	if !nearVec(lo, r2.Vec{X: 180, Y: 200}) || !nearVec(hi, r2.Vec{X: 220, Y: 220}) {
		t.Errorf("screen mount spans %v to %v, want (180, 200) to (220, 220)", lo, hi)
	}
	if bd.Mounts[0].Post != (r2.Vec{X: 102.5, Y: 100}) {
		t.Errorf("L1 post at %v, want its placement (102.5, 100)", bd.Mounts[0].Post)
	}
}

func TestBoardTable(t *testing.T) {
	imperial := optics.Table{Grid: optics.GridImperial1, WidthMM: 609.6, DepthMM: 304.8}
	noGrid := optics.Table{Grid: optics.GridNone, WidthMM: 600, DepthMM: 300}
	cases := []struct {
		name     string
		table    optics.Table
		holes    optics.HoleGrid // as the report has it
		known    bool
		columns  int
		radiusMM float64
	}{
		// Common practice: M6 holes (6 mm) on metric tables, 1/4-20 (1/4 in = 6.35 mm) on imperial ones.
		{"metric", boardTable, Holes(boardTable).HoleGrid, true, 24, 3},
		{"imperial", imperial, Holes(imperial).HoleGrid, true, 24, 3.175},
		{"no grid", noGrid, Holes(noGrid).HoleGrid, true, 0, 0},
		// A table without a size is not drawn, nor are holes a report may still name.
		{"no size", optics.Table{Grid: optics.GridMetric25}, Holes(boardTable).HoleGrid, false, 0, 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := boardReport()
			r.Holes = c.holes
			bd := NewBoard(c.table, boardSource, r)
			if bd.SizeKnown() != c.known || bd.Holes.Columns != c.columns || bd.HoleRadiusMM != c.radiusMM {
				t.Errorf("size known %v, %d columns, radius %g; want %v, %d, %g",
					bd.SizeKnown(), bd.Holes.Columns, bd.HoleRadiusMM, c.known, c.columns, c.radiusMM)
			}
		})
	}
}

func TestBoardWithoutElements(t *testing.T) {
	// A bench of no elements still has its source; a source that is not a finite position is
	// drawn at the origin heading +x.
	bd := NewBoard(boardTable, optics.Source{XMM: 10, YMM: 20, HeadingDeg: 90}, &optics.Report{})
	if len(bd.Path) != 1 || bd.Path[0].At != (r2.Vec{X: 10, Y: 20}) || bd.SourceDir != (r2.Vec{Y: 1}) || bd.TailDir != bd.SourceDir {
		t.Errorf("path %v, source direction %v, tail %v; want the source at (10, 20) heading +y", bd.Path, bd.SourceDir, bd.TailDir)
	}
	bd = NewBoard(boardTable, optics.Source{XMM: math.NaN()}, &optics.Report{})
	if bd.Path[0].At != (r2.Vec{}) || bd.SourceDir != (r2.Vec{X: 1}) {
		t.Errorf("non-finite source drawn at %v heading %v, want the origin and +x", bd.Path[0].At, bd.SourceDir)
	}
}
