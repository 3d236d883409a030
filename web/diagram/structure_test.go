package diagram

import (
	"bytes"
	"fmt"
	"math"
	"strings"
	"testing"

	"raytable/optics"
)

func TestSideRaysAndStops(t *testing.T) {
	r := fixtureReport()
	root := parseSVG(t, Side(r, SideOptions{ShowParaxial: true}))
	stopped := 0
	for _, ray := range r.Rays {
		if ray.Status != optics.RayOK {
			stopped++
		}
	}
	if got := root.count("rays", "polyline"); got != len(r.Rays) {
		t.Errorf("ray polylines = %d, want one per ray = %d", got, len(r.Rays))
	}
	if got := root.count("paraxial", "polyline"); got != len(r.Rays) {
		t.Errorf("paraxial polylines = %d, want %d", got, len(r.Rays))
	}
	titles := root.count("rays", "title")
	if titles != stopped {
		t.Errorf("stop tooltips = %d, want one per stopped ray = %d", titles, stopped)
	}
	if got := root.count("rays", "path"); got != stopped {
		t.Errorf("stop markers = %d, want %d", got, stopped)
	}
	var tips []string
	for _, g := range root.byClass("rays") {
		for _, tt := range g.all(func(m xnode) bool { return m.XMLName.Local == "title" }) {
			tips = append(tips, tt.Text)
		}
	}
	want := "edge 632.8 nm clipped at A1: height 2.5 mm > semi-diameter 2 mm <iris>"
	if len(tips) == 0 || tips[0] != want {
		t.Errorf("first stop tooltip = %q, want %q", tips, want)
	}
	if got := root.count("waists", "line"); got != len(r.Beam.Waists) {
		t.Errorf("waist ticks = %d, want %d", got, len(r.Beam.Waists))
	}
	if !hasText(root, "waist 40 µm") || !hasText(root, "waist 120 µm") {
		t.Errorf("waist labels missing from %q", root.texts())
	}
	for _, nm := range r.WavelengthsNM {
		if !hasText(root, fmtNum(nm)+" nm") {
			t.Errorf("legend lacks %g nm", nm)
		}
	}
}

func TestSideRayPointsFollowReport(t *testing.T) {
	// The first ray's polyline must pass through its hits at z = face path + z offset: the side
	// view scale maps z and y linearly, so the pixel differences of two hits recover the mm ones.
	r := fixtureReport()
	f := newSideFrame(r, SideOptions{})
	xs, ys := rayPoints(f, newFaceIndex(r), &r.Rays[0])
	if len(xs) != len(r.Rays[0].Hits)+1 { // start and hits; no run-out after the fixture's dump
		t.Fatalf("points = %d for %d hits", len(xs), len(r.Rays[0].Hits))
	}
	const tolMM = 1e-9 // arithmetic only
	h0, h1 := r.Rays[0].Hits[0], r.Rays[0].Hits[1]
	dzMM := (xs[2] - xs[1]) * f.mmPerPX
	wantDZ := (55 + h1.Exact.ZMM) - (50 + h0.Exact.ZMM)
	if math.Abs(dzMM-wantDZ) > tolMM {
		t.Errorf("z step between the lens faces = %g mm, want %g", dzMM, wantDZ)
	}
	dyMM := -(ys[2] - ys[1]) * f.mmPerPX / f.exag
	if math.Abs(dyMM-(h1.Exact.YMM-h0.Exact.YMM)) > tolMM {
		t.Errorf("y step = %g mm, want %g", dyMM, h1.Exact.YMM-h0.Exact.YMM)
	}
}

func TestSideRunOut(t *testing.T) {
	// A ray that runs through ends a run-out past its last hit along its last direction; one that
	// ends at a dump does not.
	r := fixtureReport()
	r.Elements = r.Elements[:5] // drop the dump: the screen is last and rays run on
	ray := fixtureRay("through", 632.8, 1, optics.RayOK, "SC", "")
	ray.StoppedAt = ""
	f := newSideFrame(r, SideOptions{})
	xs, ys := rayPoints(f, newFaceIndex(r), &ray)
	if len(xs) != len(ray.Hits)+2 {
		t.Fatalf("points = %d, want start + %d hits + run-out", len(xs), len(ray.Hits))
	}
	last := ray.Hits[len(ray.Hits)-1].Exact
	n := len(xs) - 1
	slope := -(ys[n] - ys[n-1]) / f.exag / (xs[n] - xs[n-1])
	if want := last.Dir[1] / last.Dir[2]; math.Abs(slope-want) > 1e-9 {
		t.Errorf("run-out slope = %g, want dir y/z = %g", slope, want)
	}
	withDump := fixtureReport()
	g := newSideFrame(withDump, SideOptions{})
	xs, _ = rayPoints(g, newFaceIndex(withDump), &withDump.Rays[0])
	if len(xs) != len(withDump.Rays[0].Hits)+1 {
		t.Errorf("a ray ending at a dump has %d points, want start + hits = %d", len(xs), len(withDump.Rays[0].Hits)+1)
	}
}

func TestSideRayLimit(t *testing.T) {
	r := fixtureReport()
	var many []optics.Ray
	for k := range 1000 {
		ray := fixtureRay(fmt.Sprintf("r%d", k), 632.8, -3+6*float64(k)/999, optics.RayOK, "", "")
		if k%100 == 0 {
			ray = fixtureRay(fmt.Sprintf("r%d", k), 632.8, 3, optics.RayClipped, "A1", "cut")
		}
		many = append(many, ray)
	}
	r.Rays = many
	out := Side(r, SideOptions{})
	root := parseSVG(t, out)
	if got := root.count("rays", "polyline"); got != maxSideRays {
		t.Errorf("drawn rays = %d, want the limit %d", got, maxSideRays)
	}
	if got := root.count("rays", "title"); got != 10 {
		t.Errorf("stopped rays drawn = %d, want all 10 (they are kept first)", got)
	}
	if !hasText(root, fmt.Sprintf("showing %d of 1000 rays", maxSideRays)) {
		t.Error("the drawing does not say how many rays it shows")
	}
	if len(out) > 80_000 {
		t.Errorf("side view with 1000 rays is %d bytes, over the 80 KB budget", len(out))
	}
}

func TestSideExaggerationStated(t *testing.T) {
	r := fixtureReport()
	for _, c := range []struct {
		exag   float64
		stated bool
	}{{0, false}, {1, false}, {0.5, false}, {3, true}} {
		root := parseSVG(t, Side(r, SideOptions{Exaggeration: c.exag}))
		found := false
		for _, s := range root.texts() {
			if strings.HasPrefix(s, "vertical exaggeration ×") {
				found = true
			}
		}
		if found != c.stated {
			t.Errorf("exaggeration %g: stated = %v, want %v", c.exag, found, c.stated)
		}
	}
}

func TestSideSharedScale(t *testing.T) {
	// Two drawings given the same MMPerPX and ZMaxMM put z = 0 and the scale bar at the same
	// pixels, whatever their own lengths (what the compare page relies on).
	a := fixtureReport()
	b := fixtureReport()
	b.Elements = b.Elements[:3]
	o := SideOptions{ZMaxMM: math.Max(PathLengthMM(a), PathLengthMM(b))}
	o.MMPerPX = math.Max(SideMMPerPX(a, o), SideMMPerPX(b, o))
	fa, fb := newSideFrame(a, o), newSideFrame(b, o)
	if fa.x(0) != fb.x(0) || fa.x(100) != fb.x(100) {
		t.Errorf("shared scale: z=0 at %g and %g px, z=100 at %g and %g px", fa.x(0), fb.x(0), fa.x(100), fb.x(100))
	}
	ta, tb := parseSVG(t, Side(a, o)).texts(), parseSVG(t, Side(b, o)).texts()
	if !hasScaleText(ta) || !hasScaleText(tb) {
		t.Fatal("scale bar text missing")
	}
}

func hasScaleText(texts []string) bool {
	for _, s := range texts {
		if strings.HasSuffix(s, " mm") && !strings.HasPrefix(s, "waist") {
			return true
		}
	}
	return false
}

func TestTableHoles(t *testing.T) {
	// Common practice: metric breadboards have holes every 25 mm starting 12.5 mm from the front
	// and left edges, imperial ones every 1 in (25.4 mm) starting 0.5 in; a hole centre must lie
	// strictly inside the table. Counts are floor((size - offset) / pitch) + 1 less any hole on the
	// far edge.
	cases := []struct {
		name       string
		table      optics.Table
		cols, rows int
	}{
		{"metric 600x300", optics.Table{Grid: optics.GridMetric25, WidthMM: 600, DepthMM: 300}, 24, 12},
		{"metric 900x600", optics.Table{Grid: optics.GridMetric25, WidthMM: 900, DepthMM: 600}, 36, 24},
		{"imperial 24x12 in", optics.Table{Grid: optics.GridImperial1, WidthMM: 609.6, DepthMM: 304.8}, 24, 12},
		{"metric offset 25 (far-edge hole dropped)", optics.Table{Grid: optics.GridMetric25, WidthMM: 600, DepthMM: 300, HoleOffsetMM: fp(25)}, 23, 11},
		{"no grid", optics.Table{Grid: optics.GridNone, WidthMM: 600, DepthMM: 300}, 0, 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			b := fixtureBench()
			b.Table = c.table
			for _, out := range [][]byte{Table(b, fixtureReport(), TableOptions{}), Plan(b, fixtureReport())} {
				root := parseSVG(t, out)
				if got := root.count("holes", "circle"); got != c.cols*c.rows {
					t.Errorf("hole circles = %d, want %d x %d = %d", got, c.cols, c.rows, c.cols*c.rows)
				}
			}
		})
	}
}

func TestTableHolePositions(t *testing.T) {
	// The front-left hole of a metric table sits 12.5 mm from both edges (common practice); with
	// the front edge at the bottom its centre is 12.5 mm above the table's bottom edge in the plan.
	b := fixtureBench()
	root := parseSVG(t, Plan(b, fixtureReport()))
	holes := root.byClass("holes")[0].Children
	var table xnode
	for _, r := range root.all(func(m xnode) bool { return m.XMLName.Local == "rect" && m.attr("fill") == "#f3f3ee" }) {
		table = r
	}
	left, bottom := table.num(t, "x"), table.num(t, "y")+table.num(t, "height")
	first := holes[0]   // row 1, column 1: drawn first
	const tolMM = 0.005 // two decimals in the plan
	if dx := first.num(t, "cx") - left; math.Abs(dx-12.5) > tolMM {
		t.Errorf("first hole %g mm from the left edge, want 12.5", dx)
	}
	if dy := bottom - first.num(t, "cy"); math.Abs(dy-12.5) > tolMM {
		t.Errorf("first hole %g mm from the front edge, want 12.5", dy)
	}
	if w := table.num(t, "width"); math.Abs(w-600) > tolMM {
		t.Errorf("table drawn %g mm wide, want 600", w)
	}
}

func TestTableMountsAndWarnings(t *testing.T) {
	b, r := fixtureBench(), fixtureReport()
	root := parseSVG(t, Table(b, r, TableOptions{}))
	mounts := root.byClass("mounts")[0].Children
	if len(mounts) != len(r.Placement) {
		t.Fatalf("footprints = %d, want one per placement = %d", len(mounts), len(r.Placement))
	}
	var red []int
	for i, m := range mounts {
		if m.attr("stroke") == "#c62828" {
			red = append(red, i)
		}
	}
	// The fixture's mounts-overlap warning names SC (element) and D (in its message): placements 4, 5.
	if fmt.Sprint(red) != "[4 5]" {
		t.Errorf("red footprints at %v, want [4 5] (SC and D)", red)
	}
	// Markers: warnings 1 (SC) and 2 (A1) have elements; 3 has none and is only in the legend.
	if got := root.count("warning-markers", "circle"); got != 2 {
		t.Errorf("warning markers = %d, want 2", got)
	}
	for _, want := range []string{"1.", "2.", "3.", "rays-clipped: 1 ray is cut by A1 <iris> & more"} {
		if !hasText(root, want) {
			t.Errorf("legend lacks %q", want)
		}
	}
	if pts := strings.Fields(mounts[2].attr("points")); len(pts) != 4 {
		t.Errorf("mirror footprint points %q, want 4 corners", mounts[2].attr("points"))
	}
}

func TestMirrorFootprintTurns(t *testing.T) {
	// A mirror's mount turns with its surface: a +x to +y fold has its normal at 135°, so a square
	// footprint of side s stands as a diamond, corners on the table axes through the post at
	// s/sqrt(2) (geometry).
	const side, tol = 40.0, 1e-9
	c := footprint(optics.Placement{TableXMM: 200, TableYMM: 100, HeadingDeg: 135, MountWidthMM: side, MountDepthMM: side})
	d := side / math.Sqrt2
	want := map[vec]bool{{200 - d, 100}: true, {200 + d, 100}: true, {200, 100 - d}: true, {200, 100 + d}: true}
	for _, v := range c {
		found := false
		for w := range want {
			if math.Abs(v.x-w.x) < tol && math.Abs(v.y-w.y) < tol {
				found = true
			}
		}
		if !found {
			t.Errorf("corner %v is not on an axis through the post at %g mm", v, d)
		}
	}
}

func TestFootprintGeometry(t *testing.T) {
	// A 40 x 20 mm mount heading 90° (+y): depth 20 along y, width 40 along x (geometry).
	c := footprint(optics.Placement{TableXMM: 100, TableYMM: 50, HeadingDeg: 90, MountWidthMM: 40, MountDepthMM: 20})
	minX, maxX, minY, maxY := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, v := range c {
		minX, maxX = math.Min(minX, v.x), math.Max(maxX, v.x)
		minY, maxY = math.Min(minY, v.y), math.Max(maxY, v.y)
	}
	const tol = 1e-9
	if math.Abs(maxX-minX-40) > tol || math.Abs(maxY-minY-20) > tol || math.Abs((minX+maxX)/2-100) > tol || math.Abs((minY+maxY)/2-50) > tol {
		t.Errorf("footprint spans x [%g, %g], y [%g, %g]; want x [80, 120], y [40, 60]", minX, maxX, minY, maxY)
	}
}

func TestFoldedPathBands(t *testing.T) {
	// Along the fixture's first stretch (+x at y = 100) the band is ±w around the path; after the
	// 90° fold at M1 (path 150) it runs along +y at x = 200.
	b, r := fixtureBench(), fixtureReport()
	fp := newFoldedPath(b, r)
	p := fp.at(fp.segment(120), 120)
	if p != (vec{170, 100}) {
		t.Errorf("path 120 mm is at %v, want {170 100}", p)
	}
	q := fp.at(fp.segment(180), 180)
	if math.Abs(q.x-200) > 1e-9 || math.Abs(q.y-130) > 1e-9 {
		t.Errorf("path 180 mm is at %v, want {200 130}", q)
	}
	bands := fp.bands(r.Beam.Samples)
	if len(bands) == 0 {
		t.Fatal("no bands")
	}
	first := bands[0] // source to L1 first face: w = 1 mm from the fixture
	if first[0] != (vec{50, 101}) {
		t.Errorf("band starts at %v, want {50 101} (1 mm left of the source)", first[0])
	}
}

func TestPlanIsTrueSize(t *testing.T) {
	b, r := fixtureBench(), fixtureReport()
	root := parseSVG(t, Plan(b, r))
	w, h := root.attr("width"), root.attr("height")
	if !strings.HasSuffix(w, "mm") || !strings.HasSuffix(h, "mm") {
		t.Fatalf("width %q height %q: want millimetres", w, h)
	}
	// SVG 1.1 §7.7: with viewBox "0 0 W H" on a W mm x H mm viewport one user unit is one mm.
	vb := strings.Fields(root.attr("viewBox"))
	if len(vb) != 4 || vb[0] != "0" || vb[1] != "0" || vb[2]+"mm" != w || vb[3]+"mm" != h {
		t.Errorf("viewBox %q does not match width %q height %q", root.attr("viewBox"), w, h)
	}
	bars := root.byClass("check-bar")
	if len(bars) != 1 {
		t.Fatalf("check bars = %d, want 1", len(bars))
	}
	if got := bars[0].num(t, "width"); got != 100 {
		t.Errorf("check bar is %g user units long, want 100 (= 100 mm)", got)
	}
	if !hasText(root, CheckBarLabel) {
		t.Error("check bar label missing")
	}
	var caution []string
	for _, g := range root.byClass("cautions-text") {
		for _, c := range g.Children {
			caution = append(caution, c.Text)
		}
	}
	if strings.Join(caution, " ") != LaserCaution {
		t.Errorf("cautions box reads %q", strings.Join(caution, " "))
	}
	for _, p := range r.Placement {
		if !hasText(root, p.ID) {
			t.Errorf("post %s not labelled", p.ID)
		}
	}
	// Hole numbering: columns 1..24 and rows 1..12 of the 600 x 300 metric table (common practice
	// grid, see TestTableHoles), one number each.
	var numbers []string
	for _, g := range root.byClass("hole-numbers") {
		for _, c := range g.Children {
			numbers = append(numbers, c.Text)
		}
	}
	if len(numbers) != 24+12 || numbers[0] != "1" || numbers[23] != "24" || numbers[35] != "12" {
		t.Errorf("hole numbers %q, want 1..24 then 1..12", numbers)
	}
}

func TestEscaping(t *testing.T) {
	// Titles and ids are user input: '<' and '&' must reach the reader as typed, escaped exactly
	// once in the document.
	r := fixtureReport()
	r.Title = `a<b & "c"`
	r.Elements[0].ID = "L<1>"
	b := fixtureBench()
	b.Title = r.Title
	for name, out := range map[string][]byte{
		"side":  Side(r, SideOptions{}),
		"table": Table(b, r, TableOptions{}),
		"plan":  Plan(b, r),
	} {
		root := parseSVG(t, out)
		if !strings.Contains(root.attr("aria-label"), `a<b & "c"`) {
			t.Errorf("%s: aria-label %q", name, root.attr("aria-label"))
		}
		titles := root.all(func(m xnode) bool { return m.XMLName.Local == "title" })
		if len(titles) == 0 || !strings.HasSuffix(titles[0].Text, `: a<b & "c"`) {
			t.Errorf("%s: document title %q", name, titles[0].Text)
		}
		if bytes.Contains(out, []byte("&amp;lt;")) || bytes.Contains(out, []byte("<b &")) {
			t.Errorf("%s: text escaped twice or not at all", name)
		}
		if name == "side" && !hasText(root, "L<1>") {
			t.Errorf("%s: element label L<1> not drawn as typed", name)
		}
	}
}

func TestNoNonFiniteNumbers(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	r := fixtureReport()
	r.Rays[0].Hits[2].Exact.YMM = nan
	r.Rays[1].Hits[1].Exact.Dir = [3]float64{0, inf, 1}
	r.Rays[2].Start.YMM = inf
	r.Beam.Samples[3].WTMM = inf
	r.Beam.Samples[4].PathMM = nan
	r.Elements[1].SemiDiameterMM = fp(nan)
	r.Elements[2].Faces[0].RadiusMM = fp(inf)
	r.Elements[3].TableXMM = nan
	r.Placement[0].HeadingDeg = nan
	r.Placement[1].MountWidthMM = inf
	w := nan
	r.Beam.Waists[0].RadiusTMM = &w
	r.WavelengthsNM = append(r.WavelengthsNM, nan)
	b := fixtureBench()
	b.Table.HoleOffsetMM = fp(nan)
	for name, out := range map[string][]byte{
		"side":     Side(r, SideOptions{Exaggeration: nan, MMPerPX: nan, ZMaxMM: inf}),
		"table":    Table(b, r, TableOptions{MMPerPX: inf}),
		"plan":     Plan(b, r),
		"paraxial": Side(r, SideOptions{ShowParaxial: true}),
	} {
		parseSVG(t, out)
		for _, bad := range []string{"NaN", "Inf"} {
			if bytes.Contains(out, []byte(bad)) {
				t.Errorf("%s contains %s", name, bad)
			}
		}
	}
}

func TestEmptyInputs(t *testing.T) {
	unlimited := fixtureReport()
	for i := range unlimited.Elements {
		unlimited.Elements[i].SemiDiameterMM = nil
		for k := range unlimited.Elements[i].Faces {
			unlimited.Elements[i].Faces[k].SemiDiameterMM = nil
		}
	}
	noRays := fixtureReport()
	noRays.Rays, noRays.Beam = nil, nil
	cases := map[string][]byte{
		"side nil":           Side(nil, SideOptions{}),
		"table nil":          Table(nil, nil, TableOptions{}),
		"plan nil":           Plan(nil, nil),
		"side empty":         Side(&optics.Report{}, SideOptions{ShowParaxial: true, Exaggeration: 10}),
		"table no bench":     Table(nil, fixtureReport(), TableOptions{}),
		"plan no table size": Plan(&optics.Bench{}, fixtureReport()),
		"side unlimited":     Side(unlimited, SideOptions{}),
		"table unlimited":    Table(fixtureBench(), unlimited, TableOptions{}),
		"side no rays":       Side(noRays, SideOptions{ShowParaxial: true}),
		"table no rays":      Table(fixtureBench(), noRays, TableOptions{}),
	}
	for name, out := range cases {
		parseSVG(t, out)
		if len(out) == 0 {
			t.Errorf("%s: empty output", name)
		}
	}
	// Unlimited elements are drawn with a nominal size from the rays: the lens outline exists.
	root := parseSVG(t, cases["side unlimited"])
	if got := root.count("elements", "polygon"); got != 1 {
		t.Errorf("unlimited lens outlines = %d, want 1", got)
	}
}

func TestNiceLength(t *testing.T) {
	// Scale bars use 1-2-5 steps (common practice for chart scales).
	for _, c := range []struct{ in, want float64 }{{37, 20}, {100, 100}, {0.3, 0.2}, {9.99, 5}, {1, 1}, {0, 1}} {
		if got := niceLength(c.in); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("niceLength(%g) = %g, want %g", c.in, got, c.want)
		}
	}
}

func TestWrap(t *testing.T) {
	lines := wrap("aaa bbb ccc dddddddddd e", 7)
	want := []string{"aaa bbb", "ccc", "ddddddd", "ddd e"}
	if fmt.Sprint(lines) != fmt.Sprint(want) {
		t.Errorf("wrap = %q, want %q", lines, want)
	}
	if strings.Join(wrap(LaserCaution, 60), " ") != LaserCaution {
		t.Error("wrapping loses words")
	}
}
