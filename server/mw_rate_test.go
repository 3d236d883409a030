package server

import (
	"net/http"
	"net/http/httptest"
	"strconv"
	"testing"
	"time"

	"raytable/server/store"
)

// TestWriteLimit: a client gets its burst of writes, then 429 with Retry-After naming the wait;
// another address and every read go on; the bucket refills with time.
func TestWriteLimit(t *testing.T) {
	clock := time.Date(2026, 1, 2, 3, 4, 5, 0, time.UTC)
	mem := store.NewMem()
	ts := &testServer{Server: New(Config{Store: mem, AllowedHosts: testHosts, Now: func() time.Time { return clock }, WritesPerMinute: 6}), mem: mem}
	for i := range writeBurst {
		if rec := ts.do(t, http.MethodPost, "/demo", nil, ""); rec.Code != http.StatusSeeOther {
			t.Fatalf("write %d: status %d, want 303", i, rec.Code)
		}
	}
	rec := ts.do(t, http.MethodPost, "/demo", nil, "")
	if rec.Code != http.StatusTooManyRequests {
		t.Fatalf("write past the burst: status %d, want 429", rec.Code)
	}
	// 6 a minute: one token every 10 s (common practice: a token bucket refills at its rate).
	if got := rec.Header().Get("Retry-After"); got != "10" {
		t.Errorf("Retry-After %q, want 10", got)
	}
	if n := ts.count(t); n != writeBurst {
		t.Errorf("%d revisions stored, want %d", n, writeBurst)
	}
	recent, _ := mem.Recent(1)
	for _, path := range []string{"/", "/r/" + recent[0].ID, "/r/" + recent[0].ID + "/bench.json"} {
		if rec := ts.get(t, path); rec.Code != http.StatusOK {
			t.Errorf("read %s while limited: status %d", path, rec.Code)
		}
	}
	other := httptest.NewRequest(http.MethodPost, "/demo", nil)
	other.RemoteAddr = "198.51.100.7:4000"
	otherRec := httptest.NewRecorder()
	ts.ServeHTTP(otherRec, other)
	if rec := otherRec; rec.Code != http.StatusSeeOther {
		t.Errorf("another address: status %d, want 303", rec.Code)
	}
	clock = clock.Add(10 * time.Second)
	if rec := ts.do(t, http.MethodPost, "/demo", nil, ""); rec.Code != http.StatusSeeOther {
		t.Errorf("after the wait: status %d, want 303", rec.Code)
	}
}

// TestWriteLimiterForgetsIdleClients: the table of clients stays within its bound.
func TestWriteLimiterForgetsIdleClients(t *testing.T) {
	clock := time.Date(2026, 1, 2, 3, 4, 5, 0, time.UTC)
	l := newWriteLimiter(60, func() time.Time { return clock })
	l.max = 3
	for i := range 10 {
		clock = clock.Add(time.Millisecond)
		for range writeBurst { // empties its bucket, so it cannot be forgotten as new
			l.wait(strconv.Itoa(i))
		}
		if len(l.clients) > l.max {
			t.Fatalf("after %d clients the table holds %d, bound %d", i+1, len(l.clients), l.max)
		}
	}
	if _, ok := l.clients["9"]; !ok {
		t.Error("the newest client was forgotten")
	}
	if _, ok := l.clients["0"]; ok {
		t.Error("the oldest client is still held")
	}
}
