package optics

import (
	"os"
	"strings"
	"testing"
)

// warningTable is the README's table of warning codes as WarningCodes gives it.
func warningTable() string {
	var b strings.Builder
	b.WriteString("| warning code | meaning |\n| --- | --- |\n")
	for _, w := range WarningCodes {
		b.WriteString("| `" + string(w.Code) + "` | " + w.Meaning + " |\n")
	}
	return b.String()
}

// TestReadmeListsEveryWarningCode keeps the README's table of codes ('Report, format
// raytable/report/v1') equal to WarningCodes.
func TestReadmeListsEveryWarningCode(t *testing.T) {
	readme := readReadme(t)
	start := strings.Index(readme, "| warning code | meaning |")
	if start < 0 {
		t.Fatalf("README has no table of warning codes; it should read:\n%s", warningTable())
	}
	end := strings.Index(readme[start:], "\n\n")
	if end < 0 {
		end = len(readme) - start
	}
	if got, want := readme[start:start+end+1], warningTable(); got != want {
		t.Errorf("README's table of warning codes differs from optics.WarningCodes; it should read:\n%s", want)
	}
}

// readReadme is the repository's README.md.
func readReadme(t *testing.T) string {
	t.Helper()
	data, err := os.ReadFile("../README.md")
	if err != nil {
		t.Fatal(err)
	}
	return string(data)
}

// TestWarningCodesAreUnique: each code has one entry with a meaning, and Meaning finds it.
func TestWarningCodesAreUnique(t *testing.T) {
	seen := map[WarningCode]bool{}
	for _, w := range WarningCodes {
		if seen[w.Code] || w.Meaning == "" || w.Code.Meaning() != w.Meaning {
			t.Errorf("code %q: listed twice or without a meaning", w.Code)
		}
		seen[w.Code] = true
	}
	if WarningCode("no-such-code").Meaning() != "" {
		t.Error("an unknown code has a meaning")
	}
}
