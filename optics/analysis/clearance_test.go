package analysis

import (
	"fmt"
	"math"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// TestClearanceOnTiltedMirror: a tilted mirror's clear aperture is a circle on the mirror, so a
// ray's clearance is its distance from the mirror's centre measured on the mirror. A ray at height
// h in the plane of incidence meets a flat mirror at angle of incidence i a distance h/cos i from
// its centre; a ray displaced across that plane (x, up) meets it at |x| (plane geometry, from
// memory). Across the leaving beam the first would look only h from the centre: at i = 45° a ray
// 10 mm high on a 25.4 mm mirror looks 21 % inside the rim though it is cut.
func TestClearanceOnTiltedMirror(t *testing.T) {
	const semiMM = 12.7
	tests := []struct {
		name              string
		turnDeg, yMM, xMM float64
		wantRMM           float64
		wantStatus        string
	}{
		{"normal incidence", 180, 5, 0, 5, optics.RayOK},
		{"45° in the plane of incidence", 90, 5, 0, 5 * math.Sqrt2, optics.RayOK},
		{"45° across the plane of incidence", 90, 0, 5, 5, optics.RayOK},
		{"60° in the plane of incidence", 60, 5, 0, 10, optics.RayOK},
		{"45°, inside across the beam, cut on the mirror", 90, 10, 0, 10 * math.Sqrt2, optics.RayClipped},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r := mustRun(t, fmt.Sprintf(`{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"metric-25mm","width_mm":900,"depth_mm":900,"beam_height_mm":75},
 "source":{"x_mm":300,"y_mm":300,"heading_deg":0,"kind":"collimated","semi_diameter_mm":0.01,
   "rays":[{"height_mm":%g,"angle_deg":0,"x_mm":%g,"x_angle_deg":0}]},
 "elements":[
  {"id":"M1","type":"mirror","gap_mm":100,"radius_mm":null,"turn_deg":%g,"diameter_mm":%g},
  {"id":"CAM","type":"screen","gap_mm":100}]}`, tc.yMM, tc.xMM, tc.turnDeg, 2*semiMM))
			m := r.Elements[0]
			if !approx.Abs(m.MaxExactYMM, tc.wantRMM, 1e-9) {
				t.Errorf("max_exact_r_mm = %.9f, want %.9f", m.MaxExactYMM, tc.wantRMM)
			}
			if got := value(t, "clearance", m.Clearance); !approx.Abs(got, tc.wantRMM/semiMM, 1e-9) {
				t.Errorf("clearance = %.9f, want %.9f", got, tc.wantRMM/semiMM)
			}
			// The clearance and the trace's clipping agree: above 1 exactly when the ray is cut.
			if got := r.Rays[0].Status; got != tc.wantStatus {
				t.Errorf("ray status %s, want %s", got, tc.wantStatus)
			}
		})
	}
}
