package layout

import (
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// foldedPath maps a distance along the unfolded path to a point on the table, by walking the
// straight stretches between the element positions a report gives. Beyond the last node it goes
// on along the last element's outgoing heading.
type foldedPath struct {
	nodes   []optics.PathNode
	tailDir r2.Vec
}

// newFoldedPath starts at the source and adds each element's first vertex and, for an element of
// several faces, its last face's vertex, skipping positions that are not finite numbers.
func newFoldedPath(s optics.Source, elements []optics.ElementPlace) foldedPath {
	src, srcDir := r2.Vec{X: s.XMM, Y: s.YMM}, unitDeg(s.HeadingDeg)
	if !finiteVec(src) || !finiteVec(srcDir) {
		src, srcDir = r2.Vec{}, r2.Vec{X: 1}
	}
	fp := foldedPath{nodes: []optics.PathNode{{PathMM: 0, At: src}}, tailDir: srcDir}
	for _, e := range elements {
		first := r2.Vec{X: e.TableXMM, Y: e.TableYMM}
		if !finiteVec(first) || !finite(e.PathMM) {
			continue
		}
		fp.nodes = append(fp.nodes, optics.PathNode{PathMM: e.PathMM, At: first})
		if n := len(e.Faces); n > 1 {
			last := e.Faces[n-1].PathMM
			if finite(last) && last > e.PathMM {
				fp.nodes = append(fp.nodes, optics.PathNode{PathMM: last, At: faceVertex(e, last)})
			}
		}
		if d := unitDeg(e.HeadingOutDeg); finiteVec(d) {
			fp.tailDir = d
		}
	}
	return fp
}

// faceVertex is the table point pathMM along the path from element e's first vertex, on its
// arriving heading: where a face of e lies.
func faceVertex(e optics.ElementPlace, pathMM float64) r2.Vec {
	first := r2.Vec{X: e.TableXMM, Y: e.TableYMM}
	return r2.Add(first, r2.Scale(pathMM-e.PathMM, unitDeg(e.HeadingInDeg)))
}

// dir is the direction of stretch i (nodes[i] to nodes[i+1]; the last node's stretch is the tail).
func (fp foldedPath) dir(i int) r2.Vec {
	if i+1 >= len(fp.nodes) {
		return fp.tailDir
	}
	return unitOr(r2.Sub(fp.nodes[i+1].At, fp.nodes[i].At), fp.tailDir)
}

// at is the table point at distance s along stretch i.
func (fp foldedPath) at(i int, s float64) r2.Vec {
	a := fp.nodes[i]
	if i+1 >= len(fp.nodes) {
		return r2.Add(a.At, r2.Scale(s-a.PathMM, fp.tailDir))
	}
	b := fp.nodes[i+1]
	if b.PathMM-a.PathMM < 1e-12 {
		return b.At
	}
	t := (s - a.PathMM) / (b.PathMM - a.PathMM)
	return r2.Add(a.At, r2.Scale(t, r2.Sub(b.At, a.At)))
}

// bands returns, for each stretch the beam samples cover, the outline of the band ±w_t around it:
// the left edge forward then the right edge back. Radii between samples are interpolated linearly
// at the stretch ends so neighbouring bands meet. Samples that are not finite, negative or out of
// order are left out; fewer than two give no band.
func (fp foldedPath) bands(samples []optics.BeamSample) [][]r2.Vec {
	var clean []optics.BeamSample
	for _, s := range samples {
		if finite(s.PathMM) && finite(s.WTMM) && s.WTMM >= 0 && (len(clean) == 0 || s.PathMM >= clean[len(clean)-1].PathMM) {
			clean = append(clean, s)
		}
	}
	if len(clean) < 2 {
		return nil
	}
	// after is the index of the first clean sample beyond s (len(clean) when there is none); the
	// samples are in path order, so it is a binary search.
	after := func(s float64) int {
		return sort.Search(len(clean), func(k int) bool { return clean[k].PathMM > s })
	}
	wAt := func(s float64) float64 {
		// The first sample from index 1 on at or beyond s closes the piece holding s.
		k := max(1, sort.Search(len(clean), func(k int) bool { return s <= clean[k].PathMM }))
		if k == len(clean) {
			return clean[len(clean)-1].WTMM
		}
		a, b := clean[k-1], clean[k]
		if b.PathMM-a.PathMM < 1e-12 {
			return b.WTMM
		}
		return a.WTMM + (b.WTMM-a.WTMM)*(s-a.PathMM)/(b.PathMM-a.PathMM)
	}
	lo, hi := clean[0].PathMM, clean[len(clean)-1].PathMM
	var out [][]r2.Vec
	for i := range fp.nodes {
		s0 := fp.nodes[i].PathMM
		s1 := hi
		if i+1 < len(fp.nodes) {
			s1 = fp.nodes[i+1].PathMM
		}
		a, b := math.Max(s0, lo), math.Min(s1, hi)
		if b <= a {
			continue
		}
		ss := []float64{a}
		for _, c := range clean[after(a):] {
			if c.PathMM >= b {
				break
			}
			ss = append(ss, c.PathMM)
		}
		ss = append(ss, b)
		n := perp(fp.dir(i))
		left := make([]r2.Vec, 0, 2*len(ss))
		var right []r2.Vec
		for _, s := range ss {
			p, w := fp.at(i, s), wAt(s)
			left = append(left, r2.Add(p, r2.Scale(w, n)))
			right = append(right, r2.Sub(p, r2.Scale(w, n)))
		}
		for k := len(right) - 1; k >= 0; k-- {
			left = append(left, right[k])
		}
		out = append(out, left)
	}
	return out
}
