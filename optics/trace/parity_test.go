package trace

import (
	"fmt"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics/internal/approx"
)

// After an odd number of mirrors the unfolded frame's +y points to the right of travel (each
// mirror reflects all three axes; README, 'Report, format raytable/report/v1', Frames). A mirror that turns the beam
// counter-clockwise therefore tilts towards -y of that frame. Check it against the same mirror met
// first: a flat fold changes nothing physical about how the next mirror meets the beam, so the
// hit on a tilted concave mirror behind a fold must be the hit on that mirror alone of the ray
// that lies on the same physical side, with y (left of travel) negated on the way in and out
// (geometry of the unfolding; a left-handed frame is a y-reflection of a right-handed one).
func TestMirrorTurnAfterOddFold(t *testing.T) {
	const r = 150.0
	const hitTol = 1e-10 // hit positions of order 10 mm behind a fold; rounding leaves 8e-14 here
	rays := []Start{
		parallel(0, 4), parallel(3, -5), parallel(-2, 6),
		{Pos: r3.Vec{X: 1, Y: 2, Z: 0}, Dir: unit(r3.Vec{X: 0.03, Y: -0.05, Z: 1})},
		{Pos: r3.Vec{X: -3, Y: -1, Z: 0}, Dir: unit(r3.Vec{X: -0.02, Y: 0.04, Z: 1})},
	}
	flipY := func(v r3.Vec) r3.Vec { return r3.Vec{X: v.X, Y: -v.Y, Z: v.Z} }
	for _, fold := range []float64{90, -90, 60} {
		for _, turn := range []float64{60, -60, 120, -150} {
			folded := path(mirror(40, 0, fold), mirror(100, r, turn))
			alone := path(mirror(100, r, turn))
			for i, s := range rays {
				t.Run(fmt.Sprintf("fold %g turn %g ray %d", fold, turn, i), func(t *testing.T) {
					got := mustTrace(t, folded, s).Points[1]
					want := mustTrace(t, alone, Start{Pos: flipY(s.Pos), Dir: flipY(s.Dir)}).Points[0]
					want.Pos, want.Dir = flipY(want.Pos), flipY(want.Dir)
					if d := norm(r3.Sub(got.Pos, want.Pos)); !approx.Abs(d, 0, hitTol) {
						t.Errorf("hit %+v behind the fold, want %+v", got.Pos, want.Pos)
					}
					if d := norm(r3.Sub(got.Dir, want.Dir)); !approx.Abs(d, 0, approx.Rounding) {
						t.Errorf("dir %+v behind the fold, want %+v", got.Dir, want.Dir)
					}
				})
			}
		}
	}
}
