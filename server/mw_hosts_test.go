package server

import (
	"errors"
	"net/http"
	"net/http/httptest"
	"slices"
	"strings"
	"testing"

	"raytable/optics"
)

func TestCheckHosts(t *testing.T) {
	allowed := append(slices.Clone(loopbackHosts), "bench.lab.example")
	for _, tc := range []struct {
		host string
		pass bool
	}{
		{"localhost", true},
		{"localhost:8080", true},
		{"LOCALHOST.:8080", true}, // names compare without case or the root dot (RFC 4343, RFC 1034)
		{"127.0.0.1:1", true},
		{"[::1]:8080", true},
		{"[::1]", true},
		{"bench.lab.example:443", true},
		{"evil.example", false},
		{"evil.example:8080", false},
		{"localhost.evil.example", false},
		{"127.0.0.2:8080", false},
		{"[::2]:8080", false},
		{"", false},
	} {
		t.Run(tc.host, func(t *testing.T) {
			var failed error
			ran := false
			h := checkHosts(allowed, func(w http.ResponseWriter, r *http.Request, err error) { failed = err })(
				http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) { ran = true }))
			req := httptest.NewRequest(http.MethodGet, "/", nil)
			req.Host = tc.host
			h.ServeHTTP(httptest.NewRecorder(), req)
			if ran != tc.pass || (failed == nil) != tc.pass {
				t.Fatalf("handler ran %v, failure %v; want pass %v", ran, failed, tc.pass)
			}
			if !tc.pass {
				if statusOf(failed) != http.StatusMisdirectedRequest {
					t.Errorf("status %d, want 421", statusOf(failed))
				}
				var e *optics.Error
				if !errors.As(failed, &e) || !strings.Contains(e.Message, "--allowed-hosts") {
					t.Errorf("message %q does not say how to allow the host", failed)
				}
			}
		})
	}
}

func TestDefaultAllowedHosts(t *testing.T) {
	for _, tc := range []struct {
		addr string
		want []string
	}{
		{"127.0.0.1:8080", []string{"localhost", "127.0.0.1", "::1"}},
		{"[::1]:8080", []string{"localhost", "127.0.0.1", "::1"}},
		{"192.168.1.20:8080", []string{"localhost", "127.0.0.1", "::1", "192.168.1.20"}},
		{"Bench.Lab:80", []string{"localhost", "127.0.0.1", "::1", "bench.lab"}},
		{":8080", []string{"localhost", "127.0.0.1", "::1"}},        // every interface: no name is implied
		{"0.0.0.0:8080", []string{"localhost", "127.0.0.1", "::1"}}, // the same
		{"[::]:8080", []string{"localhost", "127.0.0.1", "::1"}},
	} {
		if got := DefaultAllowedHosts(tc.addr); !slices.Equal(got, tc.want) {
			t.Errorf("DefaultAllowedHosts(%q) = %q, want %q", tc.addr, got, tc.want)
		}
	}
	if DefaultAllowedHosts("10.0.0.1:1"); !slices.Equal(loopbackHosts, []string{"localhost", "127.0.0.1", "::1"}) {
		t.Errorf("DefaultAllowedHosts changed loopbackHosts to %q", loopbackHosts)
	}
}

func TestParseAllowedHosts(t *testing.T) {
	for _, tc := range []struct {
		list string
		want []string
	}{
		{"", nil},
		{"bench.lab", []string{"bench.lab"}},
		{" bench.lab , 10.0.0.5,,[::1] ", []string{"bench.lab", "10.0.0.5", "[::1]"}},
	} {
		if got := ParseAllowedHosts(tc.list); !slices.Equal(got, tc.want) {
			t.Errorf("ParseAllowedHosts(%q) = %q, want %q", tc.list, got, tc.want)
		}
	}
}

// TestServerRefusesForeignHost checks the wiring: the server's default list refuses the name an
// httptest request carries, and a refused request shows the 421 page.
func TestServerRefusesForeignHost(t *testing.T) {
	ts := newTestServer(t)
	strict := &testServer{Server: New(Config{Store: ts.mem}), mem: ts.mem}
	rec := strict.do(t, http.MethodPost, "/demo", nil, "")
	if rec.Code != http.StatusMisdirectedRequest {
		t.Fatalf("POST /demo as example.com on the default list: %d, want 421", rec.Code)
	}
	if msg := text(one(t, parseHTML(t, rec.Body.Bytes()), "error-message")); !strings.Contains(msg, `"example.com"`) {
		t.Errorf("message %q does not name the host", msg)
	}
	if n := ts.count(t); n != 0 {
		t.Errorf("a refused request stored %d revisions", n)
	}
	req := httptest.NewRequest(http.MethodGet, "/", nil)
	req.Host = "localhost:8080"
	if rec := strict.send(req); rec.Code != http.StatusOK {
		t.Errorf("GET / as localhost:8080: %d, want 200", rec.Code)
	}
}
