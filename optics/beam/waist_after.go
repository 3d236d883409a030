package beam

import (
	"math"
	"math/cmplx"

	"raytable/optics"
	"raytable/optics/paraxial"
)

// OutputWaist is where the beam leaving one surface has its waist and how long that waist is, in
// one plane at the primary wavelength.
type OutputWaist struct {
	AfterMM    float64 // signed distance along the path from the surface to the waist (negative: a virtual waist upstream)
	RayleighMM float64 // the Rayleigh range π w0²/(M² λ) in the medium the beam leaves into (n·Im q̂)
}

// WaistAfter follows b's source beam through p up to surface last (inclusive) in the given plane
// and gives the waist of the beam leaving it. It is a reused, allocation-free walk for callers
// that recompute it on many changed paths (the spacing tolerances). ok is false when the source
// has no beam, its numbers are out of range, or q stops being a beam (Im q̂ ≤ 0) on the way.
func WaistAfter(b *optics.Bench, p *optics.Path, last int, plane paraxial.Plane) (OutputWaist, bool) {
	if b == nil || p == nil || b.Source.GaussianBeam() == nil || last < 0 || last >= len(p.Surfaces) || len(p.WavelengthsNM) == 0 {
		return OutputWaist{}, false
	}
	// Each plane starts from its own waist and M² (a diode's elliptical beam, source.beam.sagittal).
	bp, vertical := b.Source.GaussianBeam().Planes()
	if plane == paraxial.Sagittal {
		bp = vertical
	}
	m2 := bp.Quality()
	lam := p.WavelengthsNM[0]
	if !(lam > 0) || !(bp.WaistRadiusMM > 0) || !(m2 > 0) || math.IsInf(bp.WaistRadiusMM, 0) || math.IsInf(m2, 0) ||
		math.IsNaN(bp.WaistAtMM) || math.IsInf(bp.WaistAtMM, 0) {
		return OutputWaist{}, false
	}
	q := newGaussian(lam, m2).sourceQ(bp.WaistRadiusMM, bp.WaistAtMM)
	for i := 0; i <= last; i++ {
		if len(p.Surfaces[i].Index) == 0 {
			return OutputWaist{}, false
		}
		q = applyABCD(paraxial.GapMatrix(p, i, 0, plane), q)
		q = applyABCD(paraxial.SurfaceMatrix(p, i, 0, plane), q)
		if cmplx.IsNaN(q) || cmplx.IsInf(q) || !(imag(q) > 0) {
			return OutputWaist{}, false
		}
	}
	// Reduced q̂ = q/n: the waist lies -Re(q) = -n·Re(q̂) downstream, and zR = n·Im(q̂).
	n := p.Surfaces[last].Index[0]
	return OutputWaist{AfterMM: -n * real(q), RayleighMM: n * imag(q)}, true
}
