package analysis

import (
	"fmt"

	"raytable/optics"
	"raytable/optics/material"
)

// media lists the index of every medium the bench uses at every wavelength, and warns where a
// wavelength lies outside the range the medium's model was fitted over or where a glass code's
// model is poor (material.GlassCode.Poor).
func media(b *optics.Bench, warnings []optics.Warning) ([]optics.MediumIndex, []optics.Warning) {
	out := []optics.MediumIndex{}
	for _, name := range optics.MaterialNames(b) {
		m, err := b.Medium(name)
		if err != nil {
			continue // Validate has reported it
		}
		lo, hi := m.RangeNM()
		for _, w := range b.WavelengthsNM {
			in := material.InRange(m, w)
			out = append(out, optics.MediumIndex{
				Material: name, WavelengthNM: w, Index: m.Index(w), Model: m.Describe(), InRange: in,
			})
			if !in {
				warnings = append(warnings, optics.Warning{
					Code:    optics.WarnOutsideFitRange,
					Element: usedBy(b, name),
					Message: fmt.Sprintf("%s at %g nm is outside the %g-%g nm range of its index model; the index is extrapolated", name, w, lo, hi),
				})
			}
			if g, ok := m.(material.GlassCode); ok && g.Poor(w) != "" {
				warnings = append(warnings, optics.Warning{
					Code:    optics.WarnGlassCodePoor,
					Element: usedBy(b, name),
					Message: fmt.Sprintf("%s at %g nm: %s", name, w, g.Poor(w)),
				})
			}
		}
	}
	return out, warnings
}

// usedBy is the id of the first element made of the named material.
func usedBy(b *optics.Bench, name string) string {
	for _, e := range b.Elements {
		for _, m := range e.Materials {
			if m == name {
				return e.ID
			}
		}
	}
	return ""
}
