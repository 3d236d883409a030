package analysis

import (
	"math"
	"testing"

	"raytable/optics"
)

// TestCouplingInAReflectedArm: a fibre behind a 4 % pick-off gets its coupling from the reflected
// arm's own beam. A thin lens of focal length f focusing a collimated waist w makes a waist
// w' = λf/(π w) at its focus (Kogelnik and Li, Applied Optics 5, 1550, 1966, far-field limit),
// and two waists at the same place couple 4/(w'/w0 + w0/w')² (Kogelnik, from memory).
func TestCouplingInAReflectedArm(t *testing.T) {
	f := func(v float64) *float64 { return &v }
	b := &optics.Bench{
		Format: optics.FormatBenchV1, WavelengthsNM: []float64{1064},
		Table: optics.Table{Grid: optics.GridMetric25, WidthMM: 600, DepthMM: 400, BeamHeightMM: 75},
		Source: optics.Source{XMM: 50, YMM: 100, Kind: optics.SourceCollimated, SemiDiameterMM: f(1),
			Beam: &optics.Beam{WaistRadiusMM: 1}},
		Elements: []optics.Element{
			{ID: "PO", Type: optics.TypeSplitter, GapMM: 100, TurnDeg: f(90), Reflect: f(0.04), DiameterMM: f(25.4),
				Reflected: []optics.Element{
					{ID: "FL", Type: optics.TypeThinLens, GapMM: 50, FocalMM: f(20), DiameterMM: f(12.7)},
					{ID: "FC", Type: optics.TypeFiber, GapMM: 20, MFDUM: f(6.2)},
				}},
			{ID: "D", Type: optics.TypeDump, GapMM: 200},
		},
	}
	r, err := Run(b)
	if err != nil {
		t.Fatal(err)
	}
	if len(r.Coupling) != 1 || r.Coupling[0].Element != "FC" {
		t.Fatalf("coupling %+v, want one row for FC", r.Coupling)
	}
	// The source waist sits 170 mm before the lens, far inside its Rayleigh range (2.95 m), so
	// the focus is within 0.05 % of the far-field waist: allow 1e-3 in the efficiency.
	wFocus := 1064e-6 * 20 / (math.Pi * 1)
	w0 := 6.2e-3 / 2
	x := wFocus/w0 + w0/wFocus
	want := 4 / (x * x)
	if got := r.Coupling[0].Efficiency; math.Abs(got-want) > 1e-3 {
		t.Errorf("coupling %.5f, want %.5f (Kogelnik)", got, want)
	}
}
