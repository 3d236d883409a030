package analysis

import (
	"context"
	"fmt"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/numfmt"
	"raytable/optics/paraxial"
	"raytable/optics/trace"
)

// traceRays traces the explicit rays and the fans exactly, pairs every hit with the paraxial twin
// of the ray, records the largest ray height at each element, and summarises rays that stopped
// early as warnings, one per element and status.
//
// It stops with the EDeadline error once ctx is done, checked at the start of every fan (and
// every fanCheck explicit rays).
func traceRays(ctx context.Context, b *optics.Bench, p *optics.Path, places []optics.ElementPlace, tan paraxial.Result) ([]optics.Ray, []optics.Warning, error) {
	specs := trace.AimedRays(b, p, fanAim(b, tan))
	buf := make([]trace.Point, 0, len(p.Surfaces))
	twin := make([]paraxial.Ray, len(p.Surfaces))
	rays := make([]optics.Ray, 0, len(specs))
	type stopKey struct {
		element int
		status  string
	}
	stopped := map[stopKey]int{}
	var stopOrder []stopKey

	for i, spec := range specs {
		if i%fanCheck == 0 {
			if err := deadlineErr(ctx); err != nil {
				return nil, nil, err
			}
		}
		res := trace.Trace(p, spec.K, spec.Start, buf)
		twin = paraxial.TraceInto(twin, p, spec.K, paraxial.Tangential, paraxial.Ray{Y: spec.ParaxialY, NU: spec.ParaxialU})
		ray := optics.Ray{
			Name:         spec.Name,
			WavelengthNM: p.WavelengthsNM[spec.K],
			Field:        spec.Field,
			Pupil:        spec.Pupil,
			Status:       res.Status,
			Reason:       res.Reason,
			Start:        optics.RayStart{XMM: spec.Start.Pos.X, YMM: spec.Start.Pos.Y, Dir: vec(spec.Start.Dir)},
			Hits:         make([]optics.Hit, 0, len(res.Points)),
		}
		for _, pt := range res.Points {
			s := &p.Surfaces[pt.Surface]
			ray.Hits = append(ray.Hits, optics.Hit{
				Element:  s.ID,
				Face:     s.Face,
				Paraxial: optics.ParaxialPoint{YMM: twin[pt.Surface].Y, URad: twin[pt.Surface].NU / s.Index[spec.K]},
				Exact:    optics.ExactPoint{XMM: pt.Pos.X, YMM: pt.Pos.Y, ZMM: pt.Pos.Z, Dir: vec(pt.Dir)},
			})
			// Measured where the clear aperture is, on the surface: across the leaving beam a
			// tilted mirror's hit would look cos i too close to the centre.
			if pt.RimMM > places[s.Element].MaxExactYMM {
				places[s.Element].MaxExactYMM = pt.RimMM
			}
		}
		if res.Surface >= 0 {
			el := p.Surfaces[res.Surface].Element
			ray.StoppedAt = b.Elements[el].ID
			if res.Status != optics.RayOK {
				k := stopKey{el, res.Status}
				if stopped[k] == 0 {
					stopOrder = append(stopOrder, k)
				}
				stopped[k]++
			}
		}
		rays = append(rays, ray)
	}
	for i := range places {
		if sd := places[i].SemiDiameterMM; sd != nil && *sd > 0 {
			places[i].Clearance = ptr(places[i].MaxExactYMM / *sd)
		}
	}
	var warnings []optics.Warning
	for _, k := range stopOrder {
		e := &b.Elements[k.element]
		warnings = append(warnings, optics.Warning{
			Code:    stopCodes[k.status],
			Element: e.ID,
			Message: stopMessage(e, k.status, stopped[k], len(specs)),
		})
	}
	return rays, warnings, nil
}

// fanCheck is how many rays are traced between two looks at the deadline: at most one fan
// (optics.MaxFanRays), a fraction of a millisecond.
const fanCheck = optics.MaxFanRays

// stopCodes is the warning given for rays that end early with each status.
var stopCodes = map[string]optics.WarningCode{
	optics.RayClipped: optics.WarnRaysClipped,
	optics.RayTIR:     optics.WarnRaysTIR,
	optics.RayMissed:  optics.WarnRaysMissed,
}

func stopMessage(e *optics.Element, status string, n, total int) string {
	switch status {
	case optics.RayClipped:
		return fmt.Sprintf("%d of %d traced rays are cut by the %s mm clear aperture of %s", n, total, num(2*e.SemiDiameterMM()), e.ID)
	case optics.RayTIR:
		return fmt.Sprintf("%d of %d traced rays are totally reflected inside %s", n, total, e.ID)
	default:
		return fmt.Sprintf("%d of %d traced rays miss a face of %s", n, total, e.ID)
	}
}

func vec(v r3.Vec) [3]float64 { return [3]float64{v.X, v.Y, v.Z} }

// num formats a length compactly: 25.4, 0.04, 150.
var num = numfmt.Brief.Format

// fanAim centres the off-axis fans on the paraxial chief ray of the primary wavelength in the
// table plane, which passes through the centre of the aperture stop (paraxial.Analyze): the chief
// ray is linear in the field, so its start for the largest field, divided by that field, serves
// every field.
func fanAim(b *optics.Bench, tan paraxial.Result) trace.Aim {
	c := tan.ChiefStart
	if b.Source.Kind == optics.SourcePoint {
		if c.Y != 0 {
			return trace.Aim{UPerField: c.NU / c.Y}
		}
		return trace.Aim{}
	}
	if c.NU != 0 {
		return trace.Aim{YPerField: c.Y / c.NU}
	}
	return trace.Aim{}
}
