package diagram

import (
	"strconv"
	"strings"
	"testing"
)

// TestThinLensArrows: a converging thin lens is drawn with arrowheads pointing outwards, a
// diverging one with them pointing inwards (a drawing convention of ours).
func TestThinLensArrows(t *testing.T) {
	for _, focal := range []float64{80, -80} {
		r := fixtureReport()
		for i := range r.Elements {
			if r.Elements[i].ID == "T1" {
				f := focal
				r.Elements[i].FocalMM = &f
			}
		}
		root := parseSVG(t, Side(r, SideOptions{}))
		lens := root.all(func(n xnode) bool { return n.XMLName.Local == "g" && n.attr("stroke") == "#2d5fa8" })
		if len(lens) != 1 {
			t.Fatalf("focal %g: %d thin-lens groups, want 1", focal, len(lens))
		}
		var line, head xnode
		for _, c := range lens[0].Children {
			switch c.XMLName.Local {
			case "line":
				line = c
			case "polyline":
				if head.XMLName.Local == "" {
					head = c // the upper arrowhead
				}
			}
		}
		top := line.num(t, "y1")
		// The head's middle point is the tip on the line's end; its wings lie below the tip
		// (larger y) when the head points up and out.
		wingY := headWingY(t, head.attr("points"))
		outwards := wingY > top
		if outwards != (focal > 0) {
			t.Errorf("focal %g: wing at y %.1f, line top at %.1f: arrow points the wrong way", focal, wingY, top)
		}
	}
}

func headWingY(t *testing.T, points string) float64 {
	t.Helper()
	first := strings.Fields(points)
	if len(first) == 0 {
		t.Fatalf("empty points %q", points)
	}
	xy := strings.Split(first[0], ",")
	if len(xy) != 2 {
		t.Fatalf("points %q", points)
	}
	y, err := strconv.ParseFloat(xy[1], 64)
	if err != nil {
		t.Fatal(err)
	}
	return y
}
