package diagram

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// bladeMM is the length of an aperture's blades on the table beyond its opening.
func (t *tableScene) bladeMM(open float64) float64 { return math.Max(8, open) + t.st.minHalf/t.st.s }

// extentMM is how far an element's drawing reaches from the beam on each side.
func (t *tableScene) extentMM(e *optics.ElementPlace) float64 {
	if e.Type == optics.TypeAperture {
		open := 0.0
		if e.SemiDiameterMM != nil && finite(*e.SemiDiameterMM) {
			open = *e.SemiDiameterMM
		}
		return open + t.bladeMM(open)
	}
	return t.halfMM(e)
}

// halfMM is the half-length an element is drawn with on the table.
func (t *tableScene) halfMM(e *optics.ElementPlace) float64 {
	h := nominalOpticHalfMM
	if e.SemiDiameterMM != nil && finite(*e.SemiDiameterMM) && *e.SemiDiameterMM > 0 {
		h = *e.SemiDiameterMM
	}
	return math.Max(h, t.st.minHalf/t.st.s)
}

// drawElement draws element e at its place on the board, be: a stroke along each face, an
// aperture's two blades, a dump's block.
func (t *tableScene) drawElement(p *pen, e *optics.ElementPlace, be *optics.BoardElement) {
	pos := be.At
	if !finiteVec(pos) {
		return
	}
	in, ac, h := be.In, be.Across, t.halfMM(e)
	stroke := func(c r2.Vec, half float64, attrs ...string) {
		xs, ys := t.poly([]r2.Vec{r2.Sub(c, r2.Scale(half, ac)), r2.Add(c, r2.Scale(half, ac))})
		p.polyline(xs, ys, attrs...)
	}
	w := func(k float64) string { return attr("stroke-width", p.num(k*t.st.line)) }
	switch e.Type {
	case optics.TypeLens:
		for _, f := range be.Faces {
			stroke(f, h, `stroke="#3b6e8f"`, w(2))
		}
		if len(be.Faces) == 0 {
			stroke(pos, h, `stroke="#3b6e8f"`, w(2))
		}
	case optics.TypeThinLens:
		stroke(pos, h, `stroke="#2d5fa8"`, w(2))
	case optics.TypeMirror:
		stroke(pos, h, `stroke="#37474f"`, w(3.5))
	case optics.TypeAperture:
		open := 0.0
		if e.SemiDiameterMM != nil && finite(*e.SemiDiameterMM) {
			open = *e.SemiDiameterMM
		}
		blade := t.bladeMM(open)
		for _, sgn := range []float64{1, -1} {
			a, b := r2.Add(pos, r2.Scale(sgn*open, ac)), r2.Add(pos, r2.Scale(sgn*(open+blade), ac))
			xs, ys := t.poly([]r2.Vec{a, b})
			p.polyline(xs, ys, `stroke="#303030"`, w(2.5))
		}
	case optics.TypeScreen:
		stroke(pos, h, `stroke="#5d5d5d"`, w(3))
	case optics.TypeDump:
		s := math.Max(5, t.st.minHalf/t.st.s)
		side, depth := r2.Scale(s, ac), r2.Scale(2*s, in)
		xs, ys := t.poly([]r2.Vec{r2.Add(pos, side), r2.Add(r2.Add(pos, side), depth), r2.Add(r2.Sub(pos, side), depth), r2.Sub(pos, side)})
		p.polygon(xs, ys, `fill="#262626"`)
	case optics.TypeSplitter:
		stroke(pos, h, `stroke="#6a8fa8"`, w(2.5), attr("stroke-dasharray", p.num(3*t.st.line)+" "+p.num(1.5*t.st.line)))
	case optics.TypePeriscope:
		s := math.Max(4, 0.6*t.st.minHalf/t.st.s)
		side, depth := r2.Scale(s, ac), r2.Scale(s, in)
		xs, ys := t.poly([]r2.Vec{r2.Add(r2.Sub(pos, depth), side), r2.Add(r2.Add(pos, depth), side), r2.Sub(r2.Add(pos, depth), side), r2.Sub(r2.Sub(pos, depth), side)})
		p.polygon(xs, ys, `fill="#b0bec5"`, `stroke="#37474f"`, w(2))
	case optics.TypeFiber: // a connector block behind the face the beam enters
		s := math.Max(4, 0.6*t.st.minHalf/t.st.s)
		side, depth := r2.Scale(s, ac), r2.Scale(3*s, in)
		xs, ys := t.poly([]r2.Vec{r2.Add(pos, side), r2.Add(r2.Add(pos, side), depth), r2.Add(r2.Sub(pos, side), depth), r2.Sub(pos, side)})
		p.polygon(xs, ys, `fill="#c8a24a"`, `stroke="#5d4a1f"`, w(1.5))
	case optics.TypeModeTarget: // the mode's plane, dashed: a place to match, not a part
		stroke(pos, h, `stroke="#7b4fa0"`, w(2.5), attr("stroke-dasharray", p.num(1.5*t.st.line)+" "+p.num(1.5*t.st.line)))
	default:
		stroke(pos, h, `stroke="#888888"`, w(1))
	}
}

// drawLabels writes each element id beside its stroke, on the left of the arriving beam.
func (t *tableScene) drawLabels(p *pen) {
	p.group(attr("font-size", p.num(t.st.font)), `fill="#1a1a1a"`, `text-anchor="middle"`)
	for i := range t.elements() {
		e, be := &t.r.Elements[i], &t.board.Elements[i]
		if !finiteVec(be.At) {
			continue
		}
		at := r2.Add(be.At, r2.Scale(t.extentMM(e)+1.2*t.st.font/t.st.s, be.Across))
		x, y := t.pt(at)
		p.text(x, y+0.35*t.st.font, e.ID)
	}
	p.gend()
}
