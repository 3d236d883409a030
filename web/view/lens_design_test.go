package view

import (
	"bytes"
	"context"
	"testing"

	"golang.org/x/net/html"

	"raytable/optics/analysis"
	"raytable/optics/benchtest"
)

// A bench with a beam folds its lens-design tables into a closed details element after the
// warnings (it opens without a script); a bench without one shows every table open, as before.
func TestLensDesignFolded(t *testing.T) {
	for _, c := range []struct {
		bench  string
		folded bool
	}{{"demo-bench.json", true}, {"relay-bench.json", false}} {
		r := analysis.RunValid(benchtest.Load(t, c.bench))
		var buf bytes.Buffer
		if err := ResultFragment(Result{Numbers: NumbersPanel(r)}).Render(context.Background(), &buf); err != nil {
			t.Fatal(err)
		}
		var details *html.Node
		systemInside := false
		walk(parse(t, buf.String()), func(n *html.Node) {
			if v, _ := attrOf(n, "data-testid"); v == "lens-design" {
				details = n
				walk(n, func(m *html.Node) {
					if v, _ := attrOf(m, "data-testid"); v == "system-values" {
						systemInside = true
					}
				})
			}
		})
		if got := details != nil; got != c.folded {
			t.Fatalf("%s: lens-design part present %v, want %v", c.bench, got, c.folded)
		}
		if c.folded {
			if _, open := attrOf(details, "open"); open || details.Data != "details" || !systemInside {
				t.Errorf("%s: want a closed <details> holding the system values, got <%s> open=%v system=%v", c.bench, details.Data, open, systemInside)
			}
		}
	}
}
