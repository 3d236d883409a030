package view

import (
	"net/url"
	"strings"

	"raytable/optics"
)

// MainArm is the arm the side view shows when none is asked for: the first source's own list.
const MainArm = "main"

// ArmLink is one arm of a branching bench as the side view's choice lists it.
type ArmLink struct {
	ID      string
	URL     string // the same page showing this arm's side view
	Current bool
	Note    string // what the list says beside the id: its source, where its height changes
}

// armIndex finds the arm with an id in the report; an unknown or empty id is the main arm.
func armIndex(r *optics.Report, id string) int {
	for i, a := range r.Arms {
		if a.ID == id {
			return i
		}
	}
	return 0
}

// KnownArm is id when it names an arm of the report other than the main one, else "": what a
// page asks for is kept only when it means something, so that it keys no more drawings than
// there are arms.
func KnownArm(r *optics.Report, id string) string {
	for i, a := range r.Arms {
		if a.ID == id && i > 0 {
			return id
		}
	}
	return ""
}

// SideReport is the report the side view draws for arm id: that arm's complete report
// (Report.ArmFull) when the analysis gave one, else the report itself (the main line, as every
// bench without arms has it).
func SideReport(r *optics.Report, id string) *optics.Report {
	i := armIndex(r, id)
	if i < len(r.ArmFull) && r.ArmFull[i] != nil {
		return r.ArmFull[i]
	}
	return r
}

// armLinks lists the arms for the side view's choice, each a link to the page showing it; none
// for a bench with one arm.
func armLinks(r *optics.Report, current string) []ArmLink {
	if len(r.Arms) < 2 {
		return nil
	}
	cur := armIndex(r, current)
	out := make([]ArmLink, len(r.Arms))
	for i, a := range r.Arms {
		out[i] = ArmLink{ID: a.ID, URL: "?arm=" + url.QueryEscape(a.ID), Current: i == cur, Note: armNote(r, i)}
	}
	return out
}

// armNote says where an arm's light comes from and where its height changes (a periscope).
func armNote(r *optics.Report, i int) string {
	a := r.Arms[i]
	var parts []string
	if a.Source != "source" {
		parts = append(parts, "from "+a.Source)
	}
	var lifts []string
	for _, e := range a.Elements {
		if e.Type == optics.TypePeriscope {
			lifts = append(lifts, e.ID)
		}
	}
	if len(lifts) > 0 {
		parts = append(parts, "height changes at "+strings.Join(lifts, ", "))
	}
	if a.Ends != "" {
		parts = append(parts, "ends "+a.Ends)
	}
	return strings.Join(parts, "; ")
}
