package analysis_test

import (
	"encoding/json"
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/optics/benchtest"
)

// FuzzRun computes the report of every bench the decoder accepts. A valid bench always gives a
// report (README: clipped, missed or totally reflected rays are results, not errors), and that
// report must encode as JSON, which fails on NaN or ±Inf anywhere in it. Benches heavier than
// benchtest.Light are skipped so that an iteration stays fast. Seeds: every testdata bench, plus
// testdata/fuzz/FuzzRun.
func FuzzRun(f *testing.F) {
	for _, data := range benchtest.BenchFiles(f) {
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		b, err := optics.Decode(data)
		if err != nil || !benchtest.Light(b) {
			return
		}
		r, err := analysis.Run(b)
		if err != nil {
			t.Fatalf("a decoded bench fails Run: %v", err)
		}
		if _, err := json.Marshal(r); err != nil {
			t.Fatalf("the report does not encode as JSON: %v", err)
		}
	})
}
