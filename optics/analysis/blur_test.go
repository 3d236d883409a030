package analysis

import (
	"encoding/json"
	"fmt"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// singletBench is a collimated fan of radius h through a plano-convex fused-silica lens (f about
// 100 mm at 632.8 nm), curved face first or flat face first, onto a screen at the paraxial focus.
func singletBench(t *testing.T, h float64, curvedFirst bool) *optics.Report {
	t.Helper()
	faces := "[45.7, null]"
	if !curvedFirst {
		faces = "[null, -45.7]"
	}
	probe := mustRun(t, fmt.Sprintf(singletJSON, h, faces, 100.0))
	bfl := value(t, "bfl_mm", probe.System.BFLMM)
	return mustRun(t, fmt.Sprintf(singletJSON, h, faces, bfl))
}

const singletJSON = `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
 "source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":%g},
 "elements":[{"id":"L","type":"lens","gap_mm":20,"faces_mm":%s,"thicknesses_mm":[4],"materials":["fused-silica"],"diameter_mm":25.4},
  {"id":"CAM","type":"screen","gap_mm":%.12g}]}`

func TestBlurIdealLensAndAiryRadius(t *testing.T) {
	r := mustRun(t, `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
 "source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":5},
 "elements":[{"id":"F","type":"thin-lens","gap_mm":20,"focal_mm":100},{"id":"CAM","type":"screen","gap_mm":100}]}`)
	if len(r.Blur) != 1 {
		t.Fatalf("%d blur rows, want 1", len(r.Blur))
	}
	bl := r.Blur[0]
	// An ideal thin lens brings a collimated fan to one point at its focal plane (definition of
	// the focal length; common practice): no spread beyond rounding.
	if bl.Rays != 21 || !approx.Abs(bl.RMSMM, 0, approx.Rounding) || !approx.Abs(bl.PeakMM, 0, approx.Rounding) {
		t.Errorf("ideal lens: %d rays, rms %g, peak %g mm; want 21 rays on one point", bl.Rays, bl.RMSMM, bl.PeakMM)
	}
	// Airy radius 1.22·λ/(2·NA) (Born and Wolf, Principles of Optics, §8.5.2, section from
	// memory) at NA = 5/100.
	want := 1.22 * 632.8e-6 / (2 * 0.05)
	if bl.AiryRadiusMM == nil || !approx.Rel(*bl.AiryRadiusMM, want, approx.VeryClose) {
		t.Errorf("Airy radius %v, want %.6g mm", bl.AiryRadiusMM, want)
	}
}

// TestBlurSphericalAberration: at the paraxial focus a singlet's transverse spherical aberration
// grows as the cube of the aperture (third-order, Seidel; Welford, Aberrations of Optical
// Systems, 1986), so doubling the fan radius multiplies the blur by 8; and a plano-convex lens
// with its curved face towards the collimated beam blurs about four times less than turned round
// (common practice for orienting a singlet, from memory).
func TestBlurSphericalAberration(t *testing.T) {
	const (
		cubeTol = 0.1 // fifth-order terms at h = 2 mm of f = 100 mm; 8.007 measured
		// orientLo, orientHi bracket "about four": 3.69 measured at h = 5 mm.
		orientLo, orientHi = 3.0, 5.0
	)
	small := singletBench(t, 1, true).Blur[0].RMSMM
	large := singletBench(t, 2, true).Blur[0].RMSMM
	if ratio := large / small; !approx.Abs(ratio, 8, cubeTol) {
		t.Errorf("blur ratio for twice the aperture = %.4f, want 8 (h³)", ratio)
	}
	good := singletBench(t, 5, true).Blur[0].RMSMM
	bad := singletBench(t, 5, false).Blur[0].RMSMM
	if ratio := bad / good; !(ratio >= orientLo && ratio <= orientHi) {
		t.Errorf("flat-first / curved-first blur = %.3f (%.4g / %.4g mm), want about 4", ratio, bad, good)
	} else {
		t.Logf("flat-first / curved-first blur = %.3f (%.4g / %.4g mm)", ratio, bad, good)
	}
}

// The report's blur is a list (README, "Report": one row per fan at every screen); a bench with
// no screen has an empty list, which JSON must show as [] rather than null, as the report does
// for every other list.
func TestBlurWithoutScreenIsEmptyList(t *testing.T) {
	r := mustRun(t, `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
 "source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":5},
 "elements":[{"id":"F","type":"thin-lens","gap_mm":20,"focal_mm":100},{"id":"D","type":"dump","gap_mm":100}]}`)
	data, err := json.Marshal(r)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(data), `"blur":[]`) {
		t.Errorf("report without a screen: want \"blur\":[], got blur %v", r.Blur)
	}
}
