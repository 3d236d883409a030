package layout

import (
	"fmt"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// Warning codes of the layout checks (see optics.WarningCodes).
const (
	CodeMountsOverlap = optics.WarnMountsOverlap
	CodeMountInBeam   = optics.WarnMountInBeam
	CodeOffTable      = optics.WarnOffTable
	CodeBeamOffTable  = optics.WarnBeamOffTable
	CodeNoBeamEnd     = optics.WarnNoBeamEnd
)

// Plan places every element's mount on the breadboard and checks the arrangement. It returns one
// Placement per element (the post at the footprint centre, the nearest hole and the post's offset
// from it) and the warnings, each naming the elements involved: the Element field holds the one to
// move (the upstream one of an overlapping pair), the message names all of them.
//
// beamRadius gives the beam's half-width at a distance along the unfolded path from the source (for
// a Gaussian beam the radius that passes 99 % of its power, beam.PassRadiusPerW times its 1/e²
// radius, as the analysis passes it; or the ray bundle's envelope); nil means a beam of no width. The
// beam is checked as a band of that half-width around each straight segment of the folded path
// (see band). A mount counts as in the beam only for segments that neither end nor start at its own
// element. Table-edge checks are skipped when the table has no positive width and depth.
//
// places must come from Walk for the same bench.
func Plan(b *optics.Bench, places []optics.ElementPlace, beamRadius func(pathMM float64) float64) ([]optics.Placement, []optics.Warning) {
	if b == nil {
		return nil, nil
	}
	fps := Footprints(b, places)
	placements := placementsOf(b, places, fps)
	segs := Segments(b, places)
	bands := make([][][]r2.Vec, len(segs))
	for i, s := range segs {
		bands[i] = band(s, beamRadius)
	}
	var warns []optics.Warning
	warns = append(warns, offTable(b, places, fps)...)
	warns = append(warns, beamOffTable(b.Table, segs, bands)...)
	warns = append(warns, overlaps(fps)...)
	warns = append(warns, mountsInBeam(segs, bands, fps)...)
	warns = append(warns, beamEnd(b)...)
	return placements, warns
}

func placementsOf(b *optics.Bench, places []optics.ElementPlace, fps []Footprint) []optics.Placement {
	g := Holes(b.Table)
	ps := make([]optics.Placement, len(fps))
	for i, f := range fps {
		p := optics.Placement{
			ID: f.ID, Type: f.Type,
			TableXMM: f.Center.X, TableYMM: f.Center.Y,
			HeadingDeg:   f.AxisDeg,
			MountWidthMM: f.WidthMM, MountDepthMM: f.DepthMM,
		}
		if col, row, hx, hy, ok := g.Nearest(f.Center.X, f.Center.Y); ok {
			p.HoleColumn, p.HoleRow = col, row
			p.OffsetXMM, p.OffsetYMM = f.Center.X-hx, f.Center.Y-hy
		}
		ps[i] = p
	}
	return ps
}

func tableKnown(t optics.Table) bool { return t.WidthMM > 0 && t.DepthMM > 0 }

func offTable(b *optics.Bench, places []optics.ElementPlace, fps []Footprint) []optics.Warning {
	t := b.Table
	if !tableKnown(t) {
		return nil
	}
	var warns []optics.Warning
	for i, f := range fps {
		first := r2.Vec{X: places[i].TableXMM, Y: places[i].TableYMM}
		last := lastVertex(b, places[i], i)
		switch {
		case !inside(first, t.WidthMM, t.DepthMM) || !inside(last, t.WidthMM, t.DepthMM):
			warns = append(warns, optics.Warning{Code: CodeOffTable, Element: f.ID, Message: fmt.Sprintf(
				"%s at (%.1f, %.1f) mm is off the %g x %g mm table", f.ID, first.X, first.Y, t.WidthMM, t.DepthMM)})
		case !allInside(f.Corners[:], t):
			warns = append(warns, optics.Warning{Code: CodeOffTable, Element: f.ID, Message: fmt.Sprintf(
				"the mount of %s (%g x %g mm around (%.1f, %.1f) mm) reaches off the %g x %g mm table",
				f.ID, f.WidthMM, f.DepthMM, f.Center.X, f.Center.Y, t.WidthMM, t.DepthMM)})
		}
	}
	return warns
}

func allInside(pts []r2.Vec, t optics.Table) bool {
	for _, p := range pts {
		if !inside(p, t.WidthMM, t.DepthMM) {
			return false
		}
	}
	return true
}

func beamOffTable(t optics.Table, segs []Segment, bands [][][]r2.Vec) []optics.Warning {
	if !tableKnown(t) {
		return nil
	}
	var warns []optics.Warning
	for i, s := range segs {
		off := !inside(s.Start, t.WidthMM, t.DepthMM) || !inside(s.End, t.WidthMM, t.DepthMM)
		for _, q := range bands[i] {
			off = off || !allInside(q, t)
		}
		if off {
			warns = append(warns, optics.Warning{Code: CodeBeamOffTable, Element: s.To, Message: fmt.Sprintf(
				"the beam %s leaves the %g x %g mm table", stretch(s), t.WidthMM, t.DepthMM)})
		}
	}
	return warns
}

// stretch names a segment in words: "from the source to L1", "from L1 to M1", "inside L2".
func stretch(s Segment) string {
	if s.FromIndex == s.ToIndex {
		return "inside " + s.To
	}
	from := s.From
	if s.FromIndex < 0 {
		from = "the source"
	}
	return "from " + from + " to " + s.To
}

func overlaps(fps []Footprint) []optics.Warning {
	boxes := make([]box, len(fps))
	for i := range fps {
		boxes[i] = boundsOf(fps[i].Corners[:])
	}
	var warns []optics.Warning
	for i := range fps {
		for j := i + 1; j < len(fps); j++ {
			if !boxes[i].overlaps(boxes[j]) || !convexOverlap(fps[i].Corners[:], fps[j].Corners[:]) {
				continue
			}
			warns = append(warns, optics.Warning{Code: CodeMountsOverlap, Element: fps[i].ID, Others: []string{fps[j].ID}, Message: fmt.Sprintf(
				"the mounts of %s and %s overlap: move one of them or give a smaller mount", fps[i].ID, fps[j].ID)})
		}
	}
	return warns
}

func mountsInBeam(segs []Segment, bands [][][]r2.Vec, fps []Footprint) []optics.Warning {
	boxes := make([]box, len(fps))
	for i := range fps {
		boxes[i] = boundsOf(fps[i].Corners[:])
	}
	var warns []optics.Warning
	var pts []r2.Vec
	for si, s := range segs {
		pts = pts[:0]
		for _, q := range bands[si] {
			pts = append(pts, q...)
		}
		segBox := boundsOf(pts)
		for fi := range fps {
			if fi == s.FromIndex || fi == s.ToIndex || !segBox.overlaps(boxes[fi]) {
				continue
			}
			for _, q := range bands[si] {
				if boundsOf(q).overlaps(boxes[fi]) && convexOverlap(q, fps[fi].Corners[:]) {
					warns = append(warns, optics.Warning{Code: CodeMountInBeam, Element: fps[fi].ID, Message: fmt.Sprintf(
						"the beam %s passes through the mount of %s", stretch(s), fps[fi].ID)})
					break
				}
			}
		}
	}
	return warns
}

func beamEnd(b *optics.Bench) []optics.Warning {
	n := len(b.Elements)
	if n == 0 {
		return []optics.Warning{{Code: CodeNoBeamEnd, Message: "the bench has no elements: the beam is not terminated; end it on a screen or a dump"}}
	}
	last := b.Elements[n-1]
	if k, ok := optics.KindOf(last.Type); ok && k.EndsPath {
		return nil
	}
	return []optics.Warning{{Code: CodeNoBeamEnd, Element: last.ID, Message: fmt.Sprintf(
		"the beam leaves %s, the last element, without a screen or dump: terminate it", last.ID)}}
}
