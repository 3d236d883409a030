package material

import (
	"fmt"
	"testing"
)

// Dispersion fits of three common catalogue glasses, recalled from memory of the makers' published
// Sellmeier coefficients (a crown nd 1.5168 vd 64.17, a flint nd 1.6200 vd 36.37 and a dense flint
// nd 1.7847 vd 25.68). Each reproduces its well-known nd and vd to 1e-5 and 0.01 (checked in
// TestGlassCodeAccuracy), which a slip in a leading digit would not.
var memoryGlasses = map[string]Sellmeier{
	"crown":       {B: []float64{1.03961212, 0.231792344, 1.01046945}, CUM2: []float64{0.00600069867, 0.0200179144, 103.560653}},
	"flint":       {B: []float64{1.34533359, 0.209073176, 0.937357162}, CUM2: []float64{0.00997743871, 0.0470450767, 111.886764}},
	"dense-flint": {B: []float64{1.73759695, 0.313747346, 1.89878101}, CUM2: []float64{0.013188707, 0.0623068142, 155.23629}},
}

// TestGlassCodeAccuracy keeps the measured error of the nd/vd model honest (README 'Media'): each
// medium is given as a glass code from its own nd and vd (unrounded) and the model's index minus the
// Sellmeier index is checked at wavelengths across 400-1600 nm. Built-in fits: Malitson 1965,
// Malitson 1963, Malitson and Dodge 1972; the glasses: memoryGlasses (from memory). The tolerance
// is 1 % of each value or 1e-6, enough for the three printed digits. Every error above
// GlassCodePoorError inside 400-1000 nm must fall in a zone where Poor warns.
func TestGlassCodeAccuracy(t *testing.T) {
	media := map[string]Medium{}
	for _, name := range []string{FusedSilica, CalciumFluoride, SapphireO} {
		media[name], _ = Builtin(name)
	}
	for name, s := range memoryGlasses {
		media[name] = s
	}
	const relTol, absTol = 0.01, 1e-6
	tests := []struct {
		medium string
		nd, vd float64 // of the Sellmeier fit
		errs   map[float64]float64
	}{
		{FusedSilica, 1.45846, 67.82, map[float64]float64{400: 2.18e-4, 450: 1.25e-4, 500: 4.30e-5, 700: 1.42e-4, 800: 4.24e-4, 1000: 1.33e-3, 1300: 3.39e-3, 1600: 6.17e-3}},
		{CalciumFluoride, 1.43385, 95.00, map[float64]float64{400: 1.55e-5, 450: 2.58e-5, 500: 1.25e-5, 700: 4.02e-5, 800: 1.29e-4, 1000: 4.31e-4, 1300: 1.13e-3, 1600: 2.07e-3}},
		{SapphireO, 1.76817, 72.31, map[float64]float64{400: 3.06e-4, 450: 1.80e-4, 500: 6.26e-5, 700: 2.06e-4, 800: 6.18e-4, 1000: 1.94e-3, 1300: 4.92e-3, 1600: 8.93e-3}},
		{"crown", 1.51680, 64.17, map[float64]float64{400: 9.45e-5, 450: 9.13e-5, 500: 3.91e-5, 700: 1.27e-4, 800: 3.97e-4, 1000: 1.30e-3, 1300: 3.38e-3, 1600: 6.21e-3}},
		{"flint", 1.62004, 36.37, map[float64]float64{400: -2.17e-3, 450: -5.42e-4, 500: -4.56e-5, 700: -1.93e-4, 800: -2.58e-4, 1000: 3.65e-5, 1300: 1.33e-3, 1600: 3.41e-3}},
		{"dense-flint", 1.78472, 25.68, map[float64]float64{400: -7.04e-3, 450: -1.77e-3, 500: -1.79e-4, 700: -7.26e-4, 800: -1.25e-3, 1000: -1.51e-3, 1300: -3.40e-4, 1600: 2.11e-3}},
	}
	for _, tc := range tests {
		t.Run(tc.medium, func(t *testing.T) {
			m := media[tc.medium]
			nd, vd := m.Index(DLineNM), AbbeNumber(m)
			if diff := nd - tc.nd; diff > 1e-5 || diff < -1e-5 {
				t.Errorf("nd = %.6f, want %.5f", nd, tc.nd)
			}
			if diff := vd - tc.vd; diff > 0.01 || diff < -0.01 {
				t.Errorf("vd = %.3f, want %.2f", vd, tc.vd)
			}
			g, err := NewGlassCode(nd, vd)
			if err != nil {
				t.Fatal(err)
			}
			for wl, want := range tc.errs {
				got := g.Index(wl) - m.Index(wl)
				if d := got - want; d > max(relTol*abs(want), absTol) || d < -max(relTol*abs(want), absTol) {
					t.Errorf("at %g nm model − Sellmeier = %.2e, want %.1e", wl, got, want)
				}
			}
			// Poor covers every point inside the model's range where it errs beyond the bound.
			for wl := GlassCodeLoNM; wl <= GlassCodeHiNM; wl += 5 {
				if e := abs(g.Index(wl) - m.Index(wl)); e > GlassCodePoorError && g.Poor(wl) == "" {
					t.Errorf("at %g nm the model errs by %.2e but Poor says nothing", wl, e)
				}
			}
		})
	}
}

// TestGlassCodePoorZones: the zones of Poor at their edges (the rule in glasscode_accuracy.go).
func TestGlassCodePoorZones(t *testing.T) {
	tests := []struct {
		vd, wavelengthNM float64
		poor             bool
	}{
		{36.4, 400, true}, {36.4, 469, true}, {36.4, 470, false}, {40, 420, false}, {64.2, 400, false},
		{25.7, 739, false}, {25.7, 740, true}, {30, 800, false},
		{64.2, 869, false}, {64.2, 870, true}, {95, 1000, true},
		{25.7, 399, false}, {64.2, 1001, false}, // outside the range, which warns on its own
	}
	for _, tc := range tests {
		t.Run(fmt.Sprintf("vd %g at %g nm", tc.vd, tc.wavelengthNM), func(t *testing.T) {
			g, _ := NewGlassCode(1.6, tc.vd)
			if got := g.Poor(tc.wavelengthNM) != ""; got != tc.poor {
				t.Errorf("Poor = %q, want poor %v", g.Poor(tc.wavelengthNM), tc.poor)
			}
		})
	}
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
