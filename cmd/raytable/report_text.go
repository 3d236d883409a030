package main

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"raytable/optics"
	"raytable/optics/tables"
)

// writeText prints a report as aligned plain-text tables, the sections and rows that
// optics/tables lays out for the text layout.
func writeText(w io.Writer, r *optics.Report) error {
	t := tables.Build(r)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	if t.Title != "" {
		fmt.Fprintf(tw, "%s\n", t.Title)
	}
	wavelengths := make([]string, len(t.Wavelengths))
	for i, c := range t.Wavelengths {
		wavelengths[i] = c.In(tables.Text)
	}
	fmt.Fprintf(tw, "wavelengths\t%s nm (first is primary)\n", strings.Join(wavelengths, ", "))
	for _, s := range t.Lead(tables.Text) {
		fmt.Fprint(tw, "\n")
		writeSection(tw, s)
	}
	// A bench with a beam opens with it; the lens-design values follow under their own heading.
	if design := t.Design(tables.Text); len(design) > 0 {
		fmt.Fprint(tw, "\nLENS DESIGN VALUES\n")
		for _, s := range design {
			fmt.Fprint(tw, "\n")
			writeSection(tw, s)
		}
	}
	return tw.Flush()
}

// writeSection prints one table: the heading in place of an empty first column head (its unit
// then goes into that column's cells), or on a line of its own; the rows indented by two spaces;
// a row's note in parentheses after it; the section's note under the rows, or alone in their place.
func writeSection(w io.Writer, s *tables.Section) {
	cols := s.ColumnsIn(tables.Text)
	var heads []string
	if s.Transposed {
		heads = append(heads, s.LabelHead.In(tables.Text))
	}
	for _, i := range cols {
		heads = append(heads, s.Columns[i].Label(tables.Text))
	}
	title, firstUnit := s.Title.In(tables.Text), ""
	if len(heads) > 0 && heads[0] == "" {
		heads[0] = title
		if !s.Transposed && len(cols) > 0 {
			firstUnit = s.Columns[cols[0]].Unit.In(tables.Text)
		}
	} else {
		fmt.Fprintf(w, "%s\n", title)
		if len(heads) > 0 {
			heads[0] = "  " + heads[0]
		}
	}
	for len(heads) > 0 && heads[len(heads)-1] == "" {
		heads = heads[:len(heads)-1]
	}
	if len(heads) > 0 {
		fmt.Fprintf(w, "%s\n", strings.Join(heads, "\t"))
	}
	rows := s.RowsIn(tables.Text)
	for _, row := range rows {
		var cells []string
		if s.Transposed {
			cells = append(cells, row.QuantityLabel(tables.Text))
		}
		for k, i := range cols {
			if i >= len(row.Cells) {
				break
			}
			v := row.Cells[i].In(tables.Text)
			if k == 0 && firstUnit != "" {
				v += " " + firstUnit
			}
			cells = append(cells, v)
		}
		if row.Note != "" && len(cells) > 0 {
			cells[len(cells)-1] += " (" + row.Note + ")"
		}
		fmt.Fprintf(w, "  %s\n", strings.Join(cells, "\t"))
	}
	if note := s.Note.In(tables.Text); note != "" {
		if len(rows) > 0 {
			note = "  " + note
		}
		fmt.Fprintf(w, "%s\n", note)
	}
}
