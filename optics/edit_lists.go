package optics

import (
	"strconv"
	"strings"
)

// This file holds the list-aware edits of a branching bench: elements added, deleted and moved in
// any element list by its JSON path ("elements", "elements[1].reflected",
// "more_sources[0].elements"), further sources added, and what a same_as may name. Like the
// edits of edit.go they do not validate the bench.

// ElementAt finds the element at a JSON path such as "elements[1].reflected[0]".
func ElementAt(b *Bench, path string) (*Element, bool) {
	list, i, ok := splitElementPath(path)
	if !ok {
		return nil, false
	}
	els, err := listAt(b, list)
	if err != nil || i >= len(*els) {
		return nil, false
	}
	return &(*els)[i], true
}

// splitElementPath splits "elements[1].reflected[0]" into its list "elements[1].reflected" and 0.
func splitElementPath(path string) (list string, i int, ok bool) {
	if !strings.HasSuffix(path, "]") {
		return "", 0, false
	}
	list = listPathOf(path)
	i, err := strconv.Atoi(path[len(list)+1 : len(path)-1])
	return list, i, err == nil && i >= 0 && list != ""
}

// listAt finds the element list at a JSON path: "elements", "more_sources[N].elements", or the
// reflected list of a splitter ("elements[1].reflected"), which may still be empty.
func listAt(b *Bench, list string) (*[]Element, error) {
	switch {
	case list == "elements":
		return &b.Elements, nil
	case strings.HasSuffix(list, ".reflected"):
		e, ok := ElementAt(b, strings.TrimSuffix(list, ".reflected"))
		if !ok || e.Type != TypeSplitter {
			return nil, Errorf(EInvalid, "there is no element list %s: only a splitter has a reflected list", list)
		}
		return &e.Reflected, nil
	case strings.HasPrefix(list, "more_sources[") && strings.HasSuffix(list, "].elements"):
		n, err := strconv.Atoi(strings.TrimSuffix(strings.TrimPrefix(list, "more_sources["), "].elements"))
		if err == nil && n >= 0 && n < len(b.MoreSources) {
			return &b.MoreSources[n].Elements, nil
		}
	}
	return nil, Errorf(EInvalid, "there is no element list %s", list)
}

// AddElementIn inserts a new element of a type (DefaultElement with a UniqueID over the whole tree)
// into the list at the JSON path list so that it stands at index at; an index outside the list adds
// it at the end. It returns the new id, or an EInvalid *Error for an unknown type or list.
func AddElementIn(b *Bench, list string, typ string, at int) (string, error) {
	if _, ok := KindOf(typ); !ok {
		return "", Errorf(EInvalid, "unknown element type %q; choose one of %s", typ, strings.Join(KindTypes(), ", "))
	}
	els, err := listAt(b, list)
	if err != nil {
		return "", err
	}
	if at < 0 || at > len(*els) {
		at = len(*els)
	}
	e := DefaultElement(typ)
	e.ID = UniqueID(b, typ)
	*els = append((*els)[:at], append([]Element{e}, (*els)[at:]...)...)
	return e.ID, nil
}

// DeleteElementAt removes the element at a JSON path, with its reflected list.
func DeleteElementAt(b *Bench, path string) error {
	els, i, err := elementIn(b, path)
	if err != nil {
		return err
	}
	*els = append((*els)[:i], (*els)[i+1:]...)
	return nil
}

// MoveElementAt moves the element at a JSON path within its list so that it stands at index to.
func MoveElementAt(b *Bench, path string, to int) error {
	els, from, err := elementIn(b, path)
	if err != nil {
		return err
	}
	if err := checkIndex("element", to, len(*els)); err != nil {
		return err
	}
	e := (*els)[from]
	*els = append((*els)[:from], (*els)[from+1:]...)
	*els = append((*els)[:to], append([]Element{e}, (*els)[to:]...)...)
	return nil
}

// elementIn finds the list and index of the element at a JSON path.
func elementIn(b *Bench, path string) (*[]Element, int, error) {
	list, i, ok := splitElementPath(path)
	if !ok {
		return nil, 0, Errorf(EInvalid, "%q is not the path of an element", path)
	}
	els, err := listAt(b, list)
	if err != nil {
		return nil, 0, err
	}
	if err := checkIndex("element", i, len(*els)); err != nil {
		return nil, 0, err
	}
	return els, i, nil
}

// DefaultSourceOffsetMM is how far beside the first source a new further source starts.
const DefaultSourceOffsetMM = 50

// AddSource adds a further source: the first kind's defaults, the first source's heading and
// height, DefaultSourceOffsetMM beside it, the bench's wavelengths and no elements. It returns its
// id (laser1, laser2, ...).
func AddSource(b *Bench) string {
	s := DefaultSource(SourceKinds[0].Kind)
	s.XMM, s.YMM, s.HeadingDeg = b.Source.XMM, b.Source.YMM+DefaultSourceOffsetMM, b.Source.HeadingDeg
	id := firstFree(b, "laser")
	b.MoreSources = append(b.MoreSources, MoreSource{ID: id, Source: s, Elements: []Element{}})
	return id
}

// Parts lists the ids a same_as may name, in depth-first order: every element that is not itself
// a pass, once.
func Parts(b *Bench) []string {
	var out []string
	seen := map[string]bool{}
	for _, pe := range treeElements(b) {
		if pe.E.SameAs == "" && pe.E.ID != "" && !seen[pe.E.ID] {
			seen[pe.E.ID] = true
			out = append(out, pe.E.ID)
		}
	}
	return out
}
