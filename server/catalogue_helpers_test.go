package server

import (
	"bytes"
	"encoding/json"
	"fmt"
	"html"
	"maps"
	"strings"
	"testing"

	nethtml "golang.org/x/net/html"

	"raytable/server/demo"
)

// demoWith is the demo bench file with change applied to its decoded JSON object: a quick way to
// write one bad or heavy value into an otherwise valid bench.
func demoWith(t testing.TB, change func(b map[string]any)) []byte {
	t.Helper()
	var b map[string]any
	if err := json.Unmarshal(demo.Bench, &b); err != nil {
		t.Fatal(err)
	}
	change(b)
	data, err := json.Marshal(b)
	if err != nil {
		t.Fatal(err)
	}
	return data
}

// demoSource and demoElement reach into the decoded demo bench.
func demoSource(b map[string]any) map[string]any { return b["source"].(map[string]any) }

func demoElement(b map[string]any, i int) map[string]any {
	return b["elements"].([]any)[i].(map[string]any)
}

// manyElements is n copies of a thin lens, each with its own id, 10 mm apart.
func manyElements(n int) []any {
	out := make([]any, n)
	for i := range out {
		out[i] = map[string]any{"id": fmt.Sprintf("T%d", i), "type": "thin-lens", "gap_mm": 10, "focal_mm": 1000, "diameter_mm": 25.4}
	}
	return out
}

// explicitRays is n explicit rays spread over ±1 mm.
func explicitRays(n int) []any {
	out := make([]any, n)
	for i := range out {
		out[i] = map[string]any{"height_mm": -1 + 2*float64(i)/float64(max(n-1, 1)), "angle_deg": 0}
	}
	return out
}

// nested is depth levels of JSON arrays around a number.
func nested(depth int) string { return strings.Repeat("[", depth) + "1" + strings.Repeat("]", depth) }

// messageText is what a response says, as a reader sees it: the error and problems of a JSON
// answer, or the unescaped text of a page.
func messageText(contentType string, body []byte) string {
	if strings.HasPrefix(contentType, "application/json") {
		var e jsonError
		if json.Unmarshal(body, &e) == nil {
			lines := []string{e.Error}
			for _, p := range e.Problems {
				lines = append(lines, p.String())
			}
			return strings.Join(lines, "\n")
		}
	}
	doc, err := nethtml.Parse(bytes.NewReader(body))
	if err != nil {
		return string(body)
	}
	// A page says what is wrong in its error message, beside each field, or in a list of problems.
	said := findAll(doc, func(n *nethtml.Node) bool {
		id, _ := attr(n, "data-testid")
		return strings.Contains(id, "error") || strings.Contains(id, "problem")
	})
	if len(said) == 0 {
		return html.UnescapeString(string(body))
	}
	lines := make([]string, len(said))
	for i, n := range said {
		lines[i] = text(n)
	}
	return strings.Join(lines, "\n")
}

// withHeaders is a copy of base with more headers set.
func withHeaders(base map[string]string, kv ...string) map[string]string {
	out := maps.Clone(base)
	if out == nil {
		out = map[string]string{}
	}
	for i := 0; i+1 < len(kv); i += 2 {
		out[kv[i]] = kv[i+1]
	}
	return out
}
