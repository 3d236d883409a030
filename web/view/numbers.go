package view

import (
	"strings"

	"raytable/optics"
	"raytable/optics/tables"
)

// NumbersPanel lays out a report as the tables of the numbers panel: the sections optics/tables
// builds for the page, then the warnings in plain words; for a bench with a beam the lens-design
// sections come after the warnings.
func NumbersPanel(r *optics.Report) Numbers {
	var n Numbers
	t := tables.Build(r)
	for _, s := range t.Lead(tables.Page) {
		n.Tables = append(n.Tables, pageTable(s))
	}
	for _, s := range t.Design(tables.Page) {
		n.Design = append(n.Design, pageTable(s))
	}
	for _, w := range r.Warnings {
		n.Warnings = append(n.Warnings, warningText(w))
	}
	return n
}

func warningText(w optics.Warning) string {
	if w.Element == "" || strings.HasPrefix(w.Message, w.Element) {
		return w.Message
	}
	return w.Element + ": " + w.Message
}

// pageTable writes one section as a page table: heads with their units in parentheses, the
// cells by the page's profile.
func pageTable(s *tables.Section) Table {
	t := Table{Title: s.Title.In(tables.Page), TestID: string(s.Name), Note: s.Note.In(tables.Page)}
	cols := s.ColumnsIn(tables.Page)
	if s.Transposed {
		t.Head = append(t.Head, s.LabelHead.In(tables.Page))
	}
	for _, i := range cols {
		t.Head = append(t.Head, s.Columns[i].Label(tables.Page))
	}
	for _, row := range s.RowsIn(tables.Page) {
		var cells []string
		if s.Transposed {
			cells = append(cells, row.QuantityLabel(tables.Page))
		}
		for _, i := range cols {
			cells = append(cells, row.Cells[i].In(tables.Page))
		}
		t.Rows = append(t.Rows, Row{Cells: cells, Marked: row.Marked})
	}
	if s.Agree != "" && len(t.Rows) > 0 {
		collapse(&t, s.Agree)
	}
	return t
}

// collapse shows a transposed table's columns after the first only where they differ from it:
// a repeated value reads "same", a row that differs is marked, rows missing in every column are
// left out, and when no column differs anywhere only the first is kept and agree is noted.
func collapse(t *Table, agree string) {
	const missing = "—"
	differ := false
	rows := t.Rows[:0]
	for _, r := range t.Rows {
		first, all := r.Cells[1], r.Cells[1] == missing
		r.Marked = false
		for k := 2; k < len(r.Cells); k++ {
			all = all && r.Cells[k] == missing
			if r.Cells[k] == first {
				r.Cells[k] = "same"
			} else {
				r.Marked, differ = true, true
			}
		}
		if !all {
			rows = append(rows, r)
		}
	}
	t.Rows = rows
	if !differ {
		t.Head = t.Head[:2]
		for i := range t.Rows {
			t.Rows[i].Cells = t.Rows[i].Cells[:2]
		}
		t.Note = strings.TrimSpace(t.Note + " " + agree)
	}
}
