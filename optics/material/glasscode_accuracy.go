package material

import (
	"fmt"
	"math"
)

// GlassCodePoorError is the index error above which the glass-code model is called poor: 1e-3
// changes a singlet's focal length by about 0.2 % (f ∝ 1/(n − 1) with n − 1 ≈ 0.5).
const GlassCodePoorError = 1e-3

// glassCodePoorZones are where the two-term model, measured against Sellmeier fits from nd and vd
// alone (glasscode_accuracy_test.go keeps the table), errs by more than GlassCodePoorError inside
// its 400-1000 nm range. Below 400 nm and above 1000 nm the range itself warns.
var glassCodePoorZones = []struct {
	maxVD, loNM, hiNM float64
	why               string
}{
	{40, 0, 470, "in a flint (vd below 40) below 470 nm it errs by up to 2e-3 at 400 nm for vd 36 and 7e-3 for vd 26"},
	{30, 740, math.Inf(1), "in a dense flint (vd below 30) above 740 nm it errs by up to 1.7e-3"},
	{math.Inf(1), 870, math.Inf(1), "above 870 nm it errs by up to 2e-3 at 1000 nm, since real glasses bend away from 1/λ² towards their infrared absorption"},
}

// Poor says why the model's index at wavelengthNM may be off by more than GlassCodePoorError, or
// "" where the measurement found it closer (or the wavelength lies outside RangeNM, which callers
// report on its own).
func (g GlassCode) Poor(wavelengthNM float64) string {
	if wavelengthNM < GlassCodeLoNM || wavelengthNM > GlassCodeHiNM {
		return ""
	}
	for _, z := range glassCodePoorZones {
		if g.VD < z.maxVD && wavelengthNM >= z.loNM && wavelengthNM < z.hiNM {
			return fmt.Sprintf("the nd/vd model %s; give a Sellmeier fit for this glass", z.why)
		}
	}
	return ""
}
