package server

import (
	"net/http"
	"strings"
	"testing"

	"golang.org/x/net/html"

	"raytable/optics"
)

func TestHistory(t *testing.T) {
	ts := newTestServer(t)
	first := ts.startDemo(t)
	b, _ := ts.bench(t, first)
	vals := ts.pageForm(t, first)
	vals.Set("elements[2].gap_mm", "160")
	second := redirectID(t, ts.postForm(t, "/r/"+first+"/edit", vals))
	vals = ts.pageForm(t, second)
	vals.Set("action", "delete:1")
	third := redirectID(t, ts.postForm(t, "/r/"+second+"/edit", vals))

	rec := ts.get(t, "/r/"+third+"/history")
	if rec.Code != http.StatusOK {
		t.Fatalf("history: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	steps := testIDs(doc, "history-step")
	if len(steps) != 3 {
		t.Fatalf("%d steps, want 3", len(steps))
	}
	wantIDs := []string{third, second, first}
	wantChange := []string{"removed " + b.Elements[1].ID, b.Elements[2].ID + " gap_mm " + optics.FormatNumber(b.Elements[2].GapMM) + " -> 160", ""}
	for i, s := range steps {
		if got, _ := attr(s, "data-revision"); got != wantIDs[i] {
			t.Errorf("step %d is %s, want %s", i, got, wantIDs[i])
		}
		var changes []string
		for _, c := range testIDs(s, "change") {
			changes = append(changes, text(c))
		}
		if wantChange[i] == "" {
			if len(changes) != 0 || len(testIDs(s, "history-compare")) != 0 {
				t.Errorf("first step lists changes %v or a compare link", changes)
			}
			continue
		}
		if !contains(changes, wantChange[i]) {
			t.Errorf("step %d changes %q, want %q among them", i, changes, wantChange[i])
		}
		cmp := testIDs(s, "history-compare")
		if href, _ := attr(cmp[0], "href"); len(cmp) != 1 || href != "/compare?a="+wantIDs[i+1]+"&b="+wantIDs[i] {
			t.Errorf("step %d compare link %q", i, href)
		}
	}
}

func contains(xs []string, x string) bool {
	for _, v := range xs {
		if v == x {
			return true
		}
	}
	return false
}

func TestCompare(t *testing.T) {
	ts := newTestServer(t)
	a := ts.startDemo(t)
	vals := ts.pageForm(t, a)
	vals.Set("elements[2].gap_mm", "160")
	b := redirectID(t, ts.postForm(t, "/r/"+a+"/edit", vals))

	// The compare-with-parent link of the new revision.
	page := parseHTML(t, ts.get(t, "/r/"+b).Body.Bytes())
	link, _ := attr(one(t, page, "compare-parent-link"), "href")
	if link != "/compare?a="+a+"&b="+b {
		t.Fatalf("compare with parent link %q", link)
	}
	rec := ts.get(t, link)
	if rec.Code != http.StatusOK {
		t.Fatalf("compare: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	for _, side := range []string{"compare-A", "compare-B"} {
		n := one(t, doc, side)
		one(t, n, "side-view")
		one(t, n, "table-view")
	}
	rows := findAll(one(t, doc, "compare-table"), func(n *html.Node) bool { return n.Data == "tr" && n.Parent.Data == "tbody" })
	changed := 0
	var l2Path *html.Node
	for _, r := range rows {
		if _, ok := attr(r, "data-changed"); ok {
			changed++
		}
		if th := findAll(r, byTag("th")); len(th) == 1 && text(th[0]) == "L2 along the path (mm)" {
			l2Path = r
		}
	}
	if changed == 0 || changed == len(rows) {
		t.Errorf("%d of %d rows marked changed", changed, len(rows))
	}
	if l2Path == nil {
		t.Fatal("no row for L2's position along the path")
	}
	if _, ok := attr(l2Path, "data-changed"); !ok {
		t.Error("L2's path position is not marked changed")
	}

	// Both side views share one scale: the same width and viewBox.
	svgA := findAll(one(t, one(t, doc, "compare-A"), "side-view"), byTag("svg"))[0]
	svgB := findAll(one(t, one(t, doc, "compare-B"), "side-view"), byTag("svg"))[0]
	for _, k := range []string{"width", "height", "viewBox"} {
		va, _ := attr(svgA, k)
		vb, _ := attr(svgB, k)
		if va != vb {
			t.Errorf("side views differ in %s: %q vs %q", k, va, vb)
		}
	}

	// A design compared with itself has no changed number; pasted links work as well as ids.
	rec = ts.get(t, "/compare?a=http://example.org/r/"+a+"/view&b="+a)
	if got := text(one(t, parseHTML(t, rec.Body.Bytes()), "changed-count")); rec.Code != http.StatusOK || !strings.HasPrefix(got, "0 numbers differ") {
		t.Errorf("self compare: %d %q", rec.Code, got)
	}
	for _, tc := range []struct {
		query  string
		status int
	}{
		{"", http.StatusOK},
		{"?a=nonsense&b=" + a, http.StatusBadRequest},
		{"?a=" + strings.Repeat("a", 24) + "&b=" + a, http.StatusNotFound},
	} {
		rec := ts.get(t, "/compare"+tc.query)
		if rec.Code != tc.status {
			t.Errorf("compare%s: %d, want %d", tc.query, rec.Code, tc.status)
		}
		one(t, parseHTML(t, rec.Body.Bytes()), "compare-form")
	}
}
