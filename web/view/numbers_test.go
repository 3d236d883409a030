package view

import (
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/tables"
)

// The system table shows a sagittal column only when a value differs between the planes.
func TestSystemTableColumns(t *testing.T) {
	efl, sagEFL := 100.0, 80.0
	r := &optics.Report{}
	r.System.Optical = true
	r.System.EFLMM = &efl
	r.System.Sagittal.EFLMM = &efl
	if tb := systemTable(r); len(tb.Head) != 2 || !strings.Contains(tb.Note, "Both planes agree") {
		t.Errorf("equal planes: head %q, note %q; want two columns and the agreement note", tb.Head, tb.Note)
	}
	r.System.Sagittal.EFLMM = &sagEFL
	tb := systemTable(r)
	if len(tb.Head) != 3 {
		t.Fatalf("differing planes: head %q, want three columns", tb.Head)
	}
	for _, row := range tb.Rows {
		if row.Cells[0] == "BFL (mm)" {
			t.Errorf("row %q shown although both planes lack it", row.Cells[0])
		}
	}
	if got := tb.Rows[0]; got.Cells[0] != "EFL (mm)" || got.Cells[1] != "100" || got.Cells[2] != "80" || !got.Marked {
		t.Errorf("first row %+v, want EFL 100 | 80 marked", got)
	}
}

// systemTable is the page's system table of r.
func systemTable(r *optics.Report) Table {
	for _, s := range tables.Build(r).In(tables.Page) {
		if s.Name == tables.System {
			return pageTable(s)
		}
	}
	return Table{}
}

func TestNumbersPanelOfAnEmptyBench(t *testing.T) {
	n := NumbersPanel(&optics.Report{})
	var ids []string
	for _, tb := range n.Tables {
		ids = append(ids, tb.TestID)
	}
	if got, want := strings.Join(ids, ","), "system-values,elements-table,ray-status"; got != want {
		t.Errorf("tables %s, want %s", got, want)
	}
	if !strings.Contains(n.Tables[0].Note, "no system values") {
		t.Errorf("system note %q, want the no-optics note", n.Tables[0].Note)
	}
}
