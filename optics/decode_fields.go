package optics

import (
	"encoding/json"
	"reflect"
)

// This file reads an object's members into its struct field by field, each by the Go type of the
// struct field its key names (see Field): the one place where a key's JSON value becomes a Go value.

// plain reads an object without kinds: its keys are those of its table, all of them allowed and the
// required ones required. It reports whether raw was an object at all.
func (r *reader) plain(path string, raw json.RawMessage, fields []Field, dst reflect.Value) bool {
	members, ok := r.object(path, raw)
	if !ok {
		return false
	}
	r.unknown(path, members, "", keys(fields))
	r.require(path, members, requiredKeys(fields)...)
	r.into(path, members, fields, dst, "")
	return true
}

// into reads the members whose keys are in fields into the struct dst, skipping the key skip (a
// kind, read before the rest). Members with other keys have been reported as unknown.
func (r *reader) into(path string, members []member, fields []Field, dst reflect.Value, skip string) {
	for _, m := range members {
		if f, ok := FieldByKey(fields, m.key); ok && m.key != skip {
			r.value(field(path, m.key), m.raw, f, f.value(dst))
		}
	}
}

// value reads one JSON value into dst, a struct field of the Go type that gives its shape. A value
// that cannot be read leaves dst zero (a list keeps its length, with bad items zero).
func (r *reader) value(path string, raw json.RawMessage, f Field, dst reflect.Value) {
	switch p := dst.Addr().Interface().(type) {
	case *string:
		*p, _ = r.str(path, raw)
	case *float64:
		*p, _ = r.number(path, raw)
	case **float64:
		if f.Flat {
			*p, _ = r.optNumber(path, raw)
		} else {
			*p = r.ptrNumber(path, raw)
		}
	case *[]float64:
		*p = r.numbers(path, raw)
	case *[]*float64:
		*p = r.radii(path, raw)
	case *[]string:
		*p = r.strs(path, raw)
	case **int:
		if n, ok := r.integer(path, raw); ok {
			*p = &n
		}
	case *Source:
		*p = r.source(path, raw)
	case *[]Element:
		if items, ok := r.array(path, raw); ok {
			for i, item := range items {
				*p = append(*p, r.element(index(path, i), item))
			}
		}
	case *[]MoreSource:
		if items, ok := r.array(path, raw); ok {
			for i, item := range items {
				*p = append(*p, r.moreSource(index(path, i), item))
			}
		}
	case *map[string]MaterialSpec:
		*p = r.materials(path, raw)
	default:
		r.objectValue(path, raw, f, dst)
	}
}

// objectValue reads a nested object without kinds into dst: a struct, a pointer to one (left nil
// when raw is not an object) or a slice of them (one per array item).
func (r *reader) objectValue(path string, raw json.RawMessage, f Field, dst reflect.Value) {
	switch dst.Kind() {
	case reflect.Struct:
		r.plain(path, raw, f.Fields, dst)
	case reflect.Pointer:
		v := reflect.New(dst.Type().Elem())
		if r.plain(path, raw, f.Fields, v.Elem()) {
			dst.Set(v)
		}
	case reflect.Slice:
		if items, ok := r.array(path, raw); ok {
			for i, item := range items {
				v := reflect.New(dst.Type().Elem()).Elem()
				r.plain(index(path, i), item, f.Fields, v)
				dst.Set(reflect.Append(dst, v))
			}
		}
	}
}

// radii reads a list of face radii, where null is a flat face; an empty list gives nil.
func (r *reader) radii(path string, raw json.RawMessage) []*float64 {
	items, ok := r.array(path, raw)
	if !ok || len(items) == 0 {
		return nil
	}
	out := make([]*float64, len(items))
	for i, item := range items {
		out[i], _ = r.optNumber(index(path, i), item)
	}
	return out
}
