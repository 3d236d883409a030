package beam

import "raytable/optics"

// litPath is p cut after its first surface that stops light (a dump): nothing past it gets light,
// so the beam, its rows, waists and envelope end there (README, element type dump). p itself is
// returned when nothing stops the light before its end.
func litPath(p *optics.Path) *optics.Path {
	lit := litStretches(p)
	if lit >= len(p.Surfaces) {
		return p
	}
	cut := *p
	cut.Surfaces = p.Surfaces[:lit]
	cut.Spans = nil
	for _, sp := range p.Spans {
		if sp.First < lit {
			cut.Spans = append(cut.Spans, sp)
		}
	}
	return &cut
}
