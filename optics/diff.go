package optics

import (
	"fmt"
	"strings"
)

// Diff lists what changed from old to new, one plain line per change, for the history of a design:
//
//	title changed
//	wavelengths_nm 632.8 -> 632.8, 532
//	source.semi_diameter_mm 1 -> 1.5
//	added material my-glass
//	removed A1
//	added F3 (thin-lens) at position 4
//	moved M2 from 5 to 3
//	moved M3 to after L4   (when its position number did not change)
//	L2 gap_mm 150 -> 162.5
//
// Elements are matched by id. Positions are counted from 1 in the element list. An element counts
// as moved only when its order relative to the other kept elements changed (the elements outside a
// longest common subsequence of the two orders), so inserting or removing one element does not
// make every later one "moved". Lines come in a fixed order: format, title, notes, wavelengths,
// table, source, materials, then removed, added, moved and changed elements. A nil bench is empty.
// Diff does not require valid benches and never panics.
func Diff(old, new *Bench) []string {
	if old == nil {
		old = &Bench{}
	}
	if new == nil {
		new = &Bench{}
	}
	d := &differ{}
	d.str("format", old.Format, new.Format)
	if old.Title != new.Title {
		d.line("title changed")
	}
	if old.Notes != new.Notes {
		d.line("notes changed")
	}
	d.nums("wavelengths_nm", old.WavelengthsNM, new.WavelengthsNM)
	d.table(&old.Table, &new.Table)
	d.source(&old.Source, &new.Source)
	d.materials(old.Materials, new.Materials)
	d.elements(old.Elements, new.Elements)
	return d.lines
}

type differ struct{ lines []string }

func (d *differ) line(format string, args ...any) {
	d.lines = append(d.lines, fmt.Sprintf(format, args...))
}

func (d *differ) change(path, from, to string) {
	if from != to {
		d.line("%s %s -> %s", path, from, to)
	}
}

func (d *differ) str(path, a, b string) {
	if a != b {
		d.change(path, quoteIfOdd(a), quoteIfOdd(b))
	}
}

func (d *differ) num(path string, a, b float64) { d.change(path, fmtNum(a), fmtNum(b)) }

func (d *differ) optNum(path string, a, b *float64, none string) {
	d.change(path, optText(a, none), optText(b, none))
}

func (d *differ) nums(path string, a, b []float64) { d.change(path, numsText(a), numsText(b)) }

func optText(x *float64, none string) string {
	if x == nil {
		return none
	}
	return fmtNum(*x)
}

func numsText(xs []float64) string {
	if len(xs) == 0 {
		return "none"
	}
	parts := make([]string, len(xs))
	for i, x := range xs {
		parts[i] = fmtNum(x)
	}
	return strings.Join(parts, ", ")
}

// quoteIfOdd shows an empty or spaced string in quotes so that the line stays readable.
func quoteIfOdd(s string) string {
	if s == "" || strings.ContainsAny(s, " \t\n\"") {
		return fmt.Sprintf("%q", s)
	}
	return s
}

func (d *differ) table(a, b *Table) {
	d.str("table.grid", a.Grid, b.Grid)
	d.num("table.width_mm", a.WidthMM, b.WidthMM)
	d.num("table.depth_mm", a.DepthMM, b.DepthMM)
	d.num("table.beam_height_mm", a.BeamHeightMM, b.BeamHeightMM)
	d.optNum("table.hole_offset_mm", a.HoleOffsetMM, b.HoleOffsetMM, "default")
}

func (d *differ) source(a, b *Source) {
	d.num("source.x_mm", a.XMM, b.XMM)
	d.num("source.y_mm", a.YMM, b.YMM)
	d.num("source.heading_deg", a.HeadingDeg, b.HeadingDeg)
	d.str("source.kind", a.Kind, b.Kind)
	d.optNum("source.semi_diameter_mm", a.SemiDiameterMM, b.SemiDiameterMM, "none")
	d.nums("source.field_angles_deg", a.FieldAnglesDeg, b.FieldAnglesDeg)
	d.optNum("source.na", a.NA, b.NA, "none")
	d.nums("source.object_heights_mm", a.ObjectHeightsMM, b.ObjectHeightsMM)
	d.change("source.fan_rays", fmt.Sprint(a.FanRayCount()), fmt.Sprint(b.FanRayCount()))
	for i := range max(len(a.Rays), len(b.Rays)) {
		p := index("source.rays", i)
		switch {
		case i >= len(a.Rays):
			d.line("added %s", p)
		case i >= len(b.Rays):
			d.line("removed %s", p)
		default:
			ra, rb := a.Rays[i], b.Rays[i]
			d.num(field(p, "height_mm"), ra.HeightMM, rb.HeightMM)
			d.num(field(p, "angle_deg"), ra.AngleDeg, rb.AngleDeg)
			d.num(field(p, "x_mm"), ra.XMM, rb.XMM)
			d.num(field(p, "x_angle_deg"), ra.XAngleDeg, rb.XAngleDeg)
		}
	}
	switch {
	case a.Beam == nil && b.Beam != nil:
		d.line("added source.beam")
	case a.Beam != nil && b.Beam == nil:
		d.line("removed source.beam")
	case a.Beam != nil && b.Beam != nil:
		d.num("source.beam.waist_radius_mm", a.Beam.WaistRadiusMM, b.Beam.WaistRadiusMM)
		d.num("source.beam.waist_at_mm", a.Beam.WaistAtMM, b.Beam.WaistAtMM)
		d.num("source.beam.m2", a.Beam.BeamQuality(), b.Beam.BeamQuality())
	}
}

func (d *differ) materials(a, b map[string]MaterialSpec) {
	names := sortedKeys(a)
	for _, name := range sortedKeys(b) {
		if _, ok := a[name]; !ok {
			names = append(names, name)
		}
	}
	for _, name := range names {
		ma, inA := a[name]
		mb, inB := b[name]
		switch {
		case !inA:
			d.line("added material %s", quoteIfOdd(name))
		case !inB:
			d.line("removed material %s", quoteIfOdd(name))
		default:
			p := materialPath(name)
			var ab, ac, bb, bc []float64
			if ma.Sellmeier != nil {
				ab, ac = ma.Sellmeier.B, ma.Sellmeier.CUM2
			}
			if mb.Sellmeier != nil {
				bb, bc = mb.Sellmeier.B, mb.Sellmeier.CUM2
			}
			d.nums(field(p, "sellmeier.b"), ab, bb)
			d.nums(field(p, "sellmeier.c_um2"), ac, bc)
			d.nums(field(p, "range_nm"), ma.RangeNM, mb.RangeNM)
			d.optNum(field(p, "nd"), ma.ND, mb.ND, "none")
			d.optNum(field(p, "vd"), ma.VD, mb.VD, "none")
			d.optNum(field(p, "index"), ma.Index, mb.Index, "none")
		}
	}
}

func (d *differ) elements(a, b []Element) {
	posA, posB := firstPositions(a), firstPositions(b)
	for i, e := range a {
		if _, ok := posB[e.ID]; !ok || posA[e.ID] != i {
			d.line("removed %s", quoteIfOdd(e.ID))
		}
	}
	for i, e := range b {
		if _, ok := posA[e.ID]; !ok || posB[e.ID] != i {
			d.line("added %s (%s) at position %d", quoteIfOdd(e.ID), e.Type, i+1)
		}
	}
	// Kept elements, in old and in new order; those outside the longest common subsequence moved.
	var keptA, keptB []string
	for i, e := range a {
		if _, ok := posB[e.ID]; ok && posA[e.ID] == i {
			keptA = append(keptA, e.ID)
		}
	}
	for i, e := range b {
		if _, ok := posA[e.ID]; ok && posB[e.ID] == i {
			keptB = append(keptB, e.ID)
		}
	}
	stay := lcs(keptA, keptB)
	for _, id := range keptB {
		if stay[id] {
			continue
		}
		from, to := posA[id]+1, posB[id]+1
		switch {
		case from != to:
			d.line("moved %s from %d to %d", quoteIfOdd(id), from, to)
		case to == 1:
			d.line("moved %s to the front", quoteIfOdd(id))
		default: // same number, other neighbours: say where it went
			d.line("moved %s to after %s", quoteIfOdd(id), quoteIfOdd(b[to-2].ID))
		}
	}
	for _, id := range keptB {
		d.element(quoteIfOdd(id), &a[posA[id]], &b[posB[id]])
	}
}

// firstPositions maps each id to the index of its first element. Later elements with the same id
// (only in an invalid bench) are treated as unmatched.
func firstPositions(els []Element) map[string]int {
	pos := make(map[string]int, len(els))
	for i, e := range els {
		if _, dup := pos[e.ID]; !dup {
			pos[e.ID] = i
		}
	}
	return pos
}

// lcs returns the members of a longest common subsequence of two lists of distinct ids, by the
// textbook dynamic programme (O(len(a)·len(b)), at most 200² steps for a valid bench).
func lcs(a, b []string) map[string]bool {
	n, m := len(a), len(b)
	table := make([][]int, n+1)
	for i := range table {
		table[i] = make([]int, m+1)
	}
	for i := n - 1; i >= 0; i-- {
		for j := m - 1; j >= 0; j-- {
			if a[i] == b[j] {
				table[i][j] = table[i+1][j+1] + 1
			} else {
				table[i][j] = max(table[i+1][j], table[i][j+1])
			}
		}
	}
	keep := map[string]bool{}
	for i, j := 0, 0; i < n && j < m; {
		switch {
		case a[i] == b[j]:
			keep[a[i]] = true
			i++
			j++
		case table[i+1][j] >= table[i][j+1]:
			i++
		default:
			j++
		}
	}
	return keep
}

// element lists the field changes of one kept element, prefixed by its id.
func (d *differ) element(id string, a, b *Element) {
	p := func(key string) string { return id + " " + key }
	d.str(p("type"), a.Type, b.Type)
	d.num(p("gap_mm"), a.GapMM, b.GapMM)
	d.change(p("faces_mm"), facesText(a.FacesMM), facesText(b.FacesMM))
	d.nums(p("thicknesses_mm"), a.ThicknessesMM, b.ThicknessesMM)
	d.change(p("materials"), namesText(a.Materials), namesText(b.Materials))
	d.optNum(p("focal_mm"), a.FocalMM, b.FocalMM, "none")
	d.optNum(p("radius_mm"), a.RadiusMM, b.RadiusMM, "flat")
	d.optNum(p("turn_deg"), a.TurnDeg, b.TurnDeg, "none")
	d.optNum(p("diameter_mm"), a.DiameterMM, b.DiameterMM, "none")
	d.optNum(p("width_mm"), a.WidthMM, b.WidthMM, "none")
	d.change(p("mount"), mountText(a.Mount), mountText(b.Mount))
}

func facesText(faces []*float64) string {
	if len(faces) == 0 {
		return "none"
	}
	parts := make([]string, len(faces))
	for i, r := range faces {
		parts[i] = optText(r, "flat")
	}
	return strings.Join(parts, ", ")
}

func namesText(names []string) string {
	if len(names) == 0 {
		return "none"
	}
	parts := make([]string, len(names))
	for i, n := range names {
		parts[i] = quoteIfOdd(n)
	}
	return strings.Join(parts, ", ")
}

func mountText(m *Mount) string {
	if m == nil {
		return "none"
	}
	return fmtNum(m.WidthMM) + " x " + fmtNum(m.DepthMM) + " mm"
}
