package paraxial

import (
	"math"

	"raytable/optics"
)

// StopSource is the aperture stop's name when nothing on the bench limits the axial bundle more
// than the source's own extent (its semi-diameter or numerical aperture).
const StopSource = "source"

// Result is the paraxial analysis of a path in one plane at one wavelength.
type Result struct {
	Values optics.PlaneValues

	// StopSurface is the surface index of the aperture stop, -1 when the stop is the source.
	StopSurface int
	// MarginalStart and ChiefStart are the two rays at the source plane.
	MarginalStart, ChiefStart Ray
	// Marginal and Chief are the rays leaving each surface (index = surface index). The marginal
	// ray fills the stop; the chief ray comes from the largest field through the stop centre.
	Marginal, Chief []Ray
	// UnitField is true when every field is zero: the chief ray then belongs to a unit field
	// (slope 1 or height 1 mm) so that pupils can still be found, and the reported Lagrange
	// invariant and image height are those of the real, zero field.
	UnitField bool
	// Lagrange is the invariant n(ū y - u ȳ) of the Marginal and Chief rays after each surface.
	Lagrange []float64
}

// stopMargin is how much more than the source's own extent a surface must cut the axial bundle to
// be the stop; equal apertures leave the source as the stop.
const stopMargin = 1e-12

// Analyze finds the aperture stop, the marginal and chief rays, pupils, f-number, image-side NA,
// the Lagrange invariant and the image height of p at wavelength index k in the given plane, with
// b's source. Values.Cardinal is Cardinals(p, k, plane, &b.Source).
//
// The stop is the surface whose clear aperture most limits a ray from the axial source point: the
// largest ratio |y|/semi-aperture of the source's full axial ray (height semi_diameter_mm for a
// collimated source; for a point source the slope tan(asin na) of the exact cone's edge, so that
// the paraxial and the exact trace agree on the stop), provided it exceeds 1; otherwise the
// source itself, with a marginal ray of slope na. Surfaces after a dump receive no light and are not candidates.
//
// The pupils are where the chief ray, extended in object space and in image space, crosses the
// axis: by construction those are the images of the stop centre through what precedes and what
// follows it. Their radii are the marginal ray's heights there. A pupil at infinity (telecentric
// chief ray) is nil.
func Analyze(b *optics.Bench, p *optics.Path, k int, plane Plane) Result {
	src := &b.Source
	res := Result{StopSurface: -1}
	res.Values.Cardinal = Cardinals(p, k, plane, src)
	res.Values.ApertureStop = StopSource

	point := src.Diverging()
	// The source's full axial ray: every candidate stop is measured against it.
	axial := Ray{Y: 1}
	if point {
		axial = Ray{NU: 1}
	}
	if !point && src.SemiDiameterMM != nil {
		axial.Y = *src.SemiDiameterMM
	}
	// The stop is searched with the ray the exact cone's edge follows: a point source's cone of
	// numerical aperture NA leaves at the angle asin(NA), whose slope is tan(asin NA), larger
	// than NA (trace.Rays). Searching with u = NA would call the source the stop at NA 0.4 while a
	// lens clips the exact rays. When the source stays the stop the marginal ray keeps u = NA,
	// the paraxial convention; when a surface is the stop the marginal ray fills it.
	search := axial
	if na := src.ConeNA(p.WavelengthsNM[0]); point && na > 0 {
		axial.NU = na
		search.NU = ConeSlope(na)
	}
	axialTrace := Trace(p, k, plane, search)
	stop, ratio := limitingSurface(p, axialTrace, plane)
	res.MarginalStart = axial
	if stop >= 0 && ratio > 1+stopMargin {
		res.StopSurface = stop
		res.Values.ApertureStop = p.Surfaces[stop].ID
		res.MarginalStart = Ray{Y: search.Y / ratio, NU: search.NU / ratio}
	}
	res.Marginal = Trace(p, k, plane, res.MarginalStart)

	field := largestField(src)
	res.UnitField = field == 0
	if res.UnitField {
		field = 1
	}
	res.ChiefStart = chiefStart(p, k, plane, point, field, res.StopSurface)
	res.Chief = Trace(p, k, plane, res.ChiefStart)

	res.Lagrange = make([]float64, len(p.Surfaces))
	for i := range p.Surfaces {
		res.Lagrange[i] = Lagrange(res.Marginal[i], res.Chief[i])
	}
	// With no field the true invariant and image height are zero; the unit chief ray only serves
	// to locate the pupils.
	res.Values.LagrangeInvariant = ptr(0)
	if !res.UnitField {
		res.Values.LagrangeInvariant = ptr(Lagrange(res.MarginalStart, res.ChiefStart))
	}

	first, last, ok := p.OpticalRange()
	if !ok {
		return res
	}
	pupils(&res, p, k, first, last)
	nImg := p.Surfaces[last].Index[k]
	res.Values.ImageNA = ptr(math.Abs(res.Marginal[last].NU))

	v := &res.Values
	if *v.ImageNA > 0 {
		v.WorkingFNumber = ptr(1 / (2 * *v.ImageNA))
	}
	if point {
		if *v.ImageNA > 0 {
			v.FNumber = ptr(1 / (2 * *v.ImageNA))
		}
	} else if v.EFLMM != nil && v.EntrancePupilRadiusMM != nil && *v.EntrancePupilRadiusMM > 0 {
		v.FNumber = ptr(math.Abs(*v.EFLMM) / (2 * *v.EntrancePupilRadiusMM))
	}
	if v.ImageDistanceMM != nil {
		v.ImageHeightMM = ptr(0)
		if !res.UnitField {
			v.ImageHeightMM = ptr(At(res.Chief[last], *v.ImageDistanceMM, nImg).Y)
		}
	}
	return res
}

// ConeSlope is the slope dy/dz of the edge of a cone of numerical aperture na in air,
// tan(asin na); na of 1 or more is a hemisphere, given the slope of a ray at 89.9° so that stop
// searches stay finite.
func ConeSlope(na float64) float64 {
	if na >= 1 {
		return math.Tan(89.9 * math.Pi / 180)
	}
	return na / math.Sqrt(1-na*na)
}

// limitingSurface returns the surface where the axial ray fills the largest fraction of the
// clear aperture, and that fraction; -1 when no surface up to the first dump has a finite
// aperture.
func limitingSurface(p *optics.Path, axial []Ray, plane Plane) (int, float64) {
	best, ratio := -1, 0.0
	for i := range p.Surfaces {
		s := &p.Surfaces[i]
		if a := BeamSemiAperture(s, plane); a > 0 && !math.IsInf(a, 1) {
			if r := math.Abs(axial[i].Y) / a; r > ratio {
				best, ratio = i, r
			}
		}
		if s.Stops {
			break
		}
	}
	return best, ratio
}

// BeamSemiAperture is the largest ray height, measured across the beam in the given plane, that a
// surface lets through. A tilted surface's clear aperture (a mirror's, a splitter's, a periscope
// mirror's) is measured on the surface; met at incidence i, a beam of half-width a·cos i in the
// plane of incidence already spans it, since its footprint is stretched by 1/cos i along the tilt.
func BeamSemiAperture(s *optics.Surface, plane Plane) float64 {
	if IncidencePlane(s, plane) {
		return s.SemiAperture * math.Cos(s.IncidenceRad)
	}
	return s.SemiAperture
}

// IncidencePlane reports whether the beam's plane is the plane of incidence of a tilted surface
// s, the plane in which its footprint on s is stretched by 1/cos i: the table plane for mirrors
// and splitters, the vertical plane for a periscope's mirrors (optics.Fold).
func IncidencePlane(s *optics.Surface, plane Plane) bool {
	if s.IncidenceRad == 0 {
		return false
	}
	if s.Kind == optics.Fold {
		return TablePlane(s, plane) == Sagittal
	}
	return TablePlane(s, plane) == Tangential
}

// largestField is the field of largest magnitude, with its sign: tan(angle) for a collimated
// source, the object height in mm for a point source.
func largestField(src *optics.Source) float64 {
	var best float64
	if src.Diverging() {
		for _, h := range src.ObjectHeightsMM {
			if math.Abs(h) > math.Abs(best) {
				best = h
			}
		}
		return best
	}
	for _, a := range src.FieldAnglesDeg {
		if t := math.Tan(a * math.Pi / 180); math.Abs(t) > math.Abs(best) {
			best = t
		}
	}
	return best
}

// chiefStart is the chief ray at the source plane for the given field, aimed at the centre of
// the stop. A collimated source fixes the slope and the starting height is chosen; a point source
// fixes the height and the slope is chosen. When the source is the stop, a collimated bundle is
// centred on the axis at the source plane and a point source's cone is centred on the axis
// direction at every object point (object-side telecentric).
func chiefStart(p *optics.Path, k int, plane Plane, point bool, field float64, stop int) Ray {
	if stop < 0 {
		if point {
			return Ray{Y: field}
		}
		return Ray{NU: field}
	}
	// Heights at the stop of the two unit rays; the stop was chosen because the source's axial
	// ray reaches it off axis, so the coefficient divided by here is not zero.
	hy := heightAt(p, k, plane, Ray{Y: 1}, stop)
	hu := heightAt(p, k, plane, Ray{NU: 1}, stop)
	if point {
		return Ray{Y: field, NU: -field * hy / hu}
	}
	return Ray{Y: -field * hu / hy, NU: field}
}

func heightAt(p *optics.Path, k int, plane Plane, r Ray, surface int) float64 {
	return Trace(p, k, plane, r)[surface].Y
}

// farMM is the distance beyond which a pupil counts as at infinity: a chief ray whose slope is
// rounding noise would otherwise put it 1e15 mm away. No bench comes near a thousand kilometres.
const farMM = 1e9

// pupils fills the entrance and exit pupils from the chief ray's axis crossings in object space
// (air, before the first optical vertex) and image space (after the last).
func pupils(res *Result, p *optics.Path, k, first, last int) {
	v := &res.Values
	zFirst := p.Surfaces[first].PathMM
	n := p.IndexBefore(first, k)
	if z, ok := axisCrossing(res.ChiefStart, n); ok {
		v.EntrancePupilMM = ptr(z - zFirst)
		v.EntrancePupilRadiusMM = ptr(math.Abs(At(res.MarginalStart, z, n).Y))
	}
	nImg := p.Surfaces[last].Index[k]
	if d, ok := axisCrossing(res.Chief[last], nImg); ok {
		v.ExitPupilMM = ptr(d)
		v.ExitPupilRadiusMM = ptr(math.Abs(At(res.Marginal[last], d, nImg).Y))
	}
}

// axisCrossing is how far along the axis a ray, in a medium of index n, crosses it; ok is false
// when it runs parallel to the axis (the crossing is at infinity).
func axisCrossing(r Ray, n float64) (float64, bool) {
	if r.NU == 0 {
		return 0, false
	}
	d := -r.Y * n / r.NU
	return d, math.Abs(d) < farMM
}
