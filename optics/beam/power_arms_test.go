package beam_test

import (
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/optics/benchtest"
	"raytable/optics/internal/approx"
)

const tol = 1e-9

// A 4 % pick-off plate (testdata/pickoff-bench.json) with a 100 mW source and a 1 % back face:
// the reflected arm gets 0.04 of the power (the plate's split), the main line 0.96 × 0.99, and
// every stray beam its mW: the plate's back face 100 × 0.96 × 0.01, M1's leak through its 0.99
// reflectance, the thin lens's two AR faces of 0.25 % (README "Power", self-consistency).
func TestPickOffPower(t *testing.T) {
	b := benchtest.Load(t, "pickoff-bench.json")
	b.Source.PowerMW = new(100.0)
	b.Elements[0].FaceReflectance = new(0.01)
	r, err := analysis.Run(b)
	if err != nil {
		t.Fatal(err)
	}
	arm := r.Arms[1]
	if arm.ID != "PO1.reflected" || !approx.Abs(arm.PowerFraction, 0.04, tol) {
		t.Fatalf("arm %s with %v of the power, want PO1.reflected with 0.04", arm.ID, arm.PowerFraction)
	}
	ar := optics.ARFaceReflectance
	for _, tc := range []struct {
		rows []optics.BeamAt
		id   string
		want float64
	}{
		{arm.Beam.Elements, "F1", 0.04},
		{arm.Beam.Elements, "PD", 0.04 * (1 - ar) * (1 - ar)},
		{r.Beam.Elements, "PO1", 1},
		{r.Beam.Elements, "M1", 0.96 * 0.99},
		{r.Beam.Elements, "D1", 0.96 * 0.99 * optics.DefaultMirrorReflectance},
	} {
		row, ok := find(tc.rows, tc.id)
		if !ok || !approx.Abs(row.PowerFraction, tc.want, tol) {
			t.Errorf("%s: power_fraction %v, want %v", tc.id, row.PowerFraction, tc.want)
			continue
		}
		// 2P/(π w_t w_s) of the arriving beam (definition of the 1/e² radius), P in W, w in cm.
		want := 2 * (tc.want * 0.1) / (3.141592653589793 * row.ArrivingWTMM / 10 * row.ArrivingWSMM / 10)
		if row.PeakIrradianceWCM2 == nil || !approx.Rel(*row.PeakIrradianceWCM2, want, tol) {
			t.Errorf("%s: peak irradiance %v, want %v W/cm²", tc.id, row.PeakIrradianceWCM2, want)
		}
		if row.PeakFluenceJCM2 != nil {
			t.Errorf("%s: a steady laser has no pulse fluence, got %v", tc.id, *row.PeakFluenceJCM2)
		}
	}

	want := map[string]float64{
		"ghost PO1": 100 * 0.96 * 0.01,
		"leak M1":   100 * 0.96 * 0.99 * 0.01,
		"ghost F1":  100 * 0.04 * (1 - (1-ar)*(1-ar)),
	}
	got := map[string]float64{}
	for _, s := range r.Power.Strays {
		got[s.Kind+" "+s.Element] += s.PowerMW
	}
	for k, w := range want {
		if !approx.Abs(got[k], w, tol) {
			t.Errorf("stray %s: %v mW, want %v", k, got[k], w)
		}
	}
	if s := r.Power.Strays[0]; s.Element != "PO1" || s.Kind != optics.StrayGhost {
		t.Errorf("strongest stray %+v, want PO1's ghost", s)
	}
	leak, ok := findWarning(r.Warnings, optics.WarnMirrorLeak, "M1")
	if !ok || !strings.Contains(leak.Message, "0.9504 mW") {
		t.Errorf("M1's leak warning %q, want 0.9504 mW", leak.Message)
	}
	lines := optics.PowerLevels(r)
	if len(lines) != 2 || lines[0] != "This bench carries up to 100 mW at 1064 nm; the strongest stray beam is 0.96 mW, reflected back by PO1." ||
		!strings.Contains(lines[1], "IEC 60825-1") {
		t.Errorf("power levels %q", lines)
	}
}

// A ghost that comes to a focus near the source carries the power its face reflects: a bare face
// of n = 1.5 sends back 4 % (Fresnel, from memory) of the 20 mW arriving.
func TestGhostCarriesPower(t *testing.T) {
	b := &optics.Bench{
		Format: optics.FormatBenchV1, WavelengthsNM: []float64{1064},
		Table:     optics.Table{Grid: optics.GridNone, WidthMM: 600, DepthMM: 300, BeamHeightMM: 80},
		Source:    optics.Source{XMM: 10, YMM: 150, Kind: optics.SourceCollimated, SemiDiameterMM: new(1.0), PowerMW: new(20.0)},
		Materials: map[string]optics.MaterialSpec{"n15": {Index: new(1.5)}},
		Elements: []optics.Element{
			{ID: "L", Type: optics.TypeLens, GapMM: 10, FacesMM: []*float64{new(-40.0), nil}, ThicknessesMM: []float64{3}, Materials: []string{"n15"}, Coating: optics.CoatingNone},
			{ID: "D", Type: optics.TypeDump, GapMM: 100},
		},
	}
	r, err := analysis.Run(b)
	if err != nil {
		t.Fatal(err)
	}
	w, ok := findWarning(r.Warnings, optics.WarnBackReflectionFocus, "L")
	if !ok || !strings.Contains(w.Message, "The ghost carries about 0.8 mW.") {
		t.Errorf("back-reflection warning %q, want 0.8 mW (4 %% of 20 mW)", w.Message)
	}
}

// Pulses give the peak fluence 2E/(π w_t w_s) and warn at half an element's damage threshold
// (common practice).
func TestDamageWarning(t *testing.T) {
	b := benchtest.Load(t, "pickoff-bench.json")
	b.Source.Pulse = &optics.Pulse{EnergyUJ: 1000, DurationNS: 10, RateHz: 10}
	b.Elements[1].DamageJCM2 = new(0.1)  // M1: far below what 1 mJ on a 1 mm beam gives
	b.Elements[1].DamageWCM2 = new(1e12) // but its irradiance limit is far away
	r, err := analysis.Run(b)
	if err != nil {
		t.Fatal(err)
	}
	row, _ := find(r.Beam.Elements, "M1")
	if row.PeakFluenceJCM2 == nil {
		t.Fatal("no fluence on M1")
	}
	want := 2 * (row.PowerFraction * 1e-3) / (3.141592653589793 * row.ArrivingWTMM / 10 * row.ArrivingWSMM / 10)
	if !approx.Rel(*row.PeakFluenceJCM2, want, tol) {
		t.Errorf("fluence %v, want %v J/cm²", *row.PeakFluenceJCM2, want)
	}
	var damage []optics.Warning
	for _, w := range r.Warnings {
		if w.Code == optics.WarnDamageRisk {
			damage = append(damage, w)
		}
	}
	if len(damage) != 1 || damage[0].Element != "M1" || !strings.Contains(damage[0].Message, "fluence") {
		t.Errorf("damage warnings %v, want one on M1's fluence", damage)
	}
}

func find(rows []optics.BeamAt, id string) (optics.BeamAt, bool) {
	for _, r := range rows {
		if r.ID == id {
			return r, true
		}
	}
	return optics.BeamAt{}, false
}

func findWarning(ws []optics.Warning, code optics.WarningCode, id string) (optics.Warning, bool) {
	for _, w := range ws {
		if w.Code == code && w.Element == id {
			return w, true
		}
	}
	return optics.Warning{}, false
}
