package optics

import (
	"math"
	"reflect"
	"strings"
	"unicode/utf8"
)

// elements checks every element list of the tree (elementLists) and the further sources: each
// element by its type's rules, a same_as pass by the pass rules, ids unique over the whole tree,
// the limits of a branching bench; then, when everything else holds, the geometry of the passes.
func (v *checker) elements() {
	lists := elementLists(v.b)
	total := 0
	for _, l := range lists {
		total += len(*l.Els)
	}
	switch {
	case total > MaxElements && len(lists) == 1:
		v.add("elements", "has %d elements; at most %d are allowed", total, MaxElements)
	case total > MaxElements:
		v.add("elements", "the bench has %d elements over all its lists; at most %d are allowed", total, MaxElements)
	}
	if len(lists) > MaxElementLists {
		v.add("elements", "the bench has %d element lists; at most %d are allowed (the main list, each reflected list and each further source's list)", len(lists), MaxElementLists)
	}
	v.moreSources()
	firstUse := map[string]string{}
	for _, ms := range v.b.MoreSources {
		if ms.ID != "" {
			firstUse[ms.ID] = "" // reported by moreSources when it clashes with an element
		}
	}
	placed := map[string]*Element{} // parts placed so far, in depth-first order
	for _, l := range lists {
		if l.Depth > MaxArmDepth {
			v.add(l.Path, "reflected lists nest %d deep here; at most %d levels are allowed", l.Depth, MaxArmDepth)
			continue
		}
		for i := range *l.Els {
			e := &(*l.Els)[i]
			p := index(l.Path, i)
			v.element(p, e, firstUse, placed)
			if e.SameAs == "" && e.ID != "" {
				if _, dup := placed[e.ID]; !dup {
					placed[e.ID] = e
				}
			}
		}
	}
	if len(v.problems) == 0 {
		v.glassOverlaps(lists)
		v.passGeometry()
	}
}

// glassOverlaps checks, in each element list, that two consecutive lenses leave air between
// them everywhere inside their common clear aperture. At height h the air gap along the beam is
// gap − s_last(h) + s_first(h), with s the sag of the first lens's last face and the second's
// first face (positive downstream, README 'Bench file': a radius is positive when its centre lies
// downstream). A face with no clear aperture exists out to its radius. The air gap is monotonic
// in h (as the edge thickness in edge) and equals the gap, which is not negative, on the axis, so
// the rim of the common aperture decides. Glass that overlaps would make the exact trace meet the
// second face before the first and run backwards. Faces touching (air 0) are allowed, as lenses
// set in contact are. Passes (same_as) carry no faces of their own and are not checked here.
func (v *checker) glassOverlaps(lists []elementList) {
	for _, l := range lists {
		els := *l.Els
		for i := 1; i < len(els); i++ {
			a, b := &els[i-1], &els[i]
			if a.Type != TypeLens || b.Type != TypeLens || a.SameAs != "" || b.SameAs != "" ||
				len(a.FacesMM) == 0 || len(b.FacesMM) == 0 {
				continue
			}
			last, first := a.FacesMM[len(a.FacesMM)-1], b.FacesMM[0]
			h := min(a.SemiDiameterMM(), b.SemiDiameterMM())
			for _, r := range []*float64{last, first} {
				if r != nil {
					h = min(h, math.Abs(*r))
				}
			}
			if math.IsInf(h, 1) {
				continue // two flat faces with no aperture: the air is the gap everywhere
			}
			need := sag(last, h) - sag(first, h)
			if air := b.GapMM - need; air < 0 {
				v.add(field(index(l.Path, i), "gap_mm"),
					"the glass of %s and %s overlaps: at %s mm from the axis, the rim of their common clear aperture, the air between %s's last face and %s's first face is %s mm; it may not be negative, so the gap must be at least %s mm",
					a.ID, b.ID, fmtNum(h), a.ID, b.ID, fmtRound(air), fmtRound(math.Ceil(need*1000)/1000)) // rounded up to 1 µm
			}
		}
	}
}

// element checks one element at path p.
func (v *checker) element(p string, e *Element, firstUse map[string]string, placed map[string]*Element) {
	v.elementID(p, e.ID, firstUse)
	if v.length(field(p, "gap_mm"), e.GapMM) && e.GapMM < 0 {
		v.add(field(p, "gap_mm"), "gap %s mm is negative: negative gaps are not supported, since elements follow one another along the beam",
			fmtNum(e.GapMM))
	}
	if e.Mount != nil {
		v.positive(field(p, "mount.width_mm"), e.Mount.WidthMM)
		v.positive(field(p, "mount.depth_mm"), e.Mount.DepthMM)
	}
	k, known := KindOf(e.Type)
	if !known {
		v.add(field(p, "type"), "unknown element type %q: use one of %s", e.Type, strings.Join(KindTypes(), ", "))
		return
	}
	if e.SameAs != "" {
		v.pass(p, e, placed)
		return
	}
	ev := reflect.ValueOf(e).Elem()
	v.stray(p, ev, elementKindFields, append(keys(ElementFields), keys(k.Fields)...), " for type "+e.Type)
	// Checked on every type, so that a stray diameter also hears when it is not positive.
	diameterOK := e.DiameterMM == nil || v.positive(field(p, "diameter_mm"), *e.DiameterMM)
	v.need(p, ev, k.Fields, k.Noun)
	v.elementPower(p, e)
	if k.check != nil {
		k.check(v, p, e, diameterOK)
	}
}

// elementID checks that an id is non-empty, short, plain and not used before anywhere in the tree.
func (v *checker) elementID(p, id string, firstUse map[string]string) {
	ip := field(p, "id")
	switch {
	case id == "":
		v.add(ip, "must not be empty")
		return
	case utf8.RuneCountInString(id) > MaxIDLength:
		v.add(ip, "id is %d characters long; at most %d are allowed", utf8.RuneCountInString(id), MaxIDLength)
	case !plainName(id):
		v.add(ip, "id %q may use only letters, digits, '-', '_' and '.'", id)
	}
	if at, dup := firstUse[id]; dup {
		if at == "" {
			v.add(ip, "duplicate id %q: already the id of a source in more_sources", id)
		} else {
			v.add(ip, "duplicate id %q: already used by %s", id, at)
		}
		return
	}
	firstUse[id] = p
}

func (v *checker) lens(p string, e *Element, diameterOK bool) {
	k := len(e.FacesMM)
	if k < 2 {
		v.add(field(p, "faces_mm"), "a lens needs at least 2 faces, got %d", k)
	}
	if k >= 2 && len(e.ThicknessesMM) != k-1 {
		v.add(field(p, "thicknesses_mm"), "a lens with %d faces needs %d thicknesses, got %d", k, k-1, len(e.ThicknessesMM))
	}
	if k >= 2 && len(e.Materials) != k-1 {
		v.add(field(p, "materials"), "a lens with %d faces needs %d materials, got %d", k, k-1, len(e.Materials))
	}
	semi := math.Inf(1)
	if e.DiameterMM != nil && diameterOK {
		semi = *e.DiameterMM / 2
	}
	faceOK := make([]bool, k)
	for i, r := range e.FacesMM {
		fp := index(field(p, "faces_mm"), i)
		faceOK[i] = v.radius(fp, r, semi, "face")
	}
	for i, t := range e.ThicknessesMM {
		tp := index(field(p, "thicknesses_mm"), i)
		if !v.length(tp, t) {
			continue
		}
		if t <= 0 {
			v.add(tp, "thickness must be greater than 0 mm, got %s", fmtNum(t))
			continue
		}
		// Without a usable clear aperture (diameter_mm given but wrong) the edge rule has no height.
		if i+1 < k && faceOK[i] && faceOK[i+1] && diameterOK {
			v.edge(tp, i, t, e.FacesMM[i], e.FacesMM[i+1], semi)
		}
	}
	for i, name := range e.Materials {
		v.lensMaterial(index(field(p, "materials"), i), name, v.checkedMedia)
	}
}

// radius checks a face or mirror radius: nil is flat; otherwise finite, non-zero, within range
// and at least the semi-diameter in magnitude (a sphere has no surface beyond its radius).
func (v *checker) radius(path string, r *float64, semi float64, what string) bool {
	if r == nil {
		return true
	}
	if !v.length(path, *r) {
		return false
	}
	if *r == 0 {
		v.add(path, "radius 0 mm is not allowed: use null for a flat %s", what)
		return false
	}
	if !math.IsInf(semi, 1) && math.Abs(*r) < semi {
		v.add(path, "radius %s mm is smaller than the semi-diameter %s mm", fmtNum(math.Abs(*r)), fmtNum(semi))
		return false
	}
	return true
}

// edge checks that faces i and i+1, a centre thickness t apart, do not meet inside the clear
// aperture. The edge thickness at height h is t + s2(h) - s1(h), with s the sag of each face
// (positive downstream). With no clear aperture given the faces must stay apart as far out as both
// spheres exist, min(|R1|, |R2|). The edge thickness is monotonic in h for any pair of spheres (its
// derivative keeps one sign), so checking the outermost height suffices.
func (v *checker) edge(path string, i int, t float64, r1, r2 *float64, semi float64) {
	h := semi
	if math.IsInf(semi, 1) {
		h = math.Inf(1)
		for _, r := range []*float64{r1, r2} {
			if r != nil {
				h = min(h, math.Abs(*r))
			}
		}
		if math.IsInf(h, 1) {
			return // two flat faces never meet
		}
	}
	edge := t + sag(r2, h) - sag(r1, h)
	if edge > 0 {
		return
	}
	if math.IsInf(semi, 1) {
		v.add(path, "faces %d and %d intersect within %s mm of the axis (edge thickness there %s mm): give diameter_mm for the clear aperture or make the lens thicker",
			i, i+1, fmtNum(h), fmtRound(edge))
		return
	}
	v.add(path, "faces %d and %d meet inside the clear aperture: the edge thickness at the clear-aperture radius %s mm is %s mm and must be greater than 0",
		i, i+1, fmtNum(h), fmtRound(edge))
}

// sag is the axial displacement of a spherical face at height h, positive downstream, 0 for a flat
// face. It uses the rationalised form h²/(R + sign(R)·√(R² − h²)), equal to R − sign(R)·√(R² − h²)
// but free of cancellation when h ≪ |R| (common practice in lens design codes).
func sag(r *float64, h float64) float64 {
	if r == nil {
		return 0
	}
	R := *r
	return h * h / (R + math.Copysign(math.Sqrt(max(R*R-h*h, 0)), R))
}

// thinLens checks a thin lens's focal length.
func (v *checker) thinLens(p string, e *Element, _ bool) {
	if fp := field(p, "focal_mm"); e.FocalMM != nil && v.length(fp, *e.FocalMM) && *e.FocalMM == 0 {
		v.add(fp, "focal length must not be 0 mm")
	}
}

// mirror checks a mirror's turn and radius.
func (v *checker) mirror(p string, e *Element, diameterOK bool) {
	tp := field(p, "turn_deg")
	if e.TurnDeg != nil && v.finite(tp, *e.TurnDeg) {
		if t := math.Abs(*e.TurnDeg); t == 0 || t > 180 {
			v.add(tp, "turn %s° must have a magnitude above 0° and at most 180°", fmtNum(*e.TurnDeg))
		}
	}
	semi := math.Inf(1)
	if e.DiameterMM != nil && diameterOK {
		semi = *e.DiameterMM / 2
	}
	v.radius(field(p, "radius_mm"), e.RadiusMM, semi, "mirror")
}

// screen checks a screen's width.
func (v *checker) screen(p string, e *Element, _ bool) {
	if e.WidthMM != nil {
		v.positive(field(p, "width_mm"), *e.WidthMM)
	}
}
