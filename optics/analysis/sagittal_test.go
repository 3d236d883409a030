package analysis

import (
	"fmt"
	"math"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// sagittalLimit is the relative agreement of an exact focus found with rays 1 µm off the chief
// ray and the paraxial focus: coma and astigmatism of the tilted mirror move the crossing by a
// fraction of order h/f, 1e-5 here.
const sagittalLimit = 1e-4

// TestTiltedMirrorExactFociMatchParaxial traces rays 1 µm off the axis through a tilted concave
// mirror, alone and behind a flat fold (so that the unfolded frame's y is reversed), and finds
// where they cross the axis planes after the mirror. Sagittal rays (x only) must cross x = 0 at
// the paraxial sagittal focus and tangential rays (y only) y = 0 at the tangential one; a skew
// ray (x and y) must do both, since to first order the two planes separate. The reference is the
// paraxial report itself (system.bfl_mm and system.sagittal.bfl_mm), which Coddington's
// f·cos i and f/cos i (Coddington 1829, as README, 'Report, format raytable/report/v1', states
// them) pin independently.
func TestTiltedMirrorExactFociMatchParaxial(t *testing.T) {
	const r, turn, h = 200.0, 120.0, 1e-3
	cosI := math.Cos((180 - turn) / 2 * math.Pi / 180)
	for _, fold := range []string{"", `{"id":"F","type":"mirror","gap_mm":100,"radius_mm":null,"turn_deg":90},`} {
		for _, sign := range []float64{1, -1} {
			name := fmt.Sprintf("fold %t turn %g", fold != "", sign*turn)
			t.Run(name, func(t *testing.T) {
				rep := mustRun(t, fmt.Sprintf(`{"format":"raytable/bench/v1","wavelengths_nm":[632.8],
 "table":{"grid":"none","width_mm":2000,"depth_mm":2000,"beam_height_mm":75},
 "source":{"x_mm":1000,"y_mm":1000,"heading_deg":0,"kind":"collimated","semi_diameter_mm":%g,
   "rays":[{"height_mm":0,"angle_deg":0,"x_mm":%g,"x_angle_deg":0},{"height_mm":0,"angle_deg":0,"x_mm":%g,"x_angle_deg":0},
           {"height_mm":%g,"angle_deg":0,"x_mm":0,"x_angle_deg":0},{"height_mm":%g,"angle_deg":0,"x_mm":0,"x_angle_deg":0},
           {"height_mm":%g,"angle_deg":0,"x_mm":%g,"x_angle_deg":0},{"height_mm":%g,"angle_deg":0,"x_mm":%g,"x_angle_deg":0}]},
 "elements":[%s{"id":"M","type":"mirror","gap_mm":150,"radius_mm":%g,"turn_deg":%g},{"id":"S","type":"screen","gap_mm":300}]}`,
					h, h, -h, h, -h, h, h, -h, -h, fold, r, sign*turn))
				sag := value(t, "sagittal bfl_mm", rep.System.Sagittal.BFLMM)
				tan := value(t, "bfl_mm", rep.System.BFLMM)
				// Coddington: f/cos i sagittal, f·cos i tangential, f = R/2.
				if !approx.Rel(sag, r/2/cosI, approx.VeryClose) || !approx.Rel(tan, r/2*cosI, approx.VeryClose) {
					t.Fatalf("paraxial foci: sagittal %.9g, tangential %.9g; Coddington %.9g and %.9g", sag, tan, r/2/cosI, r/2*cosI)
				}
				at := func(i int) optics.ExactPoint {
					for _, hit := range rep.Rays[i].Hits {
						if hit.Element == "M" {
							return hit.Exact
						}
					}
					t.Fatalf("ray %d (%s) never reached M: %s", i, rep.Rays[i].Status, rep.Rays[i].Reason)
					return optics.ExactPoint{}
				}
				crossX := func(p optics.ExactPoint) float64 { return p.ZMM - p.XMM*p.Dir[2]/p.Dir[0] }
				crossY := func(p optics.ExactPoint) float64 { return p.ZMM - p.YMM*p.Dir[2]/p.Dir[1] }
				// Symmetric pairs cancel the coma term, which is odd in the ray's offset.
				checks := []struct {
					what      string
					got, want float64
				}{
					{"sagittal rays cross x = 0", (crossX(at(0)) + crossX(at(1))) / 2, sag},
					{"tangential rays cross y = 0", (crossY(at(2)) + crossY(at(3))) / 2, tan},
					{"skew rays cross x = 0", (crossX(at(4)) + crossX(at(5))) / 2, sag},
					{"skew rays cross y = 0", (crossY(at(4)) + crossY(at(5))) / 2, tan},
				}
				for _, c := range checks {
					if !approx.Rel(c.got, c.want, sagittalLimit) {
						t.Errorf("%s %.8g mm after the mirror, paraxial focus %.8g mm", c.what, c.got, c.want)
					}
				}
			})
		}
	}
}
