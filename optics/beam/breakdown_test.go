package beam

import (
	"math"
	"testing"

	"raytable/optics"
)

// TestBeamBreakdown: a beam focused so tightly that its far-field half-angle M²λ/(π·w0)
// (Siegman, Lasers, 1986) exceeds ParaxialLimitRad gets a warning and no numbers, instead of radii
// that overflow to NaN; a moderately focused beam keeps its numbers.
func TestBeamBreakdown(t *testing.T) {
	for _, tt := range []struct {
		name     string
		focalMM  float64
		wantBeam bool
	}{
		// w = 3 mm at 1064 nm: behind f = 100 mm the waist is λf/(πw) = 11 µm, θ = w/f = 0.03 rad.
		{"f 100 mm", 100, true},
		// Behind f = 0.001 mm the waist would be 0.1 nm and θ = w/f = 3000 rad: not a beam.
		{"f 0.001 mm", 0.001, false},
	} {
		t.Run(tt.name, func(t *testing.T) {
			b := &optics.Bench{
				WavelengthsNM: []float64{1064},
				Source:        optics.Source{Beam: &optics.Beam{WaistRadiusMM: 3}},
				Elements: []optics.Element{
					{ID: "F", Type: optics.TypeThinLens, GapMM: 10, FocalMM: &tt.focalMM},
					{ID: "D", Type: optics.TypeDump, GapMM: 200},
				},
			}
			p := optics.BuildPath(b)
			rep, warns := Propagate(b, p)
			if got := rep != nil; got != tt.wantBeam {
				t.Fatalf("beam report present = %v, want %v (warnings %v)", got, tt.wantBeam, warns)
			}
			if tt.wantBeam {
				for _, e := range rep.Elements {
					if math.IsNaN(e.WTMM) || math.IsInf(e.WTMM, 0) {
						t.Errorf("%s: w_t %g", e.ID, e.WTMM)
					}
				}
				return
			}
			if len(warns) != 1 || warns[0].Code != CodeNotParaxial || warns[0].Element != "F" {
				t.Errorf("warnings %+v, want one %s at F", warns, CodeNotParaxial)
			}
		})
	}
}
