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
	Plane                         // an aperture, screen, dump or a splitter of no thickness: clips, records or stops
	Fold                          // one flat 45° mirror of a periscope, unfolded: no power; the second may rotate the beam
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

	FocalMM float64 // Thin: focal length
	// IncidenceRad is the angle of incidence of the axis, 0 at normal incidence: on a mirror, on a
	// splitter (Plane, or both faces of its plate, the angle in air) and on a periscope's mirrors
	// (Fold, 45°). The clear aperture is a circle on the tilted surface, so across the beam it is
	// an ellipse of semi-axes SemiAperture·cos i in the plane of incidence and SemiAperture in
	// the other: the table plane for mirrors and splitters, the vertical plane for Fold.
	IncidenceRad float64
	TurnRad      float64 // Reflecting: change of heading on the table, + counter-clockwise; a splitter's faces: its reflected port's turn
	Stops        bool    // a dump: rays end here with status ok

	// TiltRad is the angle in the table plane from the arriving axis to a tilted flat refracting
	// face's normal (a splitter's plate), + counter-clockwise seen from above; 0 for a face square
	// to the axis. AxisTurnRad is the heading change of the axis refracting there at the primary
	// wavelength, which the frame after the face follows (+ counter-clockwise); the plate's two
	// faces turn it by opposite amounts, so after the plate the axis is parallel to the arriving
	// one, displaced sideways.
	TiltRad, AxisTurnRad float64
	// PlateMM is set on a plate's second face: the plate's thickness. The stretch in front of
	// this surface is then the glass of a plate met at IncidenceRad, whose reduced length differs
	// between the planes (paraxial.PlateReducedMM).
	PlateMM float64
	// RotateRad is the rotation of the beam's cross-section about the axis at this surface (a
	// periscope's second mirror: its turn, + as the turn).
	RotateRad float64
	// Swapped is true where the beam's tangential plane (the source's table plane) lies
	// vertical: after an odd number of periscopes whose turn is nearest an odd multiple of 90°.
	// The paraxial planes are the beam's own, so a tilted mirror there gives its table-plane
	// power to the sagittal plane.
	Swapped bool
	// CylinderAxis is a cylindrical lens's axis on the table (optics.CylinderVertical: power in the
	// table plane; CylinderHorizontal: in the vertical plane), "" for a spherical or flat face.
	CylinderAxis string
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
	// RotatedImage is true when a periscope turns by an angle that is not a multiple of 90°: the
	// exact trace follows the rotation, the paraxial and beam values take the nearest multiple.
	RotatedImage bool
}

// ElementLengthMM is the distance along the unfolded axis from element e's first vertex to its
// last: a lens's thicknesses, a plate's glass path t / cos θ' (primary wavelength), a
// periscope's |rise_mm|, zero for the rest. It is the element's share of the path length.
func (p *Path) ElementLengthMM(e int) float64 {
	sp := p.Spans[e]
	if sp.Last < sp.First {
		return 0
	}
	return p.Surfaces[sp.Last].PathMM - p.Surfaces[sp.First].PathMM
}

// ElementOpticalPathMM is the optical path Σ n·L of the axis at wavelength k inside element e,
// from its first vertex to its last: glass counts n times its length. A tilted plate's glass
// path is that of the axis at wavelength k, t·n / sqrt(n² - sin² i). Free space counts its
// length (a periscope's rise). The path in front of an element is its gap, in air.
func (p *Path) ElementOpticalPathMM(e, k int) float64 {
	sp := p.Spans[e]
	var opl float64
	for i := sp.First + 1; i <= sp.Last; i++ {
		s := &p.Surfaces[i]
		n := p.IndexBefore(i, k)
		if s.PlateMM > 0 {
			opl += n * PlateGlassPathMM(s.PlateMM, n, s.IncidenceRad)
			continue
		}
		opl += n * (s.PathMM - p.Surfaces[i-1].PathMM)
	}
	return opl
}

// IndexBefore is the index of the medium in front of surface i at wavelength k.
func (p *Path) IndexBefore(i, k int) float64 {
	if i == 0 {
		return 1
	}
	return p.Surfaces[i-1].Index[k]
}

// OpticalRange returns the indices of the first and last surface of the optical part (lenses, thin
// lenses, mirrors and splitter plates: everything but planes and periscopes), and ok=false when
// the bench has none.
func (p *Path) OpticalRange() (first, last int, ok bool) {
	first, last = -1, -1
	for i, s := range p.Surfaces {
		if s.Kind == Plane || s.Kind == Fold {
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
	swapped := false
	for ei := range b.Elements {
		e := &b.Elements[ei]
		z += e.GapMM
		first := len(p.Surfaces)
		base := Surface{Element: ei, ID: e.ID, SemiAperture: e.SemiDiameterMM(), Index: air, Swapped: swapped}
		base.CylinderAxis = e.CylinderAxis
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
		case TypeSplitter: // the transmitted pass; a reflected pass arrives here as a mirror
			z = p.addSplitter(b, e, base, z)
		case TypePeriscope:
			s := base
			s.Kind, s.PathMM, s.IncidenceRad = Fold, z, math.Pi/4
			p.Surfaces = append(p.Surfaces, s)
			if e.RiseMM != nil {
				z += math.Abs(*e.RiseMM)
			}
			s.Face, s.PathMM = 1, z
			if e.TurnDeg != nil {
				s.RotateRad = *e.TurnDeg * math.Pi / 180
				q, exact := PeriscopeQuarterTurns(*e.TurnDeg)
				p.RotatedImage = p.RotatedImage || !exact
				if q%2 != 0 {
					swapped = !swapped
				}
			}
			s.Swapped = swapped
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

// addSplitter appends the transmitted pass through splitter e, whose first vertex is at z, and
// returns the position of its last vertex. Without a plate it is a plane at the vertex that
// clips at the ellipse its tilted clear aperture presents. A plate is two flat faces tilted by
// the incidence i, the frame inside following the axis refracted at the primary wavelength.
func (p *Path) addSplitter(b *Bench, e *Element, base Surface, z float64) float64 {
	inc := e.SplitterIncidenceRad()
	base.PathMM, base.IncidenceRad = z, inc
	if e.TurnDeg != nil {
		base.TurnRad = *e.TurnDeg * math.Pi / 180
	}
	pl, ok := SplitterPlate(b, e)
	if !ok {
		base.Kind = Plane
		p.Surfaces = append(p.Surfaces, base)
		return z
	}
	side := e.PlateSide()
	dev := PlateDeviationRad(pl.N, inc)
	in := base
	in.Kind, in.Face = Refracting, 0
	in.Index = indices(pl.Medium, b.WavelengthsNM)
	in.TiltRad, in.AxisTurnRad = side*inc, side*dev
	out := base
	out.Kind, out.Face = Refracting, 1
	out.PathMM = z + PlateGlassPathMM(pl.ThicknessMM, pl.N, inc)
	out.TiltRad, out.AxisTurnRad = side*(inc-dev), -side*dev
	out.PlateMM = pl.ThicknessMM
	p.Surfaces = append(p.Surfaces, in, out)
	return out.PathMM
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
