package analysis

import (
	"strings"
	"testing"

	"raytable/optics"
)

// TestWarningsFire builds a bench for each warning that analysis raises itself and checks that it
// fires with the element and the numbers in its message.
func TestWarningsFire(t *testing.T) {
	const head = `{"format":"raytable/bench/v1","wavelengths_nm":[WL],
 "table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
 "source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":5},`
	tests := []struct {
		name, bench string
		code        optics.WarningCode
		element     string
		inMessage   []string
	}{
		{
			// A 10 mm wide bundle on a 4 mm wide screen: rays land up to 5 mm from its centre.
			"screen overfilled",
			strings.Replace(head, "WL", "632.8", 1) + `"elements":[{"id":"CAM","type":"screen","gap_mm":50,"width_mm":4}]}`,
			"screen-overfilled", "CAM", []string{"CAM", "4 mm width", "5 mm"},
		},
		{
			// Malitson's fused-silica fit covers 210-3710 nm (Malitson 1965); 5000 nm is outside.
			"index model outside its range",
			strings.Replace(head, "WL", "5000", 1) + `"elements":[{"id":"W","type":"lens","gap_mm":10,"faces_mm":[null,null],"thicknesses_mm":[3],"materials":["fused-silica"]},{"id":"D","type":"dump","gap_mm":10}]}`,
			"outside-fit-range", "W", []string{"fused-silica", "5000 nm", "210-3710 nm"},
		},
		{
			// A 4 mm iris in a 10 mm bundle cuts the outer rays of the 21-ray fan.
			"rays clipped",
			strings.Replace(head, "WL", "632.8", 1) + `"elements":[{"id":"IRIS","type":"aperture","gap_mm":10,"diameter_mm":4},{"id":"D","type":"dump","gap_mm":10}]}`,
			"rays-clipped", "IRIS", []string{"of 21 traced rays", "4 mm clear aperture of IRIS"},
		},
		{
			// The nd/vd model of a dense flint errs by about 1.8e-3 at 450 nm (measured against a
			// Sellmeier fit in material.TestGlassCodeAccuracy), beyond the 1e-3 of a poor model.
			"glass code poor",
			strings.Replace(head, "WL", "450", 1) + `"elements":[{"id":"W","type":"lens","gap_mm":10,"faces_mm":[null,null],"thicknesses_mm":[3],"materials":["code:785257"]},{"id":"D","type":"dump","gap_mm":10}]}`,
			"glass-code-poor", "W", []string{"code:785257 at 450 nm", "below 470 nm", "give a Sellmeier fit"},
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			r := mustRun(t, tt.bench)
			for _, w := range r.Warnings {
				if w.Code.Meaning() == "" {
					t.Errorf("warning code %q is not in optics.WarningCodes", w.Code)
				}
				if w.Code != tt.code {
					continue
				}
				if w.Element != tt.element {
					t.Errorf("%s names %q, want %q", tt.code, w.Element, tt.element)
				}
				for _, s := range tt.inMessage {
					if !strings.Contains(w.Message, s) {
						t.Errorf("message %q lacks %q", w.Message, s)
					}
				}
				return
			}
			t.Errorf("no %s warning; got %+v", tt.code, r.Warnings)
		})
	}
}
