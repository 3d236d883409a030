package optics

// TEMPORARY: a minimal stand-in for the list-aware edits of optics/edit.go (ARMS.md, "Contracts
// between helpers") so that the web form builds before they land. The lead drops this file at
// merge in favour of the real ones; nothing else may depend on what it does beyond the signatures.

import (
	"strconv"
	"strings"
)

// listAt finds the element list at a JSON path: "elements", "elements[1].reflected",
// "more_sources[0].elements".
func listAt(b *Bench, list string) (*[]Element, bool) {
	segs := strings.Split(list, ".")
	cur := &b.Elements
	if k, ok := bracket(segs[0], "more_sources"); ok {
		if k >= len(b.MoreSources) || len(segs) < 2 {
			return nil, false
		}
		cur, segs = &b.MoreSources[k].Elements, segs[1:]
	}
	for n, s := range segs {
		name := "reflected"
		if n == 0 {
			name = "elements"
		}
		if s == name && n == len(segs)-1 {
			return cur, true
		}
		i, ok := bracket(s, name)
		if !ok || i >= len(*cur) || n == len(segs)-1 {
			return nil, false
		}
		cur = &(*cur)[i].Reflected
	}
	return nil, false
}

func bracket(seg, name string) (int, bool) {
	if !strings.HasPrefix(seg, name+"[") || !strings.HasSuffix(seg, "]") {
		return 0, false
	}
	i, err := strconv.Atoi(seg[len(name)+1 : len(seg)-1])
	return i, err == nil && i >= 0
}

// splitPath cuts an element path into its list and index: elements[1].reflected[0] ->
// elements[1].reflected, 0.
func splitPath(path string) (string, int, bool) {
	open := strings.LastIndex(path, "[")
	if open < 0 || !strings.HasSuffix(path, "]") {
		return "", 0, false
	}
	i, err := strconv.Atoi(path[open+1 : len(path)-1])
	return path[:open], i, err == nil && i >= 0
}

// ElementAt finds the element at a JSON path.
func ElementAt(b *Bench, path string) (*Element, bool) {
	list, i, ok := splitPath(path)
	if !ok {
		return nil, false
	}
	l, ok := listAt(b, list)
	if !ok || i >= len(*l) {
		return nil, false
	}
	return &(*l)[i], true
}

func allIDs(b *Bench) map[string]bool {
	used := map[string]bool{}
	var walk func([]Element)
	walk = func(es []Element) {
		for _, e := range es {
			used[e.ID] = true
			walk(e.Reflected)
		}
	}
	walk(b.Elements)
	for _, m := range b.MoreSources {
		used[m.ID] = true
		walk(m.Elements)
	}
	return used
}

// AddElementIn inserts a new element of a type into the list at a JSON path.
func AddElementIn(b *Bench, list string, typ string, at int) (string, error) {
	if _, ok := KindOf(typ); !ok {
		return "", Errorf(EInvalid, "unknown element type %q; choose one of %s", typ, strings.Join(KindTypes(), ", "))
	}
	l, ok := listAt(b, list)
	if !ok {
		return "", Errorf(EInvalid, "there is no element list %s", list)
	}
	if at < 0 || at > len(*l) {
		at = len(*l)
	}
	used := allIDs(b)
	k, _ := KindOf(typ)
	e := DefaultElement(typ)
	for n := 1; ; n++ {
		if id := k.IDPrefix + strconv.Itoa(n); !used[id] {
			e.ID = id
			break
		}
	}
	*l = append((*l)[:at], append([]Element{e}, (*l)[at:]...)...)
	return e.ID, nil
}

// DeleteElementAt removes the element at a JSON path.
func DeleteElementAt(b *Bench, path string) error {
	list, i, ok := splitPath(path)
	l, found := listAt(b, list)
	if !ok || !found || i >= len(*l) {
		return Errorf(EInvalid, "there is no element %s", path)
	}
	*l = append((*l)[:i], (*l)[i+1:]...)
	return nil
}

// MoveElementAt moves the element at a JSON path to index to of its list.
func MoveElementAt(b *Bench, path string, to int) error {
	list, i, ok := splitPath(path)
	l, found := listAt(b, list)
	if !ok || !found || i >= len(*l) || to < 0 || to >= len(*l) {
		return Errorf(EInvalid, "cannot move element %s to %d", path, to)
	}
	e := (*l)[i]
	*l = append((*l)[:i], (*l)[i+1:]...)
	*l = append((*l)[:to], append([]Element{e}, (*l)[to:]...)...)
	return nil
}

// AddSource adds a further source beside the first, a copy of its kind's defaults.
func AddSource(b *Bench) string {
	used := allIDs(b)
	id := ""
	for n := 2; ; n++ {
		if id = "S" + strconv.Itoa(n); !used[id] {
			break
		}
	}
	s := DefaultSource(b.Source.Kind)
	s.XMM, s.YMM = b.Source.XMM, b.Source.YMM+50
	b.MoreSources = append(b.MoreSources, MoreSource{ID: id, Source: s, Elements: []Element{}})
	return id
}

// Parts lists the ids a same_as may name: every element that is not itself a pass.
func Parts(b *Bench) []string {
	var out []string
	var walk func([]Element)
	walk = func(es []Element) {
		for _, e := range es {
			if e.SameAs == "" && e.ID != "" {
				out = append(out, e.ID)
			}
			walk(e.Reflected)
		}
	}
	walk(b.Elements)
	for _, m := range b.MoreSources {
		walk(m.Elements)
	}
	return out
}
