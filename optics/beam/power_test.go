package beam

import (
	"math"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

const powerTol = 1e-12

// TestFresnelNormal: ((n1 - n2)/(n1 + n2))² at normal incidence (Fresnel; any optics text): 4.0 %
// for n = 1.5 in air (from memory), the same both ways, nothing between equal media.
func TestFresnelNormal(t *testing.T) {
	for _, tc := range []struct {
		n1, n2, want float64
	}{
		{1, 1.5, 0.04},   // from memory
		{1.5, 1, 0.04},   // the boundary reflects alike from either side
		{1, 2, 1.0 / 9},  // ((1 - 2)/(1 + 2))²
		{1.45, 1.45, 0},  // no boundary
		{1, 4, 9.0 / 25}, // ((1 - 4)/(1 + 4))², germanium-like (from memory)
	} {
		if got := optics.FresnelNormal(tc.n1, tc.n2); !approx.Abs(got, tc.want, powerTol) {
			t.Errorf("FresnelNormal(%v, %v) = %v, want %v", tc.n1, tc.n2, got, tc.want)
		}
	}
}

// TestPeakIrradiance: 2P/(π w²) for a round beam and 2P/(π w_x w_y) for an elliptical one, the
// peak of a Gaussian whose 1/e² radii are w (definition of the 1/e² radius); 1 mm = 0.1 cm.
func TestPeakIrradiance(t *testing.T) {
	for _, tc := range []struct {
		name             string
		powerW, wxMM, wy float64
		want             float64
	}{
		{"1 W, w = 1 mm", 1, 1, 1, 2 / (math.Pi * 0.01)},          // 63.66 W/cm²
		{"1 W, 1 mm by 2 mm", 1, 1, 2, 2 / (math.Pi * 0.1 * 0.2)}, // half the round one's
		{"35 mW, w = 0.5 mm", 0.035, 0.5, 0.5, 2 * 0.035 / (math.Pi * 0.05 * 0.05)},
	} {
		if got := PeakIrradianceWCM2(tc.powerW, tc.wxMM, tc.wy); !approx.Rel(got, tc.want, powerTol) {
			t.Errorf("%s: %v W/cm², want %v", tc.name, got, tc.want)
		}
	}
	if got := PeakIrradianceWCM2(1, 1, 1); !approx.Abs(got, 63.662, 1e-3) { // 2/(π·0.01) by hand
		t.Errorf("1 W on w = 1 mm: %v W/cm², want 63.662", got)
	}
}

// TestLensEnergyBookkeeping: what arrives at a lens is passed, reflected by its faces or clipped
// by its apertures, and nothing else (self-consistency), for coatings and clipping of all kinds.
func TestLensEnergyBookkeeping(t *testing.T) {
	for _, tc := range []struct {
		name    string
		coating string
		faceR   *float64
		clearMM float64
		want    float64 // the share reflected back per face
	}{
		{"ar, unclipped", "", nil, 0, optics.ARFaceReflectance},
		{"uncoated, clipped", optics.CoatingNone, nil, 2.5, optics.FresnelNormal(1, 1.5)},
		{"stated 1 %, clipped hard", "", new(0.01), 1.5, 0.01},
	} {
		b := beamBench(hene, 1, 0, 1)
		p := buildPath(hene, plane("A0", 50, 0), lens("L", 50, 80, -80, 5, 1.5).clear(tc.clearMM), plane("S", 100, 0))
		b.Elements = []optics.Element{{ID: "A0", Type: optics.TypeAperture}, {ID: "L", Type: optics.TypeLens, Coating: tc.coating, FaceReflectance: tc.faceR}, {ID: "S", Type: optics.TypeScreen}}
		_, _, pass := propagate(b, p)
		ep := powerBudget(b, p, pass)[1]
		if sum := ep.Passed + ep.Reflected + ep.Clipped; !approx.Abs(sum, ep.Arriving, powerTol) {
			t.Errorf("%s: passed %v + reflected %v + clipped %v = %v, want the arriving %v", tc.name, ep.Passed, ep.Reflected, ep.Clipped, sum, ep.Arriving)
		}
		in := ep.Arriving - ep.Clipped
		if want := in * (1 - (1-tc.want)*(1-tc.want)); !approx.Abs(ep.Reflected, want, powerTol) {
			t.Errorf("%s: reflected %v, want %v (two faces of %v)", tc.name, ep.Reflected, want, tc.want)
		}
		if tc.clearMM > 0 && !(ep.Clipped > 0) {
			t.Errorf("%s: a %v mm clear diameter clips nothing", tc.name, tc.clearMM)
		}
	}
}

// TestSourcePower: a pulse's average power is energy × rate and its peak energy / duration (a
// flat-top pulse in time); 1 µJ in 10 ns at 1 kHz is 1 mW on average and 100 W at the peak.
func TestSourcePower(t *testing.T) {
	s := optics.Source{Pulse: &optics.Pulse{EnergyUJ: 1, DurationNS: 10, RateHz: 1000}}
	avg, peak, pulse, ok := s.SourcePower()
	if !ok || !approx.Rel(avg, 1, powerTol) || !approx.Rel(peak, 1e5, powerTol) || !approx.Rel(pulse, 1e-3, powerTol) {
		t.Errorf("1 µJ, 10 ns, 1 kHz: average %v mW, peak %v mW, pulse %v mJ (%v), want 1, 1e5, 1e-3", avg, peak, pulse, ok)
	}
	s = optics.Source{PowerMW: new(35.0)}
	if avg, peak, pulse, ok = s.SourcePower(); !ok || avg != 35 || peak != 35 || pulse != 0 {
		t.Errorf("35 mW steady: %v %v %v %v", avg, peak, pulse, ok)
	}
	if _, _, _, ok = (&optics.Source{}).SourcePower(); ok {
		t.Error("a source without power_mw or pulse states a power")
	}
}
