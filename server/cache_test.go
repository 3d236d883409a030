package server

import (
	"bytes"
	"errors"
	"net/http"
	"runtime"
	"sync"
	"sync/atomic"
	"testing"
	"time"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/server/store"
	"raytable/web/view"
)

// countingServer is a test server whose analysis counts its calls.
type countingServer struct {
	*testServer
	calls atomic.Int64
}

func newCountingServer(t testing.TB, entries int) *countingServer {
	t.Helper()
	cs := &countingServer{}
	mem := store.NewMem()
	clock := time.Date(2026, 3, 1, 9, 0, 0, 0, time.UTC)
	s := New(Config{
		Store:        mem,
		AllowedHosts: testHosts,
		Now:          func() time.Time { clock = clock.Add(time.Second); return clock },
		CacheEntries: entries,
		Analyze: func(b *optics.Bench) (*optics.Report, error) {
			cs.calls.Add(1)
			return analysis.Run(b)
		},
	})
	cs.testServer = &testServer{Server: s, mem: mem}
	return cs
}

// mustGet checks a 200 and returns the body.
func (cs *countingServer) mustGet(t *testing.T, target string) []byte {
	t.Helper()
	rec := cs.get(t, target)
	if rec.Code != http.StatusOK {
		t.Fatalf("GET %s: %d", target, rec.Code)
	}
	return rec.Body.Bytes()
}

// revisionRoutes are the GETs whose answer is computed from one stored revision.
func revisionRoutes(id string) []string {
	base := "/r/" + id
	return []string{
		base, base + "?paraxial=1", base + "/view", base + "/view?paraxial=1",
		base + "/side.svg", base + "/side.svg?paraxial=1", base + "/table.svg", base + "/plan.svg",
		base + "/report.json", "/compare?a=" + id + "&b=" + id,
	}
}

func TestCacheAnalyzesARevisionOnce(t *testing.T) {
	cs := newCountingServer(t, 0)
	id := cs.startDemo(t)
	for round := 1; round <= 2; round++ {
		for _, target := range revisionRoutes(id) {
			cs.mustGet(t, target)
			if got := cs.calls.Load(); got != 1 {
				t.Fatalf("round %d, GET %s: analysis ran %d times in all, want 1", round, target, got)
			}
		}
	}
}

// A cached answer must be byte for byte what the server computes without a cache.
func TestCachedAnswersMatchUncached(t *testing.T) {
	cs := newCountingServer(t, 0)
	id := cs.startDemo(t)
	fresh := &testServer{Server: New(Config{Store: cs.mem, AllowedHosts: testHosts, CacheEntries: -1}), mem: cs.mem}
	for _, target := range revisionRoutes(id) {
		cs.mustGet(t, target) // fills the cache
		cached := cs.mustGet(t, target)
		rec := fresh.get(t, target)
		if rec.Code != http.StatusOK {
			t.Fatalf("uncached GET %s: %d", target, rec.Code)
		}
		if !bytes.Equal(cached, rec.Body.Bytes()) {
			t.Errorf("GET %s: cached answer (%d bytes) differs from a fresh one (%d bytes)", target, len(cached), rec.Body.Len())
		}
	}
	if fresh.cache.len() != 0 {
		t.Errorf("CacheEntries -1 kept %d revisions, want none", fresh.cache.len())
	}
}

// A preview is an unsaved bench: it is computed on every request and never enters the cache. A
// rejected edit shows the stored revision's result, which the cache supplies.
func TestPreviewIsNotCached(t *testing.T) {
	cs := newCountingServer(t, 0)
	id := cs.startDemo(t)
	vals := cs.pageForm(t, id) // GET /r/{id}: one analysis
	for i := 1; i <= 3; i++ {
		rec := cs.postForm(t, "/r/"+id+"/preview", vals)
		if rec.Code != http.StatusOK {
			t.Fatalf("preview: %d", rec.Code)
		}
		if got, want := cs.calls.Load(), int64(1+i); got != want {
			t.Fatalf("after %d previews analysis ran %d times, want %d", i, got, want)
		}
	}
	if n := cs.cache.len(); n != 1 {
		t.Errorf("cache holds %d revisions after previews, want 1 (the stored one)", n)
	}
	bad := cs.pageForm(t, id)
	bad.Set("elements[2].gap_mm", "not a number")
	bad.Set("action", "save")
	before := cs.calls.Load()
	if rec := cs.postForm(t, "/r/"+id+"/edit", bad); rec.Code != http.StatusUnprocessableEntity {
		t.Fatalf("bad edit: %d, want 422", rec.Code)
	}
	if got := cs.calls.Load(); got != before {
		t.Errorf("a rejected edit ran the analysis %d times; the stored result is cached", got-before)
	}
}

func TestCacheEvictsBeyondBound(t *testing.T) {
	const bound = 2
	cs := newCountingServer(t, bound)
	a, b, c := cs.startDemo(t), cs.startDemo(t), cs.startDemo(t)
	steps := []struct {
		id    string
		calls int64 // analyses in all after the GET
	}{
		{a, 1}, {b, 2}, {c, 3}, // a is forgotten when c comes in
		{c, 3}, {b, 3}, // both kept; b is now the most recent
		{a, 4}, // computed again; c, the least recent, goes
		{b, 4}, {c, 5},
	}
	for i, st := range steps {
		cs.mustGet(t, "/r/"+st.id+"/report.json")
		if got := cs.calls.Load(); got != st.calls {
			t.Fatalf("step %d (GET %s): analysis ran %d times in all, want %d", i, st.id, got, st.calls)
		}
		if n := cs.cache.len(); n > bound {
			t.Fatalf("step %d: cache holds %d revisions, bound %d", i, n, bound)
		}
	}
	if cs.cache.has(a) || !cs.cache.has(b) || !cs.cache.has(c) {
		t.Errorf("kept a=%v b=%v c=%v, want b and c", cs.cache.has(a), cs.cache.has(b), cs.cache.has(c))
	}
}

func TestRevCacheOrder(t *testing.T) {
	c := newRevCache(2, defaultCacheBytes)
	ea := c.entry("a")
	c.entry("b")
	if c.entry("a") != ea {
		t.Fatal("a second entry() for a kept id gave a new entry")
	}
	c.entry("c") // b is the least recently used
	if !c.has("a") || c.has("b") || !c.has("c") || c.len() != 2 {
		t.Errorf("after a, b, a, c with bound 2: a=%v b=%v c=%v len=%d, want a and c", c.has("a"), c.has("b"), c.has("c"), c.len())
	}
	for _, max := range []int{0, -1} {
		none := newRevCache(max, defaultCacheBytes)
		none.entry("a")
		if none.len() != 0 || none.has("a") {
			t.Errorf("bound %d kept an entry", max)
		}
	}
}

func TestMemoKeepsValuesNotErrors(t *testing.T) {
	c := newRevCache(4, defaultCacheBytes)
	calls := 0
	fail := errors.New("boom")
	compute := func() (int, error) {
		calls++
		if calls == 1 {
			return 0, fail
		}
		return 42, nil
	}
	a := artifact{kind: artReport}
	if _, err := memo(c, "x", a, compute); !errors.Is(err, fail) {
		t.Fatalf("first call: err %v, want %v", err, fail)
	}
	for range 2 {
		v, err := memo(c, "x", a, compute)
		if err != nil || v != 42 {
			t.Fatalf("memo = %v, %v; want 42, nil", v, err)
		}
	}
	if calls != 2 {
		t.Errorf("compute ran %d times, want 2 (the error is not kept)", calls)
	}
	// The same kind with other drawing options is another value.
	other := artifact{kind: artReport, opts: view.DrawOptions{Paraxial: true}}
	if _, err := memo(c, "x", other, compute); err != nil || calls != 3 {
		t.Errorf("other options: err %v, calls %d; want a fresh computation", err, calls)
	}
}

// Many requests for one revision at once analyse it once: the entry lock is held while the report
// is computed. Run with -race.
func TestCacheConcurrentRequests(t *testing.T) {
	cs := newCountingServer(t, 0)
	ids := []string{cs.startDemo(t), cs.startDemo(t)}
	var wg sync.WaitGroup
	for i := range 16 {
		wg.Go(func() {
			id := ids[i%2]
			for _, target := range revisionRoutes(id)[:5] {
				if rec := cs.get(t, target); rec.Code != http.StatusOK {
					t.Errorf("GET %s: %d", target, rec.Code)
				}
			}
		})
	}
	wg.Wait()
	if got := cs.calls.Load(); got != 2 {
		t.Errorf("two revisions under concurrent load analysed %d times, want 2", got)
	}
}

// TestCacheByteBound: the cache forgets the least recently used revisions once the estimated
// bytes pass its bound, and keeps no revision whose values alone pass it.
func TestCacheByteBound(t *testing.T) {
	c := newRevCache(10, 1000)
	put := func(id string, n int) {
		if _, err := memo(c, id, artifact{kind: artReportJSON}, func() ([]byte, error) { return make([]byte, n), nil }); err != nil {
			t.Fatal(err)
		}
	}
	steps := []struct {
		id    string
		bytes int
		kept  []string
		size  int64
	}{
		{"a", 400, []string{"a"}, 400},
		{"b", 400, []string{"a", "b"}, 800},
		{"c", 400, []string{"b", "c"}, 800}, // 1200 > 1000: a, the least recently used, goes
		{"d", 1001, []string{}, 0},          // larger than the bound alone: nothing else can stay beside it
		{"e", 1000, []string{"e"}, 1000},
	}
	for _, s := range steps {
		put(s.id, s.bytes)
		for _, id := range s.kept {
			if !c.has(id) {
				t.Errorf("after %s: %s was forgotten", s.id, id)
			}
		}
		if c.len() != len(s.kept) || c.size() != s.size {
			t.Errorf("after %s: %d entries of %d bytes, want %d of %d", s.id, c.len(), c.size(), len(s.kept), s.size)
		}
	}
}

// TestCacheSizeEstimate compares the estimate of a report's bytes with the heap it takes, on a
// bench at the work budget (measured; the estimate is to bound memory, so it must not fall far
// below the truth, nor lie far above it).
func TestCacheSizeEstimate(t *testing.T) {
	tc := largestBenches[1]
	b := decodeOrFail(t, wideBench(tc.fields, tc.wavelengths, budgetFan(tc.fields, tc.wavelengths, tc.group), tc.group))
	// Four reports kept at once, so that what the collector frees of earlier work while they are
	// computed counts a quarter.
	const held = 4
	var before, after runtime.MemStats
	runtime.GC()
	runtime.GC()
	runtime.ReadMemStats(&before)
	reps := make([]*optics.Report, held)
	for i := range reps {
		reps[i] = analysis.RunValid(b)
	}
	runtime.GC()
	runtime.ReadMemStats(&after)
	runtime.KeepAlive(reps)
	measured := (int64(after.HeapAlloc) - int64(before.HeapAlloc)) / held
	estimate := sizeOf(reps[0])
	t.Logf("report of %d ray-faces: estimate %d bytes, heap %d bytes", analysis.RayFaces(b), estimate, measured)
	if estimate < measured*2/3 || estimate > measured*2 {
		t.Errorf("estimate %d bytes, measured %d: not within -33%%/+100%%", estimate, measured)
	}
}
