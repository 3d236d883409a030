package analysis

import (
	"math"
	"os"
	"testing"

	"raytable/optics"
)

// TestParaxialMatchesExactAtSmallAperture runs one table of benches through both traces. At a
// small aperture the exact trace must land where the paraxial one does at every face (the
// paraxial trace is the first-order limit of Snell's law); the difference shrinks as h³ for
// spherical faces, so at h = 1 µm it is far below 1e-9 mm. Mirrors, folds, thick lenses and
// both source kinds are in the table, so sign conventions must agree across all of them.
func TestParaxialMatchesExactAtSmallAperture(t *testing.T) {
	demo, err := os.ReadFile("../../testdata/demo-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name  string
		bench string
		edit  func(b *optics.Bench)
	}{
		{"demo bench", string(demo), func(b *optics.Bench) {
			b.Elements[1].DiameterMM = nil // the pinhole would cut the off-axis fan
		}},
		{"concave mirror at 180", mirror("180"), nil},
		{"tilted concave mirror", mirror("120"), nil},
		{"point source through a doublet and a folded mirror", `{"format":"raytable/bench/v1","wavelengths_nm":[486.1327, 656.2725],
 "table":{"grid":"none","width_mm":900,"depth_mm":600,"beam_height_mm":75},
 "source":{"x_mm":50,"y_mm":300,"heading_deg":0,"kind":"point","na":0.05,"object_heights_mm":[0, 2]},
 "materials":{"crown":{"nd":1.5168,"vd":64.17},"flint":{"nd":1.6727,"vd":32.21}},
 "elements":[
  {"id":"D1","type":"lens","gap_mm":150,"faces_mm":[61.5,-44.2,-129.0],"thicknesses_mm":[6,2.5],"materials":["crown","flint"],"diameter_mm":25.4},
  {"id":"FM","type":"mirror","gap_mm":80,"radius_mm":-500,"turn_deg":-70,"diameter_mm":25.4},
  {"id":"S","type":"screen","gap_mm":120}]}`, nil},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			// The paraxial trace is the first-order limit of the exact one: the discrepancy,
			// relative to the ray heights and slopes themselves, must vanish as the aperture
			// shrinks (by at least a factor 5 per decade here; spherical faces give h², a tilted
			// mirror's coma h), unless it is already at rounding level.
			coarse := discrepancy(t, tt.bench, tt.edit, 1e-3)
			fine := discrepancy(t, tt.bench, tt.edit, 1e-4)
			t.Logf("relative discrepancy %.3g at h = 1e-3, %.3g at h = 1e-4", coarse, fine)
			const rounding = 1e-9
			if fine > 1e-3 {
				t.Errorf("relative discrepancy %.3g at h = 1e-4, want < 1e-3", fine)
			}
			if fine > rounding && coarse/fine < 5 {
				t.Errorf("discrepancy does not shrink with the aperture: %.3g at 1e-3, %.3g at 1e-4", coarse, fine)
			}
		})
	}
}

// discrepancy runs the bench with its source shrunk by h and returns the largest difference
// between exact and paraxial heights and slopes at any face, relative to the largest paraxial
// height and slope. The exact hit lies on the real surface; it is carried back along its leaving
// direction to the vertex plane, where the paraxial value is given.
func discrepancy(t *testing.T, bench string, edit func(*optics.Bench), h float64) float64 {
	t.Helper()
	b, err := optics.Decode([]byte(bench))
	if err != nil {
		t.Fatal(err)
	}
	if edit != nil {
		edit(b)
	}
	shrinkSource(b, h)
	r, err := Run(b)
	if err != nil {
		t.Fatal(err)
	}
	var maxY, maxU, dY, dU float64
	var compared int
	for _, ray := range r.Rays {
		for _, hit := range ray.Hits {
			slope := hit.Exact.Dir[1] / hit.Exact.Dir[2]
			yVertex := hit.Exact.YMM - hit.Exact.ZMM*slope
			maxY = math.Max(maxY, math.Abs(hit.Paraxial.YMM))
			maxU = math.Max(maxU, math.Abs(hit.Paraxial.URad))
			dY = math.Max(dY, math.Abs(yVertex-hit.Paraxial.YMM))
			dU = math.Max(dU, math.Abs(slope-hit.Paraxial.URad))
			compared++
		}
	}
	if compared < 20 || maxY == 0 || maxU == 0 {
		t.Fatalf("only %d hits compared (largest height %g, slope %g)", compared, maxY, maxU)
	}
	return math.Max(dY/maxY, dU/maxU)
}

// shrinkSource scales every ray the source emits to a small aperture and field.
func shrinkSource(b *optics.Bench, h float64) {
	s := &b.Source
	if s.SemiDiameterMM != nil {
		*s.SemiDiameterMM = h
	}
	if s.NA != nil {
		*s.NA = h
	}
	for i := range s.FieldAnglesDeg {
		s.FieldAnglesDeg[i] *= h
	}
	for i := range s.ObjectHeightsMM {
		s.ObjectHeightsMM[i] *= h
	}
	for i := range s.Rays {
		s.Rays[i].HeightMM *= h
		s.Rays[i].AngleDeg *= h
	}
}
