package tables

import (
	"fmt"
	"sort"
	"strconv"
	"strings"

	"raytable/optics"
	"raytable/optics/numfmt"
)

// rayStatuses lists the ray statuses in the order the tables give them, with what each means.
var rayStatuses = []struct {
	status string
	words  string
}{
	{optics.RayOK, "ran through"},
	{optics.RayClipped, "cut by an aperture"},
	{optics.RayTIR, "totally reflected inside glass"},
	{optics.RayMissed, "missed a surface"},
}

// rayStatusSection counts the exact rays by status and says where they stopped.
func rayStatusSection(rays []optics.Ray) Section {
	sec := Section{
		Name:  RayStatus,
		Title: Phrase{Words: Words{Page: "Exact rays"}},
		Columns: []Column{
			{Head: Words{Page: "status"}, In: Page},
			{Head: Words{Page: "rays"}, In: Page | Compare}, // the compare page's row name says "rays" already
			{Head: Words{Page: "where they stopped"}, In: Page},
		},
	}
	counts := map[string]int{}
	where := map[string]map[string]int{}
	for _, ray := range rays {
		counts[ray.Status]++
		if ray.StoppedAt != "" {
			if where[ray.Status] == nil {
				where[ray.Status] = map[string]int{}
			}
			where[ray.Status][ray.StoppedAt]++
		}
	}
	for _, s := range rayStatuses {
		var places []string
		for id, c := range where[s.status] {
			places = append(places, fmt.Sprintf("%s (%d)", id, c))
		}
		sort.Strings(places)
		sec.Rows = append(sec.Rows, Row{
			Key:    "rays " + s.words,
			Cells:  []Cell{say(s.words), count(counts[s.status]), say(strings.Join(places, ", "))},
			Marked: s.status != optics.RayOK && counts[s.status] > 0,
			In:     Page | Compare,
		})
	}
	return sec
}

// stoppedRaysSection is the text report's ray summary: the counts by status as its heads, then
// every ray that did not run through, with where and why it stopped.
func stoppedRaysSection(rays []optics.Ray) Section {
	counts := map[string]int{}
	for _, ray := range rays {
		counts[ray.Status]++
	}
	sec := Section{
		Name:    StoppedRays,
		Title:   Phrase{Words: Words{Text: "RAYS"}},
		Columns: []Column{{In: Text}, {Head: Words{Text: strconv.Itoa(len(rays)) + " traced"}, In: Text}},
	}
	for _, s := range rayStatuses {
		sec.Columns = append(sec.Columns, Column{Head: Words{Text: s.status + " " + strconv.Itoa(counts[s.status])}, In: Text})
	}
	for _, ray := range rays {
		if ray.Status != optics.RayOK {
			sec.Rows = append(sec.Rows, Row{In: Text,
				Cells: []Cell{say(ray.Name), say(ray.Status + " at " + ray.StoppedAt), say(ray.Reason)}})
		}
	}
	return sec
}

// blurSection is how widely each fan lands on each screen beside the Airy radius; rows where the
// rays spread wider than a perfect image are marked.
// The Airy radius is left out (showAiry false) of the text report and the page for a collimated
// or virtual image, which has no diffraction spot on the screen.
func blurSection(bs []optics.Blur, showAiry bool) Section {
	sec := Section{
		Name:  Blur,
		Title: Phrase{Words: Words{Page: "Image blur at the screens", Text: "BLUR AT SCREENS"}},
		Columns: []Column{
			{Head: Words{Page: "screen"}, In: Text | Page},
			{Head: same("field"), In: Text | Page},
			{Head: same("wavelength"), Unit: NM, In: Text | Page},
			{Head: Words{Page: "rays arriving", Text: "rays"}, In: Text | Page},
			{Head: same("RMS"), Unit: UM, In: Everywhere},
			{Head: same("largest"), Unit: UM, In: Text | Page},
			{Head: same("Airy radius"), Unit: UM, In: Text | Page},
		},
		Note: Phrase{Words: Words{Page: "Spread of each exact fan about its centre in the table plane. Airy radius 1.22·λ/(2·NA') of a perfect image. Marked: wider than the Airy radius."}},
	}
	for _, b := range bs {
		airy := absent(Undefined)
		if b.AiryRadiusMM != nil && showAiry {
			airy = val(*b.AiryRadiusMM * 1000)
		}
		sec.Rows = append(sec.Rows, Row{
			Key: fmt.Sprintf("blur at %s, %s, %s nm", b.Element, b.Field, numfmt.Panel.Format(b.WavelengthNM)),
			Cells: []Cell{say(b.Element), say(b.Field), val(b.WavelengthNM), say(fmt.Sprintf("%d of %d", b.Rays, b.Traced)),
				val(b.RMSMM * 1000), val(b.PeakMM * 1000), airy},
			Marked: b.Rays > 0 && b.AiryRadiusMM != nil && b.RMSMM > *b.AiryRadiusMM,
			In:     Everywhere,
		})
	}
	return sec
}

// warningSection is the text report's list of warnings.
func warningSection(ws []optics.Warning) Section {
	sec := Section{
		Name:    Warnings,
		Title:   Phrase{Words: Words{Text: "WARNINGS"}},
		Columns: []Column{{In: Text}, {In: Text}, {In: Text}},
	}
	for _, w := range ws {
		sec.Rows = append(sec.Rows, Row{In: Text, Cells: []Cell{say("[" + string(w.Code) + "]"), say(w.Element), say(w.Message)}})
	}
	if len(ws) == 0 {
		sec.Rows = append(sec.Rows, Row{In: Text, Cells: []Cell{say("none")}})
	}
	return sec
}

// warningCountSection pairs the number of warnings of two designs.
func warningCountSection(ws []optics.Warning) Section {
	return Section{
		Name:    WarningCount,
		Columns: []Column{{In: Compare}},
		Rows:    []Row{{Key: "warnings", Cells: []Cell{count(len(ws))}, In: Compare}},
	}
}
