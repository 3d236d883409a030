package analysis

import (
	"slices"
	"testing"

	"raytable/optics"
)

// A dump in mid-path ends the light (README, element type dump): a lens focuses a HeNe beam, a
// dump stands 50 mm after it, and a second lens and a screen follow. Rays stop at the dump, the
// beam's rows and envelope end there, the focus 100 mm behind the first lens (past the dump) is
// not listed, and both elements after it are warned after-dump naming the dump (the definition).
func TestMidPathDumpStopsEverything(t *testing.T) {
	r := mustRun(t, spacingBench(`"kind":"collimated","semi_diameter_mm":1,"fan_rays":5,"beam":{"waist_radius_mm":0.5}`,
		`{"id":"L1","type":"thin-lens","gap_mm":100,"focal_mm":100},
		 {"id":"D1","type":"dump","gap_mm":50},
		 {"id":"L2","type":"thin-lens","gap_mm":100,"focal_mm":50},
		 {"id":"CAM","type":"screen","gap_mm":100}`))
	const dumpAtMM = 150.0
	for _, ray := range r.Rays {
		if last := ray.Hits[len(ray.Hits)-1]; last.Element != "D1" {
			t.Errorf("ray %s ends at %s, want D1", ray.Name, last.Element)
		}
	}
	var rows []string
	for _, e := range r.Beam.Elements {
		rows = append(rows, e.ID)
	}
	if !slices.Equal(rows, []string{"L1", "D1"}) {
		t.Errorf("beam rows %v, want L1, D1", rows)
	}
	for _, s := range r.Beam.Samples {
		if s.PathMM > dumpAtMM {
			t.Fatalf("beam sample at %g mm, past the dump at %g mm", s.PathMM, dumpAtMM)
		}
	}
	if end := r.Beam.Samples[len(r.Beam.Samples)-1].PathMM; end != dumpAtMM {
		t.Errorf("envelope ends at %g mm, want the dump at %g mm", end, dumpAtMM)
	}
	for _, w := range r.Beam.Waists {
		if w.PathMM > dumpAtMM {
			t.Errorf("waist at %g mm listed past the dump", w.PathMM)
		}
	}
	var after []string
	for _, w := range r.Warnings {
		if w.Code == optics.WarnAfterDump {
			after = append(after, w.Element)
			if !slices.Equal(w.Others, []string{"D1"}) {
				t.Errorf("%s: others %v, want [D1]", w.Element, w.Others)
			}
		}
	}
	if !slices.Equal(after, []string{"L2", "CAM"}) {
		t.Errorf("after-dump warnings on %v, want L2, CAM", after)
	}
}
