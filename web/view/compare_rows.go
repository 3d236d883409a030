package view

import (
	"math"
	"strings"

	"raytable/optics"
	"raytable/optics/numfmt"
	"raytable/optics/tables"
)

// item is one number of a report, named so that the same number of two reports can be paired.
type item struct {
	key  string
	num  *float64 // nil when the value is text (or absent)
	text string
}

// reportItems lists every number of a report that the compare page shows, in a fixed order: the
// cells optics/tables lays out for the compare page, each named by what it belongs to and its
// column (or, in a transposed section, by its column and its quantity).
func reportItems(r *optics.Report) []item {
	var out []item
	add := func(key string, c tables.Cell) {
		it := item{key: strings.TrimSpace(key), text: c.In(tables.Compare)}
		if v, ok := c.Number(tables.Compare); ok {
			it.num = &v
		}
		out = append(out, it)
	}
	for _, s := range tables.Build(r).In(tables.Compare) {
		cols, rows := s.ColumnsIn(tables.Compare), s.RowsIn(tables.Compare)
		scope := sectionScope(s)
		if s.Transposed {
			for _, i := range cols {
				for _, row := range rows {
					add(scope+s.Columns[i].Key+" "+row.QuantityLabel(tables.Compare), row.Cells[i])
				}
			}
			continue
		}
		for _, row := range rows {
			for _, i := range cols {
				if c := row.Cells[i]; !c.Omitted(tables.Compare) {
					add(scope+row.Key+" "+s.Columns[i].Label(tables.Compare), c)
				}
			}
		}
	}
	return out
}

// singleLine are the sections a bench without arms has; their numbers keep the names they have
// always had on the compare page.
var singleLine = map[tables.Name]bool{
	tables.System: true, tables.Chromatic: true, tables.Elements: true, tables.Spacing: true,
	tables.RayStatus: true, tables.StoppedRays: true, tables.Blur: true, tables.Beam: true,
	tables.Waists: true, tables.Placement: true, tables.Media: true, tables.Warnings: true,
	tables.WarningCount: true,
}

// sectionScope is what a number's name starts with: nothing in the sections of the single line,
// else the section's name, which for a branching bench's sections holds the arm's id, so that the
// two designs' arms pair by id and the same element id in two arms makes two rows.
func sectionScope(s *tables.Section) string {
	if singleLine[s.Name] {
		return ""
	}
	return string(s.Name) + ": "
}

// sameTolerance is the relative difference below which two numbers count as equal: well below
// anything shown with five digits, well above rounding noise.
const sameTolerance = 1e-9

// CompareRows pairs the numbers of two reports by name, keeping a's order and then b's extra
// names, and counts the rows whose value changed.
func CompareRows(a, b *optics.Report) (rows []CompareRow, changed int) {
	ia, ib := reportItems(a), reportItems(b)
	byKey := map[string]item{}
	for _, it := range ib {
		byKey[it.key] = it
	}
	seen := map[string]bool{}
	emit := func(key string, x, y *item) {
		row := CompareRow{Label: key, A: "—", B: "—"}
		if x != nil {
			row.A = x.text
		}
		if y != nil {
			row.B = y.text
		}
		switch {
		case x != nil && y != nil && x.num != nil && y.num != nil:
			d := *y.num - *x.num
			row.Changed = math.Abs(d) > sameTolerance*math.Max(1, math.Max(math.Abs(*x.num), math.Abs(*y.num)))
			if row.Changed {
				row.Diff = numfmt.Signed(numfmt.Panel, d)
			}
		default:
			row.Changed = row.A != row.B
		}
		if row.Changed {
			changed++
		}
		rows = append(rows, row)
	}
	for i := range ia {
		seen[ia[i].key] = true
		if y, ok := byKey[ia[i].key]; ok {
			emit(ia[i].key, &ia[i], &y)
		} else {
			emit(ia[i].key, &ia[i], nil)
		}
	}
	for i := range ib {
		if !seen[ib[i].key] {
			emit(ib[i].key, nil, &ib[i])
		}
	}
	return rows, changed
}
