package view

import (
	"bytes"
	"context"
	"strings"
	"testing"

	"golang.org/x/net/html"
)

func parse(t *testing.T, s string) *html.Node {
	t.Helper()
	doc, err := html.Parse(strings.NewReader(s))
	if err != nil {
		t.Fatal(err)
	}
	return doc
}

func walk(n *html.Node, f func(*html.Node)) {
	f(n)
	for c := n.FirstChild; c != nil; c = c.NextSibling {
		walk(c, f)
	}
}

func attrOf(n *html.Node, key string) (string, bool) {
	for _, a := range n.Attr {
		if a.Key == key {
			return a.Val, true
		}
	}
	return "", false
}

// TestUserTextIsEscaped puts markup into every text a user controls; none of it may become an element.
func TestUserTextIsEscaped(t *testing.T) {
	evil := `<script>alert(1)</script><img src=x onerror=alert(2)>`
	var buf bytes.Buffer
	err := Error(ErrorPage{Status: 422, Title: evil, Message: evil, Problems: []string{evil}}).Render(context.Background(), &buf)
	if err != nil {
		t.Fatal(err)
	}
	doc := parse(t, buf.String())
	walk(doc, func(n *html.Node) {
		if n.Type != html.ElementNode {
			return
		}
		if n.Data == "img" {
			t.Error("user text became an <img> element")
		}
		if n.Data == "script" {
			if src, _ := attrOf(n, "src"); src != "/static/raytable.js" {
				t.Error("user text became a <script> element")
			}
		}
	})
	if !strings.Contains(buf.String(), "&lt;script&gt;") {
		t.Error("the markup is not shown as text")
	}
}

// TestFieldMarksItsError checks a field with a problem: the input keeps the typed value, carries
// aria-invalid, and the message sits beside it.
func TestFieldMarksItsError(t *testing.T) {
	var buf bytes.Buffer
	f := Field{Name: "elements[1].gap_mm", Label: "gap", Value: "abc", Error: `"abc" is not a length`, Unit: "mm"}
	if err := field(f).Render(context.Background(), &buf); err != nil {
		t.Fatal(err)
	}
	doc := parse(t, buf.String())
	var input, msg *html.Node
	walk(doc, func(n *html.Node) {
		if n.Type == html.ElementNode && n.Data == "input" {
			input = n
		}
		if v, _ := attrOf(n, "data-testid"); v == "field-error" {
			msg = n
		}
	})
	if input == nil || msg == nil {
		t.Fatal("missing input or message")
	}
	if v, _ := attrOf(input, "value"); v != "abc" {
		t.Errorf("input value %q, want the typed abc", v)
	}
	if v, _ := attrOf(input, "name"); v != "elements[1].gap_mm" {
		t.Errorf("input name %q, want the JSON path", v)
	}
	// WAI-ARIA: only the value "true" marks a field invalid; an empty value counts as false.
	if v, _ := attrOf(input, "aria-invalid"); v != "true" {
		t.Errorf("input aria-invalid = %q, want true", v)
	}
	// The field points at its message, so a screen reader reads the rule with the field.
	if v, _ := attrOf(input, "aria-describedby"); v == "" || v != attrOrEmpty(msg, "id") {
		t.Errorf("input aria-describedby = %q, message id = %q", v, attrOrEmpty(msg, "id"))
	}
	if msg.FirstChild == nil || msg.FirstChild.Data != `"abc" is not a length` {
		t.Errorf("message %v", msg.FirstChild)
	}

	buf.Reset()
	if err := field(Field{Name: "elements[0]._type_shown", Value: "lens", Kind: "hidden"}).Render(context.Background(), &buf); err != nil {
		t.Fatal(err)
	}
	if got := buf.String(); got != `<input type="hidden" name="elements[0]._type_shown" value="lens">` {
		t.Errorf("hidden field rendered as %s", got)
	}
}

func attrOrEmpty(n *html.Node, name string) string {
	v, _ := attrOf(n, name)
	return v
}
