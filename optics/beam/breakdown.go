package beam

import (
	"fmt"
	"math"
	"math/cmplx"

	"raytable/optics"
	"raytable/optics/numfmt"
)

// CodeNotParaxial is the warning given instead of beam numbers when the beam leaves the paraxial
// regime.
const CodeNotParaxial = optics.WarnBeamNotParaxial

// ParaxialLimitRad is the far-field half-angle beyond which the Gaussian beam, a paraxial solution
// of the wave equation, no longer describes the light even roughly (common practice: it is good
// below about 0.5 rad and only an estimate up to about 1 rad), so raytable gives no beam numbers.
const ParaxialLimitRad = 1.0

// breakdown finds the first surface after which either plane's beam has a far-field half-angle
// θ = sqrt(M²λ/(π·z_R)) above ParaxialLimitRad, or a q that is not a finite number with positive
// imaginary part (z_R > 0). Past such a point the q law gives meaningless or non-finite radii,
// so no beam numbers are reported at all. z_R is the imaginary part of the reduced q̂ = q/n, so
// inside glass θ is the angle in air, larger than the angle in the glass: the test is on the safe
// side.
func breakdown(p *optics.Path, g gaussian, planes ...*planeTrace) (surface int, angleRad float64, broke bool) {
	check := func(g gaussian, q complex128) (float64, bool) {
		zr := imag(q)
		if cmplx.IsNaN(q) || cmplx.IsInf(q) || !(zr > 0) {
			return math.Inf(1), true
		}
		theta := math.Sqrt(g.lamMM / (math.Pi * zr))
		return theta, theta > ParaxialLimitRad
	}
	for _, t := range planes {
		if a, bad := check(t.g, t.start); bad {
			return -1, a, true
		}
	}
	for i := range p.Surfaces {
		for _, t := range planes {
			for _, q := range []complex128{t.arrive[i], t.leave[i]} {
				if a, bad := check(t.g, q); bad {
					return i, a, true
				}
			}
		}
	}
	return 0, 0, false
}

func notParaxialWarning(p *optics.Path, surface int, angleRad float64) optics.Warning {
	where, id := "at the source", ""
	if surface >= 0 {
		id = p.Surfaces[surface].ID
		where = "at " + id
	}
	angle := "an unbounded angle"
	if !math.IsInf(angleRad, 0) {
		angle = numfmt.Rough.Format(angleRad) + " rad"
	}
	return optics.Warning{Code: CodeNotParaxial, Element: id, Message: fmt.Sprintf(
		"the Gaussian beam diverges with %s %s, beyond the %.1f rad where the paraxial beam model holds; no beam numbers are given: focus less tightly or check focal lengths and M²",
		angle, where, ParaxialLimitRad)}
}
