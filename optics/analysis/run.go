package analysis

import (
	"context"

	"raytable/optics"
	"raytable/optics/beam"
	"raytable/optics/layout"
	"raytable/optics/paraxial"
)

// Run validates b and computes its full report. The error is an *optics.Error with code
// optics.EInvalid when the bench breaks a rule; a valid bench always gives a report, whatever
// happens to its rays (clipped, missed or totally reflected rays are results, not errors).
func Run(b *optics.Bench) (*optics.Report, error) {
	if err := optics.Validate(b); err != nil {
		return nil, err
	}
	return RunValid(b), nil
}

// RunValid computes the report of a bench that Validate (or Decode) has already accepted, without
// checking the rules a second time. Anything else must go through Run: the computations assume
// every rule holds.
//
// Every arm of the bench (optics.ResolveArms) is computed on its own linear bench; the main arm
// gives every value of a bench that does not branch, so such a bench reports exactly as before.
func RunValid(b *optics.Bench) *optics.Report {
	return runArms(b, optics.ResolveArms(b))
}

// runArms is RunValid over arms that the caller has resolved (the tests build some by hand).
func runArms(b *optics.Bench, arms []optics.Arm) *optics.Report {
	r, _ := runArmsContext(context.Background(), b, arms) // a context never done: no error
	return r
}

// runArmsContext is runArms that stops with the EDeadline error once ctx is done.
func runArmsContext(ctx context.Context, b *optics.Bench, arms []optics.Arm) (*optics.Report, error) {
	full := make([]*optics.Report, len(arms))
	for i := range arms {
		var err error
		if full[i], err = linear(ctx, arms[i].Bench, i == 0, len(arms) == 1); err != nil {
			return nil, err
		}
	}
	r := full[0]
	r.ArmFull = full
	if len(arms) > 1 {
		combineArms(b, arms, r)
	}
	lengths := make([]*pathLengths, len(arms))
	for i := range arms {
		lengths[i] = newPathLengths(arms[i].Bench)
	}
	r.Arms = armReports(arms, full, lengths)
	r.Power = beam.CombinePower(arms, full)
	r.Meetings = meetings(arms, full, lengths)
	r.Coupling = armCouplings(arms, full)
	r.Warnings = append(r.Warnings, armWarnings(arms, r)...)
	r.Board.Arms = boardArms(arms, r)
	return r, nil
}

// linear computes the report of one linear bench: a bench that does not branch, or one arm's.
// The spacing tolerances, costly and about the main line, are computed only when main is set; the
// placement and layout checks only when plan is (a branching bench runs them over all its arms).
func linear(ctx context.Context, b *optics.Bench, main, plan bool) (*optics.Report, error) {
	p := optics.BuildPath(b)
	r := &optics.Report{
		Format:        optics.FormatReportV1,
		Title:         b.Title,
		WavelengthsNM: b.WavelengthsNM,
		Warnings:      []optics.Warning{},
	}
	r.Media, r.Warnings = media(b, r.Warnings)

	tan := paraxial.Analyze(b, p, 0, paraxial.Tangential)
	sag := paraxial.Analyze(b, p, 0, paraxial.Sagittal)
	r.System = systemValues(p, tan.Values, sag.Values)
	if main {
		var err error
		if r.Spacing, r.SpacingBasis, err = spacingTolerances(ctx, b, p, tan); err != nil {
			return nil, err
		}
	}
	for k := range b.WavelengthsNM {
		r.Chromatic = append(r.Chromatic, paraxial.Cardinals(p, k, paraxial.Tangential, &b.Source))
	}

	r.Elements = layout.Walk(b)
	fillElements(r.Elements, b, p, tan)
	var rayWarnings []optics.Warning
	var err error
	if r.Rays, rayWarnings, err = traceRays(ctx, b, p, r.Elements, tan); err != nil {
		return nil, err
	}
	r.Warnings = append(r.Warnings, rayWarnings...)

	var beamWarnings []optics.Warning
	r.Beam, beamWarnings = beam.Propagate(b, p)
	r.Warnings = append(r.Warnings, beamWarnings...)
	r.Coupling = beam.Couplings(b, p)
	r.Warnings = append(r.Warnings, beam.SafetyWarnings(b, p)...)
	r.Warnings = append(r.Warnings, beam.PowerWarnings(b, p)...)
	r.Power = beam.PowerReport(b, p)

	r.Holes = layout.Holes(b.Table).HoleGrid
	var planWarnings []optics.Warning
	if plan {
		r.Placement, planWarnings = layout.Plan(b, r.Elements, beamRadius(r, b))
	}
	r.Board = layout.NewBoard(b.Table, b.Source, r)
	r.Warnings = append(r.Warnings, planWarnings...)
	r.Warnings = append(r.Warnings, screenWarnings(b, r)...)
	r.Warnings = append(r.Warnings, afterDumpWarnings(b)...)
	r.Blur = blurs(b, r)
	return r, nil
}

// systemValues combines the two planes and says where the optical part starts and ends.
func systemValues(p *optics.Path, tan, sag optics.PlaneValues) optics.SystemValues {
	sv := optics.SystemValues{PlaneValues: tan, Sagittal: sag}
	if first, last, ok := p.OpticalRange(); ok {
		sv.Optical = true
		sv.FirstVertexPathMM = p.Surfaces[first].PathMM
		sv.LastVertexPathMM = p.Surfaces[last].PathMM
	}
	return sv
}

// armCouplings lists the coupling into every fibre and mode target of every arm: the main line's,
// then each further arm's own targets, computed on that arm's beam (its source, power share and
// path), each target once.
func armCouplings(arms []optics.Arm, full []*optics.Report) []optics.Coupling {
	out := full[0].Coupling
	seen := map[string]bool{}
	for _, c := range out {
		seen[c.Element] = true
	}
	for i := 1; i < len(arms); i++ {
		own := map[string]bool{}
		for _, e := range arms[i].Bench.Elements[min(arms[i].Own, len(arms[i].Bench.Elements)):] {
			own[e.ID] = true
		}
		for _, c := range full[i].Coupling {
			if own[c.Element] && !seen[c.Element] {
				seen[c.Element] = true
				out = append(out, c)
			}
		}
	}
	return out
}
