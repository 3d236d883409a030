package optics

import (
	"fmt"
	"math"
	"raytable/optics/numfmt"
	"strconv"
	"strings"
)

// Quantity is what a number measures: how typed text becomes the stored number (which units people
// may write after it), the stored unit shown beside an input, and what messages call it. The bench
// file itself holds bare numbers in the stored unit; units are for people typing (a form, a future
// command line editor).
type Quantity struct {
	Noun  string             // "a length", used as `"abc" is not a length`
	Hint  string             // how to write one, appended to the message
	Unit  string             // the stored unit as people read it: "mm", "nm", "°", or "" for a plain number
	units map[string]float64 // unit suffix -> factor to the stored unit; "" is the bare number
}

// Millimetres per unit for lengths. Inches are exact by definition (25.4 mm).
var lengthUnits = map[string]float64{
	"": 1, "mm": 1, "cm": 10, "m": 1000, "um": 1e-3, "µm": 1e-3, "μm": 1e-3,
	"in": 25.4, "inch": 25.4, "inches": 25.4, `"`: 25.4,
}

// The quantities of the bench file's numbers.
var (
	Length     = &Quantity{"a length", "use a number in mm or a unit such as 1 in, 2.5 cm", "mm", lengthUnits}
	Wavelength = &Quantity{"a wavelength", "use a number in nm or a unit such as 1.064 um", "nm", map[string]float64{
		"": 1, "nm": 1, "um": 1000, "µm": 1000, "μm": 1000}}
	Angle = &Quantity{"an angle", "use a number of degrees", "°", map[string]float64{
		"": 1, "deg": 1, "°": 1}}
	Plain = &Quantity{"a number", "use a plain number such as 0.1", "", map[string]float64{"": 1}} // a ratio: NA, M²
)

// MaxTypedMagnitude is the largest number Parse accepts before the bench rules even look at it;
// anything larger is a slip of the keyboard.
const MaxTypedMagnitude = 1e12

// Parse reads one value with an optional unit, e.g. "25.4", "1 in", `1"`, "2.5cm", "500 µm".
// A decimal comma ("1,5") and fractions ("1/2 in") are refused with a message saying how to write
// the number instead: commas separate the items of list fields, so "1,5" could mean two values.
func (q *Quantity) Parse(text string) (float64, error) {
	s := strings.TrimSpace(text)
	num, unit := splitUnit(s)
	factor, ok := q.units[strings.ToLower(unit)]
	if !ok {
		factor, ok = q.units[unit]
	}
	if num == "" || !ok {
		switch {
		case num != "" && strings.HasPrefix(unit, ","):
			return 0, fmt.Errorf("%q is not %s; write decimals with a point, e.g. 1.5", text, q.Noun)
		case num != "" && strings.HasPrefix(unit, "/"):
			return 0, fmt.Errorf("%q is not %s; fractions are not read, write a decimal such as 0.5 in", text, q.Noun)
		}
		return 0, fmt.Errorf("%q is not %s; %s", text, q.Noun, q.Hint)
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		if ne, isNum := err.(*strconv.NumError); isNum && ne.Err == strconv.ErrRange {
			return 0, fmt.Errorf("%q is too large to be %s", text, q.Noun)
		}
		return 0, fmt.Errorf("%q is not %s; %s", text, q.Noun, q.Hint)
	}
	v *= factor
	if math.Abs(v) > MaxTypedMagnitude {
		return 0, fmt.Errorf("%q is too large to be %s", text, q.Noun)
	}
	if v == 0 {
		v = 0 // "-0" is stored as 0, not as a negative zero that the history would show as "-0"
	}
	return v, nil
}

// splitUnit splits "2.5 cm" into "2.5" and "cm". The number is the longest prefix made of
// characters a decimal number can contain; ParseFloat then judges it.
func splitUnit(s string) (num, unit string) {
	i := 0
	for i < len(s) {
		c := s[i]
		isExp := (c == 'e' || c == 'E') && i > 0 && i+1 < len(s) && (isDigit(s[i+1]) || s[i+1] == '+' || s[i+1] == '-')
		if isDigit(c) || c == '.' || c == '+' || c == '-' || isExp {
			i++
			continue
		}
		break
	}
	return s[:i], strings.TrimSpace(s[i:])
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

// FormatNumber writes a stored value as people edit it: the shortest text that Parse reads back to
// the same float64, without exponents for everyday sizes.
func FormatNumber(v float64) string { return numfmt.Field.Format(v) }

// ModeDiameter is a fibre's mode field diameter, stored in µm as fibre data sheets give it
// (sources and targets).
var ModeDiameter = &Quantity{"a mode field diameter", "use a number in µm such as 5.3", "µm", map[string]float64{
	"": 1, "um": 1, "µm": 1, "μm": 1, "mm": 1000}}
