package tables

import (
	"strings"

	"raytable/optics"
)

// armsSection is one row per arm of a branching bench: where it branches from, its source, the
// share of the source's power it carries, its wavelengths, its optical path and group delay from
// the source to its last element, and how it ends.
func armsSection(arms []optics.ArmReport) Section {
	sec := Section{
		Name:  Arms,
		Title: Phrase{Words: Words{Page: "Arms", Text: "ARMS"}},
		Columns: []Column{
			{Head: same("arm"), In: Text | Page},
			{Head: same("from"), In: Text | Page},
			{Head: same("source"), In: Text | Page},
			{Head: same("power"), Unit: Percent, In: Everywhere},
			{Head: same("wavelengths"), Unit: NM, In: Text | Page},
			{Head: same("optical path"), Unit: MM, In: Everywhere},
			{Head: same("group delay"), Unit: PS, In: Everywhere},
			{Head: same("ends"), In: Text | Page},
		},
		Note: Phrase{Words: Words{Page: "Power at each arm's primary wavelength, as a share of its source's; optical path Σ n·L and group delay Σ n_g·L/c from the source to the arm's last element."}},
	}
	for _, a := range arms {
		from := "-"
		if a.Parent != nil {
			from = *a.Parent
		}
		var wls []string
		for _, w := range a.WavelengthsNM {
			wls = append(wls, val(w).In(Text))
		}
		sec.Rows = append(sec.Rows, Row{Key: a.ID, In: Everywhere, Cells: []Cell{
			say(a.ID), say(from), say(a.Source), num(a.PowerFraction, Fraction), say(strings.Join(wls, ", ")),
			val(a.OpticalPathMM), val(a.GroupDelayPS), say(a.Ends),
		}})
	}
	return sec
}

// armElementsSection lists the own elements of every arm with their beam height above the table.
func armElementsSection(arms []optics.ArmReport) Section {
	sec := Section{
		Name:  ArmElements,
		Title: Phrase{Words: Words{Page: "Elements of each arm", Text: "ARM ELEMENTS"}},
		Columns: []Column{
			{Head: same("arm"), In: Text | Page},
			{Head: same("id"), In: Text | Page},
			{Head: same("type"), In: Text | Page},
			{Head: Words{Page: "along the path", Text: "path", Compare: "along the path"}, Unit: MM, In: Everywhere},
			{Head: same("table x"), Unit: MM, In: Everywhere},
			{Head: same("table y"), Unit: MM, In: Everywhere},
			{Head: same("height"), Unit: MM, In: Everywhere},
			{Head: Words{Page: "heading in → out", Text: "heading in/out"}, Unit: Deg, In: Text | Page},
		},
	}
	for _, a := range arms {
		for _, e := range a.Elements {
			sec.Rows = append(sec.Rows, Row{Key: a.ID + " " + e.ID, In: Everywhere, Cells: []Cell{
				say(a.ID), say(e.ID), say(e.Type), val(e.PathMM), val(e.TableXMM), val(e.TableYMM), val(e.HeightMM),
				pair(val(e.HeadingInDeg), val(e.HeadingOutDeg), InOut),
			}})
		}
	}
	return sec
}

// meetingsSection is one row per part that two or more beams reach: how far the arriving beams
// miss it, and for the two that leave it together their angle, optical path and delay difference
// and fringe visibility.
func meetingsSection(ms []optics.Meeting) Section {
	sec := Section{
		Name:  Meetings,
		Title: Phrase{Words: Words{Page: "Where beams meet", Text: "MEETINGS"}},
		Columns: []Column{
			{Head: same("part"), In: Text | Page},
			{Head: same("arms"), In: Text | Page},
			{Head: same("miss"), Unit: MM, In: Everywhere},
			{Head: same("angle"), Unit: MRad, In: Everywhere},
			{Head: same("OPD"), Unit: MM, In: Everywhere},
			{Head: same("delay"), Unit: FS, In: Everywhere},
			{Head: same("visibility"), In: Everywhere},
		},
	}
	if len(ms) == 0 {
		sec.Note.Words = Words{Page: "No part is reached by two beams.", Text: "(no part is reached by two beams)"}
	}
	for _, m := range ms {
		sec.Rows = append(sec.Rows, Row{Key: m.Part, In: Everywhere, Cells: []Cell{
			say(m.Part), say(strings.Join(m.Arms, ", ")), val(m.MissMM), optVal(m.AngleMRad), optVal(m.OPDMM),
			optVal(m.GroupDelayFS), opt(m.Visibility, Index, Undefined),
		}})
	}
	return sec
}
