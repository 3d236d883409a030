package diagram

import (
	"raytable/optics"
)

// Hole sizes drawn on the table: the nominal thread diameters of the grids (common practice: M6
// holes on metric tables, 1/4-20 on imperial ones).
const (
	metricHoleRadiusMM   = 3.0
	imperialHoleRadiusMM = 3.175
)

// holeGrid is the breadboard's hole pattern as the report gives it, with the hole size to draw.
type holeGrid struct {
	pitch, offset, radius float64
	cols, rows            int
}

// maxHolesPerSide caps the drawing of a huge table.
const maxHolesPerSide = 400

func holesOf(h optics.HoleGrid) holeGrid {
	g := holeGrid{pitch: h.PitchMM, offset: h.OffsetMM, cols: min(h.Columns, maxHolesPerSide), rows: min(h.Rows, maxHolesPerSide)}
	switch h.Kind {
	case optics.GridMetric25:
		g.radius = metricHoleRadiusMM
	case optics.GridImperial1:
		g.radius = imperialHoleRadiusMM
	default:
		return holeGrid{}
	}
	if !finite(g.pitch, g.offset) || g.pitch <= 0 {
		return holeGrid{}
	}
	return g
}

func (g holeGrid) hole(col, row int) vec {
	return vec{g.offset + float64(col-1)*g.pitch, g.offset + float64(row-1)*g.pitch}
}
