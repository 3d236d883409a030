package analysis

import (
	"testing"

	"raytable/optics"
)

// TestSpacingVirtualImage: a negative thin lens after a collimated bundle forms a virtual image
// f upstream of itself (thin-lens equation, from memory), so no screen downstream can hold a
// focus: the basis is virtual-image, the image shifts are given and no gap has a tolerance
// (README, Report, spacing).
func TestSpacingVirtualImage(t *testing.T) {
	f := func(v float64) *float64 { return &v }
	b := &optics.Bench{
		Format: optics.FormatBenchV1, WavelengthsNM: []float64{632.8},
		Table:  optics.Table{Grid: optics.GridMetric25, WidthMM: 600, DepthMM: 300, BeamHeightMM: 75},
		Source: optics.Source{XMM: 50, YMM: 150, Kind: optics.SourceCollimated, SemiDiameterMM: f(2)},
		Elements: []optics.Element{
			{ID: "N1", Type: optics.TypeThinLens, GapMM: 50, FocalMM: f(-100), DiameterMM: f(25.4)},
			{ID: "S", Type: optics.TypeScreen, GapMM: 100},
		},
	}
	r, err := Run(b)
	if err != nil {
		t.Fatal(err)
	}
	if r.SpacingBasis.Kind != optics.SpacingVirtualImage || r.SpacingBasis.DepthOfFocusMM != nil {
		t.Errorf("basis %+v, want kind %s without a depth of focus", r.SpacingBasis, optics.SpacingVirtualImage)
	}
	if d := r.System.ImageDistanceMM; d == nil || *d != -100 {
		t.Errorf("image distance %v, want -100 mm (the virtual image at f)", d)
	}
	for _, s := range r.Spacing {
		if s.ToleranceMM != nil {
			t.Errorf("%s: tolerance %v, want none for a virtual image", s.ID, *s.ToleranceMM)
		}
	}
}
