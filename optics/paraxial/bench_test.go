package paraxial

import (
	"math/rand/v2"
	"testing"
)

// BenchmarkTrace traces one paraxial ray through a 100-element random path per iteration and
// reports the time per ray-surface.
func BenchmarkTrace(b *testing.B) {
	p := randomPath(rand.New(rand.NewPCG(1, 1)), 100)
	dst := make([]Ray, len(p.Surfaces))
	b.ReportAllocs()
	for b.Loop() {
		dst = TraceInto(dst, p, 0, Tangential, Ray{Y: 1, NU: 0.01})
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*len(p.Surfaces)), "ns/ray-surface")
}

// BenchmarkAnalyze is the full paraxial analysis of one plane of the same path.
func BenchmarkAnalyze(b *testing.B) {
	p := randomPath(rand.New(rand.NewPCG(1, 1)), 100)
	bench := collimated(5, 0, 1)
	b.ReportAllocs()
	for b.Loop() {
		Analyze(bench, p, 0, Tangential)
	}
}
