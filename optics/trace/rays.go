package trace

import (
	"fmt"
	"math"
	"strconv"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
)

// RaySpec is one ray the report traces: where it starts, at which wavelength, and its paraxial
// twin (tangential height and slope dy/dz at the source plane).
type RaySpec struct {
	Name      string
	K         int     // wavelength index into Path.WavelengthsNM
	Field     string  // "0.5 deg" or "1.5 mm" for fan rays, "" for explicit rays
	Pupil     float64 // -1..1 across the pupil for fan rays, 0 for explicit rays
	Start     Start
	ParaxialY float64
	ParaxialU float64
}

// Rays lists the rays of a bench in report order: the explicit rays first (named explicit[0],
// explicit[1], ... and traced at the primary wavelength), then, for each field and each
// wavelength, a meridional fan of Source.FanRayCount() rays across the pupil from -1 to 1.
//
// A collimated source's fan is a bundle of parallel rays at the field angle a, at heights
// pupil·semi_diameter on the source plane, direction ∝ (0, tan a, 1). A point source's fan leaves
// the object point (0, h, 0) at angles pupil·asin(NA) in the table plane; its paraxial twin has
// slope pupil·NA, so the marginal ray has u = NA.
func Rays(b *optics.Bench, p *optics.Path) []RaySpec {
	return AimedRays(b, p, Aim{})
}

// Aim is where the fans of an off-axis field are centred, per unit of field (tan of the field
// angle for a collimated source, the object height in mm for a point source): the paraxial chief
// ray's start, which passes through the centre of the aperture stop. The zero Aim centres every
// fan on the axis at the source plane (collimated) or on the axis direction (point), which is the
// chief ray when the source itself is the stop.
type Aim struct {
	YPerField float64 // a collimated fan's centre height at the source plane, mm per unit tan(angle)
	UPerField float64 // a point fan's centre slope dy/dz, per mm of object height
}

// AimedRays is Rays with the off-axis fans centred on the chief ray through the aperture stop
// (README, Report, Rays), so that their blur and the system values describe the same bundle: a
// collimated fan at field angle a spans heights tan(a)·YPerField + pupil·semi_diameter; a point
// fan from height h spans angles atan(h·UPerField) + pupil·asin(NA), its paraxial twin the slopes
// h·UPerField + pupil·NA.
func AimedRays(b *optics.Bench, p *optics.Path, aim Aim) []RaySpec {
	src := &b.Source
	n := src.FanRayCount()
	if n < 0 {
		n = 0
	}
	var fields []float64
	fieldUnit, point := "deg", src.Diverging()
	if point {
		fields, fieldUnit = src.ObjectHeightsMM, "mm"
	} else {
		fields = src.FieldAnglesDeg
	}
	if len(fields) == 0 {
		fields = []float64{0}
	}
	specs := make([]RaySpec, 0, len(src.Rays)+len(fields)*len(p.WavelengthsNM)*n)

	for i, r := range src.Rays {
		u := math.Tan(r.AngleDeg * math.Pi / 180)
		specs = append(specs, RaySpec{
			Name: fmt.Sprintf("explicit[%d]", i),
			Start: Start{
				Pos: r3.Vec{X: r.XMM, Y: r.HeightMM, Z: 0},
				Dir: unit(r3.Vec{X: math.Tan(r.XAngleDeg * math.Pi / 180), Y: u, Z: 1}),
			},
			ParaxialY: r.HeightMM,
			ParaxialU: u,
		})
	}

	semi, na := 0.0, 0.0
	if src.SemiDiameterMM != nil {
		semi = *src.SemiDiameterMM
	}
	if len(p.WavelengthsNM) > 0 {
		na = src.ConeNA(p.WavelengthsNM[0])
	}
	digits := len(strconv.Itoa(max(n-1, 0)))
	for _, f := range fields {
		fs := strconv.FormatFloat(f, 'g', -1, 64)
		for k, wl := range p.WavelengthsNM {
			ws := strconv.FormatFloat(wl, 'g', -1, 64)
			for j := range n {
				pupil := fanPupil(j, n)
				spec := RaySpec{
					Name:  fmt.Sprintf("fan %s%s %snm %0*d", fs, fieldUnit, ws, digits, j),
					K:     k,
					Field: fs + " " + fieldUnit,
					Pupil: pupil,
				}
				if point {
					centre := f * aim.UPerField
					theta := math.Atan(centre) + pupil*math.Asin(math.Min(na, 1))
					spec.Start = Start{Pos: r3.Vec{X: 0, Y: f, Z: 0}, Dir: r3.Vec{X: 0, Y: math.Sin(theta), Z: math.Cos(theta)}}
					spec.ParaxialY, spec.ParaxialU = f, centre+pupil*na
				} else {
					u := math.Tan(f * math.Pi / 180)
					y := u*aim.YPerField + pupil*semi
					spec.Start = Start{Pos: r3.Vec{X: 0, Y: y, Z: 0}, Dir: unit(r3.Vec{X: 0, Y: u, Z: 1})}
					spec.ParaxialY, spec.ParaxialU = y, u
				}
				specs = append(specs, spec)
			}
		}
	}
	return specs
}

// fanPupil is ray j's pupil coordinate in a fan of n rays from -1 to 1, 0 for a single ray. It is
// (2j - (n-1))/(n-1): the numerator is an exact integer, so rays j and n-1-j get coordinates of
// exactly opposite sign and a symmetric fan stays symmetric to the last bit (-1 + 2j/(n-1) rounds
// differently on the two sides and clipped a round-number fan unevenly).
func fanPupil(j, n int) float64 {
	if n <= 1 {
		return 0
	}
	return float64(2*j-(n-1)) / float64(n-1)
}
