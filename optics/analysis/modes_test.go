package analysis

import (
	"fmt"
	"math"
	"testing"

	"raytable/optics"
)

// modesTable is a large table with the source near its left edge, for the benches of this file.
const modesTable = `"table":{"grid":"none","width_mm":2000,"depth_mm":1000,"beam_height_mm":75}`

// waistFor is the beam waist after a thin lens of focal length f whose input waist w0 lies d in
// front of it (zR its Rayleigh range): at d' = f + (d - f) f² / ((d - f)² + zR²) behind the lens,
// of radius w0 f / sqrt((d - f)² + zR²) (Kogelnik and Li, Applied Optics 5, 1550, 1966; from memory).
func waistFor(w0, d, f, wavelengthNM float64) (dAfter, w float64) {
	zR := math.Pi * w0 * w0 / (wavelengthNM * 1e-6)
	den := (d-f)*(d-f) + zR*zR
	return f + (d-f)*f*f/den, w0 * f / math.Sqrt(den)
}

// freeRadius is a beam of waist w0 at distance z from it: w0 sqrt(1 + (z/zR)²) (Kogelnik and Li 1966).
func freeRadius(w0, z, wavelengthNM float64) float64 {
	zR := math.Pi * w0 * w0 / (wavelengthNM * 1e-6)
	return w0 * math.Sqrt(1+(z/zR)*(z/zR))
}

// TestCylindricalThinLensFocusesALine: a round beam through a cylindrical thin lens has its focal
// line where the thin-lens law of Kogelnik and Li 1966 puts the waist, with that radius, in the
// plane across the cylinder's axis, while the other plane spreads as in free space.
func TestCylindricalThinLensFocusesALine(t *testing.T) {
	const wl, w0, d, f, screen = 632.8, 0.5, 50.0, 100.0, 300.0
	for _, axis := range []string{optics.CylinderVertical, optics.CylinderHorizontal} {
		rep := mustRun(t, fmt.Sprintf(`{"format":"raytable/bench/v1","wavelengths_nm":[%g],%s,
 "source":{"x_mm":100,"y_mm":500,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1,
   "beam":{"waist_radius_mm":%g,"waist_at_mm":0}},
 "elements":[{"id":"C","type":"thin-lens","gap_mm":%g,"focal_mm":%g,"cylinder_axis":%q},{"id":"S","type":"screen","gap_mm":%g}]}`,
			wl, modesTable, w0, d, f, axis, screen))
		dAfter, wFocus := waistFor(w0, d, f, wl)
		var found bool
		for _, w := range rep.Beam.Waists {
			power, other := w.RadiusTMM, w.RadiusSMM
			if axis == optics.CylinderHorizontal {
				power, other = other, power
			}
			if power == nil || w.PathMM <= d {
				continue
			}
			found = true
			if math.Abs(w.PathMM-(d+dAfter)) > 1e-6 || math.Abs(*power-wFocus) > 1e-9 || other != nil {
				t.Errorf("%s axis: focal line at %.6f mm of radius %.9f (other plane %v), want %.6f mm and %.9f (Kogelnik and Li 1966)",
					axis, w.PathMM, *power, other, d+dAfter, wFocus)
			}
		}
		if !found {
			t.Errorf("%s axis: no focal line after the lens in %+v", axis, rep.Beam.Waists)
		}
		at := rep.Beam.Elements[len(rep.Beam.Elements)-1]
		untouched := at.WSMM
		if axis == optics.CylinderHorizontal {
			untouched = at.WTMM
		}
		if want := freeRadius(w0, d+screen, wl); math.Abs(untouched-want) > 1e-12 {
			t.Errorf("%s axis: the other plane at the screen is %.12f mm, want %.12f as in free space (Kogelnik and Li 1966)", axis, untouched, want)
		}
	}
}

// TestCylindricalLensExactTrace: through a plano-convex cylindrical lens with a vertical axis, a
// ray near the axis in the table plane crosses the axis at the paraxial back focus, and a ray
// displaced only vertically leaves undeviated (the face is straight along the axis), while the
// paraxial vertical plane is afocal (definition of a cylinder).
func TestCylindricalLensExactTrace(t *testing.T) {
	rep := mustRun(t, `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],`+modesTable+`,
 "source":{"x_mm":100,"y_mm":500,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1,
   "rays":[{"height_mm":0.001,"angle_deg":0},{"height_mm":0,"angle_deg":0,"x_mm":3,"x_angle_deg":0}]},
 "elements":[{"id":"C","type":"lens","gap_mm":50,"faces_mm":[40,null],"thicknesses_mm":[4],"materials":["fused-silica"],"diameter_mm":25,"cylinder_axis":"vertical"},
   {"id":"S","type":"screen","gap_mm":200}]}`)
	bfl := value(t, "bfl_mm", rep.System.BFLMM)
	if rep.System.Sagittal.EFLMM != nil {
		t.Errorf("vertical plane EFL %v, want none: a cylinder has no power along its axis", *rep.System.Sagittal.EFLMM)
	}
	table, vertical := rep.Rays[0], rep.Rays[1]
	out := table.Hits[1].Exact // leaving the flat face
	if cross := -out.YMM * out.Dir[2] / out.Dir[1]; math.Abs(cross-bfl) > 1e-4*bfl {
		t.Errorf("table-plane ray crosses the axis %.6f mm after the lens, want the paraxial BFL %.6f mm", cross, bfl)
	}
	if d := vertical.Hits[1].Exact.Dir; d[0] != 0 || d[1] != 0 || vertical.Hits[2].Exact.XMM != 3 {
		t.Errorf("vertical ray leaves with direction %v at x %v, want (0, 0, 1) at 3 mm", d, vertical.Hits[2].Exact.XMM)
	}
}

// TestCylindricalTelescopeRoundsADiodeBeam: a diode beam 3:1 elliptical (0.6 mm in the table plane,
// 1.8 mm vertically, waists at the source) is made round by a 3x Galilean telescope of cylindrical
// thin lenses acting in the table plane (f = -50 and 150 mm, 100 mm apart, our own scenario): at a
// screen 200 mm after it the two radii agree within 1 %, and the vertical one is as in free space.
func TestCylindricalTelescopeRoundsADiodeBeam(t *testing.T) {
	const wl = 780.0
	rep := mustRun(t, `{"format":"raytable/bench/v1","wavelengths_nm":[780],`+modesTable+`,
 "source":{"x_mm":100,"y_mm":500,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1,
   "beam":{"waist_radius_mm":0.6,"waist_at_mm":0,"m2":1.1,"sagittal":{"waist_radius_mm":1.8,"waist_at_mm":0,"m2":1.3}}},
 "elements":[{"id":"C1","type":"thin-lens","gap_mm":30,"focal_mm":-50,"cylinder_axis":"vertical"},
   {"id":"C2","type":"thin-lens","gap_mm":100,"focal_mm":150,"cylinder_axis":"vertical"},
   {"id":"S","type":"screen","gap_mm":200}]}`)
	at := rep.Beam.Elements[len(rep.Beam.Elements)-1]
	if r := at.ArrivingWTMM / at.ArrivingWSMM; math.Abs(r-1) > 0.01 {
		t.Errorf("at the screen w_t %.4f mm and w_s %.4f mm differ by %.2f %%, want within 1 %%", at.ArrivingWTMM, at.ArrivingWSMM, 100*(r-1))
	}
	if want := freeRadius(1.8, 330, wl*1.3); math.Abs(at.ArrivingWSMM-want) > 1e-12 {
		t.Errorf("vertical radius %.12f, want %.12f (free space with M² 1.3, Siegman 1986)", at.ArrivingWSMM, want)
	}
}

// TestFibreToFibreCoupling: a fibre's mode collimated, expanded 3x and refocused by thin lenses
// into a second fibre of the same mode, with the second fibre a little past the refocused waist.
// The coupling is the mode-matching value 4/((w1/w2 + w2/w1)² + (λ z/(π w1 w2))²) of the
// refocused waist w1 at distance z from the face (Kogelnik, from memory), and the lateral and
// angular 1 dB offsets are Marcuse's (1977) for the beam arriving at the face.
func TestFibreToFibreCoupling(t *testing.T) {
	const wl, mfd = 1064.0, 6.2
	for _, past := range []float64{0, 0.02, -0.05} {
		rep := mustRun(t, fmt.Sprintf(`{"format":"raytable/bench/v1","wavelengths_nm":[%g],%s,
 "source":{"x_mm":100,"y_mm":500,"heading_deg":0,"kind":"fiber","mfd_um":%g},
 "elements":[{"id":"F1","type":"thin-lens","gap_mm":8,"focal_mm":8},
   {"id":"F2","type":"thin-lens","gap_mm":50,"focal_mm":-25},
   {"id":"F3","type":"thin-lens","gap_mm":50,"focal_mm":75},
   {"id":"F4","type":"thin-lens","gap_mm":100,"focal_mm":24},
   {"id":"FC","type":"fiber","gap_mm":%g,"mfd_um":%g}]}`, wl, modesTable, mfd, 24+past, mfd))
		if len(rep.Coupling) != 1 {
			t.Fatalf("past %v: coupling %+v, want one row", past, rep.Coupling)
		}
		c := rep.Coupling[0]
		// The waist of the beam arriving at the face, from its radius w and curvature R there:
		// w1 = w / sqrt(1 + (π w²/(λ R))²), the face z = R / (1 + (λ R/(π w²))²) past it
		// (Kogelnik and Li 1966, from memory).
		at := rep.Beam.Elements[len(rep.Beam.Elements)-1]
		lam := wl * 1e-6
		w, z, w1 := at.ArrivingWTMM, 0.0, at.ArrivingWTMM
		if at.RTMM != nil {
			R := *at.RTMM
			w1 = w / math.Sqrt(1+math.Pow(math.Pi*w*w/(lam*R), 2))
			z = R / (1 + math.Pow(lam*R/(math.Pi*w*w), 2))
		}
		w2 := mfd / 2000
		r := w1/w2 + w2/w1
		x := lam * z / (math.Pi * w1 * w2)
		if want := 4 / (r*r + x*x); math.Abs(c.Efficiency-want) > 1e-9 {
			t.Errorf("past %v: coupling %.12f, want %.12f (Kogelnik, from memory)", past, c.Efficiency, want)
		}
		if past == 0 && c.Efficiency < 0.999 {
			t.Errorf("a matched refocus couples %.6f, want above 0.999", c.Efficiency)
		}
		arriving := at.ArrivingWTMM
		if past == 0 {
			s := arriving*arriving + w2*w2
			ln := math.Log(1 / math.Pow(10, -0.1))
			if want := math.Sqrt(s / 2 * ln); math.Abs(value(t, "lateral", c.LateralMM)/want-1) > 1e-3 {
				t.Errorf("lateral 1 dB %.6g mm, want %.6g (Marcuse 1977)", *c.LateralMM, want)
			}
			if want := 1000 * wl * 1e-6 / math.Pi * math.Sqrt(s/(2*arriving*arriving*w2*w2)*ln); math.Abs(value(t, "angular", c.AngularMrad)/want-1) > 1e-3 {
				t.Errorf("angular 1 dB %.6g mrad, want %.6g (Marcuse 1977)", *c.AngularMrad, want)
			}
		}
		// The shift dz that brings 4/(r² + x(z + dz)²) to 0.794 of its value, the smaller either way.
		far := math.Sqrt((r*r+x*x)/math.Pow(10, -0.1)-r*r) * math.Pi * w1 * w2 / lam
		if want := math.Min(math.Abs(far-z), math.Abs(-far-z)); math.Abs(value(t, "axial", c.AxialMM)/want-1) > 1e-6 {
			t.Errorf("past %v: axial 1 dB %.6g mm, want %.6g (Kogelnik, from memory)", past, *c.AxialMM, want)
		}
	}
}
