package optics

import (
	"sort"
	"strings"

	"raytable/optics/material"
)

// Medium resolves a material name as a bench references it: a user-defined material of the bench,
// a built-in medium, or a glass code "code:NNNMMM". The error names the rule that failed.
func (b *Bench) Medium(name string) (material.Medium, error) {
	if spec, ok := b.Materials[name]; ok {
		return spec.Medium()
	}
	if m, ok := material.Builtin(name); ok {
		return m, nil
	}
	if strings.HasPrefix(name, "code:") {
		if _, err := material.ParseGlassCode(name); err != nil {
			return nil, err
		}
	}
	return nil, Errorf(EInvalid, "unknown material %q: use a built-in medium (%s), a glass code such as code:517642, or define it under materials",
		name, strings.Join(material.BuiltinNames(), ", "))
}

// Medium turns a user-defined material into a medium. It assumes the spec passed validation.
func (s MaterialSpec) Medium() (material.Medium, error) {
	switch {
	case s.Sellmeier != nil:
		lo, hi := 0.0, inf
		if len(s.RangeNM) == 2 {
			lo, hi = s.RangeNM[0], s.RangeNM[1]
		}
		m, err := material.NewSellmeier(s.Sellmeier.B, s.Sellmeier.CUM2, lo, hi)
		if err != nil {
			return nil, err
		}
		return m, nil
	case s.ND != nil && s.VD != nil:
		return material.GlassCode{ND: *s.ND, VD: *s.VD}, nil
	case s.Index != nil:
		return material.Constant{N: *s.Index}, nil
	}
	return nil, Errorf(EInvalid, "a material needs sellmeier, nd and vd, or index")
}

// Media resolves every material the elements use, by name. Names that do not resolve are left out;
// Validate reports them.
func Media(b *Bench) map[string]material.Medium {
	out := map[string]material.Medium{}
	for _, name := range MaterialNames(b) {
		if m, err := b.Medium(name); err == nil {
			out[name] = m
		}
	}
	return out
}

// MaterialNames lists the materials the elements use, in order of first use.
func MaterialNames(b *Bench) []string {
	var names []string
	seen := map[string]bool{}
	for _, e := range b.Elements {
		for _, m := range e.Materials {
			if !seen[m] {
				seen[m] = true
				names = append(names, m)
			}
		}
	}
	return names
}

// sortedKeys returns a map's keys in sorted order, so that output never depends on map order.
func sortedKeys[V any](m map[string]V) []string {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	return keys
}
