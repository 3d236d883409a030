package optics

// The rules of fibre sources, fibres, mode targets, cylindrical lenses and a beam's vertical
// plane (README, "Fibres, mode targets and cylindrical lenses").

// fiberSource checks a fibre source: its mode, an optional cone NA, and no beam of its own (the
// mode is the beam).
func (v *checker) fiberSource(path string, s *Source) {
	if s.MFDUM != nil && v.modeDiameter(field(path, "mfd_um"), *s.MFDUM) && s.NA == nil && v.wavelengthsValid() {
		if na := s.ConeNA(v.b.PrimaryWavelengthNM()); na >= 1 {
			v.add(field(path, "mfd_um"), "a mode field diameter of %s µm diverges beyond NA 1 at %s nm; give na or a larger mode",
				fmtNum(*s.MFDUM), fmtNum(v.b.PrimaryWavelengthNM()))
		}
	}
	if s.NA != nil && v.finite(field(path, "na"), *s.NA) && (*s.NA <= 0 || *s.NA >= 1) {
		v.add(field(path, "na"), "numerical aperture %s must lie strictly between 0 and 1", fmtNum(*s.NA))
	}
	if s.Beam != nil {
		v.add(field(path, "beam"), "a fibre source's beam is its mode, set by mfd_um; remove beam")
	}
}

// modeDiameter checks a mode field diameter in µm: finite, above 0 and at most MaxLengthMM.
func (v *checker) modeDiameter(path string, um float64) bool {
	if !v.finite(path, um) {
		return false
	}
	if um <= 0 || um/1000 > MaxLengthMM {
		v.add(path, "a mode field diameter must be greater than 0 µm and at most %s mm, got %s µm", fmtNum(MaxLengthMM), fmtNum(um))
		return false
	}
	return true
}

// fiber checks a fibre element's mode and clear diameter.
func (v *checker) fiber(p string, e *Element, _ bool) {
	if e.MFDUM != nil {
		v.modeDiameter(field(p, "mfd_um"), *e.MFDUM)
	}
}

// modeTarget checks a mode target's waists.
func (v *checker) modeTarget(p string, e *Element, _ bool) {
	if e.WaistRadiusMM != nil {
		v.positive(field(p, "waist_radius_mm"), *e.WaistRadiusMM)
	}
	if e.WaistAtMM != nil {
		v.length(field(p, "waist_at_mm"), *e.WaistAtMM)
	}
	if e.Sagittal != nil {
		v.beamPlane(field(p, "sagittal"), e.Sagittal)
		if e.Sagittal.M2 != nil {
			v.add(field(p, "sagittal.m2"), "a mode target is an ideal Gaussian mode; remove m2")
		}
	}
}

// beamPlane checks one plane's waist: a beam's or a mode target's vertical plane.
func (v *checker) beamPlane(p string, bp *BeamPlane) {
	v.positive(field(p, "waist_radius_mm"), bp.WaistRadiusMM)
	v.length(field(p, "waist_at_mm"), bp.WaistAtMM)
	v.beamQuality(field(p, "m2"), bp.M2)
}

// beamQuality checks an optional M²: at least 1 and at most MaxM2.
func (v *checker) beamQuality(p string, m2 *float64) {
	switch {
	case m2 == nil || !v.finite(p, *m2):
	case *m2 < 1:
		v.add(p, "M² is at least 1 for any real beam, got %s", fmtNum(*m2))
	case *m2 > MaxM2:
		v.add(p, "M² of %s is beyond %s, where a Gaussian beam model no longer describes the light", fmtNum(*m2), fmtNum(MaxM2))
	}
}

// cylinder checks a lens's cylinder axis.
func (v *checker) cylinder(p string, e *Element) {
	switch e.CylinderAxis {
	case "", CylinderVertical, CylinderHorizontal:
	default:
		v.add(field(p, "cylinder_axis"), "must be %s, got %q", quotedList([]string{CylinderVertical, CylinderHorizontal}), e.CylinderAxis)
	}
}
