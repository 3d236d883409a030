package optics

// FormatReportV1 is the value of Report.Format.
const FormatReportV1 = "raytable/report/v1"

// Report is everything raytable computes for one bench. Its JSON form is the report of
// `raytable report --json` and of GET /r/{id}/report.json; the names are a public interface.
// Optional numbers are pointers: nil is JSON null (for example the EFL of an afocal system).
type Report struct {
	Format        string         `json:"format"`
	Title         string         `json:"title,omitempty"`
	WavelengthsNM []float64      `json:"wavelengths_nm"`
	Media         []MediumIndex  `json:"media"`
	System        SystemValues   `json:"system"`
	Chromatic     []Cardinal     `json:"chromatic"` // cardinal points at every wavelength (tangential plane)
	Elements      []ElementPlace `json:"elements"`
	Rays          []Ray          `json:"rays"`
	Beam          *BeamReport    `json:"beam,omitempty"`
	Blur          []Blur         `json:"blur"` // exact ray spread at each screen, per fan
	Holes         HoleGrid       `json:"holes"`
	Placement     []Placement    `json:"placement,omitempty"`
	Warnings      []Warning      `json:"warnings"`
	Arms          []ArmReport    `json:"arms"`     // every arm, the main one first; one for a bench that does not branch
	Meetings      []Meeting      `json:"meetings"` // parts that two or more beams reach; empty for a bench that does not branch

	// ArmFull is, index-aligned with Arms, the complete report of each arm's linear bench (its
	// elements from the source, rays, beam and system values) for drawing one arm from the side.
	// For a bench that does not branch ArmFull[0] is the report itself. Not in the JSON.
	ArmFull []*Report `json:"-"`

	// Spacing says how tightly each gap must be held, one row per element up to the element the
	// image is looked at (see SpacingTolerance); SpacingBasis is the allowance it is measured
	// against. Both are at the primary wavelength in the tangential plane.
	Spacing      []SpacingTolerance `json:"spacing"`
	SpacingBasis SpacingBasis       `json:"spacing_basis"`

	// Board is the table seen from above as the drawings show it (see Board); not in the JSON.
	Board *Board `json:"-"`

	// sources and targets: the beam's coupling into each fibre and mode target it reaches
	Coupling []Coupling `json:"coupling,omitempty"`
	// Power is the power the bench carries (README "Power"): each source's output and the stray
	// beams it sends off; absent when no source states a power or pulse.
	Power *PowerReport `json:"power,omitempty"`
}

// MediumIndex is the index of one medium used on the bench at one wavelength.
type MediumIndex struct {
	Material     string  `json:"material"`
	WavelengthNM float64 `json:"wavelength_nm"`
	Index        float64 `json:"index"`
	Model        string  `json:"model,omitempty"`
	InRange      bool    `json:"in_range"`
}

// Cardinal holds the first-order values of the optical part at one wavelength in one plane.
// Distances are signed along the unfolded path, positive downstream; see the README for each.
type Cardinal struct {
	WavelengthNM         float64       `json:"wavelength_nm"`
	ABCD                 [2][2]float64 `json:"abcd"`
	Afocal               bool          `json:"afocal"`
	EFLMM                *float64      `json:"efl_mm"`
	BFLMM                *float64      `json:"bfl_mm"`
	FFLMM                *float64      `json:"ffl_mm"`
	FrontPrincipalMM     *float64      `json:"front_principal_mm"`
	RearPrincipalMM      *float64      `json:"rear_principal_mm"`
	FrontNodalMM         *float64      `json:"front_nodal_mm"`
	RearNodalMM          *float64      `json:"rear_nodal_mm"`
	ImageDistanceMM      *float64      `json:"image_distance_mm"`
	Magnification        *float64      `json:"magnification"`
	AngularMagnification *float64      `json:"angular_magnification,omitempty"` // afocal systems
}

// PlaneValues are the system values in one plane (tangential or sagittal) at the primary wavelength.
type PlaneValues struct {
	Cardinal
	ApertureStop          string   `json:"aperture_stop"` // element id, or "source"
	FNumber               *float64 `json:"f_number"`
	ImageNA               *float64 `json:"image_na"`
	EntrancePupilMM       *float64 `json:"entrance_pupil_mm"` // position from the first vertex, + downstream
	EntrancePupilRadiusMM *float64 `json:"entrance_pupil_radius_mm"`
	ExitPupilMM           *float64 `json:"exit_pupil_mm"` // position from the last vertex, + downstream
	ExitPupilRadiusMM     *float64 `json:"exit_pupil_radius_mm"`
	LagrangeInvariant     *float64 `json:"lagrange_invariant_mm"` // n(ū y - u ȳ) of chief and marginal rays
	ImageHeightMM         *float64 `json:"image_height_mm"`       // chief ray height at the image, finite conjugates
	// WorkingFNumber is 1/(2 NA'), beside the infinite-conjugate FNumber EFL/EPD (l-beam part);
	// null when NA' is 0.
	WorkingFNumber *float64 `json:"working_f_number"`
}

// SystemValues are the tangential (table-plane) values with the sagittal ones beside them.
type SystemValues struct {
	PlaneValues
	FirstVertexPathMM float64     `json:"first_vertex_path_mm"`
	LastVertexPathMM  float64     `json:"last_vertex_path_mm"`
	Sagittal          PlaneValues `json:"sagittal"`
	Optical           bool        `json:"optical"` // false when the bench has no lens, thin lens or mirror
}

// ElementPlace is where an element is on the path and on the table, with what passes through it.
type ElementPlace struct {
	ID             string      `json:"id"`
	Type           string      `json:"type"`
	PathMM         float64     `json:"path_mm"` // source to first vertex along the beam
	TableXMM       float64     `json:"table_x_mm"`
	TableYMM       float64     `json:"table_y_mm"`
	HeightMM       float64     `json:"height_mm"` // beam height above the table at the first vertex
	HeadingInDeg   float64     `json:"heading_in_deg"`
	HeadingOutDeg  float64     `json:"heading_out_deg"`
	SemiDiameterMM *float64    `json:"semi_diameter_mm"`   // null when unlimited
	FocalMM        *float64    `json:"focal_mm,omitempty"` // thin lenses
	Faces          []FacePlace `json:"faces"`
	MarginalYMM    float64     `json:"marginal_y_mm"`  // paraxial marginal ray height at the first face (tangential)
	ChiefYMM       float64     `json:"chief_y_mm"`     // paraxial chief ray height at the first face (tangential)
	MaxExactYMM    float64     `json:"max_exact_r_mm"` // largest distance of an exact ray from the centre of any face, on the face (a tilted mirror's too)
	Clearance      *float64    `json:"clearance"`      // max_exact_r_mm / semi_diameter_mm; > 1 means rays are cut
}

// FacePlace is one face of an element: its vertex along the path and its radius.
type FacePlace struct {
	PathMM         float64  `json:"path_mm"`
	RadiusMM       *float64 `json:"radius_mm"` // null flat
	SemiDiameterMM *float64 `json:"semi_diameter_mm"`
	MaterialAfter  string   `json:"material_after"`
}

// Ray statuses.
const (
	RayOK      = "ok"
	RayClipped = "clipped"
	RayTIR     = "tir"
	RayMissed  = "missed"
)

// Ray is one exactly traced ray with its paraxial twin.
type Ray struct {
	Name         string   `json:"name"`
	WavelengthNM float64  `json:"wavelength_nm"`
	Field        string   `json:"field,omitempty"` // "0.5 deg" or "1.5 mm" for fan rays
	Pupil        float64  `json:"pupil"`           // -1..1 across the pupil for fan rays
	Status       string   `json:"status"`
	StoppedAt    string   `json:"stopped_at"` // element id where the ray ended early; "" when it ran through
	Reason       string   `json:"reason,omitempty"`
	Start        RayStart `json:"start"`
	Hits         []Hit    `json:"hits"`
}

// RayStart is a ray at the source plane.
type RayStart struct {
	XMM float64    `json:"x_mm"`
	YMM float64    `json:"y_mm"`
	Dir [3]float64 `json:"dir"`
}

// Hit is a ray at one face: exact coordinates in the face's vertex frame, paraxial beside them.
type Hit struct {
	Element  string        `json:"element"`
	Face     int           `json:"face"`
	Paraxial ParaxialPoint `json:"paraxial"`
	Exact    ExactPoint    `json:"exact"`
}

// ParaxialPoint is a paraxial ray leaving a face: height and slope dy/dz.
type ParaxialPoint struct {
	YMM  float64 `json:"y_mm"`
	URad float64 `json:"u_rad"`
}

// ExactPoint is where an exact ray meets a face, relative to the face vertex in the frame of the
// leaving axis, and the unit direction it leaves with.
type ExactPoint struct {
	XMM float64    `json:"x_mm"`
	YMM float64    `json:"y_mm"`
	ZMM float64    `json:"z_mm"`
	Dir [3]float64 `json:"dir"`
}

// Warning is something a builder should look at; it does not stop the computation.
type Warning struct {
	Code    WarningCode `json:"code"`
	Element string      `json:"element"`
	Message string      `json:"message"`
	// Others names further elements the warning is about, e.g. the second of two overlapping
	// mounts, so that drawings can mark them without reading the message.
	Others []string `json:"others,omitempty"`
}

// BeamReport is the Gaussian beam along the bench.
type BeamReport struct {
	WavelengthNM float64      `json:"wavelength_nm"`
	M2           float64      `json:"m2"`
	Elements     []BeamAt     `json:"elements"`
	Waists       []Waist      `json:"waists"`
	Samples      []BeamSample `json:"samples"` // envelope along the path, for drawing

	// The beam summary (l-beam part): the beam leaving the last element and the waists in glass.
	Output      *BeamOutput  `json:"output"`       // null when the path has no surface
	GlassWaists []GlassWaist `json:"glass_waists"` // [] when no waist lies in glass
}

// BeamAt is the beam leaving one element.
type BeamAt struct {
	ID           string   `json:"id"`
	WTMM         float64  `json:"w_t_mm"`
	WSMM         float64  `json:"w_s_mm"`
	RTMM         *float64 `json:"r_t_mm"`
	RSMM         *float64 `json:"r_s_mm"`
	Transmitted  float64  `json:"transmitted"`
	ArrivingWTMM float64  `json:"arriving_w_t_mm"`
	ArrivingWSMM float64  `json:"arriving_w_s_mm"`

	// power (README "Power"): the fraction of the source's power arriving at the element, and the
	// peak irradiance and fluence of the arriving beam where the source states a power or pulse
	PowerFraction      float64  `json:"power_fraction"`
	PeakIrradianceWCM2 *float64 `json:"peak_irradiance_w_cm2,omitempty"`
	PeakFluenceJCM2    *float64 `json:"peak_fluence_j_cm2,omitempty"`
}

// Waist is a beam waist in air between elements.
type Waist struct {
	After       *string  `json:"after"`
	PathMM      float64  `json:"path_mm"`
	RadiusTMM   *float64 `json:"radius_t_mm"`
	RadiusSMM   *float64 `json:"radius_s_mm"`
	RayleighTMM *float64 `json:"rayleigh_t_mm"`
	RayleighSMM *float64 `json:"rayleigh_s_mm"`
}

// BeamSample is the beam radius at one point along the unfolded path.
type BeamSample struct {
	PathMM float64 `json:"path_mm"`
	WTMM   float64 `json:"w_t_mm"`
	WSMM   float64 `json:"w_s_mm"`
}

// Placement is where an element's mount goes on the breadboard.
type Placement struct {
	ID           string  `json:"id"`
	Type         string  `json:"type"`
	TableXMM     float64 `json:"table_x_mm"`
	TableYMM     float64 `json:"table_y_mm"`
	HeadingDeg   float64 `json:"heading_deg"`
	HoleColumn   int     `json:"hole_column"` // from 1 at the left edge; 0 when the table has no grid
	HoleRow      int     `json:"hole_row"`    // from 1 at the front edge
	OffsetXMM    float64 `json:"offset_x_mm"` // post position minus hole position
	OffsetYMM    float64 `json:"offset_y_mm"`
	MountWidthMM float64 `json:"mount_width_mm"`
	MountDepthMM float64 `json:"mount_depth_mm"`
}

// HoleGrid is the breadboard's hole pattern: the first hole OffsetMM from the front and left
// edges, then one every PitchMM, Columns x Rows holes whose centres lie inside the table.
type HoleGrid struct {
	Kind     string  `json:"kind"`   // GridMetric25, GridImperial1 or GridNone
	Thread   string  `json:"thread"` // the screw the holes take; "" without a grid
	PitchMM  float64 `json:"pitch_mm"`
	OffsetMM float64 `json:"offset_mm"`
	Columns  int     `json:"columns"`
	Rows     int     `json:"rows"`
}

// Spacing basis kinds: what a gap error is allowed to spoil.
const (
	SpacingDepthOfFocus     = "depth-of-focus"    // the image must stay within the depth of focus
	SpacingDiffractionAngle = "diffraction-angle" // the output must stay collimated to its diffraction angle
	SpacingNone             = "none"              // no lens, thin lens or mirror: no gap changes the light
	SpacingVirtualImage     = "virtual-image"     // the output diverges from a virtual image: no screen can hold its focus
	// Spacing tolerances from the beam (README, Report, spacing):
	SpacingBeamRayleigh = "beam-rayleigh" // the output beam's waist must stay within its Rayleigh range of where it was
)

// SpacingTolerance is how one gap (element ID's gap_mm, from the previous element or the source)
// acts on the output when it alone changes by a small amount and everything downstream moves with
// it, as on the bench when one spacing changes. Sensitivities are central differences with a
// step of ±0.01 mm at the primary wavelength in the tangential plane.
//
// When the system forms an image at a finite distance (SpacingBasis.Kind "depth-of-focus"),
// ImageShiftPerMM is d z_image / d gap, z_image being the image position along the path, and
// DefocusPerMM is d(z_image - z_ref) / d gap, z_ref being the position of the element the image is
// looked at (SpacingBasis.Reference, the bench's last element or its first dump), which moves with
// every gap up to its own. ToleranceMM = depth of focus / |DefocusPerMM|.
//
// When the output is collimated (Kind "diffraction-angle"), DivergencePerMM is the change of the
// output marginal ray's slope in rad per mm of gap and ToleranceMM = diffraction angle /
// |DivergencePerMM|.
//
// ToleranceMM is the gap error, either way, that uses up the whole allowance; it is null when the
// gap does not matter (its sensitivity is zero up to rounding, or the tolerance would exceed
// MaxLengthMM). Values that do not apply to the basis are null.
type SpacingTolerance struct {
	ID              string   `json:"id"`
	GapMM           float64  `json:"gap_mm"`
	ImageShiftPerMM *float64 `json:"image_shift_per_mm"`
	DefocusPerMM    *float64 `json:"defocus_per_mm"`
	DivergencePerMM *float64 `json:"divergence_per_mm"` // rad per mm of gap
	ToleranceMM     *float64 `json:"tolerance_mm"`
	// Spacing tolerances from the beam (kind "beam-rayleigh"): d(z_waist - z_ref)/d gap, z_waist
	// the output beam's waist along the path; ToleranceMM is then rayleigh_mm / |WaistShiftPerMM|.
	WaistShiftPerMM *float64 `json:"waist_shift_per_mm"`
}

// SpacingBasis is the allowance the spacing tolerances are measured against, so that the table
// explains itself.
//
// Depth of focus: λ/(2·NA'²) on either side of the image, with λ the primary wavelength and NA'
// the image-side numerical aperture (system.image_na; image space is always air): Rayleigh's
// quarter-wave criterion (Born and Wolf, Principles of Optics, sec. 8.8; the section from memory).
//
// Diffraction angle: λ/(π·w), the far-field half-angle of a Gaussian beam of radius w, with w the
// output marginal ray height at the last optical vertex. Holding a collimated beam's divergence
// below its own diffraction angle is common practice.
type SpacingBasis struct {
	Kind           string   `json:"kind"`              // SpacingDepthOfFocus, SpacingDiffractionAngle or SpacingNone
	WavelengthNM   float64  `json:"wavelength_nm"`     // the primary wavelength
	Reference      string   `json:"reference"`         // id of the element defocus is measured at
	DepthOfFocusMM *float64 `json:"depth_of_focus_mm"` // λ/(2·NA'²); null when NA' is 0 or the output is collimated
	ImageNA        *float64 `json:"image_na"`
	DivergenceRad  *float64 `json:"divergence_rad"`   // λ/(π·w); null for a finite image
	OutputRadiusMM *float64 `json:"output_radius_mm"` // w
	// Spacing tolerances from the beam (kind "beam-rayleigh"; null otherwise): the Rayleigh range
	// of the beam leaving the last optical vertex, and where its waist lies relative to the
	// reference element (positive downstream).
	RayleighMM           *float64 `json:"rayleigh_mm"`
	WaistFromReferenceMM *float64 `json:"waist_from_reference_mm"`
}

// Blur is how widely one fan of exact rays lands on a screen: the RMS distance of the hits from
// their centroid and the largest distance, in the table plane, with the Airy radius of a perfect
// image beside them (null when the system forms no finite image).
type Blur struct {
	Element      string   `json:"element"`
	Field        string   `json:"field"`
	WavelengthNM float64  `json:"wavelength_nm"`
	Rays         int      `json:"rays"`   // rays of the fan that reached the screen
	Traced       int      `json:"traced"` // rays in the fan
	RMSMM        float64  `json:"rms_mm"`
	PeakMM       float64  `json:"peak_mm"`
	AiryRadiusMM *float64 `json:"airy_radius_mm"`
}

// BeamOutput is the beam leaving the last element, in each plane (l-beam part).
type BeamOutput struct {
	After string      `json:"after"` // id of the last element
	T     OutputWaist `json:"t"`
	S     OutputWaist `json:"s"`
}

// OutputWaist is the waist of the beam leaving the last element in one plane. FromLastMM is its
// position from the last element's last vertex, + downstream, negative when the waist is virtual
// (the beam already diverges). DivergenceRad is the far-field half-angle M²λ/(π w0 n).
type OutputWaist struct {
	FromLastMM    float64 `json:"waist_from_last_mm"`
	RadiusMM      float64 `json:"waist_radius_mm"`
	RayleighMM    float64 `json:"rayleigh_mm"`
	DivergenceRad float64 `json:"divergence_rad"`
}

// GlassWaist is a beam waist inside an element's glass. DepthMM is measured from the face the
// beam entered; the Rayleigh range is the physical one in the medium, π w0² n/(M² λ). A plane
// whose waist lies elsewhere has nil fields.
type GlassWaist struct {
	Element     string   `json:"element"`
	PathMM      float64  `json:"path_mm"`
	DepthMM     float64  `json:"depth_mm"`
	Index       float64  `json:"index"`
	RadiusTMM   *float64 `json:"radius_t_mm"`
	RadiusSMM   *float64 `json:"radius_s_mm"`
	RayleighTMM *float64 `json:"rayleigh_t_mm"`
	RayleighSMM *float64 `json:"rayleigh_s_mm"`
}

// Coupling is how much of the beam arriving at a fibre or mode target its mode accepts, and the
// offsets of the target that each alone lose 1 dB of that (sources and targets; README "Fibres,
// mode targets and cylindrical lenses"). Lateral and angular offsets are given per plane: the
// table plane and the vertical one. The axial offset is nil when no shift up to 1000 Rayleigh
// ranges of the mode loses 1 dB.
type Coupling struct {
	Element             string   `json:"element"`
	Efficiency          float64  `json:"efficiency"` // power coupling |γ|², 0 to 1
	AxialMM             *float64 `json:"axial_1db_mm"`
	LateralMM           *float64 `json:"lateral_1db_mm"`
	LateralVerticalMM   *float64 `json:"lateral_vertical_1db_mm"`
	AngularMrad         *float64 `json:"angular_1db_mrad"`
	AngularVerticalMrad *float64 `json:"angular_vertical_1db_mrad"`
}

// PowerReport is the power a bench carries, at each source's primary wavelength.
type PowerReport struct {
	Sources []SourcePowerLevel `json:"sources"` // each source that states a power or pulse
	Strays  []StrayBeam        `json:"strays"`  // every stray beam, strongest first
}

// SourcePowerLevel is what one source emits.
type SourcePowerLevel struct {
	Source       string   `json:"source"` // "source" or the further source's id
	WavelengthNM float64  `json:"wavelength_nm"`
	AverageMW    float64  `json:"average_mw"`
	PeakMW       float64  `json:"peak_mw"`            // power during a pulse: energy / duration; the average for a steady laser
	PulseMJ      *float64 `json:"pulse_mj,omitempty"` // energy of one pulse
}

// Stray-beam kinds.
const (
	StrayLeak  = "leak"  // the light a mirror lets through
	StrayGhost = "ghost" // the reflection off a refracting face, back upstream
	StrayPort  = "port"  // a splitter's port that no element takes
)

// StrayBeam is light that leaves the intended path: its average power in mW.
type StrayBeam struct {
	Element string  `json:"element"`
	Face    *int    `json:"face,omitempty"` // the face of a ghost
	Kind    string  `json:"kind"`           // StrayLeak, StrayGhost or StrayPort
	PowerMW float64 `json:"power_mw"`
}
