package optics

import (
	"bytes"
	"encoding/json"
	"fmt"
)

// Encode writes a valid bench as canonical bench-file JSON: keys in the order of the format,
// user materials sorted by name, optional fields left out when unset, two-space indentation, and
// arrays of plain values (wavelengths, faces, thicknesses, material names) kept on one line.
// A null face radius stays null. Decode reads the result back to an equal Bench.
//
// Encode refuses an invalid bench with the same *Error as Validate, so that no file it writes is
// one that Decode would reject.
func Encode(b *Bench) ([]byte, error) {
	if err := Validate(b); err != nil {
		return nil, err
	}
	return EncodeValid(b)
}

// EncodeValid writes b as Encode does without checking the rules again, for a caller that has
// just had b accepted by Validate (or Decode) and would otherwise check the same bench twice. A
// bench that was never validated must go through Encode.
func EncodeValid(b *Bench) ([]byte, error) {
	encodes.Add(1)
	c := *b
	if c.Elements == nil {
		c.Elements = []Element{}
	}
	var compact bytes.Buffer
	enc := json.NewEncoder(&compact)
	enc.SetEscapeHTML(false) // keep '<', '>' and '&' in titles and notes readable
	if err := enc.Encode(&c); err != nil {
		return nil, fmt.Errorf("encode bench: %w", err)
	}
	var out bytes.Buffer
	r := &reader{}
	indentValue(&out, r, bytes.TrimSpace(compact.Bytes()), "")
	if len(r.problems) > 0 {
		return nil, fmt.Errorf("encode bench: %s", r.problems[0])
	}
	out.WriteByte('\n')
	return out.Bytes(), nil
}

// indentValue writes one compact JSON value with two-space indentation. Objects are always opened
// up; an array stays on one line when all its items are plain values.
func indentValue(out *bytes.Buffer, r *reader, raw json.RawMessage, indent string) {
	switch kindOf(raw) {
	case "an object":
		members, _ := r.object("", raw)
		if len(members) == 0 {
			out.WriteString("{}")
			return
		}
		out.WriteString("{\n")
		for i, m := range members {
			out.WriteString(indent + "  ")
			out.Write(quote(m.key))
			out.WriteString(": ")
			indentValue(out, r, m.raw, indent+"  ")
			if i < len(members)-1 {
				out.WriteByte(',')
			}
			out.WriteByte('\n')
		}
		out.WriteString(indent + "}")
	case "an array":
		items, _ := r.array("", raw)
		if len(items) == 0 {
			out.WriteString("[]")
			return
		}
		flat := true
		for _, item := range items {
			if k := kindOf(item); k == "an object" || k == "an array" {
				flat = false
			}
		}
		if flat {
			out.WriteByte('[')
			for i, item := range items {
				if i > 0 {
					out.WriteString(", ")
				}
				out.Write(item)
			}
			out.WriteByte(']')
			return
		}
		out.WriteString("[\n")
		for i, item := range items {
			out.WriteString(indent + "  ")
			indentValue(out, r, item, indent+"  ")
			if i < len(items)-1 {
				out.WriteByte(',')
			}
			out.WriteByte('\n')
		}
		out.WriteString(indent + "]")
	default:
		out.Write(raw)
	}
}

// quote writes s as a JSON string without HTML escaping, as the compact form has it.
func quote(s string) []byte {
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetEscapeHTML(false)
	_ = enc.Encode(s) // a Go string always encodes
	return bytes.TrimRight(buf.Bytes(), "\n")
}
