package beam

import (
	"math"
	"math/cmplx"

	"raytable/optics"
)

// OneDBLoss is the fraction of the aligned coupling left after a 1 dB loss, 10^(-0.1) ≈ 0.794.
var OneDBLoss = math.Pow(10, -0.1)

// maxAxialRayleigh bounds the search for an axial 1 dB shift, in Rayleigh ranges of the mode;
// beyond it the shift is reported as none.
const maxAxialRayleigh = 1000.0

// ModeProfile is one plane of a Gaussian mode (M² = 1) at a plane z upstream of its waist
// (waistAtMM = z downstream of the plane), in air: q = -waistAtMM + i zR.
func ModeProfile(waistRadiusMM, waistAtMM, wavelengthNM float64) Profile {
	g := newGaussian(wavelengthNM, 1)
	return profileOf(g, g.sourceQ(waistRadiusMM, waistAtMM))
}

// profileOf is the radius and wavefront curvature of a beam with reduced q in air.
func profileOf(g gaussian, q complex128) Profile {
	r := math.Inf(1)
	if c := curvatureMM(q, 1); c != nil {
		r = *c
	}
	return Profile{RadiusMM: g.radiusMM(q), CurvatureMM: r}
}

// LateralOneDBMM is the lateral offset of the second beam in one plane that alone lowers the
// coupling by 1 dB. From OverlapPlane with a displacement d the coupling falls as
// exp(2 Re(b*²/A - b*) d²), so d = sqrt(ln(1/0.794) / (-2 Re(b*²/A - b*))); for equal waists
// at a common waist plane that is w sqrt(ln(1/0.794)) (Marcuse 1977).
func LateralOneDBMM(one, two Profile, wavelengthNM float64) float64 {
	a, b := exponents(one, two, wavelengthNM)
	bc := cmplx.Conj(b)
	e := real(bc*bc/(a+bc) - bc)
	return math.Sqrt(math.Log(1/OneDBLoss) / (-2 * e))
}

// TiltOneDBRad is the tilt of the second beam in one plane that alone lowers the coupling by
// 1 dB: with B = -i k θ the coupling falls as exp(-2 Re(k²θ²/(4A))), so θ = sqrt(2 ln(1/0.794) /
// (k² Re(1/A))); for equal waists at a common waist plane λ/(π w)·sqrt(ln(1/0.794)) (Marcuse 1977).
func TiltOneDBRad(one, two Profile, wavelengthNM float64) float64 {
	a, b := exponents(one, two, wavelengthNM)
	k := 2 * math.Pi / (wavelengthNM * 1e-6)
	return math.Sqrt(2 * math.Log(1/OneDBLoss) / (k * k * real(1/(a+cmplx.Conj(b)))))
}

func exponents(one, two Profile, wavelengthNM float64) (complex128, complex128) {
	k := 2 * math.Pi / (wavelengthNM * 1e-6)
	return one.exponent(k), two.exponent(k)
}

// AxialOneDBMM is the smallest shift of a target along the axis, either way, that alone lowers
// the coupling of a beam (reduced q per plane at the target's plane, gT and gS its planes) into
// the mode (qMode per plane, M² = 1) by 1 dB: both beams are moved by the same distance and the
// overlap is taken again. The search doubles the step from a tenth of the mode's Rayleigh range
// and then bisects; ok is false when no shift up to maxAxialRayleigh Rayleigh ranges loses 1 dB.
func AxialOneDBMM(beamT, beamS, modeT, modeS complex128, gT, gS gaussian, wavelengthNM float64) (float64, bool) {
	mode := newGaussian(wavelengthNM, 1)
	at := func(dz float64) float64 {
		d := complex(dz, 0)
		return Coupling(Overlap(profileOf(gT, beamT), profileOf(gS, beamS),
			profileOf(mode, modeT-d), profileOf(mode, modeS-d), Offset{}, Offset{}, wavelengthNM))
	}
	limit := OneDBLoss * at(0)
	maxMM := maxAxialRayleigh * math.Max(imag(modeT), imag(modeS))
	best, found := 0.0, false
	for _, sign := range []float64{1, -1} {
		lo, hi := 0.0, 0.1*math.Min(imag(modeT), imag(modeS))
		for at(sign*hi) > limit {
			lo, hi = hi, 2*hi
			if hi > maxMM {
				break
			}
		}
		if hi > maxMM {
			continue
		}
		for range 60 {
			mid := (lo + hi) / 2
			if at(sign*mid) > limit {
				lo = mid
			} else {
				hi = mid
			}
		}
		if !found || hi < best {
			best, found = hi, true
		}
	}
	return best, found
}

// Couplings is the coupling of the source's beam into every fibre and mode target on p that the
// beam reaches (README "Fibres, mode targets and cylindrical lenses"): the overlap integral at the
// element's plane of the arriving beam in both planes (size, curvature, astigmatism) with the
// target's mode, at the primary wavelength. A beam of M² > 1 is taken as a Gaussian of its real
// radius and curvature, an upper bound on its coupling into a single mode.
func Couplings(b *optics.Bench, p *optics.Path) []optics.Coupling {
	if b == nil || p == nil || b.Source.GaussianBeam() == nil {
		return nil
	}
	t, s, warn := sourceTraces(b, p)
	if warn != nil {
		return nil
	}
	lam := p.WavelengthsNM[0]
	mode := newGaussian(lam, 1)
	var out []optics.Coupling
	lit := litStretches(p) // nothing passes a dump
	for ei, sp := range p.Spans {
		e := &b.Elements[ei]
		tab, ver, ok := e.TargetPlanes()
		if !ok || sp.First < 0 || sp.First >= len(p.Surfaces) || sp.First >= lit {
			continue
		}
		qt, qs := t.arrive[sp.First], s.arrive[sp.First]
		mt, ms := mode.sourceQ(tab.WaistRadiusMM, tab.WaistAtMM), mode.sourceQ(ver.WaistRadiusMM, ver.WaistAtMM)
		beamT, beamS := profileOf(t.g, qt), profileOf(s.g, qs)
		modeT, modeS := profileOf(mode, mt), profileOf(mode, ms)
		c := optics.Coupling{
			Element:    e.ID,
			Efficiency: Coupling(Overlap(beamT, beamS, modeT, modeS, Offset{}, Offset{}, lam)),
		}
		if !(c.Efficiency > 0) {
			out = append(out, c)
			continue
		}
		if dz, ok := AxialOneDBMM(qt, qs, mt, ms, t.g, s.g, lam); ok {
			c.AxialMM = &dz
		}
		c.LateralMM = finitePtr(LateralOneDBMM(beamT, modeT, lam))
		c.LateralVerticalMM = finitePtr(LateralOneDBMM(beamS, modeS, lam))
		c.AngularMrad = finitePtr(1000 * TiltOneDBRad(beamT, modeT, lam))
		c.AngularVerticalMrad = finitePtr(1000 * TiltOneDBRad(beamS, modeS, lam))
		out = append(out, c)
	}
	return out
}

func finitePtr(x float64) *float64 {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return nil
	}
	return &x
}
