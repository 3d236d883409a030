package paraxial

import (
	"math"
	"math/rand/v2"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// finiteValues fails when a reported number is NaN or infinite: the report is JSON, which has
// neither, so such a value must be nil instead.
func finiteValues(t *testing.T, name string, v optics.PlaneValues) {
	t.Helper()
	ptrs := map[string]*float64{
		"efl": v.EFLMM, "bfl": v.BFLMM, "ffl": v.FFLMM, "front_principal": v.FrontPrincipalMM,
		"rear_principal": v.RearPrincipalMM, "front_nodal": v.FrontNodalMM, "rear_nodal": v.RearNodalMM,
		"image_distance": v.ImageDistanceMM, "magnification": v.Magnification,
		"angular_magnification": v.AngularMagnification, "f_number": v.FNumber, "image_na": v.ImageNA,
		"entrance_pupil": v.EntrancePupilMM, "entrance_pupil_radius": v.EntrancePupilRadiusMM,
		"exit_pupil": v.ExitPupilMM, "exit_pupil_radius": v.ExitPupilRadiusMM,
		"lagrange": v.LagrangeInvariant, "image_height": v.ImageHeightMM,
	}
	for key, p := range ptrs {
		if p != nil && (math.IsNaN(*p) || math.IsInf(*p, 0)) {
			t.Errorf("%s: %s = %v", name, key, *p)
		}
	}
	for _, row := range v.ABCD {
		for _, x := range row {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				t.Errorf("%s: abcd %v", name, v.ABCD)
			}
		}
	}
}

func TestEdgeCasesStayFinite(t *testing.T) {
	zero := 0.0
	noSemi := &optics.Bench{Source: optics.Source{Kind: optics.SourceCollimated, FieldAnglesDeg: []float64{1}}}
	noNA := &optics.Bench{Source: optics.Source{Kind: optics.SourcePoint, ObjectHeightsMM: []float64{1}}}
	zeroSemi := &optics.Bench{Source: optics.Source{Kind: optics.SourceCollimated, SemiDiameterMM: &zero}}
	cases := []struct {
		name  string
		bench *optics.Bench
		path  *optics.Path
	}{
		{"empty path", collimated(2, 1), newPath().path()},
		{"planes only", pointSource(0.1, 1), newPath().plane("A", 10, 1).plane("S", 10, 0).path()},
		{"no semi-diameter", noSemi, newPath().thin("L", 10, 50, 5).path()},
		{"no NA", noNA, newPath().thin("L", 10, 50, 5).path()},
		{"zero semi-diameter", zeroSemi, newPath().thin("L", 10, 50, 5).path()},
		{"object at the front focus", pointSource(0.1, 1), newPath().thin("L", 50, 50, 0).path()},
		{"stop at a focus", collimated(5, 1), newPath().thin("L", 10, 50, 0).plane("A", 50, 1).path()},
		{"flat mirrors", collimated(5, 1), newPath().mirror("M1", 10, 0, 45, 10).mirror("M2", 10, 0, 45, 10).path()},
		{"telecentric relay", pointSource(0.05, 2),
			newPath().thin("A", 100, 100, 0).plane("STOP", 100, 3).thin("B", 50, 50, 0).path()},
	}
	for _, tc := range cases {
		for _, plane := range []Plane{Tangential, Sagittal} {
			res := Analyze(tc.bench, tc.path, 0, plane)
			finiteValues(t, tc.name, res.Values)
		}
	}
	rng := rand.New(rand.NewPCG(1, 4))
	for trial := 0; trial < 200; trial++ {
		p := randomPath(rng, 1+rng.IntN(12))
		for _, b := range []*optics.Bench{collimated(3, 0.5), pointSource(0.2, 2), collimated(3, 0)} {
			finiteValues(t, "random", Analyze(b, p, 0, Tangential).Values)
		}
	}
}

func TestTelecentricRelay(t *testing.T) {
	// Object at the front focus of A (f 100), stop at the common focus, B (f 50) one focal length
	// after it: a doubly telecentric relay. Its magnification is -f_B/f_A and both pupils are at
	// infinity (Smith, Modern Optical Engineering, telecentric systems, from memory).
	p := newPath().thin("A", 100, 100, 0).plane("STOP", 100, 3).thin("B", 50, 50, 0).path()
	res := Analyze(pointSource(0.05, 2), p, 0, Tangential)
	v := res.Values
	if !v.Afocal || v.ApertureStop != "STOP" {
		t.Fatalf("afocal %v stop %q, want afocal with STOP", v.Afocal, v.ApertureStop)
	}
	approx.CheckPtr(t, "magnification", v.Magnification, -0.5, approx.Rounding)
	approx.CheckPtr(t, "image_distance_mm", v.ImageDistanceMM, 50, approx.Rounding)
	checkNil(t, "entrance_pupil_mm", v.EntrancePupilMM)
	checkNil(t, "exit_pupil_mm", v.ExitPupilMM)
}

func TestCardinalsAtEveryWavelength(t *testing.T) {
	// The same singlet with a different index at the second wavelength: each wavelength's EFL
	// follows Gullstrand's formula with its own index (Hecht, Optics, 4th ed., eq. 6.2, from memory).
	const r1, r2, thick = 60.0, -60.0, 5.0
	nByWavelength := []float64{1.5168, 1.5224}
	b := newPath(587.6, 486.1).lens("L", 40, 0, []float64{r1, r2}, []float64{thick}, []float64{1})
	b.p.Surfaces[0].Index = nByWavelength
	for k, n := range nByWavelength {
		p1, p2 := (n-1)/r1, (1-n)/r2
		c := Cardinals(b.path(), k, Tangential, nil)
		approx.CheckPtr(t, "efl_mm", c.EFLMM, 1/(p1+p2-thick/n*p1*p2), approx.Rounding)
		approx.Check(t, "wavelength_nm", c.WavelengthNM, b.p.WavelengthsNM[k], 0)
	}
}
