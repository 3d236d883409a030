package server

import (
	"bytes"
	"net/http"
	"net/http/httptest"
	"net/url"
	"strings"
	"testing"

	"github.com/go-chi/chi/v5"

	"raytable/server/demo"
)

func TestSameOrigin(t *testing.T) {
	for _, tc := range []struct {
		name, method string
		header       map[string]string
		pass         bool
	}{
		{"GET from anywhere", http.MethodGet, map[string]string{"Sec-Fetch-Site": "cross-site", "Origin": "https://evil.example"}, true},
		{"HEAD from anywhere", http.MethodHead, map[string]string{"Sec-Fetch-Site": "cross-site"}, true},
		{"same-origin", http.MethodPost, map[string]string{"Sec-Fetch-Site": "same-origin"}, true},
		{"typed or bookmarked", http.MethodPost, map[string]string{"Sec-Fetch-Site": "none"}, true},
		{"cross-site", http.MethodPost, map[string]string{"Sec-Fetch-Site": "cross-site"}, false},
		{"same-site is another origin", http.MethodPost, map[string]string{"Sec-Fetch-Site": "same-site"}, false},
		{"unknown fetch site", http.MethodPost, map[string]string{"Sec-Fetch-Site": "elsewhere"}, false},
		// Sec-Fetch-Site is set by the browser alone; a page cannot forge it, so it wins over Origin.
		{"fetch site wins over origin", http.MethodPost, map[string]string{"Sec-Fetch-Site": "same-origin", "Origin": "https://evil.example"}, true},
		{"own origin", http.MethodPost, map[string]string{"Origin": "http://example.com"}, true},
		{"own origin, any case", http.MethodPost, map[string]string{"Origin": "http://EXAMPLE.com"}, true},
		{"foreign origin", http.MethodPost, map[string]string{"Origin": "https://evil.example"}, false},
		{"same name, other port", http.MethodPost, map[string]string{"Origin": "http://example.com:8081"}, false},
		{"opaque origin", http.MethodPost, map[string]string{"Origin": "null"}, false},
		{"neither header: curl", http.MethodPost, nil, true},
		{"PUT cross-site", http.MethodPut, map[string]string{"Sec-Fetch-Site": "cross-site"}, false},
		{"DELETE foreign origin", http.MethodDelete, map[string]string{"Origin": "https://evil.example"}, false},
	} {
		t.Run(tc.name, func(t *testing.T) {
			var failed error
			ran := false
			h := sameOrigin(func(w http.ResponseWriter, r *http.Request, err error) { failed = err })(
				http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) { ran = true }))
			req := httptest.NewRequest(tc.method, "/import", nil) // host example.com
			for k, v := range tc.header {
				req.Header.Set(k, v)
			}
			h.ServeHTTP(httptest.NewRecorder(), req)
			if ran != tc.pass || (failed == nil) != tc.pass {
				t.Fatalf("handler ran %v, failure %v; want pass %v", ran, failed, tc.pass)
			}
			if !tc.pass && statusOf(failed) != http.StatusForbidden {
				t.Errorf("status %d, want 403", statusOf(failed))
			}
		})
	}
}

// postRoutes lists every POST route of the router with its parameters filled in, so that a route
// added later is checked without editing this test.
func postRoutes(t *testing.T, ts *testServer, id string) []string {
	t.Helper()
	var paths []string
	err := chi.Walk(ts.router, func(method, route string, _ http.Handler, _ ...func(http.Handler) http.Handler) error {
		// A route ending in /* is the static file server, registered for every method: it reads
		// files only.
		if method == http.MethodPost && !strings.HasSuffix(route, "/*") {
			paths = append(paths, strings.NewReplacer("{id}", id, "{name}", demo.Starts[0].Name).Replace(strings.TrimSuffix(route, "/")))
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	return paths
}

// TestCrossSitePostsAreRefused posts to every state-changing route as a page of another site
// would, once marked by Sec-Fetch-Site and once only by Origin (an older browser). Each is refused
// with 403 and stores nothing; the same posts from the page's own origin still work.
func TestCrossSitePostsAreRefused(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	form := ts.pageForm(t, id)
	form.Set("elements[1].gap_mm", "120")
	form.Set("action", "save")
	bodies := map[string]func() (string, string){
		"/import": func() (string, string) {
			v := url.Values{"bench_text": {string(demo.Bench)}}
			return v.Encode(), "application/x-www-form-urlencoded"
		},
		"/r/" + id + "/edit":    func() (string, string) { return form.Encode(), "application/x-www-form-urlencoded" },
		"/r/" + id + "/preview": func() (string, string) { return form.Encode(), "application/x-www-form-urlencoded" },
	}
	routes := postRoutes(t, ts, id)
	for _, want := range []string{"/import", "/demo", "/demo/" + demo.Starts[0].Name, "/r/" + id + "/edit", "/r/" + id + "/preview"} {
		if !contains(routes, want) {
			t.Fatalf("POST routes %q lack %s", routes, want)
		}
	}
	post := func(path string, header map[string]string) *httptest.ResponseRecorder {
		body, ct := "", ""
		if b, ok := bodies[path]; ok {
			body, ct = b()
		}
		req := httptest.NewRequest(http.MethodPost, path, strings.NewReader(body))
		if ct != "" {
			req.Header.Set("Content-Type", ct)
		}
		for k, v := range header {
			req.Header.Set(k, v)
		}
		return ts.send(req)
	}
	for _, path := range routes {
		for name, header := range map[string]map[string]string{
			"sec-fetch-site": {"Sec-Fetch-Site": "cross-site", "Origin": "https://evil.example"},
			"origin only":    {"Origin": "https://evil.example"},
			"same-site":      {"Sec-Fetch-Site": "same-site", "Origin": "http://other.example.com"},
		} {
			t.Run(path+"/"+name, func(t *testing.T) {
				n := ts.count(t)
				rec := post(path, header)
				if rec.Code != http.StatusForbidden {
					t.Fatalf("status %d, want 403; body %s", rec.Code, truncate(rec.Body.String(), 300))
				}
				if msg := text(one(t, parseHTML(t, rec.Body.Bytes()), "error-message")); !strings.Contains(msg, "another site") && !strings.Contains(msg, "evil.example") {
					t.Errorf("message %q does not say where the request came from", msg)
				}
				if ts.count(t) != n {
					t.Errorf("revisions %d -> %d: a refused post stored something", n, ts.count(t))
				}
			})
		}
		t.Run(path+"/same-origin", func(t *testing.T) {
			for _, header := range []map[string]string{
				{"Sec-Fetch-Site": "same-origin", "Origin": "http://example.com"},
				{"Origin": "http://example.com"},
				nil,
			} {
				rec := post(path, header)
				if rec.Code != http.StatusSeeOther && rec.Code != http.StatusOK {
					t.Errorf("%v: status %d, want 303 or 200 (a preview); body %s", header, rec.Code, truncate(rec.Body.String(), 300))
				}
			}
		})
	}
}

// TestGetStoresNothing opens the start links as a link, a reload or a link checker would: each
// shows the button that posts, and nothing is stored.
func TestGetStoresNothing(t *testing.T) {
	ts := newTestServer(t)
	st := demo.Starts[0]
	for _, tc := range []struct {
		path, form, action string
	}{
		{"/demo", "demo-form", "/demo"},
		{"/demo/" + st.Name, "start-" + st.Name, "/demo/" + st.Name},
	} {
		for _, method := range []string{http.MethodGet, http.MethodHead} {
			t.Run(method+" "+tc.path, func(t *testing.T) {
				rec := ts.do(t, method, tc.path, nil, "")
				if rec.Code != http.StatusOK {
					t.Fatalf("status %d, want 200", rec.Code)
				}
				if ts.count(t) != 0 {
					t.Fatalf("%s %s stored %d revisions", method, tc.path, ts.count(t))
				}
				if method == http.MethodHead {
					return
				}
				f := one(t, parseHTML(t, rec.Body.Bytes()), tc.form)
				if m, _ := attr(f, "method"); m != "post" {
					t.Errorf("form method %q, want post", m)
				}
				if a, _ := attr(f, "action"); a != tc.action {
					t.Errorf("form action %q, want %s", a, tc.action)
				}
			})
		}
	}
	if rec := ts.get(t, "/demo/no-such-bench"); rec.Code != http.StatusNotFound {
		t.Errorf("GET /demo/no-such-bench: %d, want 404", rec.Code)
	}
}

// TestImportContentTypes: /import takes JSON or a form; text/plain, which a page elsewhere may
// post without asking first, and bodies of no type are 415.
func TestImportContentTypes(t *testing.T) {
	ts := newTestServer(t)
	for _, tc := range []struct {
		ct     string
		status int
	}{
		{"application/json", http.StatusSeeOther},
		{"application/json; charset=utf-8", http.StatusSeeOther},
		{"text/plain", http.StatusUnsupportedMediaType},
		{"text/plain; charset=utf-8", http.StatusUnsupportedMediaType},
		{"", http.StatusUnsupportedMediaType},
		{"application/octet-stream", http.StatusUnsupportedMediaType},
	} {
		t.Run(tc.ct, func(t *testing.T) {
			n := ts.count(t)
			rec := ts.do(t, http.MethodPost, "/import", bytes.NewReader(demo.Bench), tc.ct)
			if rec.Code != tc.status {
				t.Fatalf("status %d, want %d; body %s", rec.Code, tc.status, truncate(rec.Body.String(), 300))
			}
			if tc.status == http.StatusSeeOther {
				return
			}
			if ts.count(t) != n {
				t.Errorf("a refused body stored something")
			}
			if body := rec.Body.String(); !strings.Contains(body, "application/json") || !strings.Contains(body, "multipart/form-data") {
				t.Errorf("415 body %q does not name the accepted types", body)
			}
		})
	}
}
