package trace

import (
	"fmt"
	"math"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// singlet is a lens of two faces (curvatures c1, c2, thickness t, index n) at z = 10.
func singlet(c1, c2, t, n float64) *optics.Path {
	return path(face(10, c1, n), face(10+t, c2, 1))
}

// gullstrandBFL is the paraxial back focal length of a thick lens in air from Gullstrand's
// equation: P = P1 + P2 - (t/n)·P1·P2 with Pi = (n-1)c1, (1-n)c2, and BFL = (1 - (t/n)·P1) / P
// (e.g. E. Hecht, Optics, 4th ed., 2002, §6.1, thick lenses; section from memory).
func gullstrandBFL(c1, c2, t, n float64) float64 {
	p1, p2 := (n-1)*c1, (1-n)*c2
	p := p1 + p2 - t/n*p1*p2
	return (1 - t/n*p1) / p
}

// axialCrossing traces a ray parallel to the axis at height h and returns where it crosses the
// axis after the last face, measured from that face's vertex.
func axialCrossing(t *testing.T, p *optics.Path, h float64) float64 {
	t.Helper()
	return crossY(last(mustTrace(t, p, parallel(0, h))))
}

// At small aperture the exact trace converges on the paraxial focus: h = 0.01 mm leaves a
// spherical aberration of order h²/f ~ 1e-8 relative.
func TestSingletSmallApertureMeetsParaxialFocus(t *testing.T) {
	cases := []struct {
		name           string
		c1, c2, th, nn float64
	}{
		{"plano-convex, curved side first", 1.0 / 50, 0, 5, 1.5},
		{"plano-convex, flat side first", 0, -1.0 / 50, 5, 1.5},
		{"biconvex", 1.0 / 80, -1.0 / 120, 8, 1.7},
		{"positive meniscus", 1.0 / 30, 1.0 / 90, 4, 1.8},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			want := gullstrandBFL(c.c1, c.c2, c.th, c.nn)
			got := axialCrossing(t, singlet(c.c1, c.c2, c.th, c.nn), 0.01)
			if !approx.Rel(got, want, paraxRel) {
				t.Errorf("exact focus %.10g mm after the last vertex, Gullstrand BFL %.10g", got, want)
			}
		})
	}
}

// Third-order (Seidel) aberration theory: the longitudinal spherical aberration of a ray at
// height h grows as h² for small h (e.g. Welford, Aberrations of Optical Systems, 1986), so
// doubling h quadruples it; a single positive lens is under-corrected (marginal focus short).
func TestSphericalAberrationGrowsAsHeightSquared(t *testing.T) {
	const ratioTol = 1e-3 // fifth-order terms add ~ (h/f)² ~ 1e-5, rounding ~ 1e-9
	p := singlet(1.0/50, 0, 5, 1.5)
	bfl := gullstrandBFL(1.0/50, 0, 5, 1.5)
	for _, h := range []float64{0.1, 0.25, 0.5} {
		t.Run(fmt.Sprint("h=", h), func(t *testing.T) {
			lsa1 := bfl - axialCrossing(t, p, h)
			lsa2 := bfl - axialCrossing(t, p, 2*h)
			if lsa1 <= 0 {
				t.Fatalf("LSA(%g) = %g, want > 0 (under-corrected)", h, lsa1)
			}
			if r := lsa2 / lsa1; !approx.Rel(r, 4, ratioTol) {
				t.Errorf("LSA(2h)/LSA(h) = %.6f, want 4", r)
			}
		})
	}
}

// Thin-lens aberration theory (e.g. R. Kingslake, Lens Design Fundamentals; E. Hecht, Optics,
// 4th ed., §6.3; chapter and section from memory): for an object at infinity a singlet has least
// spherical aberration at the shape factor X = (R2+R1)/(R2-R1) = 2(n²-1)/(n+2). Scan X at fixed
// focal length with the exact trace at small aperture and find the minimum of the longitudinal
// aberration.
func TestBendingForMinimumSphericalAberration(t *testing.T) {
	const f, th, h = 100.0, 1.0, 2.0 // thin-ish lens at f/25
	for _, n := range []float64{1.5, 1.65, 1.8} {
		t.Run(fmt.Sprint("n=", n), func(t *testing.T) {
			// Lensmaker's equation with c1 - c2 = 1/(f(n-1)) and X = (c1+c2)/(c1-c2).
			a := 2 * f * (n - 1)
			lsa := func(x float64) float64 {
				p := singlet((x+1)/a, (x-1)/a, th, n)
				return axialCrossing(t, p, 1e-3) - axialCrossing(t, p, h)
			}
			best := goldenMin(lsa, -0.5, 2.5, 1e-5)
			want := 2 * (n*n - 1) / (n + 2)
			if !approx.Abs(best, want, bendingTol) {
				t.Errorf("least aberration at X = %.4f, third-order prediction %.4f", best, want)
			}
			t.Logf("n=%g: exact minimum at X = %.4f, third order %.4f", n, best, want)
		})
	}
}

// goldenMin finds the minimum of a unimodal f on [lo, hi] by golden-section search (Kiefer 1953).
func goldenMin(f func(float64) float64, lo, hi, tol float64) float64 {
	g := (math.Sqrt(5) - 1) / 2
	x1, x2 := hi-g*(hi-lo), lo+g*(hi-lo)
	f1, f2 := f(x1), f(x2)
	for hi-lo > tol {
		if f1 < f2 {
			hi, x2, f2 = x2, x1, f1
			x1 = hi - g*(hi-lo)
			f1 = f(x1)
		} else {
			lo, x1, f1 = x1, x2, f2
			x2 = lo + g*(hi-lo)
			f2 = f(x2)
		}
	}
	return (lo + hi) / 2
}
