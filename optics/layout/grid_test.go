package layout

import (
	"testing"

	"raytable/optics"
)

func TestHoles(t *testing.T) {
	cases := []struct {
		name          string
		table         optics.Table
		pitch, offset float64
		thread        string
		columns, rows int
		lastX, lastY  float64
	}{
		// Common practice: metric breadboards, M6 on 25 mm, first hole 12.5 mm from the edges.
		{"metric 1200x600", optics.Table{Grid: optics.GridMetric25, WidthMM: 1200, DepthMM: 600}, 25, 12.5, "M6", 48, 24, 1187.5, 587.5},
		// Common practice: imperial breadboards, 1/4-20 on 1 in, first hole 0.5 in from the edges (48 x 24 in table).
		{"imperial 48x24 in", optics.Table{Grid: optics.GridImperial1, WidthMM: 1219.2, DepthMM: 609.6}, 25.4, 12.7, "1/4-20", 48, 24, 1206.5, 596.9},
		// A hole whose centre would fall on the far edge is not on the table.
		{"metric hole on the edge", optics.Table{Grid: optics.GridMetric25, WidthMM: 1012.5, DepthMM: 300}, 25, 12.5, "M6", 40, 12, 987.5, 287.5},
		// The table's hole_offset_mm overrides the default.
		{"metric offset 20", optics.Table{Grid: optics.GridMetric25, WidthMM: 1200, DepthMM: 600, HoleOffsetMM: f(20)}, 25, 20, "M6", 48, 24, 1195, 595},
		{"imperial offset 1 in", optics.Table{Grid: optics.GridImperial1, WidthMM: 609.6, DepthMM: 304.8, HoleOffsetMM: f(25.4)}, 25.4, 25.4, "1/4-20", 23, 11, 584.2, 279.4},
		{"no grid", optics.Table{Grid: optics.GridNone, WidthMM: 1200, DepthMM: 600}, 0, 0, "", 0, 0, 0, 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			g := Holes(c.table)
			if g.PitchMM != c.pitch || g.OffsetMM != c.offset || g.Thread != c.thread {
				t.Errorf("pitch %g offset %g thread %q, want %g %g %q", g.PitchMM, g.OffsetMM, g.Thread, c.pitch, c.offset, c.thread)
			}
			if g.Columns != c.columns || g.Rows != c.rows {
				t.Fatalf("%d x %d holes, want %d x %d", g.Columns, g.Rows, c.columns, c.rows)
			}
			if g.Columns == 0 {
				return
			}
			h := g.Hole(g.Columns, g.Rows)
			if !near(h.X, c.lastX, posTolMM) || !near(h.Y, c.lastY, posTolMM) {
				t.Errorf("last hole at (%g, %g), want (%g, %g)", h.X, h.Y, c.lastX, c.lastY)
			}
		})
	}
}

func TestNearestHole(t *testing.T) {
	metric := optics.Table{Grid: optics.GridMetric25, WidthMM: 1200, DepthMM: 600}
	imperial := optics.Table{Grid: optics.GridImperial1, WidthMM: 1219.2, DepthMM: 609.6}
	shifted := optics.Table{Grid: optics.GridMetric25, WidthMM: 1200, DepthMM: 600, HoleOffsetMM: f(20)}
	cases := []struct {
		name     string
		table    optics.Table
		x, y     float64
		col, row int
		hx, hy   float64
	}{
		// Metric, common practice grid: holes at 12.5 + 25 k.
		{"metric first hole", metric, 12.5, 12.5, 1, 1, 12.5, 12.5},
		{"metric front-left corner", metric, 0, 0, 1, 1, 12.5, 12.5},
		{"metric between holes", metric, 49, 30, 2, 2, 37.5, 37.5},
		{"metric back-right corner", metric, 1200, 600, 48, 24, 1187.5, 587.5},
		{"metric off the right edge", metric, 1500, 290, 48, 12, 1187.5, 287.5},
		// Imperial, common practice grid: holes at 12.7 + 25.4 k.
		{"imperial first hole", imperial, 12.7, 12.7, 1, 1, 12.7, 12.7},
		{"imperial between holes", imperial, 100, 200, 4, 8, 88.9, 190.5},
		{"imperial back-right corner", imperial, 1219.2, 609.6, 48, 24, 1206.5, 596.9},
		// The table's own offset moves the whole grid.
		{"shifted first hole", shifted, 20, 20, 1, 1, 20, 20},
		{"shifted between holes", shifted, 60, 31, 3, 1, 70, 20},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			col, row, hx, hy, ok := NearestHole(c.table, c.x, c.y)
			if !ok {
				t.Fatal("no hole found")
			}
			if col != c.col || row != c.row {
				t.Errorf("hole (%d, %d), want (%d, %d)", col, row, c.col, c.row)
			}
			if !near(hx, c.hx, posTolMM) || !near(hy, c.hy, posTolMM) {
				t.Errorf("hole at (%g, %g), want (%g, %g)", hx, hy, c.hx, c.hy)
			}
		})
	}
}

func TestNearestHoleNone(t *testing.T) {
	for _, tb := range []optics.Table{
		{Grid: optics.GridNone, WidthMM: 1200, DepthMM: 600},
		{Grid: optics.GridMetric25}, // no size: no holes
		{Grid: optics.GridMetric25, WidthMM: 1200, DepthMM: 600, HoleOffsetMM: f(-5)},
	} {
		if _, _, _, _, ok := NearestHole(tb, 100, 100); ok {
			t.Errorf("%+v: a hole was found on a table without holes", tb)
		}
	}
	if _, _, _, _, ok := NearestHole(table(), nan(), 1); ok {
		t.Error("NaN position found a hole")
	}
}
