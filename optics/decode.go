package optics

import (
	"encoding/json"
	"slices"
	"strings"
)

// MaxBenchBytes is the largest bench file Decode reads (1 MiB).
const MaxBenchBytes = 1 << 20

// Keys allowed in each object of the bench file. An element or source may carry only the keys of
// its own type or kind: a key that belongs to another type is as unknown as a misspelt one.
var (
	benchKeys   = []string{"format", "title", "notes", "wavelengths_nm", "table", "source", "materials", "elements"}
	tableKeys   = []string{"grid", "width_mm", "depth_mm", "beam_height_mm", "hole_offset_mm"}
	sourceKeys  = []string{"x_mm", "y_mm", "heading_deg", "kind", "rays", "beam", "fan_rays"}
	kindKeys    = map[string][]string{SourceCollimated: {"semi_diameter_mm", "field_angles_deg"}, SourcePoint: {"na", "object_heights_mm"}}
	elementKeys = []string{"id", "type", "gap_mm", "mount"}
	typeKeys    = map[string][]string{
		TypeLens:     {"faces_mm", "thicknesses_mm", "materials", "diameter_mm"},
		TypeThinLens: {"focal_mm", "diameter_mm"},
		TypeMirror:   {"radius_mm", "turn_deg", "diameter_mm"},
		TypeAperture: {"diameter_mm"},
		TypeScreen:   {"width_mm"},
		TypeDump:     {},
	}
	materialKeys  = []string{"sellmeier", "range_nm", "nd", "vd", "index"}
	sellmeierKeys = []string{"b", "c_um2"}
	mountKeys     = []string{"width_mm", "depth_mm"}
	beamKeys      = []string{"waist_radius_mm", "waist_at_mm", "m2"}
	rayKeys       = []string{"height_mm", "angle_deg", "x_mm", "x_angle_deg"}
)

// Decode reads a bench file (format raytable/bench/v1) strictly and validates it.
//
// Every problem is collected and returned at once as an *Error with code EInvalid whose Problems
// name the JSON path and the rule: unknown keys (including a key of another element type or
// source kind), keys given twice, values of the wrong JSON type, missing required fields, and
// everything Validate checks. null is accepted only as a lens face or mirror radius, where it
// means flat. Optional keys: title, notes, materials, table.hole_offset_mm, and in source
// field_angles_deg, object_heights_mm, fan_rays, rays, beam (and its m2), a ray's x_mm and
// x_angle_deg, and in elements diameter_mm, a mirror's radius_mm, a screen's width_mm and mount.
// Input above MaxBenchBytes gives an *Error with code ETooLarge.
func Decode(data []byte) (*Bench, error) {
	decodes.Add(1)
	if len(data) > MaxBenchBytes {
		return nil, Errorf(ETooLarge, "the bench file is %d bytes; at most %d bytes (1 MiB) are accepted", len(data), MaxBenchBytes)
	}
	if !json.Valid(data) {
		var probe any // Unmarshal checks the syntax first and says where it fails
		return nil, Invalid([]Problem{syntaxProblem(data, json.Unmarshal(data, &probe))})
	}
	r := &reader{}
	b := r.bench(data)
	if b == nil {
		return nil, Invalid(r.problems)
	}
	problems := r.problems
	problems = append(problems, unlessCovered(validationProblems(b), r.problems)...)
	if len(problems) > 0 {
		return nil, Invalid(problems)
	}
	return b, nil
}

// unlessCovered drops the validation problems at or below a path where decoding already failed:
// a value that could not be read was left zero, and Validate would only repeat the complaint.
func unlessCovered(problems, decoded []Problem) []Problem {
	var out []Problem
	for _, p := range problems {
		covered := false
		for _, d := range decoded {
			if d.Path == "" || p.Path == d.Path || strings.HasPrefix(p.Path, d.Path+".") || strings.HasPrefix(p.Path, d.Path+"[") {
				covered = true
				break
			}
		}
		if !covered {
			out = append(out, p)
		}
	}
	return out
}

// unknown reports the members whose keys are not in allowed; why completes "unknown field".
func (r *reader) unknown(path string, members []member, why string, allowed ...[]string) {
	for _, m := range members {
		known := false
		for _, set := range allowed {
			if slices.Contains(set, m.key) {
				known = true
				break
			}
		}
		if !known {
			var all []string
			for _, set := range allowed {
				all = append(all, set...)
			}
			r.add(field(path, m.key), "unknown field%s (allowed: %s)", why, strings.Join(all, ", "))
		}
	}
}

func (r *reader) bench(data []byte) *Bench {
	members, ok := r.object("", data)
	if !ok {
		r.problems[len(r.problems)-1].Message = "a bench file must be a JSON object"
		return nil
	}
	r.unknown("", members, "", benchKeys)
	r.require("", members, "format", "wavelengths_nm", "table", "source", "elements")
	b := &Bench{Elements: []Element{}}
	for _, m := range members {
		switch m.key {
		case "format":
			b.Format, _ = r.str(m.key, m.raw)
		case "title":
			b.Title, _ = r.str(m.key, m.raw)
		case "notes":
			b.Notes, _ = r.str(m.key, m.raw)
		case "wavelengths_nm":
			b.WavelengthsNM = r.numbers(m.key, m.raw)
		case "table":
			b.Table = r.table(m.key, m.raw)
		case "source":
			b.Source = r.source(m.key, m.raw)
		case "materials":
			b.Materials = r.materials(m.key, m.raw)
		case "elements":
			if items, ok := r.array(m.key, m.raw); ok {
				for i, item := range items {
					b.Elements = append(b.Elements, r.element(index(m.key, i), item))
				}
			}
		}
	}
	return b
}

func (r *reader) table(path string, raw json.RawMessage) Table {
	var t Table
	members, ok := r.object(path, raw)
	if !ok {
		return t
	}
	r.unknown(path, members, "", tableKeys)
	r.require(path, members, "grid", "width_mm", "depth_mm", "beam_height_mm")
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "grid":
			t.Grid, _ = r.str(p, m.raw)
		case "width_mm":
			t.WidthMM, _ = r.number(p, m.raw)
		case "depth_mm":
			t.DepthMM, _ = r.number(p, m.raw)
		case "beam_height_mm":
			t.BeamHeightMM, _ = r.number(p, m.raw)
		case "hole_offset_mm":
			t.HoleOffsetMM = r.ptrNumber(p, m.raw)
		}
	}
	return t
}

func (r *reader) source(path string, raw json.RawMessage) Source {
	var s Source
	members, ok := r.object(path, raw)
	if !ok {
		return s
	}
	r.require(path, members, "x_mm", "y_mm", "heading_deg", "kind")
	// The kind decides which keys are allowed; read it first.
	if kindRaw, ok := lookup(members, "kind"); ok {
		s.Kind, _ = r.str(field(path, "kind"), kindRaw)
	}
	if extra, known := kindKeys[s.Kind]; known {
		r.unknown(path, members, " for a "+s.Kind+" source", sourceKeys, extra)
	} else {
		// An unknown kind is reported by Validate; judge keys against every kind.
		r.unknown(path, members, "", sourceKeys, kindKeys[SourceCollimated], kindKeys[SourcePoint])
	}
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "x_mm":
			s.XMM, _ = r.number(p, m.raw)
		case "y_mm":
			s.YMM, _ = r.number(p, m.raw)
		case "heading_deg":
			s.HeadingDeg, _ = r.number(p, m.raw)
		case "semi_diameter_mm":
			s.SemiDiameterMM = r.ptrNumber(p, m.raw)
		case "field_angles_deg":
			s.FieldAnglesDeg = r.numbers(p, m.raw)
		case "na":
			s.NA = r.ptrNumber(p, m.raw)
		case "object_heights_mm":
			s.ObjectHeightsMM = r.numbers(p, m.raw)
		case "fan_rays":
			if n, ok := r.integer(p, m.raw); ok {
				s.FanRays = &n
			}
		case "rays":
			if items, ok := r.array(p, m.raw); ok {
				for i, item := range items {
					s.Rays = append(s.Rays, r.ray(index(p, i), item))
				}
			}
		case "beam":
			s.Beam = r.beam(p, m.raw)
		}
	}
	return s
}

func (r *reader) ray(path string, raw json.RawMessage) ExplicitRay {
	var ray ExplicitRay
	members, ok := r.object(path, raw)
	if !ok {
		return ray
	}
	r.unknown(path, members, "", rayKeys)
	r.require(path, members, "height_mm", "angle_deg")
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "height_mm":
			ray.HeightMM, _ = r.number(p, m.raw)
		case "angle_deg":
			ray.AngleDeg, _ = r.number(p, m.raw)
		case "x_mm":
			ray.XMM, _ = r.number(p, m.raw)
		case "x_angle_deg":
			ray.XAngleDeg, _ = r.number(p, m.raw)
		}
	}
	return ray
}

func (r *reader) beam(path string, raw json.RawMessage) *Beam {
	members, ok := r.object(path, raw)
	if !ok {
		return nil
	}
	r.unknown(path, members, "", beamKeys)
	r.require(path, members, "waist_radius_mm") // waist_at_mm defaults to 0: the waist at the source
	bm := &Beam{}
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "waist_radius_mm":
			bm.WaistRadiusMM, _ = r.number(p, m.raw)
		case "waist_at_mm":
			bm.WaistAtMM, _ = r.number(p, m.raw)
		case "m2":
			bm.M2 = r.ptrNumber(p, m.raw)
		}
	}
	return bm
}

func (r *reader) materials(path string, raw json.RawMessage) map[string]MaterialSpec {
	members, ok := r.object(path, raw)
	if !ok || len(members) == 0 {
		return nil
	}
	out := make(map[string]MaterialSpec, len(members))
	for _, m := range members {
		out[m.key] = r.material(materialPath(m.key), m.raw)
	}
	return out
}

func (r *reader) material(path string, raw json.RawMessage) MaterialSpec {
	var spec MaterialSpec
	members, ok := r.object(path, raw)
	if !ok {
		return spec
	}
	r.unknown(path, members, "", materialKeys)
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "sellmeier":
			spec.Sellmeier = r.sellmeier(p, m.raw)
		case "range_nm":
			spec.RangeNM = r.numbers(p, m.raw)
		case "nd":
			spec.ND = r.ptrNumber(p, m.raw)
		case "vd":
			spec.VD = r.ptrNumber(p, m.raw)
		case "index":
			spec.Index = r.ptrNumber(p, m.raw)
		}
	}
	return spec
}

func (r *reader) sellmeier(path string, raw json.RawMessage) *SellmeierSpec {
	members, ok := r.object(path, raw)
	if !ok {
		return nil
	}
	r.unknown(path, members, "", sellmeierKeys)
	r.require(path, members, "b", "c_um2")
	s := &SellmeierSpec{}
	for _, m := range members {
		p := field(path, m.key)
		switch m.key {
		case "b":
			s.B = r.numbers(p, m.raw)
		case "c_um2":
			s.CUM2 = r.numbers(p, m.raw)
		}
	}
	return s
}
