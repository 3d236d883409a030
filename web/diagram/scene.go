package diagram

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"

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

// tableScene is the report's board (optics.Board) mapped to output coordinates with the front
// edge at the bottom: output x grows with table x, output y shrinks as table y grows away from
// the viewer.
type tableScene struct {
	r        *optics.Report
	board    *optics.Board
	min, max r2.Vec // region drawn, mm
	ox, oy   float64
	st       sceneStyle
	flagged  map[string]bool
}

// noBoard stands in for the board of a report that has none: no table, no path, nothing placed.
var noBoard = &optics.Board{}

func newTableScene(r *optics.Report) *tableScene {
	t := &tableScene{r: r, board: r.Board}
	if t.board == nil {
		t.board = noBoard
	}
	t.region()
	t.flagged = flaggedMounts(r)
	return t
}

// region is the table plus any content off it (with a margin), or the content alone.
func (t *tableScene) region() {
	bd := t.board
	lo, hi := r2.Vec{X: math.Inf(1), Y: math.Inf(1)}, r2.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	grow := func(v r2.Vec, pad float64) {
		if !finiteVec(v) {
			return
		}
		lo = r2.Vec{X: math.Min(lo.X, v.X-pad), Y: math.Min(lo.Y, v.Y-pad)}
		hi = r2.Vec{X: math.Max(hi.X, v.X+pad), Y: math.Max(hi.Y, v.Y+pad)}
	}
	if bd.SizeKnown() {
		grow(r2.Vec{}, 0)
		grow(r2.Vec{X: bd.WidthMM, Y: bd.DepthMM}, 0)
	}
	pad := func(v r2.Vec) {
		if bd.SizeKnown() && v.X >= 0 && v.Y >= 0 && v.X <= bd.WidthMM && v.Y <= bd.DepthMM {
			return
		}
		grow(v, regionPadMM)
	}
	for _, n := range bd.Path {
		pad(n.At)
	}
	for _, a := range bd.Arms {
		for _, n := range a.Path {
			pad(n.At)
		}
	}
	for _, m := range bd.Mounts {
		for _, c := range m.Corners {
			pad(c)
		}
	}
	if !finiteVec(lo) || !finiteVec(hi) {
		lo, hi = r2.Vec{}, r2.Vec{X: 100, Y: 100}
	}
	if hi.X-lo.X < 50 {
		c := (hi.X + lo.X) / 2
		lo.X, hi.X = c-25, c+25
	}
	if hi.Y-lo.Y < 50 {
		c := (hi.Y + lo.Y) / 2
		lo.Y, hi.Y = c-25, c+25
	}
	t.min, t.max = lo, hi
}

func (t *tableScene) widthMM() float64 { return t.max.X - t.min.X }
func (t *tableScene) depthMM() float64 { return t.max.Y - t.min.Y }

// pt maps a table point (mm) to output coordinates.
func (t *tableScene) pt(v r2.Vec) (x, y float64) {
	return t.ox + (v.X-t.min.X)*t.st.s, t.oy + (t.max.Y-v.Y)*t.st.s
}

func (t *tableScene) poly(vs []r2.Vec) (xs, ys []float64) {
	for _, v := range vs {
		x, y := t.pt(v)
		xs, ys = append(xs, x), append(ys, y)
	}
	return xs, ys
}

func finiteVec(v r2.Vec) bool { return finite(v.X, v.Y) }

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

// elements is how many of the report's elements have a place on the board, index for index (all
// of them on a board laid out for the report).
func (t *tableScene) elements() int { return min(len(t.r.Elements), len(t.board.Elements)) }

// mounts is how many of the report's placements have a footprint on the board, index for index.
func (t *tableScene) mounts() int { return min(len(t.r.Placement), len(t.board.Mounts)) }

// position finds an element's table position by id: the element's first vertex, else its post.
func (t *tableScene) position(id string) (r2.Vec, bool) {
	for i := range t.elements() {
		if t.r.Elements[i].ID == id {
			return t.board.Elements[i].At, true
		}
	}
	for i := range t.mounts() {
		if t.r.Placement[i].ID == id {
			return t.board.Mounts[i].Post, true
		}
	}
	return r2.Vec{}, false
}

// draw renders the table: outline, holes, footprints, beam band, path, source, elements, labels
// and warning markers, in that order (later on top).
func (t *tableScene) draw(p *pen) {
	st, bd := t.st, t.board
	if bd.SizeKnown() {
		x, y := t.pt(r2.Vec{Y: bd.DepthMM})
		p.rect(x, y, bd.WidthMM*st.s, bd.DepthMM*st.s, `fill="#f3f3ee"`, `stroke="#7d7d7d"`, attr("stroke-width", p.num(st.line*1.5)))
	}
	t.drawHoles(p)
	t.drawFootprints(p)
	t.drawBeam(p)
	t.drawArmBeams(p)
	t.drawSource(p)
	p.group(`class="elements"`)
	for i := range t.elements() {
		t.drawElement(p, &t.r.Elements[i], &bd.Elements[i])
	}
	p.gend()
	t.drawArmElements(p)
	if st.postLabels {
		t.drawPosts(p)
	} else {
		t.drawLabels(p)
	}
	t.drawMeetings(p)
	t.drawWarningMarkers(p)
}

func (t *tableScene) drawHoles(p *pen) {
	g := t.board.Holes
	cols, rows := drawnHoles(g)
	if cols == 0 || rows == 0 {
		return
	}
	p.group(`class="holes"`, `fill="#c9c9c2"`)
	for row := 1; row <= rows; row++ {
		for col := 1; col <= cols; col++ {
			x, y := t.pt(g.Hole(col, row))
			p.circle(x, y, t.board.HoleRadiusMM*t.st.s)
		}
	}
	p.gend()
}

func (t *tableScene) drawFootprints(p *pen) {
	lw := p.num(t.st.line)
	p.group(`class="mounts"`)
	defer p.gend()
	for i := range t.mounts() {
		pl := &t.r.Placement[i]
		if !finite(pl.TableXMM, pl.TableYMM, pl.HeadingDeg, pl.MountWidthMM, pl.MountDepthMM) || pl.MountWidthMM <= 0 || pl.MountDepthMM <= 0 {
			continue
		}
		xs, ys := t.poly(t.board.Mounts[i].Corners[:])
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

// endsTerminated reports whether the path ends on an element the beam may end on (a screen or a
// dump: optics.Kind.EndsPath).
func (t *tableScene) endsTerminated() bool {
	n := len(t.r.Elements)
	if n == 0 {
		return false
	}
	k, ok := optics.KindOf(t.r.Elements[n-1].Type)
	return ok && k.EndsPath
}

func (t *tableScene) drawBeam(p *pen) {
	c := t.primaryColor()
	bd := t.board
	if t.r.Beam != nil && len(bd.Band) > 0 {
		p.group(`class="beam"`, attr("fill", c), `fill-opacity="0.3"`, `stroke="none"`)
		for _, band := range bd.Band {
			xs, ys := t.poly(band)
			p.polygon(xs, ys)
		}
		p.gend()
	}
	if len(bd.Path) == 0 {
		return
	}
	path := make([]r2.Vec, len(bd.Path))
	for i, n := range bd.Path {
		path[i] = n.At
	}
	xs, ys := t.poly(path)
	p.polyline(xs, ys, `class="beam-path"`, `fill="none"`, attr("stroke", c), attr("stroke-width", p.num(1.2*t.st.line)), `stroke-linejoin="round"`)
	if t.endsTerminated() {
		return
	}
	// The beam goes on: show where it leaves the drawn region, dashed.
	last := path[len(path)-1]
	end := r2.Add(last, r2.Scale(t.exitDistance(last, bd.TailDir), bd.TailDir))
	xs, ys = t.poly([]r2.Vec{last, end})
	p.polyline(xs, ys, `class="beam-runs-on"`, `fill="none"`, attr("stroke", c), attr("stroke-width", p.num(1.2*t.st.line)), attr("stroke-dasharray", p.num(4*t.st.line)+" "+p.num(3*t.st.line)))
}

// exitDistance is how far from a point inside the region a ray along d runs before leaving it.
func (t *tableScene) exitDistance(a, d r2.Vec) float64 {
	best := math.Inf(1)
	if d.X > 1e-12 {
		best = math.Min(best, (t.max.X-a.X)/d.X)
	} else if d.X < -1e-12 {
		best = math.Min(best, (t.min.X-a.X)/d.X)
	}
	if d.Y > 1e-12 {
		best = math.Min(best, (t.max.Y-a.Y)/d.Y)
	} else if d.Y < -1e-12 {
		best = math.Min(best, (t.min.Y-a.Y)/d.Y)
	}
	if !finite(best) || best < 0 {
		return 0
	}
	return best
}

// drawSource draws the first source's arrow, then each further source's with its id.
func (t *tableScene) drawSource(p *pen) {
	bd := t.board
	if len(bd.Path) > 0 {
		t.drawSourceAt(p, bd.Path[0].At, bd.SourceDir, "source")
	}
	for _, i := range t.branches() {
		if a := &t.r.Arms[i]; a.Parent == nil && len(bd.Arms[i].Path) > 0 {
			t.drawSourceAt(p, bd.Arms[i].Path[0].At, bd.Arms[i].SourceDir, a.ID)
		}
	}
}

// drawSourceAt draws an arrowhead ending at a source, pointing along its beam, and its label.
func (t *tableScene) drawSourceAt(p *pen, tip, d r2.Vec, label string) {
	size := 2.5 * t.st.minHalf / t.st.s
	n := perp(d)
	back := r2.Sub(tip, r2.Scale(2*size, d))
	xs, ys := t.poly([]r2.Vec{tip, r2.Add(back, r2.Scale(size, n)), r2.Sub(back, r2.Scale(size, n))})
	p.polygon(xs, ys, `fill="#222222"`)
	x, y := t.pt(back)
	p.text(x, y-size*t.st.s-0.5*t.st.font, label, attr("font-size", p.num(t.st.font)), `fill="#222222"`)
}

// perp turns a direction on the table by 90° counter-clockwise seen from above.
func perp(v r2.Vec) r2.Vec { return r2.Vec{X: -v.Y, Y: v.X} }

// drawPosts marks each post with a small cross and the element id (plan).
func (t *tableScene) drawPosts(p *pen) {
	r := 1.5 * t.st.s
	p.group(attr("font-size", p.num(t.st.font)), `fill="#1a1a1a"`)
	for i := range t.mounts() {
		c := t.board.Mounts[i].Post
		if !finiteVec(c) {
			continue
		}
		x, y := t.pt(c)
		p.cross(x, y, r, `stroke="#000000"`, attr("stroke-width", p.num(t.st.line)))
		p.text(x+r+0.6*t.st.s, y-r-0.6*t.st.s, t.r.Placement[i].ID)
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
		if w.Element == "" || !ok || !finiteVec(pos) {
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
