package paraxial

import (
	"math"

	"raytable/optics"
)

// Matrix is a 2x2 ray-transfer (ABCD) matrix acting on (y, n·u): height and reduced slope.
// In this reduced-angle convention every matrix of a system in air has determinant 1.
type Matrix struct{ A, B, C, D float64 }

// Identity leaves a ray unchanged.
var Identity = Matrix{A: 1, D: 1}

// Mul returns m·n: n acts first, then m.
func Mul(m, n Matrix) Matrix {
	return Matrix{
		A: m.A*n.A + m.B*n.C, B: m.A*n.B + m.B*n.D,
		C: m.C*n.A + m.D*n.C, D: m.C*n.B + m.D*n.D,
	}
}

// Det is the determinant AD - BC.
func (m Matrix) Det() float64 { return m.A*m.D - m.B*m.C }

// Apply maps a ray through m.
func (m Matrix) Apply(r Ray) Ray {
	return Ray{Y: m.A*r.Y + m.B*r.NU, NU: m.C*r.Y + m.D*r.NU}
}

// Array is the matrix as rows, as the report writes it.
func (m Matrix) Array() [2][2]float64 { return [2][2]float64{{m.A, m.B}, {m.C, m.D}} }

// Ray is a paraxial ray: height y in mm and reduced slope n·u (u = dy/dz).
type Ray struct{ Y, NU float64 }

// Plane selects the tangential (table) plane or the sagittal (vertical) plane. They differ only at
// tilted curved mirrors.
type Plane int

const (
	Tangential Plane = iota
	Sagittal
)

// Transfer moves a ray a distance d through a medium of index n: y += d·(n·u)/n.
func Transfer(d, n float64) Matrix { return Matrix{A: 1, B: d / n, D: 1} }

// Power is the optical power of a surface, in 1/mm, for a ray meeting it in the given plane, with
// nBefore and nAfter the indices on either side (equal for thin lenses and mirrors).
//
// A refracting face has power (n' - n)·c. An ideal thin lens has 1/f. A mirror, unfolded, acts as
// a lens of power 2c (c = 1/R, + concave); tilted by the angle of incidence i its tangential power
// is 2c/cos i and its sagittal power 2c·cos i (Coddington's equations for a spherical mirror,
// focal lengths f·cos i and f/cos i).
func Power(s *optics.Surface, nBefore, nAfter float64, plane Plane) float64 {
	switch s.Kind {
	case optics.Refracting:
		return (nAfter - nBefore) * s.Curvature
	case optics.Thin:
		if s.FocalMM == 0 {
			return 0
		}
		return 1 / s.FocalMM
	case optics.Reflecting:
		cos := math.Cos(s.IncidenceRad)
		if plane == Tangential {
			return 2 * s.Curvature / cos
		}
		return 2 * s.Curvature * cos
	}
	return 0
}

// SurfaceMatrix is the matrix of surface i of p at wavelength index k: a pure power [1 0; -P 1].
func SurfaceMatrix(p *optics.Path, i, k int, plane Plane) Matrix {
	s := &p.Surfaces[i]
	return Matrix{A: 1, C: -Power(s, p.IndexBefore(i, k), s.Index[k], plane), D: 1}
}

// GapMatrix is the transfer from the vertex of surface i-1 (or the source, for i = 0) to the
// vertex of surface i at wavelength index k.
func GapMatrix(p *optics.Path, i, k int) Matrix {
	z0 := 0.0
	if i > 0 {
		z0 = p.Surfaces[i-1].PathMM
	}
	return Transfer(p.Surfaces[i].PathMM-z0, p.IndexBefore(i, k))
}
