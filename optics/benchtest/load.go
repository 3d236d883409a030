package benchtest

import (
	"os"
	"path/filepath"
	"testing"

	"raytable/optics"
)

// Load reads and decodes a bench file of the repository's testdata folder by name (for example
// "demo-bench.json"), from whichever package directory the test runs in.
func Load(t testing.TB, name string) *optics.Bench {
	t.Helper()
	dir, err := os.Getwd()
	if err != nil {
		t.Fatal(err)
	}
	for {
		data, err := os.ReadFile(filepath.Join(dir, "testdata", name))
		if err == nil {
			b, err := optics.Decode(data)
			if err != nil {
				t.Fatalf("testdata/%s: %v", name, err)
			}
			return b
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			t.Fatalf("no testdata/%s above the test's directory", name)
		}
		dir = parent
	}
}
