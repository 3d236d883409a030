package analysis

import (
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// The demo's Gaussian focus lands 0.71 mm beyond the camera, inside its 1.6 mm Rayleigh range, so
// the camera sees the focus; with the camera 5 mm closer to F1's mirror the focus lies 5.71 mm
// behind it, more than the Rayleigh range, and the warning names CAM (values of this bench's own
// report; the rule is README, warning codes).
func TestFocusMissesScreenOnDemo(t *testing.T) {
	cases := []struct {
		name    string
		shiftMM float64
		want    string // "" for no warning
	}{
		{"as built", 0, ""},
		{"camera 5 mm short", -5, "the beam focuses 5.71 mm behind CAM"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			b := benchtest.Load(t, "demo-bench.json")
			cam := &b.Elements[len(b.Elements)-1]
			cam.GapMM += c.shiftMM
			r := RunValid(b)
			var got []string
			for _, w := range r.Warnings {
				if w.Code == optics.WarnFocusMissesScreen {
					got = append(got, w.Message)
				}
			}
			if c.want == "" && len(got) != 0 || c.want != "" && (len(got) != 1 || !strings.HasPrefix(got[0], c.want)) {
				t.Fatalf("want %q, got %q", c.want, got)
			}
		})
	}
}
