package server

import (
	"encoding/json"
	"fmt"
	"net/url"
	"strconv"
	"strings"

	"raytable/optics"
	"raytable/web/view"
)

// benchValues writes a bench into form values, keyed by JSON path, the way formReader reads them.
func benchValues(b *optics.Bench) map[string]string {
	v := map[string]string{
		"title":                    b.Title,
		"notes":                    b.Notes,
		"wavelengths_nm":           numList(b.WavelengthsNM),
		"table.grid":               b.Table.Grid,
		"table.width_mm":           optics.FormatNumber(b.Table.WidthMM),
		"table.depth_mm":           optics.FormatNumber(b.Table.DepthMM),
		"table.beam_height_mm":     optics.FormatNumber(b.Table.BeamHeightMM),
		"table.hole_offset_mm":     optText(b.Table.HoleOffsetMM),
		"source.x_mm":              optics.FormatNumber(b.Source.XMM),
		"source.y_mm":              optics.FormatNumber(b.Source.YMM),
		"source.heading_deg":       optics.FormatNumber(b.Source.HeadingDeg),
		"source.kind":              b.Source.Kind,
		"source._kind_shown":       b.Source.Kind,
		"source.semi_diameter_mm":  optText(b.Source.SemiDiameterMM),
		"source.field_angles_deg":  numList(b.Source.FieldAnglesDeg),
		"source.na":                optText(b.Source.NA),
		"source.object_heights_mm": numList(b.Source.ObjectHeightsMM),
	}
	if b.Source.FanRays != nil {
		v["source.fan_rays"] = strconv.Itoa(*b.Source.FanRays)
	}
	if bm := b.Source.Beam; bm != nil {
		v["source.beam.waist_radius_mm"] = optics.FormatNumber(bm.WaistRadiusMM)
		v["source.beam.waist_at_mm"] = optics.FormatNumber(bm.WaistAtMM)
		v["source.beam.m2"] = optText(bm.M2)
	}
	for i, r := range b.Source.Rays {
		p := fmt.Sprintf("source.rays[%d].", i)
		v[p+"height_mm"] = optics.FormatNumber(r.HeightMM)
		v[p+"angle_deg"] = optics.FormatNumber(r.AngleDeg)
		v[p+"x_mm"] = optics.FormatNumber(r.XMM)
		v[p+"x_angle_deg"] = optics.FormatNumber(r.XAngleDeg)
	}
	if len(b.Materials) > 0 {
		if data, err := json.MarshalIndent(b.Materials, "", "  "); err == nil {
			v["materials"] = string(data)
		}
	}
	for i, e := range b.Elements {
		p := fmt.Sprintf("elements[%d].", i)
		v[p+"id"] = e.ID
		v[p+"type"] = e.Type
		v[p+"_type_shown"] = e.Type
		v[p+"gap_mm"] = optics.FormatNumber(e.GapMM)
		v[p+"faces_mm"] = facesText(e.FacesMM)
		v[p+"thicknesses_mm"] = numList(e.ThicknessesMM)
		v[p+"materials"] = strings.Join(e.Materials, ", ")
		v[p+"focal_mm"] = optText(e.FocalMM)
		if e.Type == optics.TypeMirror {
			v[p+"radius_mm"] = optTextOr(e.RadiusMM, "flat")
		}
		v[p+"turn_deg"] = optText(e.TurnDeg)
		v[p+"diameter_mm"] = optText(e.DiameterMM)
		v[p+"width_mm"] = optText(e.WidthMM)
		if e.Mount != nil {
			v[p+"mount.width_mm"] = optics.FormatNumber(e.Mount.WidthMM)
			v[p+"mount.depth_mm"] = optics.FormatNumber(e.Mount.DepthMM)
		}
	}
	return v
}

func numList(xs []float64) string {
	parts := make([]string, len(xs))
	for i, x := range xs {
		parts[i] = optics.FormatNumber(x)
	}
	return strings.Join(parts, ", ")
}

func optText(x *float64) string { return optTextOr(x, "") }

func optTextOr(x *float64, none string) string {
	if x == nil {
		return none
	}
	return optics.FormatNumber(*x)
}

func facesText(faces []*float64) string {
	parts := make([]string, len(faces))
	for i, f := range faces {
		parts[i] = optTextOr(f, "flat")
	}
	return strings.Join(parts, ", ")
}

// overlay replaces values with what the user posted, so a re-rendered form keeps their text.
func overlay(values map[string]string, posted url.Values) {
	for k, vs := range posted {
		if len(vs) > 0 && !strings.HasPrefix(k, "_") && k != "action" {
			values[k] = vs[0]
		}
	}
}

// formBuilder lays out the form for a bench's shape and attaches problems to fields by path.
type formBuilder struct {
	values   map[string]string
	problems map[string][]string // field name -> messages
	rest     []optics.Problem    // problems not yet attached to a field
}

// buildForm makes the edit form for bench b (its element types and source kind decide which
// fields appear), filled from values and marked with problems.
func buildForm(id string, b *optics.Bench, values map[string]string, problems []optics.Problem) view.BenchForm {
	fb := &formBuilder{values: values, problems: map[string][]string{}}
	names := fieldNames(b)
	for _, p := range problems {
		if name, ok := fieldFor(p.Path, names); ok {
			fb.problems[name] = append(fb.problems[name], itemMessage(p.Path, name, p.Message))
		} else {
			fb.rest = append(fb.rest, p)
		}
	}
	f := view.BenchForm{
		Action:     "/r/" + id + "/edit",
		PreviewURL: "/r/" + id + "/preview",
		Invalid:    len(problems) > 0,
		AddTypes:   typeOptions(),
	}
	f.General = fb.group("Design", "general", "", generalFields())
	f.Table = fb.group("Table", "table", "table", tableFields())
	f.Source = fb.group("Source", "source", "source", sourceFields(b.Source.Kind))
	f.Beam = fb.group("Laser beam (leave empty for none)", "beam", "source.beam", beamFields())
	f.Materials = fb.group("Your own materials", "materials", "materials", []spec{{"materials", "materials (JSON, as in the bench file)", "", "textarea"}})
	for i := range b.Source.Rays {
		p := fmt.Sprintf("source.rays[%d].", i)
		f.Rays = append(f.Rays, view.RayForm{Index: i, Fields: fb.fields([]spec{
			{p + "height_mm", "height", "mm", ""}, {p + "angle_deg", "angle", "°", ""},
			{p + "x_mm", "vertical height", "mm", ""}, {p + "x_angle_deg", "vertical angle", "°", ""},
		})})
	}
	f.RayErrors = fb.take("source.rays")
	f.AddAt = append(f.AddAt, view.Option{Value: "0", Label: "at the start"})
	for i, e := range b.Elements {
		g := fb.group(elementTitle(i, e), "element", fmt.Sprintf("elements[%d]", i), elementFields(i, e.Type))
		f.Elements = append(f.Elements, view.ElementForm{Group: g, Index: i, First: i == 0, Last: i == len(b.Elements)-1})
		f.AddAt = append(f.AddAt, view.Option{Value: strconv.Itoa(i + 1), Label: "after " + nonEmpty(e.ID, fmt.Sprintf("element %d", i+1))})
	}
	f.Source.Errors = append(f.Source.Errors, fb.take("source")...)
	for _, p := range fb.rest {
		f.Errors = append(f.Errors, p.String())
	}
	return f
}

func nonEmpty(s, def string) string {
	if s == "" {
		return def
	}
	return s
}

func elementTitle(i int, e optics.Element) string {
	return fmt.Sprintf("%d. %s (%s)", i+1, nonEmpty(e.ID, "no id"), e.Type)
}

// itemMessage prefixes a message about one item of a list field with the item's number.
func itemMessage(path, name, msg string) string {
	rest := strings.TrimPrefix(path, name)
	if rest == "" {
		return msg
	}
	if strings.HasPrefix(rest, "[") {
		if end := strings.Index(rest, "]"); end > 0 {
			if n, err := strconv.Atoi(rest[1:end]); err == nil {
				return fmt.Sprintf("item %d: %s", n+1, msg)
			}
		}
	}
	return strings.TrimPrefix(rest, ".") + ": " + msg
}

// fieldFor finds the input a problem path belongs to: the path itself or its nearest parent that
// is a field (elements[2].faces_mm[0] -> elements[2].faces_mm).
func fieldFor(path string, names map[string]bool) (string, bool) {
	for p := path; p != ""; p = parentPath(p) {
		if names[p] {
			return p, true
		}
	}
	return "", false
}

// parentPath drops the last segment of a JSON path: a.b[2] -> a.b, a.b -> a, a -> "".
func parentPath(p string) string {
	i := strings.LastIndexAny(p, ".[")
	if i < 0 {
		return ""
	}
	return p[:i]
}

// take removes and returns the unattached problems at or below prefix.
func (fb *formBuilder) take(prefix string) []string {
	var out []string
	kept := fb.rest[:0]
	for _, p := range fb.rest {
		if p.Path == prefix || strings.HasPrefix(p.Path, prefix+".") || strings.HasPrefix(p.Path, prefix+"[") {
			msg := strings.TrimPrefix(strings.TrimPrefix(p.Path, prefix), ".")
			if msg != "" {
				msg += ": "
			}
			out = append(out, msg+p.Message)
			continue
		}
		kept = append(kept, p)
	}
	fb.rest = kept
	return out
}

// spec describes one field: name (JSON path), label, unit and kind.
type spec struct{ name, label, unit, kind string }

func (fb *formBuilder) group(title, testID, prefix string, specs []spec) view.Group {
	g := view.Group{Title: title, TestID: testID, Fields: fb.fields(specs)}
	if prefix != "" && prefix != "source" {
		g.Errors = fb.take(prefix)
	}
	return g
}

func (fb *formBuilder) fields(specs []spec) []view.Field {
	out := make([]view.Field, 0, len(specs))
	for _, s := range specs {
		f := view.Field{Name: s.name, Label: s.label, Unit: s.unit, Kind: s.kind, Value: fb.values[s.name]}
		f.Error = strings.Join(fb.problems[s.name], "; ")
		switch {
		case strings.HasSuffix(s.name, ".type"):
			f.Kind, f.Options, f.Apply = "select", typeOptions(), true
		case s.name == "source.kind":
			f.Kind, f.Apply = "select", true
			f.Options = []view.Option{{Value: optics.SourceCollimated, Label: "collimated bundle"}, {Value: optics.SourcePoint, Label: "point source"}}
		case s.name == "table.grid":
			f.Kind = "select"
			f.Options = []view.Option{{Value: optics.GridMetric25, Label: "metric, 25 mm holes"}, {Value: optics.GridImperial1, Label: "imperial, 1 in holes"}, {Value: optics.GridNone, Label: "no grid"}}
		}
		out = append(out, f)
	}
	return out
}

func typeOptions() []view.Option {
	labels := map[string]string{
		optics.TypeLens: "lens", optics.TypeThinLens: "thin lens", optics.TypeMirror: "mirror",
		optics.TypeAperture: "aperture (iris, pinhole)", optics.TypeScreen: "screen (camera, card)", optics.TypeDump: "beam dump",
	}
	out := make([]view.Option, len(elementTypes))
	for i, t := range elementTypes {
		out[i] = view.Option{Value: t, Label: labels[t]}
	}
	return out
}

func generalFields() []spec {
	return []spec{
		{"title", "title", "", ""},
		{"wavelengths_nm", "wavelengths (first is primary, comma list)", "nm", ""},
		{"notes", "notes", "", "textarea"},
	}
}

func tableFields() []spec {
	return []spec{
		{"table.grid", "hole grid", "", ""},
		{"table.width_mm", "width", "mm", ""},
		{"table.depth_mm", "depth", "mm", ""},
		{"table.beam_height_mm", "beam height", "mm", ""},
		{"table.hole_offset_mm", "first hole from the edges (empty: by grid)", "mm", ""},
	}
}

func sourceFields(kind string) []spec {
	s := []spec{
		{"source.kind", "kind", "", ""},
		{"source._kind_shown", "", "", "hidden"},
		{"source.x_mm", "x on the table", "mm", ""},
		{"source.y_mm", "y on the table", "mm", ""},
		{"source.heading_deg", "heading", "°", ""},
	}
	switch kind {
	case optics.SourcePoint:
		s = append(s, spec{"source.na", "numerical aperture", "", ""}, spec{"source.object_heights_mm", "object heights (comma list)", "mm", ""})
	default:
		s = append(s, spec{"source.semi_diameter_mm", "bundle radius", "mm", ""}, spec{"source.field_angles_deg", "field angles (comma list)", "°", ""})
	}
	return append(s, spec{"source.fan_rays", "rays per fan (empty: 21)", "", ""})
}

func beamFields() []spec {
	return []spec{
		{"source.beam.waist_radius_mm", "waist radius (1/e²)", "mm", ""},
		{"source.beam.waist_at_mm", "waist position from the source", "mm", ""},
		{"source.beam.m2", "M² (empty: 1)", "", ""},
	}
}

func elementFields(i int, typ string) []spec {
	p := fmt.Sprintf("elements[%d].", i)
	s := []spec{
		{p + "id", "id", "", ""},
		{p + "type", "type", "", ""},
		{p + "_type_shown", "", "", "hidden"},
		{p + "gap_mm", "gap from the previous element", "mm", ""},
	}
	switch typ {
	case optics.TypeLens:
		s = append(s,
			spec{p + "faces_mm", "face radii (comma list, flat for flat)", "mm", ""},
			spec{p + "thicknesses_mm", "thicknesses (comma list)", "mm", ""},
			spec{p + "materials", "materials (comma list)", "", ""},
			spec{p + "diameter_mm", "clear diameter (empty: unlimited)", "mm", ""})
	case optics.TypeThinLens:
		s = append(s, spec{p + "focal_mm", "focal length", "mm", ""}, spec{p + "diameter_mm", "clear diameter (empty: unlimited)", "mm", ""})
	case optics.TypeMirror:
		s = append(s,
			spec{p + "radius_mm", "radius (+ concave, flat)", "mm", ""},
			spec{p + "turn_deg", "turn (+ counter-clockwise)", "°", ""},
			spec{p + "diameter_mm", "clear diameter (empty: unlimited)", "mm", ""})
	case optics.TypeAperture:
		s = append(s, spec{p + "diameter_mm", "clear diameter", "mm", ""})
	case optics.TypeScreen:
		s = append(s, spec{p + "width_mm", "width (empty: unlimited)", "mm", ""})
	}
	return append(s,
		spec{p + "mount.width_mm", "mount width (empty: by type)", "mm", ""},
		spec{p + "mount.depth_mm", "mount depth", "mm", ""})
}

// fieldNames lists every input name the form for b has.
func fieldNames(b *optics.Bench) map[string]bool {
	names := map[string]bool{"materials": true}
	add := func(specs []spec) {
		for _, s := range specs {
			names[s.name] = true
		}
	}
	add(generalFields())
	add(tableFields())
	add(sourceFields(b.Source.Kind))
	add(beamFields())
	for i := range b.Source.Rays {
		p := fmt.Sprintf("source.rays[%d].", i)
		for _, n := range []string{"height_mm", "angle_deg", "x_mm", "x_angle_deg"} {
			names[p+n] = true
		}
	}
	for i, e := range b.Elements {
		add(elementFields(i, e.Type))
	}
	return names
}
