package server

import (
	"bytes"
	"net/http"
	"slices"
	"testing"

	"raytable/optics"
	"raytable/server/demo"
)

// TestNamesTextReadsBack: every list of names, plain or hostile, reads back from its field as it
// was written, and plain lists keep the comma form a person types.
func TestNamesTextReadsBack(t *testing.T) {
	for _, tc := range []struct {
		names []string
		text  string // "" when only the round trip is checked
	}{
		{[]string{"N-BK7", "F2"}, "N-BK7, F2"},
		{[]string{"fused-silica"}, "fused-silica"},
		{[]string{"glass, batch 2", "F2"}, `["glass, batch 2","F2"]`},
		{[]string{`say "hi"`}, `["say \"hi\""]`},
		{[]string{"[odd"}, `["[odd"]`},
		{[]string{" spaced ", ""}, ""},
		{[]string{`<b>&amp;</b>`, `back\slash`, "ünïcödé · ±", "a;b|c'd"}, ""},
	} {
		text := namesText(tc.names)
		if tc.text != "" && text != tc.text {
			t.Errorf("namesText(%q) = %s, want %s", tc.names, text, tc.text)
		}
		f := &formReader{vals: map[string][]string{"m": {text}}}
		if got := f.names("m"); !slices.Equal(got, tc.names) || len(f.problems) > 0 {
			t.Errorf("%q wrote %s and read back %q, problems %v", tc.names, text, got, f.problems)
		}
	}
	f := &formReader{vals: map[string][]string{"m": {`["unclosed`}}}
	if f.names("m"); len(f.problems) != 1 || f.problems[0].Path != "m" {
		t.Errorf("a broken JSON list: problems %v, want one at m", f.problems)
	}
}

// TestFormKeepsHostileMaterialNames: a bench whose own materials have names with commas, quotes
// and other printable characters imports, and an edit of its title alone through the page form
// stores the same materials and lens lists.
func TestFormKeepsHostileMaterialNames(t *testing.T) {
	b, err := optics.Decode(demo.Bench)
	if err != nil {
		t.Fatal(err)
	}
	one := 1.5
	names := []string{"glass, batch 2", `the "good" one`, "[left", "<b>&</b> · ±, ü"}
	b.Materials = map[string]optics.MaterialSpec{}
	for _, n := range names {
		b.Materials[n] = optics.MaterialSpec{Index: &one}
	}
	lenses := 0
	for i := range b.Elements {
		if b.Elements[i].Type == optics.TypeLens {
			b.Elements[i].Materials = []string{names[lenses%len(names)]}
			lenses++
		}
	}
	data, err := optics.Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	ts := newTestServer(t)
	id := redirectID(t, ts.do(t, http.MethodPost, "/import", bytes.NewReader(data), "application/json"))
	vals := ts.pageForm(t, id)
	const hostile = `a, "b" [c] <d> & 'e' \ · ± ü; {f}`
	vals.Set("title", hostile)
	vals.Set("action", "save")
	edited := redirectID(t, ts.postForm(t, "/r/"+id+"/edit", vals))
	got, _ := ts.bench(t, edited)
	if got.Title != hostile {
		t.Errorf("title %q, want %q", got.Title, hostile)
	}
	for i, e := range b.Elements {
		if !slices.Equal(got.Elements[i].Materials, e.Materials) {
			t.Errorf("%s materials %q after the edit, want %q", e.ID, got.Elements[i].Materials, e.Materials)
		}
	}
	for _, n := range names {
		if _, ok := got.Materials[n]; !ok {
			t.Errorf("material %q lost", n)
		}
	}
}

// TestFormKeepsEveryRay: a title edit of a bench with as many explicit rays as the cap allows
// stores every ray (the form has no cap of its own).
func TestFormKeepsEveryRay(t *testing.T) {
	const rays = optics.MaxExplicitRays
	ts := newTestServer(t)
	id := redirectID(t, ts.do(t, http.MethodPost, "/import", bytes.NewReader(withRays(t, rays)), "application/json"))
	vals := ts.pageForm(t, id)
	vals.Set("title", "renamed")
	vals.Set("action", "save")
	edited := redirectID(t, ts.postForm(t, "/r/"+id+"/edit", vals))
	if got, _ := ts.bench(t, edited); len(got.Source.Rays) != rays || got.Title != "renamed" {
		t.Errorf("after a title edit: %d rays, title %q; want %d and renamed", len(got.Source.Rays), got.Title, rays)
	}
}
