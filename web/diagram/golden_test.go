package diagram

import (
	"bytes"
	"flag"
	"os"
	"path/filepath"
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
)

var update = flag.Bool("update", false, "rewrite the golden SVG files under testdata/golden")

var goldenDir = filepath.Join("..", "..", "testdata", "golden")

// checkGolden compares got with testdata/golden/name; with -update it rewrites the file instead.
// On a mismatch it writes name.actual beside the golden file for a visual diff.
func checkGolden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join(goldenDir, name)
	if *update {
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		os.Remove(path + ".actual")
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run `go test ./web/diagram -update` to create it)", err)
	}
	if !bytes.Equal(got, want) {
		if err := os.WriteFile(path+".actual", got, 0o644); err != nil {
			t.Fatal(err)
		}
		t.Errorf("%s differs from the golden file; the drawing is in %s.actual (run with -update if the change is intended)", name, path)
		return
	}
	os.Remove(path + ".actual")
}

func TestGoldenFixture(t *testing.T) {
	b, r := fixtureBench(), fixtureReport()
	emptyBench := &optics.Bench{Format: optics.FormatBenchV1, WavelengthsNM: []float64{1064},
		Table: optics.Table{Grid: optics.GridImperial1, WidthMM: 304.8, DepthMM: 304.8}}
	cases := []struct {
		name string
		draw func() []byte
	}{
		{"side-fixture.svg", func() []byte { return Side(r, SideOptions{}) }},
		{"side-fixture-exaggerated.svg", func() []byte {
			return Side(r, SideOptions{Exaggeration: 4, ShowParaxial: true, WidthPX: 800, HeightPX: 420})
		}},
		{"side-empty.svg", func() []byte { return Side(&optics.Report{}, SideOptions{}) }},
		{"table-fixture.svg", func() []byte { return Table(boarded(b, r), TableOptions{}) }},
		{"table-empty.svg", func() []byte {
			return Table(boarded(emptyBench, &optics.Report{Holes: holesFor(emptyBench.Table)}), TableOptions{WidthPX: 480})
		}},
		{"plan-fixture.svg", func() []byte { return Plan(boarded(b, r)) }},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			got := c.draw()
			if again := c.draw(); !bytes.Equal(got, again) {
				t.Fatal("two drawings of the same input differ")
			}
			checkGolden(t, c.name, got)
		})
	}
}

// TestGoldenDemo draws the demo bench through the real analysis.
func TestGoldenDemo(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "demo-bench.json"))
	if err != nil {
		t.Fatal(err)
	}
	b, err := optics.Decode(data)
	if err != nil {
		t.Fatalf("demo bench: %v", err)
	}
	r, err := analysis.Run(b)
	if err != nil {
		t.Fatalf("analysis of the demo bench: %v", err)
	}
	cases := []struct {
		name string
		draw func() []byte
	}{
		{"side-demo.svg", func() []byte { return Side(r, SideOptions{Exaggeration: 8, ShowParaxial: true}) }},
		{"table-demo.svg", func() []byte { return Table(boarded(b, r), TableOptions{}) }},
		{"plan-demo.svg", func() []byte { return Plan(boarded(b, r)) }},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			got := c.draw()
			// The bench page carries a side and a table view and stays under 300 KB (server TestDemoPageSize);
			// our budget is 80 KB per drawing.
			if c.name != "plan-demo.svg" && len(got) > 80_000 {
				t.Errorf("%s is %d bytes, over the 80 KB budget", c.name, len(got))
			}
			if again := c.draw(); !bytes.Equal(got, again) {
				t.Fatal("two drawings of the same input differ")
			}
			checkGolden(t, c.name, got)
		})
	}
}
