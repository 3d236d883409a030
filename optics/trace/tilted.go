package trace

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
)

// Surfaces that do not sit square to the axis: the two flat faces of a splitter's tilted plate,
// a splitter of no thickness and a periscope's mirrors. side is the trace's handedness (+1 while
// the frame's +y lies left of travel), which turns table-plane angles (+ counter-clockwise seen
// from above) into angles in the frame.

// tiltedFace refracts the ray arriving at p0 (relative to the vertex, arriving frame) with unit
// direction dir at a flat face whose normal leans by sf.TiltRad from the axis in the table plane,
// and expresses the hit and the new direction in the frame of the leaving axis, turned by
// sf.AxisTurnRad. r is the hit's distance from the vertex on the face; ok is false at total
// internal reflection.
func tiltedFace(p0, dir r3.Vec, sf *optics.Surface, side, n1, n2 float64) (hit, d r3.Vec, r float64, miss missKind, ok bool) {
	sn, cs := math.Sincos(side * sf.TiltRad)
	a := r3.Vec{X: 0, Y: sn, Z: cs}
	hit, miss = intersect(p0, dir, a, 0)
	if miss != hitOK {
		return hit, dir, 0, miss, false
	}
	r = norm(hit) // the plane passes through the vertex
	d, ok = refract(dir, a, n1, n2)
	if !ok {
		return hit, dir, r, hitOK, false
	}
	turn := side * sf.AxisTurnRad
	return turnFrame(hit, turn), turnFrame(d, turn), r, hitOK, true
}

// turnFrame expresses v in a frame whose z axis is turned by angle phi towards +y about x.
func turnFrame(v r3.Vec, phi float64) r3.Vec {
	sn, cs := math.Sincos(phi)
	return r3.Vec{X: v.X, Y: v.Y*cs - v.Z*sn, Z: v.Y*sn + v.Z*cs}
}

// rotateAbout expresses v in a frame rotated about the axis (z) by phi, from +x towards +y: the
// map of a periscope that turns the heading by phi. Its first mirror lifts the beam and folds
// the frame's up (x) onto the old heading; its second, whose normal bisects up and the new
// heading, sends the beam on. The product of the two reflections is a rotation (two mirrors keep
// the handedness), so the unfolded ray is unchanged in the image frame, and that frame's x and y
// axes are the physical up and left-of-travel turned by -phi about the new heading; going back
// to physical axes is the rotation (x, y) -> (x cos phi + y sin phi, -x sin phi + y cos phi).
func rotateAbout(v r3.Vec, phi float64) r3.Vec {
	sn, cs := math.Sincos(phi)
	return r3.Vec{X: v.X*cs + v.Y*sn, Y: -v.X*sn + v.Y*cs, Z: v.Z}
}

// onSurface is the distance, measured on a tilted flat surface met at sf.IncidenceRad, of a hit
// on the plane across the axis at its vertex: a splitter leans in the table plane (y is
// stretched by 1/cos i), a periscope mirror in the vertical plane (x is).
func onSurface(hit r3.Vec, sf *optics.Surface) float64 {
	if sf.IncidenceRad == 0 {
		return math.Hypot(hit.X, hit.Y)
	}
	c := math.Cos(sf.IncidenceRad)
	if sf.Kind == optics.Fold {
		return math.Hypot(hit.X/c, hit.Y)
	}
	return math.Hypot(hit.X, hit.Y/c)
}
