package optics

import (
	"math"

	"raytable/optics/material"
)

// SurfaceKind says what a surface of the unfolded path does to light.
type SurfaceKind int

const (
	Refracting SurfaceKind = iota // a lens face between two media
	Reflecting                    // a mirror, unfolded: heights continue, a concave mirror converges
	Thin                          // an ideal thin lens
	Plane                         // an aperture, screen or dump: clips, records or stops
)

// Surface is one face along the unfolded optical path.
type Surface struct {
	Element int    // index into Bench.Elements
	ID      string // element id
	Face    int    // face number within the element, from 0
	Kind    SurfaceKind

	PathMM       float64 // vertex position along the unfolded path from the source
	Curvature    float64 // 1/radius in 1/mm, 0 flat. Lens faces: + when the centre is downstream. Mirrors: + concave.
	SemiAperture float64 // clear radius in mm, +Inf when unlimited

	// Index is the refractive index after this surface at each wavelength (Path.WavelengthsNM).
	// For every kind but Refracting it equals the index before.
	Index []float64

	FocalMM      float64 // Thin: focal length
	IncidenceRad float64 // Reflecting: angle of incidence on the mirror, 0 at normal incidence
	TurnRad      float64 // Reflecting: change of heading on the table, + counter-clockwise
	Stops        bool    // a dump: rays end here with status ok
}

// Span is the range of surfaces [First, Last] that belong to one element.
type Span struct{ First, Last int }

// Path is the bench unfolded along its optical axis: surfaces in beam order with their positions
// and the media between them resolved at every wavelength. It is what the paraxial trace, the
// exact trace and the beam propagation walk.
type Path struct {
	WavelengthsNM []float64
	Surfaces      []Surface
	Spans         []Span // one per element, in element order
}

// IndexBefore is the index of the medium in front of surface i at wavelength k.
func (p *Path) IndexBefore(i, k int) float64 {
	if i == 0 {
		return 1
	}
	return p.Surfaces[i-1].Index[k]
}

// OpticalRange returns the indices of the first and last surface of the optical part (lenses, thin
// lenses and mirrors), and ok=false when the bench has none.
func (p *Path) OpticalRange() (first, last int, ok bool) {
	first, last = -1, -1
	for i, s := range p.Surfaces {
		if s.Kind == Plane {
			continue
		}
		if first < 0 {
			first = i
		}
		last = i
	}
	return first, last, first >= 0
}

// BuildPath unfolds a valid bench. It assumes Validate found no problems; media that cannot be
// resolved give index 1, so call it only after validation.
func BuildPath(b *Bench) *Path {
	media := Media(b)
	p := &Path{WavelengthsNM: b.WavelengthsNM, Spans: make([]Span, len(b.Elements))}
	air := make([]float64, len(b.WavelengthsNM))
	for k := range air {
		air[k] = 1
	}
	var z float64
	for ei := range b.Elements {
		e := &b.Elements[ei]
		z += e.GapMM
		first := len(p.Surfaces)
		base := Surface{Element: ei, ID: e.ID, SemiAperture: e.SemiDiameterMM(), Index: air}
		switch e.Type {
		case TypeLens:
			for f, r := range e.FacesMM {
				s := base
				s.Kind, s.Face, s.PathMM = Refracting, f, z
				s.Curvature = curvature(r)
				if f < len(e.ThicknessesMM) {
					s.Index = indices(media[e.Materials[f]], b.WavelengthsNM)
					z += e.ThicknessesMM[f]
				}
				p.Surfaces = append(p.Surfaces, s)
			}
		case TypeThinLens:
			s := base
			s.Kind, s.PathMM = Thin, z
			if e.FocalMM != nil {
				s.FocalMM = *e.FocalMM
			}
			p.Surfaces = append(p.Surfaces, s)
		case TypeMirror:
			s := base
			s.Kind, s.PathMM = Reflecting, z
			s.Curvature = curvature(e.RadiusMM)
			if e.TurnDeg != nil {
				s.TurnRad = *e.TurnDeg * math.Pi / 180
				s.IncidenceRad = (math.Pi - math.Abs(s.TurnRad)) / 2
			}
			p.Surfaces = append(p.Surfaces, s)
		default: // aperture, screen, dump
			s := base
			s.Kind, s.PathMM = Plane, z
			if e.Type == TypeScreen {
				s.SemiAperture = inf
			}
			if k, ok := KindOf(e.Type); ok {
				s.Stops = k.StopsRays
			}
			p.Surfaces = append(p.Surfaces, s)
		}
		p.Spans[ei] = Span{First: first, Last: len(p.Surfaces) - 1}
	}
	return p
}

func curvature(r *float64) float64 {
	if r == nil || *r == 0 {
		return 0
	}
	return 1 / *r
}

func indices(m material.Medium, wavelengthsNM []float64) []float64 {
	n := make([]float64, len(wavelengthsNM))
	for k, w := range wavelengthsNM {
		if m == nil {
			n[k] = 1
			continue
		}
		n[k] = m.Index(w)
	}
	return n
}
