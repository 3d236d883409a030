package optics

import (
	"fmt"
	"strings"

	"raytable/optics/numfmt"
)

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

// PowerLevels names the power levels a bench reaches, one sentence per line, for the cautions box
// of the page and the plan (README "Power"): each source's power and the strongest stray beam. It
// states numbers only: raytable computes no eyewear, exposure limit or laser class, and the line
// says who does. Empty when no source states a power.
func PowerLevels(r *Report) []string {
	if r == nil || r.Power == nil || len(r.Power.Sources) == 0 {
		return nil
	}
	var parts []string
	for _, s := range r.Power.Sources {
		t := fmt.Sprintf("up to %s mW at %s nm", numfmt.Message.Format(s.AverageMW), numfmt.Message.Format(s.WavelengthNM))
		if s.PulseMJ != nil {
			t = fmt.Sprintf("up to %s mW on average at %s nm, in pulses of %s mJ and %s W peak", numfmt.Message.Format(s.AverageMW),
				numfmt.Message.Format(s.WavelengthNM), numfmt.Message.Format(*s.PulseMJ), numfmt.Message.Format(s.PeakMW/1000))
		}
		if len(r.Power.Sources) > 1 {
			t += " from " + s.Source
		}
		parts = append(parts, t)
	}
	line := "This bench carries " + strings.Join(parts, " and ")
	if len(r.Power.Strays) > 0 {
		st := r.Power.Strays[0]
		line += fmt.Sprintf("; the strongest stray beam is %s mW, %s %s", numfmt.Message.Format(st.PowerMW), strayWords[st.Kind], st.Element)
	}
	return []string{line + ".", "raytable computes no eyewear, exposure limit or laser class: ask IEC 60825-1 / ANSI Z136.1, your local rules and your laser safety officer."}
}

// strayWords says where each kind of stray beam comes from.
var strayWords = map[string]string{StrayLeak: "leaking through", StrayGhost: "reflected back by", StrayPort: "leaving the open port of"}
