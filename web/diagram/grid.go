package diagram

import (
	"math"

	"raytable/optics"
)

// Hole sizes drawn on the table: the nominal thread diameters of the grids (common practice: M6
// holes on metric tables, 1/4-20 on imperial ones).
const (
	metricHoleRadiusMM   = 3.0
	imperialHoleRadiusMM = 3.175
)

// holeGrid is the breadboard's hole pattern: the first hole offset from the front and left edges,
// then one every pitch, every centre strictly inside the table (the same rule as the placement list).
type holeGrid struct {
	pitch, offset, radius float64
	cols, rows            int
}

func holesOf(t optics.Table) holeGrid {
	var g holeGrid
	switch t.Grid {
	case optics.GridMetric25:
		g = holeGrid{pitch: 25, offset: 12.5, radius: metricHoleRadiusMM}
	case optics.GridImperial1:
		g = holeGrid{pitch: 25.4, offset: 12.7, radius: imperialHoleRadiusMM}
	default:
		return g
	}
	if t.HoleOffsetMM != nil {
		g.offset = *t.HoleOffsetMM
	}
	g.cols = holeCount(t.WidthMM, g.offset, g.pitch)
	g.rows = holeCount(t.DepthMM, g.offset, g.pitch)
	return g
}

// holeCount counts holes at offset, offset+pitch, ... strictly inside (0, size). It is capped so a
// huge table cannot blow up the drawing.
func holeCount(size, offset, pitch float64) int {
	if !finite(size, offset, pitch) || pitch <= 0 || offset <= 0 || offset >= size {
		return 0
	}
	n := int(math.Floor((size-offset)/pitch)) + 1
	if offset+float64(n-1)*pitch >= size {
		n--
	}
	return min(n, 400)
}

func (g holeGrid) hole(col, row int) vec {
	return vec{g.offset + float64(col-1)*g.pitch, g.offset + float64(row-1)*g.pitch}
}
