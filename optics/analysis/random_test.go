package analysis

import (
	"encoding/json"
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"raytable/optics"
)

// randomBenches is how many seeded random benches TestRandomBenchesEncode runs, and maxRejected
// how many of them validation may reject before the generator counts as broken (none are today).
const (
	randomBenches = 1500
	maxRejected   = randomBenches / 20
)

// TestRandomBenchesEncode runs many random but valid benches (seeded, as gonum seeds its
// property tests with rand.New(rand.NewPCG(1, 1))) through Run and checks that each report
// encodes as JSON. encoding/json refuses NaN and ±Inf, and the server answers a report that does
// not encode with a 500, so a valid bench must never produce one.
func TestRandomBenchesEncode(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	invalid := 0
	for i := range randomBenches {
		b := randomBench(rng)
		r, err := runNoPanic(b)
		if err != nil {
			invalid++
			if invalid <= 3 {
				t.Logf("bench %d rejected: %v", i, err)
			}
			continue
		}
		if _, err := json.Marshal(r); err != nil {
			data, _ := json.Marshal(b)
			t.Fatalf("bench %d: report does not encode: %v\nbench: %s", i, err, data)
		}
	}
	t.Logf("%d of %d random benches rejected", invalid, randomBenches)
	// The generator follows the rules; a few rejections are tolerated only where a rule is too
	// costly to satisfy by construction.
	if invalid > maxRejected {
		t.Errorf("%d of %d random benches were rejected: the generator no longer makes valid benches", invalid, randomBenches)
	}
}

func runNoPanic(b *optics.Bench) (r *optics.Report, err error) {
	defer func() {
		if p := recover(); p != nil {
			data, _ := json.Marshal(b)
			err = fmt.Errorf("panic: %v\nbench: %s", p, data)
			panic(err)
		}
	}()
	return Run(b)
}

func randomBench(rng *rand.Rand) *optics.Bench {
	f := func(v float64) *float64 { return &v }
	pick := func(xs ...float64) float64 { return xs[rng.IntN(len(xs))] }
	b := &optics.Bench{
		Format:        optics.FormatBenchV1,
		WavelengthsNM: []float64{pick(632.8, 1064, 405, 10600, 532, 200, 20000)},
		Table:         optics.Table{Grid: []string{optics.GridMetric25, optics.GridImperial1, optics.GridNone}[rng.IntN(3)], WidthMM: 900, DepthMM: 600, BeamHeightMM: 75},
		Source:        optics.Source{XMM: 50 + 800*rng.Float64(), YMM: 50 + 500*rng.Float64(), HeadingDeg: 360*rng.Float64() - 180},
	}
	if rng.IntN(3) == 0 {
		b.WavelengthsNM = append(b.WavelengthsNM, pick(486.1, 656.3, 1550))
	}
	if rng.IntN(2) == 0 {
		b.Source.Kind = optics.SourceCollimated
		b.Source.SemiDiameterMM = f(pick(1e-6, 0.01, 0.5, 1, 5, 20))
		b.Source.FieldAnglesDeg = []float64{0, pick(0, 0.1, 2, 10, -30)}
	} else if rng.IntN(4) != 0 {
		b.Source.Kind = optics.SourcePoint
		b.Source.NA = f(pick(0.001, 0.05, 0.3, 0.9))
		b.Source.ObjectHeightsMM = []float64{0, pick(0, 0.5, -3, 20)}
	} else {
		// A fibre face: its mode is the beam (README, 'Fibres, mode targets and cylindrical lenses').
		b.Source.Kind = optics.SourceFiber
		b.Source.MFDUM = f(pick(3, 6.2, 10.4, 25))
		if rng.IntN(2) == 0 {
			b.Source.NA = f(pick(0.05, 0.14))
		}
	}
	switch rng.IntN(4) { // power or pulses (README, 'Power')
	case 0:
		b.Source.PowerMW = f(pick(1e-3, 5, 35, 2e4))
	case 1:
		b.Source.Pulse = &optics.Pulse{EnergyUJ: pick(0.1, 50, 1e4), DurationNS: pick(1e-5, 0.01, 10), RateHz: pick(1, 1e3, 8e7)}
	}
	if rng.IntN(3) == 0 {
		b.Source.FanRays = func(n int) *int { return &n }(1 + rng.IntN(5))
	}
	if rng.IntN(3) == 0 {
		b.Source.Rays = []optics.ExplicitRay{{HeightMM: pick(0, 1, -5), AngleDeg: pick(0, 3, -45, 89), XMM: pick(0, 2), XAngleDeg: pick(0, 1, -20)}}
	}
	if b.Source.Kind != optics.SourceFiber && rng.IntN(2) == 0 {
		b.Source.Beam = &optics.Beam{WaistRadiusMM: pick(1e-6, 0.001, 0.01, 0.45, 3, 1e3), WaistAtMM: pick(0, -250, 100, 1e4, -1e6)}
		if rng.IntN(2) == 0 {
			b.Source.Beam.M2 = f(pick(1, 1.3, 15, 1e4))
		}
		if rng.IntN(3) == 0 { // an elliptical, astigmatic beam
			b.Source.Beam.Sagittal = &optics.BeamPlane{WaistRadiusMM: pick(0.002, 0.3, 2), WaistAtMM: pick(0, -40, 500), M2: f(pick(1, 1.8))}
		}
	}
	n := 1 + rng.IntN(10)
	for i := range n {
		e := optics.Element{ID: fmt.Sprintf("E%d", i), GapMM: pick(0, 1e-6, 0.5, 10, 50, 100, 300, 2000, 1e6)}
		var diameter *float64
		if rng.IntN(4) != 0 {
			diameter = f(pick(1, 5, 12.7, 25.4, 50.8))
		}
		semi, edgeH := 20.0, math.Inf(1) // without a clear aperture the faces must clear min(|R|)
		if diameter != nil {
			semi = *diameter / 2
			edgeH = semi
		}
		radius := func() *float64 {
			if rng.IntN(4) == 0 {
				return nil
			}
			r := semi * pick(1, 1.01, 2, 5, 50, 1e4)
			if rng.IntN(2) == 0 {
				r = -r
			}
			return &r
		}
		if rng.IntN(6) == 0 {
			e.DamageWCM2 = f(pick(1e-3, 10, 1e6))
		}
		cylinder := func() string {
			return []string{"", "", optics.CylinderVertical, optics.CylinderHorizontal}[rng.IntN(4)]
		}
		coating := func() {
			switch rng.IntN(3) {
			case 0:
				e.Coating = optics.CoatingNone
			case 1:
				e.FaceReflectance = f(pick(0, 0.01, 0.5))
			}
		}
		switch rng.IntN(10) {
		case 0:
			e.Type = optics.TypeLens
			faces := 2 + rng.IntN(2)
			for k := range faces {
				e.FacesMM = append(e.FacesMM, radius())
				if k > 0 {
					t := pick(0.5, 3, 10, 40) + edgeAllowance(e.FacesMM[k-1], e.FacesMM[k], edgeH)
					e.ThicknessesMM = append(e.ThicknessesMM, t)
					e.Materials = append(e.Materials, []string{"fused-silica", "calcium-fluoride", "sapphire-o", "water", "code:517642", "code:805254", "air"}[rng.IntN(7)])
				}
			}
			e.DiameterMM = diameter
			e.CylinderAxis = cylinder()
			coating()
		case 1:
			e.Type = optics.TypeThinLens
			e.CylinderAxis = cylinder()
			coating()
			e.FocalMM = f(pick(1, -1, 50, -50, 250, 1e5, 0.01, 1e-6, -1e6))
			e.DiameterMM = diameter
			// Half the time after a thin lens, make the pair afocal (gap f1 + f2).
			if i > 0 && b.Elements[i-1].Type == optics.TypeThinLens && rng.IntN(2) == 0 {
				if g := *b.Elements[i-1].FocalMM + *e.FocalMM; g >= 0 && g <= optics.MaxLengthMM {
					e.GapMM = g
				}
			}
		case 2:
			e.Type = optics.TypeMirror
			e.RadiusMM = radius()
			e.TurnDeg = f(pick(90, -90, 180, -180, 1, 45, -135, 179.9, 0.01))
			e.DiameterMM = diameter
			if rng.IntN(2) == 0 {
				e.Reflectance = f(pick(0, 0.5, 0.99, 1))
			}
		case 3:
			e.Type = optics.TypeAperture
			e.DiameterMM = f(pick(1e-6, 0.01, 1, 5, 25, 1e6))
		case 4:
			e.Type = optics.TypeScreen
			if rng.IntN(2) == 0 {
				e.WidthMM = f(pick(1, 8.8, 50))
			}
		case 5:
			e.Type = optics.TypeFiber
			e.MFDUM = f(pick(3, 6.2, 10.4))
		case 6:
			e.Type = optics.TypeModeTarget
			e.WaistRadiusMM = f(pick(0.002, 0.05, 1))
			if rng.IntN(2) == 0 {
				e.WaistAtMM = f(pick(-5, 0, 30))
			}
		case 7:
			e.Type = optics.TypePeriscope
			e.RiseMM = f(pick(-40, 25, 60))
			e.TurnDeg = f(pick(0, 90, -90, 30, 180))
			e.DiameterMM = diameter
		case 8:
			// A splitter passed straight through: a plate or a surface (README, bench format).
			e.Type = optics.TypeSplitter
			e.TurnDeg = f(pick(90, -90, 60, 150))
			e.DiameterMM = diameter
			if rng.IntN(2) == 0 {
				e.ThicknessMM = f(pick(0.5, 3, 10))
				e.Material = "fused-silica"
			}
			if rng.IntN(3) == 0 {
				e.Reflect = f(pick(0, 0.04, 0.5, 1))
			}
		default:
			e.Type = optics.TypeDump
		}
		b.Elements = append(b.Elements, e)
	}
	return b
}

// edgeAllowance is how much centre thickness two faces need so that they do not meet within
// the clear radius semi: the larger sag difference, plus a margin.
func edgeAllowance(r1, r2 *float64, semi float64) float64 {
	h := semi
	for _, r := range []*float64{r1, r2} {
		if r != nil {
			h = min(h, math.Abs(*r))
		}
	}
	s := func(r *float64) float64 {
		if r == nil {
			return 0
		}
		R := *r
		return R - math.Copysign(math.Sqrt(max(R*R-h*h, 0)), R)
	}
	return math.Max(0, s(r1)-s(r2)) + 0.1
}
