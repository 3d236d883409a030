package layout

import (
	"strconv"
	"testing"

	"raytable/optics"
)

// serpentine builds a bench of n elements: legs of lenses and irises along ±x joined by pairs of
// 90° fold mirrors, ending on a dump, on a table large enough to hold it.
func serpentine(n int) *optics.Bench {
	b := bench(50, 50, 0)
	b.Table.WidthMM, b.Table.DepthMM = 1000, 3000
	turn := 90.0
	for i := 0; len(b.Elements) < n-1; i++ {
		switch k := i % 10; {
		case k < 8 && k%2 == 0:
			b.Elements = append(b.Elements, thin("L"+strconv.Itoa(i), 90))
		case k < 8:
			b.Elements = append(b.Elements, optics.Element{ID: "A" + strconv.Itoa(i), Type: optics.TypeAperture, GapMM: 90, DiameterMM: f(5)})
		case k == 8:
			b.Elements = append(b.Elements, mirror("M"+strconv.Itoa(i), 90, turn))
		default:
			b.Elements = append(b.Elements, mirror("M"+strconv.Itoa(i), 90, turn))
			turn = -turn
		}
	}
	b.Elements = append(b.Elements, plane("D", optics.TypeDump, 90))
	return b
}

func TestSerpentineFits(t *testing.T) {
	// Self-consistency of the benchmark bench: 200 elements, all on the table, no collisions.
	b := serpentine(optics.MaxElements)
	if len(b.Elements) != optics.MaxElements {
		t.Fatalf("%d elements", len(b.Elements))
	}
	_, ws := Plan(b, Walk(b), constRadius(2))
	for _, w := range ws {
		t.Errorf("%+v", w)
	}
}

func BenchmarkPlan200(b *testing.B) {
	bench := serpentine(optics.MaxElements)
	places := Walk(bench)
	radius := func(p float64) float64 { return 1 + p/1e4 }
	b.ReportAllocs()
	for b.Loop() {
		Plan(bench, places, radius)
	}
}

func BenchmarkWalk200(b *testing.B) {
	bench := serpentine(optics.MaxElements)
	b.ReportAllocs()
	for b.Loop() {
		Walk(bench)
	}
}

// BenchmarkBoard200 lays out the board of the 200-element serpentine with a beam sampled every
// 10 mm of its path.
func BenchmarkBoard200(b *testing.B) {
	bench := serpentine(optics.MaxElements)
	places := Walk(bench)
	r := &optics.Report{Elements: places, Holes: Holes(bench.Table).HoleGrid, Beam: &optics.BeamReport{}}
	r.Placement, _ = Plan(bench, places, nil)
	for z := 0.0; z <= places[len(places)-1].PathMM; z += 10 {
		r.Beam.Samples = append(r.Beam.Samples, optics.BeamSample{PathMM: z, WTMM: 1 + z/1e4})
	}
	b.ReportAllocs()
	for b.Loop() {
		NewBoard(bench.Table, bench.Source, r)
	}
}
