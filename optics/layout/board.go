package layout

import (
	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// NewBoard lays out the table seen from above for the drawings (see optics.Board): the table and
// its holes, the folded beam path from the source through every element's position in r, the
// beam's band from r.Beam's samples, each element's faces and each placement's footprint. It works
// from the report's positions alone, so a report made by hand draws as faithfully as a computed
// one; the bench gives only what the report does not carry, the table and the source.
func NewBoard(t optics.Table, s optics.Source, r *optics.Report) *optics.Board {
	b := &optics.Board{}
	if finite(t.WidthMM) && finite(t.DepthMM) && t.WidthMM > 0 && t.DepthMM > 0 {
		b.WidthMM, b.DepthMM = t.WidthMM, t.DepthMM
		if g := r.Holes; holeRadiusMM(g.Kind) > 0 && finite(g.PitchMM) && finite(g.OffsetMM) && g.PitchMM > 0 {
			b.Holes, b.HoleRadiusMM = g, holeRadiusMM(g.Kind)
		}
	}
	fp := newFoldedPath(s, r.Elements)
	b.Path, b.TailDir, b.SourceDir = fp.nodes, fp.tailDir, fp.dir(0)
	if r.Beam != nil {
		b.Band = fp.bands(r.DrawnSamples()) // nothing is drawn past the screen or dump the path ends on
	}
	b.Elements = make([]optics.BoardElement, len(r.Elements))
	for i, e := range r.Elements {
		be := optics.BoardElement{At: r2.Vec{X: e.TableXMM, Y: e.TableYMM}, In: unitDeg(e.HeadingInDeg), Across: across(e)}
		for _, f := range e.Faces {
			be.Faces = append(be.Faces, faceVertex(e, f.PathMM))
		}
		b.Elements[i] = be
	}
	b.Mounts = BoardMounts(r.Placement)
	return b
}

// BoardMounts is each placement's footprint on the table, in the same order.
func BoardMounts(ps []optics.Placement) []optics.BoardMount {
	out := make([]optics.BoardMount, len(ps))
	for i, p := range ps {
		post := r2.Vec{X: p.TableXMM, Y: p.TableYMM}
		out[i] = optics.BoardMount{Post: post, Corners: rectangle(post, p.HeadingDeg, p.MountWidthMM, p.MountDepthMM)}
	}
	return out
}

// across is the direction of an element's faces on the table: across the arriving beam, or along
// a mirror's surface, perpendicular to its normal d_out - d_in (see mirrorNormalDeg).
func across(e optics.ElementPlace) r2.Vec {
	in := unitDeg(e.HeadingInDeg)
	if e.Type == optics.TypeMirror {
		return perp(unitOr(r2.Sub(unitDeg(e.HeadingOutDeg), in), in))
	}
	return perp(in)
}
