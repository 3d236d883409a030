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

// Plane selects the tangential or the sagittal plane of the beam: at the source the table plane
// and the vertical plane. They differ at tilted curved mirrors and tilted plates. A periscope
// turning by an odd multiple of 90° lays the beam's tangential plane vertical (Surface.Swapped);
// the planes stay the beam's own, so there each surface gives it its vertical-plane action.
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
//
// The plane is the beam's; behind an odd number of 90° periscopes the mirror's table-plane power
// falls in the beam's sagittal plane (see TablePlane).
func Power(s *optics.Surface, nBefore, nAfter float64, plane Plane) float64 {
	if !CylinderActs(s, plane) {
		return 0
	}
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
		if TablePlane(s, plane) == Tangential {
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

// TablePlane is the plane on the table that the beam's plane meets at surface s: Tangential for
// the table plane, Sagittal for the vertical one. They are the same except where s.Swapped.
func TablePlane(s *optics.Surface, plane Plane) Plane {
	if s.Swapped {
		return 1 - plane
	}
	return plane
}

// GapMatrix is the transfer from the vertex of surface i-1 (or the source, for i = 0) to the
// vertex of surface i at wavelength index k, in the given plane: [1 GapReducedMM; 0 1].
func GapMatrix(p *optics.Path, i, k int, plane Plane) Matrix {
	s := &p.Surfaces[i]
	if s.PlateMM > 0 {
		return Matrix{A: 1, B: GapReducedMM(p, i, k, plane), D: 1}
	}
	z0 := 0.0
	if i > 0 {
		z0 = p.Surfaces[i-1].PathMM
	}
	return Transfer(s.PathMM-z0, p.IndexBefore(i, k))
}

// GapReducedMM is the reduced (air-equivalent) length of the stretch in front of surface i at
// wavelength index k in the given plane: its length over its index, or, for the glass of a
// tilted plate, PlateReducedMM at that wavelength's index (the plane of incidence is the table
// plane).
func GapReducedMM(p *optics.Path, i, k int, plane Plane) float64 {
	s := &p.Surfaces[i]
	n := p.IndexBefore(i, k)
	if s.PlateMM > 0 {
		return PlateReducedMM(s.PlateMM, n, s.IncidenceRad, TablePlane(s, plane))
	}
	z0 := 0.0
	if i > 0 {
		z0 = p.Surfaces[i-1].PathMM
	}
	return (s.PathMM - z0) / n
}

// CylinderActs reports whether surface s has power in the beam's plane: always for a sphere, for a
// cylinder only in the table plane across its axis (a vertical axis bends the table plane).
func CylinderActs(s *optics.Surface, plane Plane) bool {
	switch s.CylinderAxis {
	case optics.CylinderVertical:
		return TablePlane(s, plane) == Tangential
	case optics.CylinderHorizontal:
		return TablePlane(s, plane) == Sagittal
	}
	return true
}
