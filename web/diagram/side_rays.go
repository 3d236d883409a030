package diagram

import (
	"strconv"

	"raytable/optics"
)

// selectRays picks at most limit rays to draw, in slice order: every ray that stopped early (up to
// half the limit), then an even stride through the others.
func selectRays(rays []optics.Ray, limit int) []int {
	if len(rays) <= limit {
		idx := make([]int, len(rays))
		for i := range idx {
			idx[i] = i
		}
		return idx
	}
	keep := make([]bool, len(rays))
	n := 0
	for i := range rays {
		if rays[i].Status != optics.RayOK && n < limit/2 {
			keep[i] = true
			n++
		}
	}
	rest := len(rays) - n
	room := limit - n
	for i, seen := 0, 0; i < len(rays); i++ {
		if keep[i] {
			continue
		}
		// take the ray when the running quota crosses an integer: an even stride over the rest
		if (seen*room)/rest != ((seen+1)*room)/rest {
			keep[i] = true
		}
		seen++
	}
	var idx []int
	for i, k := range keep {
		if k {
			idx = append(idx, i)
		}
	}
	return idx
}

// rayPoints returns the exact ray as pixel points: the start at z = 0, then each hit at its face
// vertex plus the hit's z offset. A ray that ran through (status ok, not ended at a dump) is
// extended along its last direction for the frame's run-out.
func rayPoints(f *sideFrame, faces faceIndex, ray *optics.Ray) (xs, ys []float64) {
	xs, ys = append(xs, f.x(0)), append(ys, f.y(ray.Start.YMM))
	z, y, dir := 0.0, ray.Start.YMM, ray.Start.Dir
	lastType := ""
	for _, h := range ray.Hits {
		fz, ok := faces.z(h.Element, h.Face)
		if !ok || !finite(fz+h.Exact.ZMM, h.Exact.YMM) {
			continue
		}
		z, y, dir = fz+h.Exact.ZMM, h.Exact.YMM, h.Exact.Dir
		lastType = faces.types[h.Element]
		xs, ys = append(xs, f.x(z)), append(ys, f.y(y))
	}
	if runsOn(ray, lastType) && dir[2] > 1e-9 && finite(dir[1]/dir[2]) {
		end := z + f.runOut
		if len(ray.Hits) == 0 {
			end = f.zFit + f.runOut
		}
		xs, ys = append(xs, f.x(end)), append(ys, f.y(y+dir[1]/dir[2]*(end-z)))
	}
	return xs, ys
}

// runsOn reports whether a ray leaves the last element it met and goes on to be drawn: not after
// a dump, nor after the screen or target the path ends on (optics.Kind.EndsPath; a ray that ran
// through a screen mid-path has later hits), where the drawings stop.
func runsOn(ray *optics.Ray, lastType string) bool {
	k, known := optics.KindOf(lastType)
	return ray.Status == optics.RayOK && ray.StoppedAt == "" && !(known && (k.StopsRays || k.EndsPath))
}

// paraxialPoints returns the paraxial twin: the start, then the paraxial height at each face
// vertex, extended like the exact ray.
func paraxialPoints(f *sideFrame, faces faceIndex, ray *optics.Ray) (xs, ys []float64) {
	xs, ys = append(xs, f.x(0)), append(ys, f.y(ray.Start.YMM))
	z, y, u := 0.0, ray.Start.YMM, 0.0
	if ray.Start.Dir[2] > 1e-9 {
		u = ray.Start.Dir[1] / ray.Start.Dir[2]
	}
	lastType := ""
	for _, h := range ray.Hits {
		fz, ok := faces.z(h.Element, h.Face)
		if !ok || !finite(fz, h.Paraxial.YMM, h.Paraxial.URad) {
			continue
		}
		z, y, u = fz, h.Paraxial.YMM, h.Paraxial.URad
		lastType = faces.types[h.Element]
		xs, ys = append(xs, f.x(z)), append(ys, f.y(y))
	}
	if runsOn(ray, lastType) {
		end := z + f.runOut
		if len(ray.Hits) == 0 {
			end = f.zFit + f.runOut
		}
		xs, ys = append(xs, f.x(end)), append(ys, f.y(y+u*(end-z)))
	}
	return xs, ys
}

// drawExactRays draws the chosen rays as polylines grouped by colour (consecutive rays of one
// wavelength share a group). A ray that stopped early ends in a cross with a tooltip giving the
// reason. It returns the number of stopped rays drawn.
func drawExactRays(p *pen, f *sideFrame, faces faceIndex, rays []optics.Ray, idx []int) int {
	stops := 0
	open := ""
	for _, i := range idx {
		ray := &rays[i]
		c := WavelengthColor(ray.WavelengthNM)
		if c != open {
			if open != "" {
				p.gend()
			}
			p.group(`class="rays"`, `fill="none"`, attr("stroke", c), `stroke-width="0.9"`, `stroke-opacity="0.85"`)
			open = c
		}
		xs, ys := rayPoints(f, faces, ray)
		if ray.Status == optics.RayOK {
			p.polyline(xs, ys)
			continue
		}
		stops++
		p.group()
		p.title(stopText(ray))
		p.polyline(xs, ys)
		last := len(xs) - 1
		p.cross(xs[last], ys[last], 3.5, `stroke="#b00020"`, `stroke-width="1.4"`, `stroke-opacity="1"`)
		p.gend()
	}
	if open != "" {
		p.gend()
	}
	return stops
}

// stopText is the tooltip of a ray that stopped: its name, status, where and why.
func stopText(ray *optics.Ray) string {
	s := ray.Name
	if s == "" {
		s = "ray"
	}
	s += " " + ray.Status
	if ray.StoppedAt != "" {
		s += " at " + ray.StoppedAt
	}
	if ray.Reason != "" {
		s += ": " + ray.Reason
	}
	return s
}

// drawParaxialRays overlays the paraxial twins of the chosen rays, dashed.
func drawParaxialRays(p *pen, f *sideFrame, faces faceIndex, rays []optics.Ray, idx []int) {
	open := ""
	for _, i := range idx {
		ray := &rays[i]
		c := WavelengthColor(ray.WavelengthNM)
		if c != open {
			if open != "" {
				p.gend()
			}
			p.group(`class="paraxial"`, `fill="none"`, attr("stroke", c), `stroke-width="0.7"`, `stroke-dasharray="4 3"`, `stroke-opacity="0.9"`)
			open = c
		}
		xs, ys := paraxialPoints(f, faces, ray)
		p.polyline(xs, ys)
	}
	if open != "" {
		p.gend()
	}
}

func itoa(n int) string { return strconv.Itoa(n) }
