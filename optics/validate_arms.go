package optics

import (
	"math"
	"reflect"
	"slices"
	"strings"
	"unicode/utf8"
)

// This file holds Validate's rules of a branching bench (README "Bench file": splitter, periscope,
// same_as, more_sources): the splitter's and periscope's own fields, the pass rules, the further
// sources.

// TurnToleranceDeg is how far a same_as pass's given turn_deg may differ from the computed one.
const TurnToleranceDeg = 0.01

// passKeys are the only fields a same_as pass carries; everything physical is its part's.
var passKeys = []string{"id", "type", "gap_mm", "same_as", "turn_deg", "reflected"}

// splitter checks a splitter's turn, split, dichroic edge and plate.
func (v *checker) splitter(p string, e *Element, _ bool) {
	tp := field(p, "turn_deg")
	if e.TurnDeg != nil && v.finite(tp, *e.TurnDeg) {
		if t := math.Abs(*e.TurnDeg); t == 0 || t >= 180 {
			v.add(tp, "turn %s° of the reflected beam must have a magnitude above 0° and below 180°", fmtNum(*e.TurnDeg))
		}
	}
	if e.Reflect != nil && v.finite(field(p, "reflect"), *e.Reflect) && (*e.Reflect < 0 || *e.Reflect > 1) {
		v.add(field(p, "reflect"), "the fraction reflected must lie between 0 and 1, got %s", fmtNum(*e.Reflect))
	}
	if d := e.Dichroic; d != nil {
		dp := field(p, "dichroic")
		if e.Reflect != nil {
			v.add(field(p, "reflect"), "a dichroic splitter sends each wavelength wholly to one port: give reflect or dichroic, not both")
		}
		if v.finite(field(dp, "edge_nm"), d.EdgeNM) && (d.EdgeNM < MinWavelengthNM || d.EdgeNM > MaxWavelengthNM) {
			v.add(field(dp, "edge_nm"), "edge %s nm is outside the accepted range %s-%s nm", fmtNum(d.EdgeNM), fmtNum(MinWavelengthNM), fmtNum(MaxWavelengthNM))
		}
		if d.Reflects != ReflectsShorter && d.Reflects != ReflectsLonger {
			v.add(field(dp, "reflects"), "must be %s, got %q", quotedList([]string{ReflectsShorter, ReflectsLonger}), d.Reflects)
		}
	}
	switch {
	case e.ThicknessMM != nil && e.Material == "":
		v.add(field(p, "material"), "a splitter plate of thickness_mm needs material, the medium of the plate")
	case e.ThicknessMM == nil && e.Material != "":
		v.add(field(p, "thickness_mm"), "a splitter plate of material %q needs thickness_mm; without a plate leave material out", e.Material)
	}
	if e.ThicknessMM != nil {
		v.positive(field(p, "thickness_mm"), *e.ThicknessMM)
	}
	if e.Material != "" {
		v.lensMaterial(field(p, "material"), e.Material, v.checkedMedia)
	}
}

// periscope checks a periscope's rise and turn.
func (v *checker) periscope(p string, e *Element, _ bool) {
	if rp := field(p, "rise_mm"); e.RiseMM != nil && v.length(rp, *e.RiseMM) && *e.RiseMM == 0 {
		v.add(rp, "rise must not be 0 mm: a periscope lifts or lowers the beam (negative lowers)")
	}
	if tp := field(p, "turn_deg"); e.TurnDeg != nil && v.finite(tp, *e.TurnDeg) && math.Abs(*e.TurnDeg) > 180 {
		v.add(tp, "turn %s° must lie between -180° and 180°", fmtNum(*e.TurnDeg))
	}
}

// pass checks a same_as pass: it names a part placed before it, has the part's type and carries
// nothing physical of its own.
func (v *checker) pass(p string, e *Element, placed map[string]*Element) {
	sp := field(p, "same_as")
	part, ok := placed[e.SameAs]
	switch {
	case e.SameAs == e.ID:
		v.add(sp, "a pass cannot name itself: same_as names the part placed earlier")
		return
	case !ok:
		v.add(sp, "%q names no part placed before this pass (a part is placed earlier when it comes before the pass in its list, or in a list before it: each list before the lists it starts)", e.SameAs)
		return
	case part.Type != e.Type:
		v.add(field(p, "type"), "a pass through %s must have the part's type %q, got %q", e.SameAs, part.Type, e.Type)
	}
	ev := reflect.ValueOf(e).Elem()
	for _, f := range allElementFields {
		if slices.Contains(passKeys, f.Key) || f.value(ev).IsZero() {
			continue
		}
		v.add(field(p, f.Key), "a same_as pass carries only %s: everything physical is the part's (%s)", strings.Join(passKeys, ", "), e.SameAs)
	}
	if len(e.Reflected) > 0 && part.Type != TypeSplitter {
		v.add(field(p, "reflected"), "only a pass through a splitter has a reflected list")
	}
	if e.TurnDeg != nil {
		v.finite(field(p, "turn_deg"), *e.TurnDeg)
	}
}

// passGeometry follows the beam through the tree and checks what only the geometry shows: a mirror
// met from behind, and a pass's given turn against the one its part's orientation gives.
func (v *checker) passGeometry() {
	w := walkTree(v.b)
	v.problems = append(v.problems, w.problems...)
	for _, vs := range w.visits {
		for _, vis := range vs {
			e := vis.E
			if e.SameAs == "" || e.TurnDeg == nil {
				continue
			}
			if math.Abs(*e.TurnDeg-vis.TurnDeg) > TurnToleranceDeg {
				v.add(field(vis.Path, "turn_deg"), "turn %s° disagrees with the turn %s° that %s's orientation gives the arriving beam (tolerance %s°); correct it or leave turn_deg out",
					fmtNum(*e.TurnDeg), fmtRound(vis.TurnDeg), e.SameAs, fmtNum(TurnToleranceDeg))
			}
		}
	}
}

// moreSources checks the further sources: how many, their ids, their source fields by kind and
// their wavelengths. Their elements are checked with the tree.
func (v *checker) moreSources() {
	v.most("more_sources", len(v.b.MoreSources), MaxSources, "further sources")
	seen := map[string]int{}
	for i := range v.b.MoreSources {
		m := &v.b.MoreSources[i]
		p := index("more_sources", i)
		ip := field(p, "id")
		switch {
		case m.ID == "":
			v.add(ip, "must not be empty")
		case utf8.RuneCountInString(m.ID) > MaxIDLength:
			v.add(ip, "id is %d characters long; at most %d are allowed", utf8.RuneCountInString(m.ID), MaxIDLength)
		case !plainName(m.ID):
			v.add(ip, "id %q may use only letters, digits, '-', '_' and '.'", m.ID)
		case m.ID == FirstSourceID || m.ID == ArmMain:
			v.add(ip, "id %q is reserved for the first source and its list; choose another", m.ID)
		}
		if j, dup := seen[m.ID]; dup && m.ID != "" {
			v.add(ip, "duplicate id %q: already used by more_sources[%d]", m.ID, j)
		} else {
			seen[m.ID] = i
		}
		v.sourceAt(p, &m.Source)
		v.most(field(p, "wavelengths_nm"), len(m.WavelengthsNM), MaxWavelengths, "wavelengths")
		for k, w := range m.WavelengthsNM {
			wp := index(field(p, "wavelengths_nm"), k)
			if v.finite(wp, w) && (w < MinWavelengthNM || w > MaxWavelengthNM) {
				v.add(wp, "%s nm is outside the accepted range %s-%s nm", fmtNum(w), fmtNum(MinWavelengthNM), fmtNum(MaxWavelengthNM))
			}
		}
	}
}
