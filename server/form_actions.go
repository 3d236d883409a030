package server

import (
	"fmt"
	"strconv"
	"strings"

	"raytable/optics"
)

func ptr[T any](v T) *T { return &v }

// elementTypes lists the element types in the order the add menu offers them.
var elementTypes = []string{optics.TypeLens, optics.TypeThinLens, optics.TypeMirror, optics.TypeAperture, optics.TypeScreen, optics.TypeDump}

// defaultElement is a new element of a type: a sensible part that a builder would then adjust.
func defaultElement(typ string) optics.Element {
	e := optics.Element{Type: typ, GapMM: 50}
	switch typ {
	case optics.TypeLens:
		e.FacesMM = []*float64{ptr(100.0), nil}
		e.ThicknessesMM = []float64{4}
		e.Materials = []string{"fused-silica"}
		e.DiameterMM = ptr(25.4)
	case optics.TypeThinLens:
		e.FocalMM = ptr(100.0)
		e.DiameterMM = ptr(25.4)
	case optics.TypeMirror:
		e.TurnDeg = ptr(90.0)
		e.DiameterMM = ptr(25.4)
	case optics.TypeAperture:
		e.DiameterMM = ptr(5.0)
	case optics.TypeScreen:
		e.WidthMM = ptr(10.0)
	}
	return e
}

// defaultSource holds the kind-specific fields of a new source of a kind.
func defaultSource(kind string) optics.Source {
	switch kind {
	case optics.SourcePoint:
		return optics.Source{Kind: kind, NA: ptr(0.1), ObjectHeightsMM: []float64{0}}
	default:
		return optics.Source{Kind: kind, SemiDiameterMM: ptr(2.0), FieldAnglesDeg: []float64{0}}
	}
}

// idPrefix is the start of generated ids by type.
var idPrefix = map[string]string{
	optics.TypeLens: "L", optics.TypeThinLens: "F", optics.TypeMirror: "M",
	optics.TypeAperture: "A", optics.TypeScreen: "S", optics.TypeDump: "D",
}

// uniqueID returns the first of L1, L2, ... (by type) that no element uses.
func uniqueID(b *optics.Bench, typ string) string {
	used := map[string]bool{}
	for _, e := range b.Elements {
		used[e.ID] = true
	}
	prefix := idPrefix[typ]
	if prefix == "" {
		prefix = "E"
	}
	for n := 1; ; n++ {
		id := prefix + strconv.Itoa(n)
		if !used[id] {
			return id
		}
	}
}

// applyAction performs the button the user pressed: save and apply change nothing more; add,
// delete, move up/down, add-ray and delete-ray change the list. An action naming an element that
// does not exist is a problem, not a crash.
func applyAction(b *optics.Bench, action, addType, addAt string) []optics.Problem {
	verb, arg, _ := strings.Cut(action, ":")
	index := func(n int) (int, bool) {
		i, err := strconv.Atoi(arg)
		return i, err == nil && i >= 0 && i < n
	}
	bad := func() []optics.Problem {
		return []optics.Problem{{Path: "action", Message: fmt.Sprintf("unknown action %q; reload the page and try again", action)}}
	}
	switch verb {
	case "", "save", "apply":
	case "add":
		if idPrefix[addType] == "" {
			return []optics.Problem{{Path: "add.type", Message: fmt.Sprintf("unknown element type %q; choose one of %s", addType, strings.Join(elementTypes, ", "))}}
		}
		at, err := strconv.Atoi(addAt)
		if err != nil || at < 0 || at > len(b.Elements) {
			at = len(b.Elements)
		}
		e := defaultElement(addType)
		e.ID = uniqueID(b, addType)
		b.Elements = append(b.Elements[:at], append([]optics.Element{e}, b.Elements[at:]...)...)
	case "delete":
		i, ok := index(len(b.Elements))
		if !ok {
			return bad()
		}
		b.Elements = append(b.Elements[:i], b.Elements[i+1:]...)
	case "up", "down":
		i, ok := index(len(b.Elements))
		j := i - 1
		if verb == "down" {
			j = i + 1
		}
		if !ok || j < 0 || j >= len(b.Elements) {
			return bad()
		}
		b.Elements[i], b.Elements[j] = b.Elements[j], b.Elements[i]
	case "add-ray":
		b.Source.Rays = append(b.Source.Rays, optics.ExplicitRay{})
	case "delete-ray":
		i, ok := index(len(b.Source.Rays))
		if !ok {
			return bad()
		}
		b.Source.Rays = append(b.Source.Rays[:i], b.Source.Rays[i+1:]...)
	default:
		return bad()
	}
	return nil
}
