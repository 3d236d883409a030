package layout

import (
	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// ArmPlaces is one arm of a branching bench as the layout checks need it: its linear bench, the
// Walk of it, where its own list starts, the part id of each linear element, and its beam's
// half-width along its path (see Plan).
type ArmPlaces struct {
	Bench      *optics.Bench
	Places     []optics.ElementPlace
	Own        int
	Part       []string
	BeamRadius func(pathMM float64) float64
}

// PlanArms is Plan over every arm of a branching bench at once, each part counted once: one
// Placement per part (the main arm's parts first, in its order, then each further arm's new parts),
// and the layout warnings over the union of the parts' mounts and every arm's beam, so that a
// mount in one arm's beam or two arms' mounts on top of each other are found. A part is placed
// where its own element (not a same_as pass) lies. Each arm's beam end is checked unless it ends on
// a pass through a splitter (whose stray beam the caller reports) or joins another arm (open).
func PlanArms(arms []ArmPlaces, joins []bool) ([]optics.Placement, []optics.Warning) {
	if len(arms) == 0 {
		return nil, nil
	}
	union := &optics.Bench{Table: arms[0].Bench.Table}
	var places []optics.ElementPlace
	var fps []Footprint
	index := map[string]int{} // part id to footprint index
	for ai, a := range arms {
		afps := Footprints(a.Bench, a.Places)
		for j, f := range afps {
			id := partOf(a, j)
			if _, seen := index[id]; seen || (ai > 0 && j < a.Own) || id != f.ID {
				continue
			}
			index[id] = len(fps)
			f.Index = len(fps)
			fps = append(fps, f)
			places = append(places, a.Places[j])
			union.Elements = append(union.Elements, a.Bench.Elements[j])
		}
	}
	var segs []Segment
	var bands [][][]r2.Vec
	for ai, a := range arms {
		for _, s := range Segments(a.Bench, a.Places) {
			if ai > 0 && s.ToIndex < a.Own {
				continue // the stretch it shares with its parent
			}
			s.FromIndex, s.ToIndex = unionIndex(a, s.FromIndex, index), unionIndex(a, s.ToIndex, index)
			segs = append(segs, s)
			bands = append(bands, band(s, a.BeamRadius))
		}
	}
	var warns []optics.Warning
	warns = append(warns, offTable(union, places, fps)...)
	warns = append(warns, beamOffTable(union.Table, segs, bands)...)
	warns = append(warns, overlaps(fps)...)
	warns = append(warns, mountsInBeam(segs, bands, fps)...)
	for ai, a := range arms {
		n := len(a.Bench.Elements)
		if (ai < len(joins) && joins[ai]) || (n > 0 && isSplitterPart(a, n-1, index, union)) {
			continue
		}
		warns = AppendNewWarnings(warns, beamEnd(a.Bench)...)
	}
	return placementsOf(union, places, fps), warns
}

func partOf(a ArmPlaces, j int) string {
	if j < len(a.Part) {
		return a.Part[j]
	}
	return a.Bench.Elements[j].ID
}

// unionIndex maps an element index of an arm's linear bench to its part's footprint; -1 (the
// source) stays.
func unionIndex(a ArmPlaces, j int, index map[string]int) int {
	if j < 0 {
		return j
	}
	if u, ok := index[partOf(a, j)]; ok {
		return u
	}
	return -2 // matches no footprint
}

// isSplitterPart reports whether linear element j of the arm is a pass through a splitter.
func isSplitterPart(a ArmPlaces, j int, index map[string]int, union *optics.Bench) bool {
	u, ok := index[partOf(a, j)]
	return ok && union.Elements[u].Type == optics.TypeSplitter
}

// AppendNewWarnings appends the warnings that are not already in warns.
func AppendNewWarnings(warns []optics.Warning, more ...optics.Warning) []optics.Warning {
next:
	for _, w := range more {
		for _, have := range warns {
			if have.Code == w.Code && have.Element == w.Element && have.Message == w.Message {
				continue next
			}
		}
		warns = append(warns, w)
	}
	return warns
}
