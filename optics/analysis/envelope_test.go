package analysis

import (
	"fmt"
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

// TestMountInBeamAtNinetyNinePercent: the beam folds back by two mirrors 50 mm beside its way out
// and passes 29.8 mm beyond the edge of L1's mount (the mount is 40.4 mm wide, so its edge is
// 20.2 mm from the axis). A collimated beam of w = 22 mm reaches 1.5174·22 = 33.4 mm: into the
// mount, though its 1/e² radius would not; w = 18 mm reaches 27.3 mm and stays clear.
func TestMountInBeamAtNinetyNinePercent(t *testing.T) {
	for _, tc := range []struct {
		wMM    float64
		inBeam bool
	}{{22, true}, {18, false}} {
		t.Run(fmt.Sprint(tc.wMM), func(t *testing.T) {
			r := mustRun(t, fmt.Sprintf(`{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"none","width_mm":1000,"depth_mm":1000,"beam_height_mm":75},
 "source":{"x_mm":0,"y_mm":100,"heading_deg":0,"kind":"collimated","semi_diameter_mm":0.5,
   "beam":{"waist_radius_mm":%g}},
 "elements":[
  {"id":"L1","type":"thin-lens","gap_mm":100,"focal_mm":1e6,"diameter_mm":25.4},
  {"id":"M1","type":"mirror","gap_mm":100,"turn_deg":90,"diameter_mm":100,"mount":{"width_mm":20,"depth_mm":10}},
  {"id":"M2","type":"mirror","gap_mm":50,"turn_deg":90,"diameter_mm":100,"mount":{"width_mm":20,"depth_mm":10}},
  {"id":"D","type":"dump","gap_mm":250}]}`, tc.wMM))
			found := false
			for _, w := range r.Warnings {
				found = found || (w.Code == optics.WarnMountInBeam && w.Element == "L1")
			}
			if found != tc.inBeam {
				t.Errorf("mount-in-beam at L1: %v, want %v; warnings %+v", found, tc.inBeam, r.Warnings)
			}
		})
	}
}
