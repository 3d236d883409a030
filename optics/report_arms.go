package optics

// ArmReport is one arm of a branching bench: an element list (the first source's main list, a
// splitter's reflected list, or a further source's list) with the light that reaches it. The
// values follow the conventions of the main report; paths run from the arm's own source.
type ArmReport struct {
	ID            string         `json:"id"`             // "main", "BS1.reflected", or a further source's id
	Parent        *string        `json:"parent"`         // the arm it branches from; null for a source's own list
	Source        string         `json:"source"`         // "source" for the first source, else the further source's id
	PowerFraction float64        `json:"power_fraction"` // of its source's power, at the arm's primary wavelength
	WavelengthsNM []float64      `json:"wavelengths_nm"` // the source's wavelengths that reach the arm
	Elements      []ElementPlace `json:"elements"`       // its own elements
	Rays          []Ray          `json:"rays"`           // exact rays of the whole path from the source
	Beam          *BeamReport    `json:"beam"`           // rows and waists of its own elements; null without a beam
	OpticalPathMM float64        `json:"optical_path_mm"`
	GroupDelayPS  float64        `json:"group_delay_ps"`
	Ends          string         `json:"ends"` // ArmOpen, ArmStopped, or "joins ARM at PART"
}

// How an arm ends.
const (
	ArmOpen    = "open"    // its last port carries light away that no element takes: a stray beam
	ArmStopped = "stopped" // on a dump or screen
)

// Meeting is a part that two or more beams reach.
type Meeting struct {
	Part         string   `json:"part"`
	Arms         []string `json:"arms"`
	MissMM       float64  `json:"miss_mm"`        // largest distance of an arriving axis from the part's centre
	AngleMRad    *float64 `json:"angle_mrad"`     // between beams that leave the part together; null when none do
	OPDMM        *float64 `json:"opd_mm"`         // optical path difference of those beams; same source only
	GroupDelayFS *float64 `json:"group_delay_fs"` // their group delay difference
	Visibility   *float64 `json:"visibility"`     // normalised overlap |γ| of their Gaussian beams at the part
	TableXMM     float64  `json:"table_x_mm"`     // where the part stands on the table
	TableYMM     float64  `json:"table_y_mm"`
}
