package analysis

import (
	"math"
	"os"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// TestParaxialMatchesExactAtSmallAperture runs one table of benches through both traces and
// measures how fast they converge as the source shrinks by h (semi-diameter, NA, field angles and
// object heights all scaled by h). The quantity compared is discrepancy below: the largest
// difference between exact and paraxial ray heights and slopes in the tangential plane at any
// face, relative to the largest paraxial height and slope (a hit's paraxial part is tangential;
// TestTiltedMirrorExactFociMatchParaxial covers the sagittal plane). The paraxial trace is the
// first-order limit of Snell's law, so any first-order disagreement (a wrong power, sign or frame)
// leaves a relative discrepancy that does not shrink: order 0. In a system symmetric about its axis
// the first aberrations are of third order: the transverse ray error grows as h³ (Seidel; W. T.
// Welford, Aberrations of Optical Systems, 1986, from memory), so the relative discrepancy as h².
// A tilted curved mirror has a second-order error besides (its coma about the folded axis, which
// grows with the tilt): h² absolute, h relative. The order is the slope of log(discrepancy)
// against log(h), fitted by least squares over two decades of h (measured: demo 1.9999, concave
// mirror at 180° 2.0000, tilted concave mirror 0.9984, doublet and folded mirror 0.9966).
// Mirrors, folds, thick lenses and both source kinds are in the table, so sign conventions must
// agree across all of them.
func TestParaxialMatchesExactAtSmallAperture(t *testing.T) {
	const (
		// orderTol is how far the fitted and each local order may lie from the predicted whole
		// number: the measured ones lie within 0.011 (local) and 0.004 (fitted) of it, and a
		// neighbouring order is 1 away.
		orderTol = 0.1
		// roundingFloor is the relative discrepancy that rounding alone leaves on these benches
		// (the demo levels off at 1.7e-10 near h = 1e-4 and rises as h shrinks further); every
		// aperture of the fit must stay above it, or the fit would measure rounding.
		roundingFloor = 1e-10
	)
	demo, err := os.ReadFile("../../testdata/demo-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name  string
		bench string
		edit  func(b *optics.Bench)
		// largest is the largest h of the fit, which spans two decades below it: small enough
		// that the next order of aberration does not bend the line, large enough that rounding
		// stays below roundingFloor.
		largest float64
		order   float64 // predicted order of the relative discrepancy
	}{
		// Lenses and flat folds: axially symmetric once unfolded.
		{"demo bench", string(demo), func(b *optics.Bench) {
			b.Elements[1].DiameterMM = nil // the pinhole would cut the off-axis fan
		}, 0.1, 2},
		// A concave mirror at normal incidence is axially symmetric too.
		{"concave mirror at 180", mirror("180"), nil, 0.1, 2},
		{"tilted concave mirror", mirror("120"), nil, 0.1, 1},
		// The source is a point of NA h. At NA 0.01 the next order still adds 12 % to the tilted
		// mirror's h term (local order 1.1 there), so the fit starts at NA 0.001.
		{"point source through a doublet and a folded mirror", `{"format":"raytable/bench/v1","wavelengths_nm":[486.1327, 656.2725],
 "table":{"grid":"none","width_mm":900,"depth_mm":600,"beam_height_mm":75},
 "source":{"x_mm":50,"y_mm":300,"heading_deg":0,"kind":"point","na":0.05,"object_heights_mm":[0, 2]},
 "materials":{"crown":{"nd":1.5168,"vd":64.17},"flint":{"nd":1.6727,"vd":32.21}},
 "elements":[
  {"id":"D1","type":"lens","gap_mm":150,"faces_mm":[61.5,-44.2,-129.0],"thicknesses_mm":[6,2.5],"materials":["crown","flint"],"diameter_mm":25.4},
  {"id":"FM","type":"mirror","gap_mm":80,"radius_mm":-500,"turn_deg":-70,"diameter_mm":25.4},
  {"id":"S","type":"screen","gap_mm":120}]}`, nil, 1e-3, 1},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			var logH, logD []float64
			for k := range 5 {
				h := tt.largest * math.Pow(10, -float64(k)/2)
				d := discrepancy(t, tt.bench, tt.edit, h)
				if !(d > roundingFloor) {
					t.Fatalf("relative discrepancy %.3g at h = %.3g is at rounding level (%g): the fit would measure rounding", d, h, roundingFloor)
				}
				logH, logD = append(logH, math.Log(h)), append(logD, math.Log(d))
			}
			order := slope(logH, logD)
			t.Logf("order %.4f over h = %.3g .. %.3g (relative discrepancy %.3g .. %.3g)",
				order, tt.largest, tt.largest/100, math.Exp(logD[0]), math.Exp(logD[len(logD)-1]))
			if !approx.Abs(order, tt.order, orderTol) {
				t.Errorf("exact and paraxial traces converge with order %.4f in h, want %g ± %g", order, tt.order, orderTol)
			}
			// Each step of the fit on its own: the line must be straight, not a mix of orders.
			for k := 1; k < len(logH); k++ {
				local := (logD[k] - logD[k-1]) / (logH[k] - logH[k-1])
				if !approx.Abs(local, tt.order, orderTol) {
					t.Errorf("local order %.4f between h = %.3g and %.3g, want %g ± %g",
						local, math.Exp(logH[k-1]), math.Exp(logH[k]), tt.order, orderTol)
				}
			}
		})
	}
}

// slope is the least-squares slope of y against x.
func slope(x, y []float64) float64 {
	var mx, my float64
	for i := range x {
		mx += x[i]
		my += y[i]
	}
	mx /= float64(len(x))
	my /= float64(len(y))
	var sxy, sxx float64
	for i := range x {
		sxy += (x[i] - mx) * (y[i] - my)
		sxx += (x[i] - mx) * (x[i] - mx)
	}
	return sxy / sxx
}

// discrepancy runs the bench with its source shrunk by h and returns the largest difference
// between exact and paraxial heights and slopes at any face, relative to the largest paraxial
// height and slope. The exact hit lies on the real surface; it is carried back along its leaving
// direction to the vertex plane, where the paraxial value is given.
func discrepancy(t *testing.T, bench string, edit func(*optics.Bench), h float64) float64 {
	t.Helper()
	b, err := optics.Decode([]byte(bench))
	if err != nil {
		t.Fatal(err)
	}
	if edit != nil {
		edit(b)
	}
	shrinkSource(b, h)
	r, err := Run(b)
	if err != nil {
		t.Fatal(err)
	}
	var maxY, maxU, dY, dU float64
	var compared int
	for _, ray := range r.Rays {
		for _, hit := range ray.Hits {
			slope := hit.Exact.Dir[1] / hit.Exact.Dir[2]
			yVertex := hit.Exact.YMM - hit.Exact.ZMM*slope
			maxY = math.Max(maxY, math.Abs(hit.Paraxial.YMM))
			maxU = math.Max(maxU, math.Abs(hit.Paraxial.URad))
			dY = math.Max(dY, math.Abs(yVertex-hit.Paraxial.YMM))
			dU = math.Max(dU, math.Abs(slope-hit.Paraxial.URad))
			compared++
		}
	}
	if compared < 20 || maxY == 0 || maxU == 0 {
		t.Fatalf("only %d hits compared (largest height %g, slope %g)", compared, maxY, maxU)
	}
	return math.Max(dY/maxY, dU/maxU)
}

// shrinkSource scales every ray the source emits to a small aperture and field.
func shrinkSource(b *optics.Bench, h float64) {
	s := &b.Source
	if s.SemiDiameterMM != nil {
		*s.SemiDiameterMM = h
	}
	if s.NA != nil {
		*s.NA = h
	}
	for i := range s.FieldAnglesDeg {
		s.FieldAnglesDeg[i] *= h
	}
	for i := range s.ObjectHeightsMM {
		s.ObjectHeightsMM[i] *= h
	}
	for i := range s.Rays {
		s.Rays[i].HeightMM *= h
		s.Rays[i].AngleDeg *= h
	}
}
