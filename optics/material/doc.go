// Package material gives the refractive index of the media on a bench: built-in media with
// published dispersion fits, user Sellmeier fits, constant indices and six-digit glass codes.
//
// # Convention
//
// Every index is relative to air: n_air = 1 exactly, which is raytable's convention because a
// breadboard sits in air. The medium "vacuum" is therefore also 1; its true ratio to air,
// about 1/1.00027, is below anything a bench layout resolves. Wavelengths are in nanometres and
// are taken as vacuum wavelengths; published fits are used exactly as their papers give them, and
// the air/vacuum wavelength difference (about 0.03 %) is ignored.
//
// # Validity
//
// Each Medium reports the wavelength range where its model holds (RangeNM). Index still returns a
// number outside that range when the formula allows it, so callers decide whether to warn or refuse;
// InRange is the check. Index never panics: it returns NaN for a wavelength that is not a positive
// finite number, or where a Sellmeier fit gives n² ≤ 0 (at or beyond a resonance).
//
// This package is a leaf: standard library only, so the root optics package can import it.
package material
