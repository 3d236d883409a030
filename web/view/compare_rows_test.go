package view

import (
	"testing"

	"raytable/optics"
)

func TestCompareRows(t *testing.T) {
	semi := 12.7
	a := &optics.Report{Elements: []optics.ElementPlace{
		{ID: "L1", PathMM: 100, SemiDiameterMM: &semi},
		{ID: "S", PathMM: 250},
	}}
	a.System.ApertureStop = "L1"
	b := &optics.Report{Elements: []optics.ElementPlace{
		{ID: "L1", PathMM: 112.5, SemiDiameterMM: &semi},
		{ID: "S", PathMM: 250 * (1 + 1e-12)}, // rounding noise, below sameTolerance
		{ID: "M1", PathMM: 300},
	}}
	b.System.ApertureStop = "S"
	rows, changed := CompareRows(a, b)
	byLabel := map[string]CompareRow{}
	for _, r := range rows {
		byLabel[r.Label] = r
	}
	for _, tc := range []struct {
		label, a, b, diff string
		changed           bool
	}{
		{"L1 along the path (mm)", "100", "112.5", "+12.5", true},
		{"S along the path (mm)", "250", "250", "", false},
		{"M1 along the path (mm)", "—", "300", "", true}, // only in b: listed after a's rows
		{"aperture stop", "L1", "S", "", true},
		{"EFL (mm)", "—", "—", "", false},
	} {
		got, ok := byLabel[tc.label]
		if !ok {
			t.Errorf("no row %q", tc.label)
			continue
		}
		if got.A != tc.a || got.B != tc.b || got.Diff != tc.diff || got.Changed != tc.changed {
			t.Errorf("row %q = %+v, want A %q B %q diff %q changed %v", tc.label, got, tc.a, tc.b, tc.diff, tc.changed)
		}
	}
	n := 0
	for _, r := range rows {
		if r.Changed {
			n++
		}
	}
	if changed != n {
		t.Errorf("changed = %d, but %d rows are marked", changed, n)
	}
	if last := rows[len(rows)-1]; last.A != "—" {
		t.Errorf("last row %q has an a-value; b's extra rows come last", last.Label)
	}
}
