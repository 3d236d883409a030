package analysis

import (
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// TestBeamRadiusPassesNinetyNinePercent: the mount-in-beam and off-table checks take a Gaussian
// beam as wide as the circle that passes 99 % of its power, the clip rule's (README 'The
// breadboard'): a = w·√(ln 100 / 2) = 1.5174 w (from 1 − exp(−2a²/w²) = 0.99, the Gaussian's
// encircled power), of the larger of the two planes' radii, linear between samples.
func TestBeamRadiusPassesNinetyNinePercent(t *testing.T) {
	const perW = 1.517427 // √(ln 100 / 2), by hand
	r := &optics.Report{Beam: &optics.BeamReport{Samples: []optics.BeamSample{
		{PathMM: 0, WTMM: 2, WSMM: 1}, {PathMM: 100, WTMM: 3, WSMM: 4},
	}}}
	radius := beamRadius(r, &optics.Bench{})
	for _, tc := range []struct{ pathMM, wantMM float64 }{
		{0, 2 * perW}, {50, 3 * perW}, {100, 4 * perW}, {200, 4 * perW},
	} {
		if got := radius(tc.pathMM); !approx.Abs(got, tc.wantMM, 1e-5) {
			t.Errorf("at %g mm: %.6f mm, want %.6f", tc.pathMM, got, tc.wantMM)
		}
	}
}
