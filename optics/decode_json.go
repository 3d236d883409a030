package optics

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"strings"
)

// This file is the low-level reader behind Decode. It walks a JSON document one level at a time as
// json.RawMessage, so that it knows which keys were present, in which order, and whether a key
// appears twice; every complaint goes to a problem list under the JSON path where it arose.

// member is one key of a JSON object with its raw value, in document order.
type member struct {
	key string
	raw json.RawMessage
}

// reader collects problems while it decodes.
type reader struct {
	problems []Problem
}

func (r *reader) add(path, format string, args ...any) {
	r.problems = append(r.problems, Problem{Path: path, Message: fmt.Sprintf(format, args...)})
}

// field and index build JSON paths: field("elements[2]", "faces_mm") is "elements[2].faces_mm".
func field(parent, key string) string {
	if parent == "" {
		return key
	}
	return parent + "." + key
}

func index(parent string, i int) string { return fmt.Sprintf("%s[%d]", parent, i) }

// kindOf names the JSON type of a raw value for messages: "an object", "a string", ...
func kindOf(raw json.RawMessage) string {
	raw = bytes.TrimLeft(raw, " \t\r\n")
	if len(raw) == 0 {
		return "nothing"
	}
	switch raw[0] {
	case '{':
		return "an object"
	case '[':
		return "an array"
	case '"':
		return "a string"
	case 't', 'f':
		return "a boolean"
	case 'n':
		return "null"
	}
	return "a number"
}

func isNull(raw json.RawMessage) bool { return kindOf(raw) == "null" }

// object reads a JSON object as its members in document order. A key that appears twice is a
// problem at its path; only the first occurrence is kept.
func (r *reader) object(path string, raw json.RawMessage) ([]member, bool) {
	if k := kindOf(raw); k != "an object" {
		r.add(path, "must be an object, got %s", k)
		return nil, false
	}
	dec := json.NewDecoder(bytes.NewReader(raw))
	dec.UseNumber()
	if _, err := dec.Token(); err != nil { // the opening brace, checked above
		r.add(path, "unreadable object: %v", err)
		return nil, false
	}
	var members []member
	seen := map[string]bool{}
	for dec.More() {
		tok, err := dec.Token()
		if err != nil {
			r.add(path, "unreadable object: %v", err)
			return nil, false
		}
		key, _ := tok.(string) // object keys are always strings in valid JSON
		var value json.RawMessage
		if err := dec.Decode(&value); err != nil {
			r.add(field(path, key), "unreadable value: %v", err)
			return nil, false
		}
		if seen[key] {
			r.add(field(path, key), "appears more than once")
			continue
		}
		seen[key] = true
		members = append(members, member{key: key, raw: value})
	}
	return members, true
}

// array reads a JSON array as its raw items.
func (r *reader) array(path string, raw json.RawMessage) ([]json.RawMessage, bool) {
	if k := kindOf(raw); k != "an array" {
		r.add(path, "must be an array, got %s", k)
		return nil, false
	}
	var items []json.RawMessage
	if err := json.Unmarshal(raw, &items); err != nil {
		r.add(path, "unreadable array: %v", err)
		return nil, false
	}
	return items, true
}

// number reads a JSON number. JSON has no NaN or Inf; a literal too large for float64 is out of
// range.
func (r *reader) number(path string, raw json.RawMessage) (float64, bool) {
	if k := kindOf(raw); k != "a number" {
		r.add(path, "must be a number, got %s", k)
		return 0, false
	}
	var v float64
	if err := json.Unmarshal(raw, &v); err != nil || math.IsInf(v, 0) {
		r.add(path, "number %s is out of range", strings.TrimSpace(string(raw)))
		return 0, false
	}
	return v, true
}

// optNumber reads a number where null is allowed and means "none" (a flat face or mirror).
func (r *reader) optNumber(path string, raw json.RawMessage) (*float64, bool) {
	if isNull(raw) {
		return nil, true
	}
	v, ok := r.number(path, raw)
	if !ok {
		return nil, false
	}
	return &v, true
}

// ptrNumber reads a number into a new pointer, for optional fields that are present.
func (r *reader) ptrNumber(path string, raw json.RawMessage) *float64 {
	v, ok := r.number(path, raw)
	if !ok {
		return nil
	}
	return &v
}

// integer reads a whole number that fits an int comfortably.
func (r *reader) integer(path string, raw json.RawMessage) (int, bool) {
	v, ok := r.number(path, raw)
	if !ok {
		return 0, false
	}
	if v != math.Trunc(v) || math.Abs(v) > 1e9 {
		r.add(path, "must be a whole number, got %s", strings.TrimSpace(string(raw)))
		return 0, false
	}
	return int(v), true
}

// str reads a JSON string.
func (r *reader) str(path string, raw json.RawMessage) (string, bool) {
	if k := kindOf(raw); k != "a string" {
		r.add(path, "must be a string, got %s", k)
		return "", false
	}
	var s string
	if err := json.Unmarshal(raw, &s); err != nil {
		r.add(path, "unreadable string: %v", err)
		return "", false
	}
	return s, true
}

// numbers reads an array of numbers. A bad item is reported at its index and kept as 0 so that
// counts stay right; an empty array gives nil.
func (r *reader) numbers(path string, raw json.RawMessage) []float64 {
	items, ok := r.array(path, raw)
	if !ok || len(items) == 0 {
		return nil
	}
	out := make([]float64, len(items))
	for i, item := range items {
		out[i], _ = r.number(index(path, i), item)
	}
	return out
}

// strs reads an array of strings, keeping bad items as "" so that counts stay right.
func (r *reader) strs(path string, raw json.RawMessage) []string {
	items, ok := r.array(path, raw)
	if !ok || len(items) == 0 {
		return nil
	}
	out := make([]string, len(items))
	for i, item := range items {
		out[i], _ = r.str(index(path, i), item)
	}
	return out
}

// require reports every key of need that the object lacks.
func (r *reader) require(path string, members []member, need ...string) {
	for _, key := range need {
		if !hasKey(members, key) {
			r.add(field(path, key), "required field is missing")
		}
	}
}

func hasKey(members []member, key string) bool {
	for _, m := range members {
		if m.key == key {
			return true
		}
	}
	return false
}

func lookup(members []member, key string) (json.RawMessage, bool) {
	for _, m := range members {
		if m.key == key {
			return m.raw, true
		}
	}
	return nil, false
}

// syntaxProblem turns a JSON syntax error into a problem that says where it is (line and column).
func syntaxProblem(data []byte, err error) Problem {
	var se *json.SyntaxError
	if errors.As(err, &se) {
		off := int(min(max(se.Offset, 0), int64(len(data))))
		line := 1 + bytes.Count(data[:off], []byte("\n"))
		col := off - bytes.LastIndexByte(data[:off], '\n')
		return Problem{Message: fmt.Sprintf("not valid JSON at line %d, column %d: %v", line, col, se)}
	}
	return Problem{Message: fmt.Sprintf("not valid JSON: %v", err)}
}
