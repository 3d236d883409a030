package analysis

import (
	"fmt"
	"math"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// expanderBench is a Keplerian expander of thin lenses f1 = 50 mm and f2 = 150 mm, gap g between
// them, a HeNe beam of waist 0.5 mm at the source, in the first lens's front focal plane (so the
// internal waist lies in its back focal plane), and a screen 500 mm after the second.
func expanderBench(gapMM float64) string {
	return spacingBench(`"kind":"collimated","semi_diameter_mm":0.5,"beam":{"waist_radius_mm":0.5}`,
		fmt.Sprintf(`{"id":"L1","type":"thin-lens","gap_mm":50,"focal_mm":50},
			{"id":"L2","type":"thin-lens","gap_mm":%.2f,"focal_mm":150},
			{"id":"CAM","type":"screen","gap_mm":500}`, gapMM))
}

// TestSpacingBeamExpanderContinuous sweeps the expander's lens gap across collimation (f1 + f2 =
// 200 mm) in 0.01 mm steps. With the beam, L2's tolerance must change smoothly: the output waist
// and its Rayleigh range are smooth functions of the gap (the q law has no pole at collimation,
// Kogelnik and Li 1966). At collimation it is the Rayleigh range of the internal focus,
// zR' = π w'²/λ with w' = λ f1/(π w0): the output waist sits z' = f2²·z/(z² + zR'²) past L2's
// back focal point for an internal waist z past its front focal point (S. A. Self, Applied Optics
// 22, 658, 1983), so dz'/dz = f2²/zR'² and zR,out = f2²/zR' at z = 0, their ratio zR'. Holding
// the internal focus within its own Rayleigh range of the second lens's focal point is common
// practice for an expander.
func TestSpacingBeamExpanderContinuous(t *testing.T) {
	const f1, w0 = 50.0, 0.5
	wInt := lambdaHeNeMM * f1 / (math.Pi * w0)
	zRInt := math.Pi * wInt * wInt / lambdaHeNeMM
	// The sweep stays within ±0.5 mm of collimation, a quarter of zR' (about 2 mm), where
	// tol(z) = zR'(z² + zR'²)/(zR'² - z²) (the two expressions above) grows by about 14 % at
	// the ends; its slope 4·zR'³·z/(zR'² - z²)² is at most 1.1 per mm there, so one 0.01 mm step
	// changes it by under 0.6 %. The geometric tolerance jumped from under a millimetre to
	// "does not matter" at collimation.
	const stepJump = 0.008
	var prev float64
	for k := -50; k <= 50; k++ {
		g := 200 + 0.01*float64(k)
		r := mustRun(t, expanderBench(g))
		if r.SpacingBasis.Kind != optics.SpacingBeamRayleigh {
			t.Fatalf("gap %.2f: basis %s, want beam-rayleigh", g, r.SpacingBasis.Kind)
		}
		tol := rowOf(t, r, "L2").ToleranceMM
		if tol == nil {
			t.Fatalf("gap %.2f: L2 tolerance null: the gap always matters to the beam", g)
		}
		if k == 0 {
			approx.CheckPtr(t, "L2 tolerance at collimation", tol, zRInt, 1e-3)
		}
		if k > -50 && math.Abs(*tol-prev) > stepJump*prev {
			t.Errorf("gap %.2f: L2 tolerance jumps from %g to %g mm in one 0.01 mm step", g, prev, *tol)
		}
		prev = *tol
	}
}

// TestSpacingWithoutBeamIsGeometric: the same expander without a beam keeps the geometric basis
// (README, Report, spacing), the depth of focus or diffraction angle of the ray bundle.
func TestSpacingWithoutBeamIsGeometric(t *testing.T) {
	bench := spacingBench(`"kind":"collimated","semi_diameter_mm":0.5`,
		`{"id":"L1","type":"thin-lens","gap_mm":50,"focal_mm":50},
		 {"id":"L2","type":"thin-lens","gap_mm":200,"focal_mm":150},
		 {"id":"CAM","type":"screen","gap_mm":500}`)
	r := mustRun(t, bench)
	if r.SpacingBasis.Kind != optics.SpacingDiffractionAngle || r.SpacingBasis.RayleighMM != nil {
		t.Errorf("basis %+v, want diffraction-angle without rayleigh_mm", r.SpacingBasis)
	}
	if w := rowOf(t, r, "L2").WaistShiftPerMM; w != nil {
		t.Errorf("waist_shift_per_mm %g without a beam", *w)
	}
}
