package optics

import (
	"reflect"
	"slices"
	"strings"
	"testing"
)

// benchTypes are the Go types of the objects of the bench file.
var benchTypes = []reflect.Type{
	reflect.TypeFor[Bench](), reflect.TypeFor[Table](), reflect.TypeFor[Source](), reflect.TypeFor[ExplicitRay](),
	reflect.TypeFor[Beam](), reflect.TypeFor[MaterialSpec](), reflect.TypeFor[SellmeierSpec](), reflect.TypeFor[Element](),
	reflect.TypeFor[Mount](),
}

// TestTablesMatchStructs ties the field tables to the JSON tags of the bench types: every struct
// field has exactly one table entry and every entry a struct field, so that a field added to a
// struct without its entry (which the decoder, validation, the diff and the form read) fails here.
func TestTablesMatchStructs(t *testing.T) {
	for _, typ := range benchTypes {
		fields := fieldsOf(typ)
		var tags []string
		for i := range typ.NumField() {
			key := tagKey(typ.Field(i))
			tags = append(tags, key)
			if _, ok := FieldByKey(fields, key); !ok {
				t.Errorf("%s.%s (json %q) has no entry in the field tables", typ.Name(), typ.Field(i).Name, key)
			}
		}
		for _, f := range fields {
			if !slices.Contains(tags, f.Key) {
				t.Errorf("the table of %s has %q, which is no field of the struct", typ.Name(), f.Key)
			}
		}
	}
	for _, table := range [][]Field{BenchFields, TableFields, SourceFields, RayFields, BeamFields, MaterialFields, SellmeierFields, ElementFields, MountFields} {
		if k := keys(table); len(slices.Compact(slices.Sorted(slices.Values(k)))) != len(k) {
			t.Errorf("a table lists a key twice: %v", k)
		}
	}
}

// TestFieldShapes checks each entry against its struct field's Go type: a quantity for numbers
// only, Flat only for radii, a nested table exactly for objects, a hint and a reason only where a
// field is required, and the same meaning wherever two tables share a key.
func TestFieldShapes(t *testing.T) {
	numeric := map[reflect.Type]bool{
		reflect.TypeFor[float64](): true, reflect.TypeFor[*float64](): true, reflect.TypeFor[[]float64](): true, reflect.TypeFor[[]*float64](): true,
	}
	for _, typ := range benchTypes {
		for i := range typ.NumField() {
			sf := typ.Field(i)
			f, _ := FieldByKey(fieldsOf(typ), tagKey(sf))
			name := typ.Name() + "." + f.Key
			if (f.Quantity != nil) != numeric[sf.Type] {
				t.Errorf("%s: quantity %v for a %s", name, f.Quantity, sf.Type)
			}
			if f.Flat && sf.Type != reflect.TypeFor[*float64]() && sf.Type != reflect.TypeFor[[]*float64]() {
				t.Errorf("%s: flat is for radii, not a %s", name, sf.Type)
			}
			if sf.Type == reflect.TypeFor[[]*float64]() && !f.Flat {
				t.Errorf("%s: a list of radii must say that null is flat", name)
			}
			if object := fieldsOf(base(sf.Type)) != nil; object != (f.Fields != nil) {
				t.Errorf("%s: nested table %v for a %s", name, f.Fields != nil, sf.Type)
			}
			if (f.Hint != "" || f.About != "") && !f.Required {
				t.Errorf("%s: a hint or reason for a field that is not required", name)
			}
		}
	}
	for _, all := range [][][]Field{kindTables(), sourceKindTables()} {
		for _, table := range all {
			for _, f := range table {
				g, _ := FieldByKey(union(all...), f.Key)
				f.Label, g.Label = "", "" // a label may say what the field is for this kind
				// whether a kind needs it may differ too: a point source needs na, a fibre's cone
				// defaults to its mode's divergence
				f.Required, g.Required, f.About, g.About, f.Hint, g.Hint, f.Absent, g.Absent = false, false, "", "", "", "", "", ""
				if !reflect.DeepEqual(f, g) {
					t.Errorf("%s means different things in two kinds: %+v and %+v", f.Key, f, g)
				}
			}
		}
	}
}

// base is the type a pointer, list or map holds, else t.
func base(t reflect.Type) reflect.Type {
	switch t.Kind() {
	case reflect.Pointer, reflect.Slice, reflect.Map:
		return base(t.Elem())
	}
	return t
}

func kindTables() [][]Field {
	var out [][]Field
	for _, k := range Kinds {
		out = append(out, k.Fields)
	}
	return out
}

func sourceKindTables() [][]Field {
	var out [][]Field
	for _, k := range SourceKinds {
		out = append(out, k.Fields)
	}
	return out
}

// TestKindTable checks each entry of the kind tables: names, messages and ids are there and
// distinct, a kind's fields are its own (not common ones), its default sets none but its own, and
// its mount grows from a number it has.
func TestKindTable(t *testing.T) {
	seen := map[string]bool{}
	for _, k := range Kinds {
		if k.Type == "" || k.Noun == "" || k.Label == "" || k.IDPrefix == "" || k.Default == nil {
			t.Errorf("%q: an entry needs a type, noun, label, id prefix and default: %+v", k.Type, k)
		}
		for _, s := range []string{"type " + k.Type, "noun " + k.Noun, "label " + k.Label, "prefix " + k.IDPrefix} {
			if seen[s] {
				t.Errorf("two kinds share the %s", s)
			}
			seen[s] = true
		}
		for _, f := range k.Fields {
			if _, common := FieldByKey(ElementFields, f.Key); common {
				t.Errorf("%s lists the common field %s as its own", k.Type, f.Key)
			}
		}
		e := DefaultElement(k.Type)
		ev := reflect.ValueOf(e)
		for _, f := range elementKindFields {
			if _, own := FieldByKey(k.Fields, f.Key); !own && !f.value(ev).IsZero() {
				t.Errorf("the default %s sets %s, which is not its field", k.Type, f.Key)
			}
		}
		if r := k.Mount.SizedBy; r != "" {
			f, own := FieldByKey(k.Fields, r)
			if _, isNumber := f.In(&e).(**float64); !own || !isNumber {
				t.Errorf("%s's mount grows from %q, which is not one of its optional numbers", k.Type, r)
			}
		}
		if k.StopsRays && !k.EndsPath {
			t.Errorf("%s stops every ray but a path may not end on it", k.Type)
		}
	}
	for _, c := range []struct {
		names []string
		want  string
	}{{[]string{"point"}, `"point"`}, {[]string{"collimated", "point"}, `"collimated" or "point"`}, {[]string{"a", "b", "c"}, `"a", "b" or "c"`}} {
		if got := quotedList(c.names); got != c.want {
			t.Errorf("quotedList(%q) = %s, want %s", c.names, got, c.want)
		}
	}
	for _, k := range SourceKinds {
		if k.Kind == "" || k.Noun == "" || k.Label == "" || k.Default == nil || k.check == nil {
			t.Errorf("%q: a source kind needs a name, noun, label, default and rules: %+v", k.Kind, k)
		}
		if !strings.HasSuffix(k.Noun, "source") {
			t.Errorf("%s: messages say %q, which reads badly after 'a'", k.Kind, "a "+k.Noun)
		}
	}
}

// TestDefaultMounts: each type's rule gives the footprints that the README's breadboard section
// states (common practice for 1-inch-class optics; our own round numbers).
func TestDefaultMounts(t *testing.T) {
	cases := []struct {
		e             Element
		width, depth  float64
		sourceComment string
	}{
		{Element{Type: TypeThinLens, DiameterMM: new(25.4)}, 40.4, 18, "diameter + 15 wide, 18 deep"},
		{Element{Type: TypeLens}, 40.4, 18, "a 25.4 mm optic assumed"},
		{Element{Type: TypeLens, DiameterMM: new(12.7), ThicknessesMM: []float64{20}}, 27.7, 26, "a thick lens: its length + 6 deep"},
		{Element{Type: TypeMirror, DiameterMM: new(50.8)}, 65.8, 65.8, "a square diameter + 15"},
		{Element{Type: TypeAperture, DiameterMM: new(3.0)}, 40, 12, "40 wide whatever the opening"},
		{Element{Type: TypeAperture, DiameterMM: new(30.0)}, 50, 12, "the opening + 20"},
		{Element{Type: TypeScreen, WidthMM: new(8.8)}, 28.8, 30, "the width + 20"},
		{Element{Type: TypeScreen}, 45, 30, "a 25 mm width assumed"},
		{Element{Type: TypeDump}, 30, 30, "a 30 mm block"},
		{Element{Type: "prism"}, 30, 30, "anything unknown gets a dump's"},
	}
	for _, c := range cases {
		if got := DefaultMount(&c.e); got.WidthMM != c.width || got.DepthMM != c.depth {
			t.Errorf("%s (%s): %g x %g, want %g x %g", c.e.Type, c.sourceComment, got.WidthMM, got.DepthMM, c.width, c.depth)
		}
	}
}
