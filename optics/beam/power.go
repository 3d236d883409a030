package beam

import (
	"math"

	"raytable/optics"
)

// thinLensIndex is the glass index assumed for the Fresnel reflection of an uncoated thin lens,
// which states no glass: 1.5, a crown glass (common practice).
const thinLensIndex = 1.5

// Where the power a face takes off the path goes.
const (
	lossGhost = iota // reflected back by a refracting face
	lossLeak         // let through by a mirror
	lossSplit        // sent to a splitter's other port: another arm's light, not a stray
)

// faceLoss is the share of the source's power one surface takes off the path.
type faceLoss struct {
	surface int
	kind    int
	share   float64
}

// elementPower is the power bookkeeping of one element, as shares of the source's power at the
// primary wavelength: what arrives is clipped by the clear apertures, reflected back by
// refracting faces, diverted (a mirror's leak, a splitter's other port), absorbed by a dump, or
// passed on: Arriving = Clipped + Reflected + Diverted + Absorbed + Passed.
//
// The clear apertures act first, then the faces in beam order, each on what the one before let
// on; clipping and reflection are taken as independent (a face's reflectance does not depend on
// where the light meets it).
type elementPower struct {
	Arriving, Clipped, Reflected, Diverted, Absorbed, Passed float64
	losses                                                   []faceLoss
}

// powerBudget follows the source's power along p, element by element. pass holds the fraction
// each element's clear apertures pass (nil: all of it).
func powerBudget(b *optics.Bench, p *optics.Path, pass []float64) []elementPower {
	out := make([]elementPower, len(p.Spans))
	f := 1.0
	for ei, sp := range p.Spans {
		ep := elementPower{Arriving: f}
		t := 1.0
		if pass != nil && ei < len(pass) {
			t = pass[ei]
		}
		ep.Clipped = f * (1 - t)
		g := f * t
		for i := sp.First; i <= sp.Last && i >= 0 && i < len(p.Surfaces); i++ {
			s := &p.Surfaces[i]
			if s.Stops {
				ep.Absorbed += g
				g = 0
				break
			}
			share, kind := surfaceLoss(b, p, i)
			lost := g * share
			if lost == 0 {
				continue
			}
			g -= lost
			ep.losses = append(ep.losses, faceLoss{surface: i, kind: kind, share: lost})
			if kind == lossGhost {
				ep.Reflected += lost
			} else {
				ep.Diverted += lost
			}
		}
		ep.Passed = g
		out[ei] = ep
		f = g
	}
	return out
}

// surfaceLoss is the fraction of the light reaching surface i that leaves the path there, and
// where it goes (README "Power").
func surfaceLoss(b *optics.Bench, p *optics.Path, i int) (float64, int) {
	s := &p.Surfaces[i]
	if s.Element < 0 || s.Element >= len(b.Elements) {
		return 0, lossGhost
	}
	e := &b.Elements[s.Element]
	lam := 0.0
	if len(p.WavelengthsNM) > 0 {
		lam = p.WavelengthsNM[0]
	}
	switch s.Kind {
	case optics.Refracting:
		if e.Type == optics.TypeSplitter && s.Face == 0 {
			return e.ReflectedShare(lam), lossSplit // the plate's first face is the splitting one
		}
		return e.FaceReflectanceAt(p.IndexBefore(i, 0), s.Index[0]), lossGhost
	case optics.Thin:
		r := e.FaceReflectanceAt(1, thinLensIndex)
		return 1 - (1-r)*(1-r), lossGhost // two faces
	case optics.Reflecting:
		if e.Type == optics.TypeMirror && (e.Reflect != nil || e.Dichroic != nil) {
			// a splitter's reflected port standing in as a mirror on an arm's linear bench
			return 1 - e.ReflectedShare(lam), lossSplit
		}
		return 1 - e.MirrorReflectance(), lossLeak
	case optics.Fold:
		return 1 - optics.DefaultMirrorReflectance, lossLeak
	case optics.Plane:
		if e.Type == optics.TypeSplitter {
			return e.ReflectedShare(lam), lossSplit
		}
	}
	return 0, lossGhost
}

// PeakIrradianceWCM2 is the peak irradiance 2P/(π w_t w_s) of a Gaussian beam of power powerW
// and 1/e² radii wtMM and wsMM (2P/(π w²) for a round beam): the definition of the 1/e² radius,
// integrating the Gaussian profile over the plane.
func PeakIrradianceWCM2(powerW, wtMM, wsMM float64) float64 {
	return 2 * powerW / (math.Pi * (wtMM / 10) * (wsMM / 10))
}

// PeakFluenceJCM2 is the peak fluence 2E/(π w_t w_s) of one pulse of energy energyJ.
func PeakFluenceJCM2(energyJ, wtMM, wsMM float64) float64 {
	return PeakIrradianceWCM2(energyJ, wtMM, wsMM)
}
