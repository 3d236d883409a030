package layout

import (
	"raytable/optics"

	"gonum.org/v1/gonum/spatial/r2"
)

// Walk follows the folded beam path from the source and returns, per element in bench order, its
// position along the path and on the table. TableXMM/TableYMM is the element's first vertex: the
// point where the beam's axis meets its first face (the plane of a thin lens, aperture, screen or
// dump; the vertex of a mirror). Each first vertex lies gap_mm along the current heading from the
// previous element's last vertex (or the source); a lens's last vertex lies its length (the sum of
// its thicknesses) further on; a mirror turns the heading by turn_deg, counter-clockwise positive.
// Headings are reported in [0, 360). The ray-related fields of ElementPlace are left at zero for
// the tracing code to fill.
func Walk(b *optics.Bench) []optics.ElementPlace {
	if b == nil {
		return nil
	}
	places := make([]optics.ElementPlace, len(b.Elements))
	pos := r2.Vec{X: b.Source.XMM, Y: b.Source.YMM}
	heading := NormDeg(b.Source.HeadingDeg)
	var path float64
	for i := range b.Elements {
		e := &b.Elements[i]
		path += e.GapMM
		first := along(pos, heading, e.GapMM)
		out := heading
		if e.Type == optics.TypeMirror && e.TurnDeg != nil {
			out = NormDeg(heading + *e.TurnDeg)
		}
		places[i] = optics.ElementPlace{
			ID:            e.ID,
			Type:          e.Type,
			PathMM:        path,
			TableXMM:      first.X,
			TableYMM:      first.Y,
			HeadingInDeg:  heading,
			HeadingOutDeg: out,
		}
		length := elementLength(e)
		pos = along(first, heading, length)
		path += length
		heading = out
	}
	return places
}

// elementLength is the distance from an element's first vertex to its last along the beam: the sum
// of a lens's thicknesses, zero for every other type (a mirror reflects at its single vertex).
func elementLength(e *optics.Element) float64 {
	if e.Type != optics.TypeLens {
		return 0
	}
	return e.LengthMM()
}

// lastVertex is where the beam leaves element i: its first vertex moved by its length along the
// arriving heading.
func lastVertex(b *optics.Bench, p optics.ElementPlace, i int) r2.Vec {
	return along(r2.Vec{X: p.TableXMM, Y: p.TableYMM}, p.HeadingInDeg, elementLength(&b.Elements[i]))
}
