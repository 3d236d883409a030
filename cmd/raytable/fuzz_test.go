package main

import (
	"bytes"
	"encoding/csv"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// FuzzWriters runs `raytable report` and `raytable plan --csv` on every bench the decoder accepts,
// as a user would, from a file. Neither may panic or fail other than with exit status 2 for a bad
// bench; the text report must hold no NaN or infinity, and the CSV must read back into the rows it
// was written from, with no cell that a spreadsheet would take for a formula (README "plan").
// Benches heavier than benchtest.Light are skipped. Seeds: every testdata bench, plus
// testdata/fuzz/FuzzWriters.
func FuzzWriters(f *testing.F) {
	for _, data := range benchtest.BenchFiles(f) {
		f.Add(data)
	}
	dir := f.TempDir()
	f.Fuzz(func(t *testing.T, data []byte) {
		b, err := optics.Decode(data)
		if err != nil || !benchtest.Light(b) {
			return
		}
		path := filepath.Join(dir, "bench.json")
		if err := os.WriteFile(path, data, 0o644); err != nil {
			t.Fatal(err)
		}
		text := withoutOwnWords(runFor(t, "report", path), b)
		for _, bad := range []string{"NaN", "+Inf", "-Inf"} {
			if strings.Contains(text, bad) {
				t.Fatalf("the text report writes %q:\n%s", bad, text)
			}
		}
		plan := runFor(t, "plan", "--csv", path)
		rows, err := csv.NewReader(strings.NewReader(plan)).ReadAll()
		if err != nil {
			t.Fatalf("the plan CSV does not read back: %v\n%s", err, plan)
		}
		for _, row := range rows[1:] {
			for _, cell := range row {
				if cell != "" && strings.ContainsRune("=+@\t\r", rune(cell[0])) {
					t.Fatalf("plan CSV cell %q would be taken for a formula; row %q", cell, row)
				}
			}
			if slices.Contains(row, "NaN") {
				t.Fatalf("plan CSV row %q holds NaN", row)
			}
		}
	})
}

// runFor runs the command line with args and returns its standard output; it fails the test on
// any exit status but 0.
func runFor(t *testing.T, args ...string) string {
	t.Helper()
	var stdout, stderr bytes.Buffer
	code := run(t.Context(), args, func(string) string { return "" }, strings.NewReader(""), &stdout, &stderr)
	if code != 0 {
		t.Fatalf("raytable %s: exit %d: %s", strings.Join(args, " "), code, stderr.String())
	}
	return stdout.String()
}

// withoutOwnWords removes the bench's own words (title, notes, ids, material names) from a report,
// so that a title such as "NaN" is not taken for a number.
func withoutOwnWords(report string, b *optics.Bench) string {
	words := []string{b.Title, b.Notes}
	for _, e := range b.Elements {
		words = append(words, e.ID)
	}
	for _, m := range b.MoreSources {
		words = append(words, m.ID)
		for _, e := range m.Elements {
			words = append(words, e.ID)
		}
	}
	for name := range b.Materials {
		words = append(words, name)
	}
	for _, w := range words {
		if w != "" {
			report = strings.ReplaceAll(report, w, "")
		}
	}
	return report
}
