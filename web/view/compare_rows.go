package view

import (
	"fmt"
	"math"

	"raytable/optics"
)

// item is one number of a report, named so that the same number of two reports can be paired.
type item struct {
	key  string
	num  *float64 // nil when the value is text (or absent)
	text string
}

// ptr gives a computed value the pointer form that optional report values have.
func ptr(v float64) *float64 { return &v }

// reportItems lists every number of a report that the compare page shows, in a fixed order.
func reportItems(r *optics.Report) []item {
	var out []item
	addNum := func(key string, v *float64) { out = append(out, item{key: key, num: v, text: optNum(v)}) }
	addText := func(key, s string) { out = append(out, item{key: key, text: s}) }
	for _, plane := range []struct {
		name string
		p    *optics.PlaneValues
	}{{"", &r.System.PlaneValues}, {"sagittal ", &r.System.Sagittal}} {
		p := plane.p
		addNum(plane.name+"EFL (mm)", p.EFLMM)
		addNum(plane.name+"BFL (mm)", p.BFLMM)
		addNum(plane.name+"FFL (mm)", p.FFLMM)
		addNum(plane.name+"front principal plane (mm)", p.FrontPrincipalMM)
		addNum(plane.name+"rear principal plane (mm)", p.RearPrincipalMM)
		addNum(plane.name+"image distance (mm)", p.ImageDistanceMM)
		addNum(plane.name+"magnification", p.Magnification)
		addText(plane.name+"aperture stop", p.ApertureStop)
		addNum(plane.name+"f-number", p.FNumber)
		addNum(plane.name+"image-side NA", p.ImageNA)
	}
	for _, e := range r.Elements {
		k := e.ID + " "
		addNum(k+"along the path (mm)", ptr(e.PathMM))
		addNum(k+"table x (mm)", ptr(e.TableXMM))
		addNum(k+"table y (mm)", ptr(e.TableYMM))
		addNum(k+"heading out (°)", ptr(e.HeadingOutDeg))
		addNum(k+"marginal ray (mm)", ptr(e.MarginalYMM))
		addNum(k+"chief ray (mm)", ptr(e.ChiefYMM))
		addNum(k+"largest ray (mm)", ptr(e.MaxExactYMM))
		if e.Clearance != nil {
			addNum(k+"use of aperture (%)", ptr(*e.Clearance*100))
		}
	}
	counts := map[string]float64{}
	for _, ray := range r.Rays {
		counts[ray.Status]++
	}
	for _, s := range []string{optics.RayOK, optics.RayClipped, optics.RayTIR, optics.RayMissed} {
		addNum("rays "+statusWords[s], ptr(counts[s]))
	}
	for _, b := range r.Blur {
		k := fmt.Sprintf("blur at %s, %s, %s nm ", b.Element, b.Field, num(b.WavelengthNM))
		addNum(k+"RMS (µm)", ptr(b.RMSMM*1000))
	}
	for _, sp := range r.Spacing {
		addNum(sp.ID+" gap tolerance ± (mm)", sp.ToleranceMM)
	}
	if r.Beam != nil {
		for _, e := range r.Beam.Elements {
			addNum(e.ID+" beam radius in plane (mm)", ptr(e.WTMM))
			addNum(e.ID+" beam radius across (mm)", ptr(e.WSMM))
			addNum(e.ID+" power passed (%)", ptr(e.Transmitted*100))
		}
		for i, w := range r.Beam.Waists {
			k := fmt.Sprintf("waist %d ", i+1)
			addNum(k+"along the path (mm)", ptr(w.PathMM))
			addNum(k+"radius in plane (mm)", w.RadiusTMM)
			addNum(k+"radius across (mm)", w.RadiusSMM)
		}
	}
	for _, p := range r.Placement {
		addText(p.ID+" hole (column, row)", fmt.Sprintf("%d, %d", p.HoleColumn, p.HoleRow))
	}
	addNum("warnings", ptr(float64(len(r.Warnings))))
	return out
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
				row.Diff = signed(d)
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

func signed(d float64) string {
	if d > 0 {
		return "+" + num(d)
	}
	return num(d)
}
