package paraxial

import (
	"math"
	"testing"

	"raytable/optics/internal/approx"
)

// Tolerances of the paraxial tests beyond approx's shared ones (approx.Rounding for closed forms
// that should agree to rounding), relative to max(|want|, 1) as approx.Check takes them.
const (
	tolThin = 1e-6 // a lens 1e-6 mm thick against the thin-lens limit
	// tolImaging is for pupils, images and magnifications, which the code finds by solving for a
	// conjugate (a division by a difference of matrix terms); rounding leaves below 1e-14 on
	// these cases.
	tolImaging = 1e-10
)

type singlet struct {
	name          string
	r1, r2, t, n  float64 // face radii (0 flat), centre thickness, index
	wantFiniteEFL bool
}

var singlets = []singlet{
	{"biconvex", 50, -50, 5, 1.5, true},
	{"meniscus", 30, 80, 4, 1.7, true},
	{"plano-convex flat first", 0, -40, 6, 1.46, true},
	{"plano-convex curved first", 40, 0, 6, 1.46, true},
	{"biconcave", -60, 45, 2.5, 1.62, true},
	{"thick ball-like", 10, -10, 15, 1.8, true},
}

func singletPath(s singlet) *pathBuilder {
	return newPath().lens("L", 100, 0, []float64{s.r1, s.r2}, []float64{s.t}, []float64{s.n})
}

func TestThickSingletMatchesGullstrand(t *testing.T) {
	for _, s := range singlets {
		t.Run(s.name, func(t *testing.T) {
			c := Cardinals(singletPath(s).path(), 0, Tangential, nil)
			p1 := (s.n - 1) * radiusCurvature(s.r1)
			p2 := (1 - s.n) * radiusCurvature(s.r2)
			// Gullstrand's thick-lens power: P = P1 + P2 - (t/n) P1 P2 (Hecht, Optics, 4th ed.,
			// eq. 6.2 in lensmaker form, from memory).
			power := p1 + p2 - s.t/s.n*p1*p2
			f := 1 / power
			approx.CheckPtr(t, "efl_mm", c.EFLMM, f, approx.Rounding)
			// Principal planes of a thick lens in air, measured from each vertex, + downstream:
			// h1 = -f (n-1) t / (n R2), h2 = -f (n-1) t / (n R1) (Hecht, Optics, 4th ed., eqs.
			// 6.3 and 6.4, from memory).
			h1 := -f * (s.n - 1) * s.t * radiusCurvature(s.r2) / s.n
			h2 := -f * (s.n - 1) * s.t * radiusCurvature(s.r1) / s.n
			approx.CheckPtr(t, "front_principal_mm", c.FrontPrincipalMM, h1, approx.Rounding)
			approx.CheckPtr(t, "rear_principal_mm", c.RearPrincipalMM, h2, approx.Rounding)
			// In air the focal points lie f from the principal planes and the nodal points
			// coincide with them (Hecht, Optics, sec. 6.1, from memory).
			approx.CheckPtr(t, "bfl_mm", c.BFLMM, f+h2, approx.Rounding)
			approx.CheckPtr(t, "ffl_mm", c.FFLMM, f-h1, approx.Rounding)
			approx.CheckPtr(t, "front_nodal_mm", c.FrontNodalMM, h1, approx.Rounding)
			approx.CheckPtr(t, "rear_nodal_mm", c.RearNodalMM, h2, approx.Rounding)
			if c.Afocal {
				t.Error("afocal = true for a singlet with power")
			}
		})
	}
}

func TestThinLensLimitMatchesLensmaker(t *testing.T) {
	for _, s := range singlets {
		t.Run(s.name, func(t *testing.T) {
			s.t = 1e-6
			c := Cardinals(singletPath(s).path(), 0, Tangential, nil)
			// Lensmaker's equation: 1/f = (n - 1)(1/R1 - 1/R2) (Hecht, Optics, 4th ed., eq. 5.16,
			// from memory).
			f := 1 / ((s.n - 1) * (radiusCurvature(s.r1) - radiusCurvature(s.r2)))
			approx.CheckPtr(t, "efl_mm", c.EFLMM, f, tolThin)
			approx.CheckPtr(t, "bfl_mm", c.BFLMM, f, tolThin)
			approx.CheckPtr(t, "ffl_mm", c.FFLMM, f, tolThin)
		})
	}
}

func TestSeparatedThinLenses(t *testing.T) {
	cases := []struct{ f1, f2, d float64 }{
		{100, 50, 30}, {100, -50, 20}, {-80, 40, 60}, {200, 200, 10},
	}
	for _, tc := range cases {
		p := newPath().thin("A", 50, tc.f1, 0).thin("B", tc.d, tc.f2, 0).path()
		c := Cardinals(p, 0, Tangential, nil)
		// Two thin lenses in air: 1/f = 1/f1 + 1/f2 - d/(f1 f2), back focal length
		// f2 (d - f1)/(d - (f1 + f2)) = f (f1 - d)/f1 and front focal length f (f2 - d)/f2
		// (Hecht, Optics, 4th ed., sec. 6.1, from memory).
		f := 1 / (1/tc.f1 + 1/tc.f2 - tc.d/(tc.f1*tc.f2))
		approx.CheckPtr(t, "efl_mm", c.EFLMM, f, approx.Rounding)
		approx.CheckPtr(t, "bfl_mm", c.BFLMM, f*(tc.f1-tc.d)/tc.f1, approx.Rounding)
		approx.CheckPtr(t, "ffl_mm", c.FFLMM, f*(tc.f2-tc.d)/tc.f2, approx.Rounding)
	}
}

func TestPlateShiftsFocus(t *testing.T) {
	cases := []struct{ thick, n float64 }{{10, 1.5}, {5, 1.8}, {25, 1.4585}}
	const f, gap = 100.0, 30.0
	for _, tc := range cases {
		p := newPath().thin("L", 50, f, 0).
			lens("P", gap, 0, []float64{0, 0}, []float64{tc.thick}, []float64{tc.n}).path()
		c := Cardinals(p, 0, Tangential, nil)
		// A plane-parallel plate in a converging beam moves the focus downstream by t(1 - 1/n)
		// (standard plate result, Smith, Modern Optical Engineering, from memory).
		zLens := p.Surfaces[0].PathMM
		zLast := p.Surfaces[len(p.Surfaces)-1].PathMM
		shift := zLast + *c.BFLMM - (zLens + f)
		approx.Check(t, "focal shift", shift, tc.thick*(1-1/tc.n), approx.Rounding)
		// The plate adds no power.
		approx.CheckPtr(t, "efl_mm", c.EFLMM, f, approx.Rounding)
	}
}

func TestConcaveMirrorFocusesAtHalfRadius(t *testing.T) {
	cases := []struct {
		name   string
		radius float64
	}{{"concave", 200}, {"convex", -200}}
	for _, tc := range cases {
		p := newPath().mirror("M", 120, tc.radius, 0, 0).path()
		c := Cardinals(p, 0, Tangential, &collimated(5).Source)
		// A spherical mirror focuses at f = R/2 (Hecht, Optics, 4th ed., sec. 5.4, from memory);
		// unfolded, the focus lies f downstream of the vertex along the folded path.
		f := tc.radius / 2
		approx.CheckPtr(t, tc.name+" efl_mm", c.EFLMM, f, approx.Rounding)
		approx.CheckPtr(t, tc.name+" bfl_mm", c.BFLMM, f, approx.Rounding)
		approx.CheckPtr(t, tc.name+" ffl_mm", c.FFLMM, f, approx.Rounding)
		approx.CheckPtr(t, tc.name+" image_distance_mm", c.ImageDistanceMM, f, approx.Rounding)
		checkNil(t, tc.name+" magnification", c.Magnification)
	}
}

func TestCoddingtonTiltedConcaveMirror(t *testing.T) {
	const radius, incidenceDeg = 200.0, 30.0
	f := radius / 2
	cosI := math.Cos(incidenceDeg * math.Pi / 180)
	p := newPath().mirror("M", 100, radius, incidenceDeg, 0).path()
	// Coddington's equations for a spherical mirror met at incidence i: tangential focal length
	// f cos i, sagittal f / cos i (Smith, Modern Optical Engineering, from memory).
	want := map[Plane]float64{Tangential: f * cosI, Sagittal: f / cosI}
	for plane, wantF := range want {
		s := &p.Surfaces[0]
		approx.Check(t, "1/Power", 1/Power(s, 1, 1, plane), wantF, approx.Rounding)
		c := Cardinals(p, 0, plane, nil)
		approx.CheckPtr(t, "efl_mm", c.EFLMM, wantF, approx.Rounding)
		approx.CheckPtr(t, "bfl_mm", c.BFLMM, wantF, approx.Rounding)
	}
	const fewULPs = 1e-15 // of 86.6, whose ulp is 1.4e-14: six ulps
	if t1, t2 := want[Tangential], 86.60254037844386; !approx.Mixed(t1, t2, fewULPs) {
		t.Errorf("f cos 30° = %v, want %v (100·√3/2)", t1, t2)
	}
}

func TestNewtonImagingEquation(t *testing.T) {
	// Two thin lenses; the object (the source plane) at several distances, real and virtual images.
	const f1, f2, d = 50.0, 80.0, 40.0
	for _, gap := range []float64{150, 300, 60, 20, 1000} {
		p := newPath().thin("A", gap, f1, 0).thin("B", d, f2, 0).path()
		c := Cardinals(p, 0, Tangential, &pointSource(0.05).Source)
		f := *c.EFLMM
		zFirst, zLast := p.Surfaces[0].PathMM, p.Surfaces[1].PathMM
		zF := zFirst - *c.FFLMM
		zF2 := zLast + *c.BFLMM
		zImage := zLast + *c.ImageDistanceMM
		// Newton's form with x = z(object) - z(F) and x' = z(image) - z(F'), both signed + downstream:
		// x x' = -f f' = -f² in air (Hecht, Optics, 4th ed., eq. 5.23, from memory; with
		// distances measured from the foci towards object and image it reads x x' = f²).
		x, x2 := 0-zF, zImage-zF2
		approx.Check(t, "x·x'", x*x2, -f*f, approx.Rounding)
		// Lateral magnification m = -x'/f = f/x with these signs (Hecht, Optics, 4th ed., eq. 5.26,
		// from memory, where x_o is measured the other way: m = -x_i/f = -f/x_o).
		approx.CheckPtr(t, "magnification", c.Magnification, f/x, tolImaging)
		approx.CheckPtr(t, "magnification", c.Magnification, -x2/f, tolImaging)
	}
}

func TestTelescopesAreAfocal(t *testing.T) {
	cases := []struct {
		name   string
		f1, f2 float64
	}{{"Keplerian", 100, 25}, {"Galilean", 100, -25}, {"Keplerian long", 500, 7.5}}
	for _, tc := range cases {
		p := newPath().thin("O", 50, tc.f1, 0).thin("E", tc.f1+tc.f2, tc.f2, 0).path()
		c := Cardinals(p, 0, Tangential, &collimated(5).Source)
		if !c.Afocal {
			t.Fatalf("%s: afocal = false, C = %g", tc.name, c.ABCD[1][0])
		}
		// A telescope with lenses separated by f1 + f2 is afocal with angular magnification
		// -f1/f2 (Hecht, Optics, 4th ed., sec. 5.7.7, from memory).
		approx.CheckPtr(t, tc.name+" angular_magnification", c.AngularMagnification, -tc.f1/tc.f2, approx.Rounding)
		for name, v := range map[string]*float64{"efl_mm": c.EFLMM, "bfl_mm": c.BFLMM, "ffl_mm": c.FFLMM,
			"front_principal_mm": c.FrontPrincipalMM, "rear_principal_mm": c.RearPrincipalMM,
			"image_distance_mm": c.ImageDistanceMM, "magnification": c.Magnification} {
			checkNil(t, tc.name+" "+name, v)
		}
	}
	// Slightly out of focus is not afocal.
	p := newPath().thin("O", 50, 100, 0).thin("E", 125.5, 25, 0).path()
	if c := Cardinals(p, 0, Tangential, nil); c.Afocal {
		t.Error("telescope defocused by 0.5 mm reported afocal")
	}
}

func TestSingleSurfaceNodalPointsAtCentre(t *testing.T) {
	// One refracting face from air into glass: the rays aimed at the centre of curvature meet the
	// surface normally and pass undeviated, so both nodal points are at the centre; both principal
	// points are at the vertex; the focal lengths are f = nR/(n'-n) in front and f' = n'R/(n'-n)
	// behind (Hecht, Optics, 4th ed., eqs. 5.5 and 5.6, from memory).
	const radius, n2 = 20.0, 1.5
	p := newPath().lens("S", 50, 0, []float64{radius}, nil, []float64{n2}).path()
	c := Cardinals(p, 0, Tangential, nil)
	approx.CheckPtr(t, "front_nodal_mm", c.FrontNodalMM, radius, approx.Rounding)
	approx.CheckPtr(t, "rear_nodal_mm", c.RearNodalMM, radius, approx.Rounding)
	approx.CheckPtr(t, "front_principal_mm", c.FrontPrincipalMM, 0, approx.Rounding)
	approx.CheckPtr(t, "rear_principal_mm", c.RearPrincipalMM, 0, approx.Rounding)
	approx.CheckPtr(t, "ffl_mm", c.FFLMM, radius/(n2-1), approx.Rounding)
	approx.CheckPtr(t, "bfl_mm", c.BFLMM, n2*radius/(n2-1), approx.Rounding)
	approx.CheckPtr(t, "efl_mm", c.EFLMM, radius/(n2-1), approx.Rounding)
}

func TestNoOpticsIsAfocalIdentity(t *testing.T) {
	p := newPath().plane("A1", 40, 3).plane("CAM", 80, 0).path()
	c := Cardinals(p, 0, Tangential, &collimated(2).Source)
	if !c.Afocal || c.ABCD != Identity.Array() {
		t.Errorf("no optics: afocal %v abcd %v, want afocal identity", c.Afocal, c.ABCD)
	}
	approx.CheckPtr(t, "angular_magnification", c.AngularMagnification, 1, 0)
}
