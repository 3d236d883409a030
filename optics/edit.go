package optics

import (
	"reflect"
	"slices"
	"strconv"
	"strings"
)

// This file holds the edits a builder makes to a bench: adding, deleting and moving elements and
// rays, and changing an element's type or the source's kind. They take and give plain values, so
// that the web form and any other client make the same edits; none of them validates the bench.

// DefaultGapMM is the gap in front of a new element.
const DefaultGapMM = 50

// DefaultElement is a new element of a type, without an id: its type's default fields (Kind.Default)
// and a gap of DefaultGapMM. An unknown type gets only its type and gap, for Validate to refuse.
func DefaultElement(typ string) Element {
	var e Element
	if k, ok := KindOf(typ); ok {
		e = k.Default()
	}
	e.Type, e.GapMM = typ, DefaultGapMM
	return e
}

// DefaultSource is a source of a kind with that kind's default fields and nothing else; an unknown
// kind gets the first kind's fields.
func DefaultSource(kind string) Source {
	s := SourceKindOrFirst(kind).Default()
	s.Kind = kind
	if kind == SourceFiber {
		s.Beam = nil // a fibre's beam is its mode
	}
	return s
}

// UniqueID returns the first of L1, L2, ... (the type's IDPrefix, E for an unknown type) that no
// element of b's tree and no further source uses.
func UniqueID(b *Bench, typ string) string {
	prefix := "E"
	if k, ok := KindOf(typ); ok {
		prefix = k.IDPrefix
	}
	return firstFree(b, prefix)
}

// firstFree is the first of prefix1, prefix2, ... that no element or further source of b uses.
func firstFree(b *Bench, prefix string) string {
	used := map[string]bool{}
	for _, pe := range treeElements(b) {
		used[pe.E.ID] = true
	}
	for _, m := range b.MoreSources {
		used[m.ID] = true
	}
	for n := 1; ; n++ {
		if id := prefix + strconv.Itoa(n); !used[id] {
			return id
		}
	}
}

// AddElement inserts a new element of a type (DefaultElement with a UniqueID) so that it stands at
// index at; an index outside 0..len(b.Elements) adds it at the end. It returns the new element's
// id, or an EInvalid *Error for an unknown type.
func AddElement(b *Bench, typ string, at int) (string, error) {
	if _, ok := KindOf(typ); !ok {
		return "", Errorf(EInvalid, "unknown element type %q; choose one of %s", typ, strings.Join(KindTypes(), ", "))
	}
	if at < 0 || at > len(b.Elements) {
		at = len(b.Elements)
	}
	e := DefaultElement(typ)
	e.ID = UniqueID(b, typ)
	b.Elements = append(b.Elements[:at], append([]Element{e}, b.Elements[at:]...)...)
	return e.ID, nil
}

// DeleteElement removes the element at index i.
func DeleteElement(b *Bench, i int) error {
	if err := checkIndex("element", i, len(b.Elements)); err != nil {
		return err
	}
	b.Elements = append(b.Elements[:i], b.Elements[i+1:]...)
	return nil
}

// MoveElement moves the element at index from so that it stands at index to; the elements between
// shift by one. Moving by one place swaps two neighbours.
func MoveElement(b *Bench, from, to int) error {
	if err := checkIndex("element", from, len(b.Elements)); err != nil {
		return err
	}
	if err := checkIndex("element", to, len(b.Elements)); err != nil {
		return err
	}
	e := b.Elements[from]
	b.Elements = append(b.Elements[:from], b.Elements[from+1:]...)
	b.Elements = append(b.Elements[:to], append([]Element{e}, b.Elements[to:]...)...)
	return nil
}

// AddRay adds an explicit ray along the axis at the end of the source's rays.
func AddRay(b *Bench) {
	b.Source.Rays = append(b.Source.Rays, ExplicitRay{})
}

// DeleteRay removes the source's explicit ray at index i.
func DeleteRay(b *Bench, i int) error {
	if err := checkIndex("ray", i, len(b.Source.Rays)); err != nil {
		return err
	}
	b.Source.Rays = append(b.Source.Rays[:i], b.Source.Rays[i+1:]...)
	return nil
}

func checkIndex(what string, i, n int) error {
	if i < 0 || i >= n {
		return Errorf(EInvalid, "there is no %s %d: the bench has %d", what, i, n)
	}
	return nil
}

// CarriedFields are the own fields an element keeps when its type changes: those both types have
// (a clear diameter between lenses, mirrors and apertures). None when either type is unknown.
func CarriedFields(from, to string) []Field {
	kf, okf := KindOf(from)
	kt, okt := KindOf(to)
	if !okf || !okt {
		return nil
	}
	var out []Field
	for _, f := range kf.Fields {
		if _, shared := FieldByKey(kt.Fields, f.Key); shared {
			out = append(out, f)
		}
	}
	return out
}

// ChangeType is e as an element of type typ: the new type's default, with e's common fields (id,
// gap, mount) and its CarriedFields.
func ChangeType(e Element, typ string) Element {
	out := DefaultElement(typ)
	src, dst := reflect.ValueOf(&e).Elem(), reflect.ValueOf(&out).Elem()
	for _, f := range slices.Concat(ElementFields, CarriedFields(e.Type, typ)) {
		if f.Key != "type" {
			f.value(dst).Set(f.value(src))
		}
	}
	return out
}

// ChangeSourceKind is s as a source of kind: its common fields kept, the fields of every kind
// replaced by the new kind's defaults (DefaultSource).
func ChangeSourceKind(s Source, kind string) Source {
	def := DefaultSource(kind)
	src, dst := reflect.ValueOf(&def).Elem(), reflect.ValueOf(&s).Elem()
	for _, f := range sourceKindFields {
		f.value(dst).Set(f.value(src))
	}
	s.Kind = kind
	if kind == SourceFiber {
		s.Beam = nil // a fibre's beam is its mode
	}
	return s
}
