package optics

import (
	"math"
	"raytable/optics/numfmt"
	"reflect"
	"slices"
	"strings"
	"unicode"
	"unicode/utf8"

	"raytable/optics/material"
)

// Limits that Validate enforces.
const (
	MinWavelengthNM = 200.0   // shortest accepted wavelength
	MaxWavelengthNM = 20000.0 // longest accepted wavelength
	MaxLengthMM     = 1e6     // largest accepted magnitude of any length; more is a slip, not a bench
	MinLengthMM     = 1e-6    // smallest non-zero magnitude of any length (1 nm); less is a slip and overflows 1/x
	MaxIDLength     = 40      // longest element id
	MaxTitleLength  = 200     // longest title, in characters
	MaxNotesLength  = 4000    // longest notes, in characters
	MaxM2           = 10000   // largest beam quality factor; past it the embedded-Gaussian model says nothing useful
	MaxHeadingDeg   = 360.0   // largest accepted |source heading|
)

// Validate checks every rule of the bench format on a bench built in Go (for example from the web
// form, which can produce NaN and Inf where JSON cannot). It returns nil or an *Error with code
// EInvalid listing every problem at once, each naming its JSON path, the rule and the numbers.
func Validate(b *Bench) error {
	return Invalid(validationProblems(b))
}

// checker collects problems for Validate.
type checker struct {
	reader
	b            *Bench
	userMedia    map[string]material.Medium // user materials without problems, built once
	checkedMedia map[string]bool            // lens media already checked, so that each is reported once
}

func validationProblems(b *Bench) []Problem {
	validations.Add(1)
	if b == nil {
		return []Problem{{Message: "no bench given"}}
	}
	v := &checker{b: b, userMedia: map[string]material.Medium{}, checkedMedia: map[string]bool{}}
	if b.Format != FormatBenchV1 {
		v.add("format", "must be %q, got %q", FormatBenchV1, b.Format)
	}
	v.text("title", b.Title, MaxTitleLength, false)
	v.text("notes", b.Notes, MaxNotesLength, true)
	v.wavelengths()
	v.table()
	v.source()
	v.materials()
	v.elements()
	return v.problems
}

// finite reports whether x is a finite number, and says so when it is not.
func (v *checker) finite(path string, x float64) bool {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		v.add(path, "must be a finite number, got %v", x)
		return false
	}
	return true
}

// length checks a length in mm: finite and at most MaxLengthMM in magnitude.
func (v *checker) length(path string, x float64) bool {
	if !v.finite(path, x) {
		return false
	}
	if math.Abs(x) > MaxLengthMM {
		v.add(path, "%s mm is out of range: lengths are limited to %s mm in magnitude", fmtNum(x), fmtNum(MaxLengthMM))
		return false
	}
	if x != 0 && math.Abs(x) < MinLengthMM {
		v.add(path, "%s mm is too small: a length other than 0 must be at least %s mm (1 nm) in magnitude", fmtNum(x), fmtNum(MinLengthMM))
		return false
	}
	return true
}

// positive checks a length that must be > 0.
func (v *checker) positive(path string, x float64) bool {
	if !v.length(path, x) {
		return false
	}
	if x <= 0 {
		v.add(path, "must be greater than 0 mm, got %s", fmtNum(x))
		return false
	}
	return true
}

// nonNegative checks a length that must be >= 0.
func (v *checker) nonNegative(path string, x float64) bool {
	if !v.length(path, x) {
		return false
	}
	if x < 0 {
		v.add(path, "must be at least 0 mm, got %s", fmtNum(x))
		return false
	}
	return true
}

// text checks free text: at most max characters and no control characters, which break drawings
// and downloads (line breaks and tabs are allowed where multiline is).
func (v *checker) text(path, s string, max int, multiline bool) {
	if n := utf8.RuneCountInString(s); n > max {
		v.add(path, "is %d characters long; at most %d are allowed", n, max)
	}
	for _, r := range s {
		if multiline && (r == '\n' || r == '\t' || r == '\r') {
			continue
		}
		if unicode.IsControl(r) {
			v.add(path, "contains the control character %U; use plain text", r)
			return
		}
	}
}

// angle checks an angle whose tangent is taken: finite and strictly inside ±90°.
func (v *checker) angle(path string, deg float64) {
	if v.finite(path, deg) && math.Abs(deg) >= 90 {
		v.add(path, "angle %s° must lie strictly between -90° and 90°", fmtNum(deg))
	}
}

// most reports a list at path that is longer than its cap (optics/limits.go), naming what it holds.
func (v *checker) most(path string, n, max int, what string) {
	if n > max {
		v.add(path, "has %d %s; at most %d are allowed", n, what, max)
	}
}

func (v *checker) wavelengths() {
	if len(v.b.WavelengthsNM) == 0 {
		v.add("wavelengths_nm", "at least one wavelength is required")
		return
	}
	v.most("wavelengths_nm", len(v.b.WavelengthsNM), MaxWavelengths, "wavelengths")
	for i, w := range v.b.WavelengthsNM {
		p := index("wavelengths_nm", i)
		if v.finite(p, w) && (w < MinWavelengthNM || w > MaxWavelengthNM) {
			v.add(p, "%s nm is outside the accepted range %s-%s nm", fmtNum(w), fmtNum(MinWavelengthNM), fmtNum(MaxWavelengthNM))
		}
	}
}

// wavelengthsValid reports whether every wavelength passed its checks (so indices can be evaluated).
func (v *checker) wavelengthsValid() bool {
	for _, w := range v.b.WavelengthsNM {
		if !(w >= MinWavelengthNM && w <= MaxWavelengthNM) {
			return false
		}
	}
	return len(v.b.WavelengthsNM) > 0
}

func (v *checker) table() {
	t := &v.b.Table
	switch t.Grid {
	case GridMetric25, GridImperial1, GridNone:
	default:
		v.add("table.grid", "must be %q, %q or %q, got %q", GridMetric25, GridImperial1, GridNone, t.Grid)
	}
	okW := v.positive("table.width_mm", t.WidthMM)
	okD := v.positive("table.depth_mm", t.DepthMM)
	v.nonNegative("table.beam_height_mm", t.BeamHeightMM)
	if t.HoleOffsetMM != nil && v.nonNegative("table.hole_offset_mm", *t.HoleOffsetMM) && okW && okD {
		if size := min(t.WidthMM, t.DepthMM); *t.HoleOffsetMM >= size {
			v.add("table.hole_offset_mm", "%s mm must be less than the table size (%s mm, the smaller of width and depth)",
				fmtNum(*t.HoleOffsetMM), fmtNum(size))
		}
	}
}

func (v *checker) source() { v.sourceAt("source", &v.b.Source) }

// sourceAt checks a source at path: the first source, or a further source whose fields stand inline
// in its more_sources entry.
func (v *checker) sourceAt(path string, s *Source) {
	at := func(key string) string { return field(path, key) }
	v.length(at("x_mm"), s.XMM)
	v.length(at("y_mm"), s.YMM)
	if v.finite(at("heading_deg"), s.HeadingDeg) && math.Abs(s.HeadingDeg) > MaxHeadingDeg {
		v.add(at("heading_deg"), "%s° is out of range: use a heading between -360° and 360°", fmtNum(s.HeadingDeg))
	}
	if k, known := SourceKindOf(s.Kind); known {
		sv := reflect.ValueOf(s).Elem()
		v.stray(path, sv, sourceKindFields, keys(k.Fields), " for a "+k.Noun)
		v.need(path, sv, k.Fields, k.Noun)
		k.check(v, path, s)
	} else {
		v.add(at("kind"), "must be %s, got %q", quotedList(SourceKindNames()), s.Kind)
	}
	if s.FanRays != nil && (*s.FanRays < 1 || *s.FanRays > MaxFanRays) {
		v.add(at("fan_rays"), "must be between 1 and %d rays, got %d", MaxFanRays, *s.FanRays)
	}
	v.most(at("rays"), len(s.Rays), MaxExplicitRays, "explicit rays")
	for i, r := range s.Rays {
		p := index(at("rays"), i)
		v.length(field(p, "height_mm"), r.HeightMM)
		v.angle(field(p, "angle_deg"), r.AngleDeg)
		v.length(field(p, "x_mm"), r.XMM)
		v.angle(field(p, "x_angle_deg"), r.XAngleDeg)
	}
	if bm := s.Beam; bm != nil {
		v.positive(at("beam.waist_radius_mm"), bm.WaistRadiusMM)
		v.length(at("beam.waist_at_mm"), bm.WaistAtMM)
		v.beamQuality(at("beam.m2"), bm.M2)
		if bm.Sagittal != nil {
			v.beamPlane(at("beam.sagittal"), bm.Sagittal)
		}
	}
	if s.HeightMM != nil {
		v.nonNegative(at("height_mm"), *s.HeightMM)
	}
	v.sourcePower(path, s)
}

// collimated checks the fields of a collimated source.
func (v *checker) collimated(path string, s *Source) {
	if s.SemiDiameterMM != nil {
		v.positive(field(path, "semi_diameter_mm"), *s.SemiDiameterMM)
	}
	v.most(field(path, "field_angles_deg"), len(s.FieldAnglesDeg), MaxFieldAngles, "field angles")
	for i, a := range s.FieldAnglesDeg {
		v.angle(index(field(path, "field_angles_deg"), i), a)
	}
}

// pointSource checks the fields of a point source.
func (v *checker) pointSource(path string, s *Source) {
	if s.NA != nil && v.finite(field(path, "na"), *s.NA) && (*s.NA <= 0 || *s.NA >= 1) {
		v.add(field(path, "na"), "numerical aperture %s must lie strictly between 0 and 1", fmtNum(*s.NA))
	}
	v.most(field(path, "object_heights_mm"), len(s.ObjectHeightsMM), MaxObjectHeights, "object heights")
	for i, h := range s.ObjectHeightsMM {
		v.length(index(field(path, "object_heights_mm"), i), h)
	}
}

// stray reports the fields of obj (a struct value) among kindFields that are set but not among
// allowed: fields that belong to another element type or source kind. They are reported in the
// order of their keys.
func (v *checker) stray(path string, obj reflect.Value, kindFields []Field, allowed []string, why string) {
	set := map[string]bool{}
	for _, f := range kindFields {
		set[f.Key] = !f.value(obj).IsZero()
	}
	for _, k := range sortedKeys(set) {
		if set[k] && !slices.Contains(allowed, k) {
			v.add(field(path, k), "unknown field%s (allowed: %s)", why, strings.Join(allowed, ", "))
		}
	}
}

// need reports the required fields among fields that obj (a struct value) lacks, naming the kind:
// "a thin lens needs focal_mm".
func (v *checker) need(path string, obj reflect.Value, fields []Field, noun string) {
	for _, f := range fields {
		if !f.Required || !f.value(obj).IsZero() {
			continue
		}
		about := ""
		if f.About != "" {
			about = ", " + f.About
		}
		v.add(field(path, f.Key), "a %s needs %s%s", noun, f.Key, about)
	}
}

// fmtNum formats a number compactly: plain decimals without trailing zeros, exponent form only for
// very large or very small magnitudes.
func fmtNum(x float64) string { return numfmt.Exact.Format(x) }

// fmtRound formats a computed value to 4 significant digits, for messages.
func fmtRound(x float64) string { return numfmt.Message.Format(x) }

// plainName reports whether s uses only letters, digits, '-', '_' and '.'.
func plainName(s string) bool {
	for _, c := range s {
		switch {
		case c >= 'a' && c <= 'z', c >= 'A' && c <= 'Z', c >= '0' && c <= '9', c == '-', c == '_', c == '.':
		default:
			return false
		}
	}
	return true
}
