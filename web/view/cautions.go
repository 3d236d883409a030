package view

// CautionLines are the laser cautions shown on the bench page and the presentation view. They are
// plain advice, not a safety assessment; the last line says so.
var CautionLines = []string{
	"Laser light can injure eyes and skin, often before anyone notices.",
	"Keep beams horizontal and below eye level, and end every beam on a dump or a screen.",
	"Watch for stray reflections from mounts, tools, watches and jewellery.",
	"Wear eyewear rated for the wavelength and the power in use.",
	"The numbers here are paraxial and Gaussian estimates, not a safety assessment.",
	"Follow IEC 60825-1 / ANSI Z136.1, your local rules and your site's laser safety officer.",
}
