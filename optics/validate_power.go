package optics

import "math"

// Limits of the power fields (README "Power"): far beyond any bench laser, so that a slip of units
// is caught rather than carried into the numbers.
const (
	MaxPowerMW     = 1e9 // 1 MW average
	MaxPulseUJ     = 1e9 // 1 kJ
	MaxDamageValue = 1e15
)

// sourcePower checks a source's power_mw or pulse: one of them, each value finite and positive.
func (v *checker) sourcePower(path string, s *Source) {
	if s.PowerMW != nil && s.Pulse != nil {
		v.add(field(path, "pulse"), "give power_mw for a steady laser or pulse for a pulsed one, not both")
	}
	if s.PowerMW != nil {
		v.positiveValue(field(path, "power_mw"), *s.PowerMW, MaxPowerMW, "mW")
	}
	if p := s.Pulse; p != nil {
		pp := field(path, "pulse")
		v.positiveValue(field(pp, "energy_uj"), p.EnergyUJ, MaxPulseUJ, "µJ")
		v.positiveValue(field(pp, "duration_ns"), p.DurationNS, MaxLengthMM, "ns")
		v.positiveValue(field(pp, "rate_hz"), p.RateHz, 1e12, "Hz")
	}
}

// elementPower checks an element's coating, face and mirror reflectances and damage thresholds.
func (v *checker) elementPower(p string, e *Element) {
	if e.Coating != "" && e.Coating != CoatingAR && e.Coating != CoatingNone {
		v.add(field(p, "coating"), "must be %s, got %q", quotedList([]string{CoatingAR, CoatingNone}), e.Coating)
	}
	if e.FaceReflectance != nil {
		v.share(field(p, "face_reflectance"), *e.FaceReflectance, "the reflectance per face")
	}
	if e.Reflectance != nil {
		v.share(field(p, "reflectance"), *e.Reflectance, "the reflectance")
	}
	if e.DamageWCM2 != nil {
		v.positiveValue(field(p, "damage_w_cm2"), *e.DamageWCM2, MaxDamageValue, "W/cm²")
	}
	if e.DamageJCM2 != nil {
		v.positiveValue(field(p, "damage_j_cm2"), *e.DamageJCM2, MaxDamageValue, "J/cm²")
	}
}

// positiveValue checks a number that must be finite, above 0 and at most max, in unit.
func (v *checker) positiveValue(path string, x, max float64, unit string) {
	if !v.finite(path, x) {
		return
	}
	if !(x > 0) || x > max {
		v.add(path, "must be greater than 0 %s and at most %s %s, got %s", unit, fmtNum(max), unit, fmtNum(x))
	}
}

// share checks a fraction from 0 to 1.
func (v *checker) share(path string, x float64, what string) {
	if v.finite(path, x) && (x < 0 || x > 1 || math.Signbit(x)) {
		v.add(path, "%s must lie between 0 and 1, got %s", what, fmtNum(x))
	}
}
