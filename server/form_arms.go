package server

import (
	"fmt"
	"strconv"
	"strings"

	"raytable/optics"
	"raytable/web/view"
)

// This file lays out the form's element lists at any depth (a splitter's reflected arm is a
// group under the splitter, with its own add control) and the further sources.

// elementForms lays out the element list at list (elements, elements[1].reflected, ...). The
// main list's buttons keep their short index form (up:2); a nested list's name the element by its
// path (up-at:elements[1].reflected[0]).
func (fb *formBuilder) elementForms(list string, es []optics.Element) []view.ElementForm {
	out := make([]view.ElementForm, 0, len(es))
	for i, e := range es {
		path := fmt.Sprintf("%s[%d]", list, i)
		// The nested list first, so that a problem inside it that no input takes is shown in its
		// own group rather than the splitter's.
		var arms []view.ArmForm
		if e.Type == optics.TypeSplitter {
			arms = append(arms, fb.armForm(path+".reflected", "Reflected arm of "+nonEmpty(e.ID, "this splitter"), e.Reflected))
		}
		g := fb.group(elementTitle(i, e), "element", path, elementSpecs(path+".", e))
		ef := view.ElementForm{Group: g, Index: i, Path: path, First: i == 0, Last: i == len(es)-1, Arms: arms}
		if list == "elements" {
			n := strconv.Itoa(i)
			ef.UpAction, ef.DownAction, ef.DeleteAction = "up:"+n, "down:"+n, "delete:"+n
		} else {
			ef.UpAction, ef.DownAction, ef.DeleteAction = "up-at:"+path, "down-at:"+path, "delete-at:"+path
		}
		out = append(out, ef)
	}
	return out
}

// armForm is an element list with the control that adds an element at its end.
func (fb *formBuilder) armForm(list, title string, es []optics.Element) view.ArmForm {
	elements := fb.elementForms(list, es)
	return view.ArmForm{
		Title:     title,
		List:      list,
		Elements:  elements,
		Errors:    fb.take(list), // after its elements took theirs
		AddName:   addInName(list),
		AddAction: "add-in:" + list,
		AddTypes:  typeOptions(),
	}
}

// addInName is the type choice of the add control of a nested list; its leading underscore keeps
// it out of the bench's fields.
func addInName(list string) string { return "_add:" + list }

// moreSourceFields lays out further source k: its id and wavelengths, then the source fields as
// the first source has them, its beam and its rays.
func moreSourceFields(k int, m *optics.MoreSource) []spec {
	p := moreSourcePrefix(k)
	out := specs(p, pick(optics.MoreSourceFields, "id", "wavelengths_nm"))
	out = append(out, sourceFieldsAt(p, m.Kind)...)
	out = append(out, specs(p+"beam.", optics.BeamFields)...)
	for i := range m.Rays {
		out = append(out, specs(fmt.Sprintf("%srays[%d].", p, i), optics.RayFields)...)
	}
	return out
}

func (fb *formBuilder) moreSourceForm(k int, m *optics.MoreSource) view.SourceForm {
	p := moreSourcePrefix(k)
	title := "Laser " + nonEmpty(m.ID, strconv.Itoa(k+2))
	arm := fb.armForm(p+"elements", "Elements of "+nonEmpty(m.ID, "this laser"), m.Elements) // first: see elementForms
	return view.SourceForm{
		Group:        fb.group(title, "more-source", strings.TrimSuffix(p, "."), moreSourceFields(k, m)),
		Arm:          arm,
		DeleteAction: "delete-source:" + strconv.Itoa(k),
	}
}

// addElementNames adds the inputs of an element list and of every list nested in it.
func addElementNames(names map[string]bool, list string, es []optics.Element) {
	for i, e := range es {
		p := fmt.Sprintf("%s[%d]", list, i)
		for _, s := range elementSpecs(p+".", e) {
			names[s.name] = true
		}
		addElementNames(names, p+".reflected", e.Reflected)
	}
}

// sameAsOptions are the parts a same_as may name, after the choice of none; a value that names no
// part (typed into a bench file) stays on the list so that the form keeps it.
func sameAsOptions(parts []string, value string) []view.Option {
	out := []view.Option{{Value: "", Label: "(its own part)"}}
	known := value == ""
	for _, id := range parts {
		out = append(out, view.Option{Value: id, Label: id})
		known = known || id == value
	}
	if !known {
		out = append(out, view.Option{Value: value, Label: value})
	}
	return out
}

// elementSpecs lays out an element: all its fields (elementFields), or for a same_as pass only
// what a pass carries: its common fields without a mount, and its turn as a check (optional).
func elementSpecs(p string, e optics.Element) []spec {
	if e.SameAs == "" {
		return elementFields(p, e.Type)
	}
	var out []spec
	for _, s := range specs(p, optics.ElementFields) {
		if !strings.HasPrefix(s.name, p+"mount") {
			out = append(out, s)
		}
	}
	if k, ok := optics.KindOf(e.Type); ok {
		if fl, ok := optics.FieldByKey(k.Fields, "turn_deg"); ok {
			out = append(out, spec{name: p + "turn_deg", label: "turn (empty: from the part)", unit: fl.Quantity.Unit})
		}
	}
	return out
}

// pass reads what a same_as pass carries beyond its common fields: an optional turn to check and,
// through a splitter, its reflected list.
func (f *formReader) pass(p string, e *optics.Element) {
	k, ok := optics.KindOf(e.Type)
	if !ok {
		return
	}
	if fl, ok := optics.FieldByKey(k.Fields, "turn_deg"); ok {
		e.TurnDeg = f.optNum(p+"turn_deg", fl.Quantity)
	}
	if fl, ok := optics.FieldByKey(k.Fields, "reflected"); ok {
		f.field(p+"reflected", fl, e)
	}
}
