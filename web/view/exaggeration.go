package view

import (
	"math"

	"raytable/optics"
	"raytable/web/diagram"
)

// maxExaggeration keeps a nearly empty bench (tiny heights) from being stretched absurdly.
const maxExaggeration = 500

// contentHalfMM is the largest height anything in the side view reaches: clear semi-diameters,
// exact ray heights and beam radii.
func contentHalfMM(r *optics.Report) float64 {
	y := 0.0
	for _, e := range r.Elements {
		if e.SemiDiameterMM != nil && !math.IsInf(*e.SemiDiameterMM, 0) {
			y = math.Max(y, *e.SemiDiameterMM)
		}
		if !math.IsInf(e.MaxExactYMM, 0) && !math.IsNaN(e.MaxExactYMM) {
			y = math.Max(y, e.MaxExactYMM)
		}
	}
	if r.Beam != nil {
		for _, s := range r.Beam.Samples {
			y = math.Max(y, s.WTMM)
		}
	}
	return y
}

// AutoExaggeration is the vertical exaggeration that lets the heights fill the side view at the
// horizontal scale o gives: a round number (1, 2, 5 times a power of ten), 1 when none is needed.
// Benches are long and thin (a metre of path, a centimetre of beam), so without it every ray
// would sit on the axis.
func AutoExaggeration(r *optics.Report, o diagram.SideOptions) float64 {
	half := contentHalfMM(r)
	plotPX := diagram.SidePlotHeightPX(o)
	if half <= 0 || plotPX <= 0 {
		return 1
	}
	o.Exaggeration = 1
	mmPerPX := diagram.SideMMPerPX(r, o)
	want := plotPX * mmPerPX / (2 * 1.2 * half)
	return roundDown125(math.Min(want, maxExaggeration))
}

// roundDown125 rounds x down to 1, 2 or 5 times a power of ten; anything below 1 gives 1.
func roundDown125(x float64) float64 {
	if !(x > 1) {
		return 1
	}
	p := math.Pow(10, math.Floor(math.Log10(x)))
	for _, m := range []float64{5, 2, 1} {
		if m*p <= x {
			return m * p
		}
	}
	return p
}
