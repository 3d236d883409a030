package optics

import "math"

// FormatBenchV1 is the value of Bench.Format for version 1 of the bench file.
const FormatBenchV1 = "raytable/bench/v1"

// Element types.
const (
	TypeLens       = "lens"        // one or more refracting faces with glass between them
	TypeThinLens   = "thin-lens"   // an ideal lens of given focal length at one plane
	TypeMirror     = "mirror"      // a flat or spherical mirror that turns the beam on the table
	TypeAperture   = "aperture"    // an iris or slit of given clear diameter
	TypeScreen     = "screen"      // a detector or viewing card: records rays, stops nothing
	TypeDump       = "dump"        // a beam dump: the end of the beam
	TypeSplitter   = "splitter"    // a beam splitter, pick-off or dichroic: part of the light turns into its reflected arm
	TypePeriscope  = "periscope"   // two 45° flat mirrors that lift or lower the beam and may turn it
	TypeFiber      = "fiber"       // a single-mode fibre face the beam is coupled into: the end of the beam
	TypeModeTarget = "mode-target" // a mode the beam should match (a cavity mode, a crystal's design waist): the end of the beam
)

// Dichroic splitters send each wavelength wholly to one port.
const (
	ReflectsShorter = "shorter" // wavelengths below the edge are reflected
	ReflectsLonger  = "longer"  // wavelengths above the edge are reflected
)

// DefaultReflect is the fraction a splitter reflects when it does not say.
const DefaultReflect = 0.5

// Source kinds.
const (
	SourceCollimated = "collimated"
	SourcePoint      = "point"
	SourceFiber      = "fiber" // a single-mode fibre's face: a Gaussian beam with its waist there
)

// Table grids.
const (
	GridMetric25  = "metric-25mm"
	GridImperial1 = "imperial-1in"
	GridNone      = "none"
)

// DefaultFanRays is the number of rays in each meridional fan when the source does not say.
const DefaultFanRays = 21

// Bench is one optical setup: a source and a list of elements in beam order on a table.
// It is the Go form of the bench file (format raytable/bench/v1); see Decode for the rules.
type Bench struct {
	Format        string                  `json:"format"`
	Title         string                  `json:"title,omitempty"`
	Notes         string                  `json:"notes,omitempty"`
	WavelengthsNM []float64               `json:"wavelengths_nm"`
	Table         Table                   `json:"table"`
	Source        Source                  `json:"source"`
	Materials     map[string]MaterialSpec `json:"materials,omitempty"`
	Elements      []Element               `json:"elements"`
	MoreSources   []MoreSource            `json:"more_sources,omitempty"` // further lasers on the same table
}

// MoreSource is a further light source on the bench's table with its own element list. Its arms
// may reach the first source's parts through same_as.
type MoreSource struct {
	ID            string    `json:"id"`
	Source                  // every source field, inline in the bench file
	WavelengthsNM []float64 `json:"wavelengths_nm,omitempty"` // its own wavelengths; the bench's when absent
	Elements      []Element `json:"elements"`
}

// PrimaryWavelengthNM is the first wavelength, the one system values are given at.
func (b *Bench) PrimaryWavelengthNM() float64 { return b.WavelengthsNM[0] }

// Table is the breadboard the bench is built on. x runs along the width, y along the depth,
// origin at the front-left corner.
type Table struct {
	Grid         string   `json:"grid"`
	WidthMM      float64  `json:"width_mm"`
	DepthMM      float64  `json:"depth_mm"`
	BeamHeightMM float64  `json:"beam_height_mm"`
	HoleOffsetMM *float64 `json:"hole_offset_mm,omitempty"` // first hole from the front and left edges; default by grid
}

// Source is where light enters the bench.
type Source struct {
	XMM        float64 `json:"x_mm"`
	YMM        float64 `json:"y_mm"`
	HeadingDeg float64 `json:"heading_deg"` // 0 = +x, 90 = +y, counter-clockwise seen from above
	Kind       string  `json:"kind"`

	SemiDiameterMM *float64  `json:"semi_diameter_mm,omitempty"` // collimated: radius of the bundle
	FieldAnglesDeg []float64 `json:"field_angles_deg,omitempty"` // collimated: field angles in the table plane

	NA              *float64  `json:"na,omitempty"`                // point: numerical aperture of the traced cone
	ObjectHeightsMM []float64 `json:"object_heights_mm,omitempty"` // point: object heights in the table plane

	FanRays *int          `json:"fan_rays,omitempty"` // rays per meridional fan; DefaultFanRays when absent
	Rays    []ExplicitRay `json:"rays,omitempty"`
	Beam    *Beam         `json:"beam,omitempty"`

	HeightMM *float64 `json:"height_mm,omitempty"` // beam height above the table; table.beam_height_mm when absent

	// sources and targets: a fibre source's mode field diameter (1/e² intensity) at the primary wavelength
	MFDUM *float64 `json:"mfd_um,omitempty"`
	// power: the laser's output, as a steady power or as pulses (not both; README "Power")
	PowerMW *float64 `json:"power_mw,omitempty"`
	Pulse   *Pulse   `json:"pulse,omitempty"`
}

// Pulse is a pulsed laser's output: the energy of one pulse, its duration and the repetition rate.
type Pulse struct {
	EnergyUJ   float64 `json:"energy_uj"`
	DurationNS float64 `json:"duration_ns"`
	RateHz     float64 `json:"rate_hz"`
}

// FanRayCount is the number of rays in each fan.
func (s *Source) FanRayCount() int {
	if s.FanRays == nil {
		return DefaultFanRays
	}
	return *s.FanRays
}

// ExplicitRay is one ray the user asked to follow, starting at the source plane.
// height/angle are in the table plane (y), x_mm/x_angle_deg vertical.
type ExplicitRay struct {
	HeightMM  float64 `json:"height_mm"`
	AngleDeg  float64 `json:"angle_deg"`
	XMM       float64 `json:"x_mm"`
	XAngleDeg float64 `json:"x_angle_deg"`
}

// Beam is an optional Gaussian laser beam leaving the source.
type Beam struct {
	WaistRadiusMM float64  `json:"waist_radius_mm"` // 1/e² intensity radius of the real beam at its waist
	WaistAtMM     float64  `json:"waist_at_mm"`     // waist position along the path from the source; negative is upstream
	M2            *float64 `json:"m2,omitempty"`    // beam quality factor; 1 when absent

	// sources and targets: the vertical plane's waist when it differs from the table plane's above
	Sagittal *BeamPlane `json:"sagittal,omitempty"`
}

// BeamPlane is a Gaussian beam's waist in one plane: an elliptical or astigmatic beam's vertical plane.
type BeamPlane struct {
	WaistRadiusMM float64  `json:"waist_radius_mm"`
	WaistAtMM     float64  `json:"waist_at_mm"`
	M2            *float64 `json:"m2,omitempty"`
}

// BeamQuality is M², 1 when not given.
func (b *Beam) BeamQuality() float64 {
	if b.M2 == nil {
		return 1
	}
	return *b.M2
}

// MaterialSpec is a user-defined medium. Exactly one of Sellmeier, (ND and VD), Index is set.
type MaterialSpec struct {
	Sellmeier *SellmeierSpec `json:"sellmeier,omitempty"`
	RangeNM   []float64      `json:"range_nm,omitempty"` // [low, high] validity range of the Sellmeier fit
	ND        *float64       `json:"nd,omitempty"`
	VD        *float64       `json:"vd,omitempty"`
	Index     *float64       `json:"index,omitempty"`
}

// SellmeierSpec holds n² = 1 + Σ B_i λ² / (λ² - C_i), λ in micrometres.
type SellmeierSpec struct {
	B    []float64 `json:"b"`
	CUM2 []float64 `json:"c_um2"`
}

// Element is one item on the bench. Which fields are allowed depends on Type; see Decode.
type Element struct {
	ID    string  `json:"id"`
	Type  string  `json:"type"`
	GapMM float64 `json:"gap_mm"` // from the previous element's last vertex (or the source) to this one's first vertex

	// lens
	FacesMM       []*float64 `json:"faces_mm,omitempty"`       // face radii, + when the centre is downstream, nil flat
	ThicknessesMM []float64  `json:"thicknesses_mm,omitempty"` // centre thicknesses between faces
	Materials     []string   `json:"materials,omitempty"`      // media between faces

	// thin-lens
	FocalMM *float64 `json:"focal_mm,omitempty"`

	// mirror
	RadiusMM *float64 `json:"radius_mm,omitempty"` // + concave, - convex, nil flat
	TurnDeg  *float64 `json:"turn_deg,omitempty"`  // heading change, + counter-clockwise, magnitude in (0, 180]

	// lens, thin-lens, mirror, aperture
	DiameterMM *float64 `json:"diameter_mm,omitempty"` // clear aperture; nil unlimited

	// screen
	WidthMM *float64 `json:"width_mm,omitempty"`

	// splitter
	Reflect     *float64  `json:"reflect,omitempty"`      // fraction of the power reflected, 0 to 1; DefaultReflect when absent
	Dichroic    *Dichroic `json:"dichroic,omitempty"`     // each wavelength wholly to one port instead of reflect
	ThicknessMM *float64  `json:"thickness_mm,omitempty"` // a plate's thickness; absent: a reflecting surface of no thickness
	Material    string    `json:"material,omitempty"`     // a plate's medium
	Reflected   []Element `json:"reflected,omitempty"`    // the elements of the reflected arm, in beam order

	// periscope
	RiseMM *float64 `json:"rise_mm,omitempty"` // height change, + up

	// any type: another pass through the part with this id, placed earlier
	SameAs string `json:"same_as,omitempty"`

	// any type: footprint of the mount on the table
	Mount *Mount `json:"mount,omitempty"`

	// sources and targets: a lens or thin lens that is a cylinder, with its axis "vertical" (power in
	// the table plane) or "horizontal" (power in the vertical plane)
	CylinderAxis string `json:"cylinder_axis,omitempty"`
	// fiber: the mode field diameter (1/e² intensity) of the fibre coupled into
	MFDUM *float64 `json:"mfd_um,omitempty"`
	// mode-target: the mode's waist, its position from the element's plane (+ downstream) and,
	// when it differs, the vertical plane's
	WaistRadiusMM *float64   `json:"waist_radius_mm,omitempty"`
	WaistAtMM     *float64   `json:"waist_at_mm,omitempty"`
	Sagittal      *BeamPlane `json:"sagittal,omitempty"`
	// power (README "Power"): each face's reflection (lens, thin lens, splitter plate), a
	// mirror's reflectance, and the damage thresholds of any element
	Coating         string   `json:"coating,omitempty"`          // CoatingAR (default) or CoatingNone
	FaceReflectance *float64 `json:"face_reflectance,omitempty"` // a stated reflectance per face, 0 to 1; it overrides coating
	Reflectance     *float64 `json:"reflectance,omitempty"`      // mirror: fraction reflected, 0 to 1; DefaultMirrorReflectance when absent
	DamageWCM2      *float64 `json:"damage_w_cm2,omitempty"`     // damage threshold for peak irradiance
	DamageJCM2      *float64 `json:"damage_j_cm2,omitempty"`     // damage threshold for peak fluence of one pulse
}

// Dichroic is a splitter's wavelength edge: each wavelength on the Reflects side of EdgeNM is
// reflected, every other one transmitted.
type Dichroic struct {
	EdgeNM   float64 `json:"edge_nm"`
	Reflects string  `json:"reflects"` // ReflectsShorter or ReflectsLonger
}

// Mount is a mount's footprint on the table, centred on the element and aligned with the beam:
// width across the beam, depth along it.
type Mount struct {
	WidthMM float64 `json:"width_mm"`
	DepthMM float64 `json:"depth_mm"`
}

// LengthMM is the distance from the element's first vertex to its last along the beam.
func (e *Element) LengthMM() float64 {
	var t float64
	for _, d := range e.ThicknessesMM {
		t += d
	}
	return t
}

// SemiDiameterMM is half the clear aperture, or +Inf when the element has none.
func (e *Element) SemiDiameterMM() float64 {
	if e.DiameterMM == nil {
		return inf
	}
	return *e.DiameterMM / 2
}

// Cylinder axes of a cylindrical lens (sources and targets). A vertical axis gives the lens its
// power in the table plane, a horizontal one in the vertical plane.
const (
	CylinderVertical   = "vertical"
	CylinderHorizontal = "horizontal"
)

// Diverging reports whether the traced rays leave one point: a point source or a fibre's face.
func (s *Source) Diverging() bool { return s.Kind == SourcePoint || s.Kind == SourceFiber }

// ConeNA is the numerical aperture of the traced cone: na when given, else for a fibre the
// divergence of its mode λ/(π w0) at the primary wavelength (the far-field 1/e² half-angle of a
// Gaussian beam, Kogelnik and Li 1966); 0 when neither says.
func (s *Source) ConeNA(primaryNM float64) float64 {
	switch {
	case s.NA != nil:
		return *s.NA
	case s.Kind == SourceFiber && s.MFDUM != nil && *s.MFDUM > 0:
		return primaryNM * 1e-6 / (math.Pi * *s.MFDUM / 2000)
	}
	return 0
}

// GaussianBeam is the beam leaving the source: a fibre's mode, round with its waist on the face
// (w0 = mfd/2), or source.beam; nil when there is none.
func (s *Source) GaussianBeam() *Beam {
	if s.Kind == SourceFiber && s.MFDUM != nil {
		return &Beam{WaistRadiusMM: *s.MFDUM / 2000}
	}
	return s.Beam
}

// Planes are the beam's waists in the table plane and the vertical plane: the sagittal entry when
// given, the table plane's otherwise.
func (b *Beam) Planes() (table, vertical BeamPlane) {
	table = BeamPlane{WaistRadiusMM: b.WaistRadiusMM, WaistAtMM: b.WaistAtMM, M2: b.M2}
	if b.Sagittal != nil {
		return table, *b.Sagittal
	}
	return table, table
}

// Quality is the plane's M², 1 when not given.
func (b BeamPlane) Quality() float64 {
	if b.M2 == nil {
		return 1
	}
	return *b.M2
}

// IsTarget reports whether the element is a mode the beam is coupled into (a fibre or a mode target).
func (e *Element) IsTarget() bool { return e.Type == TypeFiber || e.Type == TypeModeTarget }

// TargetPlanes are a target's mode in the table plane and the vertical plane, waist positions from
// the element's plane (+ downstream): a fibre's round waist mfd/2 on its face, or a mode target's
// waist and sagittal entry. ok is false for other elements or a target missing its waist.
func (e *Element) TargetPlanes() (table, vertical BeamPlane, ok bool) {
	switch {
	case e.Type == TypeFiber && e.MFDUM != nil:
		table = BeamPlane{WaistRadiusMM: *e.MFDUM / 2000}
	case e.Type == TypeModeTarget && e.WaistRadiusMM != nil:
		table = BeamPlane{WaistRadiusMM: *e.WaistRadiusMM}
		if e.WaistAtMM != nil {
			table.WaistAtMM = *e.WaistAtMM
		}
	default:
		return BeamPlane{}, BeamPlane{}, false
	}
	if e.Type == TypeModeTarget && e.Sagittal != nil {
		return table, *e.Sagittal, true
	}
	return table, table, true
}
