package optics

import "testing"

// The drawings show the beam up to the screen or dump the path ends on and no further; a path
// that ends on another element runs on (README, The web page).
func TestDrawnSamples(t *testing.T) {
	samples := []BeamSample{{PathMM: 0}, {PathMM: 100}, {PathMM: 200}, {PathMM: 220}}
	for _, tc := range []struct {
		last string
		want int
	}{
		{TypeScreen, 3}, {TypeDump, 3}, {TypeAperture, 4}, {TypeMirror, 4},
	} {
		r := &Report{Beam: &BeamReport{Samples: samples}, Elements: []ElementPlace{{ID: "E", Type: tc.last, PathMM: 200}}}
		if got := len(r.DrawnSamples()); got != tc.want {
			t.Errorf("path ending on a %s: %d samples drawn, want %d", tc.last, got, tc.want)
		}
	}
	if (&Report{}).DrawnSamples() != nil {
		t.Error("samples drawn without a beam")
	}
}
