package analysis

import (
	"math"

	"raytable/optics"
	"raytable/optics/material"
)

// pathLengths measures optical and group path along one arm's unfolded path at its primary
// wavelength: Σ n·L and Σ n_g·L over the stretches between its surfaces.
type pathLengths struct {
	p   *optics.Path
	ng  []float64 // group index after each surface; 1 in air
	lam float64
}

func newPathLengths(b *optics.Bench) *pathLengths {
	p := optics.BuildPath(b)
	pl := &pathLengths{p: p, ng: make([]float64, len(p.Surfaces))}
	if len(b.WavelengthsNM) == 0 {
		return pl
	}
	pl.lam = b.WavelengthsNM[0]
	media := optics.Media(b)
	for i, s := range p.Surfaces {
		pl.ng[i] = 1
		if name := glassAfter(b, s); name != "" {
			if ng := material.GroupIndex(media[name], pl.lam); !math.IsNaN(ng) {
				pl.ng[i] = ng
			} else {
				pl.ng[i] = s.Index[0] // no dispersion known: the phase index
			}
		}
	}
	return pl
}

// glassAfter names the medium behind surface s, "" for air: a lens's material between two faces,
// a splitter plate's material behind its first face.
func glassAfter(b *optics.Bench, s optics.Surface) string {
	if s.Kind != optics.Refracting || s.Element >= len(b.Elements) {
		return ""
	}
	e := &b.Elements[s.Element]
	switch {
	case e.Type == optics.TypeLens && s.Face < len(e.ThicknessesMM) && s.Face < len(e.Materials):
		return e.Materials[s.Face]
	case e.Type == optics.TypeSplitter && e.ThicknessMM != nil && s.Face == 0:
		return e.Material
	}
	return ""
}

// to returns the optical path Σ n·L and the group path Σ n_g·L from the source to pathMM along
// the unfolded path (the air before the first surface has n = n_g = 1).
func (pl *pathLengths) to(pathMM float64) (optical, group float64) {
	z, n, ng := 0.0, 1.0, 1.0
	for i, s := range pl.p.Surfaces {
		if s.PathMM >= pathMM {
			break
		}
		optical += n * (s.PathMM - z)
		group += ng * (s.PathMM - z)
		z, ng = s.PathMM, pl.ng[i]
		if len(s.Index) > 0 {
			n = s.Index[0]
		}
	}
	if pathMM > z {
		optical += n * (pathMM - z)
		group += ng * (pathMM - z)
	}
	return optical, group
}

// delayPS is a group path in mm as a delay in picoseconds.
func delayPS(groupMM float64) float64 { return groupMM / material.SpeedOfLightMMPerPS }
