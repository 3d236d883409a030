package optics

import (
	"fmt"
	"reflect"
	"slices"
	"strconv"
	"strings"
)

// Field is one key of an object in the bench file. The tables in this file (the fixed objects), in
// kinds.go (element types) and in source_kinds.go (source kinds) list every key of every object
// once, and everything that handles keys one by one is derived from them: the keys Decode allows
// and requires and its messages, Validate's presence and stray-field checks, Diff, and the web
// form's inputs and labels.
//
// The table says what a key means; the struct field with the same JSON tag holds its value, and
// its Go type is the field's shape: text (string), a number (float64), an optional number
// (*float64), a list of numbers ([]float64), a list of face radii where nil is flat
// ([]*float64), a list of names ([]string), an optional count (*int) or an object (a struct, a
// pointer to one or a slice of them, whose own table is Fields). The code that reads, compares
// and writes values switches on those few Go types and finds the struct field by its tag (In), so
// a new field of a known shape needs its struct field and its table entry and nothing more. A test
// ties the two: every struct field of the bench types has an entry and every entry a struct field.
//
// The tables are read-only: nothing changes them after the package is initialised.
type Field struct {
	Key      string    // JSON name, as in the struct tag
	Label    string    // what people read beside its input on a form
	Quantity *Quantity // what a number or list of numbers measures; nil for text, names, counts and objects
	Fields   []Field   // an object's own fields (mount, beam, ...)

	// Required: the object must have the field. Decode reports a missing common field of an object
	// ("required field is missing"); a missing field of an element type or source kind is
	// Validate's to report, with a message naming the kind ("a thin lens needs focal_mm"), so that
	// a bench built in Go hears the same.
	Required bool
	About    string // for a required kind field: what it is, ending that message ("…, the radius of the ray bundle")
	Hint     string // for a required kind field: a form left empty there says "is required; " + Hint at once

	Selects   bool   // the field picks the object's kind: an element's type, a source's kind
	Flat      bool   // null is accepted and means flat (a face or mirror radius); a form writes it "flat"
	Absent    string // what an absent optional value means, as the history shows it: "none" unless set
	Prose     bool   // free text: the history says only that it changed
	Multiline bool   // text over several lines, or an object a form edits as its JSON: a text area

	Choices []string // text that must be one of these words (a cylinder axis); nil: any text
}

// absentText is how the history shows a field that is not given: "flat" for a radius, the default
// for a field that has one, "none" otherwise.
func (f Field) absentText() string {
	switch {
	case f.Absent != "":
		return f.Absent
	case f.Flat:
		return "flat"
	}
	return "none"
}

// In returns a pointer to the struct field that f names in the struct obj points to: a *float64
// for gap_mm in a *Element, a **float64 for focal_mm, a *[]string for materials, and so on. It
// panics when the struct has no field with f's JSON name, which the tables' test rules out.
func (f Field) In(obj any) any {
	return f.value(reflect.ValueOf(obj).Elem()).Addr().Interface()
}

// value is the struct field of v (a struct value) with f's JSON name, looking into an embedded
// struct whose fields stand inline (a further source's Source).
func (f Field) value(v reflect.Value) reflect.Value {
	if fv, ok := f.lookup(v); ok {
		return fv
	}
	panic(fmt.Sprintf("optics: %s has no field with JSON name %q", v.Type(), f.Key))
}

func (f Field) lookup(v reflect.Value) (reflect.Value, bool) {
	t := v.Type()
	for i := range t.NumField() {
		sf := t.Field(i)
		if inline(sf) {
			if fv, ok := f.lookup(v.Field(i)); ok {
				return fv, true
			}
			continue
		}
		if tagKey(sf) == f.Key {
			return v.Field(i), true
		}
	}
	return reflect.Value{}, false
}

// inline reports whether a struct field is an embedded struct whose fields the bench file has
// inline, beside the outer object's own.
func inline(sf reflect.StructField) bool {
	return sf.Anonymous && sf.Tag.Get("json") == "" && sf.Type.Kind() == reflect.Struct
}

// tagKey is the JSON name of a struct field.
func tagKey(sf reflect.StructField) string {
	key, _, _ := strings.Cut(sf.Tag.Get("json"), ",")
	return key
}

// FieldByKey finds the field with a JSON name in a table.
func FieldByKey(fields []Field, key string) (Field, bool) {
	for _, f := range fields {
		if f.Key == key {
			return f, true
		}
	}
	return Field{}, false
}

// keys lists the JSON names of a table, in table order.
func keys(fields []Field) []string {
	out := make([]string, len(fields))
	for i, f := range fields {
		out[i] = f.Key
	}
	return out
}

// requiredKeys lists the JSON names of the required fields of a table, in table order.
func requiredKeys(fields []Field) []string {
	var out []string
	for _, f := range fields {
		if f.Required {
			out = append(out, f.Key)
		}
	}
	return out
}

// union joins tables without repeating a key, keeping the first entry of each.
func union(tables ...[]Field) []Field {
	var out []Field
	for _, t := range tables {
		for _, f := range t {
			if !slices.ContainsFunc(out, func(g Field) bool { return g.Key == f.Key }) {
				out = append(out, f)
			}
		}
	}
	return out
}

// The tables of the fixed objects of the bench file, in the order messages list their keys.
var (
	BenchFields = []Field{
		{Key: "format", Required: true},
		{Key: "title", Label: "title", Prose: true},
		{Key: "notes", Label: "notes", Prose: true, Multiline: true},
		{Key: "wavelengths_nm", Label: "wavelengths (first is primary, comma list)", Quantity: Wavelength, Required: true},
		{Key: "table", Required: true, Fields: TableFields},
		{Key: "source", Required: true, Fields: SourceFields},
		{Key: "materials", Label: "materials (JSON, as in the bench file)", Multiline: true, Fields: MaterialFields},
		{Key: "elements", Required: true, Fields: ElementFields},
		{Key: "more_sources", Fields: MoreSourceFields},
	}
	TableFields = []Field{
		{Key: "grid", Label: "hole grid", Required: true},
		{Key: "width_mm", Label: "width", Quantity: Length, Required: true},
		{Key: "depth_mm", Label: "depth", Quantity: Length, Required: true},
		{Key: "beam_height_mm", Label: "beam height", Quantity: Length, Required: true},
		{Key: "hole_offset_mm", Label: "first hole from the edges (empty: by grid)", Quantity: Length, Absent: "default"},
	}
	// SourceFields are the fields of every source; each kind adds its own (SourceKinds).
	SourceFields = []Field{
		{Key: "x_mm", Label: "x on the table", Quantity: Length, Required: true},
		{Key: "y_mm", Label: "y on the table", Quantity: Length, Required: true},
		{Key: "heading_deg", Label: "heading", Quantity: Angle, Required: true},
		{Key: "kind", Label: "kind", Required: true, Selects: true},
		{Key: "rays", Fields: RayFields},
		{Key: "beam", Fields: BeamFields},
		{Key: "fan_rays", Label: "rays per fan (empty: " + strconv.Itoa(DefaultFanRays) + ")", Absent: strconv.Itoa(DefaultFanRays)},
		{Key: "height_mm", Label: "beam height (empty: the table's)", Quantity: Length, Absent: "the table's"},
		// power (README "Power")
		{Key: "power_mw", Label: "power in mW (empty: not stated)", Quantity: Plain},
		{Key: "pulse", Label: "pulses (JSON: energy_uj, duration_ns, rate_hz)", Multiline: true, Fields: PulseFields},
	}
	PulseFields = []Field{
		{Key: "energy_uj", Label: "pulse energy in µJ", Quantity: Plain, Required: true},
		{Key: "duration_ns", Label: "pulse duration in ns", Quantity: Plain, Required: true},
		{Key: "rate_hz", Label: "repetition rate in Hz", Quantity: Plain, Required: true},
	}
	RayFields = []Field{
		{Key: "height_mm", Label: "height", Quantity: Length, Required: true},
		{Key: "angle_deg", Label: "angle", Quantity: Angle, Required: true},
		{Key: "x_mm", Label: "vertical height", Quantity: Length},
		{Key: "x_angle_deg", Label: "vertical angle", Quantity: Angle},
	}
	BeamFields = []Field{
		{Key: "waist_radius_mm", Label: "waist radius (1/e²)", Quantity: Length, Required: true},
		{Key: "waist_at_mm", Label: "waist position from the source", Quantity: Length}, // 0: the waist at the source
		{Key: "m2", Label: "M² (empty: 1)", Quantity: Plain, Absent: "1"},
		{Key: "sagittal", Label: "vertical plane (JSON: waist_radius_mm, waist_at_mm, m2; empty: as the table plane)", Multiline: true, Fields: BeamPlaneFields},
	}
	// BeamPlaneFields are one plane's waist: a beam's or a mode target's vertical plane (sources and targets).
	BeamPlaneFields = []Field{
		{Key: "waist_radius_mm", Label: "waist radius (1/e²)", Quantity: Length, Required: true},
		{Key: "waist_at_mm", Label: "waist position", Quantity: Length},
		{Key: "m2", Label: "M² (empty: 1)", Quantity: Plain, Absent: "1"},
	}
	MaterialFields = []Field{
		{Key: "sellmeier", Fields: SellmeierFields},
		{Key: "range_nm", Quantity: Wavelength},
		{Key: "nd", Quantity: Plain},
		{Key: "vd", Quantity: Plain},
		{Key: "index", Quantity: Plain},
	}
	SellmeierFields = []Field{
		{Key: "b", Quantity: Plain, Required: true},
		{Key: "c_um2", Quantity: Plain, Required: true}, // µm², as λ is in µm in the formula
	}
	// ElementFields are the fields of every element; each type adds its own (Kinds).
	ElementFields = []Field{
		{Key: "id", Label: "id", Required: true},
		{Key: "type", Label: "type", Required: true, Selects: true},
		{Key: "gap_mm", Label: "gap from the previous element", Quantity: Length, Required: true},
		{Key: "mount", Fields: MountFields},
		{Key: "same_as", Label: "another pass through"},
		// power (README "Power")
		{Key: "damage_w_cm2", Label: "damage threshold in W/cm² (empty: none)", Quantity: Plain},
		{Key: "damage_j_cm2", Label: "damage threshold in J/cm² (empty: none)", Quantity: Plain},
	}
	// moreSourceOwnFields are a further source's own fields; the source fields (SourceFields and
	// the kind's) stand inline beside them (MoreSourceFields).
	moreSourceOwnFields = []Field{
		{Key: "id", Label: "id", Required: true},
		{Key: "wavelengths_nm", Label: "wavelengths (empty: the bench's)", Quantity: Wavelength},
		{Key: "elements", Required: true, Fields: ElementFields},
	}
	// MoreSourceFields are every key of a further source: its own and then the source's.
	MoreSourceFields = union(moreSourceOwnFields, allSourceFields)
	MountFields      = []Field{
		{Key: "width_mm", Label: "mount width (empty: by type)", Quantity: Length, Required: true},
		{Key: "depth_mm", Label: "mount depth", Quantity: Length, Required: true},
	}
)

// FieldsOf is the table of an object type of the bench file (Bench, Table, Source, ExplicitRay,
// Beam, MaterialSpec, SellmeierSpec, Element, Mount), given a value or pointer of that type. For
// a source or an element it holds the common fields and then those of every kind; nil for any
// other type.
func FieldsOf(obj any) []Field {
	t := reflect.TypeOf(obj)
	if t != nil && t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	return fieldsOf(t)
}

func fieldsOf(t reflect.Type) []Field { return tables[t] }

// tables maps each object type of the bench file to its table.
var tables = map[reflect.Type][]Field{
	reflect.TypeFor[Bench]():         BenchFields,
	reflect.TypeFor[Table]():         TableFields,
	reflect.TypeFor[Source]():        allSourceFields,
	reflect.TypeFor[ExplicitRay]():   RayFields,
	reflect.TypeFor[Beam]():          BeamFields,
	reflect.TypeFor[MaterialSpec]():  MaterialFields,
	reflect.TypeFor[SellmeierSpec](): SellmeierFields,
	reflect.TypeFor[Element]():       allElementFields,
	reflect.TypeFor[Mount]():         MountFields,
	reflect.TypeFor[Dichroic]():      DichroicFields,
	reflect.TypeFor[MoreSource]():    MoreSourceFields,
	reflect.TypeFor[BeamPlane]():     BeamPlaneFields, // sources and targets
	reflect.TypeFor[Pulse]():         PulseFields,
}

// withKinds is common followed by the fields of every kind, each key once (see union).
func withKinds[K any](common []Field, kinds []K, fields func(K) []Field) []Field {
	tables := [][]Field{common}
	for _, k := range kinds {
		tables = append(tables, fields(k))
	}
	return union(tables...)
}
