package server

import (
	"fmt"
	"net/url"
	"strconv"
	"strings"

	"raytable/optics"
)

// The loops over a form's lists (elements, rays, further sources) read every item that was
// posted and stop at the first index not sent, so the body cap bounds them; the bench rules then
// judge the counts and say so. No list is cut short: a form that lost items would save a bench
// with fewer than it showed.

// formReader turns posted form values, named by their JSON paths, into a bench. It collects a
// problem for every field it cannot read and keeps going, so that all of them are shown at once.
type formReader struct {
	vals     url.Values
	problems []optics.Problem
	depth    int // of the nested element list being read
}

func (f *formReader) add(path, format string, args ...any) {
	f.problems = append(f.problems, optics.Problem{Path: path, Message: fmt.Sprintf(format, args...)})
}

func (f *formReader) has(path string) bool { _, ok := f.vals[path]; return ok }

// get returns a field's text. A field sent more than once is a problem rather than a silent pick
// of one copy: a browser never does that, so the form is not the one the page drew.
func (f *formReader) get(path string) string {
	vs := f.vals[path]
	if len(vs) > 1 && !f.problemAt(path) {
		f.add(path, "was sent %d times; send each field once (reload the page and try again)", len(vs))
	}
	if len(vs) == 0 {
		return ""
	}
	return vs[0]
}

func (f *formReader) text(path string) string { return strings.TrimSpace(f.get(path)) }

// num reads a required number.
func (f *formReader) num(path string, q *optics.Quantity) float64 {
	s := f.text(path)
	if s == "" {
		f.add(path, "is required; %s", q.Hint)
		return 0
	}
	v, err := q.Parse(s)
	if err != nil {
		f.add(path, "%s", err)
	}
	return v
}

// optNum reads an optional number; an empty field is nil.
func (f *formReader) optNum(path string, q *optics.Quantity) *float64 {
	s := f.text(path)
	if s == "" {
		return nil
	}
	v, err := q.Parse(s)
	if err != nil {
		f.add(path, "%s", err)
		return nil
	}
	return &v
}

// splitList splits a comma list. An all-blank field is an empty list.
func splitList(s string) []string {
	if strings.TrimSpace(s) == "" {
		return nil
	}
	parts := strings.Split(s, ",")
	for i := range parts {
		parts[i] = strings.TrimSpace(parts[i])
	}
	return parts
}

// list reads a comma list of numbers; the problem of item i is at path[i].
func (f *formReader) list(path string, q *optics.Quantity) []float64 {
	items := splitList(f.get(path))
	if items == nil {
		return nil
	}
	out := make([]float64, len(items))
	for i, s := range items {
		v, err := q.Parse(s)
		if err != nil {
			f.add(fmt.Sprintf("%s[%d]", path, i), "%s", err)
		}
		out[i] = v
	}
	return out
}

// faces reads lens face radii: a length, or "flat" or nothing for a flat face.
func (f *formReader) faces(path string) []*float64 {
	raw := f.get(path)
	if strings.TrimSpace(raw) == "" {
		return nil
	}
	items := strings.Split(raw, ",")
	out := make([]*float64, len(items))
	for i, s := range items {
		s = strings.TrimSpace(s)
		if s == "" || strings.EqualFold(s, "flat") {
			continue
		}
		v, err := optics.Length.Parse(s)
		if err != nil {
			f.add(fmt.Sprintf("%s[%d]", path, i), "%s, or flat", err)
			continue
		}
		out[i] = &v
	}
	return out
}

// radius reads a mirror radius: a number, or "flat" or nothing.
func (f *formReader) radius(path string, q *optics.Quantity) *float64 {
	s := f.text(path)
	if s == "" || strings.EqualFold(s, "flat") {
		return nil
	}
	return f.optNum(path, q)
}

// count reads an optional whole number.
func (f *formReader) count(path string) *int {
	s := f.text(path)
	if s == "" {
		return nil
	}
	n, err := strconv.Atoi(s)
	if err != nil {
		f.add(path, "%q is not a whole number; use a count such as 21", s)
		return nil
	}
	return &n
}

// parseBenchForm reads the edit form. It returns the bench and every problem found reading the
// fields; the bench rules (optics.Validate) are checked afterwards.
func parseBenchForm(vals url.Values) (*optics.Bench, []optics.Problem) {
	f := &formReader{vals: vals}
	b := &optics.Bench{
		Format:        optics.FormatBenchV1,
		Title:         f.text("title"),
		Notes:         strings.TrimSpace(strings.ReplaceAll(f.get("notes"), "\r\n", "\n")),
		WavelengthsNM: f.list("wavelengths_nm", optics.Wavelength),
	}
	f.fields("table.", optics.TableFields, &b.Table)
	b.Source = f.source()
	b.Materials = f.materials()
	b.Elements = f.elements("elements")
	b.MoreSources = f.moreSources()
	return b, f.problems
}

// source reads the first source.
func (f *formReader) source() optics.Source { return f.sourceAt("source.") }

// sourceAt reads the source fields under prefix: where it stands and its fan size, its kind's own
// fields, then its rays and beam (in this order, which is the order of the problems).
func (f *formReader) sourceAt(prefix string) optics.Source {
	var s optics.Source
	var objects []optics.Field
	for _, fl := range optics.SourceFields {
		if fl.Fields != nil {
			objects = append(objects, fl)
		} else {
			f.field(prefix+fl.Key, fl, &s)
		}
	}
	shown := f.text(prefix + "_kind_shown")
	if shown != "" && shown != s.Kind {
		// The kind was changed and applied: its own fields were not on the form yet.
		s = optics.ChangeSourceKind(s, s.Kind)
	} else if k, ok := optics.SourceKindOf(s.Kind); ok {
		f.fields(prefix, k.Fields, &s)
	}
	f.fields(prefix, objects, &s)
	return s
}

// fields reads the inputs of fields under prefix into obj, a pointer to the struct they belong to.
func (f *formReader) fields(prefix string, fields []optics.Field, obj any) {
	for _, fl := range fields {
		f.field(prefix+fl.Key, fl, obj)
	}
}

// field reads one input into obj by the Go type of its value: a required number must be given, an
// optional one may be empty (a number without a default then reads as 0), a radius may be flat.
// An optional object (a beam, a mount) is there when any of its inputs is filled; a list of them
// has an item for each index whose first input was sent.
func (f *formReader) field(path string, fl optics.Field, obj any) {
	switch p := fl.In(obj).(type) {
	case *string:
		*p = f.text(path)
	case *float64:
		if fl.Required {
			*p = f.num(path, fl.Quantity)
		} else {
			*p = f.zeroNum(path, fl.Quantity)
		}
	case **float64:
		if fl.Flat {
			*p = f.radius(path, fl.Quantity)
		} else {
			*p = f.optNum(path, fl.Quantity)
		}
		if *p == nil && fl.Hint != "" && !f.problemAt(path) {
			f.add(path, "is required; %s", fl.Hint)
		}
	case *[]float64:
		*p = f.list(path, fl.Quantity)
	case *[]*float64:
		*p = f.faces(path)
	case *[]string:
		*p = f.names(path)
	case **int:
		*p = f.count(path)
	case **optics.Beam:
		*p = optionalObject[optics.Beam](f, path+".", fl.Fields)
	case **optics.Mount:
		*p = optionalObject[optics.Mount](f, path+".", fl.Fields)
	case *[]optics.ExplicitRay:
		for i := 0; f.has(fmt.Sprintf("%s[%d].%s", path, i, fl.Fields[0].Key)); i++ {
			var r optics.ExplicitRay
			f.fields(fmt.Sprintf("%s[%d].", path, i), fl.Fields, &r)
			*p = append(*p, r)
		}
	case **optics.Dichroic:
		*p = f.dichroic(path)
	case **optics.Pulse:
		*p = jsonObject[optics.Pulse](f, path, "a pulse", `{"energy_uj": 10, "duration_ns": 5, "rate_hz": 1000}`)
	case *[]optics.Element:
		if f.depth >= maxFormDepth {
			f.add(path, "nests more than %d lists", maxFormDepth)
			return
		}
		f.depth++
		*p = f.elements(path)
		f.depth--
	}
}

// optionalObject reads an object that is there when any of its inputs is filled.
func optionalObject[T any](f *formReader, prefix string, fields []optics.Field) *T {
	given := false
	for _, fl := range fields {
		given = given || f.text(prefix+fl.Key) != ""
	}
	if !given {
		return nil
	}
	obj := new(T)
	f.fields(prefix, fields, obj)
	return obj
}

// zeroNum reads a number whose empty field means 0.
func (f *formReader) zeroNum(path string, q *optics.Quantity) float64 {
	if f.text(path) == "" {
		return 0
	}
	return f.num(path, q)
}

// materials reads the user media, written as the JSON object of the bench file, with the bench
// file's own reader: the same keys and types are allowed and problems name the same paths.
func (f *formReader) materials() map[string]optics.MaterialSpec {
	s := f.text("materials")
	if s == "" || s == "{}" {
		return nil
	}
	m, problems, err := optics.DecodeMaterials([]byte(s))
	if err != nil {
		f.add("materials", "is not a materials object: %v; write it as in the bench file, e.g. {\"oil\": {\"index\": 1.515}}", err)
		return nil
	}
	f.problems = append(f.problems, problems...)
	return m
}

// element reads the element whose inputs stand under prefix p (elements[2].): its common fields, then its type's own. When the type was changed and
// applied, the new type's fields were not on the form yet: the element becomes one of the new type
// (optics.ChangeType), keeping what the two types share.
func (f *formReader) element(p string) optics.Element {
	typ := f.text(p + "type")
	e := optics.Element{Type: typ, ID: f.text(p + "id")}
	shown := f.text(p + "_type_shown")
	changed := shown != "" && shown != typ
	if changed {
		old := optics.Element{Type: shown}
		f.fields(p, optics.CarriedFields(shown, typ), &old)
		e = optics.ChangeType(old, typ)
	}
	f.fields(p, optics.ElementFields, &e) // id and type again, the same texts
	if e.SameAs != "" {
		e.Mount = nil // a pass has the part's
		f.pass(p, &e)
		return e
	}
	if k, ok := optics.KindOf(typ); ok && !changed {
		f.fields(p, k.Fields, &e)
	}
	return e
}

func (f *formReader) problemAt(path string) bool {
	for _, p := range f.problems {
		if p.Path == path {
			return true
		}
	}
	return false
}
