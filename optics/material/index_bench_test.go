package material

import "testing"

// sinkIndex keeps the compiler from removing the benchmarked calls.
var sinkIndex float64

func BenchmarkIndex(b *testing.B) {
	fs, _ := Builtin(FusedSilica)
	water, _ := Builtin(Water)
	code, _ := Builtin("code:517642")
	air, _ := Builtin(Air)
	media := []struct {
		name string
		m    Medium
	}{
		{"sellmeier-3-terms", fs},
		{"sellmeier-4-terms", water},
		{"glass-code", code},
		{"constant", air},
	}
	for _, md := range media {
		b.Run(md.name, func(b *testing.B) {
			wl := 400.0
			for b.Loop() {
				sinkIndex = md.m.Index(wl)
				wl += 0.001 // vary the input so nothing is folded into a constant
			}
		})
	}
}

func BenchmarkBuiltin(b *testing.B) {
	for b.Loop() {
		m, _ := Builtin(FusedSilica)
		sinkIndex = m.Index(DLineNM)
	}
}
