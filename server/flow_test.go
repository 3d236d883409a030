package server

import (
	"net/http"
	"testing"

	"raytable/optics"
	"raytable/server/store"
)

// work is what optics did for one request: rule checks, encodes and decodes of a bench.
type work struct{ validations, encodes, decodes int64 }

func counted(do func()) work {
	v, e, d := optics.Validations(), optics.Encodes(), optics.Decodes()
	do()
	return work{optics.Validations() - v, optics.Encodes() - e, optics.Decodes() - d}
}

// TestRequestsDoEachStepOnce counts the work of the requests around an edit (STYLE.md, "one
// representation per quantity on its way through"): a gap edit parses the form, checks the rules
// once, encodes once and hands those bytes to the store; the page view that follows decodes the
// stored bytes once, trusting the rules they passed, and a second view finds the bench kept.
func TestRequestsDoEachStepOnce(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	gapEdit := ts.pageForm(t, id) // also the page the edit is posted from: its bench is kept
	gapEdit.Set("elements[2].gap_mm", "6.5 in")
	gapEdit.Set("action", "save")
	var edited string
	steps := []struct {
		name string
		do   func()
		want work
	}{
		{"a gap edit", func() { edited = redirectID(t, ts.postForm(t, "/r/"+id+"/edit", gapEdit)) }, work{1, 1, 0}},
		{"the page view after it", func() { ts.get(t, "/r/"+edited) }, work{0, 0, 1}},
		{"a second page view", func() { ts.get(t, "/r/"+edited) }, work{0, 0, 0}},
		{"its bench file", func() { ts.get(t, "/r/"+edited+"/bench.json") }, work{0, 0, 0}},
		{"saving it unchanged", func() {
			same := ts.pageForm(t, edited)
			same.Set("action", "save")
			ts.postForm(t, "/r/"+edited+"/edit", same)
		}, work{1, 1, 0}},
		{"a slider preview", func() { ts.postForm(t, "/r/"+edited+"/preview", gapEdit) }, work{1, 0, 0}},
		// Adding an element makes another bench than the one posted: both are checked, once each.
		{"adding an element", func() {
			add := ts.pageForm(t, edited)
			add.Set("action", "add")
			add.Set("add.type", "mirror")
			redirectID(t, ts.postForm(t, "/r/"+edited+"/edit", add))
		}, work{2, 1, 0}},
		{"an import", func() {
			redirectID(t, ts.do(t, http.MethodPost, "/import", readFile(t, "../testdata/relay-bench.json"), "application/json"))
		}, work{1, 1, 1}},
	}
	for _, st := range steps {
		if got := counted(st.do); got != st.want {
			t.Errorf("%s: %d validations, %d encodes, %d decodes; want %d, %d, %d", st.name,
				got.validations, got.encodes, got.decodes, st.want.validations, st.want.encodes, st.want.decodes)
		}
	}
}

// TestEditOfAnUncachedRevisionDecodesItOnce: with nothing kept, the revision an edit starts from is
// decoded from the store once, without checking its rules again.
func TestEditOfAnUncachedRevisionDecodesItOnce(t *testing.T) {
	mem := store.NewMem()
	ts := &testServer{Server: New(Config{Store: mem, AllowedHosts: testHosts, CacheEntries: -1}), mem: mem}
	id := ts.startDemo(t)
	vals := ts.pageForm(t, id)
	vals.Set("elements[2].gap_mm", "160")
	vals.Set("action", "save")
	got := counted(func() { redirectID(t, ts.postForm(t, "/r/"+id+"/edit", vals)) })
	if want := (work{1, 1, 1}); got != want {
		t.Errorf("edit without a cache: %+v, want %+v", got, want)
	}
}
