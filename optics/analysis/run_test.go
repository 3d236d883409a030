package analysis

import (
	"math"
	"os"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

func mustRun(t *testing.T, bench string) *optics.Report {
	t.Helper()
	b, err := optics.Decode([]byte(bench))
	if err != nil {
		t.Fatalf("decode: %v", err)
	}
	r, err := Run(b)
	if err != nil {
		t.Fatalf("run: %v", err)
	}
	return r
}

func value(t *testing.T, name string, v *float64) float64 {
	t.Helper()
	if v == nil {
		t.Fatalf("%s is null", name)
	}
	return *v
}

const mirrorBench = `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"metric-25mm","width_mm":600,"depth_mm":450,"beam_height_mm":75},
 "source":{"x_mm":100,"y_mm":200,"heading_deg":0,"kind":"collimated","semi_diameter_mm":2,
   "rays":[{"height_mm":10,"angle_deg":0,"x_mm":0,"x_angle_deg":0}]},
 "elements":[
  {"id":"M1","type":"mirror","gap_mm":300,"radius_mm":200,"turn_deg":TURN,"diameter_mm":50.8},
  {"id":"CAM","type":"screen","gap_mm":100}]}`

func mirror(turn string) string {
	b := []byte(mirrorBench)
	out := make([]byte, 0, len(b))
	for i := 0; i < len(b); i++ {
		if i+4 <= len(b) && string(b[i:i+4]) == "TURN" {
			out = append(out, turn...)
			i += 3
			continue
		}
		out = append(out, b[i])
	}
	return string(out)
}

// TestConcaveMirrorFocus: a concave mirror of radius R focuses collimated light at R/2 (the
// paraxial mirror equation, Hecht, Optics, 4th ed., §5.4, from memory); raytable's convention puts
// that focus 100 mm downstream along the folded path for R = 200 mm (README, 'Report, format
// raytable/report/v1', Frames: a concave mirror acts like a positive lens).
func TestConcaveMirrorFocus(t *testing.T) {
	r := mustRun(t, mirror("180"))
	if got := value(t, "efl_mm", r.System.EFLMM); !approx.Rel(got, 100, approx.VeryClose) {
		t.Errorf("efl_mm = %.12g, want 100", got)
	}
	if got := value(t, "bfl_mm", r.System.BFLMM); !approx.Rel(got, 100, approx.VeryClose) {
		t.Errorf("bfl_mm = %.12g, want 100", got)
	}
	// Folded path: the mirror at x = 400 turns the beam back (heading 180), so the screen
	// 100 mm downstream sits at x = 300 on the same line (geometry of the walk).
	cam := r.Elements[1]
	if !approx.Abs(cam.TableXMM, 300, approx.VeryClose) || !approx.Abs(cam.TableYMM, 200, approx.VeryClose) || cam.HeadingInDeg != 180 {
		t.Errorf("screen at (%g, %g) heading %g, want (300, 200) heading 180", cam.TableXMM, cam.TableYMM, cam.HeadingInDeg)
	}
	// The explicit ray at height 10 meets the mirror at the sag R - sqrt(R² - h²) = 0.25016 mm,
	// measured along the leaving axis (README, 'Report, format raytable/report/v1', Rays, which
	// quotes it to 5 decimals; sphere sag from its equation).
	const quotedTol = 5e-6 // half a unit of README's fifth decimal
	hit := r.Rays[0].Hits[0]
	wantSag := 200 - math.Sqrt(200*200-10*10)
	if hit.Element != "M1" || !approx.Abs(hit.Exact.ZMM, wantSag, approx.VeryClose) || !approx.Abs(hit.Exact.ZMM, 0.25016, quotedTol) {
		t.Errorf("mirror hit z_mm = %.6f, want %.6f", hit.Exact.ZMM, wantSag)
	}
}

// TestTiltedMirrorCoddington: a spherical mirror used at incidence i has tangential and sagittal
// focal lengths f·cos i and f/cos i (Coddington's equations for a mirror; from memory, as in
// Smith, Modern Optical Engineering). A turn of 120° is i = 30°.
func TestTiltedMirrorCoddington(t *testing.T) {
	r := mustRun(t, mirror("120"))
	i := 30 * math.Pi / 180
	if got, want := value(t, "efl_mm", r.System.EFLMM), 100*math.Cos(i); !approx.Rel(got, want, approx.VeryClose) {
		t.Errorf("tangential efl_mm = %.10g, want %.10g", got, want)
	}
	if got, want := value(t, "sagittal.efl_mm", r.System.Sagittal.EFLMM), 100/math.Cos(i); !approx.Rel(got, want, approx.VeryClose) {
		t.Errorf("sagittal efl_mm = %.10g, want %.10g", got, want)
	}
	if r.Elements[0].HeadingOutDeg != 120 {
		t.Errorf("heading out = %g, want 120", r.Elements[0].HeadingOutDeg)
	}
}

// TestFusedSilicaSingletGullstrand runs a biconvex fused-silica lens through the whole pipeline
// and compares the EFL with Gullstrand's thick-lens power P = P1 + P2 - (t/n)·P1·P2 (Hecht,
// Optics, 4th ed., eq. 6.2, from memory), using the Malitson (1965) index at the d line,
// n = 1.45846 (his table, from memory).
func TestFusedSilicaSingletGullstrand(t *testing.T) {
	r := mustRun(t, `{"format":"raytable/bench/v1","wavelengths_nm":[587.5618],
 "table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
 "source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1},
 "elements":[{"id":"L","type":"lens","gap_mm":50,"faces_mm":[50,-50],"thicknesses_mm":[5],"materials":["fused-silica"],"diameter_mm":25.4},
  {"id":"D","type":"dump","gap_mm":60}]}`)
	n := r.Media[0].Index
	const quoted5 = 1e-5                  // n_d quoted to 5 decimals
	if !approx.Abs(n, 1.45846, quoted5) { // Malitson 1965, n_d of fused silica (from memory)
		t.Fatalf("n_d = %.6f, want 1.45846", n)
	}
	p1, p2 := (n-1)/50, (1-n)/-50
	want := 1 / (p1 + p2 - 5/n*p1*p2)
	if got := value(t, "efl_mm", r.System.EFLMM); !approx.Rel(got, want, approx.VeryClose) {
		t.Errorf("efl_mm = %.10g, want %.10g (Gullstrand)", got, want)
	}
	// Back focal length f·(1 - (n-1)·t/(n·R1)) (Hecht, Optics, eq. 6.3, from memory).
	wantBFL := want * (1 - (n-1)*5/(n*50))
	if got := value(t, "bfl_mm", r.System.BFLMM); !approx.Rel(got, wantBFL, approx.VeryClose) {
		t.Errorf("bfl_mm = %.10g, want %.10g", got, wantBFL)
	}
}

// TestGaussianFocusBehindLens: a collimated Gaussian beam of waist w at a thin lens of focal
// length f focuses to w' ≈ M²λf/(πw) near the focal plane when the Rayleigh range is much longer
// than f (Kogelnik and Li, Applied Optics 5, 1550 (1966), far-field form).
func TestGaussianFocusBehindLens(t *testing.T) {
	r := mustRun(t, `{"format":"raytable/bench/v1","wavelengths_nm":[1064],
 "table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
 "source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1,
   "beam":{"waist_radius_mm":2,"waist_at_mm":100}},
 "elements":[{"id":"F","type":"thin-lens","gap_mm":100,"focal_mm":100},{"id":"D","type":"dump","gap_mm":200}]}`)
	// Two waists: the source's own at the lens plane (it belongs to the gap ending there, so it
	// comes after no element) and the focus.
	if r.Beam == nil || len(r.Beam.Waists) != 2 {
		t.Fatalf("want two waists, got %d", len(r.Beam.Waists))
	}
	if r.Beam.Waists[0].After != nil || r.Beam.Waists[0].PathMM != 100 {
		t.Errorf("first waist after %v at %g, want after none at 100", r.Beam.Waists[0].After, r.Beam.Waists[0].PathMM)
	}
	// With zR = 11.8 m and f = 100 mm the far-field form is off by about (f/zR)² = 7e-5 in radius,
	// and the waist lies f³/zR² = 0.007 mm short of the focal plane (Self 1983, thin-lens waist).
	const (
		farFieldRel = 1e-3
		focusTol    = 0.01 // mm
	)
	w := r.Beam.Waists[1]
	want := 1064e-6 * 100 / (math.Pi * 2)
	if got := value(t, "radius_t_mm", w.RadiusTMM); !approx.Rel(got, want, farFieldRel) {
		t.Errorf("focused waist = %.6g mm, want %.6g", got, want)
	}
	if !approx.Abs(w.PathMM, 200, focusTol) {
		t.Errorf("waist at %g mm, want about 200 (the focal plane)", w.PathMM)
	}
	if w.After == nil || *w.After != "F" {
		t.Errorf("waist after %v, want F", w.After)
	}
}

// TestDemoBench checks the demo bench end to end: it computes, its expander is six times
// (f2/f1 = 150/25, common practice for a Keplerian expander), and the camera sits at the focus.
func TestDemoBench(t *testing.T) {
	data, err := os.ReadFile("../../testdata/demo-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	r := mustRun(t, string(data))
	if len(r.Elements) != 8 || len(r.Placement) != 8 {
		t.Fatalf("%d elements, %d placements", len(r.Elements), len(r.Placement))
	}
	// Beam radius after the expander / before it: 2.85 / 0.43 from the q law; the geometric ratio
	// f2/f1 with the design focal lengths is 6. The q law gives 5.96 (the beam is no plane wave),
	// and the bench puts the camera by hand at 130 mm, 0.17 mm from the computed focus.
	const (
		expansionTol = 0.5
		cameraTol    = 0.5 // mm
	)
	ratio := r.Beam.Elements[2].WTMM / r.Beam.Elements[0].ArrivingWTMM
	if !approx.Abs(ratio, 6, expansionTol) {
		t.Errorf("expansion = %.3f, want about 6", ratio)
	}
	bfl := value(t, "bfl_mm", r.System.BFLMM)
	if !approx.Abs(bfl, 130, cameraTol) {
		t.Errorf("bfl_mm = %g, want the camera's 130 mm within 0.5 mm", bfl)
	}
}

func TestInvalidBenchIsAnError(t *testing.T) {
	b := &optics.Bench{Format: optics.FormatBenchV1}
	_, err := Run(b)
	if optics.ErrorCode(err) != optics.EInvalid {
		t.Fatalf("code %q, err %v", optics.ErrorCode(err), err)
	}
}

func BenchmarkRunDemo(b *testing.B) {
	data, err := os.ReadFile("../../testdata/demo-bench.json")
	if err != nil {
		b.Fatal(err)
	}
	bench, err := optics.Decode(data)
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Run(bench); err != nil {
			b.Fatal(err)
		}
	}
}

// TestCollidingMounts: two lens mounts 8 mm apart along the beam, each 18 mm deep by default
// (common practice for a 1 in lens mount), must be reported as overlapping.
func TestCollidingMounts(t *testing.T) {
	data, err := os.ReadFile("../../testdata/collide-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	r := mustRun(t, string(data))
	var found bool
	for _, w := range r.Warnings {
		if w.Code == "mounts-overlap" && w.Element == "RL1" && len(w.Others) == 1 && w.Others[0] == "RL2" {
			found = true
		}
	}
	if !found {
		t.Errorf("no mounts-overlap warning naming RL1 and RL2; warnings: %+v", r.Warnings)
	}
}

// TestRelayMagnification: the relay bench images the fibre tip with lateral magnification
// m = -f / (s - f), s the object distance from the front principal plane (Gaussian lens
// equation, Hecht, Optics, eq. 5.17 and 5.24, from memory), and the slit sits at that image.
func TestRelayMagnification(t *testing.T) {
	data, err := os.ReadFile("../../testdata/relay-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	r := mustRun(t, string(data))
	f := value(t, "efl_mm", r.System.EFLMM)
	s := r.System.FirstVertexPathMM + value(t, "front_principal_mm", r.System.FrontPrincipalMM)
	want := -f / (s - f)
	if got := value(t, "magnification", r.System.Magnification); !approx.Rel(got, want, approx.Close) {
		t.Errorf("magnification = %.8g, want %.8g", got, want)
	}
	// Image distance from the rear principal plane s' = f·s/(s - f), same source.
	sImage := f * s / (s - f)
	got := value(t, "image_distance_mm", r.System.ImageDistanceMM) - value(t, "rear_principal_mm", r.System.RearPrincipalMM)
	if !approx.Rel(got, sImage, approx.Close) {
		t.Errorf("image distance from H' = %.8g, want %.8g", got, sImage)
	}
	// The bench file places the slit by hand, 0.03 mm from the computed image.
	const slitTol = 0.1 // mm
	slit := r.Elements[2]
	imageAt := r.System.LastVertexPathMM + value(t, "image_distance_mm", r.System.ImageDistanceMM)
	if slit.ID != "SLIT" || !approx.Abs(slit.PathMM, imageAt, slitTol) {
		t.Errorf("slit at %g mm, image at %g mm", slit.PathMM, imageAt)
	}
}
