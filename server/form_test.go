package server

import (
	"bytes"
	"net/url"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
	"raytable/server/demo"
	"raytable/web/view"
)

// everyField is a bench file that uses every field of the format, written by hand.
const everyField = benchtest.EveryFieldJSON

func valuesOf(m map[string]string) url.Values {
	v := url.Values{}
	for k, s := range m {
		v.Set(k, s)
	}
	return v
}

// TestFormRoundTrip writes benches into form values and reads them back: the canonical encodings
// must be identical, so the form covers every field.
func TestFormRoundTrip(t *testing.T) {
	point := strings.Replace(everyField, `"kind": "collimated", "semi_diameter_mm": 1.5,
    "field_angles_deg": [0, 0.1]`, `"kind": "point", "na": 0.05, "object_heights_mm": [0, 1]`, 1)
	pulsed := strings.Replace(everyField, `"kind": "collimated",`, `"kind": "collimated", "pulse": {"energy_uj": 10, "duration_ns": 5, "rate_hz": 1000},`, 1)
	for name, data := range map[string][]byte{"demo": demo.Bench, "every field": []byte(everyField), "point source": []byte(point), "pulsed source": []byte(pulsed)} {
		t.Run(name, func(t *testing.T) {
			b, err := optics.Decode(data)
			if err != nil {
				t.Fatal(err)
			}
			got, problems := parseBenchForm(valuesOf(benchValues(b)))
			if len(problems) > 0 {
				t.Fatalf("problems reading back: %v", problems)
			}
			want, err := optics.Encode(b)
			if err != nil {
				t.Fatal(err)
			}
			back, err := optics.Encode(got)
			if err != nil {
				t.Fatalf("read-back bench is invalid: %v", err)
			}
			if !bytes.Equal(want, back) {
				t.Errorf("round trip changed the bench:\nwant %s\ngot  %s", want, back)
			}
			// Every value written has an input on the form (hidden helpers included).
			names := fieldNames(b)
			for k, v := range benchValues(b) {
				if v != "" && !names[k] {
					t.Errorf("value %s=%q has no input on the form", k, v)
				}
			}
		})
	}
}

func TestFormProblemsNameThePath(t *testing.T) {
	b, err := optics.Decode([]byte(everyField))
	if err != nil {
		t.Fatal(err)
	}
	vals := valuesOf(benchValues(b))
	vals.Set("elements[0].faces_mm", "60, x, flat")
	vals.Set("elements[4].gap_mm", "abc")
	vals.Set("source.fan_rays", "many")
	vals.Set("source.beam.m2", "")
	vals.Set("source.beam.waist_radius_mm", "")
	vals.Set("materials", "{not json")
	vals.Set("elements[1].focal_mm", "")
	vals.Set("elements[2].turn_deg", "")
	_, problems := parseBenchForm(vals)
	want := map[string]string{
		"elements[0].faces_mm[1]":     `"x" is not a length`,
		"elements[4].gap_mm":          `"abc" is not a length; use a number in mm or a unit such as 1 in, 2.5 cm`,
		"source.fan_rays":             "not a whole number",
		"source.beam.waist_radius_mm": "is required",
		"materials":                   "is not a materials object",
		"elements[1].focal_mm":        "is required",
		"elements[2].turn_deg":        "is required",
	}
	got := map[string]string{}
	for _, p := range problems {
		got[p.Path] = p.Message
	}
	for path, msg := range want {
		if !strings.Contains(got[path], msg) {
			t.Errorf("problem at %s: %q, want one containing %q", path, got[path], msg)
		}
	}
	if len(got) != len(want) {
		t.Errorf("problems %v, want exactly %d", problems, len(want))
	}
}

func TestFieldFor(t *testing.T) {
	names := map[string]bool{"elements[2].faces_mm": true, "elements[2].gap_mm": true, "source.beam.m2": true, "title": true}
	for _, tc := range []struct {
		path, want string
	}{
		{"elements[2].faces_mm[0]", "elements[2].faces_mm"},
		{"elements[2].faces_mm", "elements[2].faces_mm"},
		{"elements[2].gap_mm", "elements[2].gap_mm"},
		{"elements[2]", ""},
		{"elements[12].gap_mm", ""},
		{"source.beam.m2", "source.beam.m2"},
		{"title", "title"},
		{"", ""},
	} {
		got, ok := fieldFor(tc.path, names)
		if got != tc.want || ok != (tc.want != "") {
			t.Errorf("fieldFor(%q) = %q, %v; want %q", tc.path, got, ok, tc.want)
		}
	}
}

func TestBuildFormMarksFields(t *testing.T) {
	b, err := optics.Decode(demo.Bench)
	if err != nil {
		t.Fatal(err)
	}
	problems := []optics.Problem{
		{Path: "elements[0].faces_mm[0]", Message: "radius 3 mm is smaller than the semi-diameter 6.35 mm"},
		{Path: "elements[1]", Message: "something about the whole element"},
		{Path: "source.rays[0].angle_deg", Message: "bad angle"},
		{Path: "source", Message: "about the source"},
		{Path: "elements", Message: "too many"},
	}
	f := buildForm("x", b, benchValues(b), problems)
	find := func(fields []view.Field, name string) view.Field {
		for _, fl := range fields {
			if fl.Name == name {
				return fl
			}
		}
		t.Fatalf("no field %s", name)
		return view.Field{}
	}
	if got := find(f.Elements[0].Fields, "elements[0].faces_mm").Error; got != "item 1: radius 3 mm is smaller than the semi-diameter 6.35 mm" {
		t.Errorf("faces error %q", got)
	}
	if got := f.Elements[1].Errors; len(got) != 1 || got[0] != "something about the whole element" {
		t.Errorf("element errors %q", got)
	}
	if got := find(f.Rays[0].Fields, "source.rays[0].angle_deg").Error; got != "bad angle" {
		t.Errorf("ray error %q", got)
	}
	if got := f.Source.Errors; len(got) != 1 || got[0] != "about the source" {
		t.Errorf("source errors %q", got)
	}
	if len(f.Errors) != 1 || !strings.Contains(f.Errors[0], "too many") {
		t.Errorf("form errors %q", f.Errors)
	}
	if !f.Invalid {
		t.Error("form not marked invalid")
	}
}

func TestTypeChangeKeepsWhatCarriesOver(t *testing.T) {
	b, err := optics.Decode([]byte(everyField))
	if err != nil {
		t.Fatal(err)
	}
	vals := valuesOf(benchValues(b))
	vals.Set("elements[2].type", optics.TypeAperture) // a mirror becomes an aperture
	vals.Set("elements[5].type", optics.TypeDump)     // a screen becomes a dump
	got, problems := parseBenchForm(vals)
	if len(problems) > 0 {
		t.Fatal(problems)
	}
	ap := got.Elements[2]
	if ap.Type != optics.TypeAperture || ap.ID != "M1" || ap.GapMM != 60 || ap.DiameterMM == nil || *ap.DiameterMM != 25.4 || ap.TurnDeg != nil {
		t.Errorf("mirror -> aperture gave %+v", ap)
	}
	if d := got.Elements[5]; d.Type != optics.TypeDump || d.WidthMM != nil || d.ID != "S1" {
		t.Errorf("screen -> dump gave %+v", d)
	}
	if err := optics.Validate(got); err != nil {
		t.Errorf("converted bench is invalid: %v", err)
	}
}

// TestApplyAction: each button is one of optics' edits (tested there); a button that names
// nothing, or a type that does not exist, is a problem at its input.
func TestApplyAction(t *testing.T) {
	mk := func() *optics.Bench {
		b, err := optics.Decode([]byte(everyField))
		if err != nil {
			t.Fatal(err)
		}
		return b
	}
	b := mk()
	applyAction(b, "add", url.Values{"add.type": {optics.TypeScreen}})
	if got := b.Elements[len(b.Elements)-1].ID; got != "S3" {
		t.Errorf("new screen id %q, want S3 at the end (S1 and S2 are taken)", got)
	}
	b = mk()
	if ps := applyAction(b, "down:0", nil); ps != nil || b.Elements[1].ID != "L1" {
		t.Errorf("down:0 gave %v, elements[1] %s", ps, b.Elements[1].ID)
	}
	for _, bad := range []string{"down:7", "up:0", "delete:-1", "delete:x", "delete-ray:1", "fly", "delete-at:elements[9]", "up-at:elements[0]", "down-at:nowhere", "delete-source:0", "add-in:elements[0].reflected"} {
		if ps := applyAction(mk(), bad, nil); len(ps) != 1 || ps[0].Path != "action" {
			t.Errorf("action %q: %v", bad, ps)
		}
	}
	if ps := applyAction(mk(), "add", url.Values{"add.type": {"prism"}, "add.at": {"1"}}); len(ps) != 1 || ps[0].Path != "add.type" || !strings.HasPrefix(ps[0].Message, `unknown element type "prism"`) {
		t.Errorf("adding a prism: %v", ps)
	}
}
