package optics

import (
	"strings"
	"testing"
)

// TestValidateGlassOverlap: two consecutive lenses may not overlap inside their common clear
// aperture (25.4 mm lenses, rim at h = 12.7 mm). The sag of a sphere, s = R − sign(R)·√(R² − h²)
// (from memory), is positive downstream and R is positive when the centre lies downstream (README
// 'Bench file'). L1's convex back face of R = −100 mm falls back upstream by 0.8097 mm at the rim;
// L2's concave front face of R = −25 mm reaches upstream by 3.4661 mm there, so the glass of both
// meets unless the gap exceeds 3.4661 − 0.8097 = 2.6563 mm. A convex face nested into a concave
// one of the same radius keeps its gap everywhere, and two convex faces only touch at the axis.
func TestValidateGlassOverlap(t *testing.T) {
	pair := func(lastR, firstR *float64, gapMM float64, list string) *Bench {
		lens := func(id string, faces []*float64, gap float64) Element {
			return Element{ID: id, Type: TypeLens, GapMM: gap, FacesMM: faces, ThicknessesMM: []float64{8},
				Materials: []string{"fused-silica"}, DiameterMM: ptr(25.4)}
		}
		els := []Element{lens("L1", []*float64{nil, lastR}, 50), lens("L2", []*float64{firstR, nil}, gapMM),
			{ID: "CAM", Type: TypeScreen, GapMM: 100}}
		b := fixture(t)
		if list == "main" {
			b.Elements = els
			return b
		}
		b.Elements = []Element{{ID: "BS", Type: TypeSplitter, GapMM: 50, TurnDeg: ptr(90.0), Reflected: els},
			{ID: "D1", Type: TypeDump, GapMM: 50}}
		return b
	}
	tests := []struct {
		name          string
		lastR, firstR *float64
		gapMM         float64
		list          string
		wantPath      string // "" when valid
		wantText      string
	}{
		{"convex into a tighter concave 0.5 mm apart", ptr(-100.0), ptr(-25.0), 0.5, "main",
			"elements[1].gap_mm", "the air between L1's last face and L2's first face is -2.156 mm; it may not be negative, so the gap must be at least 2.657 mm"},
		{"the same pair in a reflected arm", ptr(-100.0), ptr(-25.0), 0.5, "arm",
			"elements[0].reflected[1].gap_mm", "the glass of L1 and L2 overlaps"},
		{"convex into a tighter concave, far enough apart", ptr(-100.0), ptr(-25.0), 2.7, "main", "", ""},
		{"flat against concave 1 mm apart", nil, ptr(-50.0), 1, "main", "elements[1].gap_mm", "is -0.6398 mm; it may not be negative, so the gap must be at least 1.64 mm"},
		{"matching convex and concave 0.5 mm apart (a valid close pair)", ptr(-50.0), ptr(-50.0), 0.5, "main", "", ""},
		{"two convex faces touching on the axis", ptr(-50.0), ptr(50.0), 0, "main", "", ""},
		{"two flat faces touching", nil, nil, 0, "main", "", ""},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			err := Validate(pair(tc.lastR, tc.firstR, tc.gapMM, tc.list))
			var got []Problem
			for _, p := range ErrorProblems(err) {
				if strings.Contains(p.Message, "overlaps") {
					got = append(got, p)
				}
			}
			if tc.wantPath == "" {
				if len(got) != 0 {
					t.Fatalf("want no overlap, got %v", got)
				}
				return
			}
			if len(got) != 1 || got[0].Path != tc.wantPath || !strings.Contains(got[0].Message, tc.wantText) {
				t.Fatalf("want one overlap at %s saying %q, got %v (all: %v)", tc.wantPath, tc.wantText, got, err)
			}
		})
	}
}
