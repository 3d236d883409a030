package beam

import "testing"

// demoLikePath is a ten-element bench: expander, pinhole, folding and focusing mirrors, iris.
func demoLikePath() *pathAndBench {
	p := buildPath(hene,
		lens("L1", 100, 11.4, 0, 3.5, 1.457).clear(12.7),
		plane("PH", 22.6, 0.04),
		lens("L2", 147.3, 0, -68.6, 4, 1.457).clear(25.4),
		mirror("M1", 100, 0, 90).clear(25.4),
		plane("IR", 60, 10),
		thinLens("F1", 90, 250).clear(25.4),
		mirror("M2", 120, 500, -60).clear(25.4),
		lens("W", 50, 0, 0, 5, 1.5).clear(20),
		plane("A2", 40, 6),
		plane("CAM", 80, 0),
	)
	return &pathAndBench{p: p, b: beamBench(hene, 0.45, -250, 1.05)}
}

func BenchmarkPropagate(b *testing.B) {
	x := demoLikePath()
	b.ReportAllocs()
	for b.Loop() {
		Propagate(x.b, x.p)
	}
}

func BenchmarkSafetyWarnings(b *testing.B) {
	x := demoLikePath()
	b.ReportAllocs()
	for b.Loop() {
		SafetyWarnings(x.b, x.p)
	}
}

func BenchmarkFractionInCircleElliptical(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		FractionInCircle(1.2, 1.5, 0.7)
	}
}
