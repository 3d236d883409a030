package diagram

import (
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/optics/benchtest"
)

// The plan's cautions box names the power levels of a bench whose source states its power, after
// the standing advice, and nothing more for a bench that states none (README "Power").
func TestPlanCautionsNamePower(t *testing.T) {
	for _, tc := range []struct {
		bench string
		want  string // "" for none
	}{
		{"power-bench.json", "This bench carries up to 35 mW at 1064 nm; the strongest stray beam is 1.179 mW, reflected back by L1."},
		{"pickoff-bench.json", ""},
	} {
		r, err := analysis.Run(benchtest.Load(t, tc.bench))
		if err != nil {
			t.Fatal(err)
		}
		root := parseSVG(t, Plan(r))
		var lines []string
		for _, g := range root.byClass("cautions-text") {
			for _, c := range g.Children {
				lines = append(lines, c.Text)
			}
		}
		text := strings.Join(lines, " ")
		want := strings.Join(append([]string{optics.CautionText()}, optics.PowerLevels(r)...), " ")
		if text != want {
			t.Errorf("%s: cautions read %q, want %q", tc.bench, text, want)
		}
		if got := strings.Contains(text, tc.want); tc.want != "" && !got {
			t.Errorf("%s: cautions lack %q", tc.bench, tc.want)
		}
		if tc.want == "" && len(optics.PowerLevels(r)) != 0 {
			t.Errorf("%s states no power but has power levels %q", tc.bench, optics.PowerLevels(r))
		}
	}
}
