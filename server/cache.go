package server

import (
	"container/list"
	"sync"

	"raytable/web/view"
)

// defaultCacheEntries is how many revisions keep their computed results when Config does not say.
// One entry holds a bench, its report, the report's JSON and a few drawings: for the demo bench
// about 1-2 MB.
const defaultCacheEntries = 64

// defaultCacheBytes bounds the estimated size of all kept results when Config does not say
// (sizeOf): a handful of benches at the work budget (optics.MaxRayFaces), or all 64 entries of
// ordinary ones.
const defaultCacheBytes = 256 << 20

// revCache keeps what was computed for stored revisions: the decoded bench, the report, its JSON,
// the drawings and the laid-out results. A revision never changes, so nothing in it goes stale and there is no
// expiry; the cache is bounded by the number of revisions and forgets the least recently used one
// first, and by the estimated bytes of what it holds (sizeOf), forgetting the least recently used
// ones until the rest fit. Only stored revisions go in: a preview or a form with errors is not a revision and is
// computed every time.
//
// The cache lock guards the list and the map only. Each entry has its own lock, held while one of
// its values is computed, so two requests for the same revision compute it once and requests for
// different revisions do not wait for each other.
type revCache struct {
	mu       sync.Mutex
	max      int        // entries kept; 0 keeps none
	maxBytes int64      // estimated bytes kept over all entries
	bytes    int64      // estimated bytes of the entries kept now
	order    *list.List // of *revEntry, most recently used first
	byID     map[string]*list.Element
}

// revEntry is everything computed for one revision, by kind and drawing options.
type revEntry struct {
	id    string
	mu    sync.Mutex
	items map[artifact]any
	bytes int64 // estimated size of items; guarded by the cache's lock, not the entry's
}

// artifact names one computed value of a revision. Values that depend on drawing options carry
// them, so the side view with and without the paraxial overlay are two items.
type artifact struct {
	kind string // one of the art* constants
	opts view.DrawOptions
}

const (
	artBench      = "bench"       // *optics.Bench, read-only once kept
	artReport     = "report"      // *optics.Report
	artReportJSON = "report.json" // []byte
	artResult     = "result"      // view.Result, by opts
	artSideSVG    = "side.svg"    // []byte, by opts
	artTableSVG   = "table.svg"   // []byte
	artPlanSVG    = "plan.svg"    // []byte
)

// newRevCache makes a cache of at most max revisions and maxBytes estimated bytes; max <= 0 or
// maxBytes <= 0 keeps nothing.
func newRevCache(max int, maxBytes int64) *revCache {
	if max < 0 || maxBytes <= 0 {
		max = 0
	}
	return &revCache{max: max, maxBytes: maxBytes, order: list.New(), byID: map[string]*list.Element{}}
}

// entry returns the entry of a revision, making it the most recently used and forgetting the
// least recently used ones beyond the bound. With a bound of 0 it returns a fresh entry that is
// not kept.
func (c *revCache) entry(id string) *revEntry {
	c.mu.Lock()
	defer c.mu.Unlock()
	if el, ok := c.byID[id]; ok {
		c.order.MoveToFront(el)
		return el.Value.(*revEntry)
	}
	e := &revEntry{id: id, items: map[artifact]any{}}
	if c.max == 0 {
		return e
	}
	c.byID[id] = c.order.PushFront(e)
	c.evict()
	return e
}

// evict forgets the least recently used entries until both bounds hold. The caller holds c.mu.
func (c *revCache) evict() {
	for c.order.Len() > c.max || (c.bytes > c.maxBytes && c.order.Len() > 0) {
		last := c.order.Back()
		c.order.Remove(last)
		e := last.Value.(*revEntry)
		delete(c.byID, e.id)
		c.bytes -= e.bytes
	}
}

// grow counts n more bytes for an entry that was just given a value, when the entry is still
// kept, and forgets entries until the bound holds again: possibly this one, when its values alone
// are larger than the bound (it then serves the request at hand and is not kept).
func (c *revCache) grow(e *revEntry, n int64) {
	c.mu.Lock()
	defer c.mu.Unlock()
	if el, ok := c.byID[e.id]; !ok || el.Value != e {
		return
	}
	e.bytes += n
	c.bytes += n
	c.evict()
}

// size is the estimated bytes kept.
func (c *revCache) size() int64 {
	c.mu.Lock()
	defer c.mu.Unlock()
	return c.bytes
}

// len is the number of revisions kept.
func (c *revCache) len() int {
	c.mu.Lock()
	defer c.mu.Unlock()
	return c.order.Len()
}

// has reports whether a revision is kept, without touching its place in the order.
func (c *revCache) has(id string) bool {
	c.mu.Lock()
	defer c.mu.Unlock()
	_, ok := c.byID[id]
	return ok
}

// memo returns the value of one artifact of a revision, computing it on the first request.
// Errors are not kept: the next request tries again. compute must not call memo for the same
// revision (the entry lock is held while it runs); callers fetch what it needs first.
func memo[V any](c *revCache, id string, a artifact, compute func() (V, error)) (V, error) {
	e := c.entry(id)
	e.mu.Lock()
	defer e.mu.Unlock()
	if v, ok := e.items[a]; ok {
		return v.(V), nil
	}
	v, err := compute()
	if err != nil {
		return v, err
	}
	e.items[a] = v
	c.grow(e, sizeOf(v))
	return v, nil
}
