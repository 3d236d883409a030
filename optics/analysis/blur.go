package analysis

import (
	"math"

	"raytable/optics"
)

// blurs measures, at every screen, how far the exact rays of each fan land from one another: the
// RMS distance from their centroid and the largest one, in the table plane (the fans are
// meridional). Beside them stands the Airy radius 0.61·λ/NA' of a perfect image at the image-side
// NA, so a builder sees at once whether aberrations or diffraction set the image size.
func blurs(b *optics.Bench, r *optics.Report) []optics.Blur {
	var airyNA float64
	if na := r.System.ImageNA; na != nil && *na > 0 && !r.System.Afocal {
		airyNA = *na
	}
	out := []optics.Blur{} // [] in JSON, not null, when the bench has no screen
	for _, e := range b.Elements {
		if e.Type != optics.TypeScreen {
			continue
		}
		for _, fan := range fans(r.Rays) {
			var ys []float64
			for _, ray := range fan.rays {
				for _, h := range ray.Hits {
					if h.Element == e.ID {
						ys = append(ys, h.Exact.YMM)
					}
				}
			}
			bl := optics.Blur{Element: e.ID, Field: fan.field, WavelengthNM: fan.wavelengthNM, Rays: len(ys), Traced: len(fan.rays)}
			if len(ys) > 0 {
				bl.RMSMM, bl.PeakMM = spread(ys)
			}
			if airyNA > 0 {
				bl.AiryRadiusMM = ptr(airyRadiusMM(fan.wavelengthNM, airyNA))
			}
			out = append(out, bl)
		}
	}
	return out
}

// airyRadiusMM is the radius of the first dark ring of a perfect image, 1.22·λ/(2·NA) (Airy 1835;
// Born and Wolf, Principles of Optics, §8.5.2, section from memory).
func airyRadiusMM(wavelengthNM, na float64) float64 {
	return 0.61 * wavelengthNM * 1e-6 / na
}

// spread returns the RMS distance of ys from their mean and the largest distance.
func spread(ys []float64) (rms, peak float64) {
	var mean float64
	for _, y := range ys {
		mean += y
	}
	mean /= float64(len(ys))
	var ss float64
	for _, y := range ys {
		d := y - mean
		ss += d * d
		peak = math.Max(peak, math.Abs(d))
	}
	return math.Sqrt(ss / float64(len(ys))), peak
}

type fan struct {
	field        string
	wavelengthNM float64
	rays         []*optics.Ray
}

// fans groups the fan rays (not the explicit ones) by field and wavelength, in trace order.
func fans(rays []optics.Ray) []fan {
	var out []fan
	for i := range rays {
		ray := &rays[i]
		if ray.Field == "" {
			continue
		}
		n := len(out)
		if n == 0 || out[n-1].field != ray.Field || out[n-1].wavelengthNM != ray.WavelengthNM {
			out = append(out, fan{field: ray.Field, wavelengthNM: ray.WavelengthNM})
			n++
		}
		out[n-1].rays = append(out[n-1].rays, ray)
	}
	return out
}
