package analysis

import (
	"fmt"
	"testing"

	"raytable/optics"
	"raytable/optics/material"
)

// chain is n elements in a row for the benchmarks: lenses, thin lenses, apertures and a fold
// mirror in turn, ids prefixed.
func chain(prefix string, n int) []optics.Element {
	var es []optics.Element
	for i := range n {
		e := optics.Element{ID: fmt.Sprintf("%s%d", prefix, i), GapMM: 40, DiameterMM: f64(25.4)}
		switch i % 4 {
		case 0:
			e.Type, e.FacesMM, e.ThicknessesMM, e.Materials = optics.TypeLens, []*float64{f64(100), nil}, []float64{4}, []string{material.FusedSilica}
		case 1:
			e.Type, e.FocalMM = optics.TypeThinLens, f64(-200)
		case 2:
			e.Type = optics.TypeAperture
		default:
			e.Type, e.TurnDeg = optics.TypeMirror, f64(90)
		}
		es = append(es, e)
	}
	return es
}

func benchOf(es []optics.Element) *optics.Bench {
	return &optics.Bench{Format: optics.FormatBenchV1, WavelengthsNM: []float64{632.8, 532},
		Table:    optics.Table{Grid: optics.GridMetric25, WidthMM: 900, DepthMM: 600, BeamHeightMM: 75},
		Source:   optics.Source{XMM: 450, YMM: 300, Kind: optics.SourceCollimated, SemiDiameterMM: f64(2), FieldAnglesDeg: []float64{0, 0.5}, Beam: &optics.Beam{WaistRadiusMM: 1}},
		Elements: es}
}

// branching60 is a 4-arm bench of 60 elements: a main line of 15 and three arms of 15 of their own
// that leave it at its 4th, 8th and 12th element.
func branching60() (*optics.Bench, []optics.Arm) {
	mainEls := chain("M", 15)
	main := benchOf(mainEls)
	arms := []optics.Arm{{ID: "main", Source: "source", Bench: main, PowerFraction: 1}}
	for _, e := range mainEls {
		arms[0].Part = append(arms[0].Part, e.ID)
	}
	for k, at := range []int{3, 7, 11} {
		es := append([]optics.Element{}, mainEls[:at]...)
		es = append(es, optics.Element{ID: mainEls[at].ID, Type: optics.TypeMirror, GapMM: mainEls[at].GapMM, TurnDeg: f64(-90)})
		es = append(es, chain(fmt.Sprintf("B%d.", k), 15)...)
		a := optics.Arm{ID: mainEls[at].ID + ".reflected", Parent: "main", Source: "source", Bench: benchOf(es), Own: at + 1, PowerFraction: 0.5}
		for _, e := range es {
			a.Part = append(a.Part, e.ID)
		}
		arms = append(arms, a)
	}
	return main, arms
}

// BenchmarkRunBranching and BenchmarkRunStraight60 compare a 4-arm bench of 60 elements with the
// same 60 elements as one straight bench.
func BenchmarkRunBranching(b *testing.B) {
	bench, arms := branching60()
	for b.Loop() {
		runArms(bench, arms)
	}
}

func BenchmarkRunStraight60(b *testing.B) {
	_, arms := branching60()
	var es []optics.Element
	for _, a := range arms {
		es = append(es, a.Bench.Elements[a.Own:]...)
	}
	bench := benchOf(es)
	if len(es) != 60 {
		b.Fatalf("%d elements, want 60", len(es))
	}
	for b.Loop() {
		RunValid(bench)
	}
}
