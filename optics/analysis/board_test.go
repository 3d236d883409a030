package analysis

import (
	"bytes"
	"encoding/json"
	"testing"

	"raytable/optics/internal/approx"
)

// TestDemoBoard: the analysis lays out the board from the report it computed, once, and keeps it
// out of the report's JSON.
func TestDemoBoard(t *testing.T) {
	b := loadDemo(t)
	r, err := Run(b)
	if err != nil {
		t.Fatal(err)
	}
	bd := r.Board
	if bd == nil {
		t.Fatal("no board")
	}
	if len(bd.Elements) != len(r.Elements) || len(bd.Mounts) != len(r.Placement) {
		t.Fatalf("%d board elements and %d mounts for %d elements and %d placements",
			len(bd.Elements), len(bd.Mounts), len(r.Elements), len(r.Placement))
	}
	if bd.WidthMM != b.Table.WidthMM || bd.DepthMM != b.Table.DepthMM || bd.Holes != r.Holes {
		t.Errorf("board table %g x %g holes %+v, want the bench's %g x %g and the report's %+v",
			bd.WidthMM, bd.DepthMM, bd.Holes, b.Table.WidthMM, b.Table.DepthMM, r.Holes)
	}
	if at := bd.Path[0].At; at.X != b.Source.XMM || at.Y != b.Source.YMM {
		t.Errorf("path starts at %v, want the source (%g, %g)", at, b.Source.XMM, b.Source.YMM)
	}
	// Geometry identity: a footprint's corners average to its post, the placement's position.
	for i, m := range bd.Mounts {
		var cx, cy float64
		for _, c := range m.Corners {
			cx, cy = cx+c.X/4, cy+c.Y/4
		}
		p := r.Placement[i]
		if !approx.Mixed(cx, p.TableXMM, approx.VeryClose) || !approx.Mixed(cy, p.TableYMM, approx.VeryClose) {
			t.Errorf("%s: footprint centred on (%g, %g), post at (%g, %g)", p.ID, cx, cy, p.TableXMM, p.TableYMM)
		}
	}
	with, err := json.Marshal(r)
	if err != nil {
		t.Fatal(err)
	}
	r.Board = nil
	without, _ := json.Marshal(r)
	if !bytes.Equal(with, without) {
		t.Error("the board shows in the report's JSON")
	}
}
