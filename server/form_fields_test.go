package server

import (
	"bytes"
	"encoding/json"
	"slices"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// TestFormCoversEveryField puts a bench that sets every field of the format (built from optics'
// tables, so a new type or field is in it), and that bench with each field changed alone, through
// the page form: benchValues -> parseBenchForm must give the same bench back, every value written
// must have an input, and every input a label.
func TestFormCoversEveryField(t *testing.T) {
	for _, sk := range optics.SourceKinds {
		base := benchtest.EveryField(sk.Kind)
		changes := append([]benchtest.Change{{Path: "nothing", Bench: base}}, benchtest.Changes(base)...)
		for _, c := range changes {
			if optics.Validate(c.Bench) != nil || strings.HasSuffix(c.Path, ".same_as") {
				// The format, or a material left without a model: not a bench the form shows. A
				// same_as pass carries only its id, type, gap, turn and reflected list (ARMS.md),
				// so one set beside every physical field is not a bench the rules take either.
				continue
			}
			want, err := optics.Encode(c.Bench)
			if err != nil {
				t.Fatal(err)
			}
			values := benchValues(c.Bench)
			got, problems := parseBenchForm(valuesOf(values))
			if len(problems) > 0 {
				t.Errorf("%s source, %s changed: problems reading the form back: %v", sk.Kind, c.Path, problems)
				continue
			}
			back, err := optics.Encode(got)
			if err != nil {
				t.Errorf("%s source, %s changed: the form gave an invalid bench: %v", sk.Kind, c.Path, err)
				continue
			}
			if !bytes.Equal(want, back) {
				t.Errorf("%s source, %s changed: the form changed the bench:\nwant %s\ngot  %s", sk.Kind, c.Path, want, back)
			}
			names := fieldNames(c.Bench)
			for k, v := range values {
				if v != "" && !names[k] {
					t.Errorf("%s source, %s changed: value %s=%q has no input on the form", sk.Kind, c.Path, k, v)
				}
			}
		}
	}
	b := benchtest.EveryField(optics.SourceCollimated)
	form := buildForm("x", b, benchValues(b), nil)
	fields := slices.Concat(form.General.Fields, form.Table.Fields, form.Source.Fields, form.Beam.Fields, form.Materials.Fields)
	for _, r := range form.Rays {
		fields = append(fields, r.Fields...)
	}
	for _, e := range form.Elements {
		fields = append(fields, e.Fields...)
	}
	if len(fields) < 40 {
		t.Errorf("the form has %d inputs; want one per field of the bench", len(fields))
	}
	for _, f := range fields {
		if f.Label == "" && f.Kind != "hidden" {
			t.Errorf("input %s has no label", f.Name)
		}
	}
}

// TestFormCarriesNestedLists puts a branching bench through the page form: a splitter with every
// own field whose reflected arm holds a mirror, a periscope, a splitter of its own with a
// reflected arm, and a same_as pass; and a further source with its own fields and elements. The
// form must give back the same bench, with an input for every value it wrote.
func TestFormCarriesNestedLists(t *testing.T) {
	b := benchtest.Load(t, "demo-bench.json")
	inner := optics.DefaultElement(optics.TypeSplitter)
	inner.ID = "BS2"
	inner.Reflect = new(0.3)
	inner.Reflected = []optics.Element{{ID: "D9", Type: optics.TypeDump, GapMM: 40}}
	bs := optics.DefaultElement(optics.TypeSplitter)
	bs.ID, bs.ThicknessMM, bs.Material = "BS1", new(3.0), "fused-silica"
	bs.Dichroic = &optics.Dichroic{EdgeNM: 600, Reflects: optics.ReflectsLonger}
	bs.Mount = &optics.Mount{WidthMM: 30, DepthMM: 20}
	mirror := optics.DefaultElement(optics.TypeMirror)
	mirror.ID = "M7"
	peri := optics.DefaultElement(optics.TypePeriscope)
	peri.ID, peri.RiseMM = "P1", new(-20.0)
	pass := optics.Element{ID: "M1b", Type: optics.TypeMirror, GapMM: 70, SameAs: "M1"}
	bs.Reflected = []optics.Element{mirror, peri, inner, pass}
	b.Elements = append(b.Elements[:2], append([]optics.Element{bs}, b.Elements[2:]...)...)
	more := optics.MoreSource{ID: "G", Source: optics.DefaultSource(optics.SourceCollimated), WavelengthsNM: []float64{532}}
	more.HeightMM = new(90.0)
	more.Beam = &optics.Beam{WaistRadiusMM: 0.4}
	more.Elements = []optics.Element{{ID: "BS1b", Type: optics.TypeSplitter, GapMM: 30, SameAs: "BS1",
		Reflected: []optics.Element{{ID: "D8", Type: optics.TypeDump, GapMM: 20}}}}
	b.MoreSources = []optics.MoreSource{more}

	// The form's round trip is checked on the values, as json.Marshal writes them: the bench's
	// geometry (whether each pass meets its part) is not the form's to judge.
	want, err := json.Marshal(b)
	if err != nil {
		t.Fatal(err)
	}
	values := benchValues(b)
	for _, name := range []string{"elements[2].reflected[0].gap_mm", "elements[2].reflected[2].reflected[0].type",
		"elements[2].reflected[3].same_as", "elements[2].dichroic", "more_sources[0].elements[0].reflected[0].gap_mm",
		"more_sources[0].id", "more_sources[0].beam.waist_radius_mm", "more_sources[0].height_mm"} {
		if values[name] == "" {
			t.Errorf("the form writes no value for %s", name)
		}
	}
	got, problems := parseBenchForm(valuesOf(values))
	if len(problems) > 0 {
		t.Fatalf("problems reading the form back: %v", problems)
	}
	back, err := json.Marshal(got)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(want, back) {
		t.Errorf("the form changed the bench:\nwant %s\ngot  %s", want, back)
	}
	names := fieldNames(b)
	for k, v := range values {
		if v != "" && !names[k] {
			t.Errorf("value %s=%q has no input on the form", k, v)
		}
	}
	form := buildForm("x", b, values, nil)
	if n := len(form.Elements[2].Arms); n != 1 || len(form.Elements[2].Arms[0].Elements) != 4 {
		t.Fatalf("the splitter's form shows %d arms, want one of 4 elements", n)
	}
	pass3 := form.Elements[2].Arms[0].Elements[3]
	if pass3.UpAction != "up-at:elements[2].reflected[3]" || pass3.DeleteAction != "delete-at:elements[2].reflected[3]" {
		t.Errorf("nested element buttons %q, %q", pass3.UpAction, pass3.DeleteAction)
	}
	if len(form.MoreSources) != 1 || form.MoreSources[0].Arm.List != "more_sources[0].elements" {
		t.Errorf("further sources on the form: %+v", form.MoreSources)
	}
}
