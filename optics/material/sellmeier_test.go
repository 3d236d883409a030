package material

import (
	"errors"
	"math"
	"strings"
	"testing"

	"raytable/optics/internal/approx"
)

// Tolerances, named by how precisely the reference value is known; a value computed two ways
// agrees to approx.Rounding.
const (
	tolTable5  = 2e-5 // a value quoted to 5 decimals (±1 in the last digit, plus rounding)
	tolQuoted4 = 1e-4 // a value quoted to 4 decimals
	tolQuoted3 = 5e-4 // a value quoted to 3 decimals
	tolAbbe    = 0.1  // Abbe numbers are quoted to 0.1
)

func TestSellmeierBuiltinIndices(t *testing.T) {
	tests := []struct {
		medium       string
		wavelengthNM float64
		want         float64
		tol          float64
		source       string
	}{
		{FusedSilica, FLineNM, 1.46313, tolTable5, "Malitson 1965, nF (from memory)"},
		{FusedSilica, DLineNM, 1.45846, tolTable5, "Malitson 1965, nd = 1.4585 (from memory)"},
		{FusedSilica, CLineNM, 1.45637, tolTable5, "Malitson 1965, nC (from memory)"},
		{FusedSilica, 1064, 1.4496, tolQuoted4, "fused silica at 1064 nm, common practice (from memory)"},
		{CalciumFluoride, DLineNM, 1.43385, tolTable5, "Malitson 1963, nd (from memory)"},
		{CalciumFluoride, 1064, 1.4285, tolQuoted4, "Malitson 1963 fit at 1064 nm, common practice (from memory)"},
		{CalciumFluoride, 5000, 1.399, tolQuoted3, "Malitson 1963, CaF2 near 5 µm (from memory)"},
		{SapphireO, DLineNM, 1.7682, tolQuoted4, "Malitson and Dodge 1972, ordinary nd (from memory)"},
		{SapphireO, 632.8, 1.766, tolQuoted3, "Malitson and Dodge 1972, HeNe line (from memory)"},
		{SapphireO, 1064, 1.7545, tolQuoted4, "Malitson and Dodge 1972, ordinary at 1064 nm (from memory)"},
	}
	for _, tc := range tests {
		m, ok := Builtin(tc.medium)
		if !ok {
			t.Fatalf("Builtin(%q) not found", tc.medium)
		}
		got := m.Index(tc.wavelengthNM)
		if !approx.Abs(got, tc.want, tc.tol) {
			t.Errorf("%s at %v nm: n = %.6f, want %.6f ± %g (%s)", tc.medium, tc.wavelengthNM, got, tc.want, tc.tol, tc.source)
		}
	}
}

func TestSellmeierBuiltinAbbeNumbers(t *testing.T) {
	tests := []struct {
		medium string
		want   float64
		source string
	}{
		{FusedSilica, 67.8, "Malitson 1965 fit, vd of fused silica 67.8, common practice (from memory)"},
		{CalciumFluoride, 95.0, "Malitson 1963 fit, vd of CaF2 95.0, common practice (from memory)"},
		{SapphireO, 72.2, "sapphire ordinary vd 72.2, common practice (from memory)"},
	}
	for _, tc := range tests {
		m, _ := Builtin(tc.medium)
		if got := AbbeNumber(m); !approx.Abs(got, tc.want, 2*tolAbbe) {
			t.Errorf("%s: vd = %.3f, want %.1f ± %g (%s)", tc.medium, got, tc.want, 2*tolAbbe, tc.source)
		}
	}
}

// The built-in fits must pass the same checks as user fits.
func TestSellmeierBuiltinsAreValid(t *testing.T) {
	for _, name := range BuiltinNames() {
		m, _ := Builtin(name)
		s, ok := m.(Sellmeier)
		if !ok {
			continue
		}
		if _, err := NewSellmeier(s.B, s.CUM2, s.LoNM, s.HiNM); err != nil {
			t.Errorf("%s: built-in fit fails validation: %v", name, err)
		}
	}
}

// Self-consistency: inside every range the index is real, above 1 and falls with wavelength
// (normal dispersion, which all these transparent media show across their ranges).
func TestSellmeierNormalDispersionInRange(t *testing.T) {
	for _, name := range []string{FusedSilica, CalciumFluoride, SapphireO, Water} {
		m, _ := Builtin(name)
		lo, hi := m.RangeNM()
		prev := math.Inf(1)
		for i := 0; i <= 200; i++ {
			wl := lo + (hi-lo)*float64(i)/200
			n := m.Index(wl)
			if !(n > 1) || n >= prev {
				t.Fatalf("%s at %.1f nm: n = %v, want > 1 and below %v", name, wl, n, prev)
			}
			prev = n
		}
	}
}

func TestNewSellmeierAccepts(t *testing.T) {
	b := []float64{1.0}
	c := []float64{0.01}
	s, err := NewSellmeier(b, c, 400, 800)
	if err != nil {
		t.Fatal(err)
	}
	b[0] = 99 // the fit must own a copy
	// n² = 1 + 1·0.25/(0.25-0.01) = 2.041666…, so n = 1.428869… (direct evaluation of the formula)
	if got, want := s.Index(500), math.Sqrt(1+0.25/0.24); !approx.Abs(got, want, approx.Rounding) {
		t.Errorf("Index(500) = %v, want %v", got, want)
	}
	if got := s.Describe(); got != "Sellmeier (1 term, user fit), valid 400-800 nm" {
		t.Errorf("Describe() = %q", got)
	}
	// C = 0 and an unlimited range are allowed: a constant-offset term.
	if _, err := NewSellmeier([]float64{0.5}, []float64{0}, 0, math.Inf(1)); err != nil {
		t.Errorf("unlimited range with C = 0: %v", err)
	}
}

func TestNewSellmeierRejects(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	tests := []struct {
		name      string
		b, c      []float64
		lo, hi    float64
		wantField string
		wantText  string
	}{
		{"no terms", nil, nil, 200, 800, "sellmeier.b", "needs 1 to 6 terms, got 0"},
		{"seven terms", make([]float64, 7), make([]float64, 7), 200, 800, "sellmeier.b", "got 7"},
		{"length mismatch", []float64{1, 1}, []float64{0.01}, 200, 800, "sellmeier.c_um2", "one value per term of b (2), got 1"},
		{"NaN B", []float64{nan}, []float64{0.01}, 200, 800, "sellmeier.b[0]", "finite"},
		{"infinite C", []float64{1}, []float64{inf}, 200, 800, "sellmeier.c_um2[0]", "finite"},
		{"negative C", []float64{1}, []float64{-0.01}, 200, 800, "sellmeier.c_um2[0]", "at least 0"},
		{"lo above hi", []float64{1}, []float64{0.01}, 800, 200, "range_nm", "low end 800 nm must be below the high end 200 nm"},
		{"lo equals hi", []float64{1}, []float64{0.01}, 500, 500, "range_nm", "must be below"},
		{"negative lo", []float64{1}, []float64{0.01}, -1, 800, "range_nm[0]", "at least 0"},
		{"NaN hi", []float64{1}, []float64{0.01}, 200, nan, "range_nm[1]", "must be a finite number, got NaN"},
		{"NaN lo", []float64{1}, []float64{0.01}, nan, 800, "range_nm[0]", "must be a finite number, got NaN"},
		// Only (0, +Inf) means no range; a stated range ends somewhere.
		{"open-ended stated range", []float64{1}, []float64{0.01}, 400, inf, "range_nm[1]", "must be a finite number, got +Inf"},
		{"resonance in range", []float64{1}, []float64{0.25}, 200, 800, "sellmeier.c_um2[0]", "resonance at 500 nm"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := NewSellmeier(tc.b, tc.c, tc.lo, tc.hi)
			var ie InputError
			if !errors.As(err, &ie) {
				t.Fatalf("error %v is not an InputError", err)
			}
			for _, fe := range ie {
				if fe.Field == tc.wantField && strings.Contains(fe.Rule, tc.wantText) {
					return
				}
			}
			t.Errorf("error %q lacks %s: …%s…", err, tc.wantField, tc.wantText)
		})
	}
}

func TestIndexBadWavelengthIsNaN(t *testing.T) {
	fs, _ := Builtin(FusedSilica)
	media := []Medium{fs, Constant{N: 1.5}, GlassCode{ND: 1.517, VD: 64.2}, Sellmeier{B: []float64{1, 2}, CUM2: []float64{0.01}}}
	for _, m := range media {
		for _, wl := range []float64{0, -500, math.NaN(), math.Inf(1), math.Inf(-1)} {
			if got := m.Index(wl); !approx.Alike(got, math.NaN()) {
				t.Errorf("%s: Index(%v) = %v, want NaN", m.Describe(), wl, got)
			}
		}
	}
}

// A literal with mismatched lengths uses the shorter one instead of panicking, and a wavelength
// exactly at a resonance gives NaN, not ±Inf.
func TestSellmeierLiteralEdgeCases(t *testing.T) {
	s := Sellmeier{B: []float64{1, 2}, CUM2: []float64{0.25}}
	want := math.Sqrt(1 + 1*0.36/(0.36-0.25)) // one term only, formula evaluated directly
	if got := s.Index(600); !approx.Abs(got, want, approx.Rounding) {
		t.Errorf("mismatched literal: Index(600) = %v, want %v", got, want)
	}
	if got := s.Index(500); !math.IsNaN(got) {
		t.Errorf("at the resonance: Index(500) = %v, want NaN", got)
	}
	if got := (Sellmeier{}).Index(500); got != 1 {
		t.Errorf("zero Sellmeier: Index = %v, want 1 (no terms)", got)
	}
}
