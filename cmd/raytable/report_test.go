package main

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

const demoBench = "../../testdata/demo-bench.json"

// runCmd runs the command line in-process and returns its exit status and output.
func runCmd(t *testing.T, stdin string, args ...string) (int, string, string) {
	t.Helper()
	var out, errOut bytes.Buffer
	code := run(context.Background(), args, func(string) string { return "" }, strings.NewReader(stdin), &out, &errOut)
	return code, out.String(), errOut.String()
}

func TestReportText(t *testing.T) {
	code, out, errOut := runCmd(t, "", "report", demoBench)
	if code != exitOK {
		t.Fatalf("exit %d, stderr:\n%s", code, errOut)
	}
	for _, want := range []string{"SYSTEM at 632.8 nm", "EFL mm", "ELEMENTS", "L1", "CAM", "RAYS", "BLUR AT SCREENS", "BEAM", "WAISTS", "SPACING", "WARNINGS"} {
		if !strings.Contains(out, want) {
			t.Errorf("text report lacks %q", want)
		}
	}
}

// TestReportJSONNames checks that --json carries every name the report format promises
// (README, 'Report, format raytable/report/v1').
func TestReportJSONNames(t *testing.T) {
	code, out, errOut := runCmd(t, "", "report", "--json", demoBench)
	if code != exitOK {
		t.Fatalf("exit %d, stderr:\n%s", code, errOut)
	}
	var r map[string]any
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	if r["format"] != "raytable/report/v1" {
		t.Errorf("format = %v", r["format"])
	}
	requireKeys(t, "report", r, "format", "wavelengths_nm", "media", "system", "elements", "rays", "warnings", "beam", "placement",
		"spacing", "spacing_basis", "blur", "holes")
	sys := r["system"].(map[string]any)
	planeKeys := []string{"efl_mm", "bfl_mm", "ffl_mm", "front_principal_mm", "rear_principal_mm", "abcd", "afocal",
		"image_distance_mm", "magnification", "aperture_stop", "f_number", "image_na"}
	requireKeys(t, "system", sys, append(planeKeys, "sagittal")...)
	requireKeys(t, "system.sagittal", sys["sagittal"].(map[string]any), planeKeys...)
	requireKeys(t, "media[0]", first(t, r, "media"), "material", "wavelength_nm", "index")
	requireKeys(t, "elements[0]", first(t, r, "elements"), "id", "type", "path_mm", "table_x_mm", "table_y_mm", "heading_in_deg", "heading_out_deg")
	ray := first(t, r, "rays")
	requireKeys(t, "rays[0]", ray, "name", "wavelength_nm", "status", "stopped_at", "hits")
	if ray["name"] != "explicit[0]" {
		t.Errorf("first ray is %v, want the explicit ray", ray["name"])
	}
	hit := ray["hits"].([]any)[0].(map[string]any)
	requireKeys(t, "rays[0].hits[0]", hit, "element", "face", "paraxial", "exact")
	requireKeys(t, "paraxial", hit["paraxial"].(map[string]any), "y_mm", "u_rad")
	requireKeys(t, "exact", hit["exact"].(map[string]any), "x_mm", "y_mm", "z_mm", "dir")
	beam := r["beam"].(map[string]any)
	requireKeys(t, "beam", beam, "elements", "waists")
	requireKeys(t, "beam.elements[0]", first(t, beam, "elements"), "id", "w_t_mm", "w_s_mm", "r_t_mm", "r_s_mm", "transmitted")
	requireKeys(t, "beam.waists[0]", first(t, beam, "waists"), "after", "path_mm", "radius_t_mm", "radius_s_mm", "rayleigh_t_mm", "rayleigh_s_mm")
}

func first(t *testing.T, m map[string]any, key string) map[string]any {
	t.Helper()
	list, ok := m[key].([]any)
	if !ok || len(list) == 0 {
		t.Fatalf("%s is empty or not a list", key)
	}
	return list[0].(map[string]any)
}

func requireKeys(t *testing.T, where string, m map[string]any, keys ...string) {
	t.Helper()
	for _, k := range keys {
		if _, ok := m[k]; !ok {
			t.Errorf("%s lacks %q", where, k)
		}
	}
}

func TestReportInvalid(t *testing.T) {
	tests := []struct {
		name      string
		stdin     string
		args      []string
		wantCode  int
		wantInErr []string
	}{
		{"no file", "", []string{"report"}, exitInvalid, []string{"usage"}},
		{"missing file", "", []string{"report", "no-such-file.json"}, exitInvalid, []string{"no-such-file.json"}},
		{"not json", "{", []string{"report", "-"}, exitInvalid, []string{"standard input"}},
		{"radius below semi-diameter", `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
			"table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
			"source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1},
			"elements":[{"id":"L1","type":"lens","gap_mm":10,"faces_mm":[3,null],"thicknesses_mm":[2],"materials":["fused-silica"],"diameter_mm":25.4}]}`,
			[]string{"report", "-"}, exitInvalid, []string{"elements[0].faces_mm[0]", "semi-diameter"}},
		{"unknown material and negative gap", `{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
			"table":{"grid":"none","width_mm":600,"depth_mm":300,"beam_height_mm":75},
			"source":{"x_mm":0,"y_mm":150,"heading_deg":0,"kind":"collimated","semi_diameter_mm":1},
			"elements":[{"id":"L1","type":"lens","gap_mm":-5,"faces_mm":[50,null],"thicknesses_mm":[2],"materials":["unobtainium"]}]}`,
			[]string{"report", "-"}, exitInvalid, []string{"elements[0].gap_mm", "elements[0].materials[0]"}},
		{"unknown command", "", []string{"frobnicate"}, exitInvalid, []string{"unknown command"}},
		{"help asked for", "", []string{"report", "-h"}, exitOK, []string{"usage: raytable report"}},
		{"unknown flag", "", []string{"plan", "--pdf", demoBench}, exitInvalid, []string{"-pdf", "usage: raytable plan"}},
		{"two files", "", []string{"plan", demoBench, demoBench}, exitInvalid, []string{"usage: raytable plan"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			code, _, errOut := runCmd(t, tt.stdin, tt.args...)
			if code != tt.wantCode {
				t.Errorf("exit %d, want %d; stderr:\n%s", code, tt.wantCode, errOut)
			}
			for _, want := range tt.wantInErr {
				if !strings.Contains(errOut, want) {
					t.Errorf("stderr lacks %q:\n%s", want, errOut)
				}
			}
		})
	}
}

func TestPlanCSV(t *testing.T) {
	code, out, errOut := runCmd(t, "", "plan", demoBench, "--csv")
	if code != exitOK {
		t.Fatalf("exit %d, stderr:\n%s", code, errOut)
	}
	lines := strings.Split(strings.TrimSpace(out), "\n")
	// One header row and one row per element of the demo bench (8 elements).
	if len(lines) != 9 {
		t.Fatalf("got %d CSV lines, want 9:\n%s", len(lines), out)
	}
	if !strings.HasPrefix(lines[0], "id,type,") {
		t.Errorf("header = %q", lines[0])
	}
	if !strings.HasPrefix(lines[1], "L1,lens,") {
		t.Errorf("first row = %q", lines[1])
	}
}

// failingReader is standard input that breaks while it is read: an environment failure.
type failingReader struct{}

func (failingReader) Read([]byte) (int, error) { return 0, errors.New("device gone") }

// TestExitCodes: input the user can fix (a missing file, a rule, a cap, the work budget) exits
// 2 with the message; an environment failure exits 1 (README "Commands").
func TestExitCodes(t *testing.T) {
	dir := t.TempDir()
	demo, err := os.ReadFile(demoBench)
	if err != nil {
		t.Fatal(err)
	}
	write := func(name string, edit func(b map[string]any)) string {
		var b map[string]any
		if err := json.Unmarshal(demo, &b); err != nil {
			t.Fatal(err)
		}
		edit(b)
		data, _ := json.Marshal(b)
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, data, 0o644); err != nil {
			t.Fatal(err)
		}
		return p
	}
	list := func(n int, from, step float64) []any {
		out := make([]any, n)
		for i := range out {
			out[i] = from + step*float64(i)
		}
		return out
	}
	overCap := write("cap.json", func(b map[string]any) { b["wavelengths_nm"] = list(17, 400, 10) })
	overBudget := write("budget.json", func(b map[string]any) {
		b["wavelengths_nm"] = list(16, 400, 10)
		src := b["source"].(map[string]any)
		src["field_angles_deg"], src["fan_rays"] = list(16, 0, 0.001), 201
	})
	cases := []struct {
		name  string
		stdin io.Reader
		args  []string
		code  int
		want  string
	}{
		{"valid", nil, []string{"report", demoBench}, exitOK, ""},
		{"missing file", nil, []string{"report", filepath.Join(dir, "none.json")}, exitInvalid, "no such file"},
		{"over a cap", nil, []string{"report", overCap}, exitInvalid, "wavelengths_nm: has 17 wavelengths; at most 16 are allowed"},
		{"over the budget", nil, []string{"plan", overBudget}, exitInvalid, "at most 25,000 are allowed: use fewer field angles"},
		{"standard input breaks", failingReader{}, []string{"report", "-"}, exitInternal, "device gone"},
	}
	for _, tc := range cases {
		var out, errOut bytes.Buffer
		stdin := tc.stdin
		if stdin == nil {
			stdin = strings.NewReader("")
		}
		code := run(context.Background(), tc.args, func(string) string { return "" }, stdin, &out, &errOut)
		if code != tc.code || !strings.Contains(errOut.String(), tc.want) {
			t.Errorf("%s: exit %d, want %d with %q; stderr %s", tc.name, code, tc.code, tc.want, errOut.String())
		}
	}
}
