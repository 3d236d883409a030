package optics

import (
	"strings"
	"testing"
)

// The caution names the points of IEC 60825-1 / ANSI Z136.1 practice that the README's 'Laser
// safety' names, and defers to the standards and the laser safety officer.
func TestCautionPoints(t *testing.T) {
	for _, point := range []string{"injure eyes and skin", "below eye level", "every beam", "reflections from mounts",
		"eyewear rated for the", "paraxial and Gaussian estimates, not a safety assessment", "IEC 60825-1 / ANSI Z136.1",
		"laser safety officer"} {
		if !strings.Contains(CautionText(), point) {
			t.Errorf("the caution does not say %q", point)
		}
	}
}

// The README's 'Laser safety' section is the caution, word for word.
func TestReadmeCaution(t *testing.T) {
	readme := readReadme(t)
	start := strings.Index(readme, "## Laser safety\n")
	if start < 0 {
		t.Fatal("README has no 'Laser safety' section")
	}
	section := readme[start+len("## Laser safety\n"):]
	section = section[:strings.Index(section, "\n## ")]
	if got := strings.Join(strings.Fields(section), " "); got != CautionText() {
		t.Errorf("README's laser safety text\n%s\nis not the caution\n%s", got, CautionText())
	}
}
