// Package benchtest gives tests a bench that sets every field of the bench format, and that bench
// with each of its fields changed alone. Both are built from optics' field tables and kind table,
// so a field or element type added there is covered by every test that uses them without editing
// the tests. It is for tests only.
package benchtest

import (
	"encoding/json"
	"fmt"
	"maps"
	"reflect"
	"slices"
	"strings"

	"raytable/optics"
)

// EveryFieldJSON is a bench file written by hand for tests that pick particular fields and
// elements: a mount, user materials of all three kinds, explicit rays, a beam, a hole offset, a fan
// size and elements of every type, among them a three-face lens of user glasses, a window of two
// flat faces and a screen without a width. EveryField, built from the tables, also covers types and
// fields added after it was written.
const EveryFieldJSON = `{
  "format": "raytable/bench/v1",
  "title": "every field <&>",
  "notes": "line one\nline two",
  "wavelengths_nm": [1064, 532],
  "table": {"grid": "imperial-1in", "width_mm": 1219.2, "depth_mm": 609.6, "beam_height_mm": 101.6, "hole_offset_mm": 12.7},
  "source": {"x_mm": 50, "y_mm": 300, "heading_deg": 0, "kind": "collimated", "semi_diameter_mm": 1.5,
    "field_angles_deg": [0, 0.1], "fan_rays": 11,
    "rays": [{"height_mm": 0.5, "angle_deg": 0.1, "x_mm": 0.2, "x_angle_deg": -0.1}],
    "beam": {"waist_radius_mm": 0.5, "waist_at_mm": -100, "m2": 1.2}},
  "materials": {
    "my-glass": {"sellmeier": {"b": [1.03961212, 0.231792344, 1.01046945], "c_um2": [0.00600069867, 0.0200179144, 103.560653]}, "range_nm": [400, 1600]},
    "my-flint": {"nd": 1.6727, "vd": 32.2},
    "oil": {"index": 1.515}
  },
  "elements": [
    {"id": "L1", "type": "lens", "gap_mm": 100, "faces_mm": [60, -40, null], "thicknesses_mm": [5, 2], "materials": ["my-glass", "my-flint"], "diameter_mm": 25.4, "mount": {"width_mm": 40, "depth_mm": 20}},
    {"id": "F1", "type": "thin-lens", "gap_mm": 80, "focal_mm": 100},
    {"id": "M1", "type": "mirror", "gap_mm": 60, "radius_mm": 500, "turn_deg": 90, "diameter_mm": 25.4},
    {"id": "W1", "type": "lens", "gap_mm": 30, "faces_mm": [null, null], "thicknesses_mm": [3], "materials": ["oil"]},
    {"id": "A1", "type": "aperture", "gap_mm": 40, "diameter_mm": 10},
    {"id": "S1", "type": "screen", "gap_mm": 50, "width_mm": 8},
    {"id": "S2", "type": "screen", "gap_mm": 10},
    {"id": "D1", "type": "dump", "gap_mm": 30}
  ]
}`

// EveryField returns a valid bench that sets every field of the format, built from the tables: the
// table, source, materials, rays and beam of EveryFieldJSON, the source of the given kind (a new
// kind with its defaults, see optics.ChangeSourceKind), and one element of each type in table
// order, with its default fields, every optional field of its type filled and a mount. It panics
// if the tables make it invalid.
func EveryField(sourceKind string) *optics.Bench {
	b, err := optics.Decode([]byte(EveryFieldJSON))
	if err != nil {
		panic(err)
	}
	b.Elements = []optics.Element{}
	if sourceKind != b.Source.Kind {
		b.Source = optics.ChangeSourceKind(b.Source, sourceKind)
	}
	fillAll(&b.Source, optics.SourceKindOrFirst(sourceKind).Fields)
	fillAll(&b.Source, optics.SourceFields)
	for _, k := range optics.Kinds {
		e := optics.DefaultElement(k.Type)
		e.ID = optics.UniqueID(b, k.Type)
		e.Mount = &optics.Mount{WidthMM: 40, DepthMM: 20}
		e.DamageWCM2, e.DamageJCM2 = new(1e6), new(10.0)
		fillAll(&e, k.Fields)
		b.Elements = append(b.Elements, e)
	}
	addBranches(b)
	if err := optics.Validate(b); err != nil {
		panic(fmt.Sprintf("benchtest: the bench with every field is invalid: %v", err))
	}
	return b
}

// addBranches gives the bench what a branching bench has beyond one element of each type: a
// reflected list on the splitter, a dichroic splitter, a same_as pass through the aperture and a
// further source with its own list.
func addBranches(b *optics.Bench) {
	for i := range b.Elements {
		if e := &b.Elements[i]; e.Type == optics.TypeSplitter {
			e.Reflected = []optics.Element{{ID: "S9", Type: optics.TypeScreen, GapMM: 40}}
		}
	}
	var aperture string
	for _, e := range b.Elements {
		if e.Type == optics.TypeAperture {
			aperture = e.ID
		}
	}
	b.Elements = append(b.Elements,
		optics.Element{ID: "BS8", Type: optics.TypeSplitter, GapMM: 30, TurnDeg: new(-90.0), DiameterMM: new(25.4),
			Dichroic: &optics.Dichroic{EdgeNM: 800, Reflects: optics.ReflectsShorter}},
		optics.Element{ID: "A9", Type: optics.TypeAperture, GapMM: 20, SameAs: aperture})
	more := optics.MoreSource{ID: "laser2", Source: b.Source, WavelengthsNM: []float64{532},
		Elements: []optics.Element{{ID: "D9", Type: optics.TypeDump, GapMM: 60}}}
	more.YMM += 100
	b.MoreSources = []optics.MoreSource{more}
}

// fillAll gives each of fields that obj leaves empty a plain value of its quantity, and a plate
// material its medium (the one text field a kind has).
func fillAll(obj any, fields []optics.Field) {
	for _, f := range fields {
		switch p := f.In(obj).(type) {
		case *string:
			switch {
			case f.Key == "coating":
				*p = optics.CoatingNone
			case *p == "" && len(f.Choices) > 0:
				*p = f.Choices[0]
			case *p == "" && !f.Selects && !f.Required:
				*p = "fused-silica"
			}
		case **float64:
			if *p == nil {
				*p = new(sample(f))
			}
		case *[]float64:
			if *p == nil {
				*p = []float64{sample(f)}
			}
		}
	}
}

// sample is a value of a field's quantity that the bench rules accept.
func sample(f optics.Field) float64 {
	switch f.Quantity {
	case optics.Length:
		return 1000 // long enough for a radius, short enough for any length
	case optics.Angle:
		return 10
	case optics.Wavelength:
		return 1000
	}
	return 0.25 // not a default (a splitter's reflect is 0.5 when absent)
}

// Change is a bench with one field changed alone.
type Change struct {
	Path    string        // the JSON path of the field, e.g. "elements[2].turn_deg"
	Key     string        // the field's JSON name
	In      reflect.Type  // the object type that has the field: optics.Element, optics.Beam, ...
	Removed bool          // the optional field was removed rather than given another value
	Breaks  bool          // the change breaks a same_as reference (a pass's or its part's id, type or same_as): the bench is invalid
	Bench   *optics.Bench // the changed bench; the one Changes was given is left as it was
}

// Changes returns b with each of its leaf fields changed alone: each number scaled by 1.01 (0
// becomes 0.5), the first number of each list scaled, each text extended (a grid, a medium name,
// an element type or a source kind replaced by another that exists), each count increased, and
// each optional number or object removed. Element types and source kinds change through
// optics.ChangeType and optics.ChangeSourceKind, as a builder changes them. The changes come in
// the order of the struct fields; b itself is left as it was.
func Changes(b *optics.Bench) []Change {
	c := &changer{orig: b}
	c.walk("", reflect.ValueOf(b).Elem(), func(b *optics.Bench, use func(reflect.Value)) { use(reflect.ValueOf(b).Elem()) })
	return c.out
}

// A place finds a value inside a bench and hands it, settable, to use. A map entry is handed over
// as a copy that is stored back afterwards, since map values cannot be set in place.
type place func(b *optics.Bench, use func(v reflect.Value))

func (p place) field(i int) place {
	return func(b *optics.Bench, use func(reflect.Value)) { p(b, func(v reflect.Value) { use(v.Field(i)) }) }
}

func (p place) item(i int) place {
	return func(b *optics.Bench, use func(reflect.Value)) { p(b, func(v reflect.Value) { use(v.Index(i)) }) }
}

func (p place) deref() place {
	return func(b *optics.Bench, use func(reflect.Value)) { p(b, func(v reflect.Value) { use(v.Elem()) }) }
}

func (p place) entry(key string) place {
	return func(b *optics.Bench, use func(reflect.Value)) {
		p(b, func(m reflect.Value) {
			k := reflect.ValueOf(key)
			e := reflect.New(m.Type().Elem()).Elem()
			e.Set(m.MapIndex(k))
			use(e)
			m.SetMapIndex(k, e)
		})
	}
}

type changer struct {
	orig   *optics.Bench
	in     reflect.Type // the object being walked
	linked bool         // the element being walked is a same_as pass or a part one names
	out    []Change
}

// walk visits the fields of the struct v at path, which at finds in a copy of the bench.
func (c *changer) walk(path string, v reflect.Value, at place) {
	outer, outerLinked := c.in, c.linked
	c.in = v.Type()
	if e, ok := v.Addr().Interface().(*optics.Element); ok {
		c.linked = e.SameAs != "" || named(c.orig)[e.ID]
	}
	defer func() { c.in, c.linked = outer, outerLinked }()
	fields := optics.FieldsOf(v.Addr().Interface())
	for i := range v.NumField() {
		if sf := v.Type().Field(i); sf.Anonymous { // a further source's inline source fields
			c.walk(path, v.Field(i), at.field(i))
			continue
		}
		key := jsonKey(v.Type().Field(i))
		f, _ := optics.FieldByKey(fields, key)
		if f.Selects {
			c.selector(join(path, key), f, v.Field(i).String(), at)
			continue
		}
		c.leaf(join(path, key), f, v.Field(i), at.field(i))
	}
}

// selector picks another kind for the object at at, an element or the source, the way a builder
// does: what the kinds share is kept, the rest comes from the new kind's defaults.
func (c *changer) selector(path string, f optics.Field, kind string, at place) {
	c.change(path, f, false, func(b *optics.Bench) {
		at(b, func(obj reflect.Value) {
			switch o := obj.Addr().Interface().(type) {
			case *optics.Element:
				*o = optics.ChangeType(*o, other(optics.KindTypes(), kind))
			case *optics.Source:
				*o = optics.ChangeSourceKind(*o, other(optics.SourceKindNames(), kind))
			}
		})
	})
}

// leaf changes one field, or walks into it when it is an object.
func (c *changer) leaf(path string, f optics.Field, v reflect.Value, at place) {
	switch x := v.Interface().(type) {
	case float64:
		c.set(path, f, at, scaled(x))
	case *float64:
		if x != nil {
			c.set(path, f, at, new(scaled(*x)))
			c.remove(path, f, at)
		}
	case []float64:
		if len(x) > 0 {
			c.set(path, f, at, append([]float64{scaled(x[0])}, x[1:]...))
		}
	case []*float64:
		if i := slices.IndexFunc(x, func(r *float64) bool { return r != nil }); i >= 0 {
			y := slices.Clone(x)
			y[i] = new(scaled(*x[i]))
			c.set(path, f, at, y)
		}
	case []string:
		if len(x) > 0 {
			c.set(path, f, at, append([]string{other([]string{"water", "fused-silica"}, x[0])}, x[1:]...))
		}
	case *int:
		if x != nil {
			c.set(path, f, at, new(*x+1))
			c.remove(path, f, at)
		}
	case string:
		c.text(path, f, at, x)
	case map[string]optics.MaterialSpec:
		for _, name := range slices.Sorted(maps.Keys(x)) {
			spec := x[name]
			c.walk(join(path, name), reflect.ValueOf(&spec).Elem(), at.entry(name))
		}
	default:
		c.object(path, f, v, at)
	}
}

// object walks into a nested object: a struct, an optional one (which is also removed), or each
// item of a list of them.
func (c *changer) object(path string, f optics.Field, v reflect.Value, at place) {
	switch v.Kind() {
	case reflect.Struct:
		c.walk(path, v, at)
	case reflect.Pointer:
		if !v.IsNil() {
			c.walk(path, v.Elem(), at.deref())
			c.remove(path, f, at)
		}
	case reflect.Slice:
		for i := range v.Len() {
			c.walk(fmt.Sprintf("%s[%d]", path, i), v.Index(i), at.item(i))
		}
	}
}

// text changes a string field: a grid or a dichroic's side becomes another, a plate material
// another medium, any other text gets a letter more. Text that is not given stays so.
func (c *changer) text(path string, f optics.Field, at place, x string) {
	switch {
	case x == "" && !f.Required:
	case f.Key == "grid":
		c.set(path, f, at, other([]string{optics.GridMetric25, optics.GridImperial1, optics.GridNone}, x))
	case f.Key == "reflects":
		c.set(path, f, at, other([]string{optics.ReflectsShorter, optics.ReflectsLonger}, x))
	case len(f.Choices) > 0:
		c.set(path, f, at, other(f.Choices, x))
	case f.Key == "material":
		c.set(path, f, at, other([]string{"water", "fused-silica"}, x))
	case f.Key == "coating":
		c.set(path, f, at, other([]string{optics.CoatingAR, optics.CoatingNone}, x))
	default:
		c.set(path, f, at, x+"x")
	}
}

// named is the set of ids that same_as passes of b name.
func named(b *optics.Bench) map[string]bool {
	out := map[string]bool{}
	var visit func(els []optics.Element)
	visit = func(els []optics.Element) {
		for _, e := range els {
			if e.SameAs != "" {
				out[e.SameAs] = true
			}
			visit(e.Reflected)
		}
	}
	visit(b.Elements)
	for _, m := range b.MoreSources {
		visit(m.Elements)
	}
	return out
}

// set adds the change that gives the field at at the value x.
func (c *changer) set(path string, f optics.Field, at place, x any) {
	c.change(path, f, false, func(b *optics.Bench) { at(b, func(v reflect.Value) { v.Set(reflect.ValueOf(x)) }) })
}

// remove adds the change that removes an optional field.
func (c *changer) remove(path string, f optics.Field, at place) {
	if !f.Required {
		c.change(path, f, true, func(b *optics.Bench) { at(b, func(v reflect.Value) { v.Set(reflect.Zero(v.Type())) }) })
	}
}

// change adds edit applied to a copy of the original bench.
func (c *changer) change(path string, f optics.Field, removed bool, edit func(b *optics.Bench)) {
	b := deepCopy(c.orig)
	edit(b)
	breaks := c.linked && (f.Key == "id" || f.Key == "type" || f.Key == "same_as")
	c.out = append(c.out, Change{Path: path, Key: f.Key, In: c.in, Removed: removed, Breaks: breaks, Bench: b})
}

// other is the first of names that is not name.
func other(names []string, name string) string {
	for _, n := range names {
		if n != name {
			return n
		}
	}
	panic("benchtest: no other name than " + name)
}

// scaled is a number changed a little: by 1 %, or to 0.5 from 0.
func scaled(x float64) float64 {
	if x == 0 {
		return 0.5
	}
	return x * 1.01
}

func jsonKey(sf reflect.StructField) string {
	key, _, _ := strings.Cut(sf.Tag.Get("json"), ",")
	return key
}

// join extends a JSON path by a key.
func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

// deepCopy copies a bench through encoding/json, which keeps every field (nil and empty lists
// apart as the bench file has them).
func deepCopy(b *optics.Bench) *optics.Bench {
	data, err := json.Marshal(b)
	if err != nil {
		panic(err)
	}
	var out optics.Bench
	if err := json.Unmarshal(data, &out); err != nil {
		panic(err)
	}
	return &out
}
