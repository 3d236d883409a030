package diagram

import (
	"raytable/optics"
)

// drawSideScale draws a horizontal scale bar in mm (about a fifth of the plot) with its length as
// text; with a vertical exaggeration also a vertical bar and a note stating the exaggeration.
func drawSideScale(p *pen, f *sideFrame) {
	y := f.h - 38
	x0 := f.left + 4
	lenMM := niceLength(0.2 * f.pw * f.mmPerPX)
	x1 := x0 + lenMM/f.mmPerPX
	p.group(`stroke="#222222"`, `stroke-width="1.2"`)
	p.line(x0, y, x1, y)
	p.line(x0, y-4, x0, y+4)
	p.line(x1, y-4, x1, y+4)
	p.gend()
	p.text((x0+x1)/2, y-6, fmtNum(lenMM)+" mm", `font-size="11"`, `text-anchor="middle"`, `fill="#222222"`)
	if f.exag <= 1 {
		return
	}
	vMM := niceLength(0.25 * f.ph / f.pxPerMMY())
	vx := x1 + 60
	h := vMM * f.pxPerMMY()
	p.group(`stroke="#222222"`, `stroke-width="1.2"`)
	p.line(vx, y+4-h, vx, y+4)
	p.line(vx-4, y+4-h, vx+4, y+4-h)
	p.line(vx-4, y+4, vx+4, y+4)
	p.gend()
	p.text(vx+6, y+4, fmtNum(vMM)+" mm", `font-size="11"`, `fill="#222222"`)
	p.text(vx+60, y, "vertical exaggeration ×"+fmtNum(f.exag)+" (heights drawn "+fmtNum(f.exag)+" times larger than lengths)",
		`font-size="11"`, `fill="#8a1c00"`)
}

// drawSideLegend lists the wavelengths with their colours, then the paraxial overlay, the beam
// band and the stop marker when they are drawn.
func drawSideLegend(p *pen, f *sideFrame, r *optics.Report, paraxial bool, stops int) {
	y := f.h - 14
	x := f.left + 4
	item := func(label string, swatch func(x float64)) {
		swatch(x)
		p.text(x+24, y+4, label, `font-size="11"`, `fill="#222222"`)
		x += 24 + textWidthPX(label, 11) + 16
	}
	for _, nm := range r.WavelengthsNM {
		c := WavelengthColor(nm)
		item(wavelengthName(nm), func(x float64) {
			p.line(x, y, x+18, y, attr("stroke", c), `stroke-width="2.5"`)
		})
	}
	if paraxial {
		item("paraxial", func(x float64) {
			p.line(x, y, x+18, y, `stroke="#444444"`, `stroke-width="1"`, `stroke-dasharray="4 3"`)
		})
	}
	if samples := r.DrawnSamples(); len(samples) >= 2 {
		c := WavelengthColor(r.Beam.WavelengthNM)
		item("beam 1/e² radius", func(x float64) {
			p.rect(x, y-5, 18, 10, attr("fill", c), `fill-opacity="0.22"`, attr("stroke", c), `stroke-width="0.6"`)
		})
		if sagittalDiffers(samples) {
			item("across the table", func(x float64) {
				p.line(x, y, x+18, y, attr("stroke", c), `stroke-width="0.9"`, `stroke-dasharray="3 2"`)
			})
		}
	}
	if stops > 0 {
		item("ray stops (hover for why)", func(x float64) {
			p.cross(x+9, y, 3.5, `stroke="#b00020"`, `stroke-width="1.4"`)
		})
	}
}
