package optics

// WarningCode names what a Warning is about. Codes are stable: tests, the page, the drawings and
// other programs match on them, and the README lists them from WarningCodes.
type WarningCode string

// Every warning code. Add a code here together with its entry in WarningCodes.
const (
	WarnRaysClipped         WarningCode = "rays-clipped"
	WarnRaysTIR             WarningCode = "rays-tir"
	WarnRaysMissed          WarningCode = "rays-missed"
	WarnOutsideFitRange     WarningCode = "outside-fit-range"
	WarnScreenOverfilled    WarningCode = "screen-overfilled"
	WarnBeamClipped         WarningCode = "beam-clipped"
	WarnBeamInvalid         WarningCode = "beam-invalid"
	WarnBackReflectionFocus WarningCode = "back-reflection-focus"
	WarnFocusInGlass        WarningCode = "focus-in-glass"
	WarnFocusNearGlass      WarningCode = "focus-near-glass"
	WarnBeamNotParaxial     WarningCode = "beam-not-paraxial"
	WarnMountsOverlap       WarningCode = "mounts-overlap"
	WarnMountInBeam         WarningCode = "mount-in-beam"
	WarnOffTable            WarningCode = "off-table"
	WarnBeamOffTable        WarningCode = "beam-off-table"
	WarnNoBeamEnd           WarningCode = "no-beam-end"
	WarnOpenPort            WarningCode = "open-port"
	WarnMissesPart          WarningCode = "misses-part"
	WarnImageRotated        WarningCode = "image-rotated"
	WarnFocusMissesScreen   WarningCode = "focus-misses-screen"
	// Glass-code accuracy (README 'Media').
	WarnGlassCodePoor WarningCode = "glass-code-poor"
	WarnMirrorLeak    WarningCode = "mirror-leak"
	WarnDamageRisk    WarningCode = "damage-risk"
	// Mid-path dumps (README, element type dump):
	WarnAfterDump WarningCode = "after-dump"
)

// WarningCodes is every code with what it means, in the order the README lists them.
var WarningCodes = []struct {
	Code    WarningCode
	Meaning string
}{
	{WarnRaysClipped, "exact rays are cut by the element's clear aperture"},
	{WarnRaysTIR, "exact rays are totally reflected inside the element"},
	{WarnRaysMissed, "exact rays miss a face of the element"},
	{WarnOutsideFitRange, "a wavelength lies outside the range of a medium's index model; the index is extrapolated"},
	{WarnScreenOverfilled, "rays land outside the screen's width"},
	{WarnBeamClipped, "the element passes less than 99 % of the beam's power (common practice); the message gives the diameter that would pass 99 %"},
	{WarnBeamInvalid, "the source's beam cannot be computed (its waist, M² or waist position, or the wavelength, is out of range, or a surface has no index); no beam numbers"},
	{WarnBackReflectionFocus, "the reflection off a refracting face comes to a focus within 25 mm of the source or of an element upstream, or inside glass"},
	{WarnFocusInGlass, "the source's ray bundle comes to a focus inside glass"},
	{WarnFocusNearGlass, "the source's ray bundle comes to a focus within 1 mm of a glass surface"},
	{WarnBeamNotParaxial, "the beam diverges beyond 1 rad, where the Gaussian beam no longer holds; no beam numbers past the element"},
	{WarnMountsOverlap, "two mount footprints overlap; `others` names the second"},
	{WarnMountInBeam, "the beam (the radius passing 99 % of its power, 1.52 times its 1/e² radius; else the traced rays) crosses another element's mount"},
	{WarnOffTable, "an element or its mount lies off the table"},
	{WarnBeamOffTable, "a stretch of the beam leaves the table"},
	{WarnNoBeamEnd, "the path does not end on a screen or dump"},
	{WarnOpenPort, "a splitter's port sends light that no element takes and that joins no other beam: a stray beam; the message gives its share of the source's power"},
	{WarnMissesPart, "a same_as pass arrives more than 0.5 mm from its part, on the table or in height; `others` names the part"},
	{WarnImageRotated, "a periscope turns the beam by an angle that is not a multiple of 90°: the image is rotated, the exact trace is right, the paraxial and beam values downstream are in the rotated planes"},
	{WarnFocusMissesScreen, "the beam's waist lies farther from a screen than its Rayleigh range, in front of it (after the element before it) or behind it; the message says how far"},
	{WarnGlassCodePoor, "a medium given by nd and vd (a glass code) is used where the two-term model errs by more than 1e-3 in index (measured: flints below 470 nm, dense flints above 740 nm, every glass above 870 nm); give a Sellmeier fit"},
	{WarnMirrorLeak, "a mirror lets the part of the power it does not reflect through as a stray beam; given when the source states a power, the message gives it in mW"},
	{WarnDamageRisk, "the beam's peak irradiance or fluence on an element reaches half its damage_w_cm2 or damage_j_cm2 (common practice)"},
	{WarnAfterDump, "the element lies after a dump on its path: no light reaches it (rays, beam and drawings end at the dump); `others` names the dump"},
}

// Meaning says what the code means; "" for a code that is not in WarningCodes.
func (c WarningCode) Meaning() string {
	for _, w := range WarningCodes {
		if w.Code == c {
			return w.Meaning
		}
	}
	return ""
}
