package optics_test

import (
	"math"
	"reflect"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

func armByID(t *testing.T, arms []optics.Arm, id string) optics.Arm {
	t.Helper()
	for _, a := range arms {
		if a.ID == id {
			return a
		}
	}
	t.Fatalf("no arm %q", id)
	return optics.Arm{}
}

// pathBetween sums the gaps of a linear bench after element from up to and including element to.
func pathBetween(els []optics.Element, from, to int) float64 {
	var s float64
	for _, e := range els[from+1 : to+1] {
		s += e.GapMM
	}
	return s
}

// TestMichelsonArms: in a Michelson interferometer each beam runs to its end mirror and back, so
// the path from the splitter to its second pass is 2·L (definition of the instrument); both
// recombined beams leave towards the screen, one by joining the other.
func TestMichelsonArms(t *testing.T) {
	arms := optics.ResolveArms(benchtest.Load(t, "michelson-bench.json"))
	var ids []string
	for _, a := range arms {
		ids = append(ids, a.ID)
	}
	if want := []string{"main", "BS1.reflected", "BS1a.reflected"}; !reflect.DeepEqual(ids, want) {
		t.Fatalf("arms %q, want %q", ids, want)
	}
	tests := []struct {
		arm       string
		twoL      float64 // 2·L, from the bench file's end mirror distance
		power     float64 // 50/50 splitter: half on each pass (definition of reflect)
		joins     string
		lastIsCam bool
	}{
		{"BS1.reflected", 2 * 100.25, 0.5, "BS1a.reflected", true},
		{"BS1a.reflected", 2 * 100, 0.25, "", true},
	}
	for _, tc := range tests {
		a := armByID(t, arms, tc.arm)
		els := a.Bench.Elements
		if got := pathBetween(els, 0, 2); math.Abs(got-tc.twoL) > 1e-9 {
			t.Errorf("%s: splitter to its second pass %v mm, want 2·L = %v mm", tc.arm, got, tc.twoL)
		}
		if a.PowerFraction != tc.power || a.JoinsArm != tc.joins {
			t.Errorf("%s: power %v joins %q, want %v and %q", tc.arm, a.PowerFraction, a.JoinsArm, tc.power, tc.joins)
		}
		if last := els[len(els)-1]; tc.lastIsCam && last.ID != "CAM" {
			t.Errorf("%s: ends at %s, want CAM", tc.arm, last.ID)
		}
		for i, m := range a.MissMM {
			if m > 1e-9 || a.HeightMissMM[i] > 1e-9 {
				t.Errorf("%s element %d misses its part by %v mm, %v mm in height", tc.arm, i, m, a.HeightMissMM[i])
			}
		}
	}
	// Two open ports back towards the laser, a quarter of the power each (0.5 · 0.5).
	var open []optics.OpenPort
	for _, a := range arms {
		open = append(open, a.OpenPorts...)
	}
	if len(open) != 2 || open[0].PowerFraction != 0.25 || open[1].PowerFraction != 0.25 {
		t.Errorf("open ports %+v, want two of 0.25", open)
	}
}

// TestSameAsTurn: a 45° splitter (turn 90°) met from its other face reflects by the same normal;
// by the law of reflection (from memory) a beam arriving at right angles to the first one is
// turned by the opposite sense, -90° for +90°, and a beam arriving head-on from the first beam's
// far side (+180°) is turned +90°.
func TestSameAsTurn(t *testing.T) {
	tests := []struct {
		name       string
		headingDeg float64 // heading of the beam meeting the pass
		want       float64
	}{
		{"from the reflected side", 270, -90},
		{"back along the first beam", 180, 90},
	}
	for _, tc := range tests {
		b := benchtest.Load(t, "combiner-bench.json")
		m := &b.MoreSources[0]
		m.HeadingDeg = tc.headingDeg
		dx, dy := math.Cos(tc.headingDeg*math.Pi/180), math.Sin(tc.headingDeg*math.Pi/180)
		m.XMM, m.YMM = 287.5-175*dx, 237.5-175*dy // 175 mm before DM1 at (287.5, 237.5)
		m.Elements[0].TurnDeg = nil
		if err := optics.Validate(b); err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		a := armByID(t, optics.ResolveArms(b), "green")
		if got := *a.Bench.Elements[0].TurnDeg; math.Abs(got-tc.want) > 1e-9 {
			t.Errorf("%s: turn %v°, want %v°", tc.name, got, tc.want)
		}
	}
}

// TestCombinerArms: the dichroic reflects the green laser onto the infrared line, so the green arm
// follows the lens and the screen; each laser keeps its own wavelength.
func TestCombinerArms(t *testing.T) {
	arms := optics.ResolveArms(benchtest.Load(t, "combiner-bench.json"))
	g := armByID(t, arms, "green")
	var ids []string
	for _, e := range g.Bench.Elements {
		ids = append(ids, e.ID+" "+e.Type)
	}
	if want := []string{"DM1g mirror", "L1 lens", "CAM screen"}; !reflect.DeepEqual(ids, want) {
		t.Errorf("green arm %q, want %q", ids, want)
	}
	if g.JoinsArm != "main" || g.JoinsAt != "DM1" || !reflect.DeepEqual(g.WavelengthsNM, []float64{532}) || g.PowerFraction != 1 {
		t.Errorf("green arm joins %q at %q, wavelengths %v, power %v", g.JoinsArm, g.JoinsAt, g.WavelengthsNM, g.PowerFraction)
	}
	if n := len(arms[0].OpenPorts) + len(g.OpenPorts); n != 0 {
		t.Errorf("%d open ports; a dichroic's dark ports carry no light", n)
	}
}

// TestReversedLens: a lens met from its last face is passed with its faces in reverse order and
// negated (README "Bench file": a radius is + when its centre is downstream), thicknesses and
// materials reversed.
func TestReversedLens(t *testing.T) {
	b := benchtest.Load(t, "michelson-bench.json")
	lens := optics.Element{ID: "L9", Type: optics.TypeLens, GapMM: 40, FacesMM: []*float64{new(60.0), new(-40.0), nil},
		ThicknessesMM: []float64{5, 2}, Materials: []string{"fused-silica", "water"}, DiameterMM: new(12.7)}
	b.Elements = []optics.Element{lens,
		{ID: "M1", Type: optics.TypeMirror, GapMM: 60, TurnDeg: new(180.0)},
		{ID: "L9b", Type: optics.TypeLens, GapMM: 60, SameAs: "L9"},
		{ID: "D1", Type: optics.TypeDump, GapMM: 40}}
	if err := optics.Validate(b); err != nil {
		t.Fatal(err)
	}
	got := optics.ResolveArms(b)[0].Bench.Elements[2]
	if got.ID != "L9b" || got.GapMM != 60 || len(got.FacesMM) != 3 {
		t.Fatalf("pass %+v", got)
	}
	if got.FacesMM[0] != nil || *got.FacesMM[1] != 40 || *got.FacesMM[2] != -60 ||
		!reflect.DeepEqual(got.ThicknessesMM, []float64{2, 5}) || !reflect.DeepEqual(got.Materials, []string{"water", "fused-silica"}) {
		t.Errorf("reversed lens: faces %v, %v, %v, thicknesses %v, materials %v", got.FacesMM[0], *got.FacesMM[1], *got.FacesMM[2], got.ThicknessesMM, got.Materials)
	}
}

// TestLinearBenchIsItsOwnArm: a bench without splitters, passes or further sources is its main
// arm, the very same bench, so every v1 report keeps its values.
func TestLinearBenchIsItsOwnArm(t *testing.T) {
	for _, name := range []string{"demo-bench.json", "relay-bench.json", "collide-bench.json"} {
		b := benchtest.Load(t, name)
		arms := optics.ResolveArms(b)
		if len(arms) != 1 || arms[0].Bench != b || arms[0].PowerFraction != 1 || arms[0].End != len(b.Elements) {
			t.Errorf("%s: %d arms, first is the bench itself: %v", name, len(arms), arms[0].Bench == b)
		}
	}
}
