package analysis

import (
	"math"

	"raytable/optics"
	"raytable/optics/paraxial"
)

// fillElements adds to each element place its faces and the paraxial marginal and chief ray
// heights at its first face (tangential plane).
func fillElements(places []optics.ElementPlace, b *optics.Bench, p *optics.Path, tan paraxial.Result) {
	for i := range places {
		span := p.Spans[i]
		e := &b.Elements[i]
		pl := &places[i]
		pl.SemiDiameterMM = finite(e.SemiDiameterMM())
		if e.Type == optics.TypeThinLens && e.FocalMM != nil {
			pl.FocalMM = ptr(*e.FocalMM)
		}
		pl.Faces = make([]optics.FacePlace, 0, span.Last-span.First+1)
		for j := span.First; j <= span.Last; j++ {
			s := &p.Surfaces[j]
			f := optics.FacePlace{PathMM: s.PathMM, SemiDiameterMM: finite(s.SemiAperture), MaterialAfter: "air"}
			if s.Curvature != 0 {
				f.RadiusMM = ptr(1 / s.Curvature)
			}
			if e.Type == optics.TypeLens && s.Face < len(e.Materials) {
				f.MaterialAfter = e.Materials[s.Face]
			}
			pl.Faces = append(pl.Faces, f)
		}
		if span.First < len(tan.Marginal) {
			pl.MarginalYMM = tan.Marginal[span.First].Y
		}
		if span.First < len(tan.Chief) {
			pl.ChiefYMM = tan.Chief[span.First].Y
		}
	}
}

func ptr(v float64) *float64 { return &v }

// finite is v, or nil when v is infinite or NaN (JSON null).
func finite(v float64) *float64 {
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return nil
	}
	return ptr(v)
}
