package optics

import (
	"errors"
	"sort"

	"raytable/optics/material"
)

// Medium resolves a material name as a bench references it: a user-defined material of the bench,
// a built-in medium, or a glass code "code:NNNMMM". The error is an EInvalid *Error whose message
// names the rule that failed; the caller adds the JSON path.
func (b *Bench) Medium(name string) (material.Medium, error) {
	if spec, ok := b.Materials[name]; ok {
		return spec.Medium(materialPath(name))
	}
	m, err := material.Lookup(name)
	if err != nil {
		return nil, &Error{Code: EInvalid, Message: err.Error()}
	}
	return m, nil
}

// Medium turns a user-defined material into a medium; path is where the material sits in the
// bench ("materials.my-glass"), so that problems name the field.
func (s MaterialSpec) Medium(path string) (material.Medium, error) {
	var (
		m   material.Medium
		err error
	)
	switch {
	case s.Sellmeier != nil:
		lo, hi := 0.0, inf
		if len(s.RangeNM) == 2 {
			lo, hi = s.RangeNM[0], s.RangeNM[1]
		}
		m, err = material.NewSellmeier(s.Sellmeier.B, s.Sellmeier.CUM2, lo, hi)
	case s.ND != nil && s.VD != nil:
		m, err = material.NewGlassCode(*s.ND, *s.VD)
	case s.Index != nil:
		m, err = material.NewConstant(*s.Index)
	default:
		return nil, Invalid([]Problem{{Path: path, Message: "a material needs sellmeier, nd and vd, or index"}})
	}
	if err != nil {
		return nil, materialError(path, err)
	}
	return m, nil
}

// materialError turns the material package's field errors into problems at path.
func materialError(path string, err error) error {
	var fields material.InputError
	if !errors.As(err, &fields) {
		return Invalid([]Problem{{Path: path, Message: err.Error()}})
	}
	problems := make([]Problem, len(fields))
	for i, f := range fields {
		p := path
		if f.Field != "" {
			p += "." + f.Field
		}
		problems[i] = Problem{Path: p, Message: f.Rule}
	}
	return Invalid(problems)
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
