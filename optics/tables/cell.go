package tables

import (
	"strconv"
	"strings"

	"raytable/optics/numfmt"
)

// Precision names what kind of number a cell holds; each layout's profile (Cell.In) decides the
// digits.
type Precision uint8

const (
	// Value is a computed quantity: six significant digits in text, five on the pages.
	Value Precision = iota
	// Index is a refractive index: six decimals everywhere.
	Index
	// Fraction is a share of 1: four decimals in text, a percentage on the pages.
	Fraction
	// Count is a whole number.
	Count
	// SmallAngle is an angle in rad: written in rad in text and in µrad on the page.
	SmallAngle
)

// Missing says why a cell has no value; each layout words it.
type Missing uint8

const (
	// Undefined: the value does not exist for this design (the EFL of an afocal system).
	Undefined Missing = iota + 1
	// NotCritical: a gap that does not matter to first order has no tolerance.
	NotCritical
	// Flat: a wavefront at a waist has no radius of curvature.
	Flat
	// NoAperture: an element without a clear aperture has no use of it; the compare page leaves
	// such cells out instead of pairing them.
	NoAperture
)

var missingWords = [...]Words{
	Undefined:   {Page: "—", Text: "-", Compare: "—"},
	NotCritical: {Page: "not critical", Text: "-", Compare: "—"},
	Flat:        {Page: "flat", Text: "-", Compare: "—"},
	NoAperture:  {Page: "—", Text: "-", Compare: "—"},
}

// Join says how a pair of values shares one cell.
type Join uint8

const (
	InOut  Join = iota + 1 // heading in and out: "0/90" in text, "0 → 90" on the page
	Range                  // from and to: "100 to 647.34"
	Planes                 // tangential and sagittal: "0.011 / 0.011"
)

var joinWords = [...]Words{
	InOut:  {Page: " → ", Text: "/", Compare: " → "},
	Range:  same(" to "),
	Planes: same(" / "),
}

// Cell is one table cell: a number with its precision, words, a missing value with its reason,
// or two cells joined.
type Cell struct {
	kind    cellKind
	v       float64
	prec    Precision
	words   Words
	missing Missing
	pair    *[2]Cell
	join    Join
}

type cellKind uint8

const (
	numberCell cellKind = iota
	wordsCell
	missingCell
	pairCell
)

func num(v float64, p Precision) Cell { return Cell{kind: numberCell, v: v, prec: p} }

// opt is a number that may be missing, for the reason given.
func opt(v *float64, p Precision, why Missing) Cell {
	if v == nil {
		return absent(why)
	}
	return num(*v, p)
}

func val(v float64) Cell          { return num(v, Value) }
func optVal(v *float64) Cell      { return opt(v, Value, Undefined) }
func count(n int) Cell            { return num(float64(n), Count) }
func text(w Words) Cell           { return Cell{kind: wordsCell, words: w} }
func say(s string) Cell           { return text(same(s)) }
func absent(why Missing) Cell     { return Cell{kind: missingCell, missing: why} }
func pair(a, b Cell, j Join) Cell { return Cell{kind: pairCell, pair: &[2]Cell{a, b}, join: j} }

// In writes the cell as layout l shows it.
func (c Cell) In(l Layout) string {
	switch c.kind {
	case wordsCell:
		return c.words.In(l)
	case missingCell:
		return missingWords[c.missing].In(l)
	case pairCell:
		return c.pair[0].In(l) + joinWords[c.join].In(l) + c.pair[1].In(l)
	}
	v, _ := c.Number(l)
	switch c.prec {
	case Index:
		return numfmt.Index.Format(v)
	case Count:
		return strconv.FormatFloat(v, 'f', -1, 64)
	case Fraction:
		switch l {
		case Text:
			return numfmt.TenThousandth.Format(v)
		case Page:
			return numfmt.Panel.Format(v) + " %"
		}
	}
	if l == Text {
		return numfmt.Report.Format(v)
	}
	if l == Page && numfmt.IsNoise(v) {
		return "0" // rounding noise of a value that is really 0; the compare page keeps every digit
	}
	return numfmt.Panel.Format(v)
}

// Number is the cell's value in the unit layout l writes it in (a Fraction as a percentage and a
// SmallAngle in µrad on the pages); false for a cell that holds no number.
func (c Cell) Number(l Layout) (float64, bool) {
	if c.kind != numberCell {
		return 0, false
	}
	switch {
	case c.prec == Fraction && l != Text:
		return c.v * 100, true
	case c.prec == SmallAngle && l != Text:
		return c.v * 1e6, true
	}
	return c.v, true
}

// Omitted reports whether layout l leaves the cell out rather than showing it as missing.
func (c Cell) Omitted(l Layout) bool {
	return l == Compare && c.kind == missingCell && c.missing == NoAperture
}

// Phrase is a title or note with numbers in it: a text in each layout's wording, in which %[1]s,
// %[2]s, ... stand for the cells it quotes, each written by the layout's profile.
type Phrase struct {
	Words Words
	Args  []Cell
}

// In writes the phrase in layout l.
func (p Phrase) In(l Layout) string {
	s := p.Words.In(l)
	if len(p.Args) == 0 {
		return s
	}
	// One pass from left to right, so that a quoted text is never read as a placeholder.
	var b strings.Builder
	for {
		i := strings.Index(s, "%[")
		if i < 0 {
			break
		}
		end := strings.Index(s[i:], "]s")
		n, err := strconv.Atoi(s[i+2 : i+max(end, 2)])
		if end < 0 || err != nil || n < 1 || n > len(p.Args) {
			b.WriteString(s[:i+2])
			s = s[i+2:]
			continue
		}
		b.WriteString(s[:i])
		b.WriteString(p.Args[n-1].In(l))
		s = s[i+end+2:]
	}
	b.WriteString(s)
	return b.String()
}
