package optics

// DrawnSamples is the part of the beam's envelope the drawings show: the samples up to the last
// element when the path ends on an element the beam may end on (a screen, a dump, a target:
// Kind.EndsPath), since nothing is lit beyond it; all of them when the beam runs on. The report
// keeps every sample (beam.samples); the drawings stop where the light does (README, The web page).
func (r *Report) DrawnSamples() []BeamSample {
	if r == nil || r.Beam == nil {
		return nil
	}
	ss := r.Beam.Samples
	n := len(r.Elements)
	if n == 0 {
		return ss
	}
	last := r.Elements[n-1]
	if k, ok := KindOf(last.Type); !ok || !k.EndsPath {
		return ss
	}
	end := last.PathMM
	for _, f := range last.Faces {
		end = max(end, f.PathMM)
	}
	for i, s := range ss {
		if s.PathMM > end {
			return ss[:i]
		}
	}
	return ss
}
