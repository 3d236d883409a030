package optics

import (
	"reflect"
	"testing"
)

func TestDiff(t *testing.T) {
	cases := []struct {
		name string
		edit func(b *Bench)
		want []string
	}{
		{"no change", func(b *Bench) {}, nil},
		{"gap", func(b *Bench) { b.Elements[2].GapMM = 162.5 }, []string{"L2 gap_mm 150 -> 162.5"}},
		{"title and notes", func(b *Bench) { b.Title = "x"; b.Notes = "" }, []string{"title changed", "notes changed"}},
		{"wavelengths", func(b *Bench) { b.WavelengthsNM = []float64{632.8} }, []string{"wavelengths_nm 632.8, 532 -> 632.8"}},
		{"source", func(b *Bench) {
			b.Source.SemiDiameterMM = ptr(1.5)
			b.Source.FanRays = ptr(31)
			b.Source.Beam = nil
		}, []string{"source.semi_diameter_mm 1 -> 1.5", "source.fan_rays 21 -> 31", "removed source.beam"}},
		{"table", func(b *Bench) { b.Table.Grid = GridNone; b.Table.HoleOffsetMM = ptr(12.5) },
			[]string{"table.grid metric-25mm -> none", "table.hole_offset_mm default -> 12.5"}},
		{"removed", func(b *Bench) { b.Elements = append(b.Elements[:4], b.Elements[5:]...) }, []string{"removed IR"}},
		{"added", func(b *Bench) {
			f3 := Element{ID: "F3", Type: TypeThinLens, GapMM: 10, FocalMM: ptr(100.0)}
			b.Elements = append(b.Elements[:3], append([]Element{f3}, b.Elements[3:]...)...)
		}, []string{"added F3 (thin-lens) at position 4"}},
		{"moved", func(b *Bench) {
			m2 := b.Elements[6]
			rest := append(append([]Element{}, b.Elements[:6]...), b.Elements[7:]...)
			b.Elements = append(append(append([]Element{}, rest[:2]...), m2), rest[2:]...)
		}, []string{"moved M2 from 7 to 3"}},
		{"faces, material, mirror radius and mount", func(b *Bench) {
			b.Elements[0].FacesMM = []*float64{ptr(12.0), nil}
			b.Elements[0].Materials = []string{"code:517642"}
			b.Elements[3].RadiusMM = ptr(500.0)
			b.Elements[3].Mount = &Mount{WidthMM: 50, DepthMM: 30}
			b.Elements[5].DiameterMM = nil
		}, []string{
			"L1 faces_mm 11.4, flat -> 12, flat", "L1 materials fused-silica -> code:517642",
			"M1 radius_mm flat -> 500", "M1 mount none -> 50 x 30 mm", "F1 diameter_mm 25.4 -> none",
		}},
		{"materials", func(b *Bench) { b.Materials = map[string]MaterialSpec{"oil": {Index: ptr(1.515)}} }, []string{"added material oil"}},
		{"explicit rays", func(b *Bench) {
			b.Source.Rays[0].AngleDeg = 0.25
			b.Source.Rays = append(b.Source.Rays, ExplicitRay{HeightMM: -0.5})
		}, []string{"source.rays[0].angle_deg 0 -> 0.25", "added source.rays[1]"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			old, new := fixture(t), fixture(t)
			c.edit(new)
			if got := Diff(old, new); !reflect.DeepEqual(got, c.want) {
				t.Errorf("Diff\n got %q\nwant %q", got, c.want)
			}
		})
	}
}

// TestDiffOrderAndSymmetry: several element changes come out removed, added, moved, changed, and
// swapping the two benches turns additions into removals.
func TestDiffOrderAndSymmetry(t *testing.T) {
	old, new := fixture(t), fixture(t)
	// new: drop PH, add D1 at the end, move CAM before M2, change F1's focal length.
	els := new.Elements
	new.Elements = []Element{els[0], els[2], els[3], els[4], els[5], els[7], els[6],
		{ID: "D1", Type: TypeDump, GapMM: 30}}
	new.Elements[4].FocalMM = ptr(200.0)
	// CAM and M2 swapped places; the longest common order keeps one of them, and M2's position
	// number did not change, so the line names its new neighbour.
	want := []string{"removed PH", "added D1 (dump) at position 8", "moved M2 to after CAM", "F1 focal_mm 250 -> 200"}
	if got := Diff(old, new); !reflect.DeepEqual(got, want) {
		t.Errorf("Diff\n got %q\nwant %q", got, want)
	}
	back := []string{"removed D1", "added PH (aperture) at position 2", "moved CAM from 6 to 8", "F1 focal_mm 200 -> 250"}
	if got := Diff(new, old); !reflect.DeepEqual(got, back) {
		t.Errorf("reverse Diff\n got %q\nwant %q", got, back)
	}
}

// TestDiffNil: a nil bench is empty and nothing panics.
func TestDiffNil(t *testing.T) {
	if got := Diff(nil, nil); got != nil {
		t.Errorf("Diff(nil, nil) = %q", got)
	}
	b := fixture(t)
	got := Diff(nil, b)
	if len(got) == 0 || got[0] != "format \"\" -> raytable/bench/v1" {
		t.Errorf("Diff(nil, demo) starts %q", got)
	}
}
