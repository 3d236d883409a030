package optics

import (
	"encoding/json"
	"slices"
	"strings"
)

func (r *reader) element(path string, raw json.RawMessage) Element {
	var e Element
	members, ok := r.object(path, raw)
	if !ok {
		return e
	}
	r.require(path, members, "id", "type", "gap_mm")
	// The type decides which keys are allowed; read it first.
	if typeRaw, ok := lookup(members, "type"); ok {
		e.Type, _ = r.str(field(path, "type"), typeRaw)
	}
	if extra, known := typeKeys[e.Type]; known {
		r.unknown(path, members, " for type "+e.Type, elementKeys, extra)
	} else {
		// An unknown type is reported by Validate; judge keys against every type.
		all := [][]string{elementKeys}
		for _, t := range elementTypes {
			all = append(all, typeKeys[t])
		}
		r.unknown(path, members, "", dedupe(all))
	}
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "id":
			e.ID, _ = r.str(p, m.raw)
		case "gap_mm":
			e.GapMM, _ = r.number(p, m.raw)
		case "faces_mm":
			if items, ok := r.array(p, m.raw); ok && len(items) > 0 {
				e.FacesMM = make([]*float64, len(items))
				for i, item := range items {
					e.FacesMM[i], _ = r.optNumber(index(p, i), item)
				}
			}
		case "thicknesses_mm":
			e.ThicknessesMM = r.numbers(p, m.raw)
		case "materials":
			e.Materials = r.strs(p, m.raw)
		case "focal_mm":
			e.FocalMM = r.ptrNumber(p, m.raw)
		case "radius_mm":
			e.RadiusMM, _ = r.optNumber(p, m.raw)
		case "turn_deg":
			e.TurnDeg = r.ptrNumber(p, m.raw)
		case "diameter_mm":
			e.DiameterMM = r.ptrNumber(p, m.raw)
		case "width_mm":
			e.WidthMM = r.ptrNumber(p, m.raw)
		case "mount":
			e.Mount = r.mount(p, m.raw)
		}
	}
	return e
}

func (r *reader) mount(path string, raw json.RawMessage) *Mount {
	members, ok := r.object(path, raw)
	if !ok {
		return nil
	}
	r.unknown(path, members, "", mountKeys)
	r.require(path, members, "width_mm", "depth_mm")
	mt := &Mount{}
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "width_mm":
			mt.WidthMM, _ = r.number(p, m.raw)
		case "depth_mm":
			mt.DepthMM, _ = r.number(p, m.raw)
		}
	}
	return mt
}

// elementTypes lists the element types in the order messages name them.
var elementTypes = []string{TypeLens, TypeThinLens, TypeMirror, TypeAperture, TypeScreen, TypeDump}

// dedupe flattens key sets into one list without repeats, keeping first appearance.
func dedupe(sets [][]string) []string {
	var out []string
	for _, set := range sets {
		for _, k := range set {
			if !slices.Contains(out, k) {
				out = append(out, k)
			}
		}
	}
	return out
}

// materialPath is the JSON path of a user material: materials.NAME when the name is a plain word,
// materials["NAME"] (JSON-quoted) otherwise, so that dots or spaces in a name stay unambiguous.
func materialPath(name string) string {
	if name != "" && plainName(name) && !strings.Contains(name, ".") {
		return "materials." + name
	}
	q, _ := json.Marshal(name)
	return "materials[" + string(q) + "]"
}
