package view

import (
	"math"
	"testing"

	"raytable/optics"
	"raytable/web/diagram"
)

// Round steps of 1, 2 and 5 times a power of ten: common practice for scale factors.
func TestRoundDown125(t *testing.T) {
	for _, tc := range []struct{ in, want float64 }{
		{math.NaN(), 1}, {-3, 1}, {0.3, 1}, {1, 1}, {1.9, 1}, {2, 2}, {4.99, 2}, {5, 5}, {9.9, 5},
		{10, 10}, {19, 10}, {37, 20}, {64, 50}, {499, 200}, {500, 500},
	} {
		if got := roundDown125(tc.in); got != tc.want {
			t.Errorf("roundDown125(%v) = %v, want %v", tc.in, got, tc.want)
		}
	}
}

func TestAutoExaggeration(t *testing.T) {
	o := PageDrawing.Side(&optics.Report{})
	if o.Exaggeration != 1 {
		t.Errorf("an empty bench is stretched %v times, want 1", o.Exaggeration)
	}
	// A metre of path and a 1 mm beam: long and thin, so it must be stretched, in a round step
	// and no more than the cap.
	semi := 1.0
	thin := &optics.Report{Elements: []optics.ElementPlace{
		{ID: "L1", PathMM: 0, SemiDiameterMM: &semi, MaxExactYMM: 0.5},
		{ID: "S", PathMM: 1000, SemiDiameterMM: &semi, MaxExactYMM: 0.5},
	}}
	so := diagram.SideOptions{WidthPX: pageSideWidthPX, HeightPX: pageSideHeightPX}
	e := AutoExaggeration(thin, so)
	if !(e > 1) || e > maxExaggeration || roundDown125(e) != e {
		t.Errorf("thin bench: exaggeration %v, want a 1-2-5 step in (1, %v]", e, float64(maxExaggeration))
	}
	// Self-consistency: the stretched heights (with the 1.2 headroom) fit the plot height.
	so.Exaggeration = e
	plotPX := diagram.SidePlotHeightPX(so)
	if used := 2 * 1.2 * semi * e / diagram.SideMMPerPX(thin, so); used > plotPX {
		t.Errorf("stretched heights take %.1f px of a %.0f px plot", used, plotPX)
	}
	// Heights comparable to the length need no stretching.
	tall := 400.0
	thick := &optics.Report{Elements: []optics.ElementPlace{{ID: "L1", SemiDiameterMM: &tall}, {ID: "S", PathMM: 1000, SemiDiameterMM: &tall}}}
	if e := AutoExaggeration(thick, so); e != 1 {
		t.Errorf("tall bench: exaggeration %v, want 1", e)
	}
}
