package server

import (
	"bytes"
	"log/slog"
	"net/http"
	"net/http/httptest"
	"strings"
	"testing"
)

func TestRecoverPanicsGivesLogged500(t *testing.T) {
	var logs bytes.Buffer
	log := slog.New(slog.NewTextHandler(&logs, nil))
	failed := 0
	fail := func(w http.ResponseWriter, r *http.Request, status int) {
		failed = status
		w.WriteHeader(status)
		w.Write([]byte("sorry"))
	}
	h := recoverPanics(log, fail)(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		panic("boom at secret/path.go:12")
	}))
	rec := httptest.NewRecorder()
	h.ServeHTTP(rec, httptest.NewRequest(http.MethodGet, "/x", nil))
	if rec.Code != http.StatusInternalServerError || failed != http.StatusInternalServerError {
		t.Errorf("status %d, fail called with %d; want 500", rec.Code, failed)
	}
	if strings.Contains(rec.Body.String(), "boom") {
		t.Error("the panic value reached the user")
	}
	if !strings.Contains(logs.String(), "panic in handler") || !strings.Contains(logs.String(), "boom") {
		t.Errorf("panic not logged: %s", logs.String())
	}
}

func TestRecoverPanicsPassesThrough(t *testing.T) {
	h := recoverPanics(slog.New(slog.DiscardHandler), func(http.ResponseWriter, *http.Request, int) { t.Error("fail called") })(
		http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) { w.WriteHeader(http.StatusTeapot) }))
	rec := httptest.NewRecorder()
	h.ServeHTTP(rec, httptest.NewRequest(http.MethodGet, "/", nil))
	if rec.Code != http.StatusTeapot {
		t.Errorf("status %d, want the handler's 418", rec.Code)
	}
}

func TestRecoverPanicsRepanicsAbort(t *testing.T) {
	h := recoverPanics(slog.New(slog.DiscardHandler), func(http.ResponseWriter, *http.Request, int) {})(
		http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) { panic(http.ErrAbortHandler) }))
	defer func() {
		if p := recover(); p != http.ErrAbortHandler {
			t.Errorf("recovered %v, want http.ErrAbortHandler passed on", p)
		}
	}()
	h.ServeHTTP(httptest.NewRecorder(), httptest.NewRequest(http.MethodGet, "/", nil))
}

// TestServerPanicPage checks the whole chain: a panic becomes the 500 page without details.
func TestServerPanicPage(t *testing.T) {
	ts := newTestServer(t)
	ts.router.Get("/boom", func(http.ResponseWriter, *http.Request) { panic("kaboom") })
	rec := ts.get(t, "/boom")
	if rec.Code != http.StatusInternalServerError {
		t.Fatalf("status %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	if st, _ := attr(one(t, doc, "error-page"), "data-status"); st != "500" || strings.Contains(rec.Body.String(), "kaboom") {
		t.Errorf("500 page status %q or leaks the panic", st)
	}
	if rec.Header().Get("Content-Security-Policy") == "" {
		t.Error("the 500 page lost the security headers")
	}
}
