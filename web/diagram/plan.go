package diagram

import (
	"math"
	"strconv"

	"raytable/optics"
	"raytable/optics/numfmt"
)

// CheckBarLabel is printed above the plan's 100 mm check bar.
const CheckBarLabel = "print at 100 %: this bar must measure 100 mm"

// Plan sizes in mm (1 user unit = 1 mm).
const (
	planMarginMM   = 12
	planMinWidthMM = 190 // room for the check bar and a readable cautions box
	planRowLabelMM = 9   // room left of the table for row numbers
	planFontMM     = 3.2
	planLineMM     = 4.3
	checkBarMM     = 100
	planMaxChars   = 110 // longest text line, for reading comfort
)

// Plan draws the table view in millimetres for printing at 100 %: the root element has width and
// height in mm and a viewBox in mm, so one user unit is one millimetre on paper. It adds a 100 mm
// check bar, hole columns and rows numbered along the front and left edges, each post marked with
// its element id, the list of posts with their holes, the warnings and the laser cautions.
func Plan(r *optics.Report) []byte {
	if r == nil {
		r = &optics.Report{}
	}
	t := newTableScene(r)
	t.st = sceneStyle{s: 1, line: 0.3, font: planFontMM, marker: 2.6, minHalf: 1.5, postLabels: true}
	w := math.Max(t.widthMM()+2*planMarginMM+planRowLabelMM, planMinWidthMM)
	textW := w - 2*planMarginMM
	chars := min(int(textW/(0.52*planFontMM)), planMaxChars)
	boxW := math.Min(textW, float64(planMaxChars)*0.52*planFontMM+6)

	title := r.Title
	label := "Bench plan"
	if title != "" {
		label += ": " + title
	}

	tableTop := planMarginMM + 34.0
	t.ox, t.oy = planMarginMM+planRowLabelMM, tableTop
	y := tableTop + t.depthMM() + 12
	posts := postLines(r.Placement, chars)
	warns := warningLines(r.Warnings, chars-4)
	caution := wrap(optics.CautionText(), chars-4)
	for _, line := range optics.PowerLevels(r) {
		caution = append(caution, wrap(line, chars-4)...)
	}
	h := y
	if len(posts) > 0 {
		h += planLineMM*float64(len(posts)+1) + 4
	}
	if len(warns) > 0 {
		h += planLineMM*float64(len(warns)+1) + 4
	}
	cautionH := planLineMM*float64(len(caution)+1) + 6
	h += cautionH + planMarginMM

	p := newPen(2)
	p.start(w, h, "mm", label)
	p.rect(0, 0, w, h, `fill="#ffffff"`)
	p.text(planMarginMM, planMarginMM+5, label, `font-size="5.5"`, `font-weight="bold"`, `fill="#000000"`)
	p.text(planMarginMM, planMarginMM+11, tableCaption(t.board)+"; 1 unit = 1 mm", attr("font-size", p.num(planFontMM)), `fill="#333333"`)
	drawCheckBar(p, planMarginMM, planMarginMM+16)

	p.viewport(t.ox, t.oy, t.widthMM(), t.depthMM())
	t.draw(p)
	p.endViewport()
	drawHoleNumbers(p, t)

	if len(posts) > 0 {
		p.text(planMarginMM, y, "Posts (hole column and row from the front-left corner; offset of the post from the hole)",
			`font-size="3.5"`, `font-weight="bold"`, `fill="#000000"`)
		p.group(attr("font-size", p.num(planFontMM)), `fill="#1a1a1a"`)
		for k, l := range posts {
			p.text(planMarginMM, y+planLineMM*float64(k+1), l)
		}
		p.gend()
		y += planLineMM*float64(len(posts)+1) + 4
	}
	if len(warns) > 0 {
		p.text(planMarginMM, y, "Warnings", `font-size="3.5"`, `font-weight="bold"`, `fill="#c62828"`)
		drawLegendLines(p, planMarginMM, y+planLineMM, planFontMM, planLineMM, warns)
		y += planLineMM*float64(len(warns)+1) + 4
	}
	drawCautions(p, planMarginMM, y, boxW, cautionH, caution)
	return p.end()
}

// drawCheckBar draws a black bar exactly checkBarMM long with ticks every 10 mm and its label.
func drawCheckBar(p *pen, x, y float64) {
	p.text(x, y+3, CheckBarLabel, attr("font-size", p.num(planFontMM)), `fill="#000000"`)
	p.rect(x, y+5, checkBarMM, 2.5, `class="check-bar"`, `fill="#000000"`)
	p.group(`stroke="#000000"`, `stroke-width="0.25"`)
	for mm := 0; mm <= checkBarMM; mm += 10 {
		tick := 1.5
		if mm%50 == 0 {
			tick = 3
		}
		p.line(x+float64(mm), y+7.5, x+float64(mm), y+7.5+tick)
	}
	p.gend()
	p.group(`font-size="2.5"`, `fill="#000000"`, `text-anchor="middle"`)
	for _, mm := range []int{0, 50, 100} {
		p.text(x+float64(mm), y+13.2, strconv.Itoa(mm)+" mm")
	}
	p.gend()
}

// drawHoleNumbers numbers the hole columns below the front edge and the rows left of the left edge.
func drawHoleNumbers(p *pen, t *tableScene) {
	g := t.board.Holes
	cols, rows := drawnHoles(g)
	if cols == 0 || rows == 0 {
		return
	}
	front := t.oy + t.depthMM()
	p.group(`class="hole-numbers"`, `font-size="2.5"`, `fill="#555555"`, `text-anchor="middle"`)
	for col := 1; col <= cols; col++ {
		x, _ := t.pt(g.Hole(col, 1))
		p.text(x, front+3.6, strconv.Itoa(col))
	}
	p.gend()
	p.group(`class="hole-numbers"`, `font-size="2.5"`, `fill="#555555"`, `text-anchor="end"`)
	for row := 1; row <= rows; row++ {
		_, y := t.pt(g.Hole(1, row))
		p.text(t.ox-1.5, y+0.9, strconv.Itoa(row))
	}
	p.gend()
}

// postLines describe each post: id, type, hole and offset, wrapped to chars runes.
func postLines(ps []optics.Placement, chars int) []string {
	var lines []string
	for _, pl := range ps {
		s := pl.ID + " (" + pl.Type + "): "
		if pl.HoleColumn > 0 && pl.HoleRow > 0 {
			s += "column " + strconv.Itoa(pl.HoleColumn) + ", row " + strconv.Itoa(pl.HoleRow) +
				", offset x " + signed(pl.OffsetXMM) + " mm, y " + signed(pl.OffsetYMM) + " mm"
		} else {
			s += "x " + fmtNum(pl.TableXMM) + " mm, y " + fmtNum(pl.TableYMM) + " mm (no hole grid)"
		}
		lines = append(lines, wrap(s, chars)...)
	}
	return lines
}

// signed formats a length with an explicit sign, to 0.1 mm.
func signed(v float64) string { return numfmt.Signed(numfmt.Tenth, v) }

// drawCautions draws the laser cautions in a box.
func drawCautions(p *pen, x, y, w, h float64, lines []string) {
	p.rect(x, y, w, h, `class="cautions"`, `fill="#fff8e1"`, `stroke="#e65100"`, `stroke-width="0.5"`)
	p.text(x+3, y+planLineMM+1, "Laser safety", `font-size="3.5"`, `font-weight="bold"`, `fill="#b71c1c"`)
	p.group(`class="cautions-text"`, attr("font-size", p.num(planFontMM)), `fill="#1a1a1a"`)
	for k, l := range lines {
		p.text(x+3, y+planLineMM*float64(k+2)+1, l)
	}
	p.gend()
}
