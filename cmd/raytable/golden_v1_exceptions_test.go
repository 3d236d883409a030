package main

import (
	"fmt"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"
)

// v1Exception is a v1 value that changed on purpose: the key paths it covers (array indices
// written [*]), why, and which new values it accepts.
type v1Exception struct {
	paths  *regexp.Regexp
	why    string
	beam   bool // only on benches whose source has a Gaussian beam
	accept func(want, have any) bool
}

// v1Exceptions is every v1 value that may change, each as narrow as its reason.
var v1Exceptions = []v1Exception{
	{
		paths: regexp.MustCompile(`^\.(rays\[\*\]\.(pupil|start\.(y_mm|dir\[\*\])|hits\[\*\]\.(exact|paraxial)\.[a-z_]+(\[\*\])?)|blur\[\*\]\.(rms_mm|peak_mm))$`),
		why: "README, Report, Rays: a fan's pupil coordinates are exactly antisymmetric, (2j-(n-1))/(n-1); " +
			"fan rays and blur move by rounding only",
		accept: roundingOnly,
	},
	{
		paths:  regexp.MustCompile(`^\.(spacing\[\*\]\.tolerance_mm|spacing_basis\.[a-z_]+)$`),
		why:    "README, Report, spacing: with a Gaussian beam the tolerances come from the beam (kind beam-rayleigh)",
		beam:   true,
		accept: func(any, any) bool { return true },
	},
}

// roundingOnly accepts a number that differs from the old one by rounding: 1e-9 relative, or
// 1e-12 absolute for values that are themselves rounding (a blur of 1e-30 mm).
func roundingOnly(want, have any) bool {
	w, ok1 := want.(float64)
	h, ok2 := have.(float64)
	return ok1 && ok2 && math.Abs(w-h) <= math.Max(1e-12, 1e-9*math.Abs(w))
}

var indexRE = regexp.MustCompile(`\[[0-9]+\]`)

// v1Excused is the excuse function for one bench's old report.
func v1Excused(old any) func(at string, want, have any) bool {
	m, _ := old.(map[string]any)
	hasBeam := m != nil && m["beam"] != nil
	return func(at string, want, have any) bool {
		pattern := indexRE.ReplaceAllString(at, "[*]")
		for _, e := range v1Exceptions {
			if e.paths.MatchString(pattern) && (!e.beam || hasBeam) && e.accept(want, have) {
				return true
			}
		}
		return false
	}
}

// Changes that hold for some element types only are matched by the row they belong to.
// v1Changes are the v1 values changed on purpose, each a key path pattern over one list of the
// report (its first group the row index), the element types it covers there, and why.
var v1Changes = []struct {
	path  *regexp.Regexp
	types []string
	why   string
}{
	{regexp.MustCompile(`^\.elements\[(\d+)\]\.(max_exact_r_mm|clearance): `), []string{"mirror", "splitter", "periscope"},
		"a tilted surface's clearance is measured on the surface, as its clear aperture is (README 'Report, format raytable/report/v1', Rays)"},
	{regexp.MustCompile(`^\.placement\[(\d+)\]\.(table_x_mm|table_y_mm|hole_column|hole_row|offset_x_mm|offset_y_mm): `), []string{"mirror"},
		"a mirror's post stands behind its reflecting surface, the optic at the front of the mount (README 'The breadboard')"},
}

// v1ChangedByType says why problem p (a line of missingFrom) is an intended change, or "" when it is not.
func v1ChangedByType(want any, p string) string {
	for _, c := range v1Changes {
		m := c.path.FindStringSubmatch(p)
		if m == nil {
			continue
		}
		top, _ := want.(map[string]any)
		list, _ := top[strings.SplitN(p[1:], "[", 2)[0]].([]any)
		i, _ := strconv.Atoi(m[1])
		if i >= len(list) {
			continue
		}
		if row, ok := list[i].(map[string]any); ok && slices.Contains(c.types, fmt.Sprint(row["type"])) {
			return c.why
		}
	}
	return ""
}
