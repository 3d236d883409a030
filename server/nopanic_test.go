package server

import (
	"bytes"
	"log/slog"
	"net/http"
	"net/http/httptest"
	"net/url"
	"strconv"
	"strings"
	"testing"
	"time"

	"raytable/server/store"
)

// TestNoRoutePanics throws odd input at every route and checks that none panics: the recover
// middleware would turn a panic into a 500 and log it, so the log must stay free of panics and no
// answer may be a 500.
func TestNoRoutePanics(t *testing.T) {
	var logs bytes.Buffer
	mem := store.NewMem()
	s := New(Config{Store: mem, AllowedHosts: testHosts, Logger: slog.New(slog.NewTextHandler(&logs, nil)), Now: time.Now})
	ts := &testServer{Server: s, mem: mem}
	id := ts.startDemo(t)
	good := ts.pageForm(t, id)

	odd := []string{"", " ", "-", "1e309", "NaN", "-Inf", "0", "-0", "1e-300", strings.Repeat("9", 400), "flat", ",,,", "1 in, , 2 cm",
		"<script>alert(1)</script>", "\x00", "∞", `"`, "[]", "{}", "-1e12", "1e12"}
	var names []string
	for k := range good {
		names = append(names, k)
	}
	names = append(names, "elements[0].type", "elements[99].type", "source.rays[5].height_mm", "add.at", "add.type")
	actions := []string{"save", "add", "delete:0", "up:3", "down:99", "delete-ray:0", "add-ray", "apply", "delete:-5", "up:", ":"}

	// A request that does not answer within computeDeadline is reported once, and the sweep stops:
	// its goroutine keeps running, and more of them would only slow everything else down.
	hung := false
	post := func(path string, vals url.Values) {
		if hung {
			return
		}
		done := make(chan int, 1)
		go func() {
			rec := httptest.NewRecorder()
			req := httptest.NewRequest(http.MethodPost, path, strings.NewReader(vals.Encode()))
			req.Header.Set("Content-Type", "application/x-www-form-urlencoded")
			s.ServeHTTP(rec, req)
			done <- rec.Code
		}()
		select {
		case code := <-done:
			if code >= 500 {
				t.Errorf("POST %s with %v: %d", path, vals, code)
			}
		case <-time.After(computeDeadline):
			hung = true
			var changed []string
			for k, vs := range vals {
				if g := good[k]; len(g) == 0 || g[0] != vs[0] {
					changed = append(changed, k+"="+strconv.Quote(vs[0]))
				}
			}
			t.Errorf("POST %s did not answer within %v; fields changed from the demo: %v", path, computeDeadline, changed)
		}
	}
	for i, name := range names {
		for j, v := range odd {
			vals := url.Values{}
			for k, vs := range good {
				vals[k] = append([]string(nil), vs...)
			}
			vals.Set(name, v)
			vals.Set("action", actions[(i+j)%len(actions)])
			path := "/r/" + id + "/preview"
			if (i+j)%3 == 0 {
				path = "/r/" + id + "/edit"
			}
			post(path, vals)
		}
	}
	// Forms that lack most fields, and element types that do not exist.
	post("/r/"+id+"/edit", url.Values{"elements[0].type": {"prism"}})
	post("/r/"+id+"/edit", url.Values{})
	post("/r/"+id+"/preview", url.Values{"source.kind": {"laser"}, "source._kind_shown": {"collimated"}})
	for _, body := range []string{"", "null", "[]", `{"format":"raytable/bench/v1"}`, `{"elements":[{"type":"lens","faces_mm":[1e308,-1e308]}]}`, "\xff\xfe"} {
		rec := httptest.NewRecorder()
		req := httptest.NewRequest(http.MethodPost, "/import", strings.NewReader(body))
		req.Header.Set("Content-Type", "application/json")
		s.ServeHTTP(rec, req)
		if rec.Code >= 500 {
			t.Errorf("import %q: %d", body, rec.Code)
		}
	}
	for _, q := range []string{"?a=" + id, "?b=" + id, "?a=" + id + "&b=%00", "?a=/r/" + id + "/r/" + id + "&b=" + id} {
		if rec := ts.get(t, "/compare"+q); rec.Code >= 500 {
			t.Errorf("compare%s: %d", q, rec.Code)
		}
	}
	if strings.Contains(logs.String(), "panic") {
		t.Errorf("a route panicked:\n%s", truncate(logs.String(), 3000))
	}
}

// computeDeadline is how long one computation of a small bench may take before it counts as hung;
// the demo computes in a few milliseconds.
const computeDeadline = 5 * time.Second

// TestDenormalFocalLengthAnswers posts a thin lens of focal length 1e-320 mm (a denormal number
// that passes the finite and non-zero rules). The answer must come back, as an error or a page:
// a computation that never ends would hold a server goroutine and a CPU core for ever.
func TestDenormalFocalLengthAnswers(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	vals := ts.pageForm(t, id)
	b, _ := ts.bench(t, id)
	for i, e := range b.Elements {
		if e.Type == "thin-lens" {
			vals.Set("elements["+strconv.Itoa(i)+"].focal_mm", "1e-320")
		}
	}
	done := make(chan int, 1)
	go func() {
		rec := ts.postForm(t, "/r/"+id+"/preview", vals)
		done <- rec.Code
	}()
	select {
	case code := <-done:
		if code >= 500 {
			t.Errorf("status %d", code)
		}
	case <-time.After(computeDeadline):
		t.Errorf("no answer within %v: the computation of a thin lens with focal_mm 1e-320 does not end "+
			"(optics/beam clearDiameterFor doubles a NaN or infinite radius for ever)", computeDeadline)
	}
}
