package server

import (
	"bytes"
	"encoding/json"
)

// The small objects a form edits as one text of JSON, as in the bench file: a splitter's dichroic
// edge and a source's pulse.

// jsonText is an object as the form's JSON text.
func jsonText(v any) string {
	data, err := json.Marshal(v)
	if err != nil {
		return ""
	}
	return string(data)
}

// jsonObject reads an object written as JSON; an empty field is none. Unknown keys are a problem
// at the field, as they are in the bench file; the values' rules are Validate's. what and example
// complete the message: "is not a pulse: …; write it as in the bench file, e.g. {…}".
func jsonObject[T any](f *formReader, path, what, example string) *T {
	s := f.text(path)
	if s == "" {
		return nil
	}
	dec := json.NewDecoder(bytes.NewReader([]byte(s)))
	dec.DisallowUnknownFields()
	v := new(T)
	if err := dec.Decode(v); err != nil {
		f.add(path, "is not %s: %v; write it as in the bench file, e.g. %s", what, err, example)
		return nil
	}
	return v
}
