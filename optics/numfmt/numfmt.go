// Package numfmt writes numbers for people. Each way of writing a number is a named Precision,
// so that a value shown in two places is written by the same rule and every rule lives here.
// It imports only the standard library.
package numfmt

import (
	"math"
	"strconv"
)

// Precision is a named way of writing a number.
type Precision uint8

const (
	// Exact is the shortest text that reads back to the same float64, with an exponent only
	// below 1e-4 or from 1e15: input values quoted in messages.
	Exact Precision = iota
	// Field is Exact with an exponent from 1e9: a stored value written back into a form field.
	Field
	// Message is four significant digits, then written as Exact: computed values in messages.
	Message
	// Brief is four significant digits as %g writes them (an exponent below 1e-4 and from 1e4):
	// sizes in the ray and screen warnings.
	Brief
	// Rough is three significant digits as %g writes them: distances and angles in the beam's
	// safety and breakdown warnings.
	Rough
	// Report is six significant digits as %g writes them (an exponent below 1e-4 and from 1e6), 0
	// for rounding noise below NoiseBelow (and -0):
	// the text report.
	Report
	// Panel is five significant digits, an exponent only below 1e-4 or from 1e9, "0" for
	// anything that rounds to zero and "—" when not finite: the page's tables.
	Panel
	// Label is four significant digits, halves rounded away from zero, never an exponent, "?"
	// when not finite: text in drawings.
	Label
	// Label3 is Label with three significant digits: beam radii in drawings.
	Label3
	// Tenth rounds to 0.1 (halves away from zero), never an exponent, "0" for anything that
	// rounds to zero, "?" when not finite: post offsets on the printed plan.
	Tenth
	// Hundredth is two decimals without a negative zero: the placement list.
	Hundredth
	// TenThousandth is four decimals: fractions of 1 in the text report.
	TenThousandth
	// Index is six decimals: refractive indices.
	Index
)

// Format writes v at precision p.
func (p Precision) Format(v float64) string {
	switch p {
	case Exact:
		return shortest(v, 1e15)
	case Field:
		return shortest(v, 1e9)
	case Message:
		return shortest(roundDigits(v, 4), 1e15)
	case Brief:
		return strconv.FormatFloat(v, 'g', 4, 64)
	case Rough:
		return strconv.FormatFloat(v, 'g', 3, 64)
	case Report:
		if IsNoise(v) {
			return "0"
		}
		return strconv.FormatFloat(v, 'g', 6, 64)
	case Panel:
		if !finite(v) {
			return "—"
		}
		r := roundDigits(v, 5)
		if r == 0 {
			return "0" // also for -0 and values that round to zero
		}
		return shortest(r, 1e9)
	case Label, Label3:
		if !finite(v) {
			return "?"
		}
		n := 4
		if p == Label3 {
			n = 3
		}
		return strconv.FormatFloat(scaleRound(v, n), 'f', -1, 64)
	case Tenth:
		if !finite(v) {
			return "?"
		}
		r := math.Round(v*10) / 10
		if r == 0 {
			return "0"
		}
		return strconv.FormatFloat(r, 'f', -1, 64)
	case Hundredth:
		s := strconv.FormatFloat(v, 'f', 2, 64)
		if s == "-0.00" {
			return "0.00"
		}
		return s
	case TenThousandth:
		return strconv.FormatFloat(v, 'f', 4, 64)
	case Index:
		return strconv.FormatFloat(v, 'f', 6, 64)
	}
	panic("numfmt: unknown precision " + strconv.Itoa(int(p)))
}

// Signed writes v at precision p with a leading "+" when the written value is positive, for
// differences and offsets.
func Signed(p Precision, v float64) string {
	s := p.Format(v)
	if v > 0 && s != "0" && s[0] >= '0' && s[0] <= '9' {
		return "+" + s
	}
	return s
}

// shortest writes v with the fewest digits that read back exactly, without an exponent for
// magnitudes from 1e-4 up to (not including) plainBelow.
func shortest(v, plainBelow float64) string {
	if a := math.Abs(v); a == 0 || (a >= 1e-4 && a < plainBelow) {
		return strconv.FormatFloat(v, 'f', -1, 64)
	}
	return strconv.FormatFloat(v, 'g', -1, 64)
}

// roundDigits rounds v correctly (halves to even on the exact decimal value) to n significant
// digits, as strconv does.
func roundDigits(v float64, n int) float64 {
	r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'g', n, 64), 64)
	if err != nil {
		return v // ±Inf and NaN read back as themselves; nothing else fails
	}
	return r
}

// scaleRound rounds v to n significant digits by scaling with a power of ten and rounding halves
// away from zero, the rule the drawings have always used (it differs from roundDigits on halves:
// 608.5 becomes 609, not 608).
func scaleRound(v float64, n int) float64 {
	if v == 0 || !finite(v) {
		return v
	}
	e := math.Pow10(n - 1 - int(math.Floor(math.Log10(math.Abs(v)))))
	return math.Round(v*e) / e
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// NoiseBelow is the magnitude under which the report and the page write a value as 0: sums of
// lengths in mm that are really 0 come out as 1e-15 or -0, and no bench quantity is this small.
const NoiseBelow = 1e-12

// IsNoise says v is rounding noise: its magnitude is below NoiseBelow.
func IsNoise(v float64) bool { return math.Abs(v) < NoiseBelow }
