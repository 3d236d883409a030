package optics

import (
	"math"
	"slices"

	"gonum.org/v1/gonum/spatial/r2"
)

// Arm is one element list of a bench together with the path that leads to it, unfolded into a
// plain linear bench that the paraxial, exact and Gaussian computations take unchanged.
type Arm struct {
	ID     string // "main", "BS1.reflected", or a further source's id
	Parent string // the arm it branches from; "" for a source's own list
	Source string // "source" or the further source's id

	// Bench is the linear bench of the arm: the arm's source, the wavelengths that reach it, and
	// every element from the source to the arm's last, with passes resolved (a reflected pass
	// through a splitter as a flat mirror with its turn, a same_as pass as a copy of its part,
	// reversed when met backwards). For a bench without splitters, same_as or further sources the
	// main arm's Bench is the bench itself. An arm that no wavelength reaches keeps the
	// wavelengths that arrive at the splitter sending it none, so that its geometry can still be
	// computed; its WavelengthsNM is empty and its PowerFraction 0.
	Bench *Bench
	Own   int      // index in Bench.Elements where the arm's own list starts
	End   int      // index in Bench.Elements after the arm's own list; from End on, the beam it joins
	Path  []string // JSON path in the bench file of each linear element: "elements[1].reflected[0]"
	Part  []string // id of the physical part of each linear element (a same_as pass names its part)

	// MissMM and HeightMissMM are, per linear element, how far a same_as pass's arriving axis runs
	// from its part's first vertex: on the table (perpendicular distance) and in height. 0 for
	// every element that is not a pass. The report warns misses-part above MissLimitMM.
	MissMM       []float64
	HeightMissMM []float64

	WavelengthsNM []float64 // the source's wavelengths that reach the arm (dichroics filter); may be empty
	PowerFraction float64   // of the source's power that reaches the arm, at its primary wavelength
	JoinsArm      string    // the arm whose beam it follows past its end; "" when it does not
	JoinsAt       string    // the part where it joins

	// OpenPorts are the ports of the arm's own splitters and passes that carry light away with no
	// element to take it and no beam to join: stray beams (warning open-port).
	OpenPorts []OpenPort
}

// OpenPort is a port of a splitter or same_as pass whose beam no element takes and that joins no
// other beam.
type OpenPort struct {
	Part          string  // the physical part's id
	Pass          string  // the id of the element in the tree: the part itself or the pass
	Port          string  // PortTransmitted, PortReflected or PortOut
	Element       int     // index of the pass in the arm's Bench.Elements
	PowerFraction float64 // of the source's power leaving by the port, at the arm's primary wavelength
}

// Join and miss tolerances (README "Bench file": joins, same_as).
const (
	JoinDistanceMM = 0.5   // a port runs along another beam when their axes are this close
	JoinAngleRad   = 0.001 // and this parallel
	MissLimitMM    = 0.5   // a pass whose axis misses its part by more is warned about (misses-part)
)

// ResolveArms unfolds a valid bench into its arms: the main arm first, then every arm in the
// order the bench file lists it (depth first: each list before the lists its splitters start),
// then each further source's (README "Bench file", and "Arms" in the design notes).
func ResolveArms(b *Bench) []Arm {
	if !isBranching(b) {
		arm := Arm{ID: ArmMain, Source: FirstSourceID, Bench: b, PowerFraction: 1, WavelengthsNM: b.WavelengthsNM,
			End: len(b.Elements), MissMM: make([]float64, len(b.Elements)), HeightMissMM: make([]float64, len(b.Elements))}
		for i, e := range b.Elements {
			arm.Path = append(arm.Path, index("elements", i))
			arm.Part = append(arm.Part, e.ID)
		}
		return []Arm{arm}
	}
	r := &resolver{b: b, w: walkTree(b), armOf: map[string]int{}}
	r.build()
	r.join()
	return r.arms
}

// resolver builds the arms of a branching bench from its tree walk.
type resolver struct {
	b     *Bench
	w     *treeWalk
	arms  []Arm
	armOf map[string]int // list path -> index in arms (and in w.lists)
	k0    []int          // per arm: index of its primary wavelength among its source's, -1 when dark
}

// build makes each arm's linear bench up to the end of its own list.
func (r *resolver) build() {
	for li, l := range r.w.lists {
		arm := Arm{ID: l.Arm, Parent: l.Parent, Source: FirstSourceID}
		src := r.b.Source
		if l.Source >= 0 {
			arm.Source, src = r.b.MoreSources[l.Source].ID, r.b.MoreSources[l.Source].Source
		}
		wavelengths := listWavelengths(r.b, l)
		power := ones(len(wavelengths))
		var els []Element
		if l.From != "" {
			pi := r.armOf[listPathOf(l.From)]
			parent := &r.arms[pi]
			k := slices.Index(parent.Path, l.From)
			if k < 0 || r.w.visits[li] == nil {
				r.armOf[l.Path] = li
				r.arms = append(r.arms, arm)
				r.k0 = append(r.k0, -1)
				continue
			}
			v := r.visitAt(l.From)
			els = slices.Clone(parent.Bench.Elements[:k])
			els = append(els, reflectedPort(v))
			arm.Path = append(slices.Clone(parent.Path[:k]), l.From)
			arm.Part = append(slices.Clone(parent.Part[:k]), v.Part.ID)
			arm.MissMM = append(slices.Clone(parent.MissMM[:k]), v.MissMM)
			arm.HeightMissMM = append(slices.Clone(parent.HeightMissMM[:k]), v.HeightMM)
			power = v.Refl.Power
		}
		arm.Own = len(els)
		k0 := slices.IndexFunc(power, func(p float64) bool { return p > 0 })
		for k, w := range wavelengths {
			if power[k] > 0 {
				arm.WavelengthsNM = append(arm.WavelengthsNM, w)
			}
		}
		if k0 >= 0 {
			arm.PowerFraction = power[k0]
		}
		bw := arm.WavelengthsNM
		if len(bw) == 0 {
			bw = wavelengths
		}
		for _, v := range r.w.visits[li] {
			els = append(els, continuing(v))
			arm.Path = append(arm.Path, v.Path)
			arm.Part = append(arm.Part, v.Part.ID)
			arm.MissMM = append(arm.MissMM, v.MissMM)
			arm.HeightMissMM = append(arm.HeightMissMM, v.HeightMM)
		}
		arm.End = len(els)
		arm.Bench = &Bench{Format: r.b.Format, Title: r.b.Title, Notes: r.b.Notes, WavelengthsNM: slices.Clone(bw),
			Table: r.b.Table, Source: src, Materials: r.b.Materials, Elements: els}
		r.armOf[l.Path] = li
		r.arms = append(r.arms, arm)
		r.k0 = append(r.k0, k0)
	}
}

// visitAt finds the visit of the element at a JSON path.
func (r *resolver) visitAt(path string) *visit {
	li, ok := r.armOf[listPathOf(path)]
	if !ok {
		return nil
	}
	for _, v := range r.w.visits[li] {
		if v.Path == path {
			return v
		}
	}
	return nil
}

// listPathOf is the path of the list an element path is in: "elements[1].reflected[0]" is in
// "elements[1].reflected".
func listPathOf(elementPath string) string {
	i := len(elementPath) - 1
	for i >= 0 && elementPath[i] != '[' {
		i--
	}
	return elementPath[:max(i, 0)]
}

// beam is a beam leaving a part that has elements to follow: the arm it belongs to and the index in
// that arm's Bench.Elements of the first of them.
type beam struct {
	at    axis
	arm   int
	first int
}

// beamsLeaving lists the beams with elements that leave the visits of a part, except the visit skip.
func (r *resolver) beamsLeaving(partPath string, skip *visit) []beam {
	var out []beam
	for li, vs := range r.w.visits {
		for i, v := range vs {
			if v.PartPath != partPath || v == skip {
				continue
			}
			if i+1 < len(vs) {
				out = append(out, beam{at: v.Out, arm: li, first: r.arms[li].Own + i + 1})
			}
			if v.Refl != nil && len(v.E.Reflected) > 0 {
				if ci, ok := r.armOf[field(v.Path, "reflected")]; ok {
					out = append(out, beam{at: *v.Refl, arm: ci, first: r.arms[ci].Own})
				}
			}
		}
	}
	return out
}

// along reports whether a port's beam runs along another beam: axes within JoinDistanceMM on the
// table and in height, directions within JoinAngleRad.
func along(port, other axis) bool {
	if r2.Dot(port.Dir, other.Dir) < math.Cos(JoinAngleRad) {
		return false
	}
	return math.Abs(r2.Cross(r2.Sub(other.Pos, port.Pos), port.Dir)) <= JoinDistanceMM &&
		math.Abs(other.HeightMM-port.HeightMM) <= JoinDistanceMM
}

// join finds, for every arm whose list ends at a splitter or pass, whether its end port runs along
// another beam leaving the part, and then continues its linear bench with that beam's elements;
// every other empty port of a splitter or pass is an open port.
func (r *resolver) join() {
	target := make([]int, len(r.arms))
	first := make([]int, len(r.arms))
	for ai := range r.arms {
		target[ai] = -1
		vs := r.w.visits[ai]
		for i, v := range vs {
			isSplitter := v.Part.Type == TypeSplitter
			if isSplitter && len(v.E.Reflected) == 0 && !r.joins(v, *v.Refl) {
				r.openIfLit(ai, i, v, PortReflected, *v.Refl)
			}
			if i+1 < len(vs) || !(isSplitter || v.E.SameAs != "") {
				continue
			}
			port := PortOut
			if isSplitter {
				port = PortTransmitted
			}
			bm, ok := r.joinOf(v, v.Out)
			if !ok && isSplitter && len(v.E.Reflected) == 0 {
				// The list ends where its reflected port runs along another beam: the arm leaves
				// the part by reflection and follows that beam.
				if bm, ok = r.joinOf(v, *v.Refl); ok {
					r.arms[ai].Bench.Elements[r.arms[ai].End-1] = reflectedPort(v)
					r.openIfLit(ai, i, v, port, v.Out)
				}
			}
			if ok {
				target[ai], first[ai] = bm.arm, bm.first
				r.arms[ai].JoinsArm, r.arms[ai].JoinsAt = r.arms[bm.arm].ID, v.Part.ID
				continue
			}
			r.openIfLit(ai, i, v, port, v.Out)
		}
	}
	done := make([]bool, len(r.arms))
	var extend func(ai int, depth int)
	extend = func(ai int, depth int) {
		t := target[ai]
		if done[ai] || t < 0 || depth > len(r.arms) {
			return
		}
		done[ai] = true
		extend(t, depth+1)
		a, from := &r.arms[ai], &r.arms[t]
		a.Bench.Elements = append(a.Bench.Elements, from.Bench.Elements[first[ai]:]...)
		a.Path = append(a.Path, from.Path[first[ai]:]...)
		a.Part = append(a.Part, from.Part[first[ai]:]...)
		a.MissMM = append(a.MissMM, from.MissMM[first[ai]:]...)
		a.HeightMissMM = append(a.HeightMissMM, from.HeightMissMM[first[ai]:]...)
	}
	for ai := range r.arms {
		extend(ai, 0)
	}
}

func (r *resolver) joinOf(v *visit, port axis) (beam, bool) {
	for _, bm := range r.beamsLeaving(v.PartPath, v) {
		if along(port, bm.at) {
			return bm, true
		}
	}
	return beam{}, false
}

func (r *resolver) joins(v *visit, port axis) bool {
	_, ok := r.joinOf(v, port)
	return ok
}

// openIfLit records an open port of arm ai's own element i, unless no light leaves by it (a
// dichroic's dark port, a splitter that reflects nothing): a dark port is no stray beam.
func (r *resolver) openIfLit(ai, i int, v *visit, port string, at axis) {
	if !slices.ContainsFunc(at.Power, func(p float64) bool { return p > 0 }) {
		return
	}
	var p float64
	if k := r.k0[ai]; k >= 0 && k < len(at.Power) {
		p = at.Power[k]
	}
	r.arms[ai].OpenPorts = append(r.arms[ai].OpenPorts, OpenPort{Part: v.Part.ID, Pass: v.E.ID, Port: port,
		Element: r.arms[ai].Own + i, PowerFraction: p})
}

// continuing is the linear element of a visit for the beam that goes on in its list: the element
// itself, or for a pass a copy of its part with the pass's id and gap, its computed turn, reversed
// when met backwards. A splitter stays a splitter (its transmitted port), without its list.
func continuing(v *visit) Element {
	c := *v.Part
	c.ID, c.GapMM, c.SameAs, c.Reflected = v.E.ID, v.E.GapMM, "", nil
	if v.E.SameAs == "" {
		c.Mount = v.E.Mount
		return c
	}
	switch c.Type {
	case TypeMirror, TypeSplitter, TypePeriscope:
		c.TurnDeg = new(v.TurnDeg)
	}
	if v.Reversed {
		switch c.Type {
		case TypeLens:
			c = reversedLens(c)
		case TypePeriscope:
			c.RiseMM = new(-deref(c.RiseMM))
		}
	}
	return c
}

// reflectedPort is the linear element of a splitter visit for the beam that leaves by its
// reflected port: a flat mirror with the splitter's diameter, mount and computed turn.
func reflectedPort(v *visit) Element {
	return Element{ID: v.E.ID, Type: TypeMirror, GapMM: v.E.GapMM, TurnDeg: new(v.TurnDeg),
		DiameterMM: v.Part.DiameterMM, Mount: v.Part.Mount,
		Reflect: v.Part.Reflect, Dichroic: v.Part.Dichroic} // its split, for the power (README "Power")
}

// reversedLens is a lens met from its last face: faces in reverse order with their radii negated
// (a radius is + when its centre is downstream, README "Bench file"), thicknesses and materials
// reversed.
func reversedLens(e Element) Element {
	faces := make([]*float64, len(e.FacesMM))
	for i, r := range e.FacesMM {
		if r != nil {
			faces[len(faces)-1-i] = new(-*r)
		}
	}
	e.FacesMM = faces
	e.ThicknessesMM = slices.Clone(e.ThicknessesMM)
	slices.Reverse(e.ThicknessesMM)
	e.Materials = slices.Clone(e.Materials)
	slices.Reverse(e.Materials)
	return e
}

func ones(n int) []float64 {
	out := make([]float64, n)
	for i := range out {
		out[i] = 1
	}
	return out
}
