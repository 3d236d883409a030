package diagram

import (
	"fmt"
	"math"

	"raytable/optics"
	"raytable/optics/layout"
)

// The fixtures below are hand-made inputs for the drawings: plausible positions and ray heights
// chosen by hand (thin-lens bookkeeping in fixtureRay, not a trace of any real system). The
// drawing code must reproduce them faithfully; whether they are optically exact does not matter.

func fp(v float64) *float64 { return &v }
func sp(s string) *string   { return &s }

// fixtureBench is a 600 x 300 mm metric table: a lens, an iris, a 90° fold mirror, a thin lens, a
// screen and a dump.
func fixtureBench() *optics.Bench {
	return &optics.Bench{
		Format:        optics.FormatBenchV1,
		Title:         "Fixture <bench> & fold",
		WavelengthsNM: []float64{632.8, 532},
		Table:         optics.Table{Grid: optics.GridMetric25, WidthMM: 600, DepthMM: 300, BeamHeightMM: 75},
		Source:        optics.Source{XMM: 50, YMM: 100, HeadingDeg: 0, Kind: optics.SourceCollimated, SemiDiameterMM: fp(4)},
	}
}

// fixtureElements: path positions and table positions along the folded path.
func fixtureElements() []optics.ElementPlace {
	return []optics.ElementPlace{
		{ID: "L1", Type: optics.TypeLens, PathMM: 50, TableXMM: 100, TableYMM: 100, SemiDiameterMM: fp(12.7),
			Faces: []optics.FacePlace{
				{PathMM: 50, RadiusMM: fp(51.5), SemiDiameterMM: fp(12.7), MaterialAfter: "glass"},
				{PathMM: 55, RadiusMM: fp(-51.5), SemiDiameterMM: fp(12.7), MaterialAfter: "air"},
			}},
		{ID: "A1", Type: optics.TypeAperture, PathMM: 100, TableXMM: 150, TableYMM: 100, SemiDiameterMM: fp(2),
			Faces: []optics.FacePlace{{PathMM: 100, SemiDiameterMM: fp(2), MaterialAfter: "air"}}},
		{ID: "M1", Type: optics.TypeMirror, PathMM: 150, TableXMM: 200, TableYMM: 100, HeadingInDeg: 0, HeadingOutDeg: 90,
			SemiDiameterMM: fp(12.7), Faces: []optics.FacePlace{{PathMM: 150, RadiusMM: fp(500), SemiDiameterMM: fp(12.7), MaterialAfter: "air"}}},
		{ID: "T1", Type: optics.TypeThinLens, PathMM: 200, TableXMM: 200, TableYMM: 150, HeadingInDeg: 90, HeadingOutDeg: 90,
			SemiDiameterMM: fp(10), Faces: []optics.FacePlace{{PathMM: 200, SemiDiameterMM: fp(10), MaterialAfter: "air"}}},
		{ID: "SC", Type: optics.TypeScreen, PathMM: 260, TableXMM: 200, TableYMM: 210, HeadingInDeg: 90, HeadingOutDeg: 90,
			Faces: []optics.FacePlace{{PathMM: 260, MaterialAfter: "air"}}},
		{ID: "D", Type: optics.TypeDump, PathMM: 300, TableXMM: 200, TableYMM: 250, HeadingInDeg: 90, HeadingOutDeg: 90,
			Faces: []optics.FacePlace{{PathMM: 300, MaterialAfter: "air"}}},
	}
}

// fixtureRay follows a ray of start height y0 with thin-lens bookkeeping: L1 focal 50 mm at 52.5,
// the mirror focal 250 mm, T1 focal 80 mm. stop ends it at the named element with a status.
func fixtureRay(name string, nm, y0 float64, status, stop, reason string) optics.Ray {
	type face struct {
		id     string
		face   int
		z, pow float64 // vertex and power (1/focal) applied at this face
		sd     float64
	}
	faces := []face{{"L1", 0, 50, 0, 12.7}, {"L1", 1, 55, 1.0 / 50, 12.7}, {"A1", 0, 100, 0, 2}, {"M1", 0, 150, 1.0 / 250, 12.7},
		{"T1", 0, 200, 1.0 / 80, 10}, {"SC", 0, 260, 0, math.Inf(1)}, {"D", 0, 300, 0, math.Inf(1)}}
	dispersion := 1 + (632.8-nm)*2e-4 // bluer light bends a little more, so the colours part visibly
	ray := optics.Ray{Name: name, WavelengthNM: nm, Status: status, StoppedAt: stop, Reason: reason,
		Start: optics.RayStart{YMM: y0, Dir: [3]float64{0, 0, 1}}}
	y, u, z := y0, 0.0, 0.0
	for _, f := range faces {
		y += u * (f.z - z)
		z = f.z
		u -= y * f.pow * dispersion
		d := math.Sqrt(1 + u*u)
		ray.Hits = append(ray.Hits, optics.Hit{Element: f.id, Face: f.face,
			Paraxial: optics.ParaxialPoint{YMM: y * 1.01, URad: u},
			Exact:    optics.ExactPoint{YMM: y, ZMM: -0.002 * y * y, Dir: [3]float64{0, u / d, 1 / d}}})
		if f.id == stop {
			break
		}
	}
	return ray
}

func fixtureRays() []optics.Ray {
	var rays []optics.Ray
	for _, nm := range []float64{632.8, 532} {
		for k := -2; k <= 2; k++ {
			y0 := 1.5 * float64(k)
			rays = append(rays, fixtureRay(fmt.Sprintf("fan %g nm %d", nm, k), nm, y0, optics.RayOK, "", ""))
		}
	}
	rays = append(rays, fixtureRay("edge 632.8 nm", 632.8, 4, optics.RayClipped, "A1", "height 2.5 mm > semi-diameter 2 mm <iris>"))
	rays = append(rays, fixtureRay("edge 532 nm", 532, -4, optics.RayMissed, "M1", "misses the mirror"))
	return rays
}

// fixtureBeam is a hand-made envelope: 1 mm until L1, focused to a 40 µm waist at 102.5 mm, then
// refocused by M1 and T1 to a second waist at 240 mm.
func fixtureBeam() *optics.BeamReport {
	b := &optics.BeamReport{WavelengthNM: 632.8, M2: 1}
	w := func(z float64) float64 {
		switch {
		case z < 55:
			return 1
		case z < 150:
			return math.Hypot(0.04, (z-102.5)*0.02)
		case z < 200:
			return 0.95 - (z-150)*0.003
		default:
			return math.Hypot(0.12, (z-240)*0.02)
		}
	}
	for z := 0.0; z <= 300; z += 5 {
		b.Samples = append(b.Samples, optics.BeamSample{PathMM: z, WTMM: w(z), WSMM: w(z)})
	}
	b.Waists = []optics.Waist{
		{After: sp("A1"), PathMM: 102.5, RadiusTMM: fp(0.04), RadiusSMM: fp(0.04), RayleighTMM: fp(7.9), RayleighSMM: fp(7.9)},
		{After: sp("T1"), PathMM: 240, RadiusTMM: fp(0.12), RadiusSMM: fp(0.12), RayleighTMM: fp(71), RayleighSMM: fp(71)},
	}
	return b
}

// fixturePlacement: posts at the element positions (the lens centred on its glass), mirror mount
// aligned with its normal (135° for a +x to +y fold).
func fixturePlacement() []optics.Placement {
	return []optics.Placement{
		{ID: "L1", Type: optics.TypeLens, TableXMM: 102.5, TableYMM: 100, HeadingDeg: 0, HoleColumn: 5, HoleRow: 4, OffsetXMM: 2.5, OffsetYMM: 12.5, MountWidthMM: 40.4, MountDepthMM: 18},
		{ID: "A1", Type: optics.TypeAperture, TableXMM: 150, TableYMM: 100, HeadingDeg: 0, HoleColumn: 6, HoleRow: 4, OffsetXMM: 12.5, OffsetYMM: 12.5, MountWidthMM: 40, MountDepthMM: 12},
		{ID: "M1", Type: optics.TypeMirror, TableXMM: 200, TableYMM: 100, HeadingDeg: 135, HoleColumn: 8, HoleRow: 4, OffsetXMM: 12.5, OffsetYMM: 12.5, MountWidthMM: 40.4, MountDepthMM: 40.4},
		{ID: "T1", Type: optics.TypeThinLens, TableXMM: 200, TableYMM: 150, HeadingDeg: 90, HoleColumn: 8, HoleRow: 6, OffsetXMM: 12.5, OffsetYMM: 12.5, MountWidthMM: 35, MountDepthMM: 18},
		{ID: "SC", Type: optics.TypeScreen, TableXMM: 200, TableYMM: 210, HeadingDeg: 90, HoleColumn: 8, HoleRow: 9, OffsetXMM: 12.5, OffsetYMM: -2.5, MountWidthMM: 45, MountDepthMM: 30},
		{ID: "D", Type: optics.TypeDump, TableXMM: 200, TableYMM: 230, HeadingDeg: 90, HoleColumn: 8, HoleRow: 10, OffsetXMM: 12.5, OffsetYMM: -7.5, MountWidthMM: 30, MountDepthMM: 30},
	}
}

func fixtureReport() *optics.Report {
	return &optics.Report{
		Format:        optics.FormatReportV1,
		Title:         "Fixture <bench> & fold",
		WavelengthsNM: []float64{632.8, 532},
		Elements:      fixtureElements(),
		Rays:          fixtureRays(),
		Beam:          fixtureBeam(),
		Placement:     fixturePlacement(),
		Holes:         holesFor(fixtureBench().Table),
		Warnings: []optics.Warning{
			{Code: "mounts-overlap", Element: "SC", Others: []string{"D"}, Message: "the mounts of SC and D overlap: move one of them or give a smaller mount"},
			{Code: "rays-clipped", Element: "A1", Message: "1 ray is cut by A1 <iris> & more"},
			{Code: "no-beam-end", Message: "a warning about no element in particular"},
		},
	}
}

// boarded gives r the board the analysis would: the table and source of b around r's own
// positions. It returns r.
func boarded(b *optics.Bench, r *optics.Report) *optics.Report {
	r.Board = layout.NewBoard(b.Table, b.Source, r)
	return r
}

// holesFor is the hole grid the analysis reports for a table; the counting rule itself is tested
// in optics/layout.
func holesFor(t optics.Table) optics.HoleGrid {
	return layout.Holes(t).HoleGrid
}
