package material

import (
	"math"
	"testing"
)

// TestGroupIndexFusedSilica checks n_g = n - λ dn/dλ of the built-in fused silica against values
// computed by hand from the coefficients Malitson published (I. H. Malitson, JOSA 55, 1205,
// 1965), with the analytic derivative of the Sellmeier sum:
// dn/dλ = -(1/n) Σ B_i C_i λ / (λ² - C_i)², λ in µm.
func TestGroupIndexFusedSilica(t *testing.T) {
	m, err := Lookup(FusedSilica)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		wavelengthNM, want float64
	}{
		{800, 1.4671447553515644},   // by hand from Malitson 1965; 1.4671 also from memory
		{1064, 1.462397945966069},   // by hand from Malitson 1965
		{532.8, 1.4852377386526987}, // by hand from Malitson 1965
		{1550, 1.4625964838941496},  // by hand from Malitson 1965; 1.4626 also from memory
	} {
		const tolerance = 1e-9 // the Richardson difference is good to about 1e-10 here
		if got := GroupIndex(m, tc.wavelengthNM); math.Abs(got-tc.want) > tolerance {
			t.Errorf("n_g(%v nm) = %.12f, want %.12f (Malitson 1965, by hand)", tc.wavelengthNM, got, tc.want)
		}
	}
}

// TestGroupDelay checks the delay of a pulse through 10 mm of fused silica at 800 nm:
// τ = n_g L / c = 1.4671447553515644 × 10 mm / 0.299792458 mm/ps = 48.93868 ps (by hand, with
// c exact by the SI definition of the metre).
func TestGroupDelay(t *testing.T) {
	m, _ := Lookup(FusedSilica)
	const want = 1.4671447553515644 * 10 / 0.299792458
	if got := GroupDelayPS(m, 800, 10); math.Abs(got-want) > 1e-8 || math.Abs(want-48.93868) > 1e-5 {
		t.Errorf("group delay %.8f ps, want %.8f ps", got, want)
	}
}

// TestGroupIndexSpecialCases: no dispersion gives n_g = n (definition), and nonsense wavelengths
// give NaN rather than a number.
func TestGroupIndexSpecialCases(t *testing.T) {
	if got := GroupIndex(Constant{N: 1.5}, 633); got != 1.5 {
		t.Errorf("constant medium: n_g = %v, want 1.5", got)
	}
	for _, wl := range []float64{0, -5, math.NaN(), math.Inf(1)} {
		if got := GroupIndex(Constant{N: 1.5}, wl); !math.IsNaN(got) {
			t.Errorf("n_g at %v nm = %v, want NaN", wl, got)
		}
	}
	if got := GroupIndex(nil, 633); !math.IsNaN(got) {
		t.Errorf("nil medium: %v, want NaN", got)
	}
}
