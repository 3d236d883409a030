package server

import (
	"net/url"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// FuzzParseBenchForm reads arbitrary form bodies as the edit form. parseBenchForm must never panic
// and must name every problem by a path; a form it reads without problems that passes the bench
// rules must encode and decode as a bench file. Seeds: the form of every testdata bench, as the
// page writes it (benchValues), plus testdata/fuzz/FuzzParseBenchForm.
func FuzzParseBenchForm(f *testing.F) {
	for _, data := range benchtest.BenchFiles(f) {
		b, err := optics.Decode(data)
		if err != nil {
			f.Fatal(err)
		}
		vals := url.Values{}
		for k, v := range benchValues(b) {
			vals.Set(k, v)
		}
		f.Add(vals.Encode())
	}
	f.Fuzz(func(t *testing.T, body string) {
		vals, err := url.ParseQuery(body)
		if err != nil {
			return // the server answers 400 before the form is read
		}
		b, problems := parseBenchForm(vals)
		for _, p := range problems {
			if p.Message == "" {
				t.Fatalf("a problem at %q has no message", p.Path)
			}
		}
		if len(problems) > 0 || optics.Validate(b) != nil {
			return
		}
		data, err := optics.Encode(b)
		if err != nil {
			t.Fatalf("a valid bench from the form does not encode: %v", err)
		}
		if _, err := optics.Decode(data); err != nil {
			t.Fatalf("a valid bench from the form does not decode: %v\n%s", err, data)
		}
	})
}
