// Package layout places a bench on its breadboard: it walks the folded beam path from the source to
// find where every element stands on the table, finds the hole of the table's grid nearest to each
// mount's post, draws each mount's footprint, and checks the arrangement for problems a builder
// must fix before bolting anything down (mounts that overlap, a mount in another part of the beam,
// parts or beam off the table, a beam that is never terminated).
//
// Coordinates are table millimetres: x along the width, y along the depth, origin at the front-left
// corner; headings in degrees, 0 = +x, 90 = +y, counter-clockwise seen from above, reported in
// [0, 360). The package is pure computation and does no I/O; PlacementRows gives the placement list
// as text cells for the command line to write as CSV, and NewBoard lays out the board the drawings
// show from a report's positions.
package layout
