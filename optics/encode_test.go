package optics

import (
	"bytes"
	"reflect"
	"strings"
	"testing"
)

// TestEncodeRoundTrip: the demo bench decodes, encodes and decodes back to an equal Bench, and a
// second encoding is byte-for-byte the first (the form is canonical).
func TestEncodeRoundTrip(t *testing.T) {
	b := decodeDemo(t)
	out, err := Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	again, err := Decode(out)
	if err != nil {
		t.Fatalf("Decode(Encode(demo)): %v\n%s", err, out)
	}
	if !reflect.DeepEqual(b, again) {
		t.Errorf("round trip changed the bench\n before %+v\n after  %+v", b, again)
	}
	out2, err := Encode(again)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(out, out2) {
		t.Errorf("Encode is not canonical:\n%s\n---\n%s", out, out2)
	}
}

// TestEncodeForm checks the canonical layout: two-space indentation, plain arrays on one line,
// nulls kept in faces_mm, no HTML escaping, user materials sorted, a final newline.
func TestEncodeForm(t *testing.T) {
	b := fixture(t)
	b.Title = "Expander <6x> & filter"
	b.Materials = map[string]MaterialSpec{"z-oil": {Index: ptr(1.515)}, "a-glass": {ND: ptr(1.6), VD: ptr(40.0)}}
	out, err := Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	s := string(out)
	for _, want := range []string{
		"{\n  \"format\": \"raytable/bench/v1\",\n",
		`"title": "Expander <6x> & filter"`,
		`"wavelengths_nm": [632.8, 532],`,
		`      "faces_mm": [11.4, null],`,
		`      "faces_mm": [null, -68.6],`,
		`      "materials": ["fused-silica"],`,
	} {
		if !strings.Contains(s, want) {
			t.Errorf("encoded bench lacks %q:\n%s", want, s)
		}
	}
	if strings.Index(s, `"a-glass"`) > strings.Index(s, `"z-oil"`) {
		t.Error("materials are not sorted by name")
	}
	if !strings.HasSuffix(s, "}\n") || strings.Contains(s, "\t") {
		t.Error("encoded bench must end in a newline and indent with spaces only")
	}
}

func TestEncodeRefusesInvalid(t *testing.T) {
	b := fixture(t)
	b.Elements[0].ThicknessesMM[0] = -1
	out, err := Encode(b)
	if out != nil || ErrorCode(err) != EInvalid {
		t.Errorf("Encode of an invalid bench = (%d bytes, %v), want nil and an %s error", len(out), err, EInvalid)
	}
	if got := paths(err); !reflect.DeepEqual(got, []string{"elements[0].thicknesses_mm[0]"}) {
		t.Errorf("paths %q", got)
	}
}

// TestEncodeEmptyElements: a bench without elements encodes "elements": [] and reads back.
func TestEncodeEmptyElements(t *testing.T) {
	b := fixture(t)
	b.Elements = nil
	out, err := Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(out), `"elements": []`) {
		t.Errorf("no empty element list in\n%s", out)
	}
	if _, err := Decode(out); err != nil {
		t.Error(err)
	}
}

// BenchmarkEncode measures writing the demo bench in canonical form.
func BenchmarkEncode(b *testing.B) {
	bench := decodeDemo(b)
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Encode(bench); err != nil {
			b.Fatal(err)
		}
	}
}
