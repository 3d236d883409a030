package material

import (
	"fmt"
	"slices"
	"strings"
)

// Names of the built-in media.
const (
	Air             = "air"
	Vacuum          = "vacuum"
	FusedSilica     = "fused-silica"
	CalciumFluoride = "calcium-fluoride"
	SapphireO       = "sapphire-o"
	Water           = "water"
)

// builtins maps each name to its medium. All coefficients are recalled from memory of the cited
// papers, not copied from them; the tests check each fit against well-known values (nd, vd and a
// few tabulated indices), which a slip in any leading digit would fail. Sellmeier C values are the squares of the resonance
// wavelengths as the papers print them (λ_i in µm), squared here so the published digits stay
// visible and nothing is rounded twice.
var builtins = map[string]Medium{
	Air: Constant{N: 1, Note: "air, the reference medium: n = 1 by convention"},
	Vacuum: Constant{N: 1, Note: "vacuum, n = 1 in raytable's air-relative convention " +
		"(its true ratio to air is about 1/1.00027)"},

	// I. H. Malitson, "Interspecimen comparison of the refractive index of fused silica",
	// J. Opt. Soc. Am. 55, 1205 (1965), three-term Sellmeier, 0.21-3.71 µm, 20 °C.
	FusedSilica: Sellmeier{
		B:      []float64{0.6961663, 0.4079426, 0.8974794},
		CUM2:   []float64{sq(0.0684043), sq(0.1162414), sq(9.896161)},
		LoNM:   210,
		HiNM:   3710,
		Source: "Malitson 1965 (JOSA 55, 1205)",
	},

	// I. H. Malitson, "A redetermination of some optical properties of calcium fluoride",
	// Appl. Opt. 2, 1103 (1963), three-term Sellmeier, 0.23-9.7 µm, 24 °C.
	CalciumFluoride: Sellmeier{
		B:      []float64{0.5675888, 0.4710914, 3.8484723},
		CUM2:   []float64{sq(0.050263605), sq(0.1003909), sq(34.649040)},
		LoNM:   230,
		HiNM:   9700,
		Source: "Malitson 1963 (Appl. Opt. 2, 1103)",
	},

	// I. H. Malitson and M. J. Dodge, "Refractive index and birefringence of synthetic sapphire",
	// J. Opt. Soc. Am. 62, 1405 (1972), ordinary ray, three-term Sellmeier, 0.2-5.5 µm, 20 °C.
	SapphireO: Sellmeier{
		B:      []float64{1.4313493, 0.65054713, 5.3414021},
		CUM2:   []float64{sq(0.0726631), sq(0.1193242), sq(18.028251)},
		LoNM:   200,
		HiNM:   5500,
		Source: "Malitson and Dodge 1972 (JOSA 62, 1405), ordinary ray",
	},

	// M. Daimon and A. Masumura, "Measurement of the refractive index of distilled water from the
	// near-infrared region to the ultraviolet region", Appl. Opt. 46, 3811 (2007), four-term
	// Sellmeier at 20 °C, 182-1129 nm. Coefficients from memory. The fit gives 1.33335 at 589.3 nm,
	// the air-relative handbook value 1.33299 times n_air ≈ 1.00028: it is relative to vacuum, so
	// OverAir divides it by the index of standard air (water_test.go checks both).
	Water: OverAir{Vacuum: Sellmeier{
		B:      []float64{5.684027565e-1, 1.726177391e-1, 2.086189578e-2, 1.130748688e-1},
		CUM2:   []float64{5.101829712e-3, 1.821153936e-2, 2.620722293e-2, 1.069792721e1},
		LoNM:   182,
		HiNM:   1129,
		Source: "Daimon and Masumura 2007 (Appl. Opt. 46, 3811), 20 °C",
	}},
}

// Builtin returns a built-in medium by its exact name, or the glass of a "code:NNNMMM" name.
// The result is a fresh copy: changing it does not change the built-in. ok is false for an
// unknown name or an invalid code; Lookup says why.
func Builtin(name string) (Medium, bool) {
	m, err := Lookup(name)
	return m, err == nil
}

// Lookup is Builtin with an error that says what is wrong: the glass code rule that fails, or
// for an unknown name the list of known ones.
func Lookup(name string) (Medium, error) {
	if strings.HasPrefix(name, codePrefix) {
		g, err := ParseGlassCode(name)
		if err != nil {
			return nil, err
		}
		return g, nil
	}
	m, ok := builtins[name]
	if !ok {
		rule := fmt.Sprintf("unknown medium %q: use one of %s, or a glass code such as code:517642",
			name, strings.Join(BuiltinNames(), ", "))
		return nil, InputError{{Rule: rule}}
	}
	switch s := m.(type) {
	case Sellmeier:
		return s.clone(), nil
	case OverAir:
		return OverAir{Vacuum: s.Vacuum.clone()}, nil
	}
	return m, nil
}

// clone is s with its own coefficient slices.
func (s Sellmeier) clone() Sellmeier {
	s.B = slices.Clone(s.B)
	s.CUM2 = slices.Clone(s.CUM2)
	return s
}

// BuiltinNames returns the built-in media names, sorted, for help text and forms. Glass codes are
// not listed: any valid "code:NNNMMM" is accepted.
func BuiltinNames() []string {
	names := make([]string, 0, len(builtins))
	for name := range builtins {
		names = append(names, name)
	}
	slices.Sort(names)
	return names
}
