package trace

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Why an intersection failed.
type missKind int

const (
	hitOK        missKind = iota
	missParallel          // the ray runs parallel to the vertex plane and never meets it
	missSphere            // the ray's line passes outside the sphere
	missRim               // the only intersection near the vertex lies beyond the sphere's equator
)

// intersect finds where the ray p0 + s·d meets the surface c·|P|² - 2·P·a = 0: a sphere of
// curvature c whose centre lies at (1/c)·a from the vertex (the origin), or the plane P·a = 0 when
// c = 0. a is the unit normal at the vertex.
//
// It follows Spencer and Murty (1962, "General ray-tracing procedure", JOSA 52, 672): first move
// to the vertex plane, then solve the quadratic c·s² - 2G·s + F = 0 in the form
// s = F / (G + sign(G)·sqrt(G² - c·F)), the root that stays finite as c -> 0. That form avoids the
// cancellation of the textbook root (G - sqrt(G² - cF))/c for weak curvatures and small heights,
// and picks the intersection on the vertex side of the sphere. A negative s is allowed: when
// surfaces are placed so close that one bulges past the other's plane (a face right at an iris),
// the ray's line is extended, as is usual for a reference plane.
func intersect(p0, d, a r3.Vec, c float64) (r3.Vec, missKind) {
	da := r3.Dot(d, a)
	if da == 0 || math.IsNaN(da) {
		return r3.Vec{}, missParallel
	}
	t := r3.Add(p0, r3.Scale(-r3.Dot(p0, a)/da, d)) // on the vertex plane
	if c == 0 {
		return t, hitOK
	}
	f := c * r3.Dot(t, t)
	if f == 0 {
		return t, hitOK // at the vertex itself
	}
	s, ok := nearerRoot(c, da-c*r3.Dot(t, d), f)
	if !ok {
		return r3.Vec{}, missSphere
	}
	p := r3.Add(t, r3.Scale(s, d))
	if 1-c*r3.Dot(p, a) <= 0 {
		return r3.Vec{}, missRim
	}
	return p, hitOK
}

// normal is the unit normal of the surface of intersect at a point p on it, pointing along a
// (the vertex normal) on the vertex hemisphere: (p - centre)/(-R) = a - c·p.
func normal(p, a r3.Vec, c float64) r3.Vec {
	if c == 0 {
		return a
	}
	return r3.Sub(a, r3.Scale(c, p))
}

// refract bends the unit direction d at a surface with unit normal nrm, going from index n1 to
// n2. It is the vector form of Snell's law (Spencer and Murty 1962; Welford, "Aberrations of
// Optical Systems", 1986, ch. 4): the component along the face scales by n1/n2 and the component
// along the normal is whatever keeps the result a unit vector. ok is false at total internal
// reflection, when no such component exists.
func refract(d, nrm r3.Vec, n1, n2 float64) (r3.Vec, bool) {
	cosI := r3.Dot(d, nrm)
	if cosI < 0 { // normal against the ray: turn it round
		nrm = r3.Scale(-1, nrm)
		cosI = -cosI
	}
	mu := n1 / n2
	k := 1 - mu*mu*(1-cosI*cosI)
	if k < 0 {
		return r3.Vec{}, false
	}
	return r3.Add(r3.Scale(mu, d), r3.Scale(math.Sqrt(k)-mu*cosI, nrm)), true
}

// reflect mirrors the direction d off a surface with unit normal nrm: d - 2(d·n)n.
func reflect(d, nrm r3.Vec) r3.Vec {
	return r3.Sub(d, r3.Scale(2*r3.Dot(d, nrm), nrm))
}

// mirrorNormal is the unit normal at the vertex of a mirror that turns the heading by turnRad,
// in the incoming frame, pointing back towards the arriving light. It bisects the leaving axis
// (0, sin t, cos t) and the reversed incoming axis (0, 0, -1).
func mirrorNormal(turnRad float64) r3.Vec {
	v := r3.Vec{X: 0, Y: math.Sin(turnRad), Z: math.Cos(turnRad) - 1}
	n := norm(v)
	if n < 1e-12 { // no turn at all: not a valid mirror; keep the plane normal to the axis
		return r3.Vec{X: 0, Y: 0, Z: -1}
	}
	return r3.Scale(1/n, v)
}

// nearerRoot is the root of a·s² - 2g·s + f = 0 on the vertex side, in the form
// s = f / (g + sign(g)·sqrt(g² - a·f)) that stays finite as a -> 0 (Spencer and Murty 1962; see
// intersect). ok is false when the line misses the surface.
func nearerRoot(a, g, f float64) (s float64, ok bool) {
	disc := g*g - a*f
	if disc < 0 {
		return 0, false
	}
	den := g + math.Copysign(math.Sqrt(disc), g)
	if den == 0 {
		return 0, false
	}
	return f / den, true
}
