package server

import (
	"net/http"
	"net/url"
	"strconv"
	"strings"
	"testing"

	"raytable/server/store"
)

// BenchmarkEditRoundTrip measures one edit as the server handles it without a browser: parse the
// posted form, validate, store the new revision, then render its page (recompute the report, draw
// both views, lay out the numbers).
func BenchmarkEditRoundTrip(b *testing.B) {
	ts := newTestServer(b)
	id := ts.startDemo(b)
	vals := ts.pageForm(b, id)
	vals.Set("action", "save")
	body := func(i int) string {
		v := url.Values{}
		for k, vs := range vals {
			v[k] = vs
		}
		v.Set("elements[2].gap_mm", strconv.FormatFloat(140+float64(i%200)*0.1, 'f', 1, 64))
		return v.Encode()
	}
	var pageBytes int
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; b.Loop(); i++ {
		rec := ts.do(b, http.MethodPost, "/r/"+id+"/edit", strings.NewReader(body(i)), "application/x-www-form-urlencoded")
		if rec.Code != http.StatusSeeOther {
			b.Fatalf("edit: %d", rec.Code)
		}
		page := ts.get(b, rec.Header().Get("Location"))
		if page.Code != http.StatusOK {
			b.Fatalf("page: %d", page.Code)
		}
		pageBytes = page.Body.Len()
	}
	b.ReportMetric(float64(pageBytes), "page-bytes")
}

// BenchmarkPreview measures one slider step: parse, validate, compute and render the fragment.
func BenchmarkPreview(b *testing.B) {
	ts := newTestServer(b)
	id := ts.startDemo(b)
	vals := ts.pageForm(b, id)
	enc := vals.Encode()
	b.ReportAllocs()
	for b.Loop() {
		rec := ts.do(b, http.MethodPost, "/r/"+id+"/preview", strings.NewReader(enc), "application/x-www-form-urlencoded")
		if rec.Code != http.StatusOK {
			b.Fatalf("preview: %d", rec.Code)
		}
	}
}

// BenchmarkBenchPageCached measures GET /r/{id} of a revision whose results are cached: load the
// revision, build the form and render the page around the kept diagrams and numbers.
func BenchmarkBenchPageCached(b *testing.B) { benchPage(b, 0) }

// BenchmarkBenchPageUncached is the same GET with the cache off, so every request recomputes the
// report, both drawings and the numbers; it is the baseline for the cached one.
func BenchmarkBenchPageUncached(b *testing.B) { benchPage(b, -1) }

func benchPage(b *testing.B, cacheEntries int) {
	mem := store.NewMem()
	ts := &testServer{Server: New(Config{Store: mem, AllowedHosts: testHosts, CacheEntries: cacheEntries}), mem: mem}
	id := ts.startDemo(b)
	var pageBytes int
	b.ReportAllocs()
	for b.Loop() {
		rec := ts.get(b, "/r/"+id)
		if rec.Code != http.StatusOK {
			b.Fatalf("page: %d", rec.Code)
		}
		pageBytes = rec.Body.Len()
	}
	b.ReportMetric(float64(pageBytes), "page-bytes")
}
