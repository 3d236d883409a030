package beam

import (
	"fmt"
	"math"

	"raytable/optics"
	"raytable/optics/numfmt"
	"raytable/optics/paraxial"
)

// SafetyWarnings checks the bench with the paraxial ray bundle of the source (no beam needed):
//
//   - back-reflection-focus: the Fresnel reflection off each refracting face, traced back upstream
//     through the surfaces before it, comes to a focus within 25 mm of the source (in front of it
//     or inside the laser) or of an element upstream, or inside glass. The reflecting face acts as
//     a mirror of radius -R seen from the incoming light; going back, every surface keeps its power.
//   - focus-in-glass, focus-near-glass: the source bundle comes to a focus inside glass or within
//     1 mm of a glass surface (a damage risk for a laser).
//
// The bundle is the on-axis marginal ray: parallel to the axis for a collimated source, from the
// axis point of the object plane for a point source; the focus positions do not depend on its
// height or slope. Both planes are followed. Surfaces after a dump get no light and are skipped.
// Thin lenses have no face geometry and mirrors send their reflection downstream, so only
// refracting faces are checked for back-reflections.
func SafetyWarnings(b *optics.Bench, p *optics.Path) []optics.Warning {
	if b == nil || p == nil || len(p.Surfaces) == 0 {
		return nil
	}
	var r0 paraxial.Ray
	switch b.Source.Kind {
	case optics.SourceCollimated:
		r0 = paraxial.Ray{Y: 1}
	case optics.SourcePoint, optics.SourceFiber:
		r0 = paraxial.Ray{NU: 1}
	default:
		return nil
	}
	for i := range p.Surfaces {
		if len(p.Surfaces[i].Index) == 0 {
			return nil
		}
	}
	st := stretches(p)
	var ws warnSet
	ghosts := map[int]bool{} // the faces whose reflection comes to a hazardous focus
	for _, plane := range []paraxial.Plane{paraxial.Tangential, paraxial.Sagittal} {
		arrive, leave := traceRay(p, plane, r0)
		lit := st[:len(arrive)+1]
		if p.Surfaces[len(arrive)-1].Stops {
			lit = lit[:len(lit)-1] // nothing passes the dump
		}
		for _, x := range lit {
			r := r0
			if x.I > 0 {
				r = leave[x.I-1]
			}
			z, ok := crossing(x, r)
			if !ok || (x.I == 0 && sameZ(z, 0)) {
				continue
			}
			if code, id, where, hit := focusHazard(p, x, z); hit {
				ws.add(code, id, id, plane, fmt.Sprintf("the paraxial focus of the source's ray bundle lies %s", where))
			}
		}
		for j := range arrive {
			if p.Surfaces[j].Kind != optics.Refracting {
				continue
			}
			if where, hit := backReflection(p, st, j, arrive[j], plane); hit {
				s := &p.Surfaces[j]
				ws.add(CodeBackReflection, s.ID, ghostKey(s), plane, fmt.Sprintf("the reflection off face %d of %s goes back upstream and comes to a focus %s", s.Face, s.ID, where))
				ghosts[j] = true
			}
		}
	}
	out := ws.list()
	ghostPower(b, p, ghosts, ws.index, out)
	return out
}

func ghostKey(s *optics.Surface) string { return fmt.Sprintf("%s face %d", s.ID, s.Face) }

// ghostPower adds to each back-reflection warning the power its ghost carries, when the source
// states one: the power arriving at the face (after the clear apertures and the faces before it)
// times the face's reflectance (README "Power").
func ghostPower(b *optics.Bench, p *optics.Path, faces map[int]bool, index map[[2]string]int, out []optics.Warning) {
	avgMW, _, _, stated := b.Source.SourcePower()
	if !stated || len(faces) == 0 {
		return
	}
	for _, ep := range budgetOf(b, p) {
		for _, l := range ep.losses {
			// A splitter plate's first face reflects its split: that is the light it sends back.
			if !faces[l.surface] || l.kind == lossLeak {
				continue
			}
			s := &p.Surfaces[l.surface]
			if i, ok := index[[2]string{string(CodeBackReflection), ghostKey(s)}]; ok {
				out[i].Message += fmt.Sprintf(" The ghost carries about %s mW.", numfmt.Message.Format(l.share*avgMW))
			}
		}
	}
}

// traceRay follows a paraxial ray in one plane at the primary wavelength up to the first dump
// (included), giving it just before and just after each surface's power.
func traceRay(p *optics.Path, plane paraxial.Plane, r paraxial.Ray) (arrive, leave []paraxial.Ray) {
	for i := range p.Surfaces {
		r = paraxial.GapMatrix(p, i, 0, plane).Apply(r)
		arrive = append(arrive, r)
		r = paraxial.SurfaceMatrix(p, i, 0, plane).Apply(r)
		leave = append(leave, r)
		if p.Surfaces[i].Stops {
			break
		}
	}
	return arrive, leave
}

// crossing is where a ray starting stretch x as r meets the axis: y + (z - Z0)·(n·u)/n = 0.
func crossing(x stretch, r paraxial.Ray) (float64, bool) {
	if r.NU == 0 {
		return 0, false
	}
	z := x.Z0 - r.Y*x.N/r.NU
	return z, x.contains(z)
}

// focusHazard says whether a focus at z in stretch x lies inside glass or within 1 mm of a
// refracting face, with the element concerned and a plain description of where.
func focusHazard(p *optics.Path, x stretch, z float64) (code optics.WarningCode, id, where string, hit bool) {
	if x.Glass() {
		prev := &p.Surfaces[x.I-1]
		return CodeFocusInGlass, prev.ID, fmt.Sprintf("inside the glass of %s, %s after its face %d (path %.1f mm)", prev.ID, mm(z-x.Z0), prev.Face, z), true
	}
	best := math.Inf(1)
	if x.I > 0 && p.Surfaces[x.I-1].Kind == optics.Refracting && z-x.Z0 <= nearGlassMM {
		s := &p.Surfaces[x.I-1]
		best = z - x.Z0
		code, id, where = CodeFocusNearGlass, s.ID, fmt.Sprintf("%s after face %d of %s (path %.1f mm)", mm(best), s.Face, s.ID, z)
	}
	if x.I < len(p.Surfaces) && p.Surfaces[x.I].Kind == optics.Refracting && x.Z1-z <= nearGlassMM && x.Z1-z < best {
		s := &p.Surfaces[x.I]
		code, id, where = CodeFocusNearGlass, s.ID, fmt.Sprintf("%s before face %d of %s (path %.1f mm)", mm(x.Z1-z), s.Face, s.ID, z)
	}
	return code, id, where, code != ""
}

// backReflection traces the reflection off refracting face j back upstream and reports the first
// focus it forms inside glass or within 25 mm of the source or of an element upstream of j's.
// arriving is the ray just before face j.
func backReflection(p *optics.Path, st []stretch, j int, arriving paraxial.Ray, plane paraxial.Plane) (string, bool) {
	s := &p.Surfaces[j]
	n := p.IndexBefore(j, 0)
	// Seen from the incoming light the face is a mirror of curvature c_m = -c (+ concave) in a
	// medium of index n. Unfolded, such a mirror has reduced power P = 2·n·c_m, so its matrix
	// [1 0; -P 1] has C = 2·n·c. Heights stay continuous, and going back the light meets the
	// earlier surfaces in reverse order with unchanged powers (curvature and indices both swap).
	r := paraxial.Matrix{A: 1, C: 2 * n * s.Curvature, D: 1}.Apply(arriving)
	for k := j - 1; k >= -1; k-- {
		zA := p.Surfaces[k+1].PathMM
		zB := -backReflectionReachMM // beyond the source, into the laser
		if k >= 0 {
			zB = p.Surfaces[k].PathMM
		}
		x := st[k+1]
		if r.NU != 0 {
			d := -r.Y * x.N / r.NU // distance travelled back to the axis crossing
			if d > 0 && d <= zA-zB {
				if where, hit := backHazard(p, x, zA-d, s.Element); hit {
					return where, true
				}
			}
		}
		r = paraxial.Transfer(zA-zB, x.N).Apply(r)
		if k >= 0 {
			r.NU -= paraxial.Power(&p.Surfaces[k], p.IndexBefore(k, 0), p.Surfaces[k].Index[0], plane) * r.Y
		}
	}
	return "", false
}

// backHazard says whether a ghost focus at z in stretch x is dangerous: inside glass, or within
// 25 mm of the source or of a surface of an element before element ei.
func backHazard(p *optics.Path, x stretch, z float64, ei int) (string, bool) {
	if x.Glass() {
		return fmt.Sprintf("inside the glass of %s (path %.1f mm)", p.Surfaces[x.I].ID, z), true
	}
	best, where := math.Inf(1), ""
	if d := math.Abs(z); d <= backReflectionReachMM {
		best = d
		if z < 0 {
			where = fmt.Sprintf("%s behind the source plane, inside the source", mm(d))
		} else {
			where = fmt.Sprintf("%s in front of the source (path %.1f mm)", mm(d), z)
		}
	}
	for m := range p.Surfaces {
		u := &p.Surfaces[m]
		if u.Element >= ei {
			break
		}
		if d := math.Abs(z - u.PathMM); d <= backReflectionReachMM && d < best {
			best, where = d, fmt.Sprintf("%s from %s (path %.1f mm)", mm(d), u.ID, z)
		}
	}
	return where, where != ""
}

// beamFocusWarnings reports the beam's own waists that lie inside glass or within 1 mm of a glass
// surface. A waist counts as a focus when the beam converges into it within its stretch, which
// leaves out the source's waist at the source plane.
func beamFocusWarnings(p *optics.Path, g gaussian, st []stretch, t, s *planeTrace) []optics.Warning {
	var ws warnSet
	for _, x := range st[:litStretches(p)] {
		for _, pl := range []struct {
			plane paraxial.Plane
			tr    *planeTrace
		}{{paraxial.Tangential, t}, {paraxial.Sagittal, s}} {
			w, ok := waistIn(pl.tr.g, x, pl.tr.at(x.I))
			if !ok || sameZ(w.zMM, x.Z0) {
				continue
			}
			if code, id, where, hit := focusHazard(p, x, w.zMM); hit {
				ws.add(code, id, id, pl.plane, fmt.Sprintf("the beam comes to a waist of radius %.3g µm %s", 1000*w.radiusMM, where))
			}
		}
	}
	return ws.list()
}

// litStretches is the number of stretches light reaches: up to the first dump, or all of them.
func litStretches(p *optics.Path) int {
	for i := range p.Surfaces {
		if p.Surfaces[i].Stops {
			return i + 1
		}
	}
	return len(p.Surfaces) + 1
}

// mm writes a distance for a message, without a long tail of digits for tiny ones.
func mm(d float64) string {
	if math.Abs(d) < 0.01 {
		return "less than 0.01 mm"
	}
	return numfmt.Rough.Format(d) + " mm"
}

// warnSet collects warnings, one per code and key (an element, or a face), noting which planes
// found it.
type warnSet struct {
	ws     []optics.Warning
	planes []string
	index  map[[2]string]int
}

func (w *warnSet) add(code optics.WarningCode, id, key string, plane paraxial.Plane, msg string) {
	name := "tangential"
	if plane == paraxial.Sagittal {
		name = "sagittal"
	}
	if w.index == nil {
		w.index = map[[2]string]int{}
	}
	k := [2]string{string(code), key}
	if i, ok := w.index[k]; ok {
		if w.planes[i] != name && w.planes[i] != "tangential and sagittal" {
			w.planes[i] = "tangential and sagittal"
		}
		return
	}
	w.index[k] = len(w.ws)
	w.ws = append(w.ws, optics.Warning{Code: code, Element: id, Message: msg})
	w.planes = append(w.planes, name)
}

func (w *warnSet) list() []optics.Warning {
	out := make([]optics.Warning, len(w.ws))
	for i, x := range w.ws {
		x.Message = fmt.Sprintf("%s (%s plane%s).", x.Message, w.planes[i], map[bool]string{true: "s"}[w.planes[i] == "tangential and sagittal"])
		out[i] = x
	}
	return out
}
