package server

import (
	"encoding/json"
	"fmt"
	"net/url"
	"slices"
	"strconv"
	"strings"

	"raytable/optics"
	"raytable/web/view"
)

// benchValues writes a bench into form values, keyed by JSON path, the way formReader reads them.
func benchValues(b *optics.Bench) map[string]string {
	v := map[string]string{
		"title":          b.Title,
		"notes":          b.Notes,
		"wavelengths_nm": numList(b.WavelengthsNM),
	}
	putFields(v, "table.", optics.TableFields, &b.Table)
	putFields(v, "source.", optics.SourceFields, &b.Source)
	putFields(v, "source.", optics.SourceKindOrFirst(b.Source.Kind).Fields, &b.Source)
	if len(b.Materials) > 0 {
		if data, err := json.MarshalIndent(b.Materials, "", "  "); err == nil {
			v["materials"] = string(data)
		}
	}
	putElements(v, "elements", b.Elements)
	for k := range b.MoreSources {
		putMoreSource(v, k, &b.MoreSources[k])
	}
	return v
}

// putFields writes the fields of obj, a pointer to the struct they belong to, as form texts under
// prefix, each by the Go type of its value; a nested object's fields go under its own key. A
// selector (an element's type, a source's kind) is written twice: the second copy, a hidden
// input, tells the reader which kind the form showed.
func putFields(v map[string]string, prefix string, fields []optics.Field, obj any) {
	for _, fl := range fields {
		path := prefix + fl.Key
		switch x := fl.In(obj).(type) {
		case *string:
			v[path] = *x
			if fl.Selects {
				v[shownName(prefix, fl)] = *x
			}
		case *float64:
			v[path] = optics.FormatNumber(*x)
		case **float64:
			v[path] = optTextOr(*x, flatWord(fl))
		case *[]float64:
			v[path] = numList(*x)
		case *[]*float64:
			v[path] = facesText(*x)
		case *[]string:
			v[path] = namesText(*x)
		case **int:
			if *x != nil {
				v[path] = strconv.Itoa(**x)
			}
		case **optics.Beam:
			if *x != nil {
				putFields(v, path+".", fl.Fields, *x)
			}
		case **optics.Mount:
			if *x != nil {
				putFields(v, path+".", fl.Fields, *x)
			}
		case *[]optics.ExplicitRay:
			for i := range *x {
				putFields(v, fmt.Sprintf("%s[%d].", path, i), fl.Fields, &(*x)[i])
			}
		case **optics.Dichroic:
			if *x != nil {
				v[path] = jsonText(*x)
			}
		case **optics.Pulse:
			if *x != nil {
				v[path] = jsonText(*x)
			}
		case *[]optics.Element:
			putElements(v, path, *x)
		}
	}
}

// shownName is the hidden input that repeats a selector as the form showed it: source._kind_shown.
func shownName(prefix string, fl optics.Field) string { return prefix + "_" + fl.Key + "_shown" }

// flatWord is what an empty optional number reads as on the form: "flat" for a radius, else nothing.
func flatWord(fl optics.Field) string {
	if fl.Flat {
		return "flat"
	}
	return ""
}

func numList(xs []float64) string {
	parts := make([]string, len(xs))
	for i, x := range xs {
		parts[i] = optics.FormatNumber(x)
	}
	return strings.Join(parts, ", ")
}

func optTextOr(x *float64, none string) string {
	if x == nil {
		return none
	}
	return optics.FormatNumber(*x)
}

func facesText(faces []*float64) string {
	parts := make([]string, len(faces))
	for i, f := range faces {
		parts[i] = optTextOr(f, "flat")
	}
	return strings.Join(parts, ", ")
}

// overlay replaces values with what the user posted, so a re-rendered form keeps their text.
func overlay(values map[string]string, posted url.Values) {
	for k, vs := range posted {
		if len(vs) > 0 && !strings.HasPrefix(k, "_") && k != "action" {
			values[k] = vs[0]
		}
	}
}

// formBuilder lays out the form for a bench's shape and attaches problems to fields by path.
type formBuilder struct {
	values   map[string]string
	problems map[string][]string // field name -> messages
	rest     []optics.Problem    // problems not yet attached to a field
	parts    []string            // what a same_as may name
}

// buildForm makes the edit form for bench b (its element types and source kind decide which
// fields appear), filled from values and marked with problems.
func buildForm(id string, b *optics.Bench, values map[string]string, problems []optics.Problem) view.BenchForm {
	fb := &formBuilder{values: values, problems: map[string][]string{}, parts: optics.Parts(b)}
	names := fieldNames(b)
	for _, p := range problems {
		if name, ok := fieldFor(p.Path, names); ok {
			fb.problems[name] = append(fb.problems[name], itemMessage(p.Path, name, p.Message))
		} else {
			fb.rest = append(fb.rest, p)
		}
	}
	f := view.BenchForm{
		Action:     "/r/" + id + "/edit",
		PreviewURL: "/r/" + id + "/preview",
		Invalid:    len(problems) > 0,
		AddTypes:   typeOptions(),
	}
	f.General = fb.group("Design", "general", "", generalFields())
	f.Table = fb.group("Table", "table", "table", tableFields())
	f.Source = fb.group("Source", "source", "source", sourceFields(b.Source.Kind))
	f.Beam = fb.group("Laser beam (leave empty for none)", "beam", "source.beam", beamFields())
	f.Materials = fb.group("Your own materials", "materials", "materials", specs("", materialsLayout))
	for i := range b.Source.Rays {
		f.Rays = append(f.Rays, view.RayForm{Index: i, Fields: fb.fields(rayFields(i))})
	}
	f.RayErrors = fb.take("source.rays")
	f.AddAt = append(f.AddAt, view.Option{Value: "0", Label: "at the start"})
	f.Elements = fb.elementForms("elements", b.Elements)
	for i, e := range b.Elements {
		f.AddAt = append(f.AddAt, view.Option{Value: strconv.Itoa(i + 1), Label: "after " + nonEmpty(e.ID, fmt.Sprintf("element %d", i+1))})
	}
	for k := range b.MoreSources {
		f.MoreSources = append(f.MoreSources, fb.moreSourceForm(k, &b.MoreSources[k]))
	}
	f.Source.Errors = append(f.Source.Errors, fb.take("source")...)
	for _, p := range fb.rest {
		f.Errors = append(f.Errors, p.String())
	}
	return f
}

func nonEmpty(s, def string) string {
	if s == "" {
		return def
	}
	return s
}

func elementTitle(i int, e optics.Element) string {
	return fmt.Sprintf("%d. %s (%s)", i+1, nonEmpty(e.ID, "no id"), e.Type)
}

// itemMessage prefixes a message about one item of a list field with the item's number.
func itemMessage(path, name, msg string) string {
	rest := strings.TrimPrefix(path, name)
	if rest == "" {
		return msg
	}
	if strings.HasPrefix(rest, "[") {
		if end := strings.Index(rest, "]"); end > 0 {
			if n, err := strconv.Atoi(rest[1:end]); err == nil {
				return fmt.Sprintf("item %d: %s", n+1, msg)
			}
		}
	}
	return strings.TrimPrefix(rest, ".") + ": " + msg
}

// fieldFor finds the input a problem path belongs to: the path itself or its nearest parent that
// is a field (elements[2].faces_mm[0] -> elements[2].faces_mm).
func fieldFor(path string, names map[string]bool) (string, bool) {
	for p := path; p != ""; p = parentPath(p) {
		if names[p] {
			return p, true
		}
	}
	return "", false
}

// parentPath drops the last segment of a JSON path: a.b[2] -> a.b, a.b -> a, a -> "".
func parentPath(p string) string {
	i := strings.LastIndexAny(p, ".[")
	if i < 0 {
		return ""
	}
	return p[:i]
}

// take removes and returns the unattached problems at or below prefix.
func (fb *formBuilder) take(prefix string) []string {
	var out []string
	kept := fb.rest[:0]
	for _, p := range fb.rest {
		if p.Path == prefix || strings.HasPrefix(p.Path, prefix+".") || strings.HasPrefix(p.Path, prefix+"[") {
			msg := strings.TrimPrefix(strings.TrimPrefix(p.Path, prefix), ".")
			if msg != "" {
				msg += ": "
			}
			out = append(out, msg+p.Message)
			continue
		}
		kept = append(kept, p)
	}
	fb.rest = kept
	return out
}

// spec describes one field: name (JSON path), label, unit and kind.
type spec struct{ name, label, unit, kind string }

func (fb *formBuilder) group(title, testID, prefix string, specs []spec) view.Group {
	g := view.Group{Title: title, TestID: testID, Fields: fb.fields(specs)}
	if prefix != "" && prefix != "source" {
		g.Errors = fb.take(prefix)
	}
	return g
}

func (fb *formBuilder) fields(specs []spec) []view.Field {
	out := make([]view.Field, 0, len(specs))
	for _, s := range specs {
		f := view.Field{Name: s.name, Label: s.label, Unit: s.unit, Kind: s.kind, Value: fb.values[s.name]}
		f.Error = strings.Join(fb.problems[s.name], "; ")
		switch {
		case strings.HasSuffix(s.name, ".type"):
			f.Kind, f.Options, f.Apply = "select", typeOptions(), true
		case strings.HasSuffix(s.name, ".same_as"):
			f.Kind, f.Options = "select", sameAsOptions(fb.parts, f.Value)
		case s.name == "source.kind" || strings.HasPrefix(s.name, "more_sources[") && strings.HasSuffix(s.name, "].kind"):
			f.Kind, f.Options, f.Apply = "select", sourceKindOptions(), true
		case s.name == "table.grid":
			f.Kind = "select"
			f.Options = []view.Option{{Value: optics.GridMetric25, Label: "metric, 25 mm holes"}, {Value: optics.GridImperial1, Label: "imperial, 1 in holes"}, {Value: optics.GridNone, Label: "no grid"}}
		}
		out = append(out, f)
	}
	return out
}

// typeOptions is the list of element types, as the add menu and each type input offer them.
func typeOptions() []view.Option {
	out := make([]view.Option, len(optics.Kinds))
	for i, k := range optics.Kinds {
		out[i] = view.Option{Value: k.Type, Label: k.Label}
	}
	return out
}

func sourceKindOptions() []view.Option {
	out := make([]view.Option, len(optics.SourceKinds))
	for i, k := range optics.SourceKinds {
		out[i] = view.Option{Value: k.Kind, Label: k.Label}
	}
	return out
}

// The groups whose inputs the page lays out in an order of its own; the others follow their table.
var (
	generalLayout   = pick(optics.BenchFields, "title", "wavelengths_nm", "notes")
	materialsLayout = pick(optics.BenchFields, "materials")
	sourceHead      = pick(optics.SourceFields, "kind", "x_mm", "y_mm", "heading_deg") // then the kind's own
	sourceTail      = pick(optics.SourceFields, "fan_rays", "height_mm", "power_mw", "pulse")
)

// pick returns the table entries of keys, in that order. A key without an entry is a programmer's
// slip, caught as the package starts.
func pick(fields []optics.Field, keys ...string) []optics.Field {
	out := make([]optics.Field, len(keys))
	for i, k := range keys {
		f, ok := optics.FieldByKey(fields, k)
		if !ok {
			panic("server: no field " + k + " in the table")
		}
		out[i] = f
	}
	return out
}

// specs lays out fields as inputs named by their JSON paths under prefix, label and unit from the
// table, a selector followed by its hidden copy. A nested object's fields are laid out by the
// caller, unless the object is edited as one text (materials, as JSON).
func specs(prefix string, fields []optics.Field) []spec {
	var out []spec
	for _, fl := range fields {
		if fl.Fields != nil && !fl.Multiline {
			continue
		}
		s := spec{name: prefix + fl.Key, label: fl.Label}
		if fl.Quantity != nil {
			s.unit = fl.Quantity.Unit
		}
		if fl.Multiline {
			s.kind = "textarea"
		}
		out = append(out, s)
		if fl.Selects {
			out = append(out, spec{name: shownName(prefix, fl), kind: "hidden"})
		}
	}
	return out
}

func generalFields() []spec { return specs("", generalLayout) }

func tableFields() []spec { return specs("table.", optics.TableFields) }

// sourceFields lays out the source: its kind first, then where it stands, its kind's own fields
// (the first kind's for a kind that is not known) and the fan size. Rays and beam are groups of
// their own.
func sourceFields(kind string) []spec { return sourceFieldsAt("source.", kind) }

func sourceFieldsAt(prefix, kind string) []spec {
	return slices.Concat(specs(prefix, sourceHead), specs(prefix, optics.SourceKindOrFirst(kind).Fields), specs(prefix, sourceTail))
}

func beamFields() []spec { return specs("source.beam.", optics.BeamFields) }

func rayFields(i int) []spec { return specs(fmt.Sprintf("source.rays[%d].", i), optics.RayFields) }

// elementFields lays out the element under prefix p (elements[2].) of a type: its common fields,
// the type's own, then the mount's.
func elementFields(p string, typ string) []spec {
	s := specs(p, optics.ElementFields)
	if k, ok := optics.KindOf(typ); ok {
		s = append(s, specs(p, k.Fields)...)
	}
	for _, fl := range optics.ElementFields {
		if fl.Fields != nil {
			s = append(s, specs(p+fl.Key+".", fl.Fields)...)
		}
	}
	return s
}

// fieldNames lists every input name the form for b has.
func fieldNames(b *optics.Bench) map[string]bool {
	names := map[string]bool{}
	add := func(specs []spec) {
		for _, s := range specs {
			names[s.name] = true
		}
	}
	add(generalFields())
	add(specs("", materialsLayout))
	add(tableFields())
	add(sourceFields(b.Source.Kind))
	add(beamFields())
	for i := range b.Source.Rays {
		add(rayFields(i))
	}
	addElementNames(names, "elements", b.Elements)
	for k := range b.MoreSources {
		add(moreSourceFields(k, &b.MoreSources[k]))
		addElementNames(names, moreSourcePrefix(k)+"elements", b.MoreSources[k].Elements)
	}
	return names
}
