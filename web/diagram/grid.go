package diagram

import "raytable/optics"

// maxHolesPerSide caps the drawing of a huge table.
const maxHolesPerSide = 400

// drawnHoles is how many columns and rows of a board's hole grid are drawn.
func drawnHoles(g optics.HoleGrid) (cols, rows int) {
	return min(g.Columns, maxHolesPerSide), min(g.Rows, maxHolesPerSide)
}
