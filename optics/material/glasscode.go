package material

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// GlassCode is a glass known only by its index nd at the helium d line and its Abbe number
// vd = (nd - 1) / (nF - nC). Its dispersion is modelled by the two-term Cauchy formula
//
//	n(λ) = A + B / λ²   (λ in µm)
//
// with A and B chosen so that n(587.5618 nm) = nd exactly and n(486.1327) - n(656.2725) =
// (nd - 1) / vd exactly, i.e. the model reproduces both numbers it was given. This is an
// approximation. Measured against Sellmeier fits (the built-in fused silica, calcium fluoride and
// ordinary sapphire, and, from memory, a crown of vd 64, a flint of vd 36 and a dense flint of
// vd 26, each given as a code from its own nd and vd; glasscode_accuracy_test.go keeps the table),
// the model minus the real index is:
//
//	450-700 nm    within 2e-4 for vd above 60; within 5.5e-4 for vd 36; up to 1.8e-3 for vd 26
//	400-450 nm    within 3.1e-4 for vd above 60; 2.2e-3 for vd 36 and 7e-3 for vd 26 at 400 nm
//	700-1000 nm   grows to 1.3-1.9e-3 at 1000 nm for vd above 60 (4e-4 for calcium fluoride);
//	              up to 1.5e-3 for vd 26 from 800 nm
//	1000-1600 nm  2-9e-3 at 1600 nm: real glasses bend away from 1/λ² towards the infrared
//
// RangeNM therefore reports 400-1000 nm, callers warn outside it, and Poor names the zones inside
// it where the error exceeds 1e-3 (GlassCodePoorError).
type GlassCode struct {
	ND, VD float64
}

// Validity range reported for the Cauchy model of a glass code.
const (
	GlassCodeLoNM = 400.0
	GlassCodeHiNM = 1000.0
)

// Accepted nd and vd. Transparent optical glasses lie near nd 1.4-2.1 and vd 17-95; the bounds are
// wider so that unusual media still fit, and narrow enough to catch slips such as vd 642 for 64.2.
// With vd ≥ 5 the Cauchy constant A stays above 1, so the model never gives n < 1.
const (
	minND = 1.0 // exclusive
	maxND = 3.0
	minVD = 5.0
	maxVD = 120.0
)

// codePrefix starts every glass code name, e.g. "code:517642".
const codePrefix = "code:"

// NewGlassCode validates nd and vd (field names "nd" and "vd").
func NewGlassCode(nd, vd float64) (GlassCode, error) {
	var problems InputError
	switch {
	case !finite(nd):
		problems = append(problems, FieldError{"nd", fmt.Sprintf("must be a finite number, got %v", nd)})
	case nd <= minND || nd > maxND:
		problems = append(problems, FieldError{"nd", fmt.Sprintf("must be above %g and at most %g, got %v", minND, maxND, nd)})
	}
	switch {
	case !finite(vd):
		problems = append(problems, FieldError{"vd", fmt.Sprintf("must be a finite number, got %v", vd)})
	case vd < minVD || vd > maxVD:
		problems = append(problems, FieldError{"vd", fmt.Sprintf("must be between %g and %g, got %v", minVD, maxVD, vd)})
	}
	if err := errOrNil(problems); err != nil {
		return GlassCode{}, err
	}
	return GlassCode{ND: nd, VD: vd}, nil
}

// ParseGlassCode reads "code:NNNMMM": nd = 1 + NNN/1000 and vd = MMM/10, so "code:517642" is
// nd 1.517, vd 64.2. The error is an InputError with an empty Field that quotes the input.
func ParseGlassCode(s string) (GlassCode, error) {
	fail := func(format string, args ...any) (GlassCode, error) {
		rule := fmt.Sprintf("glass code %q: ", s) + fmt.Sprintf(format, args...)
		return GlassCode{}, InputError{{Rule: rule}}
	}
	digits, ok := strings.CutPrefix(s, codePrefix)
	if !ok {
		return fail("must start with %q followed by 6 digits, e.g. code:517642", codePrefix)
	}
	if len(digits) != 6 {
		return fail("needs exactly 6 digits after %q (3 for nd, 3 for vd), got %d characters", codePrefix, len(digits))
	}
	for i := range len(digits) {
		if digits[i] < '0' || digits[i] > '9' {
			return fail("character %q at position %d after %q is not a digit", digits[i], i+1, codePrefix)
		}
	}
	nnn, _ := strconv.Atoi(digits[:3]) // six ASCII digits checked above, cannot fail
	mmm, _ := strconv.Atoi(digits[3:])
	// (1000+NNN)/1000 rounds once, so nd is the closest float to the written decimal.
	g, err := NewGlassCode(float64(1000+nnn)/1000, float64(mmm)/10)
	if err != nil {
		var parts []string
		for _, fe := range err.(InputError) {
			parts = append(parts, fe.Error())
		}
		return fail("%s", strings.Join(parts, "; "))
	}
	return g, nil
}

// Cauchy returns the model's constants: n(λ) = a + bUM2/λ², λ in µm.
func (g GlassCode) Cauchy() (a, bUM2 float64) {
	invF := 1 / sq(FLineNM/1000)
	invC := 1 / sq(CLineNM/1000)
	invD := 1 / sq(DLineNM/1000)
	bUM2 = (g.ND - 1) / (g.VD * (invF - invC))
	a = g.ND - bUM2*invD
	return a, bUM2
}

// Index evaluates the Cauchy model; NaN for a wavelength that is not positive and finite.
func (g GlassCode) Index(wavelengthNM float64) float64 {
	if !validWavelength(wavelengthNM) {
		return math.NaN()
	}
	a, b := g.Cauchy()
	return a + b/sq(wavelengthNM/1000)
}

// RangeNM is where the two-term model is a fair approximation: 400-1000 nm.
func (g GlassCode) RangeNM() (loNM, hiNM float64) { return GlassCodeLoNM, GlassCodeHiNM }

// Code returns the "code:NNNMMM" name of g, rounding nd to 3 decimals and vd to 1. It is a valid
// code only for nd below 2, which is all that six digits can express.
func (g GlassCode) Code() string {
	return fmt.Sprintf("%s%03d%03d", codePrefix, int(math.Round((g.ND-1)*1000)), int(math.Round(g.VD*10)))
}

// Describe names the model; it states plainly that it is an approximation.
func (g GlassCode) Describe() string {
	return fmt.Sprintf("nd %s, vd %s: two-term Cauchy fit to nd and vd (approximation), valid %g-%g nm",
		strconv.FormatFloat(g.ND, 'f', -1, 64), strconv.FormatFloat(g.VD, 'f', -1, 64), GlassCodeLoNM, GlassCodeHiNM)
}

func sq(x float64) float64 { return x * x }
