package optics

import (
	"strings"
	"testing"
)

// TestValidateTargets: bad fibre sources, fibres, mode targets, cylinder axes and vertical beam
// planes are named by their JSON path with the rule they break (README "Fibres, mode targets and
// cylindrical lenses").
func TestValidateTargets(t *testing.T) {
	const head = `{"format":"raytable/bench/v1","wavelengths_nm":[1064],
 "table":{"grid":"none","width_mm":1000,"depth_mm":500,"beam_height_mm":75},`
	for _, tc := range []struct {
		name, source, elements, path, says string
	}{
		{"fibre source without its mode", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"fiber"}`,
			`{"id":"S","type":"screen","gap_mm":10}`, "source.mfd_um", "needs mfd_um"},
		{"fibre source with a beam", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"fiber","mfd_um":6,"beam":{"waist_radius_mm":1}}`,
			`{"id":"S","type":"screen","gap_mm":10}`, "source.beam", "its mode"},
		{"fibre source diverging beyond NA 1", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"fiber","mfd_um":0.5}`,
			`{"id":"S","type":"screen","gap_mm":10}`, "source.mfd_um", "beyond NA 1"},
		{"fibre source of NA 1.2", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"fiber","mfd_um":6,"na":1.2}`,
			`{"id":"S","type":"screen","gap_mm":10}`, "source.na", "strictly between 0 and 1"},
		{"fibre of negative mode", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"fiber","mfd_um":6}`,
			`{"id":"FC","type":"fiber","gap_mm":10,"mfd_um":-3}`, "elements[0].mfd_um", "greater than 0 µm"},
		{"mode target without a waist", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"fiber","mfd_um":6}`,
			`{"id":"T","type":"mode-target","gap_mm":10}`, "elements[0].waist_radius_mm", "needs waist_radius_mm"},
		{"mode target with an M²", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"fiber","mfd_um":6}`,
			`{"id":"T","type":"mode-target","gap_mm":10,"waist_radius_mm":0.1,"sagittal":{"waist_radius_mm":0.2,"m2":1.1}}`, "elements[0].sagittal.m2", "ideal Gaussian"},
		{"unknown cylinder axis", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1}`,
			`{"id":"C","type":"thin-lens","gap_mm":10,"focal_mm":50,"cylinder_axis":"diagonal"},{"id":"S","type":"screen","gap_mm":10}`,
			"elements[0].cylinder_axis", `"vertical" or "horizontal"`},
		{"vertical plane of M² 0.5", `{"x_mm":10,"y_mm":250,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1,
   "beam":{"waist_radius_mm":1,"sagittal":{"waist_radius_mm":2,"waist_at_mm":0,"m2":0.5}}}`,
			`{"id":"S","type":"screen","gap_mm":10}`, "source.beam.sagittal.m2", "at least 1"},
	} {
		_, err := Decode([]byte(head + `"source":` + tc.source + `,"elements":[` + tc.elements + `]}`))
		found := false
		for _, p := range ErrorProblems(err) {
			if p.Path == tc.path && strings.Contains(p.Message, tc.says) {
				found = true
			}
		}
		if !found {
			t.Errorf("%s: want a problem at %s saying %q, got %v", tc.name, tc.path, tc.says, err)
		}
	}
}
