package analysis

import (
	"raytable/optics"
)

// armReports gives each arm its part of the report: its own elements, the rays and beam of its
// linear bench, and its optical path and group delay from the source to its last element.
func armReports(arms []optics.Arm, full []*optics.Report, lengths []*pathLengths) []optics.ArmReport {
	out := make([]optics.ArmReport, len(arms))
	for i, a := range arms {
		fr := full[i]
		own := min(a.Own, len(fr.Elements))
		ar := optics.ArmReport{
			ID:            a.ID,
			Source:        a.Source,
			PowerFraction: a.PowerFraction,
			WavelengthsNM: a.Bench.WavelengthsNM,
			Elements:      fr.Elements[own:],
			Rays:          fr.Rays,
			Beam:          ownBeam(fr.Beam, fr.Elements, own),
			Ends:          armEnd(a),
		}
		if a.Parent != "" {
			ar.Parent = ptr2(a.Parent)
		}
		if n := len(fr.Elements); n > 0 {
			opt, grp := lengths[i].to(fr.Elements[n-1].PathMM)
			ar.OpticalPathMM, ar.GroupDelayPS = opt, delayPS(grp)
		}
		out[i] = ar
	}
	return out
}

func ptr2(s string) *string { return &s }

// ownBeam keeps the beam rows of the arm's own elements, the waists after them (or, for an arm
// without a parent, the waist before its first element too) and the samples from the arm's start.
func ownBeam(b *optics.BeamReport, places []optics.ElementPlace, own int) *optics.BeamReport {
	if b == nil || own == 0 {
		return b
	}
	ids := map[string]bool{}
	for _, p := range places[own:] {
		ids[p.ID] = true
	}
	startMM := places[own-1].PathMM
	out := &optics.BeamReport{WavelengthNM: b.WavelengthNM, M2: b.M2, Elements: []optics.BeamAt{}, Waists: []optics.Waist{}, Samples: []optics.BeamSample{},
		Output: b.Output, GlassWaists: []optics.GlassWaist{}}
	for _, w := range b.GlassWaists {
		if ids[w.Element] {
			out.GlassWaists = append(out.GlassWaists, w)
		}
	}
	for _, e := range b.Elements {
		if ids[e.ID] {
			out.Elements = append(out.Elements, e)
		}
	}
	for _, w := range b.Waists {
		if w.PathMM >= startMM {
			out.Waists = append(out.Waists, w)
		}
	}
	for _, s := range b.Samples {
		if s.PathMM >= startMM {
			out.Samples = append(out.Samples, s)
		}
	}
	return out
}

// armEnd says how an arm ends: joining another arm's beam, stopped on a dump or screen, or open.
func armEnd(a optics.Arm) string {
	if a.JoinsArm != "" {
		return "joins " + a.JoinsArm + " at " + a.JoinsAt
	}
	if n := len(a.Bench.Elements); n > 0 {
		if k, ok := optics.KindOf(a.Bench.Elements[n-1].Type); ok && k.EndsPath {
			return optics.ArmStopped
		}
	}
	return optics.ArmOpen
}

// endPower is the fraction of the source's power that leaves an arm's last element at its primary
// wavelength: the arm's own share, less what each transmitted pass through a splitter in its own
// list reflects away.
func endPower(a optics.Arm) float64 {
	f := a.PowerFraction
	for _, e := range a.Bench.Elements[min(a.Own, len(a.Bench.Elements)):] {
		if e.Type == optics.TypeSplitter && len(a.Bench.WavelengthsNM) > 0 {
			f *= 1 - e.ReflectedShare(a.Bench.WavelengthsNM[0])
		}
	}
	return f
}
