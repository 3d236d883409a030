package analysis

import (
	"fmt"

	"raytable/optics"
	"raytable/optics/layout"
)

// layoutCodes are the warnings of the layout checks, which a branching bench runs once over the
// union of its arms (layout.PlanArms) in place of each arm's own.
var layoutCodes = map[optics.WarningCode]bool{
	optics.WarnMountsOverlap: true, optics.WarnMountInBeam: true, optics.WarnOffTable: true,
	optics.WarnBeamOffTable: true, optics.WarnNoBeamEnd: true,
}

// combineArms turns the main arm's report r into the branching bench's: every part placed once,
// the layout checks over all arms, and each further arm's warnings about its own elements.
func combineArms(b *optics.Bench, arms []optics.Arm, r *optics.Report) {
	r.Title = b.Title
	warns := withoutLayout(r.Warnings)
	for i := 1; i < len(arms); i++ {
		own := map[string]bool{}
		for _, e := range r.ArmFull[i].Elements[min(arms[i].Own, len(r.ArmFull[i].Elements)):] {
			own[e.ID] = true
		}
		for _, w := range withoutLayout(r.ArmFull[i].Warnings) {
			if w.Element == "" || own[w.Element] {
				warns = appendNew(warns, w)
			}
		}
	}
	in := make([]layout.ArmPlaces, len(arms))
	joins := make([]bool, len(arms))
	for i, a := range arms {
		fr := r.ArmFull[i]
		in[i] = layout.ArmPlaces{Bench: a.Bench, Places: fr.Elements, Own: a.Own, Part: a.Part, BeamRadius: beamRadius(fr, a.Bench)}
		joins[i] = a.JoinsArm != ""
	}
	var planWarnings []optics.Warning
	r.Placement, planWarnings = layout.PlanArms(in, joins)
	r.Warnings = append(warns, planWarnings...)
	r.Board.Mounts = layout.BoardMounts(r.Placement)
}

func withoutLayout(ws []optics.Warning) []optics.Warning {
	out := []optics.Warning{}
	for _, w := range ws {
		if !layoutCodes[w.Code] {
			out = append(out, w)
		}
	}
	return out
}

// appendNew appends the warnings not already in warns.
var appendNew = layout.AppendNewWarnings

// missLimitMM is the largest miss of a same_as pass from its part that goes without a warning.
const missLimitMM = 0.5

// armWarnings are the warnings about the arms themselves: stray beams (open-port), passes that miss
// their part (misses-part) and periscopes that rotate the image (image-rotated), each once.
func armWarnings(arms []optics.Arm, r *optics.Report) []optics.Warning {
	var out []optics.Warning
	partAt := map[string]optics.ElementPlace{}
	for i := range arms {
		for _, e := range r.ArmFull[i].Elements {
			if _, ok := partAt[e.ID]; !ok {
				partAt[e.ID] = e
			}
		}
	}
	for i, a := range arms {
		fr := r.ArmFull[i]
		if w, ok := openPort(a, r.Arms[i], fr); ok {
			out = appendNew(out, w)
		}
		for j := min(a.Own, len(fr.Elements)); j < len(fr.Elements) && j < len(a.Part); j++ {
			e := fr.Elements[j]
			part, ok := partAt[a.Part[j]]
			if !ok || e.ID == a.Part[j] {
				continue
			}
			if miss := missMM(part, e); miss > missLimitMM {
				out = appendNew(out, optics.Warning{Code: optics.WarnMissesPart, Element: e.ID, Others: []string{part.ID}, Message: fmt.Sprintf(
					"the beam of %s arrives %s mm from %s (table plane and height; at most %s mm goes unnoticed): align the beam or move the part", e.ID, num(miss), part.ID, num(missLimitMM))})
			}
		}
		out = appendNew(out, imageRotated(a)...)
	}
	return out
}

// openPort is the open-port warning of an arm whose last port is a splitter's that no element
// takes: the transmitted port of a splitter pass at its end, or a reflected list left empty.
func openPort(a optics.Arm, ar optics.ArmReport, fr *optics.Report) (optics.Warning, bool) {
	n := len(a.Bench.Elements)
	if ar.Ends != optics.ArmOpen || n == 0 || len(fr.Elements) < n {
		return optics.Warning{}, false
	}
	last := a.Bench.Elements[n-1]
	if last.Type != optics.TypeSplitter && (a.Own < n || a.Parent == "") {
		return optics.Warning{}, false
	}
	p := endPower(a)
	return optics.Warning{Code: optics.WarnOpenPort, Element: fr.Elements[n-1].ID, Message: fmt.Sprintf(
		"a stray beam with %s %% of the source's power leaves %s (arm %s) and meets nothing: end it on a dump", num(100*p), fr.Elements[n-1].ID, a.ID)}, true
}

// imageRotated warns of each periscope in an arm's own list whose turn is not a multiple of 90°
// (optics.PeriscopeQuarterTurns, the rule BuildPath applies): the exact trace is right, but the
// paraxial and beam values are in planes the periscope rotated.
func imageRotated(a optics.Arm) []optics.Warning {
	var out []optics.Warning
	for _, e := range a.Bench.Elements[min(a.Own, len(a.Bench.Elements)):] {
		if e.Type != optics.TypePeriscope || e.TurnDeg == nil {
			continue
		}
		if _, exact := optics.PeriscopeQuarterTurns(*e.TurnDeg); !exact {
			out = append(out, optics.Warning{Code: optics.WarnImageRotated, Element: e.ID, Message: fmt.Sprintf(
				"%s turns the beam by %s°, not a multiple of 90°: the image is rotated; the tangential and sagittal values downstream are in the rotated planes", e.ID, num(*e.TurnDeg))})
		}
	}
	return out
}

// boardArms lays out every arm on the table for the drawings.
func boardArms(arms []optics.Arm, r *optics.Report) []optics.BoardArm {
	out := make([]optics.BoardArm, len(arms))
	for i, a := range arms {
		out[i] = layout.BoardArm(a.ID, r.ArmFull[i].Board, a.Own, r.Arms[i].Ends == optics.ArmOpen)
	}
	return out
}
