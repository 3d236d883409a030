package optics

import (
	"strconv"
	"strings"
)

// Kind is one element type of the bench file with everything about it that is not physics: its
// fields, its rules, how people see it and what a new one looks like. Kinds is the one table of
// them; the decoder, Validate, Diff, the edits (edit.go), the default mounts of optics/layout and
// the web form all read it, so that no other place lists the types or their fields.
//
// What each type does to light is code, reached by a switch on Type: BuildPath (path.go) and the
// drawings (web/diagram). A type's own validation rules (a lens's edge thickness, a mirror's turn)
// are code too, reached through the entry.
type Kind struct {
	Type     string // the element's "type" in the bench file
	Noun     string // what messages call one: "a thin lens needs focal_mm"
	Label    string // what people choose from: the form's list of types
	IDPrefix string // new elements are named IDPrefix1, IDPrefix2, ... (UniqueID)

	// Fields are its own fields besides ElementFields, in the order messages and forms list them;
	// a type takes a clear diameter when diameter_mm is among them.
	Fields []Field

	StopsRays bool      // rays end on it (with status ok): a beam dump
	EndsPath  bool      // the beam may end on it: a bench whose last element is one is terminated
	Mount     MountRule // its mount's footprint when the element gives none

	// Default gives a new element's own fields: a sensible part that a builder then adjusts.
	// DefaultElement sets the type and the gap.
	Default func() Element

	// check applies its own rules beyond presence and strays (nil: none). diameterOK says that
	// diameter_mm is absent or a positive length, so that rules may use the clear aperture.
	check func(v *checker, path string, e *Element, diameterOK bool)
}

// The fields of the element types. A clear diameter is shared by four of them.
var (
	clearDiameter = Field{Key: "diameter_mm", Label: "clear diameter (empty: unlimited)", Quantity: Length}
	irisDiameter  = Field{Key: "diameter_mm", Label: "clear diameter", Quantity: Length} // an iris is its opening
	lensFields    = []Field{
		{Key: "faces_mm", Label: "face radii (comma list, flat for flat)", Quantity: Length, Flat: true},
		{Key: "thicknesses_mm", Label: "thicknesses (comma list)", Quantity: Length},
		{Key: "materials", Label: "materials (comma list)"},
		clearDiameter,
		cylinderAxis,
		coating, faceReflectance,
	}
	thinLensFields = []Field{
		{Key: "focal_mm", Label: "focal length", Quantity: Length, Required: true, Hint: "use a length such as 100 mm"},
		clearDiameter,
		cylinderAxis,
		coating, faceReflectance,
	}
	mirrorFields = []Field{
		{Key: "radius_mm", Label: "radius (+ concave, flat)", Quantity: Length, Flat: true},
		turn("turn (+ counter-clockwise)"),
		clearDiameter,
		{Key: "reflectance", Label: "reflectance (empty: 0.99)", Quantity: Plain, Absent: "0.99"},
	}
	splitterFields = []Field{
		turn("turn of the reflected beam (+ counter-clockwise)"),
		{Key: "reflect", Label: "fraction reflected (empty: 0.5)", Quantity: Plain, Absent: "0.5"},
		{Key: "dichroic", Label: "dichroic edge (JSON: edge_nm, reflects)", Multiline: true, Fields: DichroicFields},
		{Key: "thickness_mm", Label: "plate thickness (empty: no plate)", Quantity: Length},
		{Key: "material", Label: "plate material"},
		clearDiameter,
		{Key: "reflected", Fields: ElementFields},
		coating, faceReflectance,
	}
	periscopeFields = []Field{
		{Key: "rise_mm", Label: "rise (+ up)", Quantity: Length, Required: true, About: "how far it lifts the beam",
			Hint: "use a length such as 50 mm (negative lowers)"},
		turn("turn (+ counter-clockwise, 0 straight on)"),
		clearDiameter,
	}
	screenFields = []Field{{Key: "width_mm", Label: "width (empty: unlimited)", Quantity: Length}}
)

// The reflection of refracting faces (README "Power"): a lens's, a thin lens's two, a splitter
// plate's back face.
var (
	coating         = Field{Key: "coating", Label: "coating (ar or uncoated; empty: ar)", Absent: CoatingAR}
	faceReflectance = Field{Key: "face_reflectance", Label: "reflectance per face (empty: by coating)", Quantity: Plain, Absent: "by coating"}
)

// turn is the heading change of a mirror, a splitter's reflected port or a periscope: one meaning,
// with a label that says what turns.
func turn(label string) Field {
	return Field{Key: "turn_deg", Label: label, Quantity: Angle, Required: true,
		About: "how far it turns the beam on the table", Hint: "use the heading change in degrees, e.g. 90"}
}

// Default mount sizes, common practice for 1-inch-class optics on posts (our own round numbers, not
// any maker's drawing): a lens holder is a plate about 15 mm wider than the optic and 15-20 mm
// thick along the beam; a mirror mount is roughly square, about 15 mm larger than the mirror; an
// iris housing is at least 40 mm across whatever its opening; a screen or camera body about 20 mm
// wider than its sensitive width and 30 mm deep; a beam dump a 30 mm block.
var (
	lensMount   = MountRule{SizedBy: "diameter_mm", AssumedMM: defaultOpticDiameterMM, MarginMM: 15, DepthMM: 18, LipMM: 6}
	mirrorMount = MountRule{SizedBy: "diameter_mm", AssumedMM: defaultOpticDiameterMM, MarginMM: 15} // square
	irisMount   = MountRule{SizedBy: "diameter_mm", MarginMM: 20, MinWidthMM: 40, DepthMM: 12}
	screenMount = MountRule{SizedBy: "width_mm", AssumedMM: 25, MarginMM: 20, DepthMM: 30}
	dumpMount   = MountRule{MinWidthMM: 30, DepthMM: 30}
)

// defaultOpticDiameterMM is assumed for the mount of a lens, thin lens or mirror that gives no
// diameter: a 1-inch optic.
const defaultOpticDiameterMM = 25.4

// DichroicFields is the table of a splitter's dichroic edge.
var DichroicFields = []Field{
	{Key: "edge_nm", Label: "edge", Quantity: Wavelength, Required: true},
	{Key: "reflects", Label: "reflects (shorter or longer)", Required: true},
}

// Kinds lists the element types, in the order messages and the form's list name them.
var Kinds = []Kind{
	{
		Type: TypeLens, Noun: "lens", Label: "lens", IDPrefix: "L", Fields: lensFields,
		Mount: lensMount,
		Default: func() Element {
			return Element{FacesMM: []*float64{new(100.0), nil}, ThicknessesMM: []float64{4}, Materials: []string{"fused-silica"}, DiameterMM: new(25.4)}
		},
		check: func(v *checker, p string, e *Element, ok bool) { v.lens(p, e, ok); v.cylinder(p, e) },
	},
	{
		Type: TypeThinLens, Noun: "thin lens", Label: "thin lens", IDPrefix: "F", Fields: thinLensFields,
		Mount:   lensMount,
		Default: func() Element { return Element{FocalMM: new(100.0), DiameterMM: new(25.4)} },
		check:   func(v *checker, p string, e *Element, ok bool) { v.thinLens(p, e, ok); v.cylinder(p, e) },
	},
	{
		Type: TypeMirror, Noun: "mirror", Label: "mirror", IDPrefix: "M", Fields: mirrorFields,
		Mount:   mirrorMount,
		Default: func() Element { return Element{TurnDeg: new(90.0), DiameterMM: new(25.4)} },
		check:   (*checker).mirror,
	},
	{
		Type: TypeAperture, Noun: "aperture", Label: "aperture (iris, pinhole)", IDPrefix: "A", Fields: []Field{irisDiameter},
		Mount:   irisMount,
		Default: func() Element { return Element{DiameterMM: new(5.0)} },
	},
	{
		Type: TypeScreen, Noun: "screen", Label: "screen (camera, card)", IDPrefix: "S", Fields: screenFields,
		EndsPath: true,
		Mount:    screenMount,
		Default:  func() Element { return Element{WidthMM: new(10.0)} },
		check:    (*checker).screen,
	},
	{
		Type: TypeDump, Noun: "beam dump", Label: "beam dump", IDPrefix: "D",
		StopsRays: true, EndsPath: true,
		Mount:   dumpMount,
		Default: func() Element { return Element{} },
	},
	{
		Type: TypeSplitter, Noun: "splitter", Label: "splitter (beam splitter, pick-off, dichroic)", IDPrefix: "BS",
		Fields: splitterFields, Mount: mirrorMount,
		Default: func() Element { return Element{TurnDeg: new(90.0), DiameterMM: new(25.4)} },
		check:   (*checker).splitter,
	},
	{
		Type: TypePeriscope, Noun: "periscope", Label: "periscope (raise or lower)", IDPrefix: "P",
		Fields: periscopeFields, Mount: mirrorMount,
		Default: func() Element { return Element{RiseMM: new(50.0), TurnDeg: new(0.0), DiameterMM: new(25.4)} },
		check:   (*checker).periscope,
	},
	// sources and targets
	{
		Type: TypeFiber, Noun: "fibre", Label: "fibre (single-mode, coupled into)", IDPrefix: "FC",
		Fields: fiberFields, EndsPath: true, Mount: targetMount,
		Default: func() Element { return Element{MFDUM: new(6.0), DiameterMM: new(2.5)} }, // a 2.5 mm ferrule
		check:   (*checker).fiber,
	},
	{
		Type: TypeModeTarget, Noun: "mode target", Label: "mode target (cavity mode, design waist)", IDPrefix: "T",
		Fields: modeTargetFields, EndsPath: true, Mount: targetMount,
		Default: func() Element { return Element{WaistRadiusMM: new(0.1), WaistAtMM: new(0.0)} },
		check:   (*checker).modeTarget,
	},
}

// The fields of cylindrical lenses, fibres and mode targets (sources and targets).
var (
	cylinderAxis = Field{Key: "cylinder_axis", Label: "cylinder axis (vertical or horizontal; empty: spherical)", Absent: "spherical",
		Choices: []string{CylinderVertical, CylinderHorizontal}}
	fiberFields = []Field{
		{Key: "mfd_um", Label: "mode field diameter (1/e²)", Quantity: ModeDiameter, Required: true,
			About: "its mode field diameter", Hint: "use the data sheet's value at the wavelength, e.g. 6 µm"},
		clearDiameter,
	}
	modeTargetFields = []Field{
		{Key: "waist_radius_mm", Label: "waist radius (1/e²)", Quantity: Length, Required: true,
			About: "the waist radius of the mode", Hint: "use a length such as 0.1 mm"},
		{Key: "waist_at_mm", Label: "waist position (+ downstream of the element)", Quantity: Length},
		{Key: "sagittal", Label: "vertical plane (JSON: waist_radius_mm, waist_at_mm; empty: as the table plane)", Multiline: true, Fields: BeamPlaneFields},
	}
	// targetMount is a fibre connector or crystal holder on a post: a 30 mm block (our own round number).
	targetMount = MountRule{MinWidthMM: 30, DepthMM: 25}
)

// KindOf finds the entry of an element type.
func KindOf(typ string) (*Kind, bool) {
	for i := range Kinds {
		if Kinds[i].Type == typ {
			return &Kinds[i], true
		}
	}
	return nil, false
}

// KindTypes lists the element types in table order.
func KindTypes() []string {
	out := make([]string, len(Kinds))
	for i, k := range Kinds {
		out[i] = k.Type
	}
	return out
}

// allElementFields holds the common element fields and then every type's, each key once.
var allElementFields = withKinds(ElementFields, Kinds, func(k Kind) []Field { return k.Fields })

// elementKindFields are the fields that belong to one element type or another.
var elementKindFields = kindFieldsOnly(allElementFields, ElementFields)

// kindFieldsOnly is all without the fields of common: the fields that belong to one kind or another.
func kindFieldsOnly(all, common []Field) []Field {
	var out []Field
	for _, f := range all {
		if _, isCommon := FieldByKey(common, f.Key); !isCommon {
			out = append(out, f)
		}
	}
	return out
}

// quotedList writes names for "must be one of" messages: "a" or "b", "a", "b" or "c".
func quotedList(names []string) string {
	q := make([]string, len(names))
	for i, n := range names {
		q[i] = strconv.Quote(n)
	}
	if len(q) < 2 {
		return strings.Join(q, "")
	}
	return strings.Join(q[:len(q)-1], ", ") + " or " + q[len(q)-1]
}
