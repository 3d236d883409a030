package server

import (
	"bytes"
	"encoding/json"
	"strings"
)

// A list of names (a lens's materials) is shown as a comma list, "N-BK7, F2", which is what a
// person types. A name the comma list cannot carry — one with a comma or a double quote, with
// space at either end, an empty one, or one that starts with "[" — makes the whole field a JSON
// array of strings instead, ["glass, batch 2", "F2"], which carries any text; the reader takes
// either form.

// namesText writes a list of names for its form field.
func namesText(names []string) string {
	for _, n := range names {
		if !plainName(n) {
			var buf bytes.Buffer
			enc := json.NewEncoder(&buf)
			enc.SetEscapeHTML(false) // the page escapes for HTML; the field should read as typed
			enc.Encode(names)
			return strings.TrimSpace(buf.String())
		}
	}
	return strings.Join(names, ", ")
}

// plainName reports whether a name survives the comma list as it is.
func plainName(n string) bool {
	return n != "" && n == strings.TrimSpace(n) && !strings.ContainsAny(n, `,"`) && !strings.HasPrefix(n, "[")
}

// names reads a list of names: a JSON array of strings when the field starts with "[", else a
// comma list.
func (f *formReader) names(path string) []string {
	s := strings.TrimSpace(f.get(path))
	if !strings.HasPrefix(s, "[") {
		return splitList(s)
	}
	var out []string
	if err := json.Unmarshal([]byte(s), &out); err != nil {
		f.add(path, `is not a list of names: %v; write the names with commas between them, or as a JSON list such as ["glass, batch 2", "F2"]`, err)
		return nil
	}
	return out
}
