package view

import (
	"bytes"
	"context"
	"strings"
	"testing"

	"raytable/optics"
)

// The page's cautions box lists the power levels after the standing advice, one item each.
func TestCautionsListPowerLevels(t *testing.T) {
	r := &optics.Report{Power: &optics.PowerReport{
		Sources: []optics.SourcePowerLevel{{Source: optics.FirstSourceID, WavelengthNM: 532, AverageMW: 5, PeakMW: 5}},
		Strays:  []optics.StrayBeam{{Element: "M1", Kind: optics.StrayLeak, PowerMW: 0.05}},
	}}
	var buf bytes.Buffer
	if err := cautions(optics.PowerLevels(r)).Render(context.Background(), &buf); err != nil {
		t.Fatal(err)
	}
	html := buf.String()
	want := "This bench carries up to 5 mW at 532 nm; the strongest stray beam is 0.05 mW, leaking through M1."
	if strings.Count(html, `data-testid="power-level"`) != 2 || !strings.Contains(html, want) {
		t.Errorf("cautions box %q lacks the two power lines with %q", html, want)
	}
	if strings.Index(html, want) < strings.Index(html, optics.CautionLines[len(optics.CautionLines)-1]) {
		t.Error("the power levels come before the standing advice")
	}
}
