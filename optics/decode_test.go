package optics

import (
	"bytes"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
)

// demoPath is the demo bench every round-trip and diff test starts from.
const demoPath = "../testdata/demo-bench.json"

func readDemo(t testing.TB) []byte {
	t.Helper()
	data, err := os.ReadFile(demoPath)
	if err != nil {
		t.Fatal(err)
	}
	return data
}

func decodeDemo(t testing.TB) *Bench {
	t.Helper()
	b, err := Decode(readDemo(t))
	if err != nil {
		t.Fatalf("demo bench does not decode: %v", err)
	}
	return b
}

// fixtureJSON is a fixed bench for tests that edit particular elements: the demo bench may be
// retuned, these numbers stay. Elements: 0 L1 lens, 1 PH aperture, 2 L2 lens, 3 M1 mirror, 4 IR
// aperture, 5 F1 thin lens, 6 M2 mirror, 7 CAM screen.
const fixtureJSON = `{
  "format": "raytable/bench/v1",
  "title": "Spatial filter and expander",
  "notes": "Fixture for the decode, validate, encode and diff tests.",
  "wavelengths_nm": [632.8, 532],
  "table": {"grid": "metric-25mm", "width_mm": 900, "depth_mm": 600, "beam_height_mm": 75},
  "source": {
    "x_mm": 50, "y_mm": 100, "heading_deg": 0, "kind": "collimated", "semi_diameter_mm": 1,
    "field_angles_deg": [0, 0.05],
    "rays": [{"height_mm": 0.5, "angle_deg": 0, "x_mm": 0, "x_angle_deg": 0}],
    "beam": {"waist_radius_mm": 0.45, "waist_at_mm": -250, "m2": 1.05}
  },
  "elements": [
    {"id": "L1", "type": "lens", "gap_mm": 100, "faces_mm": [11.4, null], "thicknesses_mm": [3.5], "materials": ["fused-silica"], "diameter_mm": 12.7},
    {"id": "PH", "type": "aperture", "gap_mm": 22.6, "diameter_mm": 0.04},
    {"id": "L2", "type": "lens", "gap_mm": 150, "faces_mm": [null, -68.6], "thicknesses_mm": [4.0], "materials": ["fused-silica"], "diameter_mm": 25.4},
    {"id": "M1", "type": "mirror", "gap_mm": 100, "radius_mm": null, "turn_deg": 90, "diameter_mm": 25.4},
    {"id": "IR", "type": "aperture", "gap_mm": 60, "diameter_mm": 10},
    {"id": "F1", "type": "thin-lens", "gap_mm": 90, "focal_mm": 250, "diameter_mm": 25.4},
    {"id": "M2", "type": "mirror", "gap_mm": 120, "radius_mm": null, "turn_deg": -90, "diameter_mm": 25.4},
    {"id": "CAM", "type": "screen", "gap_mm": 130, "width_mm": 8.8}
  ]
}`

func fixture(t testing.TB) *Bench {
	t.Helper()
	b, err := Decode([]byte(fixtureJSON))
	if err != nil {
		t.Fatalf("fixture does not decode: %v", err)
	}
	return b
}

// paths lists the problem paths of an error, in order.
func paths(err error) []string {
	var out []string
	for _, p := range ErrorProblems(err) {
		out = append(out, p.Path)
	}
	return out
}

// validBench wraps elements (a JSON array body) and extra top-level members in a bench that is
// otherwise valid, so that each inline case shows only what it is about.
func validBench(source, elements string) string {
	if source == "" {
		source = `{"x_mm": 50, "y_mm": 100, "heading_deg": 0, "kind": "collimated", "semi_diameter_mm": 1}`
	}
	return `{"format": "raytable/bench/v1", "wavelengths_nm": [632.8],
	"table": {"grid": "metric-25mm", "width_mm": 900, "depth_mm": 600, "beam_height_mm": 75},
	"source": ` + source + `, "elements": [` + elements + `]}`
}

// TestDecodeInvalidFiles checks the exact problem paths of every bad bench under testdata/invalid.
func TestDecodeInvalidFiles(t *testing.T) {
	cases := []struct {
		file  string
		paths []string
	}{
		{"unknown-field.json", []string{"comment", "elements[2].colour", "elements[3].focal_mm", "elements[4].diameter_mm"}},
		{"radius-smaller-than-semi-diameter.json", []string{"elements[2].faces_mm[0]"}},
		{"unknown-material.json", []string{"elements[0].materials[0]"}},
		{"duplicate-ids.json", []string{"elements[2].id"}},
		{"wavelength-150nm.json", []string{"wavelengths_nm[1]"}},
		{"negative-thickness.json", []string{"elements[0].thicknesses_mm[1]"}},
		{"edge-thickness.json", []string{"elements[0].thicknesses_mm[0]", "elements[1].thicknesses_mm[0]"}},
		{"point-source-mixed.json", []string{"source.field_angles_deg", "source.na"}},
		{"not-json.json", []string{""}},
		{"wrong-types.json", []string{
			"title", "wavelengths_nm[1]", "table.width_mm", "table.beam_height_mm", "source.fan_rays", "source.rays",
			"elements[0].id", "elements[0].focal_mm", "elements[1].gap_mm", "elements[1].turn_deg", "elements[2]",
		}},
		{"many-problems.json", []string{
			"source.na", "format", "wavelengths_nm", "table.grid", "table.width_mm", "table.beam_height_mm",
			"source.semi_diameter_mm", "source.fan_rays", "source.beam.waist_radius_mm", "source.beam.m2",
			"materials.bad-fit.sellmeier.c_um2", "materials.bad-fit.range_nm", "materials.both",
			`materials["code:123456"]`, "materials.half-glass.vd", "materials.heavy.index",
			"elements[0].id", "elements[0].gap_mm", "elements[0].faces_mm[0]", "elements[0].thicknesses_mm[0]",
			"elements[0].materials[0]", "elements[1].id", "elements[1].focal_mm", "elements[2].turn_deg",
			"elements[2].radius_mm", "elements[3].type", "elements[4].gap_mm", "elements[4].mount.width_mm",
			"elements[4].width_mm",
		}},
	}
	files, err := filepath.Glob("../testdata/invalid/*.json")
	if err != nil {
		t.Fatal(err)
	}
	if len(files) != len(cases) {
		t.Errorf("testdata/invalid has %d files, the table covers %d: add the new file to the table", len(files), len(cases))
	}
	for _, c := range cases {
		t.Run(c.file, func(t *testing.T) {
			data, err := os.ReadFile(filepath.Join("../testdata/invalid", c.file))
			if err != nil {
				t.Fatal(err)
			}
			b, err := Decode(data)
			if b != nil || ErrorCode(err) != EInvalid {
				t.Fatalf("Decode = (%v, %v), want nil and an %s error", b, err, EInvalid)
			}
			if got := paths(err); !reflect.DeepEqual(got, c.paths) {
				t.Errorf("problem paths\n got %q\nwant %q\nerror:\n%v", got, c.paths, err)
			}
		})
	}
}

// TestDecodeInvalidInline covers single rules with small inline benches.
func TestDecodeInvalidInline(t *testing.T) {
	lens := func(extra string) string {
		return `{"id": "L1", "type": "lens", "gap_mm": 10, "faces_mm": [50, -50], "thicknesses_mm": [4], "materials": ["fused-silica"]` + extra + `}`
	}
	cases := []struct {
		name, json string
		paths      []string
	}{
		{"top level array", `[1, 2]`, []string{""}},
		{"duplicate key", `{"format": "raytable/bench/v1", "format": "raytable/bench/v1"}`,
			[]string{"format", "wavelengths_nm", "table", "source", "elements"}},
		{"missing required element fields", validBench("", `{"type": "aperture"}`), []string{"elements[0].id", "elements[0].gap_mm"}},
		{"missing lens fields", validBench("", `{"id": "L1", "type": "lens", "gap_mm": 1}`), []string{"elements[0].faces_mm"}},
		{"one face", validBench("", `{"id": "L1", "type": "lens", "gap_mm": 1, "faces_mm": [null], "thicknesses_mm": [], "materials": []}`),
			[]string{"elements[0].faces_mm"}},
		{"thickness count", validBench("", `{"id": "L1", "type": "lens", "gap_mm": 1, "faces_mm": [null, null], "thicknesses_mm": [1, 2], "materials": ["air"]}`),
			[]string{"elements[0].thicknesses_mm"}},
		{"material count", validBench("", `{"id": "L1", "type": "lens", "gap_mm": 1, "faces_mm": [null, null, null], "thicknesses_mm": [1, 2], "materials": ["air"]}`),
			[]string{"elements[0].materials"}},
		{"lens field on aperture", validBench("", `{"id": "A1", "type": "aperture", "gap_mm": 1, "faces_mm": [null, null]}`),
			[]string{"elements[0].faces_mm"}},
		{"negative gap", validBench("", `{"id": "A1", "type": "aperture", "gap_mm": -1}`), []string{"elements[0].gap_mm"}},
		{"zero diameter", validBench("", lens(`, "diameter_mm": 0`)), []string{"elements[0].diameter_mm"}},
		{"flat mirror as null radius is fine, zero radius is not",
			validBench("", `{"id": "M1", "type": "mirror", "gap_mm": 1, "radius_mm": null, "turn_deg": 90},
			{"id": "M2", "type": "mirror", "gap_mm": 1, "radius_mm": 0, "turn_deg": 90}`),
			[]string{"elements[1].radius_mm"}},
		{"mirror without turn", validBench("", `{"id": "M1", "type": "mirror", "gap_mm": 1}`), []string{"elements[0].turn_deg"}},
		{"thin lens without focal length", validBench("", `{"id": "F1", "type": "thin-lens", "gap_mm": 1}`), []string{"elements[0].focal_mm"}},
		{"id too long", validBench("", `{"id": "`+strings.Repeat("x", MaxIDLength+1)+`", "type": "dump", "gap_mm": 1}`), []string{"elements[0].id"}},
		{"number out of float range", validBench("", `{"id": "D1", "type": "dump", "gap_mm": 1e400}`), []string{"elements[0].gap_mm"}},
		{"huge radius", validBench("", lens(`, "diameter_mm": 10`)+`,`+strings.Replace(lens(""), `[50, -50]`, `[2e6, null]`, 1)),
			[]string{"elements[1].id", "elements[1].faces_mm[0]"}},
		{"point source without na", validBench(`{"x_mm": 0, "y_mm": 0, "heading_deg": 0, "kind": "point"}`, ""), []string{"source.na"}},
		{"unknown source kind", validBench(`{"x_mm": 0, "y_mm": 0, "heading_deg": 0, "kind": "laser", "na": 0.1}`, ""), []string{"source.kind"}},
		{"heading out of range", validBench(`{"x_mm": 0, "y_mm": 0, "heading_deg": 720, "kind": "point", "na": 0.1}`, ""), []string{"source.heading_deg"}},
		{"fan of 202 rays", validBench(`{"x_mm": 0, "y_mm": 0, "heading_deg": 0, "kind": "point", "na": 0.1, "fan_rays": 202}`, ""), []string{"source.fan_rays"}},
		{"ray at 90 degrees", validBench(`{"x_mm": 0, "y_mm": 0, "heading_deg": 0, "kind": "point", "na": 0.1, "rays": [{"height_mm": 0, "angle_deg": 90, "color": 1}]}`, ""),
			[]string{"source.rays[0].color", "source.rays[0].angle_deg"}},
		{"beam without waist", validBench(`{"x_mm": 0, "y_mm": 0, "heading_deg": 0, "kind": "point", "na": 0.1, "beam": {"m2": 1}}`, ""),
			[]string{"source.beam.waist_radius_mm"}},
		{"mount field unknown", validBench("", `{"id": "D1", "type": "dump", "gap_mm": 1, "mount": {"width_mm": 10, "depth_mm": 10, "height_mm": 5}}`),
			[]string{"elements[0].mount.height_mm"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, err := Decode([]byte(c.json))
			if ErrorCode(err) != EInvalid {
				t.Fatalf("Decode error %v, want code %s", err, EInvalid)
			}
			if got := paths(err); !reflect.DeepEqual(got, c.paths) {
				t.Errorf("problem paths\n got %q\nwant %q\nerror:\n%v", got, c.paths, err)
			}
		})
	}
}

// TestDecodeMessages pins the wording of the messages the web page shows; README ('Bench file') quotes the first.
func TestDecodeMessages(t *testing.T) {
	cases := []struct {
		file, path, message string
	}{
		{"radius-smaller-than-semi-diameter.json", "elements[2].faces_mm[0]", "radius 3 mm is smaller than the semi-diameter 12.7 mm"},
		{"wavelength-150nm.json", "wavelengths_nm[1]", "150 nm is outside the accepted range 200-20000 nm"},
		{"negative-thickness.json", "elements[0].thicknesses_mm[1]", "thickness must be greater than 0 mm, got -2"},
		{"duplicate-ids.json", "elements[2].id", `duplicate id "A1": already used by elements[0]`},
		{"wrong-types.json", "wavelengths_nm[1]", "must be a number, got a string"},
	}
	for _, c := range cases {
		data, err := os.ReadFile(filepath.Join("../testdata/invalid", c.file))
		if err != nil {
			t.Fatal(err)
		}
		_, err = Decode(data)
		found := false
		for _, p := range ErrorProblems(err) {
			if p.Path == c.path {
				found = true
				if p.Message != c.message {
					t.Errorf("%s %s: message %q, want %q", c.file, c.path, p.Message, c.message)
				}
			}
		}
		if !found {
			t.Errorf("%s: no problem at %s in\n%v", c.file, c.path, err)
		}
	}
	// Prefixes: the full messages go on to list what is allowed.
	prefixes := []struct{ file, path, prefix string }{
		{"unknown-field.json", "elements[3].focal_mm", "unknown field for type mirror"},
		{"unknown-material.json", "elements[0].materials[0]", `unknown medium "unobtainium"`},
	}
	for _, c := range prefixes {
		data, _ := os.ReadFile(filepath.Join("../testdata/invalid", c.file))
		_, err := Decode(data)
		ok := false
		for _, p := range ErrorProblems(err) {
			if p.Path == c.path && strings.HasPrefix(p.Message, c.prefix) {
				ok = true
			}
		}
		if !ok {
			t.Errorf("%s: want a problem at %s starting %q, got\n%v", c.file, c.path, c.prefix, err)
		}
	}
	// An unknown material names what is allowed.
	data, _ := os.ReadFile("../testdata/invalid/unknown-material.json")
	_, err := Decode(data)
	if msg := err.Error(); !strings.Contains(msg, "fused-silica") || !strings.Contains(msg, "code:517642") {
		t.Errorf("unknown material message does not list the allowed media: %s", msg)
	}
}

func TestDecodeTooLarge(t *testing.T) {
	data := append([]byte(`{"notes": "`), bytes.Repeat([]byte("x"), MaxBenchBytes)...)
	data = append(data, `"}`...)
	if _, err := Decode(data); ErrorCode(err) != ETooLarge {
		t.Errorf("Decode of %d bytes: error %v, want code %s", len(data), err, ETooLarge)
	}
}

// TestDecodeValid decodes benches that follow every rule and checks the fields that have special
// forms (null faces, absent optional fields).
func TestDecodeValid(t *testing.T) {
	decodeDemo(t)
	b := fixture(t)
	if len(b.Elements) != 8 || b.Elements[0].FacesMM[1] != nil || *b.Elements[0].FacesMM[0] != 11.4 {
		t.Errorf("demo L1 faces decoded wrong: %+v", b.Elements[0])
	}
	if b.Elements[3].RadiusMM != nil || *b.Elements[3].TurnDeg != 90 {
		t.Errorf("demo M1 should be a flat mirror turning 90°: %+v", b.Elements[3])
	}
	if b.Source.FanRayCount() != DefaultFanRays || b.Source.Beam.BeamQuality() != 1.05 {
		t.Errorf("demo source decoded wrong: %+v", b.Source)
	}

	others := []struct{ name, json string }{
		{"point source, cemented doublet of user glasses, concave mirror", `{
			"format": "raytable/bench/v1", "title": "<doublet & mirror>", "wavelengths_nm": [587.6, 486.1, 656.3],
			"table": {"grid": "imperial-1in", "width_mm": 609.6, "depth_mm": 304.8, "beam_height_mm": 0, "hole_offset_mm": 12.7},
			"source": {"x_mm": 25.4, "y_mm": 50.8, "heading_deg": 90, "kind": "point", "na": 0.05, "object_heights_mm": [0, 1],
				"fan_rays": 8, "rays": [{"height_mm": 0, "angle_deg": 1}]},
			"materials": {
				"crown": {"nd": 1.517, "vd": 64.2},
				"flint": {"sellmeier": {"b": [1.3, 0.3], "c_um2": [0.01, 0.05]}, "range_nm": [400, 1000]},
				"oil": {"index": 1.515}
			},
			"elements": [
				{"id": "D1", "type": "lens", "gap_mm": 100, "faces_mm": [61.1, -47.1, -129.0], "thicknesses_mm": [6, 2.5], "materials": ["crown", "flint"], "diameter_mm": 25.4, "mount": {"width_mm": 40, "depth_mm": 15}},
				{"id": "W1", "type": "lens", "gap_mm": 20, "faces_mm": [null, null], "thicknesses_mm": [3], "materials": ["oil"]},
				{"id": "M1", "type": "mirror", "gap_mm": 50, "radius_mm": 200, "turn_deg": -30, "diameter_mm": 25.4},
				{"id": "S1", "type": "screen", "gap_mm": 100}
			]}`},
		{"no elements", validBench("", "")},
	}
	for _, c := range others {
		if _, err := Decode([]byte(c.json)); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
	}
}

// FuzzDecode feeds arbitrary bytes to Decode: it must never panic, and whatever it accepts must
// pass Validate and survive an Encode/Decode round trip unchanged.
func FuzzDecode(f *testing.F) {
	f.Add([]byte(fixtureJSON))
	seeds, _ := filepath.Glob("../testdata/*.json")
	invalid, _ := filepath.Glob("../testdata/invalid/*.json")
	for _, name := range append(seeds, invalid...) {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	f.Add([]byte(validBench("", `{"id": "L1", "type": "lens", "gap_mm": 1, "faces_mm": [10, -10], "thicknesses_mm": [4], "materials": ["code:517642"], "diameter_mm": 12}`)))
	f.Fuzz(func(t *testing.T, data []byte) {
		b, err := Decode(data)
		if err != nil {
			if b != nil {
				t.Fatalf("Decode returned a bench together with error %v", err)
			}
			if code := ErrorCode(err); code != EInvalid && code != ETooLarge {
				t.Fatalf("Decode error code %q: %v", code, err)
			}
			return
		}
		if err := Validate(b); err != nil {
			t.Fatalf("Decode accepted a bench that Validate rejects: %v", err)
		}
		out, err := Encode(b)
		if err != nil {
			t.Fatalf("Encode of a decoded bench: %v", err)
		}
		again, err := Decode(out)
		if err != nil {
			t.Fatalf("Decode of Encode output: %v\n%s", err, out)
		}
		if !reflect.DeepEqual(b, again) {
			t.Fatalf("round trip changed the bench\n%+v\n%+v", b, again)
		}
	})
}

// BenchmarkDecode measures reading and validating the demo bench.
func BenchmarkDecode(b *testing.B) {
	data := readDemo(b)
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Decode(data); err != nil {
			b.Fatal(err)
		}
	}
}

// TestBeamDefaults: a beam given by its waist radius alone has its waist at the source and
// M² 1 (README, 'Bench file, format raytable/bench/v1': waist_at_mm defaults to 0, m2 to 1).
func TestBeamDefaults(t *testing.T) {
	b, err := Decode([]byte(validBench(`{"x_mm": 0, "y_mm": 0, "heading_deg": 0, "kind": "point", "na": 0.1, "beam": {"waist_radius_mm": 0.5}}`, "")))
	if err != nil {
		t.Fatal(err)
	}
	if bm := b.Source.Beam; bm == nil || bm.WaistRadiusMM != 0.5 || bm.WaistAtMM != 0 || bm.BeamQuality() != 1 {
		t.Errorf("beam %+v, want waist 0.5 mm at 0 with M² 1", bm)
	}
}
