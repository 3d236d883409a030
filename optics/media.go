package optics

import (
	"encoding/json"
	"errors"
	"fmt"
	"sort"
	"strings"

	"raytable/optics/material"
)

// Medium resolves a material name as a bench references it: a user-defined material of the bench,
// a built-in medium, or a glass code "code:NNNMMM". The error is an EInvalid *Error; the problems
// of a user material are under its path in materials, those of any other name at the empty path,
// since only the caller knows where the name was used.
func (b *Bench) Medium(name string) (material.Medium, error) {
	if spec, ok := b.Materials[name]; ok {
		return spec.Medium(materialPath(name))
	}
	m, err := material.Lookup(name)
	if err != nil {
		return nil, Invalid(materialProblems("", err))
	}
	return m, nil
}

// Medium turns a user-defined material into a medium; path is where the material sits in the
// bench ("materials.my-glass"), so that problems name the field. It checks what the bench format
// says about the shape of the spec: exactly one of the three models, nd together with vd, a
// validity range only beside a Sellmeier fit and as [low, high]. Every number is judged by the
// material package's constructors, which own the limits; materialProblems turns their verdict
// into problems. Validate builds each user material through here, and so does the analysis.
func (s MaterialSpec) Medium(path string) (material.Medium, error) {
	switch models := s.models(); len(models) {
	case 0:
		return nil, Invalid([]Problem{{Path: path, Message: "needs exactly one of sellmeier, nd and vd, or index"}})
	case 1:
	default:
		return nil, Invalid([]Problem{{Path: path, Message: "give exactly one of sellmeier, nd and vd, or index; got " + strings.Join(models, ", ")}})
	}
	var (
		problems []Problem
		m        material.Medium
		err      error
	)
	if s.RangeNM != nil && s.Sellmeier == nil {
		problems = append(problems, Problem{Path: field(path, "range_nm"), Message: "applies only to a sellmeier fit"})
	}
	switch {
	case s.Sellmeier != nil:
		lo, hi := 0.0, inf // no range_nm: the fit states no range
		if len(s.RangeNM) == 2 {
			lo, hi = s.RangeNM[0], s.RangeNM[1]
		}
		m, err = material.NewSellmeier(s.Sellmeier.B, s.Sellmeier.CUM2, lo, hi)
		problems = append(problems, materialProblems(path, err)...)
		if s.RangeNM != nil && len(s.RangeNM) != 2 {
			problems = append(problems, Problem{Path: field(path, "range_nm"), Message: fmt.Sprintf("needs two values [low, high] in nm, got %d", len(s.RangeNM))})
		}
	case s.Index != nil:
		m, err = material.NewConstant(*s.Index)
		problems = append(problems, materialProblems(path, err)...)
	case s.ND == nil:
		problems = append(problems, Problem{Path: field(path, "nd"), Message: "required with vd: a glass is given by both nd and vd"})
	case s.VD == nil:
		problems = append(problems, Problem{Path: field(path, "vd"), Message: "required with nd: a glass is given by both nd and vd"})
	default:
		m, err = material.NewGlassCode(*s.ND, *s.VD)
		problems = append(problems, materialProblems(path, err)...)
	}
	if len(problems) > 0 {
		return nil, Invalid(problems)
	}
	return m, nil
}

// models names the models a spec gives, in the order messages list them.
func (s MaterialSpec) models() []string {
	var models []string
	if s.Sellmeier != nil {
		models = append(models, "sellmeier")
	}
	if s.ND != nil || s.VD != nil {
		models = append(models, "nd and vd")
	}
	if s.Index != nil {
		models = append(models, "index")
	}
	return models
}

// materialProblems turns an error of the material package into problems under path: each rule
// of an InputError at its field, anything else at path itself. It is the one place where the
// material package's errors become the bench's problems.
func materialProblems(path string, err error) []Problem {
	if err == nil {
		return nil
	}
	var fields material.InputError
	if !errors.As(err, &fields) {
		return []Problem{{Path: path, Message: err.Error()}}
	}
	problems := make([]Problem, len(fields))
	for i, f := range fields {
		p := path
		if f.Field != "" {
			p = field(path, f.Field)
		}
		problems[i] = Problem{Path: p, Message: f.Rule}
	}
	return problems
}

// DecodeMaterials reads the materials object of a bench file on its own, as the web form sends
// it in one field. It is Decode's own reader, so the same keys, types and problems (named
// "materials.NAME…") apply as in a file; an empty object gives nil. Data that is not JSON at all
// is the error; the rules of each material are Validate's.
func DecodeMaterials(data []byte) (map[string]MaterialSpec, []Problem, error) {
	if !json.Valid(data) {
		var probe any // Unmarshal says where the syntax fails
		return nil, nil, json.Unmarshal(data, &probe)
	}
	r := &reader{}
	m := r.materials("materials", data)
	return m, r.problems, nil
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
