package server

import (
	"net/http"
	"strings"
	"testing"

	"golang.org/x/net/html"
)

// TestCompareBranchingPairsArms compares a Michelson with the same design whose second end mirror
// sits 0.25 mm further out: the compare page pairs the arms by id, and the path difference at the
// splitter changes by twice the move (definition of the Michelson's path difference).
func TestCompareBranchingPairsArms(t *testing.T) {
	ts := newTestServer(t)
	a := redirectID(t, ts.do(t, http.MethodPost, "/import", readFile(t, "../testdata/michelson-bench.json"), "application/json"))
	vals := ts.pageForm(t, a)
	vals.Set("elements[0].reflected[0].gap_mm", "100.5") // out to the mirror
	vals.Set("elements[0].reflected[1].gap_mm", "100.5") // and back to the splitter
	vals.Set("action", "save")
	b := redirectID(t, ts.postForm(t, "/r/"+a+"/edit", vals))

	rec := ts.get(t, "/compare?a="+a+"&b="+b)
	if rec.Code != http.StatusOK {
		t.Fatalf("compare: status %d", rec.Code)
	}
	rows := map[string][3]string{}
	for _, tr := range findAll(parseHTML(t, rec.Body.Bytes()), func(n *html.Node) bool { return n.Type == html.ElementNode && n.Data == "tr" }) {
		var cells []string
		for c := tr.FirstChild; c != nil; c = c.NextSibling {
			if c.Type == html.ElementNode {
				cells = append(cells, strings.TrimSpace(text(c)))
			}
		}
		if len(cells) == 4 {
			rows[cells[0]] = [3]string{cells[1], cells[2], cells[3]}
		}
	}
	find := func(parts ...string) [3]string {
		t.Helper()
		for label, v := range rows {
			ok := true
			for _, p := range parts {
				ok = ok && strings.Contains(label, p)
			}
			if ok {
				return v
			}
		}
		t.Fatalf("no compare row with %q among %d rows", parts, len(rows))
		return [3]string{}
	}
	// The reflected arm runs 2 × 0.25 mm further: 550.5 -> 551 mm (definition).
	if got := find("BS1.reflected", "optical path"); got[0] != "550.5" || got[1] != "551" {
		t.Errorf("BS1.reflected optical path %v, want 550.5 -> 551", got)
	}
	if got := find("BS1", "OPD"); got[0] != "-0.5" || got[1] != "-1" {
		t.Errorf("OPD at BS1 %v, want -0.5 -> -1 mm", got)
	}
}
