package optics

import (
	"math"
	"strings"

	"raytable/optics/material"
)

// materials checks the user-defined media, in name order so that messages are deterministic, and
// keeps the medium of each one without problems for the lenses that use it.
func (v *checker) materials() {
	for _, name := range sortedKeys(v.b.Materials) {
		if m, ok := v.material(name, v.b.Materials[name]); ok {
			v.userMedia[name] = m
		}
	}
}

// material checks the name of a user material, then builds its medium: MaterialSpec.Medium checks
// the shape of the spec and lets the material package judge its numbers. ok is false when the
// material has any problem.
func (v *checker) material(name string, spec MaterialSpec) (m material.Medium, ok bool) {
	before := len(v.problems)
	p := materialPath(name)
	switch {
	case name == "":
		v.add(p, "a material name must not be empty")
	case strings.HasPrefix(name, "code:"):
		v.add(p, "a user material name must not start with \"code:\", which is reserved for glass codes")
	default:
		if _, builtin := material.Builtin(name); builtin {
			v.add(p, "%q is a built-in medium; give the user material another name", name)
		}
	}
	m, err := spec.Medium(p)
	v.problems = append(v.problems, ErrorProblems(err)...)
	return m, len(v.problems) == before
}

// lensMaterial checks that a lens names a medium that resolves and that gives a usable index at
// every wavelength. Problems of a user material itself are reported under materials.
func (v *checker) lensMaterial(path, name string, checked map[string]bool) {
	if name == "" {
		v.add(path, "must name a material")
		return
	}
	m, user := v.userMedia[name] // built once, by materials
	if _, defined := v.b.Materials[name]; defined && !user {
		return // it has problems of its own
	}
	if !user {
		var err error
		if m, err = material.Lookup(name); err != nil {
			v.problems = append(v.problems, materialProblems(path, err)...)
			return
		}
	}
	if checked[name] || !v.wavelengthsValid() {
		return
	}
	checked[name] = true
	var bad []string
	for _, w := range v.b.WavelengthsNM {
		if n := m.Index(w); math.IsNaN(n) || math.IsInf(n, 0) || n <= 0 {
			bad = append(bad, fmtNum(w))
		}
	}
	if len(bad) > 0 {
		v.add(path, "material %q gives no usable (real, positive) index at %s nm", name, strings.Join(bad, ", "))
	}
}
