package diagram

import (
	"math"

	"raytable/optics"
)

// across is the direction of an element's stroke on the table: across the arriving beam, or along
// a mirror's surface (perpendicular to d_out - d_in).
func across(e *optics.ElementPlace) vec {
	in := heading(e.HeadingInDeg)
	if e.Type == optics.TypeMirror {
		return heading(e.HeadingOutDeg).sub(in).unit(in).perp()
	}
	return in.perp()
}

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

func (t *tableScene) drawElement(p *pen, e *optics.ElementPlace) {
	pos := vec{e.TableXMM, e.TableYMM}
	if !pos.finite() {
		return
	}
	in, ac, h := heading(e.HeadingInDeg), across(e), t.halfMM(e)
	stroke := func(c vec, half float64, attrs ...string) {
		xs, ys := t.poly([]vec{c.sub(ac.scale(half)), c.add(ac.scale(half))})
		p.polyline(xs, ys, attrs...)
	}
	w := func(k float64) string { return attr("stroke-width", p.num(k*t.st.line)) }
	switch e.Type {
	case optics.TypeLens:
		for _, f := range e.Faces {
			stroke(pos.add(in.scale(f.PathMM-e.PathMM)), h, `stroke="#3b6e8f"`, w(2))
		}
		if len(e.Faces) == 0 {
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
			a, b := pos.add(ac.scale(sgn*open)), pos.add(ac.scale(sgn*(open+blade)))
			xs, ys := t.poly([]vec{a, b})
			p.polyline(xs, ys, `stroke="#303030"`, w(2.5))
		}
	case optics.TypeScreen:
		stroke(pos, h, `stroke="#5d5d5d"`, w(3))
	case optics.TypeDump:
		s := math.Max(5, t.st.minHalf/t.st.s)
		xs, ys := t.poly([]vec{pos.add(ac.scale(s)), pos.add(ac.scale(s)).add(in.scale(2 * s)), pos.sub(ac.scale(s)).add(in.scale(2 * s)), pos.sub(ac.scale(s))})
		p.polygon(xs, ys, `fill="#262626"`)
	default:
		stroke(pos, h, `stroke="#888888"`, w(1))
	}
}

// drawLabels writes each element id beside its stroke, on the left of the arriving beam.
func (t *tableScene) drawLabels(p *pen) {
	p.group(attr("font-size", p.num(t.st.font)), `fill="#1a1a1a"`, `text-anchor="middle"`)
	for i := range t.r.Elements {
		e := &t.r.Elements[i]
		pos := vec{e.TableXMM, e.TableYMM}
		if !pos.finite() {
			continue
		}
		ac := across(e)
		at := pos.add(ac.scale(t.extentMM(e) + 1.2*t.st.font/t.st.s))
		x, y := t.pt(at)
		p.text(x, y+0.35*t.st.font, e.ID)
	}
	p.gend()
}
