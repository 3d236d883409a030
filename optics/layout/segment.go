package layout

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// Segment is one straight stretch of the folded beam on the table: from the source or an element's
// last vertex to the next element's first vertex, or through a lens from its first vertex to its
// last. FromIndex and ToIndex are element indices, -1 for the source.
type Segment struct {
	FromIndex   int     `json:"-"`
	ToIndex     int     `json:"-"`
	From        string  `json:"from"` // element id, "" for the source
	To          string  `json:"to"`
	Start       r2.Vec  `json:"start"`
	End         r2.Vec  `json:"end"`
	StartPathMM float64 `json:"start_path_mm"`
	EndPathMM   float64 `json:"end_path_mm"`
}

// LengthMM is the segment's length on the table.
func (s Segment) LengthMM() float64 { return r2.Norm(r2.Sub(s.End, s.Start)) }

// Segments returns the folded beam path as straight segments in beam order, from the source to the
// last element's last vertex. Segments of zero length (gap_mm 0, or a lens of no thickness) are
// left out.
func Segments(b *optics.Bench, places []optics.ElementPlace) []Segment {
	if b == nil {
		return nil
	}
	n := min(len(b.Elements), len(places))
	segs := make([]Segment, 0, 2*n)
	add := func(s Segment) {
		if s.EndPathMM-s.StartPathMM > 0 || s.LengthMM() > 0 {
			segs = append(segs, s)
		}
	}
	prev := Segment{FromIndex: -1, End: r2.Vec{X: b.Source.XMM, Y: b.Source.YMM}}
	for i := range n {
		p := places[i]
		first := r2.Vec{X: p.TableXMM, Y: p.TableYMM}
		add(Segment{FromIndex: prev.FromIndex, ToIndex: i, From: prev.From, To: p.ID,
			Start: prev.End, End: first, StartPathMM: prev.EndPathMM, EndPathMM: p.PathMM})
		length := elementLength(b, &b.Elements[i])
		last := lastVertex(b, p, i)
		add(Segment{FromIndex: i, ToIndex: i, From: p.ID, To: p.ID,
			Start: first, End: last, StartPathMM: p.PathMM, EndPathMM: p.PathMM + length})
		prev = Segment{FromIndex: i, From: p.ID, End: last, EndPathMM: p.PathMM + length}
	}
	return segs
}

// bandStepMM is the longest piece of a segment whose beam envelope is bounded by one trapezoid.
const bandStepMM = 25

// maxBandPieces caps the pieces per segment so a long segment does not cost without bound.
const maxBandPieces = 32

// band returns the beam around a segment as convex quadrilaterals (trapezoids), each spanning a
// piece of the segment with the beam half-width at its two ends. The 1/e² radius of a Gaussian beam,
// w(z) = w0 sqrt(1 + (z/zR)²), and the envelope of a ray bundle (the largest of straight lines) are
// both convex along a gap, so each chord lies on or outside the envelope: the band never misses the
// beam, and splitting into pieces keeps it close to the beam near a focus.
func band(s Segment, radius func(float64) float64) [][]r2.Vec {
	length := s.LengthMM()
	if length == 0 {
		return nil
	}
	pieces := int(math.Ceil(length / bandStepMM))
	pieces = max(1, min(maxBandPieces, pieces))
	u := r2.Scale(1/length, r2.Sub(s.End, s.Start))
	v := perp(u)
	quads := make([][]r2.Vec, pieces)
	r0 := safeRadius(radius, s.StartPathMM)
	for k := range pieces {
		t1 := float64(k+1) / float64(pieces)
		r1 := safeRadius(radius, s.StartPathMM+t1*(s.EndPathMM-s.StartPathMM))
		a := r2.Add(s.Start, r2.Scale(length*float64(k)/float64(pieces), u))
		b := r2.Add(s.Start, r2.Scale(length*t1, u))
		quads[k] = []r2.Vec{r2.Sub(a, r2.Scale(r0, v)), r2.Sub(b, r2.Scale(r1, v)), r2.Add(b, r2.Scale(r1, v)), r2.Add(a, r2.Scale(r0, v))}
		r0 = r1
	}
	return quads
}

// safeRadius evaluates the caller's beam radius; nil, negative or non-finite radii count as 0 (the
// beam's axis), so a bad radius never hides the axis itself.
func safeRadius(radius func(float64) float64, pathMM float64) float64 {
	if radius == nil {
		return 0
	}
	r := radius(pathMM)
	if !finite(r) || r < 0 {
		return 0
	}
	return r
}
