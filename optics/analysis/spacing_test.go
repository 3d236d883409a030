package analysis

import (
	"encoding/json"
	"fmt"
	"math"
	"reflect"
	"strconv"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
	"raytable/optics/internal/approx"
	"raytable/optics/paraxial"
)

// Named tolerances of the spacing checks.
const (
	derivClose = 1e-6  // central difference with δ = 0.01 mm against a closed-form derivative
	zeroSens   = 1e-12 // a sensitivity that must vanish: snapped to zero or rounding at most
)

const lambdaHeNeMM = 632.8e-6

// spacingBench is a bench on a 2 m table with the given source and elements.
func spacingBench(source, elements string) string {
	return `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"none","width_mm":2000,"depth_mm":600,"beam_height_mm":75},
 "source":{"x_mm":10,"y_mm":300,"heading_deg":0,` + source + `},
 "elements":[` + elements + `]}`
}

func rowOf(t *testing.T, r *optics.Report, id string) optics.SpacingTolerance {
	t.Helper()
	for _, row := range r.Spacing {
		if row.ID == id {
			return row
		}
	}
	t.Fatalf("no spacing row for %s in %+v", id, r.Spacing)
	return optics.SpacingTolerance{}
}

// TestSpacingPointSourceThinLens images a point at distance s through a thin lens f onto a screen
// at the image. Moving the lens by δ with the screen gap fixed changes s by δ: the image moves by
// δ (the lens) plus ds'/ds·δ = -m²·δ (longitudinal magnification, Hecht, Optics, sec. 5.2.3, from
// memory), and so does the screen by δ; the defocus is -m² per mm. The screen's own gap moves only
// the screen: -1 per mm.
func TestSpacingPointSourceThinLens(t *testing.T) {
	const na = 0.05
	for _, tc := range []struct{ s, f float64 }{{300, 100}, {150, 100}, {400, 250}} {
		t.Run(fmt.Sprintf("s%g_f%g", tc.s, tc.f), func(t *testing.T) {
			sImg := tc.s * tc.f / (tc.s - tc.f) // Gaussian lens equation 1/s + 1/s' = 1/f
			m := -sImg / tc.s
			elements := fmt.Sprintf(`{"id":"L","type":"thin-lens","gap_mm":%g,"focal_mm":%g},
				{"id":"CAM","type":"screen","gap_mm":%g}`, tc.s, tc.f, sImg)
			r := mustRun(t, spacingBench(`"kind":"point","na":0.05,"object_heights_mm":[0]`, elements))

			if r.SpacingBasis.Kind != optics.SpacingDepthOfFocus || r.SpacingBasis.Reference != "CAM" {
				t.Fatalf("basis %+v, want depth of focus at CAM", r.SpacingBasis)
			}
			// Image-side NA: the marginal slope scales by s/s' (paraxial Lagrange invariant with a
			// zero-height object, Born and Wolf, sec. 4.4, from memory).
			naImg := na * tc.s / sImg
			approx.CheckPtr(t, "image_na", r.SpacingBasis.ImageNA, naImg, approx.VeryClose)
			// Rayleigh's quarter-wave depth of focus λ/(2 NA'²) (Born and Wolf, sec. 8.8, from memory).
			dof := lambdaHeNeMM / (2 * naImg * naImg)
			approx.CheckPtr(t, "depth_of_focus_mm", r.SpacingBasis.DepthOfFocusMM, dof, approx.VeryClose)

			lens := rowOf(t, r, "L")
			approx.CheckPtr(t, "L defocus_per_mm", lens.DefocusPerMM, -m*m, derivClose)
			approx.CheckPtr(t, "L image_shift_per_mm", lens.ImageShiftPerMM, 1-m*m, derivClose)
			approx.CheckPtr(t, "L tolerance_mm", lens.ToleranceMM, dof/(m*m), derivClose)

			cam := rowOf(t, r, "CAM")
			approx.CheckPtr(t, "CAM defocus_per_mm", cam.DefocusPerMM, -1, derivClose)
			approx.CheckPtr(t, "CAM image_shift_per_mm", cam.ImageShiftPerMM, 0, zeroSens)
			approx.CheckPtr(t, "CAM tolerance_mm", cam.ToleranceMM, dof, derivClose)
			if lens.DivergencePerMM != nil || cam.DivergencePerMM != nil {
				t.Error("divergence given for a finite image")
			}
		})
	}
}

// TestSpacingCollimatedThinLens: parallel light focuses at f behind the lens wherever the lens
// stands, so moving the lens moves the focus and the screen alike (defocus 0, no tolerance), while
// the screen's gap defocuses by -1 per mm. NA' = y/f for a bundle of radius y (paraxial marginal
// ray, common practice).
func TestSpacingCollimatedThinLens(t *testing.T) {
	const y, f = 2.0, 100.0
	r := mustRun(t, spacingBench(`"kind":"collimated","semi_diameter_mm":2`,
		`{"id":"L","type":"thin-lens","gap_mm":50,"focal_mm":100},{"id":"CAM","type":"screen","gap_mm":100}`))
	dof := lambdaHeNeMM / (2 * (y / f) * (y / f)) // Born and Wolf, sec. 8.8, from memory
	approx.CheckPtr(t, "depth_of_focus_mm", r.SpacingBasis.DepthOfFocusMM, dof, approx.VeryClose)

	lens := rowOf(t, r, "L")
	approx.CheckPtr(t, "L defocus_per_mm", lens.DefocusPerMM, 0, zeroSens)
	approx.CheckPtr(t, "L image_shift_per_mm", lens.ImageShiftPerMM, 1, derivClose)
	if lens.ToleranceMM != nil {
		t.Errorf("L tolerance %g, want null: the lens gap does not defocus", *lens.ToleranceMM)
	}
	cam := rowOf(t, r, "CAM")
	approx.CheckPtr(t, "CAM defocus_per_mm", cam.DefocusPerMM, -1, derivClose)
	approx.CheckPtr(t, "CAM tolerance_mm", cam.ToleranceMM, dof, derivClose)
}

// TestSpacingKeplerianExpander: thin lenses f1 and f2 at f1 + f2 + ε, collimated input of radius
// y. From the ABCD product T(f2+...)·L(f2)·T(f1+f2+ε)·L(f1): after L1 the ray is (y, -y/f1), at L2
// its height is y - (f1+f2+ε)·y/f1 = -y(f2+ε)/f1, and leaving L2 its slope is
// -y/f1 + y(f2+ε)/(f1·f2) = y·ε/(f1·f2). So du/dε = y/(f1·f2); the output radius is w = y·f2/f1
// and the tolerance λ/(π w) / (y/(f1 f2)) = λ·f1²/(π·y²). The gap before L1 and the screen's gap
// do not change the output slope of a collimated bundle (translation along a parallel beam).
func TestSpacingKeplerianExpander(t *testing.T) {
	const y, f1, f2 = 1.0, 25.0, 150.0
	r := mustRun(t, spacingBench(`"kind":"collimated","semi_diameter_mm":1`,
		`{"id":"L1","type":"thin-lens","gap_mm":50,"focal_mm":25},
		 {"id":"L2","type":"thin-lens","gap_mm":175,"focal_mm":150},
		 {"id":"CAM","type":"screen","gap_mm":100}`))
	b := r.SpacingBasis
	if b.Kind != optics.SpacingDiffractionAngle {
		t.Fatalf("basis %q, want %q for an afocal expander", b.Kind, optics.SpacingDiffractionAngle)
	}
	w := y * f2 / f1
	approx.CheckPtr(t, "output_radius_mm", b.OutputRadiusMM, w, approx.VeryClose)
	approx.CheckPtr(t, "divergence_rad", b.DivergenceRad, lambdaHeNeMM/(math.Pi*w), approx.VeryClose) // Gaussian far-field half-angle, common practice

	l2 := rowOf(t, r, "L2")
	approx.CheckPtr(t, "L2 divergence_per_mm", l2.DivergencePerMM, y/(f1*f2), derivClose)
	approx.CheckPtr(t, "L2 tolerance_mm", l2.ToleranceMM, lambdaHeNeMM*f1*f1/(math.Pi*y*y), derivClose)
	if l2.DefocusPerMM != nil || l2.ImageShiftPerMM != nil {
		t.Error("defocus given for a collimated output")
	}
	for _, id := range []string{"L1", "CAM"} {
		row := rowOf(t, r, id)
		approx.CheckPtr(t, id+" divergence_per_mm", row.DivergencePerMM, 0, zeroSens)
		if row.ToleranceMM != nil {
			t.Errorf("%s tolerance %g, want null", id, *row.ToleranceMM)
		}
	}
}

// TestSpacingStopsAtDump: nothing after a dump receives light, so its gaps get no row, and the
// dump is where defocus is measured.
func TestSpacingStopsAtDump(t *testing.T) {
	r := mustRun(t, spacingBench(`"kind":"collimated","semi_diameter_mm":2`,
		`{"id":"L","type":"thin-lens","gap_mm":50,"focal_mm":100},{"id":"D","type":"dump","gap_mm":100},
		 {"id":"CAM","type":"screen","gap_mm":100}`))
	if len(r.Spacing) != 2 || r.Spacing[1].ID != "D" || r.SpacingBasis.Reference != "D" {
		t.Fatalf("rows %+v, reference %q; want L and D, reference D", r.Spacing, r.SpacingBasis.Reference)
	}
	approx.CheckPtr(t, "D defocus_per_mm", r.Spacing[1].DefocusPerMM, -1, derivClose) // only the dump moves
}

// TestSpacingWithoutOptics: with no lens, thin lens or mirror no gap changes the light; the table
// is empty, and written as [] so that readers need not treat null.
func TestSpacingWithoutOptics(t *testing.T) {
	r := mustRun(t, spacingBench(`"kind":"collimated","semi_diameter_mm":2`,
		`{"id":"A","type":"aperture","gap_mm":50,"diameter_mm":5},{"id":"CAM","type":"screen","gap_mm":100}`))
	if r.SpacingBasis.Kind != optics.SpacingNone || len(r.Spacing) != 0 {
		t.Fatalf("basis %+v, rows %+v; want none and no rows", r.SpacingBasis, r.Spacing)
	}
	js, err := json.Marshal(r)
	if err != nil {
		t.Fatal(err)
	}
	var m map[string]json.RawMessage
	if err := json.Unmarshal(js, &m); err != nil {
		t.Fatal(err)
	}
	if got := string(m["spacing"]); got != "[]" {
		t.Errorf("spacing JSON %s, want []", got)
	}
}

// TestSpacingLeavesBenchAlone: the gaps are changed on a copy; the caller's bench is unchanged.
func TestSpacingLeavesBenchAlone(t *testing.T) {
	b := loadDemo(t)
	before, err := json.Marshal(b)
	if err != nil {
		t.Fatal(err)
	}
	p := optics.BuildPath(b)
	SpacingTolerances(b, p, paraxial.Analyze(b, p, 0, paraxial.Tangential))
	after, _ := json.Marshal(b)
	if string(before) != string(after) {
		t.Error("SpacingTolerances changed the bench it was given")
	}
}

// TestSpacingDemo: the demo bench (6x expander L1-PH-L2, fold mirrors, focusing lens F1, camera)
// has a row per element with the camera as reference. Past F1 only the camera moves with a gap
// (defocus -1 per mm, the definition). The pinhole's and L2's gaps both move L2 against L1's focus:
// with that focus at L2's front focal point the part L2..F1 images it with lateral magnification
// m = -f_F1/f_L2 (collimated between them), so the defocus is -m² (longitudinal magnification,
// Hecht, Optics, sec. 5.2.3, from memory). L2 is plano-convex, so f_L2 = -R/(n-1) whatever its
// thickness (thick-lens lensmaker's equation, Hecht sec. 6.2, from memory). Those two gaps are
// the ones to hold most tightly.
func TestSpacingDemo(t *testing.T) {
	const demoAfocal = 2e-3 // the demo's expander is afocal to about 0.04 mm of its 147 mm gap, not exactly
	b := loadDemo(t)
	r, err := Run(b)
	if err != nil {
		t.Fatal(err)
	}
	var ids, want []string
	for _, row := range r.Spacing {
		ids = append(ids, row.ID)
	}
	for _, e := range b.Elements {
		want = append(want, e.ID)
	}
	if !reflect.DeepEqual(ids, want) {
		t.Fatalf("rows %v, want one per element %v", ids, want)
	}
	// The demo's source has a Gaussian beam: the tolerances come from it (README, Report, spacing).
	if r.SpacingBasis.Kind != optics.SpacingBeamRayleigh || r.SpacingBasis.Reference != "CAM" {
		t.Fatalf("basis %+v, want beam-rayleigh at CAM", r.SpacingBasis)
	}
	// The gaps past F1 move only the camera against the waist: -1 per mm, so they are held to the
	// output waist's Rayleigh range (the definition).
	zR := value(t, "spacing_basis.rayleigh_mm", r.SpacingBasis.RayleighMM)
	for _, id := range []string{"M2", "CAM"} {
		approx.CheckPtr(t, id+" waist_shift_per_mm", rowOf(t, r, id).WaistShiftPerMM, -1, derivClose)
		approx.CheckPtr(t, id+" tolerance_mm", rowOf(t, r, id).ToleranceMM, zR, derivClose)
	}
	// The geometric depth of focus is still given beside it, and agrees with the system's own NA (self-consistency).
	na := value(t, "system.image_na", r.System.ImageNA)
	approx.CheckPtr(t, "depth_of_focus_mm", r.SpacingBasis.DepthOfFocusMM, lambdaHeNeMM/(2*na*na), approx.VeryClose)
	for _, id := range []string{"M2", "CAM"} {
		approx.CheckPtr(t, id+" defocus_per_mm", rowOf(t, r, id).DefocusPerMM, -1, derivClose)
	}

	var n float64
	for _, m := range r.Media {
		if m.Material == "fused-silica" && m.WavelengthNM == 632.8 {
			n = m.Index
		}
	}
	fL2 := 68.6 / (n - 1)
	m := 250 / fL2
	for _, id := range []string{"PH", "L2"} {
		approx.CheckPtr(t, id+" defocus_per_mm", rowOf(t, r, id).DefocusPerMM, -m*m, demoAfocal)
	}

	tightest := math.Inf(1)
	for _, row := range r.Spacing {
		if row.ToleranceMM != nil {
			tightest = math.Min(tightest, *row.ToleranceMM)
		}
	}
	if l2 := rowOf(t, r, "L2").ToleranceMM; l2 == nil || !approx.Rel(*l2, tightest, approx.VeryClose) {
		t.Errorf("L2 tolerance %s is not the tightest, %g mm", fmtPtr(l2), tightest)
	}
	if testing.Verbose() {
		for _, row := range r.Spacing {
			t.Logf("%-4s gap %-7g shift %s defocus %s tolerance %s", row.ID, row.GapMM, fmtPtr(row.ImageShiftPerMM), fmtPtr(row.DefocusPerMM), fmtPtr(row.ToleranceMM))
		}
		t.Logf("basis %s at %s: depth of focus %s mm, NA' %s", r.SpacingBasis.Kind, r.SpacingBasis.Reference, fmtPtr(r.SpacingBasis.DepthOfFocusMM), fmtPtr(r.SpacingBasis.ImageNA))
	}
}

func fmtPtr(v *float64) string {
	if v == nil {
		return "null"
	}
	return strconv.FormatFloat(*v, 'g', 6, 64)
}

func loadDemo(t testing.TB) *optics.Bench { return benchtest.Load(t, "demo-bench.json") }

// longBench is a valid bench of optics.MaxElements elements: repeated groups of a glass singlet,
// an iris, a thin lens and a fold mirror, ending on a screen.
func longBench(tb testing.TB) *optics.Bench {
	tb.Helper()
	var elems []string
	for i := 0; len(elems) < optics.MaxElements-1; i++ {
		n := strconv.Itoa(i)
		switch i % 4 {
		case 0:
			elems = append(elems, `{"id":"L`+n+`","type":"lens","gap_mm":40,"faces_mm":[60,null],"thicknesses_mm":[4],"materials":["fused-silica"],"diameter_mm":25.4}`)
		case 1:
			elems = append(elems, `{"id":"A`+n+`","type":"aperture","gap_mm":40,"diameter_mm":20}`)
		case 2:
			elems = append(elems, `{"id":"F`+n+`","type":"thin-lens","gap_mm":40,"focal_mm":80,"diameter_mm":25.4}`)
		default:
			turn := "90"
			if i%8 == 7 {
				turn = "-90"
			}
			elems = append(elems, `{"id":"M`+n+`","type":"mirror","gap_mm":40,"radius_mm":null,"turn_deg":`+turn+`,"diameter_mm":25.4}`)
		}
	}
	elems = append(elems, `{"id":"CAM","type":"screen","gap_mm":40}`)
	list := elems[0]
	for _, e := range elems[1:] {
		list += "," + e
	}
	b, err := optics.Decode([]byte(spacingBench(`"kind":"collimated","semi_diameter_mm":2`, list)))
	if err != nil {
		tb.Fatal(err)
	}
	if len(b.Elements) != optics.MaxElements {
		tb.Fatalf("%d elements", len(b.Elements))
	}
	if err := optics.Validate(b); err != nil {
		tb.Fatal(err)
	}
	return b
}

// BenchmarkSpacingTolerances is the spacing table of a 200-element bench: 400 path rebuilds.
func BenchmarkSpacingTolerances(b *testing.B) {
	bench := longBench(b)
	p := optics.BuildPath(bench)
	tan := paraxial.Analyze(bench, p, 0, paraxial.Tangential)
	if rows, _ := SpacingTolerances(bench, p, tan); len(rows) != optics.MaxElements {
		b.Fatalf("%d rows", len(rows))
	}
	b.ReportAllocs()
	for b.Loop() {
		SpacingTolerances(bench, p, tan)
	}
}

// BenchmarkRunLong is the whole report of the same bench, to set the spacing table's share.
func BenchmarkRunLong(b *testing.B) {
	bench := longBench(b)
	for b.Loop() {
		if _, err := Run(bench); err != nil {
			b.Fatal(err)
		}
	}
}
