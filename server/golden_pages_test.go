package server

import (
	"flag"
	"net/http"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

var updatePages = flag.Bool("update", false, "rewrite the golden pages under testdata/golden/pages")

// TestGoldenPages keeps the HTML of the demo's pages byte-stable: the bench page, the presentation
// view, the history after one edit, the edited page with its preview, a rejected edit, the
// comparison of two benches and the start page. Revision ids are random, so they are replaced by
// stable names before comparing.
func TestGoldenPages(t *testing.T) {
	ts := newTestServer(t)
	demo := ts.startDemo(t)
	relay := redirectID(t, ts.do(t, http.MethodPost, "/import", readFile(t, "../testdata/relay-bench.json"), "application/json"))
	collide := redirectID(t, ts.do(t, http.MethodPost, "/import", readFile(t, "../testdata/collide-bench.json"), "application/json"))

	vals := ts.pageForm(t, demo)
	vals.Set("elements[2].gap_mm", "6.5 in")
	vals.Set("action", "save")
	edited := redirectID(t, ts.postForm(t, "/r/"+demo+"/edit", vals))

	bad := ts.pageForm(t, edited)
	bad.Set("elements[1].gap_mm", "abc")
	bad.Set("action", "save")
	badRec := ts.postForm(t, "/r/"+edited+"/edit", bad)

	prev := ts.pageForm(t, edited)
	prev.Set("elements[3].gap_mm", "30")
	prevRec := ts.postForm(t, "/r/"+edited+"/preview", prev)

	names := strings.NewReplacer(demo, "ID-DEMO", relay, "ID-RELAY", collide, "ID-COLLIDE", edited, "ID-EDITED")
	pages := []struct {
		name string
		body func() []byte
	}{
		{"home", func() []byte { return ts.get(t, "/").Body.Bytes() }},
		{"demo", func() []byte { return ts.get(t, "/r/"+demo).Body.Bytes() }},
		{"demo-view", func() []byte { return ts.get(t, "/r/"+demo+"/view").Body.Bytes() }},
		{"relay", func() []byte { return ts.get(t, "/r/"+relay).Body.Bytes() }},
		{"collide", func() []byte { return ts.get(t, "/r/"+collide).Body.Bytes() }},
		{"edited", func() []byte { return ts.get(t, "/r/"+edited).Body.Bytes() }},
		{"edited-history", func() []byte { return ts.get(t, "/r/"+edited+"/history").Body.Bytes() }},
		{"edit-rejected", func() []byte { return badRec.Body.Bytes() }},
		{"preview", func() []byte { return prevRec.Body.Bytes() }},
		{"compare", func() []byte { return ts.get(t, "/compare?a="+demo+"&b="+edited).Body.Bytes() }},
		{"compare-relay", func() []byte { return ts.get(t, "/compare?a="+demo+"&b="+relay).Body.Bytes() }},
	}
	for _, p := range pages {
		t.Run(p.name, func(t *testing.T) {
			got := names.Replace(string(p.body()))
			path := filepath.Join("..", "testdata", "golden", "pages", p.name+".html")
			if *updatePages {
				if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("%v (run go test ./server -run TestGoldenPages -update)", err)
			}
			if got != string(want) {
				_ = os.WriteFile(path+".actual", []byte(got), 0o644)
				t.Errorf("%s differs from its golden; wrote %s.actual", p.name, path)
			}
		})
	}
}

func readFile(t testing.TB, path string) *strings.Reader {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return strings.NewReader(string(b))
}
