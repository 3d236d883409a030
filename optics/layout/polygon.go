package layout

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"
)

// touchMM is how far two shapes must interpenetrate to count as overlapping: shapes that merely
// touch (a mount face flush against the next one) are not reported.
const touchMM = 1e-6

// box is an axis-aligned bounding box, a cheap first test before the separating-axis test.
type box struct{ minX, minY, maxX, maxY float64 }

func boundsOf(pts []r2.Vec) box {
	b := box{math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)}
	for _, p := range pts {
		b.minX, b.maxX = math.Min(b.minX, p.X), math.Max(b.maxX, p.X)
		b.minY, b.maxY = math.Min(b.minY, p.Y), math.Max(b.maxY, p.Y)
	}
	return b
}

func (a box) overlaps(b box) bool {
	return a.minX < b.maxX-touchMM && b.minX < a.maxX-touchMM &&
		a.minY < b.maxY-touchMM && b.minY < a.maxY-touchMM
}

// convexOverlap reports whether two convex polygons (vertices in order, either sense; degenerate
// polygons such as a line segment allowed) overlap by more than touchMM. It is the separating axis
// theorem: two convex shapes are disjoint exactly when their projections on the normal of some
// edge of either shape are disjoint.
func convexOverlap(a, b []r2.Vec) bool {
	return !separatedByEdgeOf(a, a, b) && !separatedByEdgeOf(b, a, b)
}

func separatedByEdgeOf(edges, a, b []r2.Vec) bool {
	for i := range edges {
		d := r2.Sub(edges[(i+1)%len(edges)], edges[i])
		l := r2.Norm(d)
		if l < 1e-12 { // a zero-length edge has no normal
			continue
		}
		axis := r2.Scale(1/l, perp(d))
		aMin, aMax := project(a, axis)
		bMin, bMax := project(b, axis)
		if aMax <= bMin+touchMM || bMax <= aMin+touchMM {
			return true
		}
	}
	return false
}

func project(pts []r2.Vec, axis r2.Vec) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, p := range pts {
		v := r2.Dot(p, axis)
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	return lo, hi
}

// inside reports whether p lies in the rectangle [0, w] x [0, d], with touchMM of slack.
func inside(p r2.Vec, w, d float64) bool {
	return p.X >= -touchMM && p.Y >= -touchMM && p.X <= w+touchMM && p.Y <= d+touchMM
}
