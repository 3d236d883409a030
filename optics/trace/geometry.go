package trace

import "math"

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
func intersect(p0, d, a Vec, c float64) (Vec, missKind) {
	da := Dot(d, a)
	if da == 0 || math.IsNaN(da) {
		return Vec{}, missParallel
	}
	t := Add(p0, Scale(-Dot(p0, a)/da, d)) // on the vertex plane
	if c == 0 {
		return t, hitOK
	}
	f := c * Dot(t, t)
	if f == 0 {
		return t, hitOK // at the vertex itself
	}
	g := da - c*Dot(t, d)
	disc := g*g - c*f
	if disc < 0 {
		return Vec{}, missSphere
	}
	den := g + math.Copysign(math.Sqrt(disc), g)
	if den == 0 {
		return Vec{}, missSphere
	}
	p := Add(t, Scale(f/den, d))
	if 1-c*Dot(p, a) <= 0 {
		return Vec{}, missRim
	}
	return p, hitOK
}

// normal is the unit normal of the surface of intersect at a point p on it, pointing along a
// (the vertex normal) on the vertex hemisphere: (p - centre)/(-R) = a - c·p.
func normal(p, a Vec, c float64) Vec {
	if c == 0 {
		return a
	}
	return Sub(a, Scale(c, p))
}

// refract bends the unit direction d at a surface with unit normal nrm, going from index n1 to
// n2. It is the vector form of Snell's law (Spencer and Murty 1962; Welford, "Aberrations of
// Optical Systems", 1986, ch. 4): the component along the face scales by n1/n2 and the component
// along the normal is whatever keeps the result a unit vector. ok is false at total internal
// reflection, when no such component exists.
func refract(d, nrm Vec, n1, n2 float64) (Vec, bool) {
	cosI := Dot(d, nrm)
	if cosI < 0 { // normal against the ray: turn it round
		nrm = Scale(-1, nrm)
		cosI = -cosI
	}
	mu := n1 / n2
	k := 1 - mu*mu*(1-cosI*cosI)
	if k < 0 {
		return Vec{}, false
	}
	return Add(Scale(mu, d), Scale(math.Sqrt(k)-mu*cosI, nrm)), true
}

// reflect mirrors the direction d off a surface with unit normal nrm: d - 2(d·n)n.
func reflect(d, nrm Vec) Vec {
	return Sub(d, Scale(2*Dot(d, nrm), nrm))
}

// mirrorNormal is the unit normal at the vertex of a mirror that turns the heading by turnRad,
// in the incoming frame, pointing back towards the arriving light. It bisects the leaving axis
// (0, sin t, cos t) and the reversed incoming axis (0, 0, -1).
func mirrorNormal(turnRad float64) Vec {
	v := Vec{0, math.Sin(turnRad), math.Cos(turnRad) - 1}
	n := Norm(v)
	if n < 1e-12 { // no turn at all: not a valid mirror; keep the plane normal to the axis
		return Vec{0, 0, -1}
	}
	return Scale(1/n, v)
}
