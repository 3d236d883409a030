package material

import (
	"fmt"
	"math"
	"strconv"
)

// MaxSellmeierTerms bounds a Sellmeier fit; published fits use two to six terms.
const MaxSellmeierTerms = 6

// Sellmeier is the dispersion formula n² = 1 + Σ B_i λ² / (λ² - C_i), with λ in micrometres and
// C_i in µm² (C_i is the square of the i-th resonance wavelength). Build user fits with
// NewSellmeier, which checks the coefficients; a literal with B and CUM2 of different lengths
// uses only the shorter of the two rather than panicking.
type Sellmeier struct {
	B, CUM2    []float64
	LoNM, HiNM float64 // validity range of the fit
	Source     string  // who published the fit, e.g. "Malitson 1965"; empty for user fits
}

// NewSellmeier validates and copies a fit: B and C of the same length 1..6, all finite, every
// C ≥ 0, and either the unlimited range (0, +Inf), which states no range at all, or a stated one
// with finite ends, 0 ≤ lo < hi, and no resonance √C_i strictly inside it. Field names follow the
// bench file's material object: "sellmeier.b[0]", "sellmeier.c_um2", "range_nm[1]".
func NewSellmeier(b, cUM2 []float64, loNM, hiNM float64) (Sellmeier, error) {
	var problems InputError
	add := func(field, format string, args ...any) {
		problems = append(problems, FieldError{Field: field, Rule: fmt.Sprintf(format, args...)})
	}
	if len(b) == 0 || len(b) > MaxSellmeierTerms {
		add("sellmeier.b", "needs 1 to %d terms, got %d", MaxSellmeierTerms, len(b))
	}
	if len(cUM2) != len(b) {
		add("sellmeier.c_um2", "needs one value per term of b (%d), got %d", len(b), len(cUM2))
	}
	for i, v := range b {
		if !finite(v) {
			add(fmt.Sprintf("sellmeier.b[%d]", i), "must be a finite number, got %v", v)
		}
	}
	for i, v := range cUM2 {
		switch {
		case !finite(v):
			add(fmt.Sprintf("sellmeier.c_um2[%d]", i), "must be a finite number, got %v", v)
		case v < 0:
			add(fmt.Sprintf("sellmeier.c_um2[%d]", i), "must be at least 0 (it is a squared wavelength in µm²), got %v", v)
		}
	}
	unlimited := loNM == 0 && math.IsInf(hiNM, 1)
	rangeOK := true
	if !unlimited {
		switch {
		case !finite(loNM):
			add("range_nm[0]", "must be a finite number, got %v", loNM)
			rangeOK = false
		case loNM < 0:
			add("range_nm[0]", "must be a finite number of nm, at least 0, got %v", loNM)
			rangeOK = false
		}
		if !finite(hiNM) {
			add("range_nm[1]", "must be a finite number, got %v", hiNM)
			rangeOK = false
		}
		if rangeOK && loNM >= hiNM {
			add("range_nm", "low end %v nm must be below the high end %v nm", loNM, hiNM)
			rangeOK = false
		}
	}
	if rangeOK && !unlimited {
		for i, c := range cUM2 {
			resonanceNM := math.Sqrt(c) * 1000
			if c > 0 && resonanceNM > loNM && resonanceNM < hiNM {
				add(fmt.Sprintf("sellmeier.c_um2[%d]", i),
					"puts a resonance at %.4g nm inside the range %v-%v nm, where the formula diverges",
					resonanceNM, loNM, hiNM)
			}
		}
	}
	if err := errOrNil(problems); err != nil {
		return Sellmeier{}, err
	}
	return Sellmeier{
		B:    append([]float64(nil), b...),
		CUM2: append([]float64(nil), cUM2...),
		LoNM: loNM,
		HiNM: hiNM,
	}, nil
}

// Index evaluates the fit. It returns NaN for a wavelength that is not positive and finite, or
// where n² ≤ 0 (at a resonance or between a resonance and its zero crossing).
func (s Sellmeier) Index(wavelengthNM float64) float64 {
	if !validWavelength(wavelengthNM) {
		return math.NaN()
	}
	um := wavelengthNM / 1000
	l2 := um * um
	n2 := 1.0
	for i := range min(len(s.B), len(s.CUM2)) {
		n2 += s.B[i] * l2 / (l2 - s.CUM2[i])
	}
	if !(n2 > 0) || math.IsInf(n2, 0) {
		return math.NaN()
	}
	return math.Sqrt(n2)
}

// RangeNM returns the fit's validity range.
func (s Sellmeier) RangeNM() (loNM, hiNM float64) { return s.LoNM, s.HiNM }

// Describe names the model, its source and its range.
func (s Sellmeier) Describe() string {
	text := "Sellmeier"
	if s.Source != "" {
		text += ", " + s.Source
	} else {
		terms := min(len(s.B), len(s.CUM2))
		plural := "s"
		if terms == 1 {
			plural = ""
		}
		text += fmt.Sprintf(" (%d term%s, user fit)", terms, plural)
	}
	if s.LoNM > 0 || !math.IsInf(s.HiNM, 1) {
		text += ", valid " + formatNM(s.LoNM) + "-" + formatNM(s.HiNM) + " nm"
	}
	return text
}

func formatNM(v float64) string {
	if math.IsInf(v, 1) {
		return "∞"
	}
	return strconv.FormatFloat(v, 'f', -1, 64)
}
