package optics

import (
	"errors"
	"math"
	"strings"

	"raytable/optics/material"
)

// materials checks the user-defined media, in name order so that messages are deterministic.
func (v *checker) materials() {
	for _, name := range sortedKeys(v.b.Materials) {
		before := len(v.problems)
		v.material(name, v.b.Materials[name])
		if len(v.problems) > before {
			v.badMaterials[name] = true
		}
	}
}

func (v *checker) material(name string, spec MaterialSpec) {
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

	var models []string
	if spec.Sellmeier != nil {
		models = append(models, "sellmeier")
	}
	if spec.ND != nil || spec.VD != nil {
		models = append(models, "nd and vd")
	}
	if spec.Index != nil {
		models = append(models, "index")
	}
	switch len(models) {
	case 0:
		v.add(p, "needs exactly one of sellmeier, nd and vd, or index")
		return
	case 1:
	default:
		v.add(p, "give exactly one of sellmeier, nd and vd, or index; got %s", strings.Join(models, ", "))
		return
	}
	if spec.RangeNM != nil && spec.Sellmeier == nil {
		v.add(field(p, "range_nm"), "applies only to a sellmeier fit")
	}
	switch {
	case spec.Sellmeier != nil:
		v.sellmeier(p, spec)
	case spec.Index != nil:
		v.indexValue(field(p, "index"), *spec.Index)
	default:
		v.glass(p, spec.ND, spec.VD)
	}
}

// indexValue checks an index or nd: finite and within [1, MaxIndex] (relative to air).
func (v *checker) indexValue(path string, n float64) bool {
	if !v.finite(path, n) {
		return false
	}
	if n < 1 || n > MaxIndex {
		v.add(path, "index %s must lie between 1 and %s (indices are relative to air)", fmtNum(n), fmtNum(MaxIndex))
		return false
	}
	return true
}

// glass checks a material given by nd and vd, first by the bench rules, then by the rules of the
// glass-code dispersion model that will evaluate it.
func (v *checker) glass(p string, nd, vd *float64) {
	ok := true
	if nd == nil {
		v.add(field(p, "nd"), "required with vd: a glass is given by both nd and vd")
		ok = false
	} else {
		ok = v.indexValue(field(p, "nd"), *nd) && ok
	}
	if vd == nil {
		v.add(field(p, "vd"), "required with nd: a glass is given by both nd and vd")
		ok = false
	} else if v.finite(field(p, "vd"), *vd) {
		if *vd <= 0 {
			v.add(field(p, "vd"), "Abbe number must be greater than 0, got %s", fmtNum(*vd))
			ok = false
		}
	} else {
		ok = false
	}
	if ok {
		_, err := material.NewGlassCode(*nd, *vd)
		v.materialError(p, err)
	}
}

// sellmeier checks the shape of a Sellmeier fit, then lets the material package judge the numbers
// (non-negative C, no resonance inside the range).
func (v *checker) sellmeier(p string, spec MaterialSpec) {
	s := spec.Sellmeier
	sp := field(p, "sellmeier")
	ok := true
	if len(s.B) < 1 || len(s.B) > material.MaxSellmeierTerms {
		v.add(field(sp, "b"), "needs 1 to %d terms, got %d", material.MaxSellmeierTerms, len(s.B))
		ok = false
	}
	if len(s.CUM2) != len(s.B) {
		v.add(field(sp, "c_um2"), "needs one value per term of b (%d), got %d", len(s.B), len(s.CUM2))
		ok = false
	}
	for i, x := range s.B {
		ok = v.finite(index(field(sp, "b"), i), x) && ok
	}
	for i, x := range s.CUM2 {
		ok = v.finite(index(field(sp, "c_um2"), i), x) && ok
	}
	lo, hi := 0.0, math.Inf(1)
	if spec.RangeNM != nil {
		rp := field(p, "range_nm")
		if len(spec.RangeNM) != 2 {
			v.add(rp, "needs two values [low, high] in nm, got %d", len(spec.RangeNM))
			ok = false
		} else {
			okLo := v.finite(index(rp, 0), spec.RangeNM[0])
			okHi := v.finite(index(rp, 1), spec.RangeNM[1])
			lo, hi = spec.RangeNM[0], spec.RangeNM[1]
			if okLo && okHi && lo >= hi {
				v.add(rp, "low end %s nm must be below the high end %s nm", fmtNum(lo), fmtNum(hi))
			}
			ok = ok && okLo && okHi && lo < hi
		}
	}
	if ok {
		_, err := material.NewSellmeier(s.B, s.CUM2, lo, hi)
		v.materialError(p, err)
	}
}

// materialError files the rules the material package reports, under the material's path.
func (v *checker) materialError(p string, err error) {
	if err == nil {
		return
	}
	var ie material.InputError
	if errors.As(err, &ie) {
		for _, fe := range ie {
			fp := p
			if fe.Field != "" {
				fp = field(p, fe.Field)
			}
			v.add(fp, "%s", fe.Rule)
		}
		return
	}
	v.add(p, "%v", err)
}

// lensMaterial checks that a lens names a medium that resolves and that gives a usable index at
// every wavelength. Problems of a user material itself are reported under materials.
func (v *checker) lensMaterial(path, name string, checked map[string]bool) {
	if name == "" {
		v.add(path, "must name a material")
		return
	}
	if _, user := v.b.Materials[name]; user && v.badMaterials[name] {
		return
	}
	m, err := v.b.Medium(name)
	if err != nil {
		v.add(path, "%s", err.Error())
		return
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
