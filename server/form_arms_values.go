package server

import (
	"fmt"

	"raytable/optics"
)

// This file writes and reads the parts of a branching bench the form shows beyond a plain element
// list: nested element lists (a splitter's reflected arm), a splitter's dichroic edge, and the
// further sources with their own lists. Names are JSON paths as everywhere on the form.

// putElements writes the element list at list (a JSON path: elements, elements[1].reflected,
// more_sources[0].elements) into form values, each nested list under its own path.
func putElements(v map[string]string, list string, es []optics.Element) {
	for i := range es {
		e := &es[i]
		p := fmt.Sprintf("%s[%d].", list, i)
		putFields(v, p, optics.ElementFields, e)
		if e.SameAs != "" { // a pass carries only these; the rest is its part's
			v[p+"turn_deg"] = optTextOr(e.TurnDeg, "")
			putElements(v, p+"reflected", e.Reflected)
			continue
		}
		if k, ok := optics.KindOf(e.Type); ok {
			putFields(v, p, k.Fields, e)
		}
	}
}

// putMoreSource writes further source k: its own fields (id, wavelengths, its element list) and
// the source fields that stand inline beside them.
func putMoreSource(v map[string]string, k int, m *optics.MoreSource) {
	p := moreSourcePrefix(k)
	putFields(v, p, moreSourceOwn, m)
	putFields(v, p, optics.SourceFields, &m.Source)
	putFields(v, p, optics.SourceKindOrFirst(m.Kind).Fields, &m.Source)
}

func moreSourcePrefix(k int) string { return fmt.Sprintf("more_sources[%d].", k) }

// moreSourceOwn are a further source's own fields; its source fields are the first source's and
// are written and read as those are.
var moreSourceOwn = pick(optics.MoreSourceFields, "id", "wavelengths_nm", "elements")

// dichroic reads a dichroic edge written as JSON (jsonObject).
func (f *formReader) dichroic(path string) *optics.Dichroic {
	return jsonObject[optics.Dichroic](f, path, "a dichroic edge", `{"edge_nm": 550, "reflects": "shorter"}`)
}

// maxFormDepth bounds how deep a posted form's nested lists are read; the bench rules allow
// fewer levels and say so, this only stops a hostile form from recursing long.
const maxFormDepth = 64

// elements reads the element list at list, each element while its type input was sent.
func (f *formReader) elements(list string) []optics.Element {
	var out []optics.Element
	for i := 0; f.has(fmt.Sprintf("%s[%d].type", list, i)); i++ {
		out = append(out, f.element(fmt.Sprintf("%s[%d].", list, i)))
	}
	return out
}

// moreSources reads the further sources, each while its id input was sent.
func (f *formReader) moreSources() []optics.MoreSource {
	var out []optics.MoreSource
	for k := 0; f.has(moreSourcePrefix(k) + "id"); k++ {
		p := moreSourcePrefix(k)
		m := optics.MoreSource{Source: f.sourceAt(p)}
		f.fields(p, moreSourceOwn, &m)
		if m.Elements == nil {
			m.Elements = []optics.Element{}
		}
		out = append(out, m)
	}
	return out
}
