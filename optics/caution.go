package optics

// The laser caution that every output of raytable shows, in the one place it is written. It is
// plain advice, not a safety assessment, and says so.
//
// It exists in two wordings of the same points: CautionLines, one point per line, for the bench
// page and the presentation view, and CautionParagraph, one paragraph that fits the narrow box
// of the printed plan (and the README's 'Laser safety'). Both name the standards, the eyewear and
// that the numbers are estimates; a test checks that.
var CautionLines = []string{
	"Laser light can injure eyes and skin, often before anyone notices.",
	"Keep beams horizontal and below eye level, and end every beam on a dump or a screen.",
	"Watch for stray reflections from mounts, tools, watches and jewellery.",
	"Wear eyewear rated for the wavelength and the power in use.",
	"The numbers here are paraxial and Gaussian estimates, not a safety assessment.",
	"Follow IEC 60825-1 / ANSI Z136.1, your local rules and your site's laser safety officer.",
}

// CautionParagraph is the caution as one paragraph; see CautionLines.
const CautionParagraph = "Laser radiation can injure eyes and skin. Keep beams horizontal and below eye level, " +
	"terminate every beam, watch reflections from mounts, tools and jewellery, wear eyewear rated for the " +
	"wavelength and power. These numbers are paraxial and Gaussian estimates, not a safety assessment: " +
	"follow IEC 60825-1 / ANSI Z136.1, local rules and your laser safety officer."
