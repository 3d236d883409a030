package server

import (
	"net/http"
	"testing"
)

// maxPageBytes is the budget of the bench page of the demo with its inline SVGs (our own number).
const maxPageBytes = 300 << 10

// TestDemoPageSize keeps the demo's bench page, diagrams included, under the budget, and logs the
// size of each part (go test -v -run TestDemoPageSize).
func TestDemoPageSize(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	page := ts.get(t, "/r/"+id)
	if page.Code != http.StatusOK {
		t.Fatal(page.Code)
	}
	sizes := map[string]int{"page (with inline side and table views)": page.Body.Len()}
	for _, name := range []string{"side.svg", "table.svg", "plan.svg", "report.json", "view"} {
		rec := ts.get(t, "/r/"+id+"/"+name)
		sizes[name] = rec.Body.Len()
	}
	for k, v := range sizes {
		t.Logf("%-42s %7d bytes", k, v)
	}
	if page.Body.Len() > maxPageBytes {
		t.Errorf("bench page is %d bytes, budget %d", page.Body.Len(), maxPageBytes)
	}
	// The page embeds the two views; the printable plan is an image loaded only for print.
	if total := page.Body.Len() + sizes["plan.svg"]; total > maxPageBytes {
		t.Errorf("page and plan together are %d bytes, budget %d", total, maxPageBytes)
	}
}
