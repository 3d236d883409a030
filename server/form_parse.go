package server

import (
	"bytes"
	"encoding/json"
	"fmt"
	"net/url"
	"strconv"
	"strings"

	"raytable/optics"
)

// maxFormElements bounds the element loop of a posted form; the bench rules allow fewer
// (optics.MaxElements) and say so, this only stops a hostile form from looping long.
const maxFormElements = 1000

// formReader turns posted form values, named by their JSON paths, into a bench. It collects a
// problem for every field it cannot read and keeps going, so that all of them are shown at once.
type formReader struct {
	vals     url.Values
	problems []optics.Problem
}

func (f *formReader) add(path, format string, args ...any) {
	f.problems = append(f.problems, optics.Problem{Path: path, Message: fmt.Sprintf(format, args...)})
}

func (f *formReader) has(path string) bool { _, ok := f.vals[path]; return ok }

// get returns a field's text. A field sent more than once is a problem rather than a silent pick
// of one copy: a browser never does that, so the form is not the one the page drew.
func (f *formReader) get(path string) string {
	vs := f.vals[path]
	if len(vs) > 1 && !f.problemAt(path) {
		f.add(path, "was sent %d times; send each field once (reload the page and try again)", len(vs))
	}
	if len(vs) == 0 {
		return ""
	}
	return vs[0]
}

func (f *formReader) text(path string) string { return strings.TrimSpace(f.get(path)) }

// num reads a required number.
func (f *formReader) num(path string, q *optics.Quantity) float64 {
	s := f.text(path)
	if s == "" {
		f.add(path, "is required; %s", q.Hint)
		return 0
	}
	v, err := q.Parse(s)
	if err != nil {
		f.add(path, "%s", err)
	}
	return v
}

// optNum reads an optional number; an empty field is nil.
func (f *formReader) optNum(path string, q *optics.Quantity) *float64 {
	s := f.text(path)
	if s == "" {
		return nil
	}
	v, err := q.Parse(s)
	if err != nil {
		f.add(path, "%s", err)
		return nil
	}
	return &v
}

// splitList splits a comma list. An all-blank field is an empty list.
func splitList(s string) []string {
	if strings.TrimSpace(s) == "" {
		return nil
	}
	parts := strings.Split(s, ",")
	for i := range parts {
		parts[i] = strings.TrimSpace(parts[i])
	}
	return parts
}

// list reads a comma list of numbers; the problem of item i is at path[i].
func (f *formReader) list(path string, q *optics.Quantity) []float64 {
	items := splitList(f.get(path))
	if items == nil {
		return nil
	}
	out := make([]float64, len(items))
	for i, s := range items {
		v, err := q.Parse(s)
		if err != nil {
			f.add(fmt.Sprintf("%s[%d]", path, i), "%s", err)
		}
		out[i] = v
	}
	return out
}

// faces reads lens face radii: a length, or "flat" or nothing for a flat face.
func (f *formReader) faces(path string) []*float64 {
	raw := f.get(path)
	if strings.TrimSpace(raw) == "" {
		return nil
	}
	items := strings.Split(raw, ",")
	out := make([]*float64, len(items))
	for i, s := range items {
		s = strings.TrimSpace(s)
		if s == "" || strings.EqualFold(s, "flat") {
			continue
		}
		v, err := optics.Length.Parse(s)
		if err != nil {
			f.add(fmt.Sprintf("%s[%d]", path, i), "%s, or flat", err)
			continue
		}
		out[i] = &v
	}
	return out
}

// radius reads a mirror radius: a length, or "flat" or nothing.
func (f *formReader) radius(path string) *float64 {
	s := f.text(path)
	if s == "" || strings.EqualFold(s, "flat") {
		return nil
	}
	return f.optNum(path, optics.Length)
}

// count reads an optional whole number.
func (f *formReader) count(path string) *int {
	s := f.text(path)
	if s == "" {
		return nil
	}
	n, err := strconv.Atoi(s)
	if err != nil {
		f.add(path, "%q is not a whole number; use a count such as 21", s)
		return nil
	}
	return &n
}

// parseBenchForm reads the edit form. It returns the bench and every problem found reading the
// fields; the bench rules (optics.Validate) are checked afterwards.
func parseBenchForm(vals url.Values) (*optics.Bench, []optics.Problem) {
	f := &formReader{vals: vals}
	b := &optics.Bench{
		Format:        optics.FormatBenchV1,
		Title:         f.text("title"),
		Notes:         strings.TrimSpace(strings.ReplaceAll(f.get("notes"), "\r\n", "\n")),
		WavelengthsNM: f.list("wavelengths_nm", optics.Wavelength),
	}
	b.Table = optics.Table{
		Grid:         f.text("table.grid"),
		WidthMM:      f.num("table.width_mm", optics.Length),
		DepthMM:      f.num("table.depth_mm", optics.Length),
		BeamHeightMM: f.num("table.beam_height_mm", optics.Length),
		HoleOffsetMM: f.optNum("table.hole_offset_mm", optics.Length),
	}
	b.Source = f.source()
	b.Materials = f.materials()
	for i := 0; f.has(fmt.Sprintf("elements[%d].type", i)); i++ {
		if i >= maxFormElements {
			f.add("elements", "more than %d elements; a bench holds at most %d", maxFormElements, optics.MaxElements)
			break
		}
		b.Elements = append(b.Elements, f.element(i))
	}
	return b, f.problems
}

func (f *formReader) source() optics.Source {
	s := optics.Source{
		XMM:        f.num("source.x_mm", optics.Length),
		YMM:        f.num("source.y_mm", optics.Length),
		HeadingDeg: f.num("source.heading_deg", optics.Angle),
		Kind:       f.text("source.kind"),
		FanRays:    f.count("source.fan_rays"),
	}
	shown := f.text("source._kind_shown")
	if shown != "" && shown != s.Kind {
		// The kind was changed and applied: its own fields were not on the form yet.
		def := defaultSource(s.Kind)
		s.SemiDiameterMM, s.FieldAnglesDeg, s.NA, s.ObjectHeightsMM = def.SemiDiameterMM, def.FieldAnglesDeg, def.NA, def.ObjectHeightsMM
	} else {
		switch s.Kind {
		case optics.SourceCollimated:
			s.SemiDiameterMM = f.optNum("source.semi_diameter_mm", optics.Length)
			s.FieldAnglesDeg = f.list("source.field_angles_deg", optics.Angle)
		case optics.SourcePoint:
			s.NA = f.optNum("source.na", optics.Plain)
			s.ObjectHeightsMM = f.list("source.object_heights_mm", optics.Length)
		}
	}
	for i := 0; f.has(fmt.Sprintf("source.rays[%d].height_mm", i)) && i < maxFormElements; i++ {
		p := fmt.Sprintf("source.rays[%d].", i)
		s.Rays = append(s.Rays, optics.ExplicitRay{
			HeightMM:  f.num(p+"height_mm", optics.Length),
			AngleDeg:  f.num(p+"angle_deg", optics.Angle),
			XMM:       f.zeroNum(p+"x_mm", optics.Length),
			XAngleDeg: f.zeroNum(p+"x_angle_deg", optics.Angle),
		})
	}
	if f.text("source.beam.waist_radius_mm")+f.text("source.beam.waist_at_mm")+f.text("source.beam.m2") != "" {
		s.Beam = &optics.Beam{
			WaistRadiusMM: f.num("source.beam.waist_radius_mm", optics.Length),
			WaistAtMM:     f.zeroNum("source.beam.waist_at_mm", optics.Length),
			M2:            f.optNum("source.beam.m2", optics.Plain),
		}
	}
	return s
}

// zeroNum reads a number whose empty field means 0.
func (f *formReader) zeroNum(path string, q *optics.Quantity) float64 {
	if f.text(path) == "" {
		return 0
	}
	return f.num(path, q)
}

// materials reads the user media, written as the JSON object of the bench file.
func (f *formReader) materials() map[string]optics.MaterialSpec {
	s := f.text("materials")
	if s == "" || s == "{}" {
		return nil
	}
	dec := json.NewDecoder(bytes.NewReader([]byte(s)))
	dec.DisallowUnknownFields()
	var m map[string]optics.MaterialSpec
	if err := dec.Decode(&m); err != nil {
		f.add("materials", "is not a materials object: %v; write it as in the bench file, e.g. {\"oil\": {\"index\": 1.515}}", err)
		return nil
	}
	return m
}

func (f *formReader) element(i int) optics.Element {
	p := fmt.Sprintf("elements[%d].", i)
	typ := f.text(p + "type")
	e := optics.Element{ID: f.text(p + "id"), Type: typ}
	shown := f.text(p + "_type_shown")
	changed := shown != "" && shown != typ
	if changed {
		// The type was changed and applied: start from that type's defaults, keep what carries over.
		e = defaultElement(typ)
		e.ID = f.text(p + "id")
		if takesDiameter(typ) && takesDiameter(shown) {
			e.DiameterMM = f.optNum(p+"diameter_mm", optics.Length)
		}
	}
	e.GapMM = f.num(p+"gap_mm", optics.Length)
	if f.text(p+"mount.width_mm")+f.text(p+"mount.depth_mm") != "" {
		e.Mount = &optics.Mount{WidthMM: f.num(p+"mount.width_mm", optics.Length), DepthMM: f.num(p+"mount.depth_mm", optics.Length)}
	}
	if changed {
		return e
	}
	switch typ {
	case optics.TypeLens:
		e.FacesMM = f.faces(p + "faces_mm")
		e.ThicknessesMM = f.list(p+"thicknesses_mm", optics.Length)
		e.Materials = splitList(f.get(p + "materials"))
		e.DiameterMM = f.optNum(p+"diameter_mm", optics.Length)
	case optics.TypeThinLens:
		e.FocalMM = f.optNum(p+"focal_mm", optics.Length)
		if e.FocalMM == nil && !f.problemAt(p+"focal_mm") {
			f.add(p+"focal_mm", "is required; use a length such as 100 mm")
		}
		e.DiameterMM = f.optNum(p+"diameter_mm", optics.Length)
	case optics.TypeMirror:
		e.RadiusMM = f.radius(p + "radius_mm")
		e.TurnDeg = f.optNum(p+"turn_deg", optics.Angle)
		if e.TurnDeg == nil && !f.problemAt(p+"turn_deg") {
			f.add(p+"turn_deg", "is required; use the heading change in degrees, e.g. 90")
		}
		e.DiameterMM = f.optNum(p+"diameter_mm", optics.Length)
	case optics.TypeAperture:
		e.DiameterMM = f.optNum(p+"diameter_mm", optics.Length)
	case optics.TypeScreen:
		e.WidthMM = f.optNum(p+"width_mm", optics.Length)
	}
	return e
}

func (f *formReader) problemAt(path string) bool {
	for _, p := range f.problems {
		if p.Path == path {
			return true
		}
	}
	return false
}

func takesDiameter(typ string) bool {
	switch typ {
	case optics.TypeLens, optics.TypeThinLens, optics.TypeMirror, optics.TypeAperture:
		return true
	}
	return false
}
