package material

import (
	"testing"

	"raytable/optics/internal/approx"
)

// Water is air-relative like every other medium (README 'Media'): its fit, relative to vacuum, is
// divided by the index of standard air. Checked against the best-known values of all: water at
// 20 °C relative to air, n_D = 1.33299 at the sodium D line (589.29 nm), nF = 1.33712, nC = 1.33115
// and vd ≈ 55.7 (CRC Handbook of Chemistry and Physics, from memory), usually quoted as 1.333.
func TestWaterIsAirRelative(t *testing.T) {
	const (
		sodiumDNM   = 589.29
		tolHandbook = 2e-5 // quoted to 5 decimals, plus the 5e-6 between 15 °C and 20 °C air
	)
	water, _ := Builtin(Water)
	tests := []struct {
		line               string
		wavelengthNM, want float64
	}{
		{"D", sodiumDNM, 1.33299},
		{"F", FLineNM, 1.33712},
		{"C", CLineNM, 1.33115},
	}
	for _, tc := range tests {
		if got := water.Index(tc.wavelengthNM); !approx.Abs(got, tc.want, tolHandbook) {
			t.Errorf("water n%s = %.6f, want %.5f ± %g (handbook, from memory)", tc.line, got, tc.want, tolHandbook)
		}
	}
	if got := AbbeNumber(water); !approx.Abs(got, 55.7, 2*tolAbbe) {
		t.Errorf("water vd = %.2f, want 55.7 ± %g (handbook, from memory)", got, 2*tolAbbe)
	}
	// The fit itself is relative to vacuum: it exceeds the air-relative value by n_air − 1 ≈ 2.77e-4
	// in the visible (Ciddor 1996), far beyond the handbook tolerance.
	fit := water.(OverAir).Vacuum
	if got := fit.Index(sodiumDNM) - water.Index(sodiumDNM)*StandardAirIndex(sodiumDNM); !approx.Abs(got, 0, approx.Rounding) {
		t.Errorf("fit − air-relative · n_air = %.3g, want 0", got)
	}
	if got := fit.Index(sodiumDNM); approx.Abs(got, 1.33299, tolHandbook) {
		t.Errorf("the vacuum fit alone gives %.6f, which should differ from the air-relative 1.33299", got)
	}
}
