package diagram

import (
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
	// ends at a dump, or at the screen the path ends on, does not (README, The web page: the
	// drawings stop where the light does).
	r := fixtureReport()
	r.Elements = r.Elements[:5] // drop the dump: the screen is last
	ray := fixtureRay("through", 632.8, 1, optics.RayOK, "SC", "")
	ray.StoppedAt = ""
	f := newSideFrame(r, SideOptions{})
	if xs, _ := rayPoints(f, newFaceIndex(r), &ray); len(xs) != len(ray.Hits)+1 {
		t.Errorf("a ray ending on the last screen has %d points, want start + hits = %d", len(xs), len(ray.Hits)+1)
	}
	r.Elements[4].Type = optics.TypeAperture // an open end: the beam runs on past it
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
