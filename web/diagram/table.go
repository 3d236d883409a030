package diagram

import (
	"math"

	"raytable/optics"
)

// TableOptions tune the table view.
type TableOptions struct {
	WidthPX int     // 0: 960 when fitting; with MMPerPX the width follows the table
	MMPerPX float64 // 0: fit the table to the width; otherwise a fixed scale shared by several drawings
	Title   string  // "" uses the report's title
}

const (
	defaultTableWidthPX = 960
	minTableWidthPX     = 320
	tableMarginPX       = 16
	tableTopPX          = 34
	tableFontPX         = 11
	maxWarningLines     = 14
)

// TableMMPerPX is the scale (mm per px) Table would fit for r with options o; the compare page
// passes the larger of two as TableOptions.MMPerPX so both drawings share one scale.
func TableMMPerPX(r *optics.Report, o TableOptions) float64 {
	if r == nil {
		r = &optics.Report{}
	}
	t := newTableScene(r)
	w := float64(defaultTableWidthPX)
	if o.WidthPX > 0 {
		w = math.Max(float64(o.WidthPX), minTableWidthPX)
	}
	return t.widthMM() / (w - 2*tableMarginPX)
}

// Table draws the report's board (optics.Board) from above: the table outline with its hole grid,
// the mount footprints, the folded beam path with the Gaussian envelope, the elements at their
// table positions and headings with their ids, and the warnings in place (collision footprints
// outlined in red, numbered markers listed in a legend). The front edge of the table is at the
// bottom. A report without a board draws its warnings only. It returns a standalone SVG document;
// the same inputs always give the same bytes.
func Table(r *optics.Report, o TableOptions) []byte {
	if r == nil {
		r = &optics.Report{}
	}
	t := newTableScene(r)
	mmPerPX := TableMMPerPX(r, o)
	w := float64(defaultTableWidthPX)
	if o.WidthPX > 0 {
		w = math.Max(float64(o.WidthPX), minTableWidthPX)
	}
	if o.MMPerPX > 0 && finite(o.MMPerPX) {
		mmPerPX = o.MMPerPX
		if o.WidthPX <= 0 {
			w = math.Max(t.widthMM()/mmPerPX+2*tableMarginPX, minTableWidthPX)
		}
	}
	t.st = sceneStyle{s: 1 / mmPerPX, line: 1, font: tableFontPX, marker: 7, minHalf: 4}
	t.ox, t.oy = tableMarginPX, tableTopPX
	plotW, plotH := w-2*tableMarginPX, t.depthMM()/mmPerPX

	charsPerLine := int((plotW - 3*tableFontPX) / (0.55 * tableFontPX))
	lines := warningLines(r.Warnings, max(charsPerLine, 20))
	more := 0
	if len(lines) > maxWarningLines {
		more = len(lines) - maxWarningLines
		lines = lines[:maxWarningLines]
	}
	legendTop := tableTopPX + plotH + 40
	h := legendTop + 12
	if len(lines) > 0 {
		h += float64(len(lines)+1)*15 + 4
	}
	if more > 0 {
		h += 15
	}

	title := o.Title
	if title == "" {
		title = r.Title
	}
	label := "Table view"
	if title != "" {
		label += ": " + title
	}

	p := newPen(1)
	p.start(w, h, "", label)
	p.rect(0, 0, w, h, `fill="#ffffff"`)
	p.text(tableMarginPX, 20, label, `font-size="14"`, `font-weight="bold"`, `fill="#222222"`)
	p.text(w-tableMarginPX, 20, tableCaption(t.board), `font-size="11"`, `text-anchor="end"`, `fill="#555555"`)
	p.viewport(tableMarginPX, tableTopPX, plotW, plotH)
	t.draw(p)
	p.endViewport()

	drawTableScale(p, tableMarginPX+4, tableTopPX+plotH+24, mmPerPX, plotW)
	drawTableLegend(p, t, tableMarginPX+4+0.22*plotW+60, tableTopPX+plotH+24)
	if len(lines) > 0 {
		p.text(tableMarginPX, legendTop+14, "Warnings", `font-size="12"`, `font-weight="bold"`, `fill="#c62828"`)
		drawLegendLines(p, tableMarginPX, legendTop+29, tableFontPX, 15, lines)
		if more > 0 {
			p.text(tableMarginPX, legendTop+29+float64(len(lines))*15, "and "+itoa(more)+" more lines: see the numbers",
				`font-size="11"`, `fill="#555555"`)
		}
	}
	return p.end()
}

// tableCaption states the table size, grid and orientation.
func tableCaption(bd *optics.Board) string {
	if !bd.SizeKnown() {
		return "table size unknown; front at the bottom"
	}
	s := fmtNum(bd.WidthMM) + " × " + fmtNum(bd.DepthMM) + " mm"
	if cols, rows := drawnHoles(bd.Holes); cols > 0 {
		s += ", " + itoa(cols) + " × " + itoa(rows) + " holes every " + fmtNum(bd.Holes.PitchMM) + " mm"
	}
	return s + "; front edge at the bottom"
}

// drawTableScale draws a scale bar about a fifth of the plot wide with its length as text.
func drawTableScale(p *pen, x0, y, mmPerPX, plotW float64) {
	lenMM := niceLength(0.2 * plotW * mmPerPX)
	x1 := x0 + lenMM/mmPerPX
	p.group(`stroke="#222222"`, `stroke-width="1.2"`)
	p.line(x0, y, x1, y)
	p.line(x0, y-4, x0, y+4)
	p.line(x1, y-4, x1, y+4)
	p.gend()
	p.text((x0+x1)/2, y-6, fmtNum(lenMM)+" mm", `font-size="11"`, `text-anchor="middle"`, `fill="#222222"`)
}

// drawTableLegend explains the beam, its envelope and the footprints.
func drawTableLegend(p *pen, t *tableScene, x, y float64) {
	c := t.primaryColor()
	item := func(label string, swatch func(x float64)) {
		swatch(x)
		p.text(x+24, y+4, label, `font-size="11"`, `fill="#222222"`)
		x += 24 + textWidthPX(label, 11) + 16
	}
	item("beam path", func(x float64) { p.line(x, y, x+18, y, attr("stroke", c), `stroke-width="1.5"`) })
	if t.r.Beam != nil && len(t.r.Beam.Samples) >= 2 {
		item("beam 1/e² radius", func(x float64) {
			p.rect(x, y-5, 18, 10, attr("fill", c), `fill-opacity="0.3"`)
		})
	}
	if len(t.r.Placement) > 0 {
		item("mount", func(x float64) {
			p.rect(x, y-5, 18, 10, `fill="#dbe2ea"`, `stroke="#7b8a99"`)
		})
	}
	if len(t.flagged) > 0 {
		item("mount in a collision", func(x float64) {
			p.rect(x, y-5, 18, 10, `fill="#f6c9c9"`, `stroke="#c62828"`, `stroke-width="2"`)
		})
	}
}
