package diagram

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"math"
	"raytable/optics/numfmt"
	"strconv"
	"strings"

	svg "github.com/ajstarks/svgo/float"
)

// pen wraps an svgo canvas writing into a buffer. Every coordinate goes through q, which rounds to
// the pen's decimals (so the output is byte-stable and has no "-0.0"), and every shape is skipped
// when one of its numbers is not finite.
type pen struct {
	buf bytes.Buffer
	c   *svg.SVG
	dec int
}

func newPen(decimals int) *pen {
	p := &pen{dec: decimals}
	p.c = svg.New(&p.buf)
	p.c.Decimals = decimals
	return p
}

// q rounds v to the pen's decimals and turns -0 into 0.
func (p *pen) q(v float64) float64 {
	s := math.Pow10(p.dec)
	r := math.Round(v*s) / s
	if r == 0 {
		return 0
	}
	return r
}

// num formats v as the pen writes coordinates.
func (p *pen) num(v float64) string { return strconv.FormatFloat(p.q(v), 'f', p.dec, 64) }

func finite(vs ...float64) bool {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// start writes the root element: width and height (with unit, "" for pixels), a viewBox from the
// origin, a font default and an accessible label, then a <title>.
func (p *pen) start(w, h float64, unit string, label string) {
	fmt.Fprintf(&p.buf, `<svg xmlns="http://www.w3.org/2000/svg" width="%s%s" height="%s%s" viewBox="0 0 %s %s" role="img" aria-label="%s" font-family="sans-serif">`+"\n",
		p.num(w), unit, p.num(h), unit, p.num(w), p.num(h), escapeAttr(label))
	p.c.Title(label)
}

func (p *pen) end() []byte {
	p.c.End()
	return bytes.Clone(p.buf.Bytes())
}

// viewport opens a nested <svg> covering the rectangle (x, y, w, h) in the parent's coordinates,
// with the same coordinates inside: what is drawn in it is clipped to the rectangle without ids.
func (p *pen) viewport(x, y, w, h float64) {
	fmt.Fprintf(&p.buf, `<svg x="%s" y="%s" width="%s" height="%s" viewBox="%s %s %s %s" overflow="hidden">`+"\n",
		p.num(x), p.num(y), p.num(w), p.num(h), p.num(x), p.num(y), p.num(w), p.num(h))
}

func (p *pen) endViewport() { p.buf.WriteString("</svg>\n") }

func (p *pen) group(attrs ...string) { p.c.Group(attrs...) }
func (p *pen) gend()                 { p.c.Gend() }

// title writes a <title> (a tooltip for its parent); svgo escapes the text.
func (p *pen) title(s string) { p.c.Title(s) }

func (p *pen) line(x1, y1, x2, y2 float64, attrs ...string) {
	if !finite(x1, y1, x2, y2) {
		return
	}
	p.c.Line(p.q(x1), p.q(y1), p.q(x2), p.q(y2), attrs...)
}

// points rounds a point list and drops non-finite points.
func (p *pen) points(xs, ys []float64) (qx, qy []float64) {
	qx, qy = make([]float64, 0, len(xs)), make([]float64, 0, len(xs))
	for i := range min(len(xs), len(ys)) {
		if finite(xs[i], ys[i]) {
			qx, qy = append(qx, p.q(xs[i])), append(qy, p.q(ys[i]))
		}
	}
	return qx, qy
}

func (p *pen) polyline(xs, ys []float64, attrs ...string) {
	qx, qy := p.points(xs, ys)
	if len(qx) < 2 {
		return
	}
	p.c.Polyline(qx, qy, attrs...)
}

func (p *pen) polygon(xs, ys []float64, attrs ...string) {
	qx, qy := p.points(xs, ys)
	if len(qx) < 3 {
		return
	}
	p.c.Polygon(qx, qy, attrs...)
}

func (p *pen) circle(x, y, r float64, attrs ...string) {
	if !finite(x, y, r) || r <= 0 {
		return
	}
	p.c.Circle(p.q(x), p.q(y), p.q(r), attrs...)
}

func (p *pen) rect(x, y, w, h float64, attrs ...string) {
	if !finite(x, y, w, h) || w <= 0 || h <= 0 {
		return
	}
	p.c.Rect(p.q(x), p.q(y), p.q(w), p.q(h), attrs...)
}

// text writes a label; svgo escapes its content.
func (p *pen) text(x, y float64, s string, attrs ...string) {
	if !finite(x, y) || s == "" {
		return
	}
	p.c.Text(p.q(x), p.q(y), s, attrs...)
}

// cross draws an x-shaped marker of half-size r centred on (x, y) as one path.
func (p *pen) cross(x, y, r float64, attrs ...string) {
	if !finite(x, y, r) {
		return
	}
	d := fmt.Sprintf("M%s %sL%s %sM%s %sL%s %s",
		p.num(x-r), p.num(y-r), p.num(x+r), p.num(y+r), p.num(x-r), p.num(y+r), p.num(x+r), p.num(y-r))
	p.c.Path(d, attrs...)
}

// attr formats one attribute for svgo's attribute list; the value is escaped.
func attr(name, value string) string { return name + `="` + escapeAttr(value) + `"` }

// escapeAttr escapes an attribute value for XML with encoding/xml's escaper, the one svgo uses for
// text: besides quotes, '<' and '&' it replaces characters XML 1.0 forbids (control characters,
// which a title may carry) with U+FFFD, so a standalone drawing always parses. html.EscapeString
// left them raw.
func escapeAttr(s string) string {
	var b strings.Builder
	xml.EscapeText(&b, []byte(s)) // writes to a strings.Builder cannot fail
	return b.String()
}

// fmtNum formats a number for a label: at most 4 significant digits, no exponent, no trailing zeros.
func fmtNum(v float64) string { return numfmt.Label.Format(v) }

// fmtLength formats a length in mm for a label with 3 significant digits, in µm below 1 mm.
func fmtLength(mm float64) string {
	if !finite(mm) {
		return "?"
	}
	if math.Abs(mm) < 1 && mm != 0 {
		return numfmt.Label3.Format(mm*1000) + " µm"
	}
	return numfmt.Label3.Format(mm) + " mm"
}

// niceLength is the largest 1, 2 or 5 times a power of ten not above target (target > 0).
func niceLength(target float64) float64 {
	if !(target > 0) || !finite(target) {
		return 1
	}
	base := math.Pow10(int(math.Floor(math.Log10(target))))
	for _, m := range []float64{5, 2, 1} {
		if m*base <= target {
			return m * base
		}
	}
	return base
}

// wrap breaks s into lines of at most n runes at spaces (words longer than n are cut).
func wrap(s string, n int) []string {
	var lines []string
	var cur []rune
	word := []rune{}
	flush := func() {
		if len(word) == 0 {
			return
		}
		for len(word) > n {
			if len(cur) > 0 {
				lines = append(lines, string(cur))
				cur = cur[:0]
			}
			lines = append(lines, string(word[:n]))
			word = word[n:]
		}
		switch {
		case len(cur) == 0:
			cur = append(cur, word...)
		case len(cur)+1+len(word) <= n:
			cur = append(append(cur, ' '), word...)
		default:
			lines = append(lines, string(cur))
			cur = append(cur[:0], word...)
		}
		word = word[:0]
	}
	for _, c := range s {
		if c == ' ' || c == '\n' || c == '\t' {
			flush()
			continue
		}
		word = append(word, c)
	}
	flush()
	if len(cur) > 0 {
		lines = append(lines, string(cur))
	}
	return lines
}
