package diagram

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"raytable/optics"
)

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
			r := fixtureReport()
			r.Holes = holesFor(c.table)
			for _, out := range [][]byte{Table(boarded(b, r), TableOptions{}), Plan(boarded(b, r))} {
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
	root := parseSVG(t, Plan(boarded(b, fixtureReport())))
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
	root := parseSVG(t, Table(boarded(b, r), TableOptions{}))
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
	// The fixture's mounts-overlap warning names SC and D (placements 4, 5).
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

func TestPlanIsTrueSize(t *testing.T) {
	b, r := fixtureBench(), fixtureReport()
	root := parseSVG(t, Plan(boarded(b, r)))
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
	if strings.Join(caution, " ") != optics.CautionText() {
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

// TestMountInBeamFlagsOnlyTheMount: a mount in the beam is outlined; the elements the beam runs
// between, named in the message, are not.
func TestMountInBeamFlagsOnlyTheMount(t *testing.T) {
	b, r := fixtureBench(), fixtureReport()
	r.Warnings = []optics.Warning{{Code: "mount-in-beam", Element: "T1", Message: "the beam from SC to D passes through the mount of T1"}}
	root := parseSVG(t, Table(boarded(b, r), TableOptions{}))
	var red []int
	for i, m := range root.byClass("mounts")[0].Children {
		if m.attr("stroke") == "#c62828" {
			red = append(red, i)
		}
	}
	if fmt.Sprint(red) != "[3]" {
		t.Errorf("red footprints at %v, want [3] (T1 only)", red)
	}
}
