package beam

import (
	"math"

	"raytable/optics"
)

// stretch is the part of the unfolded path in front of surface I, from Z0 (the previous vertex or
// the source) to Z1 (the vertex of surface I). I == len(p.Surfaces) is the free space beyond the
// last surface, with Z1 = +Inf.
type stretch struct {
	I      int
	Z0, Z1 float64
	N      float64 // index of the medium, primary wavelength
	Inside bool    // between two faces of one element
}

// Glass reports whether the stretch lies inside an element in a medium other than air.
func (s stretch) Glass() bool { return s.Inside && s.N != 1 }

// stretches lists the stretches of p in path order, the last one beyond the last surface.
func stretches(p *optics.Path) []stretch {
	n := len(p.Surfaces)
	out := make([]stretch, 0, n+1)
	z0 := 0.0
	for i := range p.Surfaces {
		s := &p.Surfaces[i]
		inside := i > 0 && p.Surfaces[i-1].Element == s.Element
		out = append(out, stretch{I: i, Z0: z0, Z1: s.PathMM, N: p.IndexBefore(i, 0), Inside: inside})
		z0 = s.PathMM
	}
	out = append(out, stretch{I: n, Z0: z0, Z1: math.Inf(1), N: p.IndexBefore(n, 0)})
	return out
}

// upstreamID is the id of the element whose surface precedes stretch I, or nil for the first.
func upstreamID(p *optics.Path, i int) *string {
	if i == 0 {
		return nil
	}
	id := p.Surfaces[i-1].ID
	return &id
}

// sameZ says whether two positions along the path are the same point, up to rounding of the sums
// that built them.
func sameZ(a, b float64) bool {
	return math.Abs(a-b) <= 1e-9*math.Max(1, math.Max(math.Abs(a), math.Abs(b)))
}

// contains says whether z belongs to the stretch: (Z0, Z1], a point on a vertex belonging to the
// stretch that ends there. The first stretch also holds the source plane itself.
func (s stretch) contains(z float64) bool {
	if sameZ(z, s.Z0) {
		return s.I == 0
	}
	return z > s.Z0 && (z <= s.Z1 || sameZ(z, s.Z1))
}
