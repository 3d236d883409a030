package main

import (
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

var updateReports = flag.Bool("update", false, "rewrite the golden reports under testdata/golden/reports")

// TestGoldenReports keeps the text and JSON reports and the plan listings of every bench under
// testdata byte-stable.
func TestGoldenReports(t *testing.T) {
	benches, err := filepath.Glob("../../testdata/*-bench.json")
	if err != nil || len(benches) == 0 {
		t.Fatalf("no benches: %v", err)
	}
	for _, bench := range benches {
		name := strings.TrimSuffix(filepath.Base(bench), ".json")
		for _, out := range []struct {
			suffix string
			args   []string
		}{
			{".txt", []string{"report", bench}},
			{".json", []string{"report", "--json", bench}},
			{".plan.txt", []string{"plan", bench}},
			{".plan.csv", []string{"plan", "--csv", bench}},
		} {
			t.Run(name+out.suffix, func(t *testing.T) {
				code, got, errOut := runCmd(t, "", out.args...)
				if code != exitOK {
					t.Fatalf("exit %d, stderr:\n%s", code, errOut)
				}
				path := filepath.Join("..", "..", "testdata", "golden", "reports", name+out.suffix)
				if *updateReports {
					if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
						t.Fatal(err)
					}
					return
				}
				want, err := os.ReadFile(path)
				if err != nil {
					t.Fatalf("%v (run go test ./cmd/raytable -run TestGoldenReports -update)", err)
				}
				if got != string(want) {
					_ = os.WriteFile(path+".actual", []byte(got), 0o644)
					t.Errorf("%s differs from its golden; wrote %s.actual", name+out.suffix, path)
				}
			})
		}
	}
}
