package view

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"raytable/optics"
)

// num writes a number for people: rounded to five significant digits, without an exponent for
// everyday sizes.
func num(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 5, 64), 64)
	if r == 0 {
		return "0" // also for -0 and values that round to zero
	}
	if a := math.Abs(r); a == 0 || (a >= 1e-4 && a < 1e9) {
		return strconv.FormatFloat(r, 'f', -1, 64)
	}
	return strconv.FormatFloat(r, 'g', -1, 64)
}

func optNum(v *float64) string {
	if v == nil {
		return "—"
	}
	return num(*v)
}

func percent(v float64) string { return num(v*100) + " %" }

// systemRow is one system value in both planes.
type systemRow struct {
	label string
	get   func(p *optics.PlaneValues) string
}

var systemRows = []systemRow{
	{"EFL (mm)", func(p *optics.PlaneValues) string { return optNum(p.EFLMM) }},
	{"BFL (mm)", func(p *optics.PlaneValues) string { return optNum(p.BFLMM) }},
	{"FFL (mm)", func(p *optics.PlaneValues) string { return optNum(p.FFLMM) }},
	{"front principal plane from the first vertex (mm)", func(p *optics.PlaneValues) string { return optNum(p.FrontPrincipalMM) }},
	{"rear principal plane from the last vertex (mm)", func(p *optics.PlaneValues) string { return optNum(p.RearPrincipalMM) }},
	{"image distance from the last vertex (mm)", func(p *optics.PlaneValues) string { return optNum(p.ImageDistanceMM) }},
	{"magnification", func(p *optics.PlaneValues) string { return optNum(p.Magnification) }},
	{"angular magnification", func(p *optics.PlaneValues) string { return optNum(p.AngularMagnification) }},
	{"aperture stop", func(p *optics.PlaneValues) string { return p.ApertureStop }},
	{"f-number", func(p *optics.PlaneValues) string { return optNum(p.FNumber) }},
	{"image-side NA", func(p *optics.PlaneValues) string { return optNum(p.ImageNA) }},
	{"entrance pupil from the first vertex (mm)", func(p *optics.PlaneValues) string { return optNum(p.EntrancePupilMM) }},
	{"entrance pupil radius (mm)", func(p *optics.PlaneValues) string { return optNum(p.EntrancePupilRadiusMM) }},
	{"exit pupil from the last vertex (mm)", func(p *optics.PlaneValues) string { return optNum(p.ExitPupilMM) }},
	{"exit pupil radius (mm)", func(p *optics.PlaneValues) string { return optNum(p.ExitPupilRadiusMM) }},
	{"image height (mm)", func(p *optics.PlaneValues) string { return optNum(p.ImageHeightMM) }},
	{"Lagrange invariant (mm)", func(p *optics.PlaneValues) string { return optNum(p.LagrangeInvariant) }},
}

// NumbersPanel lays out a report as the tables of the numbers panel.
func NumbersPanel(r *optics.Report) Numbers {
	var n Numbers
	n.Tables = append(n.Tables, systemTable(r))
	if len(r.Chromatic) > 1 {
		n.Tables = append(n.Tables, chromaticTable(r))
	}
	n.Tables = append(n.Tables, elementsTable(r))
	if len(r.Spacing) > 0 {
		n.Tables = append(n.Tables, spacingTable(r))
	}
	n.Tables = append(n.Tables, rayStatusTable(r))
	if len(r.Blur) > 0 {
		n.Tables = append(n.Tables, blurTable(r.Blur))
	}
	if r.Beam != nil {
		n.Tables = append(n.Tables, beamTable(r.Beam), waistTable(r.Beam))
	}
	if len(r.Placement) > 0 {
		n.Tables = append(n.Tables, placementTable(r.Placement))
	}
	if len(r.Media) > 0 {
		n.Tables = append(n.Tables, mediaTable(r.Media))
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

func systemTable(r *optics.Report) Table {
	t := Table{Title: "System", TestID: "system-values", Head: []string{"value", "in the table plane", "across it (sagittal)"}}
	if !r.System.Optical {
		t.Note = "The bench has no lens, thin lens or mirror, so it has no system values."
		return t
	}
	tan, sag := &r.System.PlaneValues, &r.System.Sagittal
	differ := false
	for _, row := range systemRows {
		a, b := row.get(tan), row.get(sag)
		if a == "—" && b == "—" {
			continue
		}
		cells := []string{row.label, a, "same"}
		if a != b {
			cells[2] = b
			differ = true
		}
		t.Rows = append(t.Rows, Row{Cells: cells, Marked: a != b})
	}
	if tan.Afocal {
		t.Note = "Afocal: parallel light leaves parallel, so there is no focal length."
	}
	if !differ {
		t.Head = t.Head[:2]
		for i := range t.Rows {
			t.Rows[i].Cells = t.Rows[i].Cells[:2]
		}
		t.Note = strings.TrimSpace(t.Note + " Both planes agree.")
	}
	return t
}

func chromaticTable(r *optics.Report) Table {
	t := Table{Title: "At each wavelength", TestID: "chromatic", Head: []string{"wavelength (nm)", "EFL (mm)", "BFL (mm)", "image distance (mm)"}}
	for _, c := range r.Chromatic {
		t.Rows = append(t.Rows, Row{Cells: []string{num(c.WavelengthNM), optNum(c.EFLMM), optNum(c.BFLMM), optNum(c.ImageDistanceMM)}})
	}
	return t
}

func elementsTable(r *optics.Report) Table {
	t := Table{
		Title: "Elements", TestID: "elements-table",
		Head: []string{"id", "type", "along the path (mm)", "table x (mm)", "table y (mm)", "heading in → out (°)",
			"marginal ray (mm)", "chief ray (mm)", "largest ray (mm)", "clear radius (mm)", "use of aperture"},
	}
	for _, e := range r.Elements {
		use := "—"
		if e.Clearance != nil {
			use = percent(*e.Clearance)
		}
		t.Rows = append(t.Rows, Row{
			Cells: []string{e.ID, e.Type, num(e.PathMM), num(e.TableXMM), num(e.TableYMM),
				num(e.HeadingInDeg) + " → " + num(e.HeadingOutDeg),
				num(e.MarginalYMM), num(e.ChiefYMM), num(e.MaxExactYMM), optNum(e.SemiDiameterMM), use},
			Marked: e.Clearance != nil && *e.Clearance > 1,
		})
	}
	t.Note = "Marked rows: exact rays reach beyond the clear aperture and are cut."
	return t
}

// spacingTable says how tightly each gap must be held, with the allowance it is measured against.
// The tightest gaps are marked.
func spacingTable(r *optics.Report) Table {
	b := r.SpacingBasis
	t := Table{Title: "Spacing tolerances at " + num(b.WavelengthNM) + " nm", TestID: "spacing"}
	tightest := math.Inf(1)
	for _, s := range r.Spacing {
		if s.ToleranceMM != nil {
			tightest = math.Min(tightest, *s.ToleranceMM)
		}
	}
	marked := func(s optics.SpacingTolerance) bool {
		return s.ToleranceMM != nil && *s.ToleranceMM <= tightest*(1+1e-9)
	}
	switch b.Kind {
	case optics.SpacingDepthOfFocus:
		t.Head = []string{"id", "gap (mm)", "image moves (mm per mm)", "defocus at " + b.Reference + " (mm per mm)", "hold the gap within ± (mm)"}
		for _, s := range r.Spacing {
			t.Rows = append(t.Rows, Row{Cells: []string{s.ID, num(s.GapMM), optNum(s.ImageShiftPerMM), optNum(s.DefocusPerMM), optNumOr(s.ToleranceMM, "not critical")}, Marked: marked(s)})
		}
		t.Note = fmt.Sprintf("Each gap changed alone, everything after it moving along. The tolerance keeps the image within the depth of focus ± %s mm at %s: λ/(2·NA'²) with image-side NA %s (Rayleigh's quarter-wave criterion). Not critical: the gap does not matter to first order. Marked: the tightest.",
			optNum(b.DepthOfFocusMM), b.Reference, optNum(b.ImageNA))
	case optics.SpacingDiffractionAngle:
		t.Head = []string{"id", "gap (mm)", "output divergence (µrad per mm)", "hold the gap within ± (mm)"}
		for _, s := range r.Spacing {
			div := "—"
			if s.DivergencePerMM != nil {
				div = num(*s.DivergencePerMM * 1e6)
			}
			t.Rows = append(t.Rows, Row{Cells: []string{s.ID, num(s.GapMM), div, optNumOr(s.ToleranceMM, "not critical")}, Marked: marked(s)})
		}
		div := "—"
		if b.DivergenceRad != nil {
			div = num(*b.DivergenceRad * 1e6)
		}
		t.Note = fmt.Sprintf("The output is collimated. Each gap changed alone, everything after it moving along. The tolerance keeps the output divergence within the beam's own diffraction angle, %s µrad = λ/(π·w) for an output radius w of %s mm. Not critical: the gap does not matter to first order. Marked: the tightest.",
			div, optNum(b.OutputRadiusMM))
	}
	return t
}

// blurTable shows how widely each fan lands on each screen beside the Airy radius; rows where
// the rays spread wider than a perfect image are marked.
func blurTable(bs []optics.Blur) Table {
	t := Table{Title: "Image blur at the screens", TestID: "blur",
		Head: []string{"screen", "field", "wavelength (nm)", "rays arriving", "RMS (µm)", "largest (µm)", "Airy radius (µm)"}}
	um := func(v float64) string { return num(v * 1000) }
	for _, b := range bs {
		airy := "—"
		if b.AiryRadiusMM != nil {
			airy = um(*b.AiryRadiusMM)
		}
		t.Rows = append(t.Rows, Row{
			Cells:  []string{b.Element, b.Field, num(b.WavelengthNM), fmt.Sprintf("%d of %d", b.Rays, b.Traced), um(b.RMSMM), um(b.PeakMM), airy},
			Marked: b.Rays > 0 && b.AiryRadiusMM != nil && b.RMSMM > *b.AiryRadiusMM,
		})
	}
	t.Note = "Spread of each exact fan about its centre in the table plane. Airy radius 1.22·λ/(2·NA') of a perfect image. Marked: wider than the Airy radius."
	return t
}

// statusWords says what each ray status means.
var statusWords = map[string]string{
	optics.RayOK:      "ran through",
	optics.RayClipped: "cut by an aperture",
	optics.RayTIR:     "totally reflected inside glass",
	optics.RayMissed:  "missed a surface",
}

func rayStatusTable(r *optics.Report) Table {
	t := Table{Title: "Exact rays", TestID: "ray-status", Head: []string{"status", "rays", "where they stopped"}}
	counts := map[string]int{}
	where := map[string]map[string]int{}
	for _, ray := range r.Rays {
		counts[ray.Status]++
		if ray.StoppedAt != "" {
			if where[ray.Status] == nil {
				where[ray.Status] = map[string]int{}
			}
			where[ray.Status][ray.StoppedAt]++
		}
	}
	for _, s := range []string{optics.RayOK, optics.RayClipped, optics.RayTIR, optics.RayMissed} {
		var places []string
		for id, c := range where[s] {
			places = append(places, fmt.Sprintf("%s (%d)", id, c))
		}
		sort.Strings(places)
		t.Rows = append(t.Rows, Row{Cells: []string{statusWords[s], strconv.Itoa(counts[s]), strings.Join(places, ", ")}, Marked: s != optics.RayOK && counts[s] > 0})
	}
	return t
}

func beamTable(b *optics.BeamReport) Table {
	t := Table{
		Title: fmt.Sprintf("Laser beam at %s nm, M² %s (leaving each element)", num(b.WavelengthNM), num(b.M2)), TestID: "beam-table",
		Head: []string{"id", "radius in plane (mm)", "radius across (mm)", "wavefront radius in plane (mm)", "wavefront radius across (mm)", "power passed"},
	}
	for _, e := range b.Elements {
		t.Rows = append(t.Rows, Row{Cells: []string{e.ID, num(e.WTMM), num(e.WSMM), optNumOr(e.RTMM, "flat"), optNumOr(e.RSMM, "flat"), percent(e.Transmitted)}, Marked: e.Transmitted < 0.99})
	}
	return t
}

func optNumOr(v *float64, none string) string {
	if v == nil {
		return none
	}
	return num(*v)
}

func waistTable(b *optics.BeamReport) Table {
	t := Table{Title: "Beam waists", TestID: "waists", Head: []string{"after", "along the path (mm)", "radius in plane (mm)", "radius across (mm)", "Rayleigh range in plane (mm)", "Rayleigh range across (mm)"}}
	for _, w := range b.Waists {
		after := "the source"
		if w.After != nil {
			after = *w.After
		}
		t.Rows = append(t.Rows, Row{Cells: []string{after, num(w.PathMM), optNum(w.RadiusTMM), optNum(w.RadiusSMM), optNum(w.RayleighTMM), optNum(w.RayleighSMM)}})
	}
	if len(b.Waists) == 0 {
		t.Note = "No waist between the source and the last element."
	}
	return t
}

func placementTable(ps []optics.Placement) Table {
	t := Table{Title: "Placement on the breadboard", TestID: "placement", Head: []string{"id", "type", "x (mm)", "y (mm)", "heading (°)", "hole column", "hole row", "offset x (mm)", "offset y (mm)"}}
	for _, p := range ps {
		col, row := "—", "—"
		if p.HoleColumn > 0 {
			col, row = strconv.Itoa(p.HoleColumn), strconv.Itoa(p.HoleRow)
		}
		t.Rows = append(t.Rows, Row{Cells: []string{p.ID, p.Type, num(p.TableXMM), num(p.TableYMM), num(p.HeadingDeg), col, row, num(p.OffsetXMM), num(p.OffsetYMM)}})
	}
	return t
}

func mediaTable(ms []optics.MediumIndex) Table {
	t := Table{Title: "Media", TestID: "media", Head: []string{"material", "wavelength (nm)", "index", "within its data range"}}
	for _, m := range ms {
		in := "yes"
		if !m.InRange {
			in = "no"
		}
		t.Rows = append(t.Rows, Row{Cells: []string{m.Material, num(m.WavelengthNM), strconv.FormatFloat(m.Index, 'f', 6, 64), in}, Marked: !m.InRange})
	}
	return t
}
