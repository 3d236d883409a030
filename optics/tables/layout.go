package tables

import "strings"

// Layout is a set of the places that show a report's tables.
type Layout uint8

const (
	// Text is `raytable report`: aligned plain text, terse words, six significant digits.
	Text Layout = 1 << iota
	// Page is the numbers panel of the bench page: full words, five significant digits.
	Page
	// Compare is the compare page: every paired number of two reports, named by what it belongs to.
	Compare

	// Everywhere is every layout.
	Everywhere = Text | Page | Compare
)

// Has reports whether l includes x.
func (l Layout) Has(x Layout) bool { return l&x != 0 }

// Words is one piece of text in each layout's wording. Set every field that the layouts in which
// the text appears need: there is no fallback, so an empty field is an empty text.
type Words struct{ Page, Text, Compare string }

// same is one wording for every layout.
func same(s string) Words { return Words{Page: s, Text: s, Compare: s} }

// In is the wording of layout l.
func (w Words) In(l Layout) string {
	switch l {
	case Text:
		return w.Text
	case Compare:
		return w.Compare
	}
	return w.Page
}

// Unit is the unit of a column or of a quantity row.
type Unit uint8

const (
	NoUnit Unit = iota
	MM
	NM
	Deg
	UM
	MMPerMM
	RadPerMM // with SmallAngle cells: the page writes µrad per mm
	Percent  // with Fraction cells: the page writes the sign in each cell, the compare page in the head
	PS
	FS
	MRad
	WPerCM2
	JPerCM2
)

// unitWords spells each unit in each layout.
var unitWords = [...]Words{
	NoUnit:   {},
	MM:       same("mm"),
	NM:       same("nm"),
	Deg:      {Page: "°", Text: "deg", Compare: "°"},
	UM:       {Page: "µm", Text: "um", Compare: "µm"},
	MMPerMM:  {Page: "mm per mm", Text: "per mm", Compare: "mm per mm"},
	RadPerMM: {Page: "µrad per mm", Text: "rad per mm", Compare: "µrad per mm"},
	Percent:  {Compare: "%"},
	PS:       same("ps"),
	FS:       same("fs"),
	MRad:     same("mrad"),
	WPerCM2:  {Page: "W/cm²", Text: "W/cm2", Compare: "W/cm²"},
	JPerCM2:  {Page: "J/cm²", Text: "J/cm2", Compare: "J/cm²"},
}

// In is u as layout l writes it; "" when l writes no unit.
func (u Unit) In(l Layout) string { return unitWords[u].In(l) }

// Label joins a name and a unit in layout l's style: "EFL mm" in text, "EFL (mm)" elsewhere.
// An empty name gives an empty label.
func Label(name string, u Unit, l Layout) string {
	unit := u.In(l)
	switch {
	case name == "" || unit == "": // a unit alone heads nothing
		return name
	case l == Text:
		return join(name, unit)
	}
	return join(name, "("+unit+")")
}

// Origin is the point a position along the path is measured from.
type Origin struct {
	Point string // "first vertex", "last vertex"
	// Usual says the quantity is defined from this point (a principal plane, the image
	// distance), so the terse layouts leave it out.
	Usual bool
}

// quantityLabel names a quantity row in layout l: the page states every origin before the unit
// ("exit pupil from the last vertex (mm)"), the terse layouts only an unusual one, after it
// ("exit pupil mm (from last vertex)").
func quantityLabel(name Words, u Unit, from *Origin, l Layout) string {
	n := name.In(l)
	if from == nil {
		return Label(n, u, l)
	}
	if l == Page {
		return Label(n+" from the "+from.Point, u, l)
	}
	s := Label(n, u, l)
	if !from.Usual {
		s += " (from " + from.Point + ")"
	}
	return s
}

// join puts a space between the parts that are not empty.
func join(parts ...string) string {
	var kept []string
	for _, p := range parts {
		if p != "" {
			kept = append(kept, p)
		}
	}
	return strings.Join(kept, " ")
}
