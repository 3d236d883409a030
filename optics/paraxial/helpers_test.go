package paraxial

import (
	"math"
	"math/rand/v2"
	"testing"

	"raytable/optics"
)

// pathBuilder assembles an unfolded path by hand, element by element, so the tests need no
// materials: every index is given directly and is the same at every wavelength.
type pathBuilder struct {
	p optics.Path
	z float64 // last vertex so far
}

func newPath(wavelengthsNM ...float64) *pathBuilder {
	if len(wavelengthsNM) == 0 {
		wavelengthsNM = []float64{587.6}
	}
	return &pathBuilder{p: optics.Path{WavelengthsNM: wavelengthsNM}}
}

func (b *pathBuilder) index(n float64) []float64 {
	out := make([]float64, len(b.p.WavelengthsNM))
	for k := range out {
		out[k] = n
	}
	return out
}

// add appends the surfaces of one element, placing its first vertex gap after the last one.
func (b *pathBuilder) add(id string, gap float64, thick []float64, ss ...optics.Surface) *pathBuilder {
	b.z += gap
	first := len(b.p.Surfaces)
	for f := range ss {
		s := ss[f]
		s.Element, s.ID, s.Face, s.PathMM = len(b.p.Spans), id, f, b.z
		if s.SemiAperture == 0 {
			s.SemiAperture = math.Inf(1)
		}
		if s.Index == nil {
			s.Index = b.index(1)
		}
		b.p.Surfaces = append(b.p.Surfaces, s)
		if f < len(thick) {
			b.z += thick[f]
		}
	}
	b.p.Spans = append(b.p.Spans, optics.Span{First: first, Last: len(b.p.Surfaces) - 1})
	return b
}

// radiusCurvature turns a face radius into a curvature; 0 or Inf means flat.
func radiusCurvature(r float64) float64 {
	if r == 0 || math.IsInf(r, 0) {
		return 0
	}
	return 1 / r
}

// lens adds a lens with the given face radii (0 flat), centre thicknesses and media between the
// faces; the medium after the last face is air.
func (b *pathBuilder) lens(id string, gap, semi float64, radii, thick, n []float64) *pathBuilder {
	ss := make([]optics.Surface, len(radii))
	for f, r := range radii {
		ss[f] = optics.Surface{Kind: optics.Refracting, Curvature: radiusCurvature(r), SemiAperture: semi}
		if f < len(n) {
			ss[f].Index = b.index(n[f])
		}
	}
	return b.add(id, gap, thick, ss...)
}

func (b *pathBuilder) thin(id string, gap, focal, semi float64) *pathBuilder {
	return b.add(id, gap, nil, optics.Surface{Kind: optics.Thin, FocalMM: focal, SemiAperture: semi})
}

// mirror adds a mirror of radius r (+ concave, 0 flat) met at the given angle of incidence.
func (b *pathBuilder) mirror(id string, gap, r, incidenceDeg, semi float64) *pathBuilder {
	i := incidenceDeg * math.Pi / 180
	return b.add(id, gap, nil, optics.Surface{Kind: optics.Reflecting, Curvature: radiusCurvature(r),
		IncidenceRad: i, TurnRad: math.Pi - 2*i, SemiAperture: semi})
}

func (b *pathBuilder) plane(id string, gap, semi float64) *pathBuilder {
	return b.add(id, gap, nil, optics.Surface{Kind: optics.Plane, SemiAperture: semi})
}

func (b *pathBuilder) path() *optics.Path { return &b.p }

// randomPath is a path of the given number of elements of every kind with moderate powers,
// thicknesses, indices and tilts, for conservation checks.
func randomPath(rng *rand.Rand, elements int) *optics.Path {
	b := newPath()
	between := func(lo, hi float64) float64 { return lo + (hi-lo)*rng.Float64() }
	sign := func() float64 {
		if rng.IntN(2) == 0 {
			return -1
		}
		return 1
	}
	radius := func() float64 {
		if rng.IntN(5) == 0 {
			return 0
		}
		return sign() * between(20, 300)
	}
	for e := 0; e < elements; e++ {
		id := string(rune('A'+e%26)) + string(rune('0'+e/26))
		gap := between(5, 80)
		semi := between(5, 30)
		switch rng.IntN(4) {
		case 0:
			faces := 2 + rng.IntN(2)
			radii := make([]float64, faces)
			for f := range radii {
				radii[f] = radius()
			}
			thick := make([]float64, faces-1)
			n := make([]float64, faces-1)
			for j := range thick {
				thick[j], n[j] = between(1, 10), between(1.4, 1.9)
			}
			b.lens(id, gap, semi, radii, thick, n)
		case 1:
			b.thin(id, gap, sign()*between(30, 300), semi)
		case 2:
			b.mirror(id, gap, radius()*3, between(0, 40), semi)
		default:
			b.plane(id, gap, between(2, 15))
		}
	}
	return b.path()
}

func checkNil(t *testing.T, name string, got *float64) {
	t.Helper()
	if got != nil {
		t.Errorf("%s = %.12g, want nil", name, *got)
	}
}

func collimated(semi float64, fieldsDeg ...float64) *optics.Bench {
	return &optics.Bench{Source: optics.Source{Kind: optics.SourceCollimated, SemiDiameterMM: &semi, FieldAnglesDeg: fieldsDeg}}
}

func pointSource(na float64, heightsMM ...float64) *optics.Bench {
	return &optics.Bench{Source: optics.Source{Kind: optics.SourcePoint, NA: &na, ObjectHeightsMM: heightsMM}}
}
