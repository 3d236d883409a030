package beam

import (
	"math"

	"raytable/optics"
)

// part is one element of a hand-built test path.
type part struct {
	id      string
	kind    optics.SurfaceKind
	gapMM   float64
	diamMM  float64   // clear diameter; 0 means unlimited
	radiiMM []float64 // lens faces, 0 flat, + centre downstream; mirror: [R], + concave
	thickMM []float64 // lens
	index   []float64 // lens: index of the glass after each face but the last
	focalMM float64   // thin lens
	turnDeg float64   // mirror
	stops   bool      // dump
}

func thinLens(id string, gap, f float64) part {
	return part{id: id, kind: optics.Thin, gapMM: gap, focalMM: f}
}

func lens(id string, gap, r1, r2, t, n float64) part {
	return part{id: id, kind: optics.Refracting, gapMM: gap, radiiMM: []float64{r1, r2}, thickMM: []float64{t}, index: []float64{n}}
}

func mirror(id string, gap, r, turnDeg float64) part {
	return part{id: id, kind: optics.Reflecting, gapMM: gap, radiiMM: []float64{r}, turnDeg: turnDeg}
}

func plane(id string, gap, diam float64) part {
	return part{id: id, kind: optics.Plane, gapMM: gap, diamMM: diam}
}

func (p part) clear(diam float64) part { p.diamMM = diam; return p }

// buildPath unfolds parts into an optics.Path at one wavelength, the way optics.BuildPath does:
// gaps from the previous last vertex, one surface per face, index after each surface.
func buildPath(wavelengthNM float64, parts ...part) *optics.Path {
	p := &optics.Path{WavelengthsNM: []float64{wavelengthNM}}
	air := []float64{1}
	z := 0.0
	for ei, e := range parts {
		z += e.gapMM
		semi := math.Inf(1)
		if e.diamMM > 0 {
			semi = e.diamMM / 2
		}
		first := len(p.Surfaces)
		base := optics.Surface{Element: ei, ID: e.id, Kind: e.kind, SemiAperture: semi, Index: air, PathMM: z}
		switch e.kind {
		case optics.Refracting:
			for f, r := range e.radiiMM {
				s := base
				s.Face, s.PathMM, s.Curvature = f, z, inv(r)
				if f < len(e.thickMM) {
					s.Index = []float64{e.index[f]}
					z += e.thickMM[f]
				}
				p.Surfaces = append(p.Surfaces, s)
			}
		case optics.Reflecting:
			s := base
			s.Curvature = inv(e.radiiMM[0])
			s.TurnRad = e.turnDeg * math.Pi / 180
			s.IncidenceRad = (math.Pi - math.Abs(s.TurnRad)) / 2
			p.Surfaces = append(p.Surfaces, s)
		case optics.Thin:
			s := base
			s.FocalMM = e.focalMM
			p.Surfaces = append(p.Surfaces, s)
		default:
			s := base
			s.Stops = e.stops
			p.Surfaces = append(p.Surfaces, s)
		}
		p.Spans = append(p.Spans, optics.Span{First: first, Last: len(p.Surfaces) - 1})
	}
	return p
}

func inv(r float64) float64 {
	if r == 0 {
		return 0
	}
	return 1 / r
}

// beamBench is a bench with a collimated source carrying a Gaussian beam.
func beamBench(wavelengthNM, w0, waistAt, m2 float64) *optics.Bench {
	return &optics.Bench{
		WavelengthsNM: []float64{wavelengthNM},
		Source: optics.Source{Kind: optics.SourceCollimated, Beam: &optics.Beam{
			WaistRadiusMM: w0, WaistAtMM: waistAt, M2: &m2,
		}},
	}
}

// waistAfter returns the waists whose `after` is id ("" for before the first element).
func waistAfter(r *optics.BeamReport, id string) []optics.Waist {
	var out []optics.Waist
	for _, w := range r.Waists {
		if (w.After == nil && id == "") || (w.After != nil && *w.After == id) {
			out = append(out, w)
		}
	}
	return out
}

func row(r *optics.BeamReport, id string) optics.BeamAt {
	for _, e := range r.Elements {
		if e.ID == id {
			return e
		}
	}
	return optics.BeamAt{}
}

type pathAndBench struct {
	p *optics.Path
	b *optics.Bench
}
