//go:build ignore

// Command fuzzseeds writes the seed corpora of the fuzz targets that read bench files, one file
// per testdata bench, in the layout go test replays (PKG/testdata/fuzz/FuzzName/NAME):
//
//	go run scripts/fuzzseeds.go
//
// The form target's corpus (server/testdata/fuzz/FuzzParseBenchForm) holds the same benches as
// the edit page writes them (server's benchValues), which only the server package can produce; its
// target adds them with f.Add as well, so a bench added to testdata is fuzzed without regenerating.
package main

import (
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
)

var targets = []struct{ dir, name, glob string }{
	{"optics", "FuzzDecode", "testdata/*.json testdata/invalid/*.json"},
	{"optics/analysis", "FuzzRun", "testdata/*-bench.json"},
	{"web/diagram", "FuzzDrawings", "testdata/*-bench.json"},
	{"cmd/raytable", "FuzzWriters", "testdata/*-bench.json"},
}

func main() {
	for _, t := range targets {
		out := filepath.Join(t.dir, "testdata", "fuzz", t.name)
		if err := os.MkdirAll(out, 0o755); err != nil {
			fail(err)
		}
		for _, glob := range strings.Fields(t.glob) {
			paths, _ := filepath.Glob(glob)
			for _, p := range paths {
				data, err := os.ReadFile(p)
				if err != nil {
					fail(err)
				}
				name := "seed-" + strings.TrimSuffix(strings.ReplaceAll(strings.TrimPrefix(p, "testdata/"), "/", "-"), ".json")
				entry := "go test fuzz v1\n[]byte(" + strconv.Quote(string(data)) + ")\n"
				if err := os.WriteFile(filepath.Join(out, name), []byte(entry), 0o644); err != nil {
					fail(err)
				}
			}
		}
	}
}

func fail(err error) {
	fmt.Fprintln(os.Stderr, "fuzzseeds:", err)
	os.Exit(1)
}
