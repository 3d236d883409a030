package layout

import (
	"math"

	"raytable/optics"
)

// Grid is a breadboard's hole pattern as the report carries it (holes every PitchMM in both
// directions, the first one OffsetMM from the front and the left edge, Columns across the width
// and Rows along the depth, every hole centre strictly inside the table), with the hole geometry
// built on it; a hole's centre is optics.HoleGrid.Hole.
type Grid struct{ optics.HoleGrid }

// Common practice for optical breadboards: metric tables have M6 holes on a 25 mm pitch, imperial
// ones 1/4-20 holes on a 1 in pitch, and the first hole sits half a pitch from the front and left
// edges (12.5 mm, 0.5 in) so that tables butted together continue the grid.
const (
	metricPitchMM    = 25
	metricOffsetMM   = 12.5
	imperialPitchMM  = 25.4
	imperialOffsetMM = 12.7
)

// Hole radii: half the nominal diameter of the thread (common practice: M6 is 6 mm, 1/4-20 is
// 1/4 in = 6.35 mm).
const (
	metricHoleRadiusMM   = 3.0
	imperialHoleRadiusMM = 3.175
)

// holeRadiusMM is the radius of the holes of a grid kind; 0 for a table without a known grid.
func holeRadiusMM(kind string) float64 {
	switch kind {
	case optics.GridMetric25:
		return metricHoleRadiusMM
	case optics.GridImperial1:
		return imperialHoleRadiusMM
	}
	return 0
}

// Holes describes the hole grid of a table; a table without a grid (or with an unknown grid name,
// or without a usable size) has no columns and no rows.
func Holes(t optics.Table) Grid {
	g := Grid{optics.HoleGrid{Kind: t.Grid}}
	switch t.Grid {
	case optics.GridMetric25:
		g.Thread, g.PitchMM, g.OffsetMM = "M6", metricPitchMM, metricOffsetMM
	case optics.GridImperial1:
		g.Thread, g.PitchMM, g.OffsetMM = "1/4-20", imperialPitchMM, imperialOffsetMM
	default:
		return g
	}
	if t.HoleOffsetMM != nil {
		g.OffsetMM = *t.HoleOffsetMM
	}
	g.Columns = holeCount(t.WidthMM, g.OffsetMM, g.PitchMM)
	g.Rows = holeCount(t.DepthMM, g.OffsetMM, g.PitchMM)
	return g
}

// holeCount counts holes at offset, offset+pitch, ... whose centres lie strictly inside (0, size).
func holeCount(sizeMM, offsetMM, pitchMM float64) int {
	if !finite(sizeMM) || !finite(offsetMM) || !(pitchMM > 0) || offsetMM <= 0 || offsetMM >= sizeMM {
		return 0
	}
	n := int(math.Floor((sizeMM-offsetMM)/pitchMM)) + 1
	for n > 0 && offsetMM+float64(n-1)*pitchMM >= sizeMM-touchMM { // a hole on the far edge is not a hole
		n--
	}
	return n
}

// Nearest returns the hole of the grid nearest to (x, y): column and row counted from 1 at the
// front-left corner, and the hole's centre. On a rectangular grid the nearest hole is the nearest
// column together with the nearest row, so a point off the table gets the nearest edge hole.
// ok is false when the grid has no holes or the point is not a finite position.
func (g Grid) Nearest(x, y float64) (col, row int, hx, hy float64, ok bool) {
	if g.Columns == 0 || g.Rows == 0 || !finite(x) || !finite(y) {
		return 0, 0, 0, 0, false
	}
	col = nearestIndex(x, g.OffsetMM, g.PitchMM, g.Columns)
	row = nearestIndex(y, g.OffsetMM, g.PitchMM, g.Rows)
	h := g.Hole(col, row)
	return col, row, h.X, h.Y, true
}

func nearestIndex(v, offsetMM, pitchMM float64, n int) int {
	i := int(math.Round((v-offsetMM)/pitchMM)) + 1
	return max(1, min(n, i))
}

// NearestHole returns the hole of table t nearest to (x, y); see Grid.Nearest.
func NearestHole(t optics.Table, x, y float64) (col, row int, hx, hy float64, ok bool) {
	return Holes(t).Nearest(x, y)
}
