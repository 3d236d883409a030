package layout

import (
	"math"

	"gonum.org/v1/gonum/spatial/r2"

	"raytable/optics"
)

// Default mount sizes, common practice for 1-inch-class optics on posts (our own round numbers, not
// any maker's drawing): a lens holder is a plate about 15 mm wider than the optic and 15-20 mm
// thick along the beam; a mirror mount is roughly square, about 15 mm larger than the mirror; an
// iris housing is at least 40 mm across whatever its opening; a screen or camera body about 20 mm
// wider than its sensitive width and 30 mm deep; a beam dump a 30 mm block.
const (
	defaultOpticDiameterMM = 25.4 // assumed when a lens, thin lens or mirror gives no diameter
	mountMarginMM          = 15   // mount width beyond the optic's diameter
	lensMountDepthMM       = 18   // lens holder thickness along the beam
	lensMountLipMM         = 6    // a thick lens's mount reaches this far beyond its glass
	irisMinWidthMM         = 40
	irisMarginMM           = 20
	irisDepthMM            = 12
	defaultScreenWidthMM   = 25 // assumed when a screen gives no width
	screenMarginMM         = 20
	screenDepthMM          = 30
	dumpSizeMM             = 30
)

// DefaultMount is the footprint used for an element without a "mount" of its own: width across the
// beam and depth along it (for a mirror: along its surface and along its normal).
func DefaultMount(e *optics.Element) optics.Mount {
	switch e.Type {
	case optics.TypeLens, optics.TypeThinLens:
		d := diameterOr(e.DiameterMM, defaultOpticDiameterMM)
		depth := float64(lensMountDepthMM)
		if l := elementLength(e) + lensMountLipMM; l > depth {
			depth = l
		}
		return optics.Mount{WidthMM: d + mountMarginMM, DepthMM: depth}
	case optics.TypeMirror:
		s := diameterOr(e.DiameterMM, defaultOpticDiameterMM) + mountMarginMM
		return optics.Mount{WidthMM: s, DepthMM: s}
	case optics.TypeAperture:
		w := diameterOr(e.DiameterMM, 0) + irisMarginMM
		return optics.Mount{WidthMM: math.Max(w, irisMinWidthMM), DepthMM: irisDepthMM}
	case optics.TypeScreen:
		return optics.Mount{WidthMM: diameterOr(e.WidthMM, defaultScreenWidthMM) + screenMarginMM, DepthMM: screenDepthMM}
	default: // dump, and anything unknown
		return optics.Mount{WidthMM: dumpSizeMM, DepthMM: dumpSizeMM}
	}
}

func diameterOr(d *float64, fallback float64) float64 {
	if d == nil || !finite(*d) || *d < 0 {
		return fallback
	}
	return *d
}

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
// every other element. Its depth axis is the beam's heading, except for a mirror, whose mount is
// aligned with its surface: depth along the mirror's normal (pointing to the reflecting side), width
// along the surface. places must come from Walk for the same bench; extra entries on either side
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
		center := along(first, p.HeadingInDeg, elementLength(e)/2)
		axis := p.HeadingInDeg
		if e.Type == optics.TypeMirror {
			axis = mirrorNormalDeg(p.HeadingInDeg, p.HeadingOutDeg)
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
