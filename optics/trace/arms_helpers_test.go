package trace

import (
	"math"

	"raytable/optics"
)

// Benches with splitters and periscopes, built in Go: one wavelength, a collimated source, a
// glass "g" of index 1.5 for plates.

func fp(v float64) *float64 { return &v }

func armsBench(els ...optics.Element) *optics.Bench {
	return &optics.Bench{
		Format: optics.FormatBenchV1, WavelengthsNM: []float64{587.6},
		Table:     optics.Table{Grid: optics.GridNone, WidthMM: 2000, DepthMM: 2000, BeamHeightMM: 100},
		Source:    optics.Source{XMM: 100, YMM: 1000, Kind: optics.SourceCollimated, SemiDiameterMM: fp(2)},
		Materials: map[string]optics.MaterialSpec{"g": {Index: fp(1.5)}},
		Elements:  els,
	}
}

func plateEl(gap, turnDeg, thickness float64) optics.Element {
	return optics.Element{ID: "BS", Type: optics.TypeSplitter, GapMM: gap, TurnDeg: fp(turnDeg),
		ThicknessMM: fp(thickness), Material: "g"}
}

func periscopeEl(gap, rise, turnDeg float64) optics.Element {
	return optics.Element{ID: "P", Type: optics.TypePeriscope, GapMM: gap, RiseMM: fp(rise), TurnDeg: fp(turnDeg)}
}

func screenEl(id string, gap float64) optics.Element {
	return optics.Element{ID: id, Type: optics.TypeScreen, GapMM: gap}
}

func thinEl(gap, focal float64) optics.Element {
	return optics.Element{ID: "T", Type: optics.TypeThinLens, GapMM: gap, FocalMM: fp(focal)}
}

func mirrorEl(gap, radius, turnDeg float64) optics.Element {
	return optics.Element{ID: "M", Type: optics.TypeMirror, GapMM: gap, RadiusMM: fp(radius), TurnDeg: fp(turnDeg)}
}

// brewsterTurnDeg is the splitter turn whose incidence (180° - |turn|)/2 is Brewster's angle.
func brewsterTurnDeg(n float64) float64 { return 180 - 2*math.Atan(n)*180/math.Pi }
