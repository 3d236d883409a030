package server

import (
	"net/http"
	"strings"
	"testing"
)

// TestIconAndHead: browsers fetch /favicon.ico on their own (a drawing opened by itself has no
// icon link), and link checkers send HEAD; both must answer 200, not an error page.
func TestIconAndHead(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	rec := ts.get(t, "/favicon.ico")
	if rec.Code != http.StatusOK || !strings.HasPrefix(rec.Header().Get("Content-Type"), "image/svg+xml") {
		t.Errorf("/favicon.ico: %d %q", rec.Code, rec.Header().Get("Content-Type"))
	}
	for _, target := range []string{"/", "/r/" + id, "/r/" + id + "/plan.svg", "/r/" + id + "/report.json"} {
		rec := ts.do(t, http.MethodHead, target, nil, "")
		if rec.Code != http.StatusOK {
			t.Errorf("HEAD %s: %d", target, rec.Code)
		}
	}
}

// TestStaticHasNoListing: /static/ serves its files, never a listing of them.
func TestStaticHasNoListing(t *testing.T) {
	ts := newTestServer(t)
	for _, target := range []string{"/static/", "/static"} {
		if rec := ts.get(t, target); rec.Code != http.StatusNotFound {
			t.Errorf("GET %s: %d, want 404", target, rec.Code)
		}
	}
	if rec := ts.get(t, "/static/raytable.css"); rec.Code != http.StatusOK {
		t.Errorf("GET /static/raytable.css: %d", rec.Code)
	}
}
