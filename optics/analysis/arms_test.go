package analysis

import (
	"math"
	"testing"

	"raytable/optics"
	"raytable/optics/material"
)

func f64(v float64) *float64 { return &v }

// plate is a flat glass plate (a compensator) in the reflected arm, gapMM after the splitter.
type plate struct{ thicknessMM, gapMM float64 }

// michelson builds a 50/50 Michelson by hand as the linear arms ARMS.md describes: arm main goes
// through BS to M1 (L1 from BS) and back through BS, whose transmitted port is left open; arm
// BS.reflected to M2 (L2 from BS) and back through BS, transmitted onto the detector, joining
// BSa.reflected, which is main's return reflected by BS onto the detector D. With a plate, the
// reflected arm holds a flat plate passed there and back, with the gaps shortened so that the
// mirrors stay put.
func michelson(l1, l2 float64, pl *plate, wavelengthNM float64) (*optics.Bench, []optics.Arm) {
	src := optics.Source{XMM: 100, YMM: 300, Kind: optics.SourceCollimated, SemiDiameterMM: f64(1), FieldAnglesDeg: []float64{0},
		Beam: &optics.Beam{WaistRadiusMM: 1}}
	bench := func(title string, es ...optics.Element) *optics.Bench {
		return &optics.Bench{Format: optics.FormatBenchV1, Title: title, WavelengthsNM: []float64{wavelengthNM},
			Table: optics.Table{Grid: optics.GridMetric25, WidthMM: 900, DepthMM: 600, BeamHeightMM: 75}, Source: src, Elements: es}
	}
	split := func(id string, gap float64) optics.Element {
		return optics.Element{ID: id, Type: optics.TypeSplitter, GapMM: gap, TurnDeg: f64(90), Reflect: f64(0.5)}
	}
	mirror := func(id string, gap, turn float64) optics.Element {
		return optics.Element{ID: id, Type: optics.TypeMirror, GapMM: gap, TurnDeg: f64(turn)}
	}
	glass := func(id string, gap, t float64) optics.Element {
		return optics.Element{ID: id, Type: optics.TypeLens, GapMM: gap, FacesMM: []*float64{nil, nil}, ThicknessesMM: []float64{t}, Materials: []string{material.FusedSilica}}
	}
	out, back := []optics.Element{mirror("M2", l2, 180)}, []optics.Element{split("BSb", l2)}
	parts := []string{"BS", "M2", "BS"}
	if pl != nil {
		rest := l2 - pl.gapMM - pl.thicknessMM
		out = []optics.Element{glass("C", pl.gapMM, pl.thicknessMM), mirror("M2", rest, 180)}
		back = []optics.Element{glass("Cb", rest, pl.thicknessMM), split("BSb", pl.gapMM)}
		parts = []string{"BS", "C", "M2", "C", "BS"}
	}
	main := bench("michelson", split("BS", 50), mirror("M1", l1, 180), split("BSa", l1))
	refl := bench("michelson", append(append([]optics.Element{mirror("BS", 50, 90)}, out...), back...)...)
	det := bench("michelson", split("BS", 50), mirror("M1", l1, 180), mirror("BSa", l1, 90), optics.Element{ID: "D", Type: optics.TypeScreen, GapMM: 50})
	return main, []optics.Arm{
		{ID: "main", Source: "source", Bench: main, Part: []string{"BS", "M1", "BS"}, PowerFraction: 1},
		{ID: "BS.reflected", Parent: "main", Source: "source", Bench: refl, Own: 1, Part: parts, PowerFraction: 0.5, JoinsArm: "BSa.reflected", JoinsAt: "BS"},
		{ID: "BSa.reflected", Parent: "main", Source: "source", Bench: det, Own: 3, Part: []string{"BS", "M1", "BS", "D"}, PowerFraction: 0.25},
	}
}

func meetingAt(t *testing.T, r *optics.Report, part string) optics.Meeting {
	t.Helper()
	for _, m := range r.Meetings {
		if m.Part == part {
			return m
		}
	}
	t.Fatalf("no meeting at %s in %+v", part, r.Meetings)
	return optics.Meeting{}
}

// TestMichelsonPathDifference: the optical path difference of a Michelson in air is 2·(L1 − L2)
// (definition: each beam goes to its mirror and back), and the two beams leave the splitter
// together, at no angle, reached exactly.
func TestMichelsonPathDifference(t *testing.T) {
	for _, tc := range []struct{ l1, l2, want float64 }{
		{100.25, 100, 0.5}, // arms at 100.25 and 100 mm: 0.5 mm
		{100, 100, 0},
		{80, 120, -80},
	} {
		b, arms := michelson(tc.l1, tc.l2, nil, 632.8)
		r := runArms(b, arms)
		m := meetingAt(t, r, "BS")
		if m.OPDMM == nil || math.Abs(*m.OPDMM-tc.want) > 1e-9 {
			t.Errorf("L1 %v, L2 %v: OPD %v, want %v mm (2·(L1 − L2), definition)", tc.l1, tc.l2, m.OPDMM, tc.want)
		}
		if m.AngleMRad == nil || *m.AngleMRad > 1e-9 || m.MissMM > 1e-9 {
			t.Errorf("L1 %v, L2 %v: angle %v mrad, miss %v mm, want 0 and 0 (aligned by construction)", tc.l1, tc.l2, m.AngleMRad, m.MissMM)
		}
		if len(m.Arms) != 3 || m.TableXMM != 150 || m.TableYMM != 300 {
			t.Errorf("meeting %+v, want three arms at (150, 300) mm", m)
		}
		// Group delay in air is the path difference over c (n_g = 1, definition).
		if wantFS := 1000 * tc.want / material.SpeedOfLightMMPerPS; m.GroupDelayFS == nil || math.Abs(*m.GroupDelayFS-wantFS) > 1e-6 {
			t.Errorf("delay %v fs, want %v", m.GroupDelayFS, wantFS)
		}
	}
}

// TestMichelsonCompensator: a plate of thickness t and index n passed there and back adds
// (n − 1)·t of optical path per pass (from memory: the usual argument for a compensator plate),
// so the OPD falls by 2(n − 1)t; its group delay rises by 2(n_g − 1)t/c, with n_g = 1.4671447553515644
// for fused silica at 800 nm (by hand from Malitson 1965, as in optics/material's group test).
func TestMichelsonCompensator(t *testing.T) {
	const thick = 3.0
	b0, arms0 := michelson(100, 100, nil, 800)
	b1, arms1 := michelson(100, 100, &plate{thicknessMM: thick, gapMM: 20}, 800)
	m0, m1 := meetingAt(t, runArms(b0, arms0), "BS"), meetingAt(t, runArms(b1, arms1), "BS")
	fs, _ := material.Lookup(material.FusedSilica)
	n := fs.Index(800)
	if got, want := *m1.OPDMM-*m0.OPDMM, -2*(n-1)*thick; math.Abs(got-want) > 1e-9 {
		t.Errorf("plate changes the OPD by %v mm, want %v (2(n-1)t, from memory)", got, want)
	}
	const ng = 1.4671447553515644 // Malitson 1965, by hand
	if got, want := *m1.GroupDelayFS-*m0.GroupDelayFS, -1000*2*(ng-1)*thick/material.SpeedOfLightMMPerPS; math.Abs(got-want) > 1e-3 {
		t.Errorf("plate changes the delay by %v fs, want %v (n_g from Malitson 1965)", got, want)
	}
}

// TestMichelsonPower: a 50/50 Michelson brings 0.25 of the source's power to the detector along
// each arm (definition: half reflected, half transmitted, twice), and sends 0.25 back out of the
// splitter's open port.
func TestMichelsonPower(t *testing.T) {
	b, arms := michelson(100.25, 100, nil, 632.8)
	r := runArms(b, arms)
	if got := endPower(arms[1]); got != 0.25 {
		t.Errorf("BS.reflected reaches the detector with %v, want 0.25", got)
	}
	if got := r.Arms[2].PowerFraction; got != 0.25 {
		t.Errorf("BSa.reflected carries %v, want 0.25", got)
	}
	var open []optics.Warning
	for _, w := range r.Warnings {
		if w.Code == optics.WarnOpenPort {
			open = append(open, w)
		}
	}
	if len(open) != 1 || open[0].Element != "BSa" {
		t.Errorf("open-port warnings %+v, want one at BSa (main's return through BS)", open)
	}
	ends := []string{r.Arms[0].Ends, r.Arms[1].Ends, r.Arms[2].Ends}
	want := []string{optics.ArmOpen, "joins BSa.reflected at BS", optics.ArmStopped}
	for i := range want {
		if ends[i] != want[i] {
			t.Errorf("arm %d ends %q, want %q", i, ends[i], want[i])
		}
	}
	// Every part placed once: BS, M1, M2, D.
	var ids []string
	for _, p := range r.Placement {
		ids = append(ids, p.ID)
	}
	if len(ids) != 4 || ids[0] != "BS" || ids[1] != "M1" || ids[2] != "M2" || ids[3] != "D" {
		t.Errorf("placements %v, want BS M1 M2 D", ids)
	}
	if len(r.Board.Arms) != 3 || len(r.Board.Arms[2].Elements) != 1 || !r.Board.Arms[0].Open {
		t.Errorf("board arms %d, want 3 with D alone in the last and main open", len(r.Board.Arms))
	}
}

// TestMeetingVisibility: two equal beams overlap fully (|γ| = 1), and two aligned round beams at
// their waists with radii w1 and w2 give |γ| = 2 w1 w2 / (w1² + w2²) (Kogelnik, from memory).
func TestMeetingVisibility(t *testing.T) {
	b, arms := michelson(100, 100, nil, 632.8)
	if m := meetingAt(t, runArms(b, arms), "BS"); m.Visibility == nil || math.Abs(*m.Visibility-1) > 1e-12 {
		t.Errorf("equal arms: visibility %v, want 1", m.Visibility)
	}
	at := optics.ElementPlace{ID: "X", TableXMM: 10, TableYMM: 20}
	for _, w := range [][2]float64{{1, 1}, {1, 2}, {0.3, 0.9}} {
		one := &optics.BeamReport{WavelengthNM: 1064, Elements: []optics.BeamAt{{ID: "X", WTMM: w[0], WSMM: w[0]}}}
		two := &optics.BeamReport{WavelengthNM: 1064, Elements: []optics.BeamAt{{ID: "X", WTMM: w[1], WSMM: w[1]}}}
		got, ok := visibility(at, at, one, two, 0)
		want := 2 * w[0] * w[1] / (w[0]*w[0] + w[1]*w[1])
		if !ok || math.Abs(got-want) > 1e-12 {
			t.Errorf("waists %v: visibility %v, want %v (Kogelnik, from memory)", w, got, want)
		}
	}
}

// TestMissesPart: a mirror set 1 mm too far makes the return pass miss the splitter by 2 mm.
func TestMissesPart(t *testing.T) {
	b, arms := michelson(100, 100, nil, 632.8)
	arms[0].Bench.Elements[2].GapMM = 102 // the return through BS, 2 mm beyond it
	r := runArms(b, arms)
	var got []optics.Warning
	for _, w := range r.Warnings {
		if w.Code == optics.WarnMissesPart {
			got = append(got, w)
		}
	}
	if len(got) != 1 || got[0].Element != "BSa" || got[0].Others[0] != "BS" {
		t.Errorf("misses-part warnings %+v, want one for BSa", got)
	}
	if m := meetingAt(t, r, "BS"); math.Abs(m.MissMM-2) > 1e-9 {
		t.Errorf("miss %v mm, want 2 (by construction)", m.MissMM)
	}
}
