package optics

import "gonum.org/v1/gonum/spatial/r2"

// Board is the breadboard seen from above as the table view and the printed plan draw it, every
// position in table millimetres (x along the width, y along the depth, origin at the front-left
// corner). optics/layout builds it once per report (layout.NewBoard) from the report's own
// positions and the bench's table and source, which the report does not otherwise carry;
// web/diagram maps it to the page and computes no geometry of its own.
//
// It is no part of the report's JSON: everything in it follows from the report and the bench. A
// report that did not come from the analysis (decoded from JSON, or made by hand) has none.
type Board struct {
	// The table's size; both 0 when it has none (SizeKnown).
	WidthMM, DepthMM float64
	// Holes is the report's hole grid when the table has a size and a known grid, else empty;
	// HoleRadiusMM is half the nominal diameter of its thread.
	Holes        HoleGrid
	HoleRadiusMM float64
	// SourceDir is the beam's direction at the source, Path[0].
	SourceDir r2.Vec
	// Path is the folded beam path: the source, each element's first vertex and a thick lens's
	// last vertex, in beam order. Beyond the last node the beam goes on along TailDir.
	Path    []PathNode
	TailDir r2.Vec
	// Band is the beam's 1/e² tangential radius drawn around the path: one outline per straight
	// stretch the beam samples cover, its left edge forward then its right edge back.
	Band [][]r2.Vec
	// Elements has one entry per report element, Mounts one per placement, in the same order.
	Elements []BoardElement
	Mounts   []BoardMount
	// Arms has one entry per arm of a branching bench (Report.Arms), the main one first; empty
	// for a bench that does not branch. Path, Band and Elements above stay the main line's.
	Arms []BoardArm
}

// BoardArm is one arm on the table: its folded path and band from its source, and its own
// elements, index-aligned with ArmReport.Elements of the same arm. Open: the arm ends in a stray
// beam, drawn running on along TailDir.
type BoardArm struct {
	ID        string
	SourceDir r2.Vec
	Path      []PathNode
	TailDir   r2.Vec
	Band      [][]r2.Vec
	Elements  []BoardElement
	Open      bool
}

// SizeKnown reports whether the table has a size to draw.
func (b *Board) SizeKnown() bool { return b.WidthMM > 0 && b.DepthMM > 0 }

// PathNode is a point of the folded path where it may change direction.
type PathNode struct {
	PathMM float64 // distance from the source along the unfolded path
	At     r2.Vec
}

// BoardElement is an element on the table.
type BoardElement struct {
	At     r2.Vec   // the first vertex
	In     r2.Vec   // unit direction of the arriving beam
	Across r2.Vec   // unit direction of the element's faces on the table (a mirror's surface)
	Faces  []r2.Vec // each face's vertex, in the report's face order
}

// BoardMount is a mount's footprint on the table.
type BoardMount struct {
	Post    r2.Vec    // where the post stands, the centre of the footprint
	Corners [4]r2.Vec // counter-clockwise from the far right corner (along the mount's heading)
}

// Hole is the centre of the hole in column col and row row, both counted from 1 at the
// front-left corner.
func (g HoleGrid) Hole(col, row int) r2.Vec {
	return r2.Vec{X: g.OffsetMM + float64(col-1)*g.PitchMM, Y: g.OffsetMM + float64(row-1)*g.PitchMM}
}
