package diagram

import (
	"math"

	"raytable/optics"
)

// SideOptions tune the side view.
type SideOptions struct {
	WidthPX, HeightPX int     // 0: defaults (960 x 360)
	Exaggeration      float64 // vertical exaggeration; 0 or 1 = none; stated on the drawing when > 1
	ShowParaxial      bool    // overlay paraxial rays (dashed) from hits[].paraxial
	MMPerPX           float64 // 0: fit; otherwise a fixed horizontal scale shared by several drawings
	ZMaxMM            float64 // 0: fit to the bench (PathLengthMM); compare passes the larger of two
	Title             string  // "" uses the report's title
}

const (
	defaultSideWidthPX  = 960
	defaultSideHeightPX = 360
	minSideWidthPX      = 320
	minSideHeightPX     = 180
	maxSideRays         = 240 // keeps a side view well under 80 KB; stopped rays are kept first

	sideMarginPX = 12 // left and right
	sideTopPX    = 58 // title and two rows of element labels
	sideBottomPX = 60 // scale bar, legend, notes
	runOutFrac   = 0.06
)

// sideFrame maps unfolded-path millimetres (z along the path, y the table-plane height) to pixels.
type sideFrame struct {
	w, h                 float64 // canvas
	left, top, pw, ph    float64 // plot area
	zStart, zFit, runOut float64 // mm
	mmPerPX, exag        float64
	yHalfMM              float64 // half the vertical range drawn
}

func (f *sideFrame) x(z float64) float64 { return f.left + (z-f.zStart)/f.mmPerPX }
func (f *sideFrame) y(y float64) float64 { return f.top + f.ph/2 - y*f.exag/f.mmPerPX }

// pxPerMMY is the vertical scale in px per mm.
func (f *sideFrame) pxPerMMY() float64 { return f.exag / f.mmPerPX }

// PathLengthMM is the length of unfolded path a side view of r fits by default: the furthest of
// the last face, the ray hits and the beam samples (at least 1 mm). The compare page passes the
// larger of two as SideOptions.ZMaxMM.
func PathLengthMM(r *optics.Report) float64 {
	z := 0.0
	if r == nil {
		return 100
	}
	for _, e := range r.Elements {
		z = maxFinite(z, e.PathMM)
		for _, f := range e.Faces {
			z = maxFinite(z, f.PathMM)
		}
	}
	faces := newFaceIndex(r)
	for i := range r.Rays {
		for _, h := range r.Rays[i].Hits {
			if fz, ok := faces.z(h.Element, h.Face); ok {
				z = maxFinite(z, fz+h.Exact.ZMM)
			}
		}
	}
	for _, s := range r.DrawnSamples() {
		z = maxFinite(z, s.PathMM)
	}
	if z <= 0 {
		return 100
	}
	return math.Max(z, 1)
}

// SideMMPerPX is the horizontal scale (mm per px) Side would fit for r with options o; the compare
// page passes the larger of two as SideOptions.MMPerPX so both drawings share one scale.
func SideMMPerPX(r *optics.Report, o SideOptions) float64 {
	o.MMPerPX = 0
	return newSideFrame(r, o).mmPerPX
}

func maxFinite(a, b float64) float64 {
	if !finite(b) {
		return a
	}
	return math.Max(a, b)
}

// sideSize is the side view's canvas in px at options o.
func sideSize(o SideOptions) (w, h float64) {
	w, h = defaultSideWidthPX, defaultSideHeightPX
	if o.WidthPX > 0 {
		w = math.Max(float64(o.WidthPX), minSideWidthPX)
	}
	if o.HeightPX > 0 {
		h = math.Max(float64(o.HeightPX), minSideHeightPX)
	}
	return w, h
}

// SidePlotHeightPX is the height in px of the side view's plot at options o: the canvas less the
// title and element labels above the plot and the scale bar and legend below it. The page sizes
// its vertical exaggeration to it.
func SidePlotHeightPX(o SideOptions) float64 {
	_, h := sideSize(o)
	return h - sideTopPX - sideBottomPX
}

func newSideFrame(r *optics.Report, o SideOptions) *sideFrame {
	f := &sideFrame{exag: 1}
	f.w, f.h = sideSize(o)
	if o.Exaggeration > 1 && finite(o.Exaggeration) {
		f.exag = o.Exaggeration
	}
	f.left, f.top = sideMarginPX, sideTopPX
	f.pw, f.ph = f.w-2*sideMarginPX, SidePlotHeightPX(o)

	f.zFit = PathLengthMM(r)
	if o.ZMaxMM > 0 && finite(o.ZMaxMM) {
		f.zFit = o.ZMaxMM
	}
	f.runOut = runOutFrac * f.zFit
	f.zStart = -0.025 * f.zFit
	zEnd := f.zFit + 1.25*f.runOut

	f.yHalfMM = 1.15 * contentHeightMM(r)
	f.mmPerPX = math.Max((zEnd-f.zStart)/f.pw, 2*f.yHalfMM*f.exag/f.ph)
	if o.MMPerPX > 0 && finite(o.MMPerPX) {
		f.mmPerPX = o.MMPerPX
	}
	return f
}

// contentHeightMM is the largest |y| of anything drawn: ray points, clear semi-diameters, beam radii.
func contentHeightMM(r *optics.Report) float64 {
	y := 0.0
	if r == nil {
		return 1
	}
	for _, e := range r.Elements {
		if e.SemiDiameterMM != nil {
			y = maxFinite(y, *e.SemiDiameterMM)
		}
		for _, f := range e.Faces {
			if f.SemiDiameterMM != nil {
				y = maxFinite(y, *f.SemiDiameterMM)
			}
		}
	}
	for i := range r.Rays {
		y = maxFinite(y, math.Abs(r.Rays[i].Start.YMM))
		for _, h := range r.Rays[i].Hits {
			y = maxFinite(y, math.Abs(h.Exact.YMM))
		}
	}
	for _, s := range r.DrawnSamples() {
		y = maxFinite(y, s.WTMM)
	}
	if y <= 0 {
		return 1
	}
	return y
}

// faceIndex finds a face's vertex position along the path by element id and face number.
type faceIndex struct {
	faces map[string][]float64
	types map[string]string
}

func newFaceIndex(r *optics.Report) faceIndex {
	fi := faceIndex{faces: map[string][]float64{}, types: map[string]string{}}
	for _, e := range r.Elements {
		if _, dup := fi.faces[e.ID]; dup {
			continue
		}
		zs := make([]float64, len(e.Faces))
		for k, f := range e.Faces {
			zs[k] = f.PathMM
		}
		if len(zs) == 0 {
			zs = []float64{e.PathMM}
		}
		fi.faces[e.ID] = zs
		fi.types[e.ID] = e.Type
	}
	return fi
}

func (fi faceIndex) z(id string, face int) (float64, bool) {
	zs, ok := fi.faces[id]
	if !ok || face < 0 || face >= len(zs) {
		return 0, false
	}
	return zs[face], true
}

// Side draws the side view of a report: the unfolded optical path along z (horizontal) with the
// table-plane height y (vertical, up = +y), to scale with an optional vertical exaggeration. It
// returns a standalone SVG document; the same report and options always give the same bytes.
func Side(r *optics.Report, o SideOptions) []byte {
	if r == nil {
		r = &optics.Report{}
	}
	f := newSideFrame(r, o)
	faces := newFaceIndex(r)
	title := o.Title
	if title == "" {
		title = r.Title
	}
	label := "Side view"
	if title != "" {
		label += ": " + title
	}

	p := newPen(1)
	p.start(f.w, f.h, "", label)
	p.rect(0, 0, f.w, f.h, `fill="#ffffff"`)
	p.text(f.left, 18, label, `font-size="14"`, `font-weight="bold"`, `fill="#222222"`)

	p.viewport(f.left, f.top, f.pw, f.ph)
	p.rect(f.left, f.top, f.pw, f.ph, `fill="#fbfbf8"`, `stroke="#dddddd"`)
	p.line(f.x(f.zStart), f.y(0), f.x(f.zFit+2*f.runOut), f.y(0), `stroke="#999999"`, `stroke-width="0.6"`, `stroke-dasharray="8 3 2 3"`)
	p.line(f.x(0), f.y(0)-6, f.x(0), f.y(0)+6, `stroke="#444444"`, `stroke-width="2"`)
	drawBeamBand(p, f, r)
	nominal := nominalHeights(r, f)
	p.group(`class="elements"`)
	for i := range r.Elements {
		drawSideElement(p, f, &r.Elements[i], nominal[i])
	}
	p.gend()
	rays := selectRays(r.Rays, maxSideRays)
	stops := drawExactRays(p, f, faces, r.Rays, rays)
	if o.ShowParaxial {
		drawParaxialRays(p, f, faces, r.Rays, rays)
	}
	drawWaists(p, f, r)
	if len(r.Elements) == 0 && len(r.Rays) == 0 {
		p.text(f.left+f.pw/2, f.top+f.ph/2-12, "nothing to draw yet: no elements and no rays",
			`font-size="12"`, `text-anchor="middle"`, `fill="#777777"`)
	}
	p.endViewport()

	drawElementLabels(p, f, r)
	drawSideScale(p, f)
	drawSideLegend(p, f, r, o.ShowParaxial, stops)
	if len(rays) < len(r.Rays) {
		p.text(f.w-sideMarginPX, f.h-8, "showing "+itoa(len(rays))+" of "+itoa(len(r.Rays))+" rays",
			`font-size="10"`, `text-anchor="end"`, `fill="#555555"`)
	}
	return p.end()
}
