package server

import (
	"bytes"
	"context"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// TestCommandLineCatalogue runs `raytable report` and `raytable plan` on bad and heavy bench files.
// Each must end with exit status 2 and a message on standard error naming the problem (README
// "Command line": 2 for bad input), within the same generous bound as the HTTP catalogue.
func TestCommandLineCatalogue(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the command; skipped with -short")
	}
	bin := buildRaytable(t)
	dir := t.TempDir()
	file := func(name string, data []byte) string {
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, data, 0o644); err != nil {
			t.Fatal(err)
		}
		return p
	}
	for _, c := range []struct {
		name  string
		args  []string
		stdin []byte
		want  string
	}{
		{"not JSON", []string{"report", file("not.json", []byte("not json"))}, nil, "not valid JSON"},
		{"empty file", []string{"report", file("empty.json", nil)}, nil, "not valid JSON"},
		{"no such file", []string{"report", filepath.Join(dir, "missing.json")}, nil, "no such file"},
		{"a folder", []string{"report", dir}, nil, "is a directory"},
		{"NaN literal", []string{"report", file("nan.json", []byte(`{"wavelengths_nm": [NaN]}`))}, nil, "not valid JSON"},
		{"width 1e308", []string{"report", file("big.json", demoWith(t, func(b map[string]any) { b["table"].(map[string]any)["width_mm"] = 1e308 }))}, nil, "table.width_mm"},
		{"10,000 elements", []string{"plan", file("many.json", demoWith(t, func(b map[string]any) { b["elements"] = manyElements(10_000) }))}, nil, "at most 200"},
		{"20 MB file", []string{"report", file("huge.json", bytes.Repeat([]byte(" "), 20<<20))}, nil, "larger than 1 MiB"},
		{"20 MB on standard input", []string{"report", "-"}, bytes.Repeat([]byte(" "), 20<<20), "standard input is larger than 1 MiB"},
		{"5,000-level nesting", []string{"report", "-"}, []byte(`{"title": ` + nested(5000) + `}`), "title"},
		{"title with a bell", []string{"plan", "--csv", file("bell.json", demoWith(t, func(b map[string]any) { b["title"] = "ring\x07" }))}, nil, "control character"},
		{"material a path", []string{"report", file("path.json", demoWith(t, func(b map[string]any) { demoElement(b, 0)["materials"] = []any{"../../etc/passwd"} }))}, nil, "elements[0].materials[0]"},
		{"unknown command", []string{"explode"}, nil, `unknown command "explode"`},
		{"unknown flag", []string{"report", "--nope", "x.json"}, nil, "flag provided but not defined: -nope"},
		{"two files", []string{"report", "a.json", "b.json"}, nil, "usage: raytable report"},
		{"serve with an argument", []string{"serve", "extra"}, nil, `unexpected argument "extra"`},
	} {
		t.Run(c.name, func(t *testing.T) {
			ctx, cancel := context.WithTimeout(t.Context(), caseDeadline)
			defer cancel()
			cmd := exec.CommandContext(ctx, bin, c.args...)
			cmd.Stdin = bytes.NewReader(c.stdin)
			var stdout, stderr bytes.Buffer
			cmd.Stdout, cmd.Stderr = &stdout, &stderr
			start := time.Now()
			err := cmd.Run()
			if took := time.Since(start); took > caseDeadline {
				t.Errorf("took %v; at most %v", took, caseDeadline)
			}
			if code := cmd.ProcessState.ExitCode(); code != 2 {
				t.Fatalf("exit status %d (%v), want 2; stderr:\n%s", code, err, truncate(stderr.String(), 1500))
			}
			if !strings.Contains(stderr.String(), c.want) {
				t.Errorf("stderr does not contain %q:\n%s", c.want, truncate(stderr.String(), 1500))
			}
			if stdout.Len() > 0 && c.args[0] != "serve" {
				t.Errorf("a refused bench printed a report:\n%s", truncate(stdout.String(), 500))
			}
		})
	}
}
