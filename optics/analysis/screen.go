package analysis

import (
	"fmt"
	"math"

	"raytable/optics"
)

// screenWarnings warns when light lands outside a screen's stated width: the detector is
// overfilled or the image is off its centre.
func screenWarnings(b *optics.Bench, r *optics.Report) []optics.Warning {
	var out []optics.Warning
	for i, e := range b.Elements {
		if e.Type != optics.TypeScreen || e.WidthMM == nil {
			continue
		}
		half := *e.WidthMM / 2
		var worst float64
		var outside, reached int
		for _, ray := range r.Rays {
			for _, h := range ray.Hits {
				if h.Element != e.ID {
					continue
				}
				reached++
				if a := math.Abs(h.Exact.YMM); a > half {
					outside++
					worst = math.Max(worst, a)
				}
			}
		}
		if outside > 0 {
			out = append(out, optics.Warning{
				Code:    optics.WarnScreenOverfilled,
				Element: b.Elements[i].ID,
				Message: fmt.Sprintf("%d of %d rays reaching %s land outside its %s mm width (up to %s mm from its centre)", outside, reached, e.ID, num(*e.WidthMM), num(worst)),
			})
		}
	}
	return out
}
