package server

import (
	"bytes"
	"compress/gzip"
	"io"
	"net/http"
	"net/http/httptest"
	"testing"
)

// TestCompressedAnswers: a client that accepts gzip gets the same bytes, smaller; one that does
// not gets them plain.
func TestCompressedAnswers(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	for _, target := range []string{"/r/" + id, "/r/" + id + "/side.svg", "/r/" + id + "/report.json"} {
		plain := ts.get(t, target)
		req := httptest.NewRequest(http.MethodGet, target, nil)
		req.Header.Set("Accept-Encoding", "gzip")
		rec := httptest.NewRecorder()
		ts.ServeHTTP(rec, req)
		if rec.Code != http.StatusOK || rec.Header().Get("Content-Encoding") != "gzip" {
			t.Errorf("%s: %d, Content-Encoding %q", target, rec.Code, rec.Header().Get("Content-Encoding"))
			continue
		}
		compressed := rec.Body.Len()
		zr, err := gzip.NewReader(rec.Body)
		if err != nil {
			t.Fatal(err)
		}
		body, err := io.ReadAll(zr)
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(body, plain.Body.Bytes()) {
			t.Errorf("%s: the compressed answer differs from the plain one", target)
		}
		if compressed >= len(body)/2 {
			t.Errorf("%s: %d bytes compressed to %d", target, len(body), compressed)
		}
		t.Logf("%s: %d bytes, %d compressed", target, len(body), compressed)
		if plain.Header().Get("Content-Encoding") != "" {
			t.Errorf("%s: compressed without Accept-Encoding", target)
		}
	}
}
