package paraxial

import (
	"math"

	"raytable/optics"
)

// Trace follows a ray from the source plane (z = 0, in air) through every surface of p at
// wavelength index k in the given plane. Element i of the result is the ray leaving surface i
// (its height is also the height at which it met the surface, since a surface acts at its vertex).
func Trace(p *optics.Path, k int, plane Plane, start Ray) []Ray {
	return TraceInto(make([]Ray, len(p.Surfaces)), p, k, plane, start)
}

// TraceInto is Trace writing into dst, which it reuses when it holds at least len(p.Surfaces)
// rays; the returned slice has exactly one ray per surface. With a large enough dst it does not
// allocate.
func TraceInto(dst []Ray, p *optics.Path, k int, plane Plane, start Ray) []Ray {
	n := len(p.Surfaces)
	if cap(dst) < n {
		dst = make([]Ray, n)
	}
	dst = dst[:n]
	r := start
	zPrev, nPrev := 0.0, 1.0
	for i := range p.Surfaces {
		s := &p.Surfaces[i]
		nAfter := s.Index[k]
		if s.PlateMM > 0 {
			r.Y += GapReducedMM(p, i, k, plane) * r.NU
		} else {
			r.Y += (s.PathMM - zPrev) * r.NU / nPrev
		}
		r.NU -= Power(s, nPrev, nAfter, plane) * r.Y
		dst[i] = r
		zPrev, nPrev = s.PathMM, nAfter
	}
	return dst
}

// System is the matrix of the optical part of p (see optics.Path.OpticalRange) at wavelength
// index k: it maps (y, n·u) just before the first vertex of the first lens, thin lens or mirror to
// just after the last vertex of the last one. A path with no optical surface gives Identity.
func System(p *optics.Path, k int, plane Plane) Matrix {
	m, _ := systemWithBound(p, k, plane)
	return m
}

// systemWithBound returns the system matrix together with the same product taken over the
// absolute values of every matrix entry. The second matrix bounds the size of the terms that were
// summed into each entry, so an entry far smaller than its bound is a cancellation, zero up to
// rounding (the running error bound of a matrix product; Higham, Accuracy and Stability of
// Numerical Algorithms, 2nd ed. 2002, sec. 3.5).
func systemWithBound(p *optics.Path, k int, plane Plane) (m, bound Matrix) {
	first, last, ok := p.OpticalRange()
	if !ok {
		return Identity, Identity
	}
	m, bound = Identity, Identity
	for i := first; i <= last; i++ {
		if i > first {
			g := GapMatrix(p, i, k, plane)
			m, bound = Mul(g, m), Mul(abs(g), bound)
		}
		s := SurfaceMatrix(p, i, k, plane)
		m, bound = Mul(s, m), Mul(abs(s), bound)
	}
	return m, bound
}

func abs(m Matrix) Matrix {
	return Matrix{A: math.Abs(m.A), B: math.Abs(m.B), C: math.Abs(m.C), D: math.Abs(m.D)}
}

// cancelTolerance is how small an entry must be relative to its term bound to count as zero:
// far above rounding (about 1e-16 per operation) and far below any deliberate design value.
const cancelTolerance = 1e-9

// cancelled reports whether v is zero up to rounding given the bound on its terms.
func cancelled(v, bound float64) bool { return math.Abs(v) <= cancelTolerance*bound }

// At is the ray r after travelling a distance d in a medium of index n.
func At(r Ray, d, n float64) Ray { return Ray{Y: r.Y + d*r.NU/n, NU: r.NU} }

// Lagrange is the Lagrange invariant H = n(ū y - u ȳ) of a marginal ray m and a chief ray c at
// the same plane. Reduced slopes make it (n ū) y - (n u) ȳ.
func Lagrange(m, c Ray) float64 { return c.NU*m.Y - m.NU*c.Y }
