package diagram

import (
	"math"

	"raytable/optics"
)

// vec is a point or direction on the table in mm (x along the width, y along the depth).
type vec struct{ x, y float64 }

func (a vec) add(b vec) vec        { return vec{a.x + b.x, a.y + b.y} }
func (a vec) sub(b vec) vec        { return vec{a.x - b.x, a.y - b.y} }
func (a vec) scale(k float64) vec  { return vec{a.x * k, a.y * k} }
func (a vec) perp() vec            { return vec{-a.y, a.x} } // 90° counter-clockwise seen from above
func (a vec) norm() float64        { return math.Hypot(a.x, a.y) }
func (a vec) finite() bool         { return finite(a.x, a.y) }
func heading(deg float64) vec      { r := deg * math.Pi / 180; return vec{math.Cos(r), math.Sin(r)} }
func lerp(a, b vec, t float64) vec { return a.add(b.sub(a).scale(t)) }
func (a vec) unit(fallback vec) vec {
	n := a.norm()
	if n < 1e-12 || !finite(n) {
		return fallback
	}
	return a.scale(1 / n)
}

// pathNode is a point of the folded path where it may change direction: the source, each
// element's first vertex and a thick lens's last vertex, with its distance along the path.
type pathNode struct {
	s   float64
	pos vec
}

// foldedPath maps a distance along the unfolded path to a point on the table, by walking the
// straight stretches between the element positions the report gives. Beyond the last node it goes
// on along the last element's outgoing heading.
type foldedPath struct {
	nodes   []pathNode
	tailDir vec
}

func newFoldedPath(b *optics.Bench, r *optics.Report) foldedPath {
	var fp foldedPath
	srcDir := vec{1, 0}
	var src vec
	switch {
	case b != nil:
		src, srcDir = vec{b.Source.XMM, b.Source.YMM}, heading(b.Source.HeadingDeg)
	case len(r.Elements) > 0:
		e := r.Elements[0]
		srcDir = heading(e.HeadingInDeg)
		src = vec{e.TableXMM, e.TableYMM}.sub(srcDir.scale(e.PathMM))
	}
	if !src.finite() || !srcDir.finite() {
		src, srcDir = vec{}, vec{1, 0}
	}
	fp.nodes = append(fp.nodes, pathNode{0, src})
	fp.tailDir = srcDir
	for _, e := range r.Elements {
		first := vec{e.TableXMM, e.TableYMM}
		if !first.finite() || !finite(e.PathMM) {
			continue
		}
		fp.nodes = append(fp.nodes, pathNode{e.PathMM, first})
		in := heading(e.HeadingInDeg)
		if n := len(e.Faces); n > 1 {
			last := e.Faces[n-1].PathMM
			if finite(last) && last > e.PathMM {
				fp.nodes = append(fp.nodes, pathNode{last, first.add(in.scale(last - e.PathMM))})
			}
		}
		if d := heading(e.HeadingOutDeg); d.finite() {
			fp.tailDir = d
		}
	}
	return fp
}

// segment returns the index of the stretch holding s: i means nodes[i]..nodes[i+1]; len-1 the tail.
func (fp foldedPath) segment(s float64) int {
	for i := 0; i+1 < len(fp.nodes); i++ {
		if s <= fp.nodes[i+1].s {
			return i
		}
	}
	return len(fp.nodes) - 1
}

// dir is the direction of stretch i.
func (fp foldedPath) dir(i int) vec {
	if i+1 >= len(fp.nodes) {
		return fp.tailDir
	}
	return fp.nodes[i+1].pos.sub(fp.nodes[i].pos).unit(fp.tailDir)
}

// at is the table point at distance s along stretch i.
func (fp foldedPath) at(i int, s float64) vec {
	a := fp.nodes[i]
	if i+1 >= len(fp.nodes) {
		return a.pos.add(fp.tailDir.scale(s - a.s))
	}
	b := fp.nodes[i+1]
	if b.s-a.s < 1e-12 {
		return b.pos
	}
	return lerp(a.pos, b.pos, (s-a.s)/(b.s-a.s))
}

// bands returns, for each stretch the beam samples cover, the outline of the band ±w_t around it:
// the left edge forward then the right edge back. Radii between samples are interpolated linearly
// at the stretch ends so neighbouring bands meet.
func (fp foldedPath) bands(samples []optics.BeamSample) [][]vec {
	var clean []optics.BeamSample
	for _, s := range samples {
		if finite(s.PathMM, s.WTMM) && s.WTMM >= 0 && (len(clean) == 0 || s.PathMM >= clean[len(clean)-1].PathMM) {
			clean = append(clean, s)
		}
	}
	if len(clean) < 2 {
		return nil
	}
	wAt := func(s float64) float64 {
		for k := 1; k < len(clean); k++ {
			if s <= clean[k].PathMM {
				a, b := clean[k-1], clean[k]
				if b.PathMM-a.PathMM < 1e-12 {
					return b.WTMM
				}
				return a.WTMM + (b.WTMM-a.WTMM)*(s-a.PathMM)/(b.PathMM-a.PathMM)
			}
		}
		return clean[len(clean)-1].WTMM
	}
	lo, hi := clean[0].PathMM, clean[len(clean)-1].PathMM
	var out [][]vec
	for i := range fp.nodes {
		s0 := fp.nodes[i].s
		s1 := hi
		if i+1 < len(fp.nodes) {
			s1 = fp.nodes[i+1].s
		}
		a, b := math.Max(s0, lo), math.Min(s1, hi)
		if b <= a {
			continue
		}
		ss := []float64{a}
		for _, c := range clean {
			if c.PathMM > a && c.PathMM < b {
				ss = append(ss, c.PathMM)
			}
		}
		ss = append(ss, b)
		n := fp.dir(i).perp()
		left := make([]vec, 0, 2*len(ss))
		var right []vec
		for _, s := range ss {
			p, w := fp.at(i, s), wAt(s)
			left = append(left, p.add(n.scale(w)))
			right = append(right, p.sub(n.scale(w)))
		}
		for k := len(right) - 1; k >= 0; k-- {
			left = append(left, right[k])
		}
		out = append(out, left)
	}
	return out
}
