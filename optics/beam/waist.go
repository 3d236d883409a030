package beam

import (
	"math"
	"slices"

	"raytable/optics"
)

// planeWaist is a waist of one plane: where, how large, and in which stretch.
type planeWaist struct {
	stretch    int
	zMM        float64
	radiusMM   float64
	rayleighMM float64 // physical Rayleigh range in the stretch's medium
}

// waistIn finds the waist of the beam in stretch st, whose reduced q at the start is q: q̂(z) =
// q̂0 + (z - Z0)/n has Re q̂ = 0 at z = Z0 - n·Re(q̂0). ok is false when that point lies outside
// the stretch (a virtual waist, or one beyond it).
func waistIn(g gaussian, st stretch, q complex128) (planeWaist, bool) {
	z := st.Z0 - st.N*real(q)
	if !st.contains(z) {
		return planeWaist{}, false
	}
	return planeWaist{
		stretch:    st.I,
		zMM:        z,
		radiusMM:   g.waistRadiusMM(imag(q)),
		rayleighMM: st.N * imag(q),
	}, true
}

// waists lists every real waist in air from the source to the last element's last vertex, in path
// order. Tangential and sagittal waists at one position are one entry; otherwise each entry has the
// other plane's fields nil. Waists inside an element's glass, upstream of the source (virtual) and
// beyond the last surface are left out.
func waists(p *optics.Path, g gaussian, st []stretch, t, s *planeTrace) []optics.Waist {
	var ws, ss []planeWaist
	for _, x := range st[:len(st)-1] { // the last stretch lies beyond the last element
		if x.Glass() {
			continue
		}
		if w, ok := waistIn(g, x, t.at(x.I)); ok {
			ws = append(ws, w)
		}
		if w, ok := waistIn(s.g, x, s.at(x.I)); ok {
			ss = append(ss, w)
		}
	}
	pairs := pairPlanes(ws, ss)
	out := make([]optics.Waist, 0, len(pairs))
	for _, pr := range pairs {
		w := pr.either()
		e := optics.Waist{After: upstreamID(p, w.stretch), PathMM: w.zMM}
		if pr.t != nil {
			e.RadiusTMM, e.RayleighTMM = ptr(pr.t.radiusMM), ptr(pr.t.rayleighMM)
		}
		if pr.s != nil {
			e.RadiusSMM, e.RayleighSMM = ptr(pr.s.radiusMM), ptr(pr.s.rayleighMM)
		}
		out = append(out, e)
	}
	slices.SortStableFunc(out, func(a, b optics.Waist) int {
		switch {
		case a.PathMM < b.PathMM:
			return -1
		case a.PathMM > b.PathMM:
			return 1
		}
		return 0
	})
	return out
}

// planePair is one waist entry: the tangential and the sagittal waist at one position, either
// nil when that plane has no waist there.
type planePair struct{ t, s *planeWaist }

// either is the waist of a plane that has one.
func (pr planePair) either() planeWaist {
	if pr.t != nil {
		return *pr.t
	}
	return *pr.s
}

// pairPlanes joins a tangential and a sagittal waist in one stretch at one position; the other
// waists stand alone, the tangential ones first.
func pairPlanes(ts, ss []planeWaist) []planePair {
	out := make([]planePair, 0, len(ts)+len(ss))
	used := make([]bool, len(ss))
	for i := range ts {
		pr := planePair{t: &ts[i]}
		for j := range ss {
			if !used[j] && ss[j].stretch == ts[i].stretch && sameZ(ss[j].zMM, ts[i].zMM) {
				used[j] = true
				pr.s = &ss[j]
				break
			}
		}
		out = append(out, pr)
	}
	for j := range ss {
		if !used[j] {
			out = append(out, planePair{s: &ss[j]})
		}
	}
	return out
}

func ptr(v float64) *float64 { return &v }

// SampleCount is the number of evenly spaced envelope samples; every vertex is added to them.
const SampleCount = 400

// samples is the envelope w_t, w_s from the source to the last vertex plus a tail of a tenth of
// that length (at least 10 mm; none after a dump, where the beam ends), inside glass too.
func samples(p *optics.Path, g gaussian, st []stretch, t, s *planeTrace) []optics.BeamSample {
	end := 0.0
	tail := 10.0
	if n := len(p.Surfaces); n > 0 {
		end = p.Surfaces[n-1].PathMM
		tail = math.Max(tail, end/10)
		if p.Surfaces[n-1].Stops {
			tail = 0
		}
	}
	zEnd := end + tail
	// Merge the even grid with the vertices (both already in order), dropping repeats.
	zs := make([]float64, 0, SampleCount+1+len(p.Surfaces))
	push := func(z float64) {
		if len(zs) == 0 || z > zs[len(zs)-1] {
			zs = append(zs, z)
		}
	}
	i := 0
	for j := 0; j <= SampleCount; j++ {
		z := zEnd * float64(j) / SampleCount
		for ; i < len(p.Surfaces) && p.Surfaces[i].PathMM <= z; i++ {
			push(p.Surfaces[i].PathMM)
		}
		push(z)
	}
	for ; i < len(p.Surfaces); i++ {
		push(p.Surfaces[i].PathMM)
	}
	out := make([]optics.BeamSample, 0, len(zs))
	k := 0
	for _, z := range zs {
		for k < len(st)-1 && !(z <= st[k].Z1) {
			k++
		}
		x := st[k]
		qt := advance(t.at(x.I), z-x.Z0, x.N)
		qs := advance(s.at(x.I), z-x.Z0, x.N)
		out = append(out, optics.BeamSample{PathMM: z, WTMM: g.radiusMM(qt), WSMM: s.g.radiusMM(qs)})
	}
	return out
}
