package server

import (
	"bytes"
	"errors"
	"io/fs"
	"net/http"
	"os"
	"strings"
	"testing"

	"golang.org/x/net/html"

	"raytable/server/demo"
)

func TestEmbeddedDemoMatchesTestdata(t *testing.T) {
	want, err := os.ReadFile("../testdata/demo-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(demo.Bench, want) {
		t.Error("server/demo/demo-bench.json differs from testdata/demo-bench.json; copy it over")
	}
}

// TestEmbeddedStartsMatchTestdata keeps each start bench of the home page equal to its testdata
// file, where the other tests read it.
func TestEmbeddedStartsMatchTestdata(t *testing.T) {
	for _, st := range demo.Starts {
		want, err := os.ReadFile("../testdata/" + st.File)
		if errors.Is(err, fs.ErrNotExist) {
			t.Skipf("testdata/%s is not written yet (it comes with the bench format's branching benches)", st.File)
		}
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(st.Bench, want) {
			t.Errorf("server/demo/%s differs from testdata/%s; copy it over", st.File, st.File)
		}
	}
}

func TestHomePage(t *testing.T) {
	ts := newTestServer(t)
	rec := ts.get(t, "/")
	if rec.Code != http.StatusOK {
		t.Fatalf("GET /: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	for _, id := range []string{"demo-form", "import-form", "recent", "compare-form"} {
		one(t, doc, id)
	}
	if got := text(one(t, doc, "recent")); !strings.Contains(got, "None yet") {
		t.Errorf("empty store: recent list says %q", got)
	}
	id := ts.startDemo(t)
	doc = parseHTML(t, ts.get(t, "/").Body.Bytes())
	links := findAll(one(t, doc, "recent"), byTag("a"))
	if len(links) != 1 {
		t.Fatalf("recent lists %d designs, want 1", len(links))
	}
	if href, _ := attr(links[0], "href"); href != "/r/"+id {
		t.Errorf("recent link %q, want /r/%s", href, id)
	}
}

func TestDemoFlow(t *testing.T) {
	for _, method := range []string{http.MethodPost} { // GET only shows the button: TestGetStoresNothing
		t.Run(method, func(t *testing.T) {
			ts := newTestServer(t)
			id := redirectID(t, ts.do(t, method, "/demo", nil, ""))
			rec := ts.get(t, "/r/"+id)
			if rec.Code != http.StatusOK {
				t.Fatalf("GET /r/%s: %d", id, rec.Code)
			}
			doc := parseHTML(t, rec.Body.Bytes())
			page := one(t, doc, "bench-page")
			if rev, _ := attr(page, "data-revision"); rev != id {
				t.Errorf("page revision %q, want %q", rev, id)
			}
			for _, tid := range []string{"side-view", "table-view"} {
				if n := len(findAll(one(t, doc, tid), byTag("svg"))); n == 0 {
					t.Errorf("%s holds no inline svg", tid)
				}
			}
			for _, tid := range []string{"numbers", "system-values", "elements-table", "ray-status", "beam-table", "waists", "placement", "warnings", "cautions", "links", "bench-form"} {
				one(t, doc, tid)
			}
			b, _ := ts.bench(t, id)
			if got := len(testIDs(doc, "element")); got != len(b.Elements) {
				t.Errorf("form shows %d elements, bench has %d", got, len(b.Elements))
			}
			if got := text(one(t, doc, "title")); got != b.Title {
				t.Errorf("title %q, want %q", got, b.Title)
			}
			if got := text(one(t, doc, "cautions")); !strings.Contains(got, "IEC 60825-1") || !strings.Contains(got, "not a safety assessment") {
				t.Errorf("cautions box lacks the standards and the estimate note: %q", got)
			}
		})
	}
}

func TestPresentationView(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	rec := ts.get(t, "/r/"+id+"/view")
	if rec.Code != http.StatusOK {
		t.Fatalf("view: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	one(t, doc, "present-page")
	one(t, doc, "cautions")
	one(t, doc, "numbers")
	if forms := findAll(doc, byTag("form")); len(forms) != 0 {
		t.Errorf("presentation view has %d forms, want none", len(forms))
	}
	// Larger diagrams than the bench page.
	svg := findAll(one(t, doc, "side-view"), byTag("svg"))[0]
	if w, _ := attr(svg, "width"); strings.TrimSuffix(w, ".0") != "1400" {
		t.Errorf("presentation side view width %q, want 1400", w)
	}
}

func TestMissingRevisionIs404Page(t *testing.T) {
	ts := newTestServer(t)
	missing := strings.Repeat("b", 24)
	for _, path := range []string{
		"/r/" + missing, "/r/" + missing + "/view", "/r/" + missing + "/history", "/r/" + missing + "/bench.json",
		"/r/" + missing + "/report.json", "/r/" + missing + "/side.svg", "/r/" + missing + "/table.svg", "/r/" + missing + "/plan.svg",
		"/r/not-an-id", "/r/../../etc/passwd", "/nowhere", "/static/missing.js",
	} {
		rec := ts.get(t, path)
		if rec.Code != http.StatusNotFound {
			t.Errorf("GET %s: %d, want 404", path, rec.Code)
			continue
		}
		if strings.HasPrefix(path, "/static/") {
			continue
		}
		doc := parseHTML(t, rec.Body.Bytes())
		if st, _ := attr(one(t, doc, "error-page"), "data-status"); st != "404" {
			t.Errorf("GET %s: error page status %q", path, st)
		}
		if strings.Contains(rec.Body.String(), "goroutine") || strings.Contains(rec.Body.String(), ".go:") {
			t.Errorf("GET %s shows a trace", path)
		}
	}
	for _, path := range []string{"/r/" + missing + "/edit", "/r/" + missing + "/preview"} {
		if rec := ts.do(t, http.MethodPost, path, strings.NewReader("title=x"), "application/x-www-form-urlencoded"); rec.Code != http.StatusNotFound {
			t.Errorf("POST %s: %d, want 404", path, rec.Code)
		}
	}
	if rec := ts.do(t, http.MethodDelete, "/", nil, ""); rec.Code != http.StatusMethodNotAllowed {
		t.Errorf("DELETE /: %d, want 405", rec.Code)
	}
}

// TestPagesFollowTheCSP checks every page for what the Content-Security-Policy would block: inline
// scripts, inline event handlers and style attributes (in the SVGs too).
func TestPagesFollowTheCSP(t *testing.T) {
	ts := newTestServer(t)
	a := ts.startDemo(t)
	vals := ts.pageForm(t, a)
	vals.Set("elements[2].gap_mm", "160")
	b := redirectID(t, ts.postForm(t, "/r/"+a+"/edit", vals))
	for _, path := range []string{"/", "/r/" + b, "/r/" + b + "?paraxial=1", "/r/" + b + "/view", "/r/" + b + "/history", "/compare?a=" + a + "&b=" + b, "/compare", "/nowhere"} {
		rec := ts.get(t, path)
		if csp := rec.Header().Get("Content-Security-Policy"); csp != contentSecurityPolicy {
			t.Errorf("%s: CSP %q", path, csp)
		}
		doc := parseHTML(t, rec.Body.Bytes())
		for _, n := range findAll(doc, func(n *html.Node) bool { return n.Type == html.ElementNode }) {
			for _, at := range n.Attr {
				if at.Key == "style" || strings.HasPrefix(at.Key, "on") {
					t.Errorf("%s: <%s %s=%q> would be blocked by the CSP", path, n.Data, at.Key, truncate(at.Val, 60))
				}
			}
			if n.Data == "script" {
				if src, ok := attr(n, "src"); !ok || src != "/static/raytable.js" || n.FirstChild != nil {
					t.Errorf("%s: inline or foreign script", path)
				}
			}
			if n.Data == "style" {
				t.Errorf("%s: <style> element would be blocked by the CSP", path)
			}
		}
	}
}

func TestStaticFiles(t *testing.T) {
	ts := newTestServer(t)
	for path, ct := range map[string]string{"/static/raytable.css": "text/css; charset=utf-8", "/static/raytable.js": "text/javascript; charset=utf-8"} {
		rec := ts.get(t, path)
		if rec.Code != http.StatusOK || rec.Header().Get("Content-Type") != ct || rec.Body.Len() == 0 {
			t.Errorf("%s: %d %q %d bytes", path, rec.Code, rec.Header().Get("Content-Type"), rec.Body.Len())
		}
	}
}

// TestStartBenches posts each start button of the home page: it stores the bench as a new design
// (303 to it) whose page lists its arms; an unknown name is 404 and stores nothing.
func TestStartBenches(t *testing.T) {
	ts := newTestServer(t)
	home := ts.get(t, "/").Body.String()
	for _, st := range demo.Starts {
		if !strings.Contains(home, `action="/demo/`+st.Name+`"`) {
			t.Errorf("the home page has no button for %s", st.Name)
		}
		if _, err := os.Stat("../testdata/" + st.File); errors.Is(err, fs.ErrNotExist) {
			t.Logf("testdata/%s is not written yet: its bench is not posted", st.File)
			continue
		}
		rec := ts.postForm(t, "/demo/"+st.Name, nil)
		if rec.Code != http.StatusSeeOther {
			t.Fatalf("POST /demo/%s: %d %s", st.Name, rec.Code, rec.Body.String())
		}
		page := ts.get(t, rec.Header().Get("Location")).Body.String()
		if !strings.Contains(page, `data-testid="arm-choice"`) {
			t.Errorf("the %s bench's page lists no arms", st.Name)
		}
	}
	before := ts.count(t)
	if rec := ts.postForm(t, "/demo/nowhere", nil); rec.Code != http.StatusNotFound || ts.count(t) != before {
		t.Errorf("POST /demo/nowhere: %d, %d designs stored", rec.Code, ts.count(t)-before)
	}
}
