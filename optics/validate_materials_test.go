package optics

import (
	"errors"
	"reflect"
	"testing"

	"raytable/optics/material"
)

// TestMaterialNumbersHaveOneOwner: every verdict on the numbers of a user material is the material
// package's. Validate reports exactly the rules its constructor gives, at the fields it names, and
// accepts what it accepts; optics adds only presence and shape. The limits themselves are the
// material package's (nd of a glass code at most 3, a constant index at most MaxIndex).
func TestMaterialNumbersHaveOneOwner(t *testing.T) {
	glass := func(nd, vd float64) func() error {
		return func() error { _, err := material.NewGlassCode(nd, vd); return err }
	}
	constant := func(n float64) func() error {
		return func() error { _, err := material.NewConstant(n); return err }
	}
	fit := func(b, c []float64, lo, hi float64) func() error {
		return func() error { _, err := material.NewSellmeier(b, c, lo, hi); return err }
	}
	cases := []struct {
		name  string
		spec  MaterialSpec
		build func() error
	}{
		{"a glass", MaterialSpec{ND: ptr(1.6), VD: ptr(40.0)}, glass(1.6, 40)},
		{"nd at its limit", MaterialSpec{ND: ptr(3.0), VD: ptr(40.0)}, glass(3, 40)},
		{"nd above it", MaterialSpec{ND: ptr(4.0), VD: ptr(40.0)}, glass(4, 40)},
		{"nd above the constant-index limit", MaterialSpec{ND: ptr(5.5), VD: ptr(40.0)}, glass(5.5, 40)},
		{"nd below 1 and vd 0", MaterialSpec{ND: ptr(0.9), VD: ptr(0.0)}, glass(0.9, 0)},
		{"an index at its limit", MaterialSpec{Index: ptr(material.MaxIndex)}, constant(material.MaxIndex)},
		{"an index above it", MaterialSpec{Index: ptr(7.0)}, constant(7)},
		{"an index below 1", MaterialSpec{Index: ptr(0.9)}, constant(0.9)},
		{"a fit", MaterialSpec{Sellmeier: &SellmeierSpec{B: []float64{1}, CUM2: []float64{0.01}}, RangeNM: []float64{400, 700}},
			fit([]float64{1}, []float64{0.01}, 400, 700)},
		{"a fit with a negative C and a reversed range", MaterialSpec{Sellmeier: &SellmeierSpec{B: []float64{1, 1}, CUM2: []float64{-0.01, 0.02}}, RangeNM: []float64{700, 400}},
			fit([]float64{1, 1}, []float64{-0.01, 0.02}, 700, 400)},
		{"a resonance inside the range", MaterialSpec{Sellmeier: &SellmeierSpec{B: []float64{1}, CUM2: []float64{0.25}}, RangeNM: []float64{400, 1000}},
			fit([]float64{1}, []float64{0.25}, 400, 1000)},
		{"seven terms", MaterialSpec{Sellmeier: &SellmeierSpec{B: make([]float64, 7), CUM2: make([]float64, 7)}},
			fit(make([]float64, 7), make([]float64, 7), 0, inf)},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var want []Problem
			var rules material.InputError
			if err := c.build(); errors.As(err, &rules) {
				for _, r := range rules {
					want = append(want, Problem{Path: "materials.m." + r.Field, Message: r.Rule})
				}
			} else if err != nil {
				t.Fatalf("constructor error %v is not an InputError", err)
			}
			b := fixture(t)
			b.Materials = map[string]MaterialSpec{"m": c.spec}
			if got := ErrorProblems(Validate(b)); !reflect.DeepEqual(got, want) {
				t.Errorf("Validate reports\n%v\nthe material package says\n%v", got, want)
			}
		})
	}
}

// TestMaterialShapeIsOptics: what optics itself says about a user material is its presence and
// shape, never a number.
func TestMaterialShapeIsOptics(t *testing.T) {
	for _, tc := range []struct {
		name string
		spec MaterialSpec
		want []string // path: message
	}{
		{"no model", MaterialSpec{}, []string{"materials.m: needs exactly one of sellmeier, nd and vd, or index"}},
		{"two models", MaterialSpec{Index: ptr(1.5), ND: ptr(1.5), VD: ptr(40.0)},
			[]string{"materials.m: give exactly one of sellmeier, nd and vd, or index; got nd and vd, index"}},
		{"vd without nd", MaterialSpec{VD: ptr(40.0)}, []string{"materials.m.nd: required with vd: a glass is given by both nd and vd"}},
		{"nd without vd", MaterialSpec{ND: ptr(1.5)}, []string{"materials.m.vd: required with nd: a glass is given by both nd and vd"}},
		{"a range beside an index", MaterialSpec{Index: ptr(1.5), RangeNM: []float64{400, 700}},
			[]string{"materials.m.range_nm: applies only to a sellmeier fit"}},
		{"a range of three values", MaterialSpec{Sellmeier: &SellmeierSpec{B: []float64{1}, CUM2: []float64{0.01}}, RangeNM: []float64{1, 2, 3}},
			[]string{"materials.m.range_nm: needs two values [low, high] in nm, got 3"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			b := fixture(t)
			b.Materials = map[string]MaterialSpec{"m": tc.spec}
			var got []string
			for _, p := range ErrorProblems(Validate(b)) {
				got = append(got, p.String())
			}
			if !reflect.DeepEqual(got, tc.want) {
				t.Errorf("problems\n%q\nwant\n%q", got, tc.want)
			}
		})
	}
}

// TestDecodeMaterialsIsTheFileReader: the materials object read alone (as the web form sends it)
// gives the same specs and the same problems as inside a bench file.
func TestDecodeMaterialsIsTheFileReader(t *testing.T) {
	const materials = `{"oil": {"index": "1.5"}, "glass": {"nd": 1.6, "vd": 40, "colour": "amber"},
		"fit": {"sellmeier": {"b": [1]}, "range_nm": [400, 700]}, "glass": {"index": 1.4}}`
	specs, problems, err := DecodeMaterials([]byte(materials))
	if err != nil {
		t.Fatal(err)
	}
	file := validBench("", "")
	file = file[:len(file)-1] + `, "materials": ` + materials + `}`
	_, fileErr := DecodeTrusted([]byte(file)) // the reader alone, without the rules Decode adds
	fromFile := ErrorProblems(fileErr)
	if len(problems) != 4 || !reflect.DeepEqual(problems, fromFile) {
		t.Errorf("alone:\n%v\nin a file:\n%v", problems, fromFile)
	}
	if got := specs["glass"]; got.ND == nil || *got.ND != 1.6 || got.Index != nil {
		t.Errorf("glass read as %+v, want the first of the two (nd 1.6)", got)
	}

	if specs, problems, err := DecodeMaterials([]byte(`{}`)); specs != nil || problems != nil || err != nil {
		t.Errorf("empty object: %v, %v, %v; want nothing", specs, problems, err)
	}
	if _, _, err := DecodeMaterials([]byte(`{"oil": {"index": 1.5}`)); err == nil {
		t.Error("broken JSON gave no error")
	}
}
