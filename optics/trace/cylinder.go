package trace

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
)

// acrossCylinder is the mask of the directions in which a face is curved: (1, 1, 0) for a sphere,
// (0, 1, 0) for a cylinder with a vertical axis (curved in the table plane, y), (1, 0, 0) for one
// with a horizontal axis (curved vertically, x).
func acrossCylinder(axis string) r3.Vec {
	switch axis {
	case optics.CylinderVertical:
		return r3.Vec{Y: 1}
	case optics.CylinderHorizontal:
		return r3.Vec{X: 1}
	}
	return r3.Vec{X: 1, Y: 1}
}

// intersectCylinder finds where the ray p0 + s·d meets the face c·(|P⊥|² + z²) - 2z = 0 square to
// the axis, P⊥ the part of P across which the face is curved (mask across, see acrossCylinder).
// For a sphere (across = (1, 1, 0)) it is intersect. For a cylinder the quadratic of Spencer and
// Murty (1962) keeps its form with the axis component left out:
//
//	c·|d'|²·s² - 2G·s + F = 0, G = d_z - c·(t'·d'), F = c·|t'|², primes the masked vectors,
//
// and the same root s = F / (G + sign(G)·sqrt(G² - c·|d'|²·F)) stays finite as c -> 0.
func intersectCylinder(p0, d r3.Vec, c float64, across r3.Vec) (r3.Vec, missKind) {
	if across.X == 1 && across.Y == 1 {
		return intersect(p0, d, r3.Vec{Z: 1}, c)
	}
	if d.Z == 0 || math.IsNaN(d.Z) {
		return r3.Vec{}, missParallel
	}
	t := r3.Add(p0, r3.Scale(-p0.Z/d.Z, d)) // on the vertex plane
	if c == 0 {
		return t, hitOK
	}
	tm := r3.Vec{X: t.X * across.X, Y: t.Y * across.Y}
	dm := r3.Vec{X: d.X * across.X, Y: d.Y * across.Y, Z: d.Z}
	f := c * r3.Dot(tm, tm)
	if f == 0 {
		return t, hitOK
	}
	s, ok := nearerRoot(c*r3.Dot(dm, dm), d.Z-c*r3.Dot(tm, dm), f)
	if !ok {
		return r3.Vec{}, missSphere
	}
	p := r3.Add(t, r3.Scale(s, d))
	if 1-c*p.Z <= 0 {
		return r3.Vec{}, missRim
	}
	return p, hitOK
}
