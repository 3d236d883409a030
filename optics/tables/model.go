package tables

import "raytable/optics"

// Report is a report laid out as tables.
type Report struct {
	Title       string
	Wavelengths []Cell // every wavelength in nm, the primary one first
	Sections    []Section
	Warnings    []optics.Warning
	byName      map[Name]int
	// beamFirst says the bench has a Gaussian beam: the text report and the page then open with
	// it and keep the lens-design values for last (see Lead and Design).
	beamFirst bool
}

// Name names a section; the page uses it as the table's data-testid.
type Name string

const (
	System       Name = "system-values"
	Chromatic    Name = "chromatic"
	Elements     Name = "elements-table"
	Spacing      Name = "spacing"
	RayStatus    Name = "ray-status"
	StoppedRays  Name = "stopped-rays"
	Blur         Name = "blur"
	Beam         Name = "beam-table"
	Waists       Name = "waists"
	Placement    Name = "placement"
	Media        Name = "media"
	Warnings     Name = "warnings"
	WarningCount Name = "warning-count"
	Arms         Name = "arms"
	ArmElements  Name = "arm-elements"
	Meetings     Name = "meetings"
	BeamOutput   Name = "beam-output"
	GlassWaists  Name = "glass-waists"
	Coupling     Name = "coupling" // into fibres and mode targets
)

// arrangement is each layout's order of sections. A section that has nothing to show for a
// bench (no beam, one wavelength) is not built and so not shown.
var arrangement = map[Layout][]Name{
	Text:    {System, Chromatic, Elements, Arms, ArmElements, Meetings, Spacing, Media, StoppedRays, Blur, Beam, Waists, Coupling, Warnings},
	Page:    {System, Chromatic, Elements, Arms, ArmElements, Meetings, Spacing, RayStatus, Blur, Beam, Waists, Coupling, Placement, Media},
	Compare: {System, Elements, Arms, ArmElements, Meetings, RayStatus, Blur, Spacing, Beam, Waists, Coupling, Placement, WarningCount},
}

// beamLead and beamDesign are the text report's and the page's order for a bench with a Gaussian
// beam: the beam at each element, its waists and the output beam, then where things go and the
// warnings; the lens-design values after them. A layout missing here keeps its arrangement.
var (
	beamLead = map[Layout][]Name{
		Text: {Beam, Waists, GlassWaists, BeamOutput, Coupling, Elements, Arms, ArmElements, Meetings, Warnings},
		Page: {Beam, Waists, GlassWaists, BeamOutput, Coupling, Placement, Arms, ArmElements, Meetings},
	}
	beamDesign = map[Layout][]Name{
		Text: {System, Chromatic, Spacing, Media, StoppedRays, Blur},
		Page: {System, Chromatic, Elements, Spacing, RayStatus, Blur, Media},
	}
)

// In lists the sections layout l shows, in its order: Lead then Design.
func (r *Report) In(l Layout) []*Section { return append(r.Lead(l), r.Design(l)...) }

// Lead lists the sections layout l opens with: for a bench with a beam the beam summary and
// placement, otherwise every section.
func (r *Report) Lead(l Layout) []*Section {
	if names, ok := beamLead[l]; ok && r.beamFirst {
		return r.named(names)
	}
	return r.named(arrangement[l])
}

// Design lists the lens-design sections that layout l shows after the lead, in their own part;
// none for a bench without a beam, whose lead holds everything.
func (r *Report) Design(l Layout) []*Section {
	if names, ok := beamDesign[l]; ok && r.beamFirst {
		return r.named(names)
	}
	return nil
}

func (r *Report) named(names []Name) []*Section {
	var out []*Section
	for _, n := range names {
		if i, ok := r.byName[n]; ok {
			out = append(out, &r.Sections[i])
		}
	}
	return out
}

// Section is one table.
type Section struct {
	Name  Name
	Title Phrase
	// Transposed sections have a quantity in each row (Row.Label, Row.Unit) and the things the
	// quantities belong to in the columns (the system's two planes); LabelHead heads the labels.
	Transposed bool
	LabelHead  Words
	Columns    []Column
	Rows       []Row
	Note       Phrase
	// Agree is the page's note when every column of a transposed section repeats the first one:
	// the page then shows only the first, and leaves out rows missing in every column.
	Agree string
}

// Column is one column: its head and unit, and, in a transposed section, the name of what it
// belongs to on the compare page ("sagittal").
type Column struct {
	Head Words
	Unit Unit
	Key  string
	In   Layout
}

// Label is the column's head in layout l.
func (c Column) Label(l Layout) string { return Label(c.Head.In(l), c.Unit, l) }

// Row is one row: a cell per column.
type Row struct {
	// Key names what the row is about on the compare page (an element id, "waist 1").
	Key string
	// Label, Unit and From name the quantity of a transposed section's row.
	Label Words
	Unit  Unit
	From  *Origin
	Cells []Cell
	// Marked rows are highlighted on the page (a clipped element, the tightest gap).
	Marked bool
	// Note is a remark on the row that the text report writes after it in parentheses.
	Note string
	In   Layout
}

// ColumnsIn lists the indexes of the columns layout l shows.
func (s *Section) ColumnsIn(l Layout) []int {
	var out []int
	for i, c := range s.Columns {
		if c.In.Has(l) {
			out = append(out, i)
		}
	}
	return out
}

// RowsIn lists the rows layout l shows.
func (s *Section) RowsIn(l Layout) []*Row {
	var out []*Row
	for i := range s.Rows {
		if s.Rows[i].In.Has(l) {
			out = append(out, &s.Rows[i])
		}
	}
	return out
}

// QuantityLabel names a transposed section's row in layout l.
func (r Row) QuantityLabel(l Layout) string { return quantityLabel(r.Label, r.Unit, r.From, l) }

func (r *Report) add(s Section) {
	if r.byName == nil {
		r.byName = map[Name]int{}
	}
	r.byName[s.Name] = len(r.Sections)
	r.Sections = append(r.Sections, s)
}
