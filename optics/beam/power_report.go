package beam

import (
	"cmp"
	"fmt"
	"slices"

	"raytable/optics"
	"raytable/optics/numfmt"
)

// fillPower gives each beam row the share of the source's power arriving at its element and,
// where the source states a power or pulse, the peak irradiance and fluence of the arriving beam
// (its 1/e² radii across the beam: on a tilted optic the footprint is larger and the peak on the
// surface lower, so this errs on the safe side). It warns where a peak reaches DamageWarnShare
// of the element's damage threshold. spanOf is the span of each row.
func fillPower(b *optics.Bench, rows []optics.BeamAt, spanOf []int, budget []elementPower) []optics.Warning {
	_, peakMW, pulseMJ, stated := b.Source.SourcePower()
	var warns []optics.Warning
	for r := range rows {
		row, ei := &rows[r], spanOf[r]
		row.PowerFraction = budget[ei].Arriving
		if !stated || !(row.ArrivingWTMM > 0) || !(row.ArrivingWSMM > 0) {
			continue
		}
		irr := PeakIrradianceWCM2(row.PowerFraction*peakMW/1000, row.ArrivingWTMM, row.ArrivingWSMM)
		row.PeakIrradianceWCM2 = &irr
		if ei >= len(b.Elements) {
			continue // a hand-built path without its elements states no thresholds
		}
		e := &b.Elements[ei]
		if d := e.DamageWCM2; d != nil && irr >= optics.DamageWarnShare**d {
			warns = append(warns, damageWarning(row.ID, "irradiance", irr, *d, "W/cm²"))
		}
		if pulseMJ > 0 {
			flu := PeakFluenceJCM2(row.PowerFraction*pulseMJ/1000, row.ArrivingWTMM, row.ArrivingWSMM)
			row.PeakFluenceJCM2 = &flu
			if d := e.DamageJCM2; d != nil && flu >= optics.DamageWarnShare**d {
				warns = append(warns, damageWarning(row.ID, "fluence", flu, *d, "J/cm²"))
			}
		}
	}
	return warns
}

func damageWarning(id, what string, peak, threshold float64, unit string) optics.Warning {
	return optics.Warning{Code: optics.WarnDamageRisk, Element: id,
		Message: fmt.Sprintf("the beam's peak %s on %s is %s %s, %s %% of its damage threshold of %s %s; keep below half of it (common practice).",
			what, id, numfmt.Message.Format(peak), unit, numfmt.Message.Format(100*peak/threshold), numfmt.Message.Format(threshold), unit)}
}

// budgetOf is the power budget of p with the clear apertures the source's beam meets (all of the
// light passes them when the source has no beam).
func budgetOf(b *optics.Bench, p *optics.Path) []elementPower {
	_, _, pass := propagate(b, p)
	return powerBudget(b, p, pass)
}

// PowerWarnings warns of every mirror's leak, with its power in mW, when the source states a
// power or pulse (README "Power").
func PowerWarnings(b *optics.Bench, p *optics.Path) []optics.Warning {
	avgMW, _, _, stated := b.Source.SourcePower()
	if b == nil || p == nil || !stated {
		return nil
	}
	var warns []optics.Warning
	for ei, ep := range budgetOf(b, p) {
		leak := 0.0
		for _, l := range ep.losses {
			if l.kind == lossLeak {
				leak += l.share
			}
		}
		if leak <= 0 || ep.Arriving <= 0 {
			continue
		}
		id := b.Elements[ei].ID
		warns = append(warns, optics.Warning{Code: optics.WarnMirrorLeak, Element: id,
			Message: fmt.Sprintf("%s lets %s %% of the arriving power through: a stray beam of about %s mW behind it; end it on a dump or a card.",
				id, numfmt.Message.Format(100*leak/ep.Arriving), numfmt.Message.Format(leak*avgMW))})
	}
	return warns
}

// PowerReport is the power of a linear bench: its source's output and every stray beam (mirror
// leaks and the reflections off refracting faces), strongest first; nil when the source states
// no power. A branching bench's is CombinePower's.
func PowerReport(b *optics.Bench, p *optics.Path) *optics.PowerReport {
	if b == nil || p == nil {
		return nil
	}
	lvl, ok := sourceLevel(optics.FirstSourceID, &b.Source, p.WavelengthsNM)
	if !ok {
		return nil
	}
	out := &optics.PowerReport{Sources: []optics.SourcePowerLevel{lvl}, Strays: []optics.StrayBeam{}}
	for _, ep := range budgetOf(b, p) {
		for _, l := range ep.losses {
			if l.kind == lossSplit || l.share <= 0 {
				continue
			}
			s := &p.Surfaces[l.surface]
			st := optics.StrayBeam{Element: s.ID, Kind: optics.StrayLeak, PowerMW: l.share * lvl.AverageMW}
			if l.kind == lossGhost {
				st.Kind, st.Face = optics.StrayGhost, new(s.Face)
			}
			out.Strays = append(out.Strays, st)
		}
	}
	sortStrays(out.Strays)
	return out
}

func sourceLevel(id string, s *optics.Source, wavelengthsNM []float64) (optics.SourcePowerLevel, bool) {
	avg, peak, pulse, ok := s.SourcePower()
	if !ok || len(wavelengthsNM) == 0 {
		return optics.SourcePowerLevel{}, false
	}
	lvl := optics.SourcePowerLevel{Source: id, WavelengthNM: wavelengthsNM[0], AverageMW: avg, PeakMW: peak}
	if pulse > 0 {
		lvl.PulseMJ = &pulse
	}
	return lvl, true
}

// sortStrays puts the strongest stray beam first; equal ones keep their order along the path.
func sortStrays(s []optics.StrayBeam) {
	slices.SortStableFunc(s, func(a, b optics.StrayBeam) int { return cmp.Compare(b.PowerMW, a.PowerMW) })
}

// CombinePower is the power of a bench from its arms' linear reports (full, index-aligned with
// arms): every source that states a power, and each arm's stray beams from its own elements, with
// the ports no element takes (their power from the arm's share of its source's). nil when no
// source states a power.
func CombinePower(arms []optics.Arm, full []*optics.Report) *optics.PowerReport {
	out := &optics.PowerReport{Strays: []optics.StrayBeam{}}
	avg := map[string]float64{}
	for i, a := range arms {
		pr := full[i].Power
		if pr == nil {
			continue
		}
		if a.Parent == "" && len(pr.Sources) > 0 {
			lvl := pr.Sources[0]
			lvl.Source = a.Source
			out.Sources = append(out.Sources, lvl)
			avg[a.Source] = lvl.AverageMW
		}
		own := map[string]bool{}
		for _, e := range a.Bench.Elements[min(a.Own, len(a.Bench.Elements)):] {
			own[e.ID] = true
		}
		for _, st := range pr.Strays {
			if own[st.Element] {
				out.Strays = append(out.Strays, st)
			}
		}
	}
	if len(out.Sources) == 0 {
		return nil
	}
	for _, a := range arms {
		for _, op := range a.OpenPorts {
			if mw := op.PowerFraction * avg[a.Source]; mw > 0 {
				out.Strays = append(out.Strays, optics.StrayBeam{Element: op.Pass, Kind: optics.StrayPort, PowerMW: mw})
			}
		}
	}
	sortStrays(out.Strays)
	return out
}
