package layout

import (
	"math"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

func fp(v float64) *float64 { return &v }

// A splitter's plate, passed straight through, keeps the heading and moves the axis sideways,
// away from the reflected port, by d = t sin θ (1 - cos θ / sqrt(n² - sin² θ)) (standard plate
// formula, from memory); the next element lies gap_mm on along the displaced axis. A periscope
// turns the heading, stands its two mirrors one above the other and changes the height by its rise.
func TestWalkSplitterAndPeriscope(t *testing.T) {
	const n, thick = 1.5, 6.0
	for _, turn := range []float64{90, -90, 50} {
		b := &optics.Bench{
			Format: optics.FormatBenchV1, WavelengthsNM: []float64{587.6},
			Table:     optics.Table{BeamHeightMM: 75},
			Source:    optics.Source{XMM: 10, YMM: 500, HeadingDeg: 0, Kind: optics.SourceCollimated, HeightMM: fp(120)},
			Materials: map[string]optics.MaterialSpec{"g": {Index: fp(n)}},
			Elements: []optics.Element{
				{ID: "BS", Type: optics.TypeSplitter, GapMM: 100, TurnDeg: fp(turn), ThicknessMM: fp(thick), Material: "g"},
				{ID: "P", Type: optics.TypePeriscope, GapMM: 50, RiseMM: fp(-40), TurnDeg: fp(90)},
				{ID: "S", Type: optics.TypeScreen, GapMM: 30},
			},
		}
		pl := Walk(b)
		inc := (180 - math.Abs(turn)) / 2 * math.Pi / 180
		s, c := math.Sincos(inc)
		d := thick * s * (1 - c/math.Sqrt(n*n-s*s))
		side := -1.0 // a counter-clockwise reflected port: shifted to the right (-y here)
		if turn < 0 {
			side = 1
		}
		approx.Check(t, "periscope y: plate shift", pl[1].TableYMM-500, side*d, 1e-12)
		approx.Check(t, "heading after the splitter", pl[1].HeadingInDeg, 0, 0)
		glass := thick * n / math.Sqrt(n*n-s*s)
		approx.Check(t, "periscope along the path", pl[1].PathMM, 100+glass+50, 1e-12)
		approx.Check(t, "periscope x", pl[1].TableXMM, 10+100+math.Sqrt(glass*glass-d*d)+50, 1e-9)
		approx.Check(t, "screen x: mirrors stacked", pl[2].TableXMM, pl[1].TableXMM, 1e-12)
		approx.Check(t, "screen y: turned 90°", pl[2].TableYMM, pl[1].TableYMM+30, 1e-12)
		approx.Check(t, "screen heading", pl[2].HeadingInDeg, 90, 0)
		approx.Check(t, "height at the splitter (source height_mm)", pl[0].HeightMM, 120, 0)
		approx.Check(t, "height at the screen", pl[2].HeightMM, 80, 0)
		approx.Check(t, "screen along the path", pl[2].PathMM, 100+glass+50+40+30, 1e-12)
	}
}
