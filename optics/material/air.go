package material

import "math"

// StandardAirIndex is the refractive index of standard air (dry, 15 °C, 101 325 Pa, 450 ppm CO₂)
// at a vacuum wavelength, by the dispersion formula of P. E. Ciddor, "Refractive index of air: new
// equations for the visible and near infrared", Appl. Opt. 35, 1566 (1996), eq. (1):
//
//	(n − 1)·10⁸ = k1/(k0 − σ²) + k3/(k2 − σ²),   σ = 1/λ in µm⁻¹
//
// Coefficients from memory; air_test.go checks them against B. Edlén's older formula for standard
// air (Metrologia 2, 71 (1966), also from memory), which agrees to a few 1e-8. Ciddor states it for
// 300-1690 nm; outside, it is extrapolated smoothly (its first resonance lies at 65 nm). NaN for a
// wavelength that is not positive and finite.
func StandardAirIndex(wavelengthNM float64) float64 {
	if !validWavelength(wavelengthNM) {
		return math.NaN()
	}
	const k0, k1, k2, k3 = 238.0185, 5792105, 57.362, 167917
	s2 := sq(1000 / wavelengthNM)
	return 1 + (k1/(k0-s2)+k3/(k2-s2))*1e-8
}

// OverAir is a medium whose published fit gives the index relative to vacuum: Index divides it by
// StandardAirIndex, so that, like every other medium, it is relative to air (README 'Media'). The
// air of a laboratory at 20 °C has n − 1 about 5e-6 below standard air at 15 °C, negligible here.
type OverAir struct {
	Vacuum Sellmeier
}

// Index is the fit's index over that of standard air; NaN where either is undefined.
func (m OverAir) Index(wavelengthNM float64) float64 {
	return m.Vacuum.Index(wavelengthNM) / StandardAirIndex(wavelengthNM)
}

// RangeNM is the fit's range.
func (m OverAir) RangeNM() (loNM, hiNM float64) { return m.Vacuum.RangeNM() }

// Describe names the fit and says it is divided by the index of air.
func (m OverAir) Describe() string {
	return m.Vacuum.Describe() + ", over standard air (Ciddor 1996)"
}
