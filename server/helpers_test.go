package server

import (
	"bytes"
	"io"
	"net/http"
	"net/http/httptest"
	"net/url"
	"strings"
	"testing"
	"time"

	"golang.org/x/net/html"

	"raytable/optics"
	"raytable/server/store"
)

// testHosts is the Host allow-list of test servers: httptest requests name example.com.
var testHosts = []string{"example.com"}

// testServer is a server over an in-memory store with a clock that ticks one second per call. Its
// requests carry the cookies earlier responses set, as one browser's would.
type testServer struct {
	*Server
	mem     *store.Mem
	cookies map[string]*http.Cookie
}

func newTestServer(t testing.TB) *testServer {
	t.Helper()
	mem := store.NewMem()
	clock := time.Date(2026, 3, 1, 9, 0, 0, 0, time.UTC)
	s := New(Config{Store: mem, AllowedHosts: testHosts, Now: func() time.Time { clock = clock.Add(time.Second); return clock }})
	return &testServer{Server: s, mem: mem}
}

func (ts *testServer) do(t testing.TB, method, target string, body io.Reader, contentType string) *httptest.ResponseRecorder {
	t.Helper()
	req := httptest.NewRequest(method, target, body)
	if contentType != "" {
		req.Header.Set("Content-Type", contentType)
	}
	return ts.send(req)
}

// send serves a request with the cookies kept so far and keeps the ones the response sets.
func (ts *testServer) send(req *http.Request) *httptest.ResponseRecorder {
	for _, c := range ts.cookies {
		req.AddCookie(c)
	}
	rec := httptest.NewRecorder()
	ts.ServeHTTP(rec, req)
	for _, c := range rec.Result().Cookies() {
		if ts.cookies == nil {
			ts.cookies = map[string]*http.Cookie{}
		}
		ts.cookies[c.Name] = c
	}
	return rec
}

func (ts *testServer) get(t testing.TB, target string) *httptest.ResponseRecorder {
	t.Helper()
	return ts.do(t, http.MethodGet, target, nil, "")
}

func (ts *testServer) postForm(t testing.TB, target string, vals url.Values) *httptest.ResponseRecorder {
	t.Helper()
	return ts.do(t, http.MethodPost, target, strings.NewReader(vals.Encode()), "application/x-www-form-urlencoded")
}

func (ts *testServer) count(t testing.TB) int {
	t.Helper()
	n, err := ts.mem.Count()
	if err != nil {
		t.Fatal(err)
	}
	return n
}

// redirectID checks a 303 to /r/{id} and returns the id.
func redirectID(t testing.TB, rec *httptest.ResponseRecorder) string {
	t.Helper()
	if rec.Code != http.StatusSeeOther {
		t.Fatalf("status %d, want 303; body:\n%s", rec.Code, truncate(rec.Body.String(), 2000))
	}
	loc := rec.Header().Get("Location")
	id, ok := strings.CutPrefix(loc, "/r/")
	if !ok || !store.ValidID(id) {
		t.Fatalf("redirect to %q, want /r/{id}", loc)
	}
	return id
}

func truncate(s string, n int) string {
	if len(s) > n {
		return s[:n] + "…"
	}
	return s
}

// startDemo stores the demo and returns its id.
func (ts *testServer) startDemo(t testing.TB) string {
	t.Helper()
	return redirectID(t, ts.do(t, http.MethodPost, "/demo", nil, ""))
}

// bench returns the stored bench of a revision.
func (ts *testServer) bench(t testing.TB, id string) (*optics.Bench, store.Revision) {
	t.Helper()
	rev, err := ts.mem.Get(id)
	if err != nil {
		t.Fatal(err)
	}
	b, err := optics.Decode(rev.Bench)
	if err != nil {
		t.Fatal(err)
	}
	return b, rev
}

func parseHTML(t testing.TB, body []byte) *html.Node {
	t.Helper()
	doc, err := html.Parse(bytes.NewReader(body))
	if err != nil {
		t.Fatal(err)
	}
	return doc
}

func attr(n *html.Node, name string) (string, bool) {
	for _, a := range n.Attr {
		if a.Key == name {
			return a.Val, true
		}
	}
	return "", false
}

// findAll returns the nodes below n for which match is true, in document order.
func findAll(n *html.Node, match func(*html.Node) bool) []*html.Node {
	var out []*html.Node
	var walk func(*html.Node)
	walk = func(c *html.Node) {
		if match(c) {
			out = append(out, c)
		}
		for k := c.FirstChild; k != nil; k = k.NextSibling {
			walk(k)
		}
	}
	walk(n)
	return out
}

func byTestID(id string) func(*html.Node) bool {
	return func(n *html.Node) bool {
		v, ok := attr(n, "data-testid")
		return n.Type == html.ElementNode && ok && v == id
	}
}

func byTag(tag string) func(*html.Node) bool {
	return func(n *html.Node) bool { return n.Type == html.ElementNode && n.Data == tag }
}

func testIDs(n *html.Node, id string) []*html.Node { return findAll(n, byTestID(id)) }

func one(t testing.TB, n *html.Node, id string) *html.Node {
	t.Helper()
	all := testIDs(n, id)
	if len(all) != 1 {
		t.Fatalf("want one element with data-testid=%q, found %d", id, len(all))
	}
	return all[0]
}

func text(n *html.Node) string {
	var b strings.Builder
	for _, t := range findAll(n, func(c *html.Node) bool { return c.Type == html.TextNode }) {
		b.WriteString(t.Data)
	}
	return strings.Join(strings.Fields(b.String()), " ")
}

// formValues serializes a form the way a browser does without a pressed button: text and hidden
// inputs, the selected option of each select, and textareas.
func formValues(t testing.TB, doc *html.Node, formID string) url.Values {
	t.Helper()
	form := one(t, doc, formID)
	vals := url.Values{}
	for _, n := range findAll(form, func(n *html.Node) bool { return n.Type == html.ElementNode }) {
		name, ok := attr(n, "name")
		if !ok {
			continue
		}
		switch n.Data {
		case "input":
			typ, _ := attr(n, "type")
			if typ == "text" || typ == "hidden" || typ == "" {
				v, _ := attr(n, "value")
				vals.Add(name, v)
			}
		case "textarea":
			v := ""
			if n.FirstChild != nil {
				v = n.FirstChild.Data
			}
			vals.Add(name, strings.TrimPrefix(v, "\n"))
		case "select":
			opts := findAll(n, byTag("option"))
			chosen := ""
			for i, o := range opts {
				v, _ := attr(o, "value")
				if _, sel := attr(o, "selected"); sel || i == 0 {
					chosen = v
				}
			}
			vals.Add(name, chosen)
		}
	}
	return vals
}

// pageForm loads a revision's bench page and returns its form values.
func (ts *testServer) pageForm(t testing.TB, id string) url.Values {
	t.Helper()
	rec := ts.get(t, "/r/"+id)
	if rec.Code != http.StatusOK {
		t.Fatalf("GET /r/%s: %d", id, rec.Code)
	}
	return formValues(t, parseHTML(t, rec.Body.Bytes()), "bench-form")
}

// fieldError returns the message shown beside the input named name, "" when none.
func fieldError(t testing.TB, doc *html.Node, name string) string {
	t.Helper()
	for _, f := range testIDs(doc, "field") {
		if v, _ := attr(f, "data-field"); v == name {
			errs := testIDs(f, "field-error")
			if len(errs) == 0 {
				return ""
			}
			return text(errs[0])
		}
	}
	t.Fatalf("no field %q on the page", name)
	return ""
}

// inputValue returns the value of the input, select or textarea named name.
func inputValue(t testing.TB, doc *html.Node, name string) string {
	t.Helper()
	vals := formValues(t, doc, "bench-form")
	if _, ok := vals[name]; !ok {
		t.Fatalf("no input %q in the form", name)
	}
	return vals.Get(name)
}
