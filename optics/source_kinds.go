package optics

// SourceKind is one kind of source: its own fields, rules and defaults, as Kind is for elements.
type SourceKind struct {
	Kind   string  // the source's "kind" in the bench file
	Noun   string  // what messages call one: "a point source needs na"
	Label  string  // what people choose from
	Fields []Field // its own fields besides SourceFields

	// Default gives a new source's own fields (DefaultSource sets the kind).
	Default func() Source

	check func(v *checker, path string, s *Source) // its own rules beyond presence and strays
}

// SourceKinds lists the source kinds, in the order messages name them. The first is the one an
// unknown kind is shown and defaulted as.
var SourceKinds = []SourceKind{
	{
		Kind: SourceCollimated, Noun: "collimated source", Label: "collimated bundle",
		Fields: []Field{
			{Key: "semi_diameter_mm", Label: "bundle radius", Quantity: Length, Required: true, About: "the radius of the ray bundle"},
			{Key: "field_angles_deg", Label: "field angles (comma list)", Quantity: Angle},
		},
		Default: func() Source { return Source{SemiDiameterMM: new(2.0), FieldAnglesDeg: []float64{0}} },
		check:   (*checker).collimated,
	},
	{
		Kind: SourcePoint, Noun: "point source", Label: "point source",
		Fields: []Field{
			{Key: "na", Label: "numerical aperture", Quantity: Plain, Required: true, About: "the numerical aperture of the traced cone"},
			{Key: "object_heights_mm", Label: "object heights (comma list)", Quantity: Length},
		},
		Default: func() Source { return Source{NA: new(0.1), ObjectHeightsMM: []float64{0}} },
		check:   (*checker).pointSource,
	},
	{ // sources and targets
		Kind: SourceFiber, Noun: "fibre source", Label: "fibre (single-mode face)",
		Fields: []Field{
			{Key: "mfd_um", Label: "mode field diameter (1/e²)", Quantity: ModeDiameter, Required: true, About: "its mode field diameter"},
			{Key: "na", Label: "numerical aperture of the traced cone (empty: the mode's divergence)", Quantity: Plain, Absent: "the mode's"},
		},
		Default: func() Source { return Source{MFDUM: new(6.0)} },
		check:   (*checker).fiberSource,
	},
}

// SourceKindOf finds the entry of a source kind.
func SourceKindOf(kind string) (*SourceKind, bool) {
	for i := range SourceKinds {
		if SourceKinds[i].Kind == kind {
			return &SourceKinds[i], true
		}
	}
	return nil, false
}

// SourceKindOrFirst is the entry of a kind, or the first entry for a kind that is not known: a
// form shows and fills an unknown kind as the first one until the user picks.
func SourceKindOrFirst(kind string) *SourceKind {
	if k, ok := SourceKindOf(kind); ok {
		return k
	}
	return &SourceKinds[0]
}

// SourceKindNames lists the source kinds in table order.
func SourceKindNames() []string {
	out := make([]string, len(SourceKinds))
	for i, k := range SourceKinds {
		out[i] = k.Kind
	}
	return out
}

// allSourceFields holds the common source fields and then every kind's, each key once.
var allSourceFields = withKinds(SourceFields, SourceKinds, func(k SourceKind) []Field { return k.Fields })

// sourceKindFields are the fields that belong to one source kind or another.
var sourceKindFields = kindFieldsOnly(allSourceFields, SourceFields)
