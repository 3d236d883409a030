package diagram

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// This file draws what a branching bench adds on the table: every arm beyond the main line
// (optics.Board.Arms, each with its band, path and own elements, an open port running on as a
// marked stray beam) and a mark at each part two beams meet with their path difference
// (optics.Report.Meetings). A bench that does not branch has no arms beyond the main one and no
// meetings, and its drawing has nothing of this.

// branches are the arms drawn beyond the main line, each paired with its report: the board's arms
// after the first (the main line, drawn from Board.Path), index for index with Report.Arms.
func (t *tableScene) branches() []int {
	var out []int
	for i := 1; i < min(len(t.board.Arms), len(t.r.Arms)); i++ {
		out = append(out, i)
	}
	return out
}

// armColor is the colour of an arm's beam: its first wavelength.
func (t *tableScene) armColor(i int) string {
	if ws := t.r.Arms[i].WavelengthsNM; len(ws) > 0 {
		return WavelengthColor(ws[0])
	}
	return t.primaryColor()
}

// drawArmBeams draws each branch's band and path; an open arm runs on dashed to the edge of the
// drawing with a marked end.
func (t *tableScene) drawArmBeams(p *pen) {
	arms := t.branches()
	if len(arms) == 0 {
		return
	}
	lw := p.num(1.2 * t.st.line)
	p.group(`class="arms"`)
	defer p.gend()
	t.markMainOpen(p)
	for _, i := range arms {
		ba, c := &t.board.Arms[i], t.armColor(i)
		parentPath, parentBand := t.parentOf(i)
		p.group(`class="arm"`, attr("data-arm", t.r.Arms[i].ID))
		if t.r.Arms[i].Beam != nil {
			for _, band := range ba.Band {
				if containsOutline(parentBand, band) {
					continue // the stretch it shares with its parent, drawn there
				}
				xs, ys := t.poly(band)
				p.polygon(xs, ys, attr("fill", c), `fill-opacity="0.3"`, `stroke="none"`)
			}
		}
		var path []r2.Vec
		for _, n := range ba.Path[sharedNodes(parentPath, ba.Path):] {
			if finiteVec(n.At) {
				path = append(path, n.At)
			}
		}
		if len(path) >= 2 {
			xs, ys := t.poly(path)
			p.polyline(xs, ys, `class="beam-path"`, `fill="none"`, attr("stroke", c), attr("stroke-width", lw), `stroke-linejoin="round"`)
		}
		if ba.Open && len(path) > 0 {
			t.drawStray(p, path[len(path)-1], ba.TailDir, c)
		}
		p.gend()
	}
}

// parentOf is the path and band of arm i's parent (the main line's for the main arm and for an
// arm the report names no parent of that is drawn).
func (t *tableScene) parentOf(i int) ([]optics.PathNode, [][]r2.Vec) {
	if p := t.r.Arms[i].Parent; p != nil {
		for _, k := range t.branches() {
			if t.r.Arms[k].ID == *p {
				return t.board.Arms[k].Path, t.board.Arms[k].Band
			}
		}
	}
	if t.r.Arms[i].Parent == nil {
		return nil, nil // a further source's own list shares nothing
	}
	return t.board.Path, t.board.Band
}

// sameMM is how close two points must be to count as one in the drawing.
const sameMM = 1e-6

// sharedNodes is the index of the last node where path still runs along parent from the start
// (the node it leaves the parent at), so that the arm is drawn only from where it branches.
func sharedNodes(parent, path []optics.PathNode) int {
	k := 0
	for k+1 < len(path) && k+1 < len(parent) && r2.Norm(r2.Sub(path[k+1].At, parent[k+1].At)) < sameMM {
		k++
	}
	if len(parent) > 0 && len(path) > 0 && r2.Norm(r2.Sub(path[0].At, parent[0].At)) >= sameMM {
		return 0
	}
	return k
}

// containsOutline reports whether outlines holds one equal to o, point by point.
func containsOutline(outlines [][]r2.Vec, o []r2.Vec) bool {
next:
	for _, c := range outlines {
		if len(c) != len(o) {
			continue
		}
		for k := range c {
			if r2.Norm(r2.Sub(c[k], o[k])) >= sameMM {
				continue next
			}
		}
		return true
	}
	return false
}

// drawStray draws a beam leaving an open port: dashed to the edge of the drawing, with a cross
// where it leaves and the words "open port" beside it there.
func (t *tableScene) drawStray(p *pen, from, dir r2.Vec, c string) {
	if !finiteVec(dir) || r2.Norm(dir) == 0 {
		return
	}
	end := r2.Add(from, r2.Scale(t.exitDistance(from, dir), dir))
	xs, ys := t.poly([]r2.Vec{from, end})
	lw := p.num(1.2 * t.st.line)
	p.polyline(xs, ys, `class="stray-beam"`, `fill="none"`, attr("stroke", c), attr("stroke-width", lw),
		attr("stroke-dasharray", p.num(2*t.st.line)+" "+p.num(2*t.st.line)))
	t.markOpenEnd(p, from, end, dir)
}

// markOpenEnd marks where a stray beam from an open port leaves the drawing: a cross, and the
// words "open port" beside the beam just before it.
func (t *tableScene) markOpenEnd(p *pen, from, end, dir r2.Vec) {
	x, y := t.pt(end)
	p.cross(x, y, 0.8*t.st.marker, `stroke="#c62828"`, attr("stroke-width", p.num(1.2*t.st.line)))
	back := math.Min(0.5*r2.Norm(r2.Sub(end, from)), 40)
	mx, my := t.pt(r2.Sub(r2.Sub(end, r2.Scale(back, dir)), r2.Scale(0.9*t.st.font/t.st.s, perp(dir))))
	p.text(mx, my, "open port", attr("font-size", p.num(0.9*t.st.font)), `fill="#c62828"`, `text-anchor="middle"`)
}

// markMainOpen marks the main line's end as an open port when it is one on a branching bench;
// the main line itself runs on dashed as on every bench (drawBeam).
func (t *tableScene) markMainOpen(p *pen) {
	bd := t.board
	if len(t.branches()) == 0 || !bd.Arms[0].Open || len(bd.Path) == 0 || t.endsTerminated() {
		return
	}
	last := bd.Path[len(bd.Path)-1].At
	end := r2.Add(last, r2.Scale(t.exitDistance(last, bd.TailDir), bd.TailDir))
	t.markOpenEnd(p, last, end, bd.TailDir)
}

// armElements are the elements of the branches with their places, each part once: a pass
// through a part already drawn (within half a millimetre) is not drawn again.
func (t *tableScene) armElements() (es []*optics.ElementPlace, bes []*optics.BoardElement) {
	var drawn []r2.Vec
	for i := range t.elements() {
		drawn = append(drawn, t.board.Elements[i].At)
	}
	for _, i := range t.branches() {
		ar, ba := &t.r.Arms[i], &t.board.Arms[i]
	next:
		for k := range min(len(ar.Elements), len(ba.Elements)) {
			at := ba.Elements[k].At
			for _, d := range drawn {
				if r2.Norm(r2.Sub(at, d)) < 0.5 {
					continue next
				}
			}
			drawn = append(drawn, at)
			es, bes = append(es, &ar.Elements[k]), append(bes, &ba.Elements[k])
		}
	}
	return es, bes
}

// drawArmElements draws and labels the branches' own parts.
func (t *tableScene) drawArmElements(p *pen) {
	es, bes := t.armElements()
	if len(es) == 0 {
		return
	}
	p.group(`class="arm-elements"`)
	for k := range es {
		t.drawElement(p, es[k], bes[k])
	}
	p.gend()
	if t.st.postLabels {
		return
	}
	p.group(attr("font-size", p.num(t.st.font)), `fill="#1a1a1a"`, `text-anchor="middle"`)
	for k, e := range es {
		be := bes[k]
		if !finiteVec(be.At) {
			continue
		}
		x, y := t.pt(r2.Add(be.At, r2.Scale(t.extentMM(e)+1.2*t.st.font/t.st.s, be.Across)))
		p.text(x, y+0.35*t.st.font, e.ID)
	}
	p.gend()
}

// meetingText is what a meeting's mark says: the optical path difference of the beams that leave
// the part together, else only that beams meet there.
func meetingText(m *optics.Meeting) string {
	if m.OPDMM != nil && finite(*m.OPDMM) {
		return "ΔOPL " + fmtNum(*m.OPDMM) + " mm"
	}
	return "beams meet"
}

// drawMeetings rings each part two or more beams reach and writes its path difference.
func (t *tableScene) drawMeetings(p *pen) {
	if len(t.r.Meetings) == 0 {
		return
	}
	p.group(`class="meetings"`)
	defer p.gend()
	for i := range t.r.Meetings {
		m := &t.r.Meetings[i]
		at := r2.Vec{X: m.TableXMM, Y: m.TableYMM}
		if !finiteVec(at) {
			continue
		}
		x, y := t.pt(at)
		rad := 1.4 * t.st.marker
		p.group(`class="meeting"`, attr("data-part", m.Part))
		p.title(m.Part + ": " + meetingText(m))
		p.circle(x, y, rad, `fill="none"`, `stroke="#6a1b9a"`, attr("stroke-width", p.num(1.5*t.st.line)))
		p.text(x+rad+2, y-rad-2, meetingText(m), attr("font-size", p.num(t.st.font)), `fill="#6a1b9a"`, `font-weight="bold"`)
		p.gend()
	}
}
