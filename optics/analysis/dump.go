package analysis

import (
	"fmt"

	"raytable/optics"
)

// afterDumpWarnings warns about every element of a linear bench that lies after its first dump:
// the dump ends the light (README, element type dump), so nothing there is lit, traced or drawn.
func afterDumpWarnings(b *optics.Bench) []optics.Warning {
	var out []optics.Warning
	dump := ""
	for i := range b.Elements {
		e := &b.Elements[i]
		if dump != "" {
			out = append(out, optics.Warning{
				Code:    optics.WarnAfterDump,
				Element: e.ID,
				Message: fmt.Sprintf("%s lies after the dump %s: no light reaches it", e.ID, dump),
				Others:  []string{dump},
			})
			continue
		}
		if k, ok := optics.KindOf(e.Type); ok && k.StopsRays {
			dump = e.ID
		}
	}
	return out
}
