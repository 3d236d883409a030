package material

import (
	"errors"
	"math"
	"strings"
	"testing"

	"raytable/optics/internal/approx"
)

// The model must reproduce the two numbers it was given: n(d) = nd and nF - nC = (nd-1)/vd
// (Abbe number definition), for codes across the usual glass map.
func TestGlassCodeRoundTrip(t *testing.T) {
	tests := []struct {
		code   string
		nd, vd float64
	}{
		{"code:517642", 1.517, 64.2},
		{"code:620364", 1.620, 36.4},
		{"code:785257", 1.785, 25.7},
		{"code:458678", 1.458, 67.8},
		{"code:434950", 1.434, 95.0},
		{"code:001050", 1.001, 5.0}, // smallest nd and vd the rules accept
	}
	for _, tc := range tests {
		t.Run(tc.code, func(t *testing.T) {
			g, err := ParseGlassCode(tc.code)
			if err != nil {
				t.Fatal(err)
			}
			if g.ND != tc.nd || g.VD != tc.vd {
				t.Fatalf("parsed nd %v vd %v, want %v %v (nd = 1 + NNN/1000, vd = MMM/10)", g.ND, g.VD, tc.nd, tc.vd)
			}
			if got := g.Index(DLineNM); !approx.Abs(got, tc.nd, approx.Rounding) {
				t.Errorf("n(d) = %.15f, want nd = %v", got, tc.nd)
			}
			wantSpread := (tc.nd - 1) / tc.vd // Abbe number definition
			if got := g.Index(FLineNM) - g.Index(CLineNM); !approx.Abs(got, wantSpread, approx.Rounding) {
				t.Errorf("nF - nC = %.15f, want (nd-1)/vd = %.15f", got, wantSpread)
			}
			if got := AbbeNumber(g); !approx.Abs(got, tc.vd, approx.VeryClose) { // vd from three indices
				t.Errorf("AbbeNumber = %v, want %v", got, tc.vd)
			}
			if got := g.Code(); got != tc.code {
				t.Errorf("Code() = %q, want %q", got, tc.code)
			}
			// The model never gives n < 1, even far past its range (A > 1 when vd ≥ 5).
			if a, _ := g.Cauchy(); !(a > 1) {
				t.Errorf("Cauchy A = %v, want > 1", a)
			}
		})
	}
}

// External check of the approximation: the code of fused silica (nd 1.458, vd 67.8) against the
// Malitson 1965 Sellmeier fit across the visible. The two-term model should agree to a few 1e-4
// (common practice for two-term Cauchy fits of glasses in the visible); the offset of 4.6e-4 at
// the d line comes from the code's rounding of nd (1.45846 → 1.458) and is removed first.
func TestGlassCodeApproximatesFusedSilica(t *testing.T) {
	const tolCauchyVisible = 3e-4
	g, _ := ParseGlassCode("code:458678")
	fs, _ := Builtin(FusedSilica)
	offset := fs.Index(DLineNM) - g.Index(DLineNM)
	for _, wl := range []float64{420, 450, 500, 550, 600, 650, 700, 750} {
		if diff := fs.Index(wl) - (g.Index(wl) + offset); !approx.Abs(diff, 0, tolCauchyVisible) {
			t.Errorf("at %v nm Sellmeier - Cauchy = %.2e, want within %g", wl, diff, tolCauchyVisible)
		}
	}
}

func TestParseGlassCodeRejects(t *testing.T) {
	tests := []struct {
		input    string
		wantText string
	}{
		{"code:51764", "exactly 6 digits"},
		{"code:5176420", "exactly 6 digits"},
		{"code:", "got 0 characters"},
		{"code:abcdef", `'a' at position 1`},
		{"code:51764x", `'x' at position 6`},
		{"code:5176-2", `'-' at position 5`},
		{"code:000642", "nd: must be above 1"},
		{"code:517000", "vd: must be between 5 and 120, got 0"},
		{"code:517049", "vd: must be between 5 and 120, got 4.9"},
		{"code:000000", "nd: must be above 1 and at most 3, got 1; vd:"},
		{"517642", `must start with "code:"`},
		{"CODE:517642", `must start with "code:"`},
		{"", `must start with "code:"`},
		{"code:５１７６４２", "exactly 6 digits"}, // full-width digits are not ASCII digits
	}
	for _, tc := range tests {
		t.Run(tc.input, func(t *testing.T) {
			_, err := ParseGlassCode(tc.input)
			var ie InputError
			if !errors.As(err, &ie) {
				t.Fatalf("error %v is not an InputError", err)
			}
			if !strings.Contains(err.Error(), tc.wantText) || !strings.Contains(err.Error(), tc.input) {
				t.Errorf("error %q should quote the input and contain %q", err, tc.wantText)
			}
		})
	}
}

func TestNewGlassCodeRejects(t *testing.T) {
	tests := []struct {
		name      string
		nd, vd    float64
		wantField string
	}{
		{"nd equal to 1", 1, 60, "nd"},
		{"nd below 1", 0.9, 60, "nd"},
		{"nd above 3", 3.2, 20, "nd"},
		{"nd NaN", math.NaN(), 60, "nd"},
		{"vd infinite", 1.5, math.Inf(1), "vd"},
		{"vd typed without decimal point", 1.5, 642, "vd"},
		{"vd negative", 1.5, -60, "vd"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := NewGlassCode(tc.nd, tc.vd)
			var ie InputError
			if !errors.As(err, &ie) || len(ie) != 1 || ie[0].Field != tc.wantField {
				t.Errorf("NewGlassCode(%v, %v) error = %v, want one problem at %q", tc.nd, tc.vd, err, tc.wantField)
			}
		})
	}
}

// Bad input never panics: any string gives either a valid glass or an InputError.
func FuzzParseGlassCode(f *testing.F) {
	for _, seed := range []string{"code:517642", "code:51764", "code:abcdef", "code:000642", "", "code:\xff\xff\xff\xff\xff\xff"} {
		f.Add(seed)
	}
	f.Fuzz(func(t *testing.T, s string) {
		g, err := ParseGlassCode(s)
		if err != nil {
			var ie InputError
			if !errors.As(err, &ie) {
				t.Fatalf("error %v is not an InputError", err)
			}
			return
		}
		if n := g.Index(DLineNM); !approx.Abs(n, g.ND, approx.Rounding) {
			t.Fatalf("%q: n(d) = %v, want %v", s, n, g.ND)
		}
	})
}
