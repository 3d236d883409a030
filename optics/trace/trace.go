package trace

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
)

// Start is a ray at the source plane (z = 0 of the path, in air): its position and its unit
// direction. Trace normalises Dir anyway.
type Start struct {
	Pos, Dir r3.Vec
}

// Point is a ray at one surface: Pos relative to the surface vertex in the frame of the leaving
// axis, Dir the unit direction it leaves with. At the surface where a ray is clipped or totally
// reflected, Dir is the direction it arrived with (unfolded), since it goes no further.
type Point struct {
	Surface int // index into Path.Surfaces
	Pos     r3.Vec
	Dir     r3.Vec
	// RimMM is the hit's distance from the surface's centre measured as its clear aperture is:
	// on the surface of a tilted mirror, fold or plate, from the axis on any other face.
	RimMM float64
}

// Result is what became of one ray.
type Result struct {
	Status  string  // optics.RayOK, RayClipped, RayTIR or RayMissed
	Surface int     // index of the surface where the ray ended (a dump, a clip, TIR, a miss); -1 if it passed every surface
	Reason  string  // plain words; empty when the ray passed every surface
	Points  []Point // one per surface reached, in order; a missed surface has none
}

// Trace follows ray s at wavelength index k through p. It appends the hits to buf[:0] and returns
// them in Result.Points; it allocates nothing when cap(buf) >= len(p.Surfaces) and the ray passes
// (the reason of a stopped ray is formatted on the spot).
func Trace(p *optics.Path, k int, s Start, buf []Point) Result {
	pts := buf[:0]
	if k < 0 || k >= len(p.WavelengthsNM) {
		return Result{Status: optics.RayMissed, Surface: -1, Points: pts,
			Reason: fmt.Sprintf("wavelength index %d is outside the %d wavelengths of the path", k, len(p.WavelengthsNM))}
	}
	dn := norm(s.Dir)
	if !(dn > 0) || math.IsInf(dn, 0) || !finite(s.Pos) || s.Dir.Z <= 0 {
		return Result{Status: optics.RayMissed, Surface: -1, Points: pts,
			Reason: "the ray does not start towards the path (its direction must point downstream)"}
	}
	pos, dir := s.Pos, r3.Scale(1/dn, s.Dir)
	prevZ := 0.0
	// side is +1 while the frame's +y lies left of travel and -1 after an odd number of mirrors,
	// when it lies to the right: a counter-clockwise turn then tilts the mirror towards -y.
	side := 1.0
	for i := range p.Surfaces {
		sf := &p.Surfaces[i]
		p0 := r3.Vec{X: pos.X, Y: pos.Y, Z: pos.Z - (sf.PathMM - prevZ)}
		prevZ = sf.PathMM
		stop := func(status, reason string) Result {
			return Result{Status: status, Surface: i, Reason: reason, Points: pts}
		}
		switch sf.Kind {
		case optics.Reflecting:
			n0 := mirrorNormal(side * sf.TurnRad)
			side = -side
			hit, miss := intersect(p0, dir, n0, sf.Curvature)
			if miss != hitOK {
				return stop(optics.RayMissed, missReason(sf, miss))
			}
			// Clear aperture on the mirror: distance from the normal through the vertex.
			r := norm(r3.Sub(hit, r3.Scale(r3.Dot(hit, n0), n0)))
			out := reflect(hit, n0) // into the leaving (unfolded) frame
			if r > sf.SemiAperture {
				pts = append(pts, Point{Surface: i, Pos: out, Dir: dir, RimMM: r})
				return stop(optics.RayClipped, clipReason(sf, r))
			}
			d := reflect(reflect(dir, normal(hit, n0, sf.Curvature)), n0)
			pts = append(pts, Point{Surface: i, Pos: out, Dir: d, RimMM: r})
			if d.Z <= 0 {
				return stop(optics.RayMissed, "the ray leaves "+where(sf)+" backwards, against the path")
			}
			pos, dir = out, d

		case optics.Refracting:
			hit, d, r, miss, ok := refractAt(p0, dir, sf, side, p.IndexBefore(i, k), sf.Index[k])
			switch {
			case miss != hitOK:
				return stop(optics.RayMissed, missReason(sf, miss))
			case r > sf.SemiAperture:
				pts = append(pts, Point{Surface: i, Pos: hit, Dir: dir, RimMM: r})
				return stop(optics.RayClipped, clipReason(sf, r))
			case !ok:
				pts = append(pts, Point{Surface: i, Pos: hit, Dir: dir, RimMM: r})
				return stop(optics.RayTIR, "total internal reflection at "+where(sf))
			}
			pts = append(pts, Point{Surface: i, Pos: hit, Dir: d, RimMM: r})
			if d.Z <= 0 {
				return stop(optics.RayMissed, "the ray leaves "+where(sf)+" backwards, against the path")
			}
			pos, dir = hit, d

		default: // Thin, Plane and Fold: a flat plane at the vertex
			hit, miss := intersect(p0, dir, r3.Vec{X: 0, Y: 0, Z: 1}, 0)
			if miss != hitOK {
				return stop(optics.RayMissed, missReason(sf, miss))
			}
			if sf.RotateRad != 0 {
				// A periscope's second mirror: back into the frame of the new heading, X up.
				hit, dir = rotateAbout(hit, side*sf.RotateRad), rotateAbout(dir, side*sf.RotateRad)
			}
			r := onSurface(hit, sf)
			if r > sf.SemiAperture {
				pts = append(pts, Point{Surface: i, Pos: hit, Dir: dir, RimMM: r})
				return stop(optics.RayClipped, clipReason(sf, r))
			}
			if sf.Kind == optics.Thin && sf.FocalMM != 0 && !math.IsInf(sf.FocalMM, 0) {
				// An ideal thin lens changes the slopes dx/dz and dy/dz by -x/f and -y/f.
				// A cylinder changes only the slope across its axis.
				across := acrossCylinder(sf.CylinderAxis)
				dir = unit(r3.Vec{X: dir.X/dir.Z - across.X*hit.X/sf.FocalMM, Y: dir.Y/dir.Z - across.Y*hit.Y/sf.FocalMM, Z: 1})
			}
			pts = append(pts, Point{Surface: i, Pos: hit, Dir: dir, RimMM: r})
			if sf.Stops {
				return stop(optics.RayOK, "absorbed by the beam dump "+sf.ID)
			}
			pos = hit
		}
	}
	return Result{Status: optics.RayOK, Surface: -1, Points: pts}
}

func finite(v r3.Vec) bool {
	return !math.IsNaN(v.X+v.Y+v.Z) && !math.IsInf(v.X+v.Y+v.Z, 0)
}

// where names a surface for a reason sentence: "face 1 of L1" for lens faces, the id otherwise.
func where(s *optics.Surface) string {
	if s.Kind == optics.Refracting {
		return fmt.Sprintf("face %d of %s", s.Face, s.ID)
	}
	return s.ID
}

func clipReason(s *optics.Surface, r float64) string {
	from := "from the axis"
	switch {
	case s.Kind == optics.Reflecting || s.Kind == optics.Fold:
		from = "from the mirror's centre"
	case s.IncidenceRad != 0:
		from = "from the centre of the tilted surface"
	}
	return fmt.Sprintf("outside the %.2f mm clear diameter of %s (ray %.2f mm %s)", 2*s.SemiAperture, where(s), r, from)
}

func missReason(s *optics.Surface, m missKind) string {
	switch m {
	case missParallel:
		return "the ray runs parallel to " + where(s) + " and never meets it"
	case missSphere:
		return fmt.Sprintf("the ray passes outside the sphere of %s (radius %.2f mm)", where(s), 1/s.Curvature)
	default:
		return fmt.Sprintf("the ray meets the sphere of %s (radius %.2f mm) only beyond its rim", where(s), 1/s.Curvature)
	}
}

// refractAt meets and refracts at a refracting face: a tilted flat face of a plate (tiltedFace),
// or a sphere or cylinder square to the axis. It gives the hit in the face's vertex frame, the
// leaving direction, the distance from the axis the clear aperture is judged by, why the ray
// missed, and ok=false for total internal reflection. The caller judges a miss, then the clear
// aperture, then the reflection, in that order.
func refractAt(p0, dir r3.Vec, sf *optics.Surface, side, n1, n2 float64) (hit, d r3.Vec, r float64, miss missKind, ok bool) {
	if sf.TiltRad != 0 || sf.AxisTurnRad != 0 {
		return tiltedFace(p0, dir, sf, side, n1, n2)
	}
	across := acrossCylinder(sf.CylinderAxis)
	hit, miss = intersectCylinder(p0, dir, sf.Curvature, across)
	if miss != hitOK {
		return hit, dir, 0, miss, false
	}
	r = math.Hypot(hit.X, hit.Y)
	d, ok = refract(dir, normal(r3.Vec{X: hit.X * across.X, Y: hit.Y * across.Y, Z: hit.Z}, r3.Vec{X: 0, Y: 0, Z: 1}, sf.Curvature), n1, n2)
	return hit, d, r, hitOK, ok
}
