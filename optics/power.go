package optics

// Coatings of a refracting face (README "Power").
const (
	CoatingAR   = "ar"       // an anti-reflection coating: ARFaceReflectance per face
	CoatingNone = "uncoated" // bare glass: the Fresnel reflectance at normal incidence
)

// ARFaceReflectance is the reflectance per face of an anti-reflection coated face when the bench
// does not state one: 0.25 %, common practice for a broadband or V-coat on a lens.
const ARFaceReflectance = 0.0025

// DefaultMirrorReflectance is a mirror's reflectance when the bench does not state one: 99 %,
// common practice for a dielectric laser mirror. The rest leaks through as a stray beam.
const DefaultMirrorReflectance = 0.99

// DamageWarnShare is the share of an element's damage threshold at which the beam's peak draws a
// warning (common practice: keep a factor of two below the threshold).
const DamageWarnShare = 0.5

// FresnelNormal is the reflectance of the boundary between media of index n1 and n2 at normal
// incidence, ((n1 - n2)/(n1 + n2))² (Fresnel; any optics text).
func FresnelNormal(n1, n2 float64) float64 {
	r := (n1 - n2) / (n1 + n2)
	return r * r
}

// FaceReflectanceAt is the fraction one refracting face of element e reflects between media of
// index n1 and n2: a stated face_reflectance, the Fresnel reflectance of an uncoated face, or the
// AR default.
func (e *Element) FaceReflectanceAt(n1, n2 float64) float64 {
	switch {
	case e.FaceReflectance != nil:
		return *e.FaceReflectance
	case e.Coating == CoatingNone:
		return FresnelNormal(n1, n2)
	}
	return ARFaceReflectance
}

// MirrorReflectance is the fraction a mirror reflects.
func (e *Element) MirrorReflectance() float64 {
	if e.Reflectance != nil {
		return *e.Reflectance
	}
	return DefaultMirrorReflectance
}

// SourcePower is what a source emits, in mW: AverageMW the mean power, PeakMW the power during a
// pulse (equal to AverageMW for a steady laser) and PulseMJ the energy of one pulse (0 for a steady
// laser). ok is false when the source gives neither power_mw nor pulse.
//
// A pulse's peak power is taken as energy / duration: a flat-top pulse in time, an approximation
// (a Gaussian pulse's true peak is about 0.94 times that over its full width at half maximum).
func (s *Source) SourcePower() (averageMW, peakMW, pulseMJ float64, ok bool) {
	switch {
	case s.PowerMW != nil:
		return *s.PowerMW, *s.PowerMW, 0, true
	case s.Pulse != nil:
		p := s.Pulse
		e := p.EnergyUJ * 1e-3 // mJ
		return e * p.RateHz, e / (p.DurationNS * 1e-9), e, true
	}
	return 0, 0, 0, false
}

// ReflectedShare is the fraction a splitter sends to its reflected port at a wavelength: its
// reflect fraction, or for a dichroic all or nothing by the side of the edge.
func (e *Element) ReflectedShare(wavelengthNM float64) float64 {
	if d := e.Dichroic; d != nil {
		if (d.Reflects == ReflectsShorter) == (wavelengthNM < d.EdgeNM) {
			return 1
		}
		return 0
	}
	if e.Reflect != nil {
		return *e.Reflect
	}
	return DefaultReflect
}
