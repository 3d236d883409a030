package view

// Field is one form input. Name is the bench file's JSON path of the value (title,
// elements[2].gap_mm, source.beam.m2), so a problem reported at a path marks its input directly.
type Field struct {
	Name    string
	Label   string
	Value   string // what the user typed, or the stored value written back
	Error   string // the problem at this path, shown beside the input
	Unit    string // unit shown after the input when none is typed
	Kind    string // "text" (default), "textarea" or "select"
	Options []Option
	Apply   bool // a select whose change is applied by pressing the button beside it
}

// Option is one choice of a select.
type Option struct{ Value, Label string }

// Group is a titled set of fields, with problems that belong to the group but to none of its fields.
type Group struct {
	Title  string
	TestID string
	Fields []Field
	Errors []string
}

// ElementForm is the fields of one element with its move and delete buttons (their action
// values), and the element lists that branch from it (a splitter's reflected arm).
type ElementForm struct {
	Group
	Index        int
	Path         string // JSON path of the element: elements[1].reflected[0]
	First, Last  bool
	UpAction     string
	DownAction   string
	DeleteAction string
	Arms         []ArmForm
}

// ArmForm is a nested element list with the control that adds an element at its end.
type ArmForm struct {
	Title     string
	List      string // JSON path of the list: elements[1].reflected
	Elements  []ElementForm
	Errors    []string // problems of the list itself
	AddName   string   // the type choice's input name
	AddAction string
	AddTypes  []Option
}

// SourceForm is a further source: its fields, its element list and its delete button.
type SourceForm struct {
	Group
	Arm          ArmForm
	DeleteAction string
}

// RayForm is the fields of one explicit ray.
type RayForm struct {
	Index  int
	Fields []Field
}

// BenchForm is the whole edit form of a design.
type BenchForm struct {
	Action      string // URL the form posts to
	PreviewURL  string // URL the script posts to while a slider moves
	General     Group
	Table       Group
	Source      Group
	Beam        Group
	Materials   Group
	Rays        []RayForm
	RayErrors   []string
	Elements    []ElementForm
	MoreSources []SourceForm
	AddAt       []Option // where a new element may go
	AddTypes    []Option
	Errors      []string // problems that match no field
	Invalid     bool
}

// Table is a table of numbers. A marked row is highlighted (a changed value, a clipped element).
type Table struct {
	Title  string
	TestID string
	Head   []string
	Rows   []Row
	Note   string
}

// Row is one table row.
type Row struct {
	Cells  []string
	Marked bool
}

// Numbers is the numbers panel: tables, then warnings in plain words, then for a bench with a
// beam the lens-design tables, folded shut.
type Numbers struct {
	Tables   []Table
	Warnings []string
	Design   []Table
}

// Result is what one computation shows: the two diagrams (inline SVG) and the numbers.
type Result struct {
	SideSVG  string
	TableSVG string
	Numbers  Numbers
	Problem  string    // set when nothing could be computed
	Arms     []ArmLink // the arms the side view may show; none for a bench with one
	Power    []string  // the power levels the bench reaches, for the cautions (optics.PowerLevels)
}

// Links are the addresses of one revision's pages and exports.
type Links struct {
	Share         string
	Edit          string
	View          string
	History       string
	CompareParent string // "" for a design without parent
	BenchJSON     string
	ReportJSON    string
	SideSVG       string
	TableSVG      string
	PlanSVG       string
	Paraxial      string // the same page with the paraxial overlay toggled
	ParaxialOn    bool
}

// BenchPage is the bench page of one revision.
type BenchPage struct {
	ID      string
	Title   string
	Created string
	Links   Links
	Form    BenchForm
	Result  Result
}

// PresentPage is the read-only presentation view.
type PresentPage struct {
	ID      string
	Title   string
	Notes   string
	Created string
	Links   Links
	Result  Result
}

// Recent is one line of the home page's list of recent designs.
type Recent struct {
	URL     string
	Title   string
	Created string
	Summary string
}

// StartChoice is a bench the home page offers to start from: a button posting to Action.
type StartChoice struct {
	Action, Button, About, TestID string
}

// HomePage is the start page.
type HomePage struct {
	Starts      []StartChoice // the benches offered beside the demo
	Recent      []Recent
	ImportText  string   // what was pasted, kept after a failed import
	ImportError []string // problems of a failed import
}

// HistoryStep is one revision in a design's parent chain with what changed from its parent.
type HistoryStep struct {
	ID         string
	URL        string
	Created    string
	Title      string
	Changes    []string
	CompareURL string // compare with its parent; "" for the first
	Current    bool
}

// HistoryPage lists the chain from the newest revision back to the first.
type HistoryPage struct {
	ID        string
	Title     string
	Links     Links
	Steps     []HistoryStep
	Truncated bool
}

// CompareRow is one number of two designs.
type CompareRow struct {
	Label   string
	A, B    string
	Diff    string
	Changed bool
}

// CompareSide is one of the two compared revisions.
type CompareSide struct {
	ID       string
	URL      string
	Title    string
	SideSVG  string
	TableSVG string
}

// ComparePage shows two revisions side by side, or only the form when none are chosen yet.
type ComparePage struct {
	A, B      CompareSide
	Rows      []CompareRow
	Changed   int
	InputA    string
	InputB    string
	Errors    []string
	HasResult bool
}

// ErrorPage is a page for a failed request.
type ErrorPage struct {
	Status   int
	Title    string
	Message  string
	Problems []string
}
