package benchtest

import (
	"os"
	"path/filepath"
	"testing"

	"raytable/optics"
)

// The most a bench may ask for before a fuzz target skips it: computing it would take longer than
// a fuzz iteration should (several milliseconds), and what the fuzzers look for, a panic or a NaN
// in the output, does not need many elements or rays to show.
const (
	lightMaxElements    = 20 // over every source's elements
	lightMaxRays        = 50 // fan rays per fan, explicit rays per source
	lightMaxWavelengths = 8
	lightMaxFields      = 8 // field angles or object heights per source
	lightMaxSources     = 4 // the first source and its more_sources
)

// Light reports whether a decoded bench is cheap enough to compute in one fuzz iteration.
func Light(b *optics.Bench) bool {
	if len(b.MoreSources)+1 > lightMaxSources || len(b.WavelengthsNM) > lightMaxWavelengths {
		return false
	}
	elements := len(b.Elements)
	sources := []*optics.Source{&b.Source}
	for i := range b.MoreSources {
		m := &b.MoreSources[i]
		elements += len(m.Elements)
		sources = append(sources, &m.Source)
		if len(m.WavelengthsNM) > lightMaxWavelengths {
			return false
		}
	}
	if elements > lightMaxElements {
		return false
	}
	for _, s := range sources {
		if s.FanRayCount() > lightMaxRays || len(s.Rays) > lightMaxRays ||
			len(s.FieldAnglesDeg) > lightMaxFields || len(s.ObjectHeightsMM) > lightMaxFields {
			return false
		}
	}
	return true
}

// BenchFiles gives the contents of every bench file in the repository's testdata folder (*.json),
// found from whichever package directory the test runs in; fuzz targets add them as seeds.
func BenchFiles(t testing.TB) [][]byte {
	t.Helper()
	dir, err := os.Getwd()
	if err != nil {
		t.Fatal(err)
	}
	for {
		paths, _ := filepath.Glob(filepath.Join(dir, "testdata", "*-bench.json"))
		if len(paths) > 0 {
			var out [][]byte
			for _, p := range paths {
				data, err := os.ReadFile(p)
				if err != nil {
					t.Fatal(err)
				}
				out = append(out, data)
			}
			return out
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			t.Fatal("no testdata/*-bench.json above the test's directory")
		}
		dir = parent
	}
}
