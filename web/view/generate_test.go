package view

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"testing"
)

// TestGeneratedFilesAreCurrent regenerates the templates into a scratch directory with the templ
// version pinned in go.mod and compares the result with the committed *_templ.go files, so a
// template edited without `go tool templ generate` fails the tests. templ names each template in
// the generated code by its path below the folder it was run on; the scratch copy keeps the
// web/view folders so the result matches a run from the repository root, as .ci/run does.
func TestGeneratedFilesAreCurrent(t *testing.T) {
	goBin, err := exec.LookPath("go")
	if err != nil {
		t.Skip("the go command is not on PATH")
	}
	templs, err := filepath.Glob("*.templ")
	if err != nil || len(templs) == 0 {
		t.Fatalf("no templates found: %v", err)
	}
	root := t.TempDir()
	scratch := filepath.Join(root, "web", "view")
	if err := os.MkdirAll(scratch, 0o755); err != nil {
		t.Fatal(err)
	}
	for _, name := range templs {
		data, err := os.ReadFile(name)
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(scratch, name), data, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	cmd := exec.Command(goBin, "tool", "templ", "generate", "-path", root)
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("templ generate: %v\n%s", err, out)
	}
	for _, name := range templs {
		gen := name[:len(name)-len(".templ")] + "_templ.go"
		want, err := os.ReadFile(filepath.Join(scratch, gen))
		if err != nil {
			t.Fatal(err)
		}
		got, err := os.ReadFile(gen)
		if err != nil {
			t.Fatalf("%s is not committed: %v", gen, err)
		}
		if !bytes.Equal(got, want) {
			t.Errorf("%s is stale: run `go tool templ generate` in the repository root", gen)
		}
	}
}
