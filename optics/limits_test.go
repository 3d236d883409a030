package optics

import (
	"fmt"
	"os"
	"strings"
	"testing"
)

// TestCaps lengthens each list a bench file can lengthen to one past its cap and expects exactly
// that problem, at its JSON path, naming the count and the cap (README "Limits and who can see
// what"); at the cap itself the list passes. The caps are ours (optics/limits.go).
func TestCaps(t *testing.T) {
	demo, err := os.ReadFile("../testdata/demo-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	load := func(t *testing.T) *Bench {
		b, err := Decode(demo)
		if err != nil {
			t.Fatal(err)
		}
		return b
	}
	floats := func(n int, from, step float64) []float64 {
		out := make([]float64, n)
		for i := range out {
			out[i] = from + step*float64(i)
		}
		return out
	}
	cases := []struct {
		name, path, message string
		cap                 int
		lengthen            func(b *Bench, n int)
	}{
		{"wavelengths", "wavelengths_nm", "wavelengths", MaxWavelengths,
			func(b *Bench, n int) { b.WavelengthsNM = floats(n, 400, 10) }},
		{"field angles", "source.field_angles_deg", "field angles", MaxFieldAngles,
			func(b *Bench, n int) { b.Source.FieldAnglesDeg = floats(n, 0, 0.001) }},
		{"object heights", "source.object_heights_mm", "object heights", MaxObjectHeights,
			func(b *Bench, n int) {
				b.Source.Kind, b.Source.SemiDiameterMM, b.Source.FieldAnglesDeg = SourcePoint, nil, nil
				b.Source.NA, b.Source.ObjectHeightsMM = ptrTo(0.01), floats(n, 0, 0.01)
			}},
		{"explicit rays", "source.rays", "explicit rays", MaxExplicitRays,
			func(b *Bench, n int) { b.Source.Rays = make([]ExplicitRay, n) }},
		{"further sources", "more_sources", "further sources", MaxSources,
			func(b *Bench, n int) {
				for i := range n {
					m := MoreSource{ID: fmt.Sprintf("s%d", i), Source: b.Source}
					m.Source.YMM += float64(i)
					b.MoreSources = append(b.MoreSources, m)
				}
			}},
		{"wavelengths of a further source", "more_sources[0].wavelengths_nm", "wavelengths", MaxWavelengths,
			func(b *Bench, n int) {
				b.MoreSources = []MoreSource{{ID: "s", Source: b.Source, WavelengthsNM: floats(n, 400, 10)}}
			}},
		{"element lists", "elements", "element lists", MaxElementLists,
			func(b *Bench, n int) {
				for i := range n - 1 {
					b.Elements = append(b.Elements, Element{ID: fmt.Sprintf("BS%d", i), Type: TypeSplitter, GapMM: 1, TurnDeg: ptrTo(90.0),
						Reflected: []Element{{ID: fmt.Sprintf("D%d", i), Type: TypeDump, GapMM: 1}}})
				}
			}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			at := load(t)
			tc.lengthen(at, tc.cap)
			for _, p := range validationProblems(at) {
				if p.Path == tc.path && strings.Contains(p.Message, "at most") {
					t.Errorf("at the cap %d: %s", tc.cap, p)
				}
			}
			over := load(t)
			tc.lengthen(over, tc.cap+1)
			want := fmt.Sprintf("%d %s; at most %d are allowed", tc.cap+1, tc.message, tc.cap)
			found := false
			for _, p := range validationProblems(over) {
				found = found || (p.Path == tc.path && strings.Contains(p.Message, want))
			}
			if !found {
				t.Errorf("one past the cap: no problem %q at %s; got %v", want, tc.path, validationProblems(over))
			}
		})
	}
}

func ptrTo[T any](v T) *T { return &v }
