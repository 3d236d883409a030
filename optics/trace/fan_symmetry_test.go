package trace

import (
	"testing"

	"raytable/optics"
)

// A fan's pupil coordinates are antisymmetric to the last bit: ray j and ray n-1-j sit at exactly
// opposite coordinates (a symmetric fan of a rotationally symmetric bench must be clipped
// symmetrically; common practice).
func TestFanPupilAntisymmetric(t *testing.T) {
	for _, n := range []int{1, 2, 3, 5, 11, 21, 41, 101} {
		for j := range n {
			if a, b := fanPupil(j, n), fanPupil(n-1-j, n); a != -b {
				t.Errorf("n %d: pupil[%d] = %v, pupil[%d] = %v, not opposite", n, j, a, n-1-j, b)
			}
		}
		if n > 1 && (fanPupil(0, n) != -1 || fanPupil(n-1, n) != 1) {
			t.Errorf("n %d: fan from %v to %v, want -1 to 1", n, fanPupil(0, n), fanPupil(n-1, n))
		}
	}
}

// A round-number bench: a 21-ray collimated fan of semi-diameter 5 mm through an iris of 6 mm
// diameter. The rays at ±3 mm touch the edge and pass; the 4 rays beyond on either side, at
// ±3.5, ±4, ±4.5 and ±5 mm, are clipped: 4 above and 4 below (geometry, from memory of the fan
// spacing 0.5 mm). With -1 + 2j/(n-1) the ray at +0.6 came out at 3.0000000000000004 mm and was
// clipped too: 5 above, 4 below.
func TestFanClippedSymmetrically(t *testing.T) {
	b := &optics.Bench{
		WavelengthsNM: []float64{587.6},
		Source:        optics.Source{Kind: optics.SourceCollimated, SemiDiameterMM: ptr(5.0), FanRays: ptr(21)},
	}
	p := path(plane("A1", 50, 3), plane("S", 100, inf))
	above, below := 0, 0
	for _, spec := range Rays(b, p) {
		if r := Trace(p, 0, spec.Start, nil); r.Status == optics.RayClipped {
			if spec.Start.Pos.Y > 0 {
				above++
			} else {
				below++
			}
		}
	}
	if above != 4 || below != 4 {
		t.Errorf("clipped %d above and %d below the axis, want 4 and 4", above, below)
	}
}
