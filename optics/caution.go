package optics

import "strings"

// CautionLines is the laser caution that every output of raytable shows, in the one place it is
// written: one point per line on the bench page and the presentation view, the same sentences run
// together as a paragraph in the printed plan's box (CautionText) and in the README's 'Laser
// safety'. It is plain advice, not a safety assessment, and says so.
var CautionLines = []string{
	"Laser light can injure eyes and skin, often before anyone notices.",
	"Keep beams horizontal and below eye level, and end every beam on a dump or a screen.",
	"Watch for stray reflections from mounts, tools, watches and jewellery.",
	"Wear eyewear rated for the wavelength and the power in use.",
	"The numbers here are paraxial and Gaussian estimates, not a safety assessment.",
	"Follow IEC 60825-1 / ANSI Z136.1, your local rules and your site's laser safety officer.",
}

// CautionText is CautionLines as one paragraph.
func CautionText() string { return strings.Join(CautionLines, " ") }
