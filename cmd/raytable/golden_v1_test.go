package main

import (
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestGoldenReportsKeepV1 checks that the JSON report of every bench under testdata still holds
// every key of its report from before benches could branch (testdata/golden/reports/v1), with the
// same value: the report may only gain keys.
func TestGoldenReportsKeepV1(t *testing.T) {
	olds, err := filepath.Glob("../../testdata/golden/reports/v1/*.json")
	if err != nil || len(olds) == 0 {
		t.Fatalf("no v1 reports: %v", err)
	}
	for _, old := range olds {
		name := strings.TrimSuffix(filepath.Base(old), ".json")
		t.Run(name, func(t *testing.T) {
			code, got, errOut := runCmd(t, "", "report", "--json", filepath.Join("..", "..", "testdata", name+".json"))
			if code != exitOK {
				t.Fatalf("exit %d, stderr:\n%s", code, errOut)
			}
			data, err := os.ReadFile(old)
			if err != nil {
				t.Fatal(err)
			}
			var want, have any
			if err := json.Unmarshal(data, &want); err != nil {
				t.Fatal(err)
			}
			if err := json.Unmarshal([]byte(got), &have); err != nil {
				t.Fatal(err)
			}
			excused := v1Excused(want)
			for _, p := range missingFrom(want, have, "", excused) {
				if why := v1ChangedByType(want, p); why != "" {
					continue
				}
				t.Error(p)
			}
		})
	}
}

// missingFrom lists where have lacks a value of want: a key of an object, an element of an array
// (arrays keep their length), or a different scalar that excused (nil: none) does not allow. Keys
// only in have are allowed.
func missingFrom(want, have any, at string, excused func(at string, want, have any) bool) []string {
	switch w := want.(type) {
	case map[string]any:
		h, ok := have.(map[string]any)
		if !ok {
			return []string{fmt.Sprintf("%s: an object became %v", at, have)}
		}
		var out []string
		for k, v := range w {
			hv, ok := h[k]
			if !ok {
				out = append(out, fmt.Sprintf("%s.%s: missing", at, k))
				continue
			}
			out = append(out, missingFrom(v, hv, at+"."+k, excused)...)
		}
		return out
	case []any:
		h, ok := have.([]any)
		if !ok || len(h) != len(w) {
			return []string{fmt.Sprintf("%s: an array of %d became %v", at, len(w), summary(have))}
		}
		var out []string
		for i := range w {
			out = append(out, missingFrom(w[i], h[i], fmt.Sprintf("%s[%d]", at, i), excused)...)
		}
		return out
	default:
		if want != have && (excused == nil || !excused(at, want, have)) {
			return []string{fmt.Sprintf("%s: %v became %v", at, want, have)}
		}
		return nil
	}
}

func summary(v any) string {
	if a, ok := v.([]any); ok {
		return fmt.Sprintf("an array of %d", len(a))
	}
	return fmt.Sprintf("%v", v)
}

// TestMissingFrom: the subset check finds a lost key, a changed value and a shortened array, and
// lets new keys pass (cases by hand).
func TestMissingFrom(t *testing.T) {
	for _, tc := range []struct {
		want, have string
		problems   int
	}{
		{`{"a":1,"b":[1,{"c":2}]}`, `{"a":1,"b":[1,{"c":2,"d":3}],"e":4}`, 0},
		{`{"a":1,"b":2}`, `{"a":1}`, 1},
		{`{"a":1}`, `{"a":1.5}`, 1},
		{`{"a":[1,2]}`, `{"a":[1]}`, 1},
		{`{"a":null}`, `{"a":0}`, 1},
	} {
		var w, h any
		_ = json.Unmarshal([]byte(tc.want), &w)
		_ = json.Unmarshal([]byte(tc.have), &h)
		if got := missingFrom(w, h, "", nil); len(got) != tc.problems {
			t.Errorf("%s in %s: %v, want %d problems", tc.want, tc.have, got, tc.problems)
		}
	}
}

// TestV1ExceptionsAreNarrow: the intended v1 changes pass only for their keys on their element
// types; the same key on a lens, or another key on a mirror, is still a problem (cases by hand).
func TestV1ExceptionsAreNarrow(t *testing.T) {
	var want any
	_ = json.Unmarshal([]byte(`{"elements":[{"type":"lens"},{"type":"mirror"}],"placement":[{"type":"lens"},{"type":"mirror"}]}`), &want)
	for _, tc := range []struct {
		problem string
		allowed bool
	}{
		{".elements[1].clearance: 0.5 became 0.7", true},
		{".elements[1].max_exact_r_mm: 5 became 7", true},
		{".elements[0].clearance: 0.5 became 0.7", false},
		{".elements[1].path_mm: 5 became 7", false},
		{".placement[1].table_x_mm: 5 became 7", true},
		{".placement[0].table_x_mm: 5 became 7", false},
		{".placement[1].heading_deg: 135 became 315", false},
		{".elements[7].clearance: 0.5 became 0.7", false},
	} {
		if got := v1ChangedByType(want, tc.problem) != ""; got != tc.allowed {
			t.Errorf("%s: allowed %v, want %v", tc.problem, got, tc.allowed)
		}
	}
}
