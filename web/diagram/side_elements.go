package diagram

import (
	"math"

	"raytable/optics"
)

const (
	faceSamples     = 16  // points per lens face outline
	minElementPX    = 6.0 // smallest half-height an element is drawn with, so it stays visible
	mirrorHintPX    = 3.0 // smallest sag a curved mirror is drawn with, so its curvature shows
	nominalHitScale = 1.25
)

// nominalHeights is the half-height (mm) each element is drawn with: its clear semi-diameter, or
// for an unlimited element a little more than the highest ray that meets it.
func nominalHeights(r *optics.Report, f *sideFrame) []float64 {
	maxHit := map[string]float64{}
	for i := range r.Rays {
		for _, h := range r.Rays[i].Hits {
			maxHit[h.Element] = maxFinite(maxHit[h.Element], math.Abs(h.Exact.YMM))
		}
	}
	hs := make([]float64, len(r.Elements))
	for i, e := range r.Elements {
		switch {
		case e.SemiDiameterMM != nil && finite(*e.SemiDiameterMM) && *e.SemiDiameterMM > 0:
			hs[i] = *e.SemiDiameterMM
		case maxHit[e.ID] > 0:
			hs[i] = math.Min(nominalHitScale*maxHit[e.ID], f.yHalfMM)
		default:
			hs[i] = 0.5 * f.yHalfMM
		}
	}
	return hs
}

// visibleHalf is h in mm, raised so that it is drawn at least minElementPX high.
func visibleHalf(f *sideFrame, h float64) float64 {
	return math.Max(h, minElementPX/f.pxPerMMY())
}

func drawSideElement(p *pen, f *sideFrame, e *optics.ElementPlace, h float64) {
	z := e.PathMM
	if len(e.Faces) > 0 {
		z = e.Faces[0].PathMM
	}
	draw, ok := sideDrawings[e.Type]
	if !ok {
		p.line(f.x(z), f.y(h), f.x(z), f.y(-h), `stroke="#888888"`)
		return
	}
	draw(p, f, e, z, h)
}

// sideDrawings is how each element type of optics.Kinds looks in the side view, at path position z
// with half-height h (mm); a test checks that every type has one.
var sideDrawings = map[string]func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64){
	optics.TypeLens: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) { drawLens(p, f, e, h) },
	optics.TypeThinLens: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		drawThinLens(p, f, z, visibleHalf(f, h), e.FocalMM != nil && *e.FocalMM < 0)
	},
	optics.TypeMirror: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		var radius *float64
		if len(e.Faces) > 0 {
			radius = e.Faces[0].RadiusMM
		}
		drawMirror(p, f, z, visibleHalf(f, h), radius)
	},
	optics.TypeAperture: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		drawAperture(p, f, z, e.SemiDiameterMM)
	},
	optics.TypeScreen: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		hv := visibleHalf(f, h)
		p.rect(f.x(z)-2, f.y(hv), 4, 2*hv*f.pxPerMMY(), `fill="#5d5d5d"`)
	},
	optics.TypeDump: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		hv := visibleHalf(f, h)
		p.rect(f.x(z), f.y(hv), 10, 2*hv*f.pxPerMMY(), `fill="#262626"`)
	},
	// A fibre is its connector: a block behind the face with the core drawn across its middle.
	optics.TypeFiber: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		hv := visibleHalf(f, h)
		p.rect(f.x(z), f.y(hv), 12, 2*hv*f.pxPerMMY(), `fill="#c8a24a"`, `stroke="#5d4a1f"`, `stroke-width="1"`)
		p.line(f.x(z), f.y(0), f.x(z)+12, f.y(0), `stroke="#5d4a1f"`, `stroke-width="1"`)
	},
	// A mode target is the plane of the mode it stands for, dashed.
	optics.TypeModeTarget: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		hv := visibleHalf(f, h)
		p.line(f.x(z), f.y(hv), f.x(z), f.y(-hv), `stroke="#7b4fa0"`, `stroke-width="2"`, `stroke-dasharray="3 3"`)
	},
	// A splitter is drawn as a thin half-silvered plate: a light filled bar with a dashed face.
	optics.TypeSplitter: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		hv := visibleHalf(f, h)
		p.rect(f.x(z)-2, f.y(hv), 4, 2*hv*f.pxPerMMY(), `fill="#c9dbe8"`, `stroke="#37474f"`, `stroke-width="1"`, `stroke-dasharray="3 2"`)
	},
	// A periscope is drawn as its two mirrors, one above the other, joined by the vertical leg.
	optics.TypePeriscope: func(p *pen, f *sideFrame, e *optics.ElementPlace, z, h float64) {
		hv, x := visibleHalf(f, h), f.x(z)
		p.group(`fill="none"`, `stroke="#37474f"`, `stroke-width="2.5"`)
		p.line(x-4, f.y(hv), x+4, f.y(hv))
		p.line(x-4, f.y(-hv), x+4, f.y(-hv))
		p.gend()
		p.line(x, f.y(hv), x, f.y(-hv), `stroke="#37474f"`, `stroke-width="1"`, `stroke-dasharray="2 2"`)
	},
}

// faceOutline samples one face from height y0 to y1 (mm) as pixel points: a circular arc of the
// face radius through the vertex at zVertex (nil radius: a flat line). Heights beyond the radius
// are clamped to the hemisphere.
func faceOutline(f *sideFrame, zVertex float64, radius *float64, y0, y1 float64) (xs, ys []float64) {
	for k := 0; k <= faceSamples; k++ {
		y := y0 + (y1-y0)*float64(k)/faceSamples
		z := zVertex
		if radius != nil && *radius != 0 && finite(*radius) {
			R := *radius
			yy := math.Min(math.Abs(y), 0.999*math.Abs(R))
			z = zVertex + R - math.Copysign(math.Sqrt(R*R-yy*yy), R)
		}
		xs, ys = append(xs, f.x(z)), append(ys, f.y(y))
	}
	return xs, ys
}

// drawLens draws each glass between two faces as a lightly filled outline: face k from bottom to
// top, then face k+1 from top to bottom, the edges joining them.
func drawLens(p *pen, f *sideFrame, e *optics.ElementPlace, h float64) {
	faceH := func(fc optics.FacePlace) float64 {
		if fc.SemiDiameterMM != nil && finite(*fc.SemiDiameterMM) && *fc.SemiDiameterMM > 0 {
			return visibleHalf(f, *fc.SemiDiameterMM)
		}
		return visibleHalf(f, h)
	}
	if len(e.Faces) == 1 {
		fc := e.Faces[0]
		xs, ys := faceOutline(f, fc.PathMM, fc.RadiusMM, -faceH(fc), faceH(fc))
		p.polyline(xs, ys, `fill="none"`, `stroke="#3b6e8f"`, `stroke-width="1.2"`)
		return
	}
	for k := 0; k+1 < len(e.Faces); k++ {
		a, b := e.Faces[k], e.Faces[k+1]
		xa, ya := faceOutline(f, a.PathMM, a.RadiusMM, -faceH(a), faceH(a))
		xb, yb := faceOutline(f, b.PathMM, b.RadiusMM, faceH(b), -faceH(b))
		p.polygon(append(xa, xb...), append(ya, yb...),
			`fill="#a9cfe6"`, `fill-opacity="0.45"`, `stroke="#3b6e8f"`, `stroke-width="1.2"`, `stroke-linejoin="round"`)
	}
}

// drawThinLens draws an ideal lens as a line with an arrowhead at each end: pointing outwards for
// a converging lens, inwards for a diverging one.
func drawThinLens(p *pen, f *sideFrame, z, h float64, diverging bool) {
	x, top, bottom := f.x(z), f.y(h), f.y(-h)
	tip := 6.0
	if diverging {
		tip = -6
	}
	p.group(`fill="none"`, `stroke="#2d5fa8"`, `stroke-width="1.5"`)
	p.line(x, top, x, bottom)
	p.polyline([]float64{x - 4, x, x + 4}, []float64{top + tip, top, top + tip})
	p.polyline([]float64{x - 4, x, x + 4}, []float64{bottom - tip, bottom, bottom - tip})
	p.gend()
}

// drawMirror draws a thick line; a curved mirror bends it toward the centre of curvature (a concave
// mirror, radius > 0, curves toward the arriving light), at least mirrorHintPX at the edge so the
// curvature shows even when the true sag is far below a pixel.
func drawMirror(p *pen, f *sideFrame, z, h float64, radius *float64) {
	var xs, ys []float64
	sagAt := func(y float64) float64 { return 0 }
	if radius != nil && *radius != 0 && finite(*radius) {
		R := *radius
		edge := math.Min(h, 0.999*math.Abs(R))
		trueSag := math.Abs(R) - math.Sqrt(R*R-edge*edge)
		hint := mirrorHintPX * f.mmPerPX
		if trueSag >= hint {
			sagAt = func(y float64) float64 {
				yy := math.Min(math.Abs(y), 0.999*math.Abs(R))
				return math.Copysign(math.Abs(R)-math.Sqrt(R*R-yy*yy), R)
			}
		} else {
			sagAt = func(y float64) float64 { return math.Copysign(hint*(y/h)*(y/h), R) }
		}
	}
	for k := 0; k <= faceSamples; k++ {
		y := -h + 2*h*float64(k)/faceSamples
		xs, ys = append(xs, f.x(z-sagAt(y))), append(ys, f.y(y))
	}
	p.polyline(xs, ys, `fill="none"`, `stroke="#37474f"`, `stroke-width="3.5"`, `stroke-linecap="round"`)
}

// drawAperture draws two blades leaving the opening; an unlimited aperture is a dashed line.
func drawAperture(p *pen, f *sideFrame, z float64, sd *float64) {
	x := f.x(z)
	if sd == nil || !finite(*sd) || *sd < 0 {
		p.line(x, f.y(f.yHalfMM), x, f.y(-f.yHalfMM), `stroke="#555555"`, `stroke-dasharray="3 3"`)
		return
	}
	open := *sd
	end := math.Min(f.yHalfMM, open+0.35*f.yHalfMM)
	end = math.Max(end, open+minElementPX/f.pxPerMMY())
	p.group(`stroke="#303030"`, `stroke-width="3"`)
	p.line(x, f.y(open), x, f.y(end))
	p.line(x, f.y(-open), x, f.y(-end))
	p.gend()
}

// drawElementLabels writes each element id above the plot at its first vertex, on two staggered
// rows so that neighbours do not overlap, with a faint guide down to the plot.
func drawElementLabels(p *pen, f *sideFrame, r *optics.Report) {
	rows := []float64{36, 50}
	lastEnd := []float64{math.Inf(-1), math.Inf(-1)}
	p.group(`font-size="11"`, `fill="#222222"`, `text-anchor="middle"`)
	for _, e := range r.Elements {
		z := e.PathMM
		if len(e.Faces) > 0 {
			z = (e.Faces[0].PathMM + e.Faces[len(e.Faces)-1].PathMM) / 2
		}
		x := f.x(z)
		if !finite(x) || x < f.left-20 || x > f.left+f.pw+20 {
			continue
		}
		half := textWidthPX(e.ID, 11) / 2
		row := 0
		if x-half < lastEnd[0]+4 {
			row = 1
		}
		lastEnd[row] = x + half
		p.text(x, rows[row], e.ID)
	}
	p.gend()
}

// textWidthPX estimates the width of a label for spacing decisions (sans-serif, about 0.6 em per
// character).
func textWidthPX(s string, size float64) float64 {
	return 0.6 * size * float64(len([]rune(s)))
}

// drawBeamBand draws the Gaussian 1/e² envelope (tangential radius) as a translucent band.
func drawBeamBand(p *pen, f *sideFrame, r *optics.Report) {
	samples := r.DrawnSamples()
	if len(samples) < 2 {
		return
	}
	var xs, ys []float64
	for _, s := range samples {
		if finite(s.PathMM, s.WTMM) {
			xs, ys = append(xs, f.x(s.PathMM)), append(ys, f.y(s.WTMM))
		}
	}
	for i := len(samples) - 1; i >= 0; i-- {
		s := samples[i]
		if finite(s.PathMM, s.WTMM) {
			xs, ys = append(xs, f.x(s.PathMM)), append(ys, f.y(-s.WTMM))
		}
	}
	c := WavelengthColor(r.Beam.WavelengthNM)
	p.polygon(xs, ys, `class="beam"`, attr("fill", c), `fill-opacity="0.22"`, attr("stroke", c), `stroke-opacity="0.6"`, `stroke-width="0.6"`)
	if !sagittalDiffers(samples) {
		return
	}
	// Across the table the beam has its own radius wherever a tilted curved mirror made the two
	// planes differ: drawn as dashed edges over the band.
	p.group(`class="beam-sagittal"`, `fill="none"`, attr("stroke", c), `stroke-width="0.9"`, `stroke-dasharray="3 2"`)
	for _, sign := range []float64{1, -1} {
		xs, ys = xs[:0], ys[:0]
		for _, s := range samples {
			if finite(s.PathMM, s.WSMM) {
				xs, ys = append(xs, f.x(s.PathMM)), append(ys, f.y(sign*s.WSMM))
			}
		}
		p.polyline(xs, ys)
	}
	p.gend()
}

// sagittalDiffers reports whether the beam's radius across the table differs anywhere from its
// radius in the table plane by more than 1 %, enough to show at drawing scale.
func sagittalDiffers(samples []optics.BeamSample) bool {
	for _, s := range samples {
		if finite(s.WTMM, s.WSMM) && math.Abs(s.WSMM-s.WTMM) > 0.01*math.Max(s.WTMM, s.WSMM) {
			return true
		}
	}
	return false
}

// drawWaists marks each waist with a tick across the band and its radius as text.
func drawWaists(p *pen, f *sideFrame, r *optics.Report) {
	if r.Beam == nil {
		return
	}
	lastX := []float64{math.Inf(-1), math.Inf(-1)}
	p.group(`class="waists"`)
	defer p.gend()
	for _, w := range r.Beam.Waists {
		rad, plane := w.RadiusTMM, ""
		if rad == nil {
			rad, plane = w.RadiusSMM, " (sagittal)"
		}
		if rad == nil || !finite(*rad, w.PathMM) {
			continue
		}
		x := f.x(w.PathMM)
		top := f.y(*rad)
		p.line(x, top-3, x, f.y(-*rad)+3, `stroke="#333333"`, `stroke-width="0.8"`)
		label := "waist " + fmtLength(*rad) + plane
		half := textWidthPX(label, 10) / 2
		level := 0
		if x-half < lastX[0]+4 {
			level = 1
		}
		lastX[level] = x + half
		// Keep the label inside the drawing when the waist sits at either end of it.
		tx := math.Min(math.Max(x, f.left+half), f.w-half)
		p.text(tx, math.Max(top-6-12*float64(level), f.top+10+12*float64(level)), label,
			`font-size="10"`, `text-anchor="middle"`, `fill="#333333"`)
	}
}
