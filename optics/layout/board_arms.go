package layout

import "raytable/optics"

// BoardArm is one arm on the table from the board of its linear bench (NewBoard of the arm's full
// report): the path and band from its source, its own elements from index own on, and whether it
// ends in a stray beam.
func BoardArm(id string, full *optics.Board, own int, open bool) optics.BoardArm {
	a := optics.BoardArm{ID: id, Open: open}
	if full == nil {
		return a
	}
	a.SourceDir, a.Path, a.TailDir, a.Band = full.SourceDir, full.Path, full.TailDir, full.Band
	a.Elements = full.Elements[min(own, len(full.Elements)):]
	return a
}
