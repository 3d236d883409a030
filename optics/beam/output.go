package beam

import (
	"fmt"
	"math"

	"raytable/optics"
	"raytable/optics/numfmt"
)

// CodeFocusMissesScreen is the warning of a beam that comes to its waist off a screen.
const CodeFocusMissesScreen = optics.WarnFocusMissesScreen

// outputBeam is the beam leaving the last element in both planes: where its waist lies from the
// last vertex (negative when virtual), how large it is and how fast it spreads far away. The
// far-field half-angle is θ = M²λ/(π w0 n) (ISO 11146-1 definitions; Siegman 1986).
func outputBeam(p *optics.Path, g gaussian, st []stretch, t, s *planeTrace) *optics.BeamOutput {
	if len(p.Surfaces) == 0 {
		return nil
	}
	last := st[len(st)-1]
	plane := func(q complex128) optics.OutputWaist {
		w0 := g.waistRadiusMM(imag(q))
		return optics.OutputWaist{
			FromLastMM:    -last.N * real(q),
			RadiusMM:      w0,
			RayleighMM:    last.N * imag(q),
			DivergenceRad: g.lamMM / (math.Pi * w0 * last.N),
		}
	}
	return &optics.BeamOutput{
		After: p.Surfaces[len(p.Surfaces)-1].ID,
		T:     plane(t.at(last.I)),
		S:     plane(s.at(last.I)),
	}
}

// glassWaists lists the waists that lie inside an element's glass, in path order, both planes in
// one entry where they coincide.
func glassWaists(p *optics.Path, g gaussian, st []stretch, t, s *planeTrace) []optics.GlassWaist {
	out := []optics.GlassWaist{}
	for _, x := range st[:len(st)-1] {
		if !x.Glass() {
			continue
		}
		var ts, ss []planeWaist
		if w, ok := waistIn(g, x, t.at(x.I)); ok {
			ts = append(ts, w)
		}
		if w, ok := waistIn(g, x, s.at(x.I)); ok {
			ss = append(ss, w)
		}
		for _, pr := range pairPlanes(ts, ss) {
			w := pr.either()
			gw := optics.GlassWaist{Element: p.Surfaces[x.I].ID, PathMM: w.zMM, DepthMM: w.zMM - x.Z0, Index: x.N}
			if pr.t != nil {
				gw.RadiusTMM, gw.RayleighTMM = ptr(pr.t.radiusMM), ptr(pr.t.rayleighMM)
			}
			if pr.s != nil {
				gw.RadiusSMM, gw.RayleighSMM = ptr(pr.s.radiusMM), ptr(pr.s.rayleighMM)
			}
			out = append(out, gw)
		}
	}
	return out
}

// screenFocusWarnings names every screen that the beam's waist misses by more than its Rayleigh
// range, in either plane, when that waist is a real focus: downstream of the element before the
// screen. A beam that is still converging there focuses behind the screen.
func screenFocusWarnings(b *optics.Bench, p *optics.Path, t, s *planeTrace) []optics.Warning {
	var out []optics.Warning
	for _, sp := range p.Spans {
		if sp.First < 0 || sp.First >= len(p.Surfaces) {
			continue
		}
		sf := &p.Surfaces[sp.First]
		if sf.Element < 0 || sf.Element >= len(b.Elements) || b.Elements[sf.Element].Type != optics.TypeScreen {
			continue
		}
		n := p.IndexBefore(sp.First, 0)
		gapMM := sf.PathMM
		if sp.First > 0 {
			gapMM -= p.Surfaces[sp.First-1].PathMM
		}
		worst, missMM := "", 0.0
		for _, pl := range []struct {
			name string
			q    complex128
		}{{"in the table plane", t.arrive[sp.First]}, {"across it", s.arrive[sp.First]}} {
			d := -n * real(pl.q) // waist position from the screen, + behind it
			zR := n * imag(pl.q)
			if math.Abs(d) <= zR || d < -gapMM || math.Abs(d) <= math.Abs(missMM) {
				continue
			}
			worst, missMM = pl.name, d
		}
		if worst == "" {
			continue
		}
		where := "behind"
		if missMM < 0 {
			where = "in front of"
		}
		out = append(out, optics.Warning{
			Code:    CodeFocusMissesScreen,
			Element: sf.ID,
			Message: fmt.Sprintf("the beam focuses %s mm %s %s (%s), farther than its Rayleigh range", numfmt.Rough.Format(math.Abs(missMM)), where, sf.ID, worst),
		})
	}
	return out
}
