package optics

import (
	"cmp"
	"fmt"
	"reflect"
	"strconv"
	"strings"
)

// Diff lists what changed from old to new, one plain line per change, for the history of a design:
//
//	title changed
//	wavelengths_nm 632.8 -> 632.8, 532
//	source.semi_diameter_mm 1 -> 1.5
//	added material my-glass
//	removed A1
//	added F3 (thin-lens) at position 4
//	moved M2 from 5 to 3
//	moved M3 to after L4   (when its position number did not change)
//	L2 gap_mm 150 -> 162.5
//
// Elements are matched by id. Positions are counted from 1 in the element list. An element counts
// as moved only when its order relative to the other kept elements changed (the elements outside a
// longest common subsequence of the two orders), so inserting or removing one element does not
// make every later one "moved". Lines come in a fixed order: format, title, notes, wavelengths,
// table, source, materials, then removed, added, moved and changed elements. A nil bench is empty.
// Diff does not require valid benches and never panics.
//
// Every field is compared, without a list of them here: the differ walks the two benches by
// reflection, field by field in struct order, and shows each value by its Go type (a number, a
// list, face radii, names, a mount's size, ...). The field tables (fields.go, kinds.go) say what an
// absent value reads as ("none", "flat", "default" or the default value) and which text is prose
// that the history only says changed. So a new field of a bench type is in the history as soon as
// it is in its struct and table; a test changes every field alone and expects a line.
func Diff(old, new *Bench) []string {
	if old == nil {
		old = &Bench{}
	}
	if new == nil {
		new = &Bench{}
	}
	d := &differ{}
	d.object(dotted(""), reflect.ValueOf(old).Elem(), reflect.ValueOf(new).Elem(), "")
	return d.lines
}

type differ struct{ lines []string }

func (d *differ) line(format string, args ...any) {
	d.lines = append(d.lines, fmt.Sprintf(format, args...))
}

func (d *differ) change(path, from, to string) {
	if from != to {
		d.line("%s %s -> %s", path, from, to)
	}
}

func (d *differ) str(path, a, b string) {
	if a != b {
		d.change(path, quoteIfOdd(a), quoteIfOdd(b))
	}
}

func (d *differ) num(path string, a, b float64) { d.change(path, fmtNum(a), fmtNum(b)) }

func (d *differ) optNum(path string, a, b *float64, none string) {
	d.change(path, optText(a, none), optText(b, none))
}

func (d *differ) nums(path string, a, b []float64) { d.change(path, numsText(a), numsText(b)) }

func optText(x *float64, none string) string {
	if x == nil {
		return none
	}
	return fmtNum(*x)
}

func numsText(xs []float64) string {
	if len(xs) == 0 {
		return "none"
	}
	parts := make([]string, len(xs))
	for i, x := range xs {
		parts[i] = fmtNum(x)
	}
	return strings.Join(parts, ", ")
}

// quoteIfOdd shows an empty or spaced string in quotes so that the line stays readable.
func quoteIfOdd(s string) string {
	if s == "" || strings.ContainsAny(s, " \t\n\"") {
		return fmt.Sprintf("%q", s)
	}
	return s
}

// dotted names the fields of an object at a JSON path: dotted("source")("na") is "source.na".
func dotted(path string) func(string) string {
	return func(key string) string { return field(path, key) }
}

// object compares two structs of one type field by field, in struct order; name makes each
// field's path, and skip is a key that is not compared (an element's id, by which it was matched).
func (d *differ) object(name func(string) string, a, b reflect.Value, skip string) {
	fields := fieldsOf(a.Type())
	for i := range a.NumField() {
		if inline(a.Type().Field(i)) { // a further source's source fields, named as its own
			d.object(name, a.Field(i), b.Field(i), skip)
			continue
		}
		key := tagKey(a.Type().Field(i))
		if key == skip {
			continue
		}
		f, _ := FieldByKey(fields, key)
		d.value(name(key), f, a.Field(i), b.Field(i))
	}
}

// value compares one field's two values, by their Go type.
func (d *differ) value(path string, f Field, a, b reflect.Value) {
	switch x := a.Interface().(type) {
	case string:
		y := b.String()
		if !f.Prose {
			d.str(path, x, y)
		} else if x != y {
			d.line("%s changed", path)
		}
	case float64:
		d.num(path, x, b.Float())
	case *float64:
		d.optNum(path, x, b.Interface().(*float64), f.absentText())
	case []float64:
		d.nums(path, x, b.Interface().([]float64))
	case []*float64:
		d.change(path, facesText(x), facesText(b.Interface().([]*float64)))
	case []string:
		d.change(path, namesText(x), namesText(b.Interface().([]string)))
	case *int:
		d.change(path, countText(x, f.absentText()), countText(b.Interface().(*int), f.absentText()))
	case *Mount: // one line: a mount is read as its size
		d.change(path, mountText(x), mountText(b.Interface().(*Mount)))
	case *SellmeierSpec: // a material's models compare as their fields, an absent one as empty
		y := b.Interface().(*SellmeierSpec)
		d.object(dotted(path), reflect.ValueOf(cmp.Or(x, &SellmeierSpec{})).Elem(), reflect.ValueOf(cmp.Or(y, &SellmeierSpec{})).Elem(), "")
	case map[string]MaterialSpec:
		d.materials(x, b.Interface().(map[string]MaterialSpec))
	case []Element:
		d.elements(path, x, b.Interface().([]Element))
	default:
		d.nested(path, a, b)
	}
}

// nested compares objects: a struct field by field, an optional one as added, removed or changed,
// a list of them item by item. Anything else that differs is one "changed" line.
func (d *differ) nested(path string, a, b reflect.Value) {
	switch {
	case a.Kind() == reflect.Struct:
		d.object(dotted(path), a, b, "")
	case a.Kind() == reflect.Pointer && a.Type().Elem().Kind() == reflect.Struct:
		switch {
		case a.IsNil() && !b.IsNil():
			d.line("added %s", path)
		case !a.IsNil() && b.IsNil():
			d.line("removed %s", path)
		case !a.IsNil():
			d.object(dotted(path), a.Elem(), b.Elem(), "")
		}
	case a.Kind() == reflect.Slice && a.Type().Elem().Kind() == reflect.Struct:
		for i := range max(a.Len(), b.Len()) {
			p := index(path, i)
			switch {
			case i >= a.Len():
				d.line("added %s", p)
			case i >= b.Len():
				d.line("removed %s", p)
			default:
				d.object(dotted(p), a.Index(i), b.Index(i), "")
			}
		}
	case !reflect.DeepEqual(a.Interface(), b.Interface()):
		d.line("%s changed", path)
	}
}

func (d *differ) materials(a, b map[string]MaterialSpec) {
	names := sortedKeys(a)
	for _, name := range sortedKeys(b) {
		if _, ok := a[name]; !ok {
			names = append(names, name)
		}
	}
	for _, name := range names {
		ma, inA := a[name]
		mb, inB := b[name]
		switch {
		case !inA:
			d.line("added material %s", quoteIfOdd(name))
		case !inB:
			d.line("removed material %s", quoteIfOdd(name))
		default:
			d.object(dotted(materialPath(name)), reflect.ValueOf(ma), reflect.ValueOf(mb), "")
		}
	}
}

// elements compares one element list; the main list's lines name no list, a reflected list's or a
// further source's say which ("added S3 (screen) at position 1 in BS1 reflected").
func (d *differ) elements(path string, a, b []Element) {
	in := ""
	if path != "elements" {
		in = " in " + path
	}
	posA, posB := firstPositions(a), firstPositions(b)
	for i, e := range a {
		if _, ok := posB[e.ID]; !ok || posA[e.ID] != i {
			d.line("removed %s%s", quoteIfOdd(e.ID), in)
		}
	}
	for i, e := range b {
		if _, ok := posA[e.ID]; !ok || posB[e.ID] != i {
			d.line("added %s (%s) at position %d%s", quoteIfOdd(e.ID), e.Type, i+1, in)
		}
	}
	// Kept elements, in old and in new order; those outside the longest common subsequence moved.
	var keptA, keptB []string
	for i, e := range a {
		if _, ok := posB[e.ID]; ok && posA[e.ID] == i {
			keptA = append(keptA, e.ID)
		}
	}
	for i, e := range b {
		if _, ok := posA[e.ID]; ok && posB[e.ID] == i {
			keptB = append(keptB, e.ID)
		}
	}
	stay := lcs(keptA, keptB)
	for _, id := range keptB {
		if stay[id] {
			continue
		}
		from, to := posA[id]+1, posB[id]+1
		switch {
		case from != to:
			d.line("moved %s from %d to %d%s", quoteIfOdd(id), from, to, in)
		case to == 1:
			d.line("moved %s to the front%s", quoteIfOdd(id), in)
		default: // same number, other neighbours: say where it went
			d.line("moved %s to after %s%s", quoteIfOdd(id), quoteIfOdd(b[to-2].ID), in)
		}
	}
	for _, id := range keptB {
		d.element(quoteIfOdd(id), &a[posA[id]], &b[posB[id]])
	}
}

// firstPositions maps each id to the index of its first element. Later elements with the same id
// (only in an invalid bench) are treated as unmatched.
func firstPositions(els []Element) map[string]int {
	pos := make(map[string]int, len(els))
	for i, e := range els {
		if _, dup := pos[e.ID]; !dup {
			pos[e.ID] = i
		}
	}
	return pos
}

// lcs returns the members of a longest common subsequence of two lists of distinct ids, by the
// textbook dynamic programme (O(len(a)·len(b)), at most 200² steps for a valid bench).
func lcs(a, b []string) map[string]bool {
	n, m := len(a), len(b)
	table := make([][]int, n+1)
	for i := range table {
		table[i] = make([]int, m+1)
	}
	for i := n - 1; i >= 0; i-- {
		for j := m - 1; j >= 0; j-- {
			if a[i] == b[j] {
				table[i][j] = table[i+1][j+1] + 1
			} else {
				table[i][j] = max(table[i+1][j], table[i][j+1])
			}
		}
	}
	keep := map[string]bool{}
	for i, j := 0, 0; i < n && j < m; {
		switch {
		case a[i] == b[j]:
			keep[a[i]] = true
			i++
			j++
		case table[i+1][j] >= table[i][j+1]:
			i++
		default:
			j++
		}
	}
	return keep
}

// element lists the field changes of one kept element, prefixed by its id.
func (d *differ) element(id string, a, b *Element) {
	d.object(func(key string) string { return id + " " + key }, reflect.ValueOf(a).Elem(), reflect.ValueOf(b).Elem(), "id")
}

func facesText(faces []*float64) string {
	if len(faces) == 0 {
		return "none"
	}
	parts := make([]string, len(faces))
	for i, r := range faces {
		parts[i] = optText(r, "flat")
	}
	return strings.Join(parts, ", ")
}

func namesText(names []string) string {
	if len(names) == 0 {
		return "none"
	}
	parts := make([]string, len(names))
	for i, n := range names {
		parts[i] = quoteIfOdd(n)
	}
	return strings.Join(parts, ", ")
}

func countText(n *int, none string) string {
	if n == nil {
		return none
	}
	return strconv.Itoa(*n)
}

func mountText(m *Mount) string {
	if m == nil {
		return "none"
	}
	return fmtNum(m.WidthMM) + " x " + fmtNum(m.DepthMM) + " mm"
}
