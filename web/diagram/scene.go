package diagram

import (
	"math"

	"raytable/optics"
)

// Warning codes drawn specially on the table: footprints they name get a red outline.
const (
	codeMountsOverlap = optics.WarnMountsOverlap
	codeMountInBeam   = optics.WarnMountInBeam
)

const (
	nominalOpticHalfMM = 12.7 // half-height drawn for an element without a clear aperture
	regionPadMM        = 20   // room around content that lies off the table
)

// sceneStyle holds the sizes of one rendering of the table, in output units.
type sceneStyle struct {
	s          float64 // output units per mm
	line       float64 // thin stroke
	font       float64
	marker     float64 // warning marker radius
	minHalf    float64 // smallest half-length of an element stroke, output units
	postLabels bool    // label each post with its element id (plan) instead of the element stroke
}

// tableScene is the table seen from above, mapped to output coordinates with the front edge at the
// bottom: output x grows with table x, output y shrinks as table y grows away from the viewer.
type tableScene struct {
	b        *optics.Bench
	r        *optics.Report
	fp       foldedPath
	min, max vec // region drawn, mm
	ox, oy   float64
	st       sceneStyle
	known    bool // the table has a size
	grid     holeGrid
	flagged  map[string]bool
}

func newTableScene(b *optics.Bench, r *optics.Report) *tableScene {
	t := &tableScene{b: b, r: r, fp: newFoldedPath(b, r)}
	if b != nil {
		t.known = finite(b.Table.WidthMM, b.Table.DepthMM) && b.Table.WidthMM > 0 && b.Table.DepthMM > 0
		if t.known && r != nil {
			t.grid = holesOf(r.Holes)
		}
	}
	t.region()
	t.flagged = flaggedMounts(r)
	return t
}

// region is the table plus any content off it (with a margin), or the content alone.
func (t *tableScene) region() {
	lo, hi := vec{math.Inf(1), math.Inf(1)}, vec{math.Inf(-1), math.Inf(-1)}
	grow := func(v vec, pad float64) {
		if !v.finite() {
			return
		}
		lo = vec{math.Min(lo.x, v.x-pad), math.Min(lo.y, v.y-pad)}
		hi = vec{math.Max(hi.x, v.x+pad), math.Max(hi.y, v.y+pad)}
	}
	if t.known {
		grow(vec{0, 0}, 0)
		grow(vec{t.b.Table.WidthMM, t.b.Table.DepthMM}, 0)
	}
	pad := func(v vec) {
		if t.known && v.x >= 0 && v.y >= 0 && v.x <= t.b.Table.WidthMM && v.y <= t.b.Table.DepthMM {
			return
		}
		grow(v, regionPadMM)
	}
	for _, n := range t.fp.nodes {
		pad(n.pos)
	}
	for _, p := range t.r.Placement {
		for _, c := range footprint(p) {
			pad(c)
		}
	}
	if !lo.finite() || !hi.finite() {
		lo, hi = vec{0, 0}, vec{100, 100}
	}
	if hi.x-lo.x < 50 {
		c := (hi.x + lo.x) / 2
		lo.x, hi.x = c-25, c+25
	}
	if hi.y-lo.y < 50 {
		c := (hi.y + lo.y) / 2
		lo.y, hi.y = c-25, c+25
	}
	t.min, t.max = lo, hi
}

func (t *tableScene) widthMM() float64 { return t.max.x - t.min.x }
func (t *tableScene) depthMM() float64 { return t.max.y - t.min.y }

// pt maps a table point (mm) to output coordinates.
func (t *tableScene) pt(v vec) (x, y float64) {
	return t.ox + (v.x-t.min.x)*t.st.s, t.oy + (t.max.y-v.y)*t.st.s
}

func (t *tableScene) poly(vs []vec) (xs, ys []float64) {
	for _, v := range vs {
		x, y := t.pt(v)
		xs, ys = append(xs, x), append(ys, y)
	}
	return xs, ys
}

// footprint is the mount rectangle of a placement: depth along its heading, width across, centred
// on the post.
func footprint(p optics.Placement) []vec {
	u := heading(p.HeadingDeg)
	v := u.perp()
	c := vec{p.TableXMM, p.TableYMM}
	du, dv := u.scale(p.MountDepthMM/2), v.scale(p.MountWidthMM/2)
	return []vec{c.add(du).sub(dv), c.add(du).add(dv), c.sub(du).add(dv), c.sub(du).sub(dv)}
}

// flaggedMounts names the elements whose footprints a collision warning involves: the warning's
// element and every element id its message names as a whole word.
func flaggedMounts(r *optics.Report) map[string]bool {
	flagged := map[string]bool{}
	for _, w := range r.Warnings {
		switch w.Code {
		case codeMountsOverlap:
			// Both mounts of the pair collide.
			flagged[w.Element] = true
			for _, id := range w.Others {
				flagged[id] = true
			}
		case codeMountInBeam:
			// Only the mount standing in the beam; the elements the beam runs between are fine.
			flagged[w.Element] = true
		}
	}
	delete(flagged, "")
	return flagged
}

// position finds an element's table position by id: the element's first vertex, else its post.
func (t *tableScene) position(id string) (vec, bool) {
	for _, e := range t.r.Elements {
		if e.ID == id {
			return vec{e.TableXMM, e.TableYMM}, true
		}
	}
	for _, p := range t.r.Placement {
		if p.ID == id {
			return vec{p.TableXMM, p.TableYMM}, true
		}
	}
	return vec{}, false
}

// draw renders the table: outline, holes, footprints, beam band, path, source, elements, labels
// and warning markers, in that order (later on top).
func (t *tableScene) draw(p *pen) {
	st := t.st
	if t.known {
		x, y := t.pt(vec{0, t.b.Table.DepthMM})
		p.rect(x, y, t.b.Table.WidthMM*st.s, t.b.Table.DepthMM*st.s, `fill="#f3f3ee"`, `stroke="#7d7d7d"`, attr("stroke-width", p.num(st.line*1.5)))
	}
	t.drawHoles(p)
	t.drawFootprints(p)
	t.drawBeam(p)
	t.drawSource(p)
	p.group(`class="elements"`)
	for i := range t.r.Elements {
		t.drawElement(p, &t.r.Elements[i])
	}
	p.gend()
	if st.postLabels {
		t.drawPosts(p)
	} else {
		t.drawLabels(p)
	}
	t.drawWarningMarkers(p)
}

func (t *tableScene) drawHoles(p *pen) {
	g := t.grid
	if g.cols == 0 || g.rows == 0 {
		return
	}
	p.group(`class="holes"`, `fill="#c9c9c2"`)
	for row := 1; row <= g.rows; row++ {
		for col := 1; col <= g.cols; col++ {
			x, y := t.pt(g.hole(col, row))
			p.circle(x, y, g.radius*t.st.s)
		}
	}
	p.gend()
}

func (t *tableScene) drawFootprints(p *pen) {
	lw := p.num(t.st.line)
	p.group(`class="mounts"`)
	defer p.gend()
	for _, pl := range t.r.Placement {
		if !finite(pl.TableXMM, pl.TableYMM, pl.HeadingDeg, pl.MountWidthMM, pl.MountDepthMM) || pl.MountWidthMM <= 0 || pl.MountDepthMM <= 0 {
			continue
		}
		xs, ys := t.poly(footprint(pl))
		if t.flagged[pl.ID] {
			p.polygon(xs, ys, `fill="#f6c9c9"`, `fill-opacity="0.8"`, `stroke="#c62828"`, attr("stroke-width", p.num(2*t.st.line)))
			continue
		}
		p.polygon(xs, ys, `fill="#dbe2ea"`, `fill-opacity="0.75"`, `stroke="#7b8a99"`, attr("stroke-width", lw))
	}
}

// primaryColor is the colour of the beam path: the beam's wavelength, else the first wavelength.
func (t *tableScene) primaryColor() string {
	if t.r.Beam != nil {
		return WavelengthColor(t.r.Beam.WavelengthNM)
	}
	if len(t.r.WavelengthsNM) > 0 {
		return WavelengthColor(t.r.WavelengthsNM[0])
	}
	return WavelengthColor(0)
}

// endsTerminated reports whether the path ends on a screen or a dump.
func (t *tableScene) endsTerminated() bool {
	n := len(t.r.Elements)
	return n > 0 && (t.r.Elements[n-1].Type == optics.TypeDump || t.r.Elements[n-1].Type == optics.TypeScreen)
}

func (t *tableScene) drawBeam(p *pen) {
	c := t.primaryColor()
	if t.r.Beam != nil {
		bands := t.fp.bands(t.r.Beam.Samples)
		if len(bands) > 0 {
			p.group(`class="beam"`, attr("fill", c), `fill-opacity="0.3"`, `stroke="none"`)
			for _, band := range bands {
				xs, ys := t.poly(band)
				p.polygon(xs, ys)
			}
			p.gend()
		}
	}
	var path []vec
	for _, n := range t.fp.nodes {
		path = append(path, n.pos)
	}
	xs, ys := t.poly(path)
	p.polyline(xs, ys, `class="beam-path"`, `fill="none"`, attr("stroke", c), attr("stroke-width", p.num(1.2*t.st.line)), `stroke-linejoin="round"`)
	if t.endsTerminated() {
		return
	}
	// The beam goes on: show where it leaves the drawn region, dashed.
	last := t.fp.nodes[len(t.fp.nodes)-1].pos
	end := last.add(t.fp.tailDir.scale(t.exitDistance(last, t.fp.tailDir)))
	xs, ys = t.poly([]vec{last, end})
	p.polyline(xs, ys, `class="beam-runs-on"`, `fill="none"`, attr("stroke", c), attr("stroke-width", p.num(1.2*t.st.line)), attr("stroke-dasharray", p.num(4*t.st.line)+" "+p.num(3*t.st.line)))
}

// exitDistance is how far from a point inside the region a ray along d runs before leaving it.
func (t *tableScene) exitDistance(a, d vec) float64 {
	best := math.Inf(1)
	if d.x > 1e-12 {
		best = math.Min(best, (t.max.x-a.x)/d.x)
	} else if d.x < -1e-12 {
		best = math.Min(best, (t.min.x-a.x)/d.x)
	}
	if d.y > 1e-12 {
		best = math.Min(best, (t.max.y-a.y)/d.y)
	} else if d.y < -1e-12 {
		best = math.Min(best, (t.min.y-a.y)/d.y)
	}
	if !finite(best) || best < 0 {
		return 0
	}
	return best
}

func (t *tableScene) drawSource(p *pen) {
	a := t.fp.nodes[0].pos
	d := t.fp.dir(0)
	if len(t.fp.nodes) == 1 {
		d = t.fp.tailDir
	}
	size := 2.5 * t.st.minHalf / t.st.s
	n := d.perp()
	tip := a
	back := a.sub(d.scale(2 * size))
	xs, ys := t.poly([]vec{tip, back.add(n.scale(size)), back.sub(n.scale(size))})
	p.polygon(xs, ys, `fill="#222222"`)
	x, y := t.pt(back)
	p.text(x, y-size*t.st.s-0.5*t.st.font, "source", attr("font-size", p.num(t.st.font)), `fill="#222222"`)
}

// drawPosts marks each post with a small cross and the element id (plan).
func (t *tableScene) drawPosts(p *pen) {
	r := 1.5 * t.st.s
	p.group(attr("font-size", p.num(t.st.font)), `fill="#1a1a1a"`)
	for _, pl := range t.r.Placement {
		c := vec{pl.TableXMM, pl.TableYMM}
		if !c.finite() {
			continue
		}
		x, y := t.pt(c)
		p.cross(x, y, r, `stroke="#000000"`, attr("stroke-width", p.num(t.st.line)))
		p.text(x+r+0.6*t.st.s, y-r-0.6*t.st.s, pl.ID)
	}
	p.gend()
}

// drawWarningMarkers puts a numbered marker beside each element a warning names; the number is
// the warning's place in the legend (1-based, report order).
func (t *tableScene) drawWarningMarkers(p *pen) {
	count := map[string]int{}
	m := t.st.marker
	p.group(`class="warning-markers"`)
	defer p.gend()
	for i, w := range t.r.Warnings {
		pos, ok := t.position(w.Element)
		if w.Element == "" || !ok || !pos.finite() {
			continue
		}
		k := count[w.Element]
		count[w.Element]++
		x, y := t.pt(pos)
		x += 1.6*m + float64(k)*2.3*m
		y -= 1.6 * m
		p.group()
		p.title(string(w.Code) + ": " + w.Message)
		p.circle(x, y, m, `fill="#c62828"`)
		p.text(x, y+0.36*m*1.1, itoa(i+1), attr("font-size", p.num(1.1*m)), `fill="#ffffff"`, `text-anchor="middle"`, `font-weight="bold"`)
		p.gend()
	}
}

// legendLine is one line of the warnings legend: the number on a warning's first line only.
type legendLine struct{ num, text string }

// warningLines are the legend lines for the warnings: "n." then "code: message" wrapped to width
// runes, continuation lines without a number.
func warningLines(ws []optics.Warning, width int) []legendLine {
	var lines []legendLine
	for i, w := range ws {
		for k, l := range wrap(string(w.Code)+": "+w.Message, width) {
			n := ""
			if k == 0 {
				n = itoa(i+1) + "."
			}
			lines = append(lines, legendLine{n, l})
		}
	}
	return lines
}

// drawLegendLines writes legend lines from (x, y) downwards, the text indented past the numbers.
func drawLegendLines(p *pen, x, y, font, lineHeight float64, lines []legendLine) {
	p.group(attr("font-size", p.num(font)), `fill="#1a1a1a"`)
	for k, l := range lines {
		yy := y + float64(k)*lineHeight
		if l.num != "" {
			p.text(x, yy, l.num, `fill="#c62828"`, `font-weight="bold"`)
		}
		p.text(x+2.2*font, yy, l.text)
	}
	p.gend()
}
