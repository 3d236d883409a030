package analysis

import (
	"fmt"
	"math"
	"testing"

	"raytable/optics"
)

// hitAt is the exact height at which a ray crosses the element, and whether it reached it.
func hitAt(ray optics.Ray, id string) (float64, bool) {
	for _, h := range ray.Hits {
		if h.Element == id {
			return h.Exact.YMM, true
		}
	}
	return 0, false
}

// TestHighNAStopAgreesWithExactCone: a point source of NA 0.4 with an iris 100 mm away. The exact
// cone's edge leaves at asin(0.4) and meets the iris at 100·tan(asin 0.4) = 43.64 mm (geometry,
// from memory); the paraxial ray of slope 0.4 would meet it at 40 mm. An iris of 42 mm radius
// clips the exact cone, so it must be the aperture stop; one of 45 mm clips nothing and the
// source stays the stop (README, Report: the stop search uses the exact cone's slope).
func TestHighNAStopAgreesWithExactCone(t *testing.T) {
	for _, tc := range []struct {
		radiusMM float64
		stop     string
		clipped  bool
	}{{42, "A1", true}, {45, "source", false}} {
		t.Run(fmt.Sprintf("r%g", tc.radiusMM), func(t *testing.T) {
			r := mustRun(t, spacingBench(`"kind":"point","na":0.4,"object_heights_mm":[0],"fan_rays":11`,
				fmt.Sprintf(`{"id":"A1","type":"aperture","gap_mm":100,"diameter_mm":%g},
				 {"id":"L","type":"thin-lens","gap_mm":20,"focal_mm":100,"diameter_mm":200},
				 {"id":"CAM","type":"screen","gap_mm":200}`, 2*tc.radiusMM)))
			if r.System.ApertureStop != tc.stop {
				t.Errorf("aperture stop %s, want %s", r.System.ApertureStop, tc.stop)
			}
			clipped := false
			for _, ray := range r.Rays {
				clipped = clipped || (ray.Status == optics.RayClipped && ray.StoppedAt == "A1")
			}
			if clipped != tc.clipped {
				t.Errorf("exact rays clipped at A1: %v, want %v", clipped, tc.clipped)
			}
		})
	}
}

// TestOffAxisFansAimThroughStop: an iris of 4 mm diameter 50 mm after the source is the stop of a
// collimated bundle of radius 5 mm; a thin lens 50 mm further focuses it. The 2° fan is centred
// on the chief ray, which starts at -50·tan 2° so as to cross the iris at its centre (the chief
// ray's definition, common practice): its middle ray crosses the iris at 0, and the iris clips
// the fan symmetrically, 6 rays on each side of 21 (pupil spacing 0.5 mm, passing |y| ≤ 2 mm).
// A point source's off-axis fan is aimed the same way.
func TestOffAxisFansAimThroughStop(t *testing.T) {
	const elements = `{"id":"A1","type":"aperture","gap_mm":50,"diameter_mm":4},
		 {"id":"L","type":"thin-lens","gap_mm":50,"focal_mm":100,"diameter_mm":50},
		 {"id":"CAM","type":"screen","gap_mm":100}`
	for _, tc := range []struct{ name, source, field string }{
		{"collimated", `"kind":"collimated","semi_diameter_mm":5,"field_angles_deg":[0,2]`, "2 deg"},
		{"point", `"kind":"point","na":0.1,"object_heights_mm":[0,1]`, "1 mm"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			r := mustRun(t, spacingBench(tc.source, elements))
			if r.System.ApertureStop != "A1" {
				t.Fatalf("aperture stop %s, want A1", r.System.ApertureStop)
			}
			above, below, middle := 0, 0, false
			for _, ray := range r.Rays {
				if ray.Field != tc.field {
					continue
				}
				if ray.Pupil == 0 {
					middle = true
					if y, ok := hitAt(ray, "A1"); !ok || math.Abs(y) > 1e-9 {
						t.Errorf("middle ray crosses A1 at %g mm (reached %v), want 0", y, ok)
					}
				}
				if ray.Status == optics.RayClipped {
					if ray.Pupil > 0 {
						above++
					} else {
						below++
					}
				}
			}
			if !middle {
				t.Fatal("no middle ray in the off-axis fan")
			}
			if above != below || (tc.name == "collimated" && above != 6) {
				t.Errorf("clipped %d above and %d below, want the same on both sides (6 for the collimated fan)", above, below)
			}
		})
	}
}
