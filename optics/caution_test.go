package optics

import (
	"strings"
	"testing"
)

// Both wordings of the caution carry the same points (the points of IEC 60825-1 / ANSI Z136.1
// practice that the README's 'Laser safety' names).
func TestCautionWordingsAgree(t *testing.T) {
	lines := strings.Join(CautionLines, " ")
	for _, point := range []string{"injure eyes and skin", "below eye level", "every beam", "reflections from mounts",
		"eyewear rated for the", "paraxial and Gaussian estimates, not a safety assessment", "IEC 60825-1 / ANSI Z136.1",
		"laser safety officer"} {
		if !strings.Contains(lines, point) || !strings.Contains(CautionParagraph, point) {
			t.Errorf("the two wordings do not both say %q", point)
		}
	}
}

// The README's 'Laser safety' section is the caution paragraph, word for word.
func TestReadmeCaution(t *testing.T) {
	readme := readReadme(t)
	start := strings.Index(readme, "## Laser safety\n")
	if start < 0 {
		t.Fatal("README has no 'Laser safety' section")
	}
	section := readme[start+len("## Laser safety\n"):]
	section = section[:strings.Index(section, "\n## ")]
	if got := strings.Join(strings.Fields(section), " "); got != CautionParagraph {
		t.Errorf("README's laser safety text\n%s\nis not the caution paragraph\n%s", got, CautionParagraph)
	}
}
