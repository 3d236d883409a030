package material

import (
	"fmt"
	"math"
	"testing"

	"raytable/optics/internal/approx"
)

// edlenStandardAir is B. Edlén's formula for standard air, Metrologia 2, 71 (1966), from memory:
// (n − 1)·10⁸ = 8342.13 + 2406030/(130 − σ²) + 15997/(38.9 − σ²). It is the independent check of
// Ciddor's coefficients (also from memory): the two agree to a few 1e-8 across the visible and
// near infrared (Ciddor 1996 compares them; his standard air holds 450 ppm CO₂, Edlén's 300).
func edlenStandardAir(wavelengthNM float64) float64 {
	s2 := math.Pow(1000/wavelengthNM, 2)
	return 1 + (8342.13+2406030/(130-s2)+15997/(38.9-s2))*1e-8
}

func TestStandardAirIndex(t *testing.T) {
	const tolEdlen = 3e-8 // the CO₂ difference and the refits between the two formulas
	for _, wl := range []float64{350, 404.7, 486.1327, 589.29, 632.8, 1064, 1550} {
		t.Run(fmt.Sprint(wl), func(t *testing.T) {
			if got, want := StandardAirIndex(wl), edlenStandardAir(wl); !approx.Abs(got, want, tolEdlen) {
				t.Errorf("n_air = %.9f, Edlén %.9f", got, want)
			}
		})
	}
	// The well-known n_air − 1 ≈ 2.76e-4 at the helium-neon line (common practice, from memory).
	if got := StandardAirIndex(632.8) - 1; !approx.Abs(got, 2.76e-4, 1e-6) {
		t.Errorf("n_air − 1 at 632.8 nm = %.4g, want 2.76e-4", got)
	}
	for _, wl := range []float64{0, -1, math.NaN(), math.Inf(1)} {
		if got := StandardAirIndex(wl); !math.IsNaN(got) {
			t.Errorf("StandardAirIndex(%v) = %v, want NaN", wl, got)
		}
	}
}
