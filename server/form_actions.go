package server

import (
	"fmt"
	"net/url"
	"strconv"
	"strings"

	"raytable/optics"
)

// indexed are the buttons that name an element of the main list or a ray by its index, and the
// edit each makes.
var indexed = map[string]func(b *optics.Bench, i int) error{
	"delete":     optics.DeleteElement,
	"up":         func(b *optics.Bench, i int) error { return optics.MoveElement(b, i, i-1) },
	"down":       func(b *optics.Bench, i int) error { return optics.MoveElement(b, i, i+1) },
	"delete-ray": optics.DeleteRay,
	"delete-source": func(b *optics.Bench, k int) error {
		if k < 0 || k >= len(b.MoreSources) {
			return fmt.Errorf("no further source %d", k)
		}
		b.MoreSources = append(b.MoreSources[:k], b.MoreSources[k+1:]...)
		return nil
	},
}

// located are the buttons that name an element of any list by its JSON path.
var located = map[string]func(b *optics.Bench, path string) error{
	"delete-at": optics.DeleteElementAt,
	"up-at":     func(b *optics.Bench, path string) error { return moveBy(b, path, -1) },
	"down-at":   func(b *optics.Bench, path string) error { return moveBy(b, path, +1) },
}

// moveBy moves the element at path by step places within its list.
func moveBy(b *optics.Bench, path string, step int) error {
	open := strings.LastIndex(path, "[")
	if open < 0 || !strings.HasSuffix(path, "]") {
		return fmt.Errorf("%q is not an element path", path)
	}
	i, err := strconv.Atoi(path[open+1 : len(path)-1])
	if err != nil {
		return err
	}
	return optics.MoveElementAt(b, path, i+step)
}

// applyAction performs the button the user pressed, one of optics' edits (optics/edit.go): save
// and apply change nothing more; add (to the main list at a place), add-in (to the end of a
// nested list), delete and move (by index in the main list, by path in any), add-ray, delete-ray,
// add-source and delete-source change the bench. An action naming something that does not exist
// is a problem, not a crash.
func applyAction(b *optics.Bench, action string, vals url.Values) []optics.Problem {
	verb, arg, _ := strings.Cut(action, ":")
	bad := []optics.Problem{{Path: "action", Message: fmt.Sprintf("unknown action %q; reload the page and try again", action)}}
	switch verb {
	case "", "save", "apply":
	case "add":
		at, err := strconv.Atoi(vals.Get("add.at"))
		if err != nil {
			at = len(b.Elements) // no place given: at the end
		}
		if _, err := optics.AddElement(b, vals.Get("add.type"), at); err != nil {
			return []optics.Problem{{Path: "add.type", Message: err.Error()}}
		}
	case "add-in":
		if _, err := optics.AddElementIn(b, arg, vals.Get(addInName(arg)), -1); err != nil {
			return []optics.Problem{{Path: "action", Message: err.Error()}}
		}
	case "add-ray":
		optics.AddRay(b)
	case "add-source":
		optics.AddSource(b)
	default:
		if edit, known := located[verb]; known {
			if edit(b, arg) != nil {
				return bad
			}
			return nil
		}
		edit, known := indexed[verb]
		i, err := strconv.Atoi(arg)
		if !known || err != nil || edit(b, i) != nil {
			return bad
		}
	}
	return nil
}
