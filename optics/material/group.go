package material

import "math"

// SpeedOfLightMMPerPS is c in millimetres per picosecond (exact by the definition of the metre).
const SpeedOfLightMMPerPS = 0.299792458

// GroupIndex is n_g = n - λ dn/dλ of m at a vacuum wavelength in nm: the factor by which a pulse's
// envelope travels slower than c, so a path L through the medium delays it by n_g L / c.
//
// dn/dλ is taken numerically, so every model (Sellmeier, glass code, constant) gets the same
// treatment: a central difference with step h and with step h/2, combined by Richardson
// extrapolation (error of order h⁴). With h = λ/1000 the result is good to about 1e-10 for the
// smooth dispersion of glass away from its resonances.
func GroupIndex(m Medium, wavelengthNM float64) float64 {
	if m == nil || !validWavelength(wavelengthNM) {
		return math.NaN()
	}
	h := wavelengthNM / 1000
	central := func(h float64) float64 { return (m.Index(wavelengthNM+h) - m.Index(wavelengthNM-h)) / (2 * h) }
	dndl := (4*central(h/2) - central(h)) / 3
	return m.Index(wavelengthNM) - wavelengthNM*dndl
}

// GroupDelayPS is the time in picoseconds a pulse's envelope needs to cross lengthMM of m.
func GroupDelayPS(m Medium, wavelengthNM, lengthMM float64) float64 {
	return GroupIndex(m, wavelengthNM) * lengthMM / SpeedOfLightMMPerPS
}
