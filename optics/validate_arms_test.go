package optics_test

import (
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// TestBranchingRulesRefused breaks each rule of a branching bench (README "Bench file") alone, on
// the demo Michelson or combiner: Validate names the path and the rule, and nothing panics.
func TestBranchingRulesRefused(t *testing.T) {
	deep := func(b *optics.Bench) {
		list := &b.Elements
		for range optics.MaxArmDepth + 1 {
			*list = append(*list, optics.Element{ID: optics.UniqueID(b, "splitter"), Type: optics.TypeSplitter, GapMM: 10, TurnDeg: new(90.0)})
			list = &(*list)[len(*list)-1].Reflected
		}
		*list = []optics.Element{{ID: "Z", Type: optics.TypeDump, GapMM: 10}}
	}
	tests := []struct {
		name, bench, path, fragment string
		edit                        func(b *optics.Bench)
	}{
		{"turn 0", "michelson", "elements[0].turn_deg", "above 0° and below 180°", func(b *optics.Bench) { b.Elements[0].TurnDeg = new(0.0) }},
		{"turn 180", "michelson", "elements[0].turn_deg", "below 180°", func(b *optics.Bench) { b.Elements[0].TurnDeg = new(180.0) }},
		{"reflect above 1", "michelson", "elements[0].reflect", "between 0 and 1", func(b *optics.Bench) { b.Elements[0].Reflect = new(1.5) }},
		{"reflect and dichroic", "combiner", "elements[0].reflect", "not both", func(b *optics.Bench) { b.Elements[0].Reflect = new(0.3) }},
		{"edge out of range", "combiner", "elements[0].dichroic.edge_nm", "200-20000 nm", func(b *optics.Bench) { b.Elements[0].Dichroic.EdgeNM = 100 }},
		{"reflects side", "combiner", "elements[0].dichroic.reflects", `"shorter" or "longer"`, func(b *optics.Bench) { b.Elements[0].Dichroic.Reflects = "short" }},
		{"plate without material", "michelson", "elements[0].material", "needs material", func(b *optics.Bench) { b.Elements[0].ThicknessMM = new(1.0) }},
		{"material without plate", "michelson", "elements[0].thickness_mm", "needs thickness_mm", func(b *optics.Bench) { b.Elements[0].Material = "fused-silica" }},
		{"unknown plate material", "michelson", "elements[0].material", "unobtainium", func(b *optics.Bench) {
			b.Elements[0].ThicknessMM, b.Elements[0].Material = new(1.0), "unobtainium"
		}},
		{"negative thickness", "michelson", "elements[0].thickness_mm", "greater than 0", func(b *optics.Bench) {
			b.Elements[0].ThicknessMM, b.Elements[0].Material = new(-1.0), "fused-silica"
		}},
		{"zero diameter", "michelson", "elements[0].diameter_mm", "greater than 0", func(b *optics.Bench) { b.Elements[0].DiameterMM = new(0.0) }},
		{"periscope rise 0", "michelson", "elements[1].rise_mm", "must not be 0", func(b *optics.Bench) {
			b.Elements[1] = optics.Element{ID: "P1", Type: optics.TypePeriscope, GapMM: 100, RiseMM: new(0.0), TurnDeg: new(0.0)}
		}},
		{"periscope turn", "michelson", "elements[1].turn_deg", "between -180° and 180°", func(b *optics.Bench) {
			b.Elements[1] = optics.Element{ID: "P1", Type: optics.TypePeriscope, GapMM: 100, RiseMM: new(50.0), TurnDeg: new(190.0)}
		}},
		{"same_as later part", "michelson", "elements[0].reflected[1].same_as", "placed before", func(b *optics.Bench) { b.Elements[0].Reflected[1].SameAs = "M1x" }},
		{"same_as a pass", "michelson", "elements[0].reflected[1].same_as", "placed before", func(b *optics.Bench) { b.Elements[0].Reflected[1].SameAs = "BS1a" }},
		{"same_as type", "michelson", "elements[2].type", `part's type "splitter"`, func(b *optics.Bench) { b.Elements[2].Type = optics.TypeMirror; b.Elements[2].Reflected = nil }},
		{"pass carries a field", "michelson", "elements[2].diameter_mm", "carries only", func(b *optics.Bench) { b.Elements[2].DiameterMM = new(25.4) }},
		{"pass turn disagrees", "michelson", "elements[2].turn_deg", "turn 80° disagrees with the turn 90°", func(b *optics.Bench) { b.Elements[2].TurnDeg = new(80.0) }},
		{"mirror from behind", "michelson", "elements[6].same_as", "from behind", func(b *optics.Bench) {
			// Four more 90° turns bring the beam back heading +y, onto M1's back (M1 turned +x to +y).
			b.Elements = b.Elements[:2]
			b.Elements[1].TurnDeg = new(90.0)
			for _, id := range []string{"M3", "M4", "M5", "M6"} {
				b.Elements = append(b.Elements, optics.Element{ID: id, Type: optics.TypeMirror, GapMM: 50, TurnDeg: new(90.0)})
			}
			b.Elements = append(b.Elements, optics.Element{ID: "M1b", Type: optics.TypeMirror, GapMM: 50, SameAs: "M1"})
		}},
		{"duplicate id in a list", "michelson", "elements[0].reflected[0].id", "already used by elements[1]", func(b *optics.Bench) { b.Elements[0].Reflected[0].ID = "M1" }},
		{"element with a source's id", "combiner", "elements[1].id", "a source in more_sources", func(b *optics.Bench) { b.Elements[1].ID = "green" }},
		{"source id reserved", "combiner", "more_sources[0].id", "reserved", func(b *optics.Bench) { b.MoreSources[0].ID = "main" }},
		{"source id plain", "combiner", "more_sources[0].id", "only letters", func(b *optics.Bench) { b.MoreSources[0].ID = "green laser" }},
		{"source kind", "combiner", "more_sources[0].kind", "must be", func(b *optics.Bench) { b.MoreSources[0].Kind = "lamp" }},
		{"source wavelength", "combiner", "more_sources[0].wavelengths_nm[0]", "outside the accepted range", func(b *optics.Bench) { b.MoreSources[0].WavelengthsNM[0] = 100 }},
		{"too many sources", "combiner", "more_sources", "at most 8", func(b *optics.Bench) {
			for range optics.MaxSources {
				optics.AddSource(b)
			}
		}},
		{"too deep", "michelson", "", "at most 8 levels", deep},
		{"too many elements", "michelson", "elements", "over all its lists; at most 200", func(b *optics.Bench) {
			for range optics.MaxElements {
				b.Elements[0].Reflected = append(b.Elements[0].Reflected, optics.Element{ID: optics.UniqueID(b, "aperture"), Type: optics.TypeAperture, GapMM: 1, DiameterMM: new(5.0)})
			}
		}},
	}
	for _, tc := range tests {
		b := benchtest.Load(t, tc.bench+"-bench.json")
		tc.edit(b)
		found := false
		var got []string
		for _, p := range optics.ErrorProblems(optics.Validate(b)) {
			got = append(got, p.String())
			if (tc.path == "" || p.Path == tc.path) && strings.Contains(p.Message, tc.fragment) {
				found = true
			}
		}
		if !found {
			t.Errorf("%s: want a problem at %q saying %q, got %q", tc.name, tc.path, tc.fragment, got)
		}
	}
}
