package optics

import (
	"encoding/json"
	"reflect"
	"slices"
	"strings"
)

// MaxBenchBytes is the largest bench file Decode reads (1 MiB).
const MaxBenchBytes = 1 << 20

// Decode reads a bench file (format raytable/bench/v1) strictly and validates it.
//
// Every problem is collected and returned at once as an *Error with code EInvalid whose Problems
// name the JSON path and the rule: unknown keys (including a key of another element type or
// source kind), keys given twice, values of the wrong JSON type, missing required fields, and
// everything Validate checks. null is accepted only as a lens face or mirror radius, where it
// means flat. Which keys each object has, and which of them it requires, is the field tables'
// (fields.go, kinds.go, source_kinds.go): in short, optional are title, notes, materials,
// table.hole_offset_mm, and in source field_angles_deg, object_heights_mm, fan_rays, rays, beam
// (and its waist_at_mm and m2), a ray's x_mm and x_angle_deg, and in elements diameter_mm, a
// mirror's radius_mm, a screen's width_mm and mount.
// Input above MaxBenchBytes gives an *Error with code ETooLarge.
func Decode(data []byte) (*Bench, error) {
	decodes.Add(1)
	if len(data) > MaxBenchBytes {
		return nil, Errorf(ETooLarge, "the bench file is %d bytes; at most %d bytes (1 MiB) are accepted", len(data), MaxBenchBytes)
	}
	if !json.Valid(data) {
		var probe any // Unmarshal checks the syntax first and says where it fails
		return nil, Invalid([]Problem{syntaxProblem(data, json.Unmarshal(data, &probe))})
	}
	r := &reader{}
	b := r.bench(data)
	if b == nil {
		return nil, Invalid(r.problems)
	}
	problems := r.problems
	problems = append(problems, unlessCovered(validationProblems(b), r.problems)...)
	if len(problems) > 0 {
		return nil, Invalid(problems)
	}
	return b, nil
}

// unlessCovered drops the validation problems at or below a path where decoding already failed:
// a value that could not be read was left zero, and Validate would only repeat the complaint.
func unlessCovered(problems, decoded []Problem) []Problem {
	var out []Problem
	for _, p := range problems {
		covered := false
		for _, d := range decoded {
			if d.Path == "" || p.Path == d.Path || strings.HasPrefix(p.Path, d.Path+".") || strings.HasPrefix(p.Path, d.Path+"[") {
				covered = true
				break
			}
		}
		if !covered {
			out = append(out, p)
		}
	}
	return out
}

// unknown reports the members whose keys are not in allowed; why completes "unknown field".
func (r *reader) unknown(path string, members []member, why string, allowed ...[]string) {
	for _, m := range members {
		known := false
		for _, set := range allowed {
			if slices.Contains(set, m.key) {
				known = true
				break
			}
		}
		if !known {
			var all []string
			for _, set := range allowed {
				all = append(all, set...)
			}
			r.add(field(path, m.key), "unknown field%s (allowed: %s)", why, strings.Join(all, ", "))
		}
	}
}

func (r *reader) bench(data []byte) *Bench {
	members, ok := r.object("", data)
	if !ok {
		r.problems[len(r.problems)-1].Message = "a bench file must be a JSON object"
		return nil
	}
	r.unknown("", members, "", keys(BenchFields))
	r.require("", members, requiredKeys(BenchFields)...)
	b := &Bench{Elements: []Element{}}
	r.into("", members, BenchFields, reflect.ValueOf(b).Elem(), "")
	return b
}

// source reads the source; its kind decides which keys it may have.
func (r *reader) source(path string, raw json.RawMessage) Source {
	var s Source
	r.kinded(path, raw, SourceFields, allSourceFields, reflect.ValueOf(&s).Elem(), sourceKindFieldsOf)
	return s
}

// moreSource reads a further source: its own keys and, inline beside them, a source's, whose kind
// decides which it may have.
func (r *reader) moreSource(path string, raw json.RawMessage) MoreSource {
	var m MoreSource
	r.kinded(path, raw, union(moreSourceOwnFields, SourceFields), MoreSourceFields, reflect.ValueOf(&m).Elem(), sourceKindFieldsOf)
	return m
}

// sourceKindFieldsOf gives a source kind's own fields and how messages name it, for kinded.
func sourceKindFieldsOf(kind string) ([]Field, string, bool) {
	k, ok := SourceKindOf(kind)
	if !ok {
		return nil, "", false
	}
	return k.Fields, " for a " + k.Noun, true
}

// element reads one element; its type decides which keys it may have.
func (r *reader) element(path string, raw json.RawMessage) Element {
	var e Element
	r.kinded(path, raw, ElementFields, allElementFields, reflect.ValueOf(&e).Elem(), func(typ string) ([]Field, string, bool) {
		k, ok := KindOf(typ)
		if !ok {
			return nil, "", false
		}
		return k.Fields, " for type " + typ, true
	})
	return e
}

// kinded reads an object whose selector (a source's kind, an element's type) decides which keys it
// may have: the common ones and its kind's own, which own gives with how messages name the kind.
// A kind that is not known is Validate's to report; keys are then judged against every kind's.
func (r *reader) kinded(path string, raw json.RawMessage, common, all []Field, dst reflect.Value, own func(kind string) ([]Field, string, bool)) {
	members, ok := r.object(path, raw)
	if !ok {
		return
	}
	r.require(path, members, requiredKeys(common)...)
	sel := common[slices.IndexFunc(common, func(f Field) bool { return f.Selects })]
	// The kind decides which keys are allowed; read it first.
	if kindRaw, ok := lookup(members, sel.Key); ok {
		kind, _ := r.str(field(path, sel.Key), kindRaw)
		sel.value(dst).SetString(kind)
	}
	if fields, why, known := own(sel.value(dst).String()); known {
		r.unknown(path, members, why, keys(common), keys(fields))
	} else {
		r.unknown(path, members, "", keys(all))
	}
	r.into(path, members, all, dst, sel.Key)
}

func (r *reader) materials(path string, raw json.RawMessage) map[string]MaterialSpec {
	members, ok := r.object(path, raw)
	if !ok || len(members) == 0 {
		return nil
	}
	out := make(map[string]MaterialSpec, len(members))
	for _, m := range members {
		var spec MaterialSpec
		r.plain(materialPath(m.key), m.raw, MaterialFields, reflect.ValueOf(&spec).Elem())
		out[m.key] = spec
	}
	return out
}

// materialPath is the JSON path of a user material: materials.NAME when the name is a plain word,
// materials["NAME"] (JSON-quoted) otherwise, so that dots or spaces in a name stay unambiguous.
func materialPath(name string) string {
	if name != "" && plainName(name) && !strings.Contains(name, ".") {
		return "materials." + name
	}
	q, _ := json.Marshal(name)
	return "materials[" + string(q) + "]"
}
