package diagram

import (
	"fmt"
	"math"
)

// spectrumStop is one anchor of the wavelength colour ramp.
type spectrumStop struct {
	nm      float64
	r, g, b float64
}

// visibleStops is our own coarse approximation of how spectral colours look on an sRGB screen:
// a few hand-picked anchors (violet, blue, cyan, green, yellow, orange, red, deep red) between which
// each channel is interpolated linearly. It is a drawing aid, not colorimetry: the ends are
// darkened because the eye is weak there, and neighbouring laser lines stay distinguishable.
var visibleStops = []spectrumStop{
	{380, 90, 0, 120},
	{420, 100, 20, 230},
	{460, 30, 70, 255},
	{490, 0, 180, 230},
	{520, 0, 200, 60},
	{560, 150, 210, 0},
	{585, 245, 190, 0},
	{610, 255, 110, 0},
	{640, 235, 20, 20},
	{700, 180, 0, 0},
	{780, 110, 0, 20},
}

// Outside the visible band: ultraviolet fades from a dark indigo at 380 nm to a slate tone at
// 200 nm and below; infrared from a dark brown at 780 nm to a dark olive grey at 2000 nm and beyond
// (interpolated in log wavelength, so 808, 1064 and 1550 nm get different tones). Both are darker
// than any visible colour so a glance tells the beam is invisible.
var (
	uvStops = []spectrumStop{{200, 55, 60, 85}, {380, 70, 35, 100}}
	irStops = []spectrumStop{{780, 105, 60, 35}, {2000, 60, 70, 55}}
)

// WavelengthColor maps a wavelength in nm to an sRGB colour "#rrggbb" for drawing rays and beams.
//
// The mapping is raytable's own: inside 380-780 nm a piecewise-linear ramp through hand-picked
// anchors (see visibleStops); ultraviolet below 380 nm and infrared above 780 nm map to distinct
// dark tones that still vary with wavelength (infrared in log wavelength). Zero, negative and
// non-finite wavelengths give a neutral grey.
func WavelengthColor(nm float64) string {
	if !(nm > 0) || math.IsInf(nm, 0) {
		return "#808080"
	}
	var r, g, b float64
	switch {
	case nm < 380:
		r, g, b = ramp(uvStops, math.Max(nm, 200))
	case nm > 780:
		// Interpolate in log wavelength: ir stops are spaced for it.
		l := math.Log(math.Min(nm, 2000))
		lo, hi := irStops[0], irStops[1]
		t := (l - math.Log(lo.nm)) / (math.Log(hi.nm) - math.Log(lo.nm))
		r, g, b = mix(lo.r, hi.r, t), mix(lo.g, hi.g, t), mix(lo.b, hi.b, t)
	default:
		r, g, b = ramp(visibleStops, nm)
	}
	return fmt.Sprintf("#%02x%02x%02x", channel(r), channel(g), channel(b))
}

// ramp interpolates linearly between the stops around nm; nm must lie within the stops' range.
func ramp(stops []spectrumStop, nm float64) (r, g, b float64) {
	for i := 1; i < len(stops); i++ {
		lo, hi := stops[i-1], stops[i]
		if nm <= hi.nm {
			t := (nm - lo.nm) / (hi.nm - lo.nm)
			return mix(lo.r, hi.r, t), mix(lo.g, hi.g, t), mix(lo.b, hi.b, t)
		}
	}
	last := stops[len(stops)-1]
	return last.r, last.g, last.b
}

func mix(a, b, t float64) float64 { return a + (b-a)*t }

func channel(v float64) int {
	return int(math.Max(0, math.Min(255, math.Round(v))))
}

// wavelengthName is the legend text for a wavelength, naming the invisible bands.
func wavelengthName(nm float64) string {
	s := fmtNum(nm) + " nm"
	switch {
	case nm < 380:
		return s + " (ultraviolet)"
	case nm > 780:
		return s + " (infrared)"
	}
	return s
}
