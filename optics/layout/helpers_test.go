package layout

import (
	"math"
	"strings"
	"testing"

	"raytable/optics"
)

// posTolMM is the tolerance of positions built from sums of a few gaps: a few ulps of 1000 mm.
const posTolMM = 1e-9

func f(v float64) *float64 { return &v }

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

// table returns a metric 1200 x 600 mm table.
func table() optics.Table {
	return optics.Table{Grid: optics.GridMetric25, WidthMM: 1200, DepthMM: 600, BeamHeightMM: 100}
}

func bench(x, y, heading float64, elems ...optics.Element) *optics.Bench {
	return &optics.Bench{
		Format:        optics.FormatBenchV1,
		WavelengthsNM: []float64{632.8},
		Table:         table(),
		Source:        optics.Source{XMM: x, YMM: y, HeadingDeg: heading, Kind: optics.SourceCollimated},
		Elements:      elems,
	}
}

func thin(id string, gap float64) optics.Element {
	return optics.Element{ID: id, Type: optics.TypeThinLens, GapMM: gap, FocalMM: f(100), DiameterMM: f(25.4)}
}

func mirror(id string, gap, turn float64) optics.Element {
	return optics.Element{ID: id, Type: optics.TypeMirror, GapMM: gap, TurnDeg: f(turn), DiameterMM: f(25.4)}
}

func plane(id, typ string, gap float64) optics.Element {
	return optics.Element{ID: id, Type: typ, GapMM: gap}
}

// withCode returns the warnings of one code.
func withCode(ws []optics.Warning, code optics.WarningCode) []optics.Warning {
	var out []optics.Warning
	for _, w := range ws {
		if w.Code == code {
			out = append(out, w)
		}
	}
	return out
}

// mentions reports whether a warning names every id in its element field or message.
func mentions(w optics.Warning, ids ...string) bool {
	for _, id := range ids {
		if w.Element != id && !strings.Contains(w.Message, id) {
			return false
		}
	}
	return true
}

func plan(t *testing.T, b *optics.Bench, radius func(float64) float64) ([]optics.Placement, []optics.Warning) {
	t.Helper()
	return Plan(b, Walk(b), radius)
}

func nan() float64 { return math.NaN() }
