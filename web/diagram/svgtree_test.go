package diagram

import (
	"bytes"
	"encoding/xml"
	"strconv"
	"strings"
	"testing"
)

// xnode is a parsed SVG element, enough to count and inspect what a drawing contains.
type xnode struct {
	XMLName  xml.Name
	Attrs    []xml.Attr `xml:",any,attr"`
	Children []xnode    `xml:",any"`
	Text     string     `xml:",chardata"`
}

// parseSVG parses a drawing strictly (a document that is not well-formed XML fails the test).
func parseSVG(t *testing.T, data []byte) xnode {
	t.Helper()
	var root xnode
	d := xml.NewDecoder(bytes.NewReader(data))
	d.Strict = true
	if err := d.Decode(&root); err != nil {
		t.Fatalf("not well-formed SVG: %v\n%s", err, data)
	}
	if root.XMLName.Local != "svg" || root.XMLName.Space != "http://www.w3.org/2000/svg" {
		t.Fatalf("root is %v, want svg in the SVG namespace", root.XMLName)
	}
	return root
}

func (n xnode) attr(name string) string {
	for _, a := range n.Attrs {
		if a.Name.Local == name {
			return a.Value
		}
	}
	return ""
}

func (n xnode) num(t *testing.T, name string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(strings.TrimSuffix(n.attr(name), "mm"), 64)
	if err != nil {
		t.Fatalf("<%s %s=%q>: %v", n.XMLName.Local, name, n.attr(name), err)
	}
	return v
}

// all returns every descendant (and n itself) for which keep is true, in document order.
func (n xnode) all(keep func(xnode) bool) []xnode {
	var out []xnode
	var walk func(xnode)
	walk = func(m xnode) {
		if keep(m) {
			out = append(out, m)
		}
		for _, c := range m.Children {
			walk(c)
		}
	}
	walk(n)
	return out
}

// byClass returns the elements with the given class attribute.
func (n xnode) byClass(class string) []xnode {
	return n.all(func(m xnode) bool { return m.attr("class") == class })
}

// count counts descendants named tag under every element of the given class.
func (n xnode) count(class, tag string) int {
	c := 0
	for _, g := range n.byClass(class) {
		c += len(g.all(func(m xnode) bool { return m.XMLName.Local == tag }))
	}
	return c
}

// texts returns the content of every <text> element.
func (n xnode) texts() []string {
	var out []string
	for _, m := range n.all(func(m xnode) bool { return m.XMLName.Local == "text" }) {
		out = append(out, m.Text)
	}
	return out
}

func hasText(n xnode, s string) bool {
	for _, t := range n.texts() {
		if t == s {
			return true
		}
	}
	return false
}
