package optics_test

import (
	"reflect"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// TestEveryFieldChangedAlone changes each field of a bench that sets every field of the format
// (built from the kind table, so a new type or field is in it), one at a time: the history must
// name the change, and a valid changed bench must survive Encode -> Decode unchanged. Between
// them, the two benches (one per source kind) must change every field of every table, so that
// none escapes the test.
func TestEveryFieldChangedAlone(t *testing.T) {
	changed := map[string]bool{}
	for _, sk := range optics.SourceKinds {
		base := benchtest.EveryField(sk.Kind)
		for _, c := range benchtest.Changes(base) {
			changed[c.In.Name()+"."+c.Key] = true
			if lines := optics.Diff(base, c.Bench); len(lines) == 0 {
				t.Errorf("%s source, %s changed (removed %v): the diff is empty", sk.Kind, c.Path, c.Removed)
			}
			err := optics.Validate(c.Bench)
			if err != nil {
				// The format has one value; a removed model leaves a material without one.
				if !c.Removed && !c.Breaks && c.Key != "format" {
					t.Errorf("%s source, %s changed: %v", sk.Kind, c.Path, err)
				}
				continue
			}
			data, err := optics.Encode(c.Bench)
			if err != nil {
				t.Fatal(err)
			}
			back, err := optics.Decode(data)
			if err != nil {
				t.Errorf("%s source, %s changed: Decode(Encode): %v", sk.Kind, c.Path, err)
				continue
			}
			if !reflect.DeepEqual(back, c.Bench) {
				t.Errorf("%s source, %s changed: Encode -> Decode gave\n%+v\nwant\n%+v", sk.Kind, c.Path, back, c.Bench)
			}
		}
	}
	for _, obj := range []any{optics.Bench{}, optics.Table{}, optics.Source{}, optics.ExplicitRay{}, optics.Beam{},
		optics.MaterialSpec{}, optics.SellmeierSpec{}, optics.Element{}, optics.Mount{}, optics.Dichroic{}, optics.MoreSource{}} {
		typ := reflect.TypeOf(obj)
		for _, f := range optics.FieldsOf(obj) {
			if _, inline := optics.FieldByKey(optics.FieldsOf(optics.Source{}), f.Key); inline && typ != reflect.TypeFor[optics.Source]() {
				continue // a further source's source fields are changed as Source's
			}
			if f.Fields == nil && !changed[typ.Name()+"."+f.Key] {
				t.Errorf("no change of %s.%s: the bench with every field lacks it", typ.Name(), f.Key)
			}
		}
	}
}
