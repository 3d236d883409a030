package server

import (
	"bytes"
	"slices"
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
			if optics.Validate(c.Bench) != nil {
				continue // the format, or a material left without a model: not a bench the form shows
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
