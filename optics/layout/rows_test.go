package layout

import (
	"slices"
	"testing"

	"raytable/optics"
)

func TestPlacementRows(t *testing.T) {
	ps := []optics.Placement{
		{ID: "L1", Type: "thin-lens", TableXMM: 115, TableYMM: 60.004, HeadingDeg: 0, HoleColumn: 5, HoleRow: 3, OffsetXMM: 2.5, OffsetYMM: -2.5},
		// Common practice against spreadsheet formula injection: a text cell starting with = + - @
		// (or tab, carriage return) is prefixed with a single quote.
		{ID: "=HYPERLINK(\"x\")", Type: "+mirror", TableXMM: 1, TableYMM: 2, HeadingDeg: 135, HoleColumn: 1, HoleRow: 1, OffsetXMM: -1e-9},
		{ID: "-2+3", Type: "@SUM(A1)", HoleColumn: 0},
		{ID: "\tcmd", Type: "dump", HoleColumn: 0},
	}
	want := [][]string{
		{"id", "type", "x_mm", "y_mm", "heading_deg", "hole_column", "hole_row", "offset_x_mm", "offset_y_mm"},
		{"L1", "thin-lens", "115.00", "60.00", "0.00", "5", "3", "2.50", "-2.50"},
		{"'=HYPERLINK(\"x\")", "'+mirror", "1.00", "2.00", "135.00", "1", "1", "0.00", "0.00"},
		{"'-2+3", "'@SUM(A1)", "0.00", "0.00", "0.00", "", "", "", ""},
		{"'\tcmd", "dump", "0.00", "0.00", "0.00", "", "", "", ""},
	}
	got := PlacementRows(ps)
	if len(got) != len(want) {
		t.Fatalf("%d rows, want %d", len(got), len(want))
	}
	for i := range want {
		if !slices.Equal(got[i], want[i]) {
			t.Errorf("row %d\n got %q\nwant %q", i, got[i], want[i])
		}
	}
	// The header is a copy: changing a result does not change the next call.
	got[0][0] = "changed"
	if PlacementRows(nil)[0][0] != "id" {
		t.Error("PlacementRows shares its header")
	}
}
