package analysis

import (
	"math"
	"sort"

	"raytable/optics"
	"raytable/optics/beam"
)

// beamRadius returns the half-width of the light along the path, for the mount-in-beam and
// off-table checks: when the bench has a Gaussian beam, the radius that passes 99 % of its power
// (beam.PassRadiusPerW of the clip rule, about 1.52 times the larger of the two 1/e² radii); else
// the largest exact ray distance at each element (the source's bundle at the start), interpolated
// linearly in between. On a tilted mirror that distance is measured on the mirror, up to 1/cos i
// wider than the bundle across the beam: on the safe side.
func beamRadius(r *optics.Report, b *optics.Bench) func(pathMM float64) float64 {
	var zs, ws []float64
	if r.Beam != nil && len(r.Beam.Samples) > 0 {
		for _, s := range r.Beam.Samples {
			zs = append(zs, s.PathMM)
			ws = append(ws, beam.PassRadiusPerW*math.Max(s.WTMM, s.WSMM))
		}
	} else {
		zs = append(zs, 0)
		ws = append(ws, sourceRadius(b))
		for _, e := range r.Elements {
			zs = append(zs, e.PathMM)
			ws = append(ws, e.MaxExactYMM)
		}
	}
	return func(z float64) float64 { return interpolate(zs, ws, z) }
}

// sourceRadius is the half-width of the light at the source plane.
func sourceRadius(b *optics.Bench) float64 {
	var h float64
	if b.Source.SemiDiameterMM != nil {
		h = *b.Source.SemiDiameterMM
	}
	for _, y := range b.Source.ObjectHeightsMM {
		h = math.Max(h, math.Abs(y))
	}
	return h
}

// interpolate is piecewise linear through (zs, ws), zs ascending, held constant past either end.
func interpolate(zs, ws []float64, z float64) float64 {
	n := len(zs)
	if n == 0 {
		return 0
	}
	i := sort.SearchFloat64s(zs, z)
	switch {
	case i == 0:
		return ws[0]
	case i >= n:
		return ws[n-1]
	}
	z0, z1 := zs[i-1], zs[i]
	if z1 == z0 {
		return math.Max(ws[i-1], ws[i])
	}
	t := (z - z0) / (z1 - z0)
	return ws[i-1] + t*(ws[i]-ws[i-1])
}
