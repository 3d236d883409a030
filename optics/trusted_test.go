package optics

import (
	"bytes"
	"reflect"
	"testing"
)

// TestTrustedRoundTrip: a bench written by EncodeValid reads back through DecodeTrusted to the same
// Bench that Decode gives, with the bytes equal to Encode's, and neither path checks the rules.
func TestTrustedRoundTrip(t *testing.T) {
	b := decodeDemo(t)
	want, err := Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	before := Validations()
	data, err := EncodeValid(b)
	if err != nil {
		t.Fatal(err)
	}
	got, err := DecodeTrusted(data)
	if err != nil {
		t.Fatal(err)
	}
	if n := Validations() - before; n != 0 {
		t.Errorf("EncodeValid and DecodeTrusted checked the rules %d times, want 0", n)
	}
	if !bytes.Equal(data, want) {
		t.Errorf("EncodeValid wrote\n%s\nEncode wrote\n%s", data, want)
	}
	strict, err := Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(got, strict) {
		t.Errorf("DecodeTrusted gave\n%+v\nDecode gave\n%+v", got, strict)
	}
}

// TestDecodeTrustedReadsStrictly: skipping the rules does not mean accepting any bytes; what the
// reader itself refuses is still an error, while a rule (here a negative gap) is left unchecked.
func TestDecodeTrustedReadsStrictly(t *testing.T) {
	for _, tc := range []struct {
		name, data string
		wantPaths  []string
	}{
		{"not JSON", `{"format": `, []string{""}},
		{"not an object", `[1, 2]`, []string{""}},
		{"unknown key", validBench("", "")[:1] + `"colour": "red", ` + validBench("", "")[1:], []string{"colour"}},
		{"wrong type", validBench(`{"x_mm": "left", "y_mm": 100, "heading_deg": 0, "kind": "collimated", "semi_diameter_mm": 1}`, ""), []string{"source.x_mm"}},
		{"a broken rule is not checked", validBench("", `{"id": "F1", "type": "thin-lens", "gap_mm": -5, "focal_mm": 100}`), nil},
	} {
		t.Run(tc.name, func(t *testing.T) {
			b, err := DecodeTrusted([]byte(tc.data))
			if got := paths(err); !reflect.DeepEqual(got, tc.wantPaths) {
				t.Errorf("problem paths %q, want %q (%v)", got, tc.wantPaths, err)
			}
			if (b == nil) != (tc.wantPaths != nil) {
				t.Errorf("bench %v with error %v", b, err)
			}
		})
	}
}
