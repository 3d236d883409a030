package layout

import (
	"strconv"
	"strings"

	"raytable/optics"
	"raytable/optics/numfmt"
)

// PlacementHeader is the first row of PlacementRows.
var PlacementHeader = []string{"id", "type", "x_mm", "y_mm", "heading_deg", "hole_column", "hole_row", "offset_x_mm", "offset_y_mm"}

// PlacementRows turns the placement list into text cells, a header row first, ready for
// encoding/csv. Lengths and headings have two decimals (0.01 mm, finer than any post can be set);
// hole column, row and offsets are empty when the table has no grid. Text cells that a spreadsheet
// would run as a formula (starting with = + - @, tab or carriage return) get a leading single quote,
// the common defence against spreadsheet formula injection; the numbers are written by this function
// and are plain numbers, so a negative offset stays a number.
func PlacementRows(ps []optics.Placement) [][]string {
	rows := make([][]string, 0, len(ps)+1)
	rows = append(rows, append([]string(nil), PlacementHeader...))
	for _, p := range ps {
		row := []string{inert(p.ID), inert(p.Type), hundredth(p.TableXMM), hundredth(p.TableYMM), hundredth(p.HeadingDeg), "", "", "", ""}
		if p.HoleColumn > 0 && p.HoleRow > 0 {
			row[5], row[6] = strconv.Itoa(p.HoleColumn), strconv.Itoa(p.HoleRow)
			row[7], row[8] = hundredth(p.OffsetXMM), hundredth(p.OffsetYMM)
		}
		rows = append(rows, row)
	}
	return rows
}

var hundredth = numfmt.Hundredth.Format

// inert defuses a text cell a spreadsheet would evaluate.
func inert(s string) string {
	if s != "" && strings.ContainsRune("=+-@\t\r", rune(s[0])) {
		return "'" + s
	}
	return s
}
