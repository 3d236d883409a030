package diagram

import (
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// armsReport is the fixture report with a branch added by hand, as the analysis fills it for a
// splitter (ARMS.md): a reflected arm turning up the table from the second element with a mirror
// of its own, ending open, and a meeting at the mirror with a path difference of 0.5 mm.
func armsReport() *optics.Report {
	r := boarded(fixtureBench(), fixtureReport())
	bd := r.Board
	at := bd.Path[2].At // the arm leaves the main line at its third node
	up := r2.Vec{Y: 1}
	m := r2.Add(at, r2.Scale(80, up))
	parent := "main"
	opd := 0.5
	r.Arms = []optics.ArmReport{
		{ID: "main", Source: "source", Elements: r.Elements},
		{ID: "BS1.reflected", Parent: &parent, Source: "source", WavelengthsNM: []float64{532},
			Elements: []optics.ElementPlace{{ID: "MX", Type: optics.TypeMirror}}, Ends: optics.ArmOpen},
	}
	bd.Arms = []optics.BoardArm{
		{ID: "main", Path: bd.Path, Elements: bd.Elements},
		{ID: "BS1.reflected", Path: append(append([]optics.PathNode{}, bd.Path[:3]...), optics.PathNode{At: m}), TailDir: r2.Vec{X: 1},
			Elements: []optics.BoardElement{{At: m, In: up, Across: r2.Vec{X: 1, Y: -1}}}, Open: true},
	}
	r.Meetings = []optics.Meeting{{Part: "MX", Arms: []string{"main", "BS1.reflected"}, OPDMM: &opd, TableXMM: m.X, TableYMM: m.Y}}
	return r
}

func TestTableDrawsArms(t *testing.T) {
	root := parseSVG(t, Table(armsReport(), TableOptions{}))
	arms := root.byClass("arm")
	if len(arms) != 1 || arms[0].attr("data-arm") != "BS1.reflected" {
		t.Fatalf("drawn arms %d, want the reflected one", len(arms))
	}
	if n := root.count("arm-elements", "polyline"); n != 1 {
		t.Errorf("the arm's own mirror is drawn %d times, want once", n)
	}
	if path := arms[0].Children; len(path) == 0 {
		t.Fatal("the arm draws nothing")
	}
	green := 0
	for _, pl := range root.byClass("beam-path") {
		if pl.attr("stroke") != WavelengthColor(532) {
			continue
		}
		green++
		if n := strings.Count(pl.attr("points"), ","); n != 2 {
			t.Errorf("the arm's path has %d points; want 2, its own stretch from where it branches", n)
		}
	}
	if green != 1 {
		t.Errorf("%d paths in the arm's colour, want 1", green)
	}
	if len(root.byClass("stray-beam")) != 1 {
		t.Error("the open port is not drawn running on")
	}
	meetings := root.byClass("meeting")
	if len(meetings) != 1 || meetings[0].attr("data-part") != "MX" {
		t.Fatalf("meeting marks: %d", len(meetings))
	}
	out := string(Table(armsReport(), TableOptions{}))
	for _, want := range []string{"ΔOPL 0.5 mm", "open port", ">MX<"} {
		if !strings.Contains(out, want) {
			t.Errorf("the drawing does not say %q", want)
		}
	}
}

// TestTableWithoutArmsIsUnchanged: a report without arms (every v1 bench) draws no arm group,
// stray beam or meeting.
func TestTableWithoutArmsIsUnchanged(t *testing.T) {
	out := string(Table(boarded(fixtureBench(), fixtureReport()), TableOptions{}))
	for _, class := range []string{`class="arms"`, `class="arm-elements"`, `class="meetings"`, `stray-beam`} {
		if strings.Contains(out, class) {
			t.Errorf("a report without arms draws %s", class)
		}
	}
}
