package material

import (
	"fmt"
	"math"
	"strconv"
)

// Medium gives the refractive index (relative to air, n_air = 1 exactly) at a vacuum wavelength in nm.
type Medium interface {
	Index(wavelengthNM float64) float64
	// RangeNM is the wavelength range where the model is valid; (0, +Inf) when unlimited.
	RangeNM() (loNM, hiNM float64)
	// Describe is one short line naming the model and its source, for reports (e.g. "Sellmeier, Malitson 1965").
	Describe() string
}

// Fraunhofer lines that define nd and the Abbe number vd = (nd - 1) / (nF - nC).
const (
	FLineNM = 486.1327 // hydrogen F line
	DLineNM = 587.5618 // helium d line
	CLineNM = 656.2725 // hydrogen C line
)

// InRange reports whether wavelengthNM lies inside m's validity range (ends included).
// It is false for a nil medium and for NaN.
func InRange(m Medium, wavelengthNM float64) bool {
	if m == nil {
		return false
	}
	lo, hi := m.RangeNM()
	return wavelengthNM >= lo && wavelengthNM <= hi
}

// AbbeNumber returns vd = (n(d) - 1) / (n(F) - n(C)) of m, +Inf for a medium without dispersion.
func AbbeNumber(m Medium) float64 {
	nd := m.Index(DLineNM)
	dispersion := m.Index(FLineNM) - m.Index(CLineNM)
	if dispersion == 0 {
		return math.Inf(1)
	}
	return (nd - 1) / dispersion
}

// validWavelength is the guard every Index applies before its formula.
func validWavelength(wavelengthNM float64) bool {
	return wavelengthNM > 0 && !math.IsInf(wavelengthNM, 1)
}

// Constant is a medium whose index does not depend on wavelength.
type Constant struct {
	N float64
	// Note optionally replaces the generic description, e.g. for the reference medium.
	Note string
}

// MaxIndex is the largest constant index NewConstant accepts. Transparent media stay well below it
// (germanium, among the highest in the infrared, is about 4, from memory); more is a slip.
const MaxIndex = 5.0

// NewConstant validates a constant index (field name "index"): finite and within [1, MaxIndex],
// relative to air.
func NewConstant(n float64) (Constant, error) {
	if !finite(n) {
		return Constant{}, InputError{{Field: "index", Rule: fmt.Sprintf("must be a finite number, got %v", n)}}
	}
	if n < 1 || n > MaxIndex {
		return Constant{}, InputError{{Field: "index", Rule: fmt.Sprintf("index %v must lie between 1 and %v (indices are relative to air)", n, MaxIndex)}}
	}
	return Constant{N: n}, nil
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// Index returns N for any positive wavelength and NaN for an invalid one.
func (c Constant) Index(wavelengthNM float64) float64 {
	if !validWavelength(wavelengthNM) {
		return math.NaN()
	}
	return c.N
}

// RangeNM is unlimited: a constant index has no range of its own.
func (c Constant) RangeNM() (loNM, hiNM float64) { return 0, math.Inf(1) }

// Describe names the constant index.
func (c Constant) Describe() string {
	if c.Note != "" {
		return c.Note
	}
	return "constant index n = " + strconv.FormatFloat(c.N, 'g', 6, 64)
}
