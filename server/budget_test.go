package server

import (
	"fmt"
	"net/http"
	"strings"
	"testing"
	"time"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/server/store"
)

// wideBench is a valid bench with the given numbers of field angles, wavelengths and fan rays and
// groups lens-iris-lens (five faces each) before its screen: a bench shaped to reach the work
// budget by one list or another.
func wideBench(fields, wavelengths, fanRays, groups int) string {
	var angles, waves, els []string
	for i := range fields {
		angles = append(angles, fmt.Sprintf("%g", 0.01*float64(i)))
	}
	for i := range wavelengths {
		waves = append(waves, fmt.Sprintf("%g", 450+20*float64(i)))
	}
	for i := range groups {
		els = append(els,
			fmt.Sprintf(`{"id":"L%da","type":"lens","gap_mm":20,"faces_mm":[100,null],"thicknesses_mm":[3],"materials":["fused-silica"],"diameter_mm":25.4}`, i),
			fmt.Sprintf(`{"id":"A%d","type":"aperture","gap_mm":20,"diameter_mm":20}`, i),
			fmt.Sprintf(`{"id":"L%db","type":"lens","gap_mm":20,"faces_mm":[null,-100],"thicknesses_mm":[3],"materials":["fused-silica"],"diameter_mm":25.4}`, i))
	}
	els = append(els, `{"id":"CAM","type":"screen","gap_mm":50}`)
	return fmt.Sprintf(`{"format":"raytable/bench/v1","title":"wide","wavelengths_nm":[%s],
		"table":{"grid":"none","width_mm":100000,"depth_mm":600,"beam_height_mm":75},
		"source":{"x_mm":10,"y_mm":300,"heading_deg":0,"kind":"collimated","semi_diameter_mm":2,
			"field_angles_deg":[%s],"fan_rays":%d,"beam":{"waist_radius_mm":0.5}},
		"elements":[%s]}`, strings.Join(waves, ","), strings.Join(angles, ","), fanRays, strings.Join(els, ","))
}

// largestBenches are benches just within the work budget, each by another list: every field
// angle and wavelength on a short line, a middle one, and the longest line with few rays (README
// "Limits and who can see what"). Each takes as many fan rays as the budget leaves.
var largestBenches = []struct {
	name                       string
	fields, wavelengths, group int
}{
	{"16 fields, 16 wavelengths, 16 faces", 16, 16, 3},
	{"4 fields, 2 wavelengths, 246 faces", 4, 2, 49},
	{"1 field, 1 wavelength, 331 faces (199 elements)", 1, 1, 66},
}

// budgetFan is the most fan rays (at most optics.MaxFanRays) that keep a wideBench within the
// budget: each group has five faces, the screen one.
func budgetFan(fields, wavelengths, groups int) int {
	return min(optics.MaxFanRays, optics.MaxRayFaces/(fields*wavelengths*(5*groups+1)))
}

// newTestServerWith is newTestServer with more of Config set.
func newTestServerWith(tb testing.TB, cfg Config) *testServer {
	tb.Helper()
	mem := store.NewMem()
	clock := time.Date(2026, 3, 1, 9, 0, 0, 0, time.UTC)
	cfg.Store, cfg.Now = mem, func() time.Time { clock = clock.Add(time.Second); return clock }
	if cfg.AllowedHosts == nil {
		cfg.AllowedHosts = testHosts
	}
	return &testServer{Server: New(cfg), mem: mem}
}

func decodeOrFail(tb testing.TB, js string) *optics.Bench {
	tb.Helper()
	b, err := optics.Decode([]byte(js))
	if err != nil {
		tb.Fatal(err)
	}
	return b
}

// BenchmarkLargestAllowedBench is the cost of one view of a bench at the work budget: import,
// then the page, the report JSON and the three drawings, each computed afresh (no cache).
func BenchmarkLargestAllowedBench(b *testing.B) {
	for _, tc := range largestBenches {
		b.Run(tc.name, func(b *testing.B) {
			js := wideBench(tc.fields, tc.wavelengths, budgetFan(tc.fields, tc.wavelengths, tc.group), tc.group)
			n := analysis.RayFaces(decodeOrFail(b, js))
			if n > optics.MaxRayFaces || n < optics.MaxRayFaces*6/10 {
				b.Fatalf("%d ray-faces: not just within the budget %d", n, optics.MaxRayFaces)
			}
			ts := newTestServerWith(b, Config{CacheEntries: -1})
			rec := ts.do(b, http.MethodPost, "/import", strings.NewReader(js), "application/json")
			id := redirectID(b, rec)
			b.ReportAllocs()
			for b.Loop() {
				for _, u := range []string{"/r/" + id, "/r/" + id + "/report.json", "/r/" + id + "/side.svg", "/r/" + id + "/table.svg", "/r/" + id + "/plan.svg"} {
					if rec := ts.get(b, u); rec.Code != http.StatusOK {
						b.Fatalf("GET %s: %d %s", u, rec.Code, truncate(rec.Body.String(), 300))
					}
				}
			}
			b.ReportMetric(float64(n), "ray-faces")
		})
	}
}

// TestComputeLimits: through the server, a bench over the work budget answers 422 with the
// budget's message, and a heavy bench past a 1 ms deadline 503 with a message saying what to
// reduce; the server goes on answering.
func TestComputeLimits(t *testing.T) {
	ts := newTestServerWith(t, Config{ComputeDeadline: time.Millisecond})
	heavy := largestBenches[0] // 24,576 rays: a deadline check every fan
	heavyID := redirectID(t, ts.do(t, http.MethodPost, "/import",
		strings.NewReader(wideBench(heavy.fields, heavy.wavelengths, budgetFan(heavy.fields, heavy.wavelengths, heavy.group), heavy.group)), "application/json"))
	// A bench over the budget is refused before it is stored: it could never be shown.
	n := ts.count(t)
	if rec := ts.do(t, http.MethodPost, "/import", strings.NewReader(wideBench(16, 16, 201, 3)), "application/json"); rec.Code != http.StatusUnprocessableEntity ||
		!strings.Contains(rec.Body.String(), "at most 25,000 are allowed") || ts.count(t) != n {
		t.Errorf("import over the budget: %d, stored %d, want 422 naming the budget and nothing stored: %s", rec.Code, ts.count(t)-n, truncate(rec.Body.String(), 300))
	}
	cases := []struct {
		target string
		status int
		want   string
	}{
		{"/r/" + heavyID, http.StatusServiceUnavailable, "took longer than raytable allows"},
		{"/r/" + heavyID + "/side.svg", http.StatusServiceUnavailable, "fewer field angles"},
		{"/r/" + heavyID + "/bench.json", http.StatusOK, `"title": "wide"`},
		{"/", http.StatusOK, "demo"},
	}
	for _, tc := range cases {
		rec := ts.get(t, tc.target)
		if rec.Code != tc.status || !strings.Contains(rec.Body.String(), tc.want) {
			t.Errorf("GET %s: %d, want %d with %q; body %s", tc.target, rec.Code, tc.status, tc.want, truncate(rec.Body.String(), 300))
		}
	}
	if got := ts.cache.size(); got != benchBytes {
		t.Errorf("the cache holds %d bytes, want %d: the decoded bench, no failed computation", got, benchBytes)
	}
}
