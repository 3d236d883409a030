package diagram

import (
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/optics/benchtest"
)

// TestEveryKindIsDrawn keeps the drawings in step with the kind table (DEVELOPERS.md, 'Adding an
// element kind'): a bench with one default element of every type in optics.Kinds is drawn in the
// side view and on the table without the grey stroke that stands in for a type with no drawing.
func TestEveryKindIsDrawn(t *testing.T) {
	b := benchtest.Load(t, "demo-bench.json")
	b.Elements = nil
	for _, k := range optics.Kinds {
		if _, err := optics.AddElement(b, k.Type, len(b.Elements)); err != nil {
			t.Fatal(err)
		}
		if _, ok := sideDrawings[k.Type]; !ok {
			t.Errorf("type %s has no side-view drawing", k.Type)
		}
	}
	r, err := analysis.Run(b)
	if err != nil {
		t.Fatal(err)
	}
	const fallback = `stroke="#888888"`
	if s := string(Side(r, SideOptions{})); strings.Contains(s, fallback) {
		t.Error("the side view draws some type with the stand-in stroke")
	}
	if s := string(Table(r, TableOptions{})); strings.Contains(s, fallback) {
		t.Error("the table view draws some type with the stand-in stroke")
	}
}
