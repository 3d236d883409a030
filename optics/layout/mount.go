package layout

import (
	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// DefaultMount is the footprint used for an element without a "mount" of its own: width across the
// beam and depth along it (for a mirror: along its surface and along its normal), by its type's
// rule in the kind table (optics.Kind.Mount).
func DefaultMount(e *optics.Element) optics.Mount { return optics.DefaultMount(e) }

// MountOf is the element's own mount when it has one, else DefaultMount.
func MountOf(e *optics.Element) optics.Mount {
	if e.Mount != nil {
		return *e.Mount
	}
	return DefaultMount(e)
}

// Footprint is the rectangle a mount covers on the table. Its centre is where the post stands.
type Footprint struct {
	Index   int       `json:"index"` // element index in the bench
	ID      string    `json:"id"`
	Type    string    `json:"type"`
	Center  r2.Vec    `json:"center"`
	WidthMM float64   `json:"width_mm"` // across AxisDeg
	DepthMM float64   `json:"depth_mm"` // along AxisDeg
	AxisDeg float64   `json:"axis_deg"` // direction of the depth axis, [0, 360)
	Corners [4]r2.Vec `json:"corners"`  // counter-clockwise from the back-right corner
}

// Footprints returns each element's mount footprint, in bench order. The rectangle is centred on
// the element: on the middle of a thick lens between its first and last vertex, on the vertex of
// every other element except a mirror. Its depth axis is the beam's heading, except for a mirror,
// whose mount is aligned with its surface: depth along the mirror's normal (pointing to the
// reflecting side), width along the surface, and the whole rectangle behind the surface (README
// 'The breadboard'). places must come from Walk for the same bench; extra entries on either side
// are ignored.
func Footprints(b *optics.Bench, places []optics.ElementPlace) []Footprint {
	if b == nil {
		return nil
	}
	n := min(len(b.Elements), len(places))
	fps := make([]Footprint, n)
	for i := range n {
		e, p := &b.Elements[i], places[i]
		m := MountOf(e)
		first := r2.Vec{X: p.TableXMM, Y: p.TableYMM}
		center := along(first, p.HeadingInDeg, elementLength(b, e)/2)
		axis := p.HeadingInDeg
		switch {
		case e.Type == optics.TypeMirror:
			// The optic sits at the front of its mount and the post behind it, on the side away
			// from the beam: the footprint's front edge lies on the reflecting surface.
			axis = mirrorNormalDeg(p.HeadingInDeg, p.HeadingOutDeg)
			center = along(first, axis, -m.DepthMM/2)
		case e.Type == optics.TypeSplitter:
			// Midway along the plate, the mount square to the splitter's surface (a mirror's
			// normal for its reflected port).
			center = r2.Add(first, r2.Scale(0.5, elementRun(b, e, p.HeadingInDeg)))
			if e.TurnDeg != nil {
				axis = mirrorNormalDeg(p.HeadingInDeg, p.HeadingInDeg+*e.TurnDeg)
			}
		case e.Type == optics.TypePeriscope:
			center = first
		}
		fps[i] = Footprint{Index: i, ID: e.ID, Type: e.Type, Center: center, WidthMM: m.WidthMM, DepthMM: m.DepthMM, AxisDeg: axis}
		fps[i].Corners = rectangle(center, axis, m.WidthMM, m.DepthMM)
	}
	return fps
}

// mirrorNormalDeg is the heading of a mirror's normal on its reflecting side: the law of reflection
// makes it parallel to d_out - d_in. A beam that does not turn (turn 0, rejected by validation)
// leaves the normal facing the arriving beam.
func mirrorNormalDeg(inDeg, outDeg float64) float64 {
	n := r2.Sub(unitDeg(outDeg), unitDeg(inDeg))
	if r2.Norm(n) < 1e-12 {
		return NormDeg(inDeg + 180)
	}
	return headingOf(n)
}

// rectangle returns the corners of a width x depth rectangle centred on c with its depth along
// axisDeg, counter-clockwise starting at the far (along +axis) right corner.
func rectangle(c r2.Vec, axisDeg, widthMM, depthMM float64) [4]r2.Vec {
	u := unitDeg(axisDeg)
	v := perp(u)
	du, dv := r2.Scale(depthMM/2, u), r2.Scale(widthMM/2, v)
	return [4]r2.Vec{
		r2.Sub(r2.Add(c, du), dv),
		r2.Add(r2.Add(c, du), dv),
		r2.Add(r2.Sub(c, du), dv),
		r2.Sub(r2.Sub(c, du), dv),
	}
}
