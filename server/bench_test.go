package server

import (
	"net/http"
	"net/url"
	"strconv"
	"strings"
	"testing"
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
