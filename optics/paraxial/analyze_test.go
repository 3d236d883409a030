package paraxial

import (
	"math"
	"math/rand/v2"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

func TestLagrangeInvariantConserved(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	benches := []*optics.Bench{collimated(4, 0, 2.5), pointSource(0.08, 0, -1.5)}
	for trial := 0; trial < 40; trial++ {
		p := randomPath(rng, 3+rng.IntN(25))
		for _, b := range benches {
			for _, plane := range []Plane{Tangential, Sagittal} {
				res := Analyze(b, p, 0, plane)
				h := *res.Values.LagrangeInvariant
				if h == 0 {
					t.Fatalf("trial %d: Lagrange invariant is 0 with a non-zero field", trial)
				}
				// The Lagrange invariant n(ū y - u ȳ) is the same at every surface of a paraxial
				// system (Welford, Aberrations of Optical Systems, 1986, ch. 3, from memory).
				for i, hi := range res.Lagrange {
					if !approx.Rel(hi, h, approx.Rounding) {
						t.Fatalf("trial %d %s plane %d: H at surface %d = %.15g, at the source %.15g",
							trial, b.Source.Kind, plane, i, hi, h)
					}
				}
			}
		}
	}
}

func TestApertureStopChoice(t *testing.T) {
	cases := []struct {
		name  string
		bench *optics.Bench
		path  *optics.Path
		want  string
	}{
		// Collimated beam of radius 5 into a lens f=100 of radius 12.7; an iris 20 mm behind it
		// sees the marginal ray at 5(1 - 20/100) = 4 mm (similar triangles, from memory).
		{"iris smaller than the converging beam", collimated(5, 1),
			newPath().thin("L1", 50, 100, 12.7).plane("A1", 20, 2).path(), "A1"},
		{"lens smaller than the beam", collimated(5, 1),
			newPath().thin("L1", 50, 100, 3).plane("A1", 20, 5).path(), "L1"},
		{"everything larger than the beam", collimated(5, 1),
			newPath().thin("L1", 50, 100, 12.7).plane("A1", 20, 4.5).path(), StopSource},
		// Point source, NA 0.1: at a lens 100 mm away the cone has radius 10 mm.
		{"lens cuts the cone", pointSource(0.1, 1),
			newPath().plane("A1", 20, 2.5).thin("L1", 80, 50, 8).path(), "L1"},
		{"iris cuts the cone more", pointSource(0.1, 1),
			newPath().plane("A1", 20, 1.5).thin("L1", 80, 50, 8).path(), "A1"},
		{"a thick lens face limits", collimated(5),
			newPath().lens("L1", 30, 4, []float64{50, -50}, []float64{5}, []float64{1.5}).path(), "L1"},
		{"an iris after a dump gets no light", collimated(5),
			newPath().thin("L1", 50, 100, 0).add("D1", 10, nil, optics.Surface{Kind: optics.Plane, Stops: true}).
				plane("A1", 10, 0.1).path(), StopSource},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			res := Analyze(tc.bench, tc.path, 0, Tangential)
			if res.Values.ApertureStop != tc.want {
				t.Errorf("aperture_stop = %q, want %q", res.Values.ApertureStop, tc.want)
			}
			// The marginal ray fills the stop exactly and passes every other aperture.
			for i, s := range tc.path.Surfaces {
				y := math.Abs(res.Marginal[i].Y)
				if i == res.StopSurface {
					approx.Check(t, "marginal height at the stop", y, s.SemiAperture, approx.Rounding)
				} else if y > s.SemiAperture*(1+approx.Rounding) && !s.Stops && (i == 0 || !tc.path.Surfaces[i-1].Stops) {
					t.Errorf("marginal ray at %s = %g exceeds its semi-aperture %g", s.ID, y, s.SemiAperture)
				}
			}
			// The chief ray crosses the axis at the stop.
			if res.StopSurface >= 0 && !approx.Abs(res.Chief[res.StopSurface].Y, 0, approx.Rounding) {
				t.Errorf("chief ray at the stop = %g, want 0", res.Chief[res.StopSurface].Y)
			}
		})
	}
}

func TestTiltedMirrorApertureInTheTablePlane(t *testing.T) {
	// A round mirror of radius 5 met at 45°: its footprint on the mirror is stretched by 1/cos i
	// along the tilt, so across the beam it passes only 5 cos 45° = 3.54 mm in the table plane and
	// the full 5 mm vertically (projection of a tilted circle, common practice).
	p := newPath().mirror("M1", 50, 0, 45, 5).plane("S", 50, 0).path()
	b := collimated(4, 0.5)
	tan := Analyze(b, p, 0, Tangential)
	sag := Analyze(b, p, 0, Sagittal)
	if tan.Values.ApertureStop != "M1" || sag.Values.ApertureStop != StopSource {
		t.Errorf("aperture_stop tangential %q sagittal %q, want M1 and source",
			tan.Values.ApertureStop, sag.Values.ApertureStop)
	}
	approx.Check(t, "tangential marginal height", tan.Marginal[0].Y, 5*math.Cos(math.Pi/4), approx.Rounding)
	approx.Check(t, "sagittal marginal height", sag.Marginal[0].Y, 4, approx.Rounding)
}

func TestEntrancePupilOfStopBehindThinLens(t *testing.T) {
	const f, stopRadius = 100.0, 2.0
	for _, d := range []float64{50, 30, 150, 250} {
		p := newPath().thin("L", 60, f, 0).plane("STOP", d, stopRadius).path()
		res := Analyze(collimated(10, 1), p, 0, Tangential)
		if res.Values.ApertureStop != "STOP" {
			t.Fatalf("d=%g: aperture_stop = %q, want STOP", d, res.Values.ApertureStop)
		}
		// The entrance pupil is the image of the stop through the lens, seen from the front. The
		// Gaussian lens equation 1/s_o + 1/s_i = 1/f (Hecht, Optics, 4th ed., eq. 5.17, from
		// memory) with the stop as an object d behind the lens, looking back, puts the image at
		// s_i = f d/(d - f) in front of the lens, i.e. f d/(f - d) downstream of it, with
		// magnification f/(f - d).
		approx.CheckPtr(t, "entrance_pupil_mm", res.Values.EntrancePupilMM, f*d/(f-d), tolImaging)
		approx.CheckPtr(t, "entrance_pupil_radius_mm", res.Values.EntrancePupilRadiusMM, stopRadius*math.Abs(f/(f-d)), tolImaging)
		// Nothing follows the lens but the stop, so the exit pupil is the stop itself.
		approx.CheckPtr(t, "exit_pupil_mm", res.Values.ExitPupilMM, d, tolImaging)
		approx.CheckPtr(t, "exit_pupil_radius_mm", res.Values.ExitPupilRadiusMM, stopRadius, tolImaging)
	}
}

func TestExitPupilOfStopBeforeThinLens(t *testing.T) {
	const f, stopRadius, d = 100.0, 3.0, 50.0
	p := newPath().plane("STOP", 20, stopRadius).thin("L", d, f, 0).path()
	res := Analyze(collimated(10, 2), p, 0, Tangential)
	// Gaussian lens equation (Hecht, Optics, 4th ed., eq. 5.17, from memory): a stop d = 50 mm in
	// front of f = 100 mm images to s_i = 1/(1/f - 1/d) = -100 mm, a virtual image 100 mm in front
	// of the lens, magnified -s_i/s_o = 2.
	approx.CheckPtr(t, "exit_pupil_mm", res.Values.ExitPupilMM, -100, tolImaging)
	approx.CheckPtr(t, "exit_pupil_radius_mm", res.Values.ExitPupilRadiusMM, 2*stopRadius, tolImaging)
	// The stop is in object space: it is its own entrance pupil.
	approx.CheckPtr(t, "entrance_pupil_mm", res.Values.EntrancePupilMM, -d, tolImaging)
	approx.CheckPtr(t, "entrance_pupil_radius_mm", res.Values.EntrancePupilRadiusMM, stopRadius, tolImaging)
	// f-number of a system focused at infinity: N = f / D, D the entrance pupil diameter
	// (Hecht, Optics, 4th ed., sec. 5.3.3, from memory).
	approx.CheckPtr(t, "f_number", res.Values.FNumber, f/(2*stopRadius), tolImaging)
	// Image NA for a collimated beam: the marginal ray leaves at slope D/2 / f.
	approx.CheckPtr(t, "image_na", res.Values.ImageNA, stopRadius/f, tolImaging)
	// Image height at the focal plane: f tan(field) (Hecht, Optics, sec. 5.7, from memory).
	approx.CheckPtr(t, "image_height_mm", res.Values.ImageHeightMM, f*math.Tan(2*math.Pi/180), tolImaging)
}

func TestFiniteConjugates(t *testing.T) {
	// Point object 200 mm in front of a thin lens f = 100: image 200 mm behind, magnification -1
	// (Gaussian lens equation, Hecht, Optics, 4th ed., eqs. 5.17 and 5.24, from memory).
	const f, s, na, h = 100.0, 200.0, 0.05, 1.5
	p := newPath().thin("L", s, f, 0).plane("CAM", 2*f, 0).path()
	res := Analyze(pointSource(na, 0, h), p, 0, Tangential)
	v := res.Values
	if v.ApertureStop != StopSource {
		t.Errorf("aperture_stop = %q, want the source", v.ApertureStop)
	}
	approx.CheckPtr(t, "image_distance_mm", v.ImageDistanceMM, 200, tolImaging)
	approx.CheckPtr(t, "magnification", v.Magnification, -1, tolImaging)
	approx.CheckPtr(t, "image_height_mm", v.ImageHeightMM, -h, tolImaging)
	// Unit magnification keeps the NA: image NA = NA / |m| in the paraxial (Abbe sine) limit
	// (Born and Wolf, Principles of Optics, sec. 4.5, from memory); working f-number 1/(2 NA)
	// (common practice).
	approx.CheckPtr(t, "image_na", v.ImageNA, na, tolImaging)
	approx.CheckPtr(t, "f_number", v.FNumber, 1/(2*na), tolImaging)
	// The source limits the cone by angle at every object point: the chief ray leaves parallel
	// to the axis and the entrance pupil is at infinity; the exit pupil is then the rear focal
	// plane.
	checkNil(t, "entrance_pupil_mm", v.EntrancePupilMM)
	approx.CheckPtr(t, "exit_pupil_mm", v.ExitPupilMM, f, tolImaging)
	// H = n u h at the object for a chief ray from the object point (Welford, Aberrations of
	// Optical Systems, 1986, from memory), here n ū y - n u ȳ = -NA·h.
	approx.CheckPtr(t, "lagrange_invariant_mm", v.LagrangeInvariant, -na*h, approx.Rounding)
}

func TestZeroFieldStillGivesPupils(t *testing.T) {
	const f, stopRadius, d = 100.0, 2.0, 50.0
	p := newPath().thin("L", 60, f, 0).plane("STOP", d, stopRadius).path()
	res := Analyze(collimated(10, 0), p, 0, Tangential)
	// The pupil does not depend on the field: the Gaussian lens equation as in
	// TestEntrancePupilOfStopBehindThinLens; with no field, no invariant and no image height.
	if !res.UnitField {
		t.Error("UnitField = false with only a zero field")
	}
	approx.CheckPtr(t, "entrance_pupil_mm", res.Values.EntrancePupilMM, f*d/(f-d), tolImaging)
	approx.CheckPtr(t, "lagrange_invariant_mm", res.Values.LagrangeInvariant, 0, 0)
	approx.CheckPtr(t, "image_height_mm", res.Values.ImageHeightMM, 0, 0)
}

func TestAfocalHasNoFNumber(t *testing.T) {
	p := newPath().thin("O", 50, 100, 0).thin("E", 125, 25, 0).path()
	res := Analyze(collimated(5, 1), p, 0, Tangential)
	checkNil(t, "f_number", res.Values.FNumber)
	checkNil(t, "image_height_mm", res.Values.ImageHeightMM)
	// The collimated beam of radius 5 leaves with radius 5·f2/f1 (beam expander ratio, from memory)
	// and zero slope.
	approx.CheckPtr(t, "image_na", res.Values.ImageNA, 0, approx.Rounding)
	approx.Check(t, "output beam radius", math.Abs(res.Marginal[1].Y), 5*25.0/100, approx.Rounding)
}
