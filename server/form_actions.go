package server

import (
	"fmt"
	"strconv"
	"strings"

	"raytable/optics"
)

// indexed are the buttons that name an element or a ray by its index, and the edit each makes.
var indexed = map[string]func(b *optics.Bench, i int) error{
	"delete":     optics.DeleteElement,
	"up":         func(b *optics.Bench, i int) error { return optics.MoveElement(b, i, i-1) },
	"down":       func(b *optics.Bench, i int) error { return optics.MoveElement(b, i, i+1) },
	"delete-ray": optics.DeleteRay,
}

// applyAction performs the button the user pressed, one of optics' edits (optics/edit.go): save
// and apply change nothing more; add, delete, move up/down, add-ray and delete-ray change the
// list. An action naming an element that does not exist is a problem, not a crash.
func applyAction(b *optics.Bench, action, addType, addAt string) []optics.Problem {
	verb, arg, _ := strings.Cut(action, ":")
	bad := []optics.Problem{{Path: "action", Message: fmt.Sprintf("unknown action %q; reload the page and try again", action)}}
	switch verb {
	case "", "save", "apply":
	case "add":
		at, err := strconv.Atoi(addAt)
		if err != nil {
			at = len(b.Elements) // no place given: at the end
		}
		if _, err := optics.AddElement(b, addType, at); err != nil {
			return []optics.Problem{{Path: "add.type", Message: err.Error()}}
		}
	case "add-ray":
		optics.AddRay(b)
	default:
		edit, known := indexed[verb]
		i, err := strconv.Atoi(arg)
		if !known || err != nil || edit(b, i) != nil {
			return bad
		}
	}
	return nil
}
