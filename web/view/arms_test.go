package view

import (
	"strings"
	"testing"

	"raytable/optics"
)

func TestArmChoice(t *testing.T) {
	parent := "main"
	main, reflected := &optics.Report{Title: "main line"}, &optics.Report{Title: "reflected arm"}
	r := &optics.Report{
		Arms: []optics.ArmReport{
			{ID: "main", Source: "source"},
			{ID: "BS1.reflected", Parent: &parent, Source: "source", Ends: optics.ArmOpen,
				Elements: []optics.ElementPlace{{ID: "P1", Type: optics.TypePeriscope}}},
			{ID: "G", Source: "G"},
		},
		ArmFull: []*optics.Report{main, reflected, nil},
	}
	cases := []struct {
		ask, known string
		side       *optics.Report
		current    int
	}{
		{"", "", main, 0},
		{"main", "", main, 0},
		{"BS1.reflected", "BS1.reflected", reflected, 1},
		{"G", "G", r, 2}, // no complete report of its own: the report itself
		{"nowhere", "", main, 0},
	}
	for _, c := range cases {
		if got := KnownArm(r, c.ask); got != c.known {
			t.Errorf("KnownArm(%q) = %q, want %q", c.ask, got, c.known)
		}
		if got := SideReport(r, c.ask); got != c.side {
			t.Errorf("arm %q: the side view draws %q", c.ask, got.Title)
		}
		links := armLinks(r, c.ask)
		for i, l := range links {
			if l.Current != (i == c.current) {
				t.Errorf("arm %q: link %s current %v", c.ask, l.ID, l.Current)
			}
		}
	}
	links := armLinks(r, "")
	if links[1].URL != "?arm=BS1.reflected" || !strings.Contains(links[1].Note, "height changes at P1") || !strings.Contains(links[2].Note, "from G") {
		t.Errorf("links %+v", links)
	}
	if armLinks(&optics.Report{Arms: r.Arms[:1]}, "") != nil {
		t.Error("a bench with one arm offers a choice of arms")
	}
}
