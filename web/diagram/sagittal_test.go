package diagram

import "testing"

// TestSagittalBeamEdges: where a tilted curved mirror makes the beam's radius across the table
// differ from its radius in the table plane, the side view adds that radius as two dashed edges
// and says so in the legend; a round beam gets neither.
func TestSagittalBeamEdges(t *testing.T) {
	r := fixtureReport()
	root := parseSVG(t, Side(r, SideOptions{}))
	if n := len(root.byClass("beam-sagittal")); n != 0 || hasText(root, "across the table") {
		t.Fatalf("round beam: %d sagittal groups drawn", n)
	}
	for i := range r.Beam.Samples {
		if r.Beam.Samples[i].PathMM > 200 {
			r.Beam.Samples[i].WSMM = 1.5 * r.Beam.Samples[i].WTMM
		}
	}
	root = parseSVG(t, Side(r, SideOptions{}))
	groups := root.byClass("beam-sagittal")
	if len(groups) != 1 || root.count("beam-sagittal", "polyline") != 2 {
		t.Fatalf("astigmatic beam: %d sagittal groups, %d edges; want 1 and 2", len(groups), root.count("beam-sagittal", "polyline"))
	}
	if !hasText(root, "across the table") {
		t.Error("the legend does not name the dashed edges")
	}
}
