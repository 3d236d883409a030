package optics

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"
)

// This file follows the beam axis through the whole tree on the table: positions, headings and
// heights of every element list, the computed turn of each same_as pass, the light on each port.
// It is the table-level geometry that ResolveArms and Validate's same_as rules need; the exact
// placement of a linear arm (ElementPlace) stays optics/layout's.

// axis is a beam's axis at a point: where, which way (a unit vector on the table), how high, and
// how much of the source's power it carries at each of the source's wavelengths.
type axis struct {
	Pos      r2.Vec
	Dir      r2.Vec
	HeightMM float64
	Power    []float64 // index-aligned with the source's wavelengths
}

// Port names of a visit's outgoing beams.
const (
	PortTransmitted = "transmitted" // straight on through a splitter
	PortReflected   = "reflected"   // a splitter's turned beam
	PortOut         = "out"         // the one beam leaving any other element
)

// visit is one element of the tree met by the beam: a part's first visit or a same_as pass.
type visit struct {
	Path     string
	E        *Element // the element in the tree
	Part     *Element // the physical part: E itself, or the element same_as names
	PartPath string
	In       axis // the arriving axis at the element's first vertex
	Reversed bool // a lens or periscope met against its first direction
	TurnDeg  float64
	MissMM   float64 // a pass: distance on the table of the part's vertex from the arriving axis
	HeightMM float64 // a pass: height difference of the arriving axis and the part
	Out      axis    // the continuing beam (transmitted through a splitter)
	Refl     *axis   // a splitter's reflected beam
}

// partFirst is what the first visit of a part fixes: where it stands and how it is oriented.
type partFirst struct {
	v      *visit
	normal r2.Vec // a mirror's or splitter's surface normal, facing the first arriving beam
	inDir  r2.Vec // the first arriving direction
	outDir r2.Vec // the first leaving direction (a periscope's)
}

// treeWalk is the geometry of a whole tree: the visits of each list, index-aligned with
// elementLists and their elements, and the problems found (a mirror met from behind, a pass
// naming a part not placed before it).
type treeWalk struct {
	lists    []elementList
	visits   [][]*visit
	parts    map[string]*partFirst
	problems []Problem
}

// walkTree follows every list of b. It assumes the numbers are finite (Validate runs it only then).
func walkTree(b *Bench) *treeWalk {
	w := &treeWalk{lists: elementLists(b), parts: map[string]*partFirst{}}
	reflected := map[string]axis{} // splitter visit path -> its reflected beam
	for _, l := range w.lists {
		var a axis
		switch {
		case l.From != "":
			r, ok := reflected[l.From]
			if !ok {
				w.visits = append(w.visits, nil)
				continue
			}
			a = r
		case l.Source < 0:
			a = sourceAxis(&b.Source, b.Table.BeamHeightMM, len(b.WavelengthsNM))
		default:
			a = sourceAxis(&b.MoreSources[l.Source].Source, b.Table.BeamHeightMM, len(listWavelengths(b, l)))
		}
		var vs []*visit
		for i := range *l.Els {
			v := w.step(b, index(l.Path, i), &(*l.Els)[i], a, listWavelengths(b, l))
			vs = append(vs, v)
			if v.Refl != nil {
				reflected[v.Path] = *v.Refl
			}
			a = v.Out
		}
		w.visits = append(w.visits, vs)
	}
	return w
}

func sourceAxis(s *Source, tableHeight float64, nWavelengths int) axis {
	h := tableHeight
	if s.HeightMM != nil {
		h = *s.HeightMM
	}
	return axis{Pos: r2.Vec{X: s.XMM, Y: s.YMM}, Dir: unitDeg(s.HeadingDeg), HeightMM: h, Power: ones(nWavelengths)}
}

// moreSourceWavelengths are a further source's wavelengths: its own, or the bench's.
func moreSourceWavelengths(b *Bench, m *MoreSource) []float64 {
	if len(m.WavelengthsNM) > 0 {
		return m.WavelengthsNM
	}
	return b.WavelengthsNM
}

// step meets element e with the beam a at the end of the previous element.
func (w *treeWalk) step(b *Bench, path string, e *Element, a axis, wavelengths []float64) *visit {
	v := &visit{Path: path, E: e, Part: e, PartPath: path}
	v.In = a
	v.In.Pos = r2.Add(a.Pos, r2.Scale(e.GapMM, a.Dir))
	v.Out = v.In
	first, isPass := w.parts[e.SameAs]
	if e.SameAs != "" {
		if !isPass {
			w.problems = append(w.problems, Problem{Path: path + ".same_as", Message: "names no part placed before this pass"})
			return v
		}
		v.Part, v.PartPath = first.v.E, first.v.Path
		at := first.v.In
		v.MissMM = math.Abs(r2.Cross(r2.Sub(at.Pos, a.Pos), a.Dir))
		v.HeightMM = math.Abs(at.HeightMM - a.HeightMM)
	} else if _, seen := w.parts[e.ID]; !seen {
		first = &partFirst{v: v, inDir: a.Dir}
		w.parts[e.ID] = first
	}
	p := v.Part
	switch p.Type {
	case TypeLens:
		v.Reversed = isPass && r2.Dot(a.Dir, first.inDir) < 0
		v.Out.Pos = r2.Add(v.In.Pos, r2.Scale(p.LengthMM(), a.Dir))
	case TypeMirror:
		if !isPass {
			v.TurnDeg = deref(p.TurnDeg)
			v.Out.Dir = rotate(a.Dir, v.TurnDeg)
			first.normal = r2.Unit(r2.Sub(v.Out.Dir, a.Dir))
			return v
		}
		if d := r2.Dot(a.Dir, first.normal); d >= -1e-9 {
			w.problems = append(w.problems, Problem{Path: path + ".same_as", Message: "meets the reflecting face of mirror " + p.ID + " from behind or edge-on: a mirror reflects on one side only"})
			return v
		}
		v.Out.Dir = reflectDir(a.Dir, first.normal)
		v.TurnDeg = turnBetween(a.Dir, v.Out.Dir)
	case TypeSplitter:
		refl := v.Out
		if !isPass {
			v.TurnDeg = deref(p.TurnDeg)
			refl.Dir = rotate(a.Dir, v.TurnDeg)
			first.normal = r2.Unit(r2.Sub(refl.Dir, a.Dir))
		} else {
			if math.Abs(r2.Dot(a.Dir, first.normal)) < 1e-9 {
				w.problems = append(w.problems, Problem{Path: path + ".same_as", Message: "runs along the surface of splitter " + p.ID + ": it meets it edge-on"})
				return v
			}
			refl.Dir = reflectDir(a.Dir, first.normal)
			v.TurnDeg = turnBetween(a.Dir, refl.Dir)
		}
		v.Out.Power, refl.Power = splitPower(p, a.Power, wavelengths)
		v.Refl = &refl
	case TypePeriscope:
		rise, turn := deref(p.RiseMM), deref(p.TurnDeg)
		if isPass && r2.Dot(a.Dir, first.inDir) < -r2.Dot(a.Dir, first.outDir) {
			v.Reversed, rise, turn = true, -rise, -turn
		}
		v.TurnDeg = turn
		v.Out.Dir = rotate(a.Dir, turn)
		v.Out.HeightMM += rise
		if !isPass {
			first.outDir = v.Out.Dir
		}
	}
	return v
}

// listWavelengths are the wavelengths of the source whose list l is.
func listWavelengths(b *Bench, l elementList) []float64 {
	if l.Source < 0 {
		return b.WavelengthsNM
	}
	return moreSourceWavelengths(b, &b.MoreSources[l.Source])
}

// splitPower divides the power at each wavelength between a splitter's ports: by its reflect
// fraction, or for a dichroic wholly to the port its side of the edge goes to.
func splitPower(s *Element, in []float64, wavelengths []float64) (transmitted, reflected []float64) {
	transmitted, reflected = make([]float64, len(in)), make([]float64, len(in))
	for k := range min(len(in), len(wavelengths)) { // one power per wavelength, in the same order
		r := s.ReflectedShare(wavelengths[k])
		transmitted[k], reflected[k] = in[k]*(1-r), in[k]*r
	}
	return transmitted, reflected
}

// unitDeg is the unit vector of a heading in degrees, counter-clockwise from +x.
func unitDeg(deg float64) r2.Vec {
	s, c := math.Sincos(deg * math.Pi / 180)
	return r2.Vec{X: c, Y: s}
}

// rotate turns a direction counter-clockwise by deg.
func rotate(d r2.Vec, deg float64) r2.Vec {
	s, c := math.Sincos(deg * math.Pi / 180)
	return r2.Vec{X: c*d.X - s*d.Y, Y: s*d.X + c*d.Y}
}

// reflectDir is d reflected by a surface of unit normal n: d - 2(d·n)n (law of reflection).
func reflectDir(d, n r2.Vec) r2.Vec { return r2.Sub(d, r2.Scale(2*r2.Dot(d, n), n)) }

// turnBetween is the heading change from a to b in degrees, in (-180, 180].
func turnBetween(a, b r2.Vec) float64 {
	t := math.Atan2(r2.Cross(a, b), r2.Dot(a, b)) * 180 / math.Pi
	if t <= -180 {
		t += 360
	}
	return t
}

func deref(x *float64) float64 {
	if x == nil {
		return 0
	}
	return *x
}
