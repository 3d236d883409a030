package layout

import (
	"math"

	"raytable/optics"

	"gonum.org/v1/gonum/spatial/r2"
)

// Walk follows the folded beam path from the source and returns, per element in bench order, its
// position along the path and on the table. TableXMM/TableYMM is the element's first vertex: the
// point where the beam's axis meets its first face (the plane of a thin lens, aperture, screen or
// dump; the vertex of a mirror; the reflecting face of a splitter; a periscope's lower or upper
// mirror). Each first vertex lies gap_mm along the current heading from the previous element's
// last vertex (or the source); a lens's last vertex lies its length (the sum of its thicknesses)
// further on; a splitter's plate moves it by the glass path along the refracted axis, which
// leaves it displaced sideways, away from the reflected port, by the plate shift
// (optics.PlateShiftMM); a periscope's last vertex stands above (or below) its first, |rise_mm|
// further along the path. A mirror and a periscope turn the heading by turn_deg,
// counter-clockwise positive; a splitter passed straight through keeps it. Headings are reported
// in [0, 360). HeightMM is the beam's height above the table at the first vertex: the source's
// height_mm, or the table's beam_height_mm, changed by the rise of every periscope passed. The
// ray-related fields of ElementPlace are left at zero for the tracing code to fill.
func Walk(b *optics.Bench) []optics.ElementPlace {
	if b == nil {
		return nil
	}
	places := make([]optics.ElementPlace, len(b.Elements))
	pos := r2.Vec{X: b.Source.XMM, Y: b.Source.YMM}
	heading := NormDeg(b.Source.HeadingDeg)
	height := b.Table.BeamHeightMM
	if b.Source.HeightMM != nil {
		height = *b.Source.HeightMM
	}
	var path float64
	for i := range b.Elements {
		e := &b.Elements[i]
		path += e.GapMM
		first := along(pos, heading, e.GapMM)
		out := heading
		if (e.Type == optics.TypeMirror || e.Type == optics.TypePeriscope) && e.TurnDeg != nil {
			out = NormDeg(heading + *e.TurnDeg)
		}
		places[i] = optics.ElementPlace{
			ID:            e.ID,
			Type:          e.Type,
			PathMM:        path,
			TableXMM:      first.X,
			TableYMM:      first.Y,
			HeightMM:      height,
			HeadingInDeg:  heading,
			HeadingOutDeg: out,
		}
		if e.Type == optics.TypePeriscope && e.RiseMM != nil {
			height += *e.RiseMM
		}
		pos = r2.Add(first, elementRun(b, e, heading))
		path += elementLength(b, e)
		heading = out
	}
	return places
}

// elementLength is the distance from an element's first vertex to its last along the beam: the sum
// of a lens's thicknesses, a splitter plate's glass path, a periscope's |rise_mm|, zero for every
// other type (a mirror reflects at its single vertex). It is optics.Path.ElementLengthMM, taken
// from the bench.
func elementLength(b *optics.Bench, e *optics.Element) float64 {
	switch e.Type {
	case optics.TypeLens:
		return e.LengthMM()
	case optics.TypePeriscope:
		if e.RiseMM != nil {
			return math.Abs(*e.RiseMM)
		}
	case optics.TypeSplitter:
		if pl, ok := optics.SplitterPlate(b, e); ok {
			return optics.PlateGlassPathMM(pl.ThicknessMM, pl.N, e.SplitterIncidenceRad())
		}
	}
	return 0
}

// elementRun is the step on the table from an element's first vertex to its last, for an element
// met at heading deg: along the heading for a lens, along the refracted axis for a splitter's
// plate (which ends displaced by the plate shift), none for a periscope (its mirrors stand one
// above the other).
func elementRun(b *optics.Bench, e *optics.Element, deg float64) r2.Vec {
	switch e.Type {
	case optics.TypePeriscope:
		return r2.Vec{}
	case optics.TypeSplitter:
		pl, ok := optics.SplitterPlate(b, e)
		if !ok {
			return r2.Vec{}
		}
		inc := e.SplitterIncidenceRad()
		dev := e.PlateSide() * optics.PlateDeviationRad(pl.N, inc) * 180 / math.Pi
		return r2.Scale(optics.PlateGlassPathMM(pl.ThicknessMM, pl.N, inc), unitDeg(deg+dev))
	}
	return r2.Scale(elementLength(b, e), unitDeg(deg))
}

// lastVertex is where the beam leaves element i: its first vertex moved by its run on the table.
func lastVertex(b *optics.Bench, p optics.ElementPlace, i int) r2.Vec {
	return r2.Add(r2.Vec{X: p.TableXMM, Y: p.TableYMM}, elementRun(b, &b.Elements[i], p.HeadingInDeg))
}
