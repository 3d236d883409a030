package optics

// ArmMain is the id of the first source's own element list.
const ArmMain = "main"

// FirstSourceID names the first source where a source is named: Arm.Source, ArmReport.Source.
const FirstSourceID = "source"

// elementList is one element list of a bench tree: the main list, a splitter's reflected list or a
// further source's list, with where it stands.
type elementList struct {
	Path   string     // JSON path of the list: "elements", "elements[1].reflected", "more_sources[0].elements"
	Els    *[]Element // the list itself, so that edits can change it
	Arm    string     // the arm id: ArmMain, "BS1.reflected", or the further source's id
	Parent string     // the arm it branches from; "" for a source's own list
	Source int        // -1 for the first source, else the index in more_sources
	Depth  int        // 0 for a source's list, 1 for a reflected list in it, ...
	From   string     // JSON path of the element whose reflected list this is; "" for a source's
}

// elementLists lists the element lists of b in depth-first order: each list before the lists that
// its splitters start, those in element order, the first source's before the further sources'.
// This is the order in which parts count as "placed earlier" for same_as, and the order of arms.
func elementLists(b *Bench) []elementList {
	var out []elementList
	var visit func(l elementList)
	visit = func(l elementList) {
		out = append(out, l)
		for i := range *l.Els {
			e := &(*l.Els)[i]
			if len(e.Reflected) == 0 || e.Type != TypeSplitter || l.Depth > MaxArmDepth {
				continue // Validate reports a reflected list on another type, or nested too deep
			}
			p := index(l.Path, i)
			visit(elementList{Path: field(p, "reflected"), Els: &e.Reflected, Arm: e.ID + ".reflected",
				Parent: l.Arm, Source: l.Source, Depth: l.Depth + 1, From: p})
		}
	}
	visit(elementList{Path: "elements", Els: &b.Elements, Arm: ArmMain, Source: -1})
	for i := range b.MoreSources {
		m := &b.MoreSources[i]
		visit(elementList{Path: field(index("more_sources", i), "elements"), Els: &m.Elements, Arm: m.ID, Source: i})
	}
	return out
}

// placedElement is one element of the tree with its JSON path, in depth-first order.
type placedElement struct {
	Path string
	E    *Element
	List int // index in elementLists
	At   int // index in its list
}

// treeElements lists every element of b in depth-first list order (elementLists).
func treeElements(b *Bench) []placedElement {
	var out []placedElement
	for li, l := range elementLists(b) {
		for i := range *l.Els {
			out = append(out, placedElement{Path: index(l.Path, i), E: &(*l.Els)[i], List: li, At: i})
		}
	}
	return out
}

// isBranching reports whether b uses anything beyond a single linear list: a splitter, a same_as
// pass or a further source. A bench that does not is its own main arm.
func isBranching(b *Bench) bool {
	if len(b.MoreSources) > 0 {
		return true
	}
	for _, e := range b.Elements {
		if e.Type == TypeSplitter || e.SameAs != "" || len(e.Reflected) > 0 {
			return true
		}
	}
	return false
}
