package server

import (
	"os/exec"
	"path/filepath"
	"testing"
)

// buildRaytable builds the raytable command into a temporary folder and returns its path, for the
// tests that run it as a user or an operator would: the command line catalogue and the crash test.
func buildRaytable(t *testing.T) string {
	t.Helper()
	bin := filepath.Join(t.TempDir(), "raytable")
	cmd := exec.Command("go", "build", "-o", bin, "raytable/cmd/raytable")
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, out)
	}
	return bin
}
