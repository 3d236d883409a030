package material

import (
	"errors"
	"math"
	"slices"
	"strings"
	"testing"
)

func TestBuiltinNames(t *testing.T) {
	want := []string{"air", "calcium-fluoride", "fused-silica", "sapphire-o", "vacuum", "water"}
	if got := BuiltinNames(); !slices.Equal(got, want) {
		t.Errorf("BuiltinNames() = %v, want %v", got, want)
	}
}

// Air is the reference medium and vacuum is 1 in the air-relative convention (project rule).
func TestBuiltinReferenceMedia(t *testing.T) {
	for _, name := range []string{Air, Vacuum} {
		m, ok := Builtin(name)
		if !ok {
			t.Fatalf("Builtin(%q) not found", name)
		}
		for _, wl := range []float64{200, 587.5618, 10600} {
			if got := m.Index(wl); got != 1 {
				t.Errorf("%s at %v nm: n = %v, want exactly 1", name, wl, got)
			}
		}
		if lo, hi := m.RangeNM(); lo != 0 || !math.IsInf(hi, 1) {
			t.Errorf("%s range = (%v, %v), want (0, +Inf)", name, lo, hi)
		}
		if !strings.HasPrefix(m.Describe(), name) {
			t.Errorf("%s: Describe() = %q should name the medium", name, m.Describe())
		}
	}
}

func TestBuiltinGlassCodeAndUnknown(t *testing.T) {
	m, ok := Builtin("code:517642")
	if !ok {
		t.Fatal(`Builtin("code:517642") not found`)
	}
	if g, isCode := m.(GlassCode); !isCode || g.ND != 1.517 || g.VD != 64.2 {
		t.Errorf(`Builtin("code:517642") = %#v, want GlassCode{1.517, 64.2}`, m)
	}
	for _, name := range []string{"code:51764", "glass", "Water", " water", ""} {
		if m, ok := Builtin(name); ok || m != nil {
			t.Errorf("Builtin(%q) = %v, %v; want nil, false", name, m, ok)
		}
	}
	_, err := Lookup("glass")
	var ie InputError
	if !errors.As(err, &ie) || !strings.Contains(err.Error(), "fused-silica") || !strings.Contains(err.Error(), "code:517642") {
		t.Errorf("Lookup(\"glass\") error %q should list the known names and the code form", err)
	}
}

// Changing a returned fit must not change the built-in.
func TestBuiltinReturnsCopies(t *testing.T) {
	m, _ := Builtin(FusedSilica)
	before := m.Index(DLineNM)
	m.(Sellmeier).B[0] = 0
	again, _ := Builtin(FusedSilica)
	if got := again.Index(DLineNM); got != before {
		t.Errorf("built-in changed through a returned copy: %v, was %v", got, before)
	}
}

func TestBuiltinDescribeNamesSource(t *testing.T) {
	tests := []struct{ name, want string }{
		{FusedSilica, "Sellmeier, Malitson 1965 (JOSA 55, 1205), valid 210-3710 nm"},
		{CalciumFluoride, "Sellmeier, Malitson 1963 (Appl. Opt. 2, 1103), valid 230-9700 nm"},
		{SapphireO, "Sellmeier, Malitson and Dodge 1972 (JOSA 62, 1405), ordinary ray, valid 200-5500 nm"},
		{Water, "Sellmeier, Daimon and Masumura 2007 (Appl. Opt. 46, 3811), 20 °C, valid 182-1129 nm, over standard air (Ciddor 1996)"},
	}
	for _, tc := range tests {
		m, _ := Builtin(tc.name)
		if got := m.Describe(); got != tc.want {
			t.Errorf("%s: Describe() = %q, want %q", tc.name, got, tc.want)
		}
	}
}

func TestInRange(t *testing.T) {
	fs, _ := Builtin(FusedSilica)
	caf2, _ := Builtin(CalciumFluoride)
	sap, _ := Builtin(SapphireO)
	water, _ := Builtin(Water)
	air, _ := Builtin(Air)
	code, _ := Builtin("code:517642")
	tests := []struct {
		label        string
		m            Medium
		wavelengthNM float64
		want         bool
	}{
		{"fused silica below 210 nm (Malitson 1965 range)", fs, 209.9, false},
		{"fused silica at 210 nm", fs, 210, true},
		{"fused silica at 3710 nm", fs, 3710, true},
		{"fused silica beyond 3710 nm", fs, 3710.1, false},
		{"CaF2 at 230 nm (Malitson 1963 range)", caf2, 230, true},
		{"CaF2 at 10.6 µm", caf2, 10600, false},
		{"sapphire at 200 nm (Malitson and Dodge 1972 range)", sap, 200, true},
		{"sapphire at 5.6 µm", sap, 5600, false},
		{"water at 1129 nm (Daimon and Masumura 2007 range)", water, 1129, true},
		{"water at 1550 nm", water, 1550, false},
		{"glass code at 399 nm (model range)", code, 399, false},
		{"glass code at 1000 nm", code, 1000, true},
		{"glass code at 1064 nm", code, 1064, false},
		{"air anywhere", air, 1e6, true},
		{"NaN wavelength", fs, math.NaN(), false},
		{"nil medium", nil, 500, false},
	}
	for _, tc := range tests {
		if got := InRange(tc.m, tc.wavelengthNM); got != tc.want {
			t.Errorf("%s: InRange = %v, want %v", tc.label, got, tc.want)
		}
	}
}

func TestNewConstant(t *testing.T) {
	c, err := NewConstant(1.5)
	if err != nil || c.Index(633) != 1.5 || c.Describe() != "constant index n = 1.5" {
		t.Errorf("NewConstant(1.5) = %#v, %v", c, err)
	}
	for _, n := range []float64{0.99, -1, MaxIndex + 0.01, 7, math.NaN(), math.Inf(1)} {
		_, err := NewConstant(n)
		var ie InputError
		if !errors.As(err, &ie) || ie[0].Field != "index" {
			t.Errorf("NewConstant(%v) error = %v, want a problem at \"index\"", n, err)
		}
	}
	// Both ends of [1, MaxIndex] are accepted; the rule names the range (the wording the bench
	// page has always shown).
	for _, n := range []float64{1, MaxIndex} {
		if _, err := NewConstant(n); err != nil {
			t.Errorf("NewConstant(%v): %v", n, err)
		}
	}
	if _, err := NewConstant(7); err == nil || err.Error() != "index: index 7 must lie between 1 and 5 (indices are relative to air)" {
		t.Errorf("NewConstant(7) error %q", err)
	}
}
