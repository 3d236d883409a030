package analysis

import (
	"math"

	"raytable/optics"
	"raytable/optics/beam"
)

// togetherRad is how far apart in heading two beams leaving a part may be and still count as
// leaving it together (their fringes are worth reporting): 50 mrad, our own choice, wide enough
// for a misaligned interferometer and far narrower than any turn a bench makes on purpose.
const togetherRad = 0.05

// pass is one beam through a part: element j of arm a's linear bench.
type pass struct {
	arm, j  int
	arrives bool // the beam reaches the part in this arm; false for the pass that starts a branch
}

// meetings lists every part that two or more beams reach: a part met by passes of the arms' own
// lists more than once in all (two arms, or one arm twice). A branch's first pass (the splitter
// reflecting into it) is the same arrival as its parent's and does not count as a second beam,
// but its leaving beam may leave together with another.
func meetings(arms []optics.Arm, full []*optics.Report, lengths []*pathLengths) []optics.Meeting {
	var order []string
	passes := map[string][]pass{}
	for ai, a := range arms {
		for j := max(0, a.Own-1); j < len(a.Part) && j < len(full[ai].Elements); j++ {
			id := a.Part[j]
			if _, seen := passes[id]; !seen {
				order = append(order, id)
			}
			passes[id] = append(passes[id], pass{arm: ai, j: j, arrives: j >= a.Own})
		}
	}
	out := []optics.Meeting{}
	for _, id := range order {
		ps := passes[id]
		arrivals := 0
		for _, p := range ps {
			if p.arrives {
				arrivals++
			}
		}
		if arrivals >= 2 {
			out = append(out, meeting(id, ps, arms, full, lengths))
		}
	}
	return out
}

func place(full []*optics.Report, p pass) optics.ElementPlace { return full[p.arm].Elements[p.j] }

func meeting(id string, ps []pass, arms []optics.Arm, full []*optics.Report, lengths []*pathLengths) optics.Meeting {
	at := partPlace(id, ps, full)
	m := optics.Meeting{Part: id, TableXMM: at.TableXMM, TableYMM: at.TableYMM}
	seen := map[int]bool{}
	for _, p := range ps {
		if !seen[p.arm] {
			seen[p.arm] = true
			m.Arms = append(m.Arms, arms[p.arm].ID)
		}
		if p.arrives {
			m.MissMM = math.Max(m.MissMM, missMM(at, place(full, p)))
		}
	}
	one, two, ok := together(ps, full)
	if !ok {
		return m
	}
	a, b := place(full, one), place(full, two)
	angle := headingDiffRad(a.HeadingOutDeg, b.HeadingOutDeg)
	m.AngleMRad = ptr(angle * 1000)
	if arms[one.arm].Source != arms[two.arm].Source {
		return m
	}
	oa, ga := lengths[one.arm].to(a.PathMM)
	ob, gb := lengths[two.arm].to(b.PathMM)
	m.OPDMM = ptr(ob - oa)
	m.GroupDelayFS = ptr(1000 * delayPS(gb-ga))
	if v, ok := visibility(a, b, full[one.arm].Beam, full[two.arm].Beam, angle); ok {
		m.Visibility = ptr(v)
	}
	return m
}

// partPlace is where the part itself stands: the pass that is the part (not a same_as pass), else
// the first.
func partPlace(id string, ps []pass, full []*optics.Report) optics.ElementPlace {
	for _, p := range ps {
		if e := place(full, p); e.ID == id {
			return e
		}
	}
	return place(full, ps[0])
}

// missMM is how far a pass's first vertex lies from the part's, on the table and in height.
func missMM(part, pass optics.ElementPlace) float64 {
	return math.Sqrt(sq(pass.TableXMM-part.TableXMM) + sq(pass.TableYMM-part.TableYMM) + sq(pass.HeightMM-part.HeightMM))
}

func sq(v float64) float64 { return v * v }

// headingDiffRad is the angle between two headings in degrees, in [0, π].
func headingDiffRad(a, b float64) float64 {
	d := math.Mod(math.Abs(a-b), 360)
	if d > 180 {
		d = 360 - d
	}
	return d * math.Pi / 180
}

// together picks the two passes of different arms whose beams leave the part closest in heading,
// within togetherRad; ok is false when no two do.
func together(ps []pass, full []*optics.Report) (one, two pass, ok bool) {
	best := togetherRad
	for i := range ps {
		for k := i + 1; k < len(ps); k++ {
			if ps[i].arm == ps[k].arm {
				continue
			}
			d := headingDiffRad(place(full, ps[i]).HeadingOutDeg, place(full, ps[k]).HeadingOutDeg)
			if d <= best {
				best, one, two, ok = d, ps[i], ps[k], true
			}
		}
	}
	return one, two, ok
}

// visibility is |γ| of the two beams leaving the part (beam.Overlap), each with its radius and
// wavefront radius per plane as it leaves its pass, the second displaced across the first's
// heading on the table (tangential) and in height (sagittal) and tilted by their angle on the
// table. ok is false without both beams or at different wavelengths.
func visibility(a, b optics.ElementPlace, ba, bb *optics.BeamReport, angleRad float64) (float64, bool) {
	ra, okA := beamRow(ba, a.ID)
	rb, okB := beamRow(bb, b.ID)
	if !okA || !okB || ba.WavelengthNM != bb.WavelengthNM || ra.WTMM <= 0 || rb.WTMM <= 0 || ra.WSMM <= 0 || rb.WSMM <= 0 {
		return 0, false
	}
	h := a.HeadingOutDeg * math.Pi / 180
	lateral := -(b.TableXMM-a.TableXMM)*math.Sin(h) + (b.TableYMM-a.TableYMM)*math.Cos(h)
	offT := beam.Offset{LateralMM: lateral, TiltRad: angleRad}
	offS := beam.Offset{LateralMM: b.HeightMM - a.HeightMM}
	g := beam.Overlap(profile(ra.WTMM, ra.RTMM), profile(ra.WSMM, ra.RSMM), profile(rb.WTMM, rb.RTMM), profile(rb.WSMM, rb.RSMM), offT, offS, ba.WavelengthNM)
	v := beam.Visibility(g)
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, false
	}
	return v, true
}

func profile(w float64, r *float64) beam.Profile {
	p := beam.Profile{RadiusMM: w}
	if r != nil {
		p.CurvatureMM = *r
	}
	return p
}

// beamRow is the beam leaving element id.
func beamRow(b *optics.BeamReport, id string) (optics.BeamAt, bool) {
	if b == nil {
		return optics.BeamAt{}, false
	}
	for _, e := range b.Elements {
		if e.ID == id {
			return e, true
		}
	}
	return optics.BeamAt{}, false
}
