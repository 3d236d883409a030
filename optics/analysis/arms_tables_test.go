package analysis

import (
	"testing"

	"raytable/optics/tables"
)

// TestArmsTables: a branching bench's report lays out an arms, an arm-elements and a meetings
// section in the text report and on the page, with the Michelson's numbers (0.5 mm OPD for arms
// at 100.25 and 100 mm, definition; 0.25 of the power on the detector arm, definition).
func TestArmsTables(t *testing.T) {
	b, arms := michelson(100.25, 100, nil, 632.8)
	tb := tables.Build(runArms(b, arms))
	for _, l := range []tables.Layout{tables.Text, tables.Page} {
		got := map[tables.Name]*tables.Section{}
		for _, s := range tb.In(l) {
			got[s.Name] = s
		}
		arm, el, meet := got[tables.Arms], got[tables.ArmElements], got[tables.Meetings]
		if arm == nil || el == nil || meet == nil {
			t.Fatalf("layout %v: sections %v, want arms, arm-elements and meetings", l, got)
		}
		if len(arm.Rows) != 3 || arm.Rows[2].Cells[3].In(tables.Text) != "0.2500" || arm.Rows[1].Cells[7].In(tables.Text) != "joins BSa.reflected at BS" {
			t.Errorf("arms rows %+v", arm.Rows)
		}
		if len(meet.Rows) != 1 || meet.Rows[0].Cells[0].In(tables.Text) != "BS" || meet.Rows[0].Cells[4].In(tables.Text) != "0.5" {
			t.Errorf("meetings row %v: want BS with OPD 0.5", meet.Rows[0].Cells[4].In(tables.Text))
		}
		if h := el.Rows[0].Cells[6].In(tables.Text); h != "75" {
			t.Errorf("height of the first arm element %s, want the table's 75 mm", h)
		}
	}
}
