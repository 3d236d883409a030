package paraxial

import (
	"raytable/optics"
)

// Cardinals returns the first-order values of the optical part of p at wavelength index k in the
// given plane, and the image of the source plane.
//
// With the system matrix [A B; C D] between the first vertex (index n before it) and the last
// vertex (index n' after it), power P = -C and:
//
//	rear focal point   z(F') - z(last)  = -A n'/C      (a ray entering parallel crosses the axis)
//	rear principal     z(H') - z(last)  = (1 - A) n'/C (it reaches its entering height)
//	front focal point  z(first) - z(F)  = -D n/C       (a ray from F leaves parallel)
//	front principal    z(H) - z(first)  = n (D - 1)/C
//	nodal points       z(N) - z(H) = z(N') - z(H') = (n' - n)/P
//
// (for example Gerrard and Burch, Introduction to Matrix Methods in Optics, 1975, ch. II). The
// system is afocal when C vanishes up to rounding relative to the sizes of the terms that form it;
// then the angular magnification is n D / n' and focal values are nil.
//
// The image of the source plane: for a collimated source it is the rear focal point
// (image_distance = BFL, magnification nil; nil when afocal). For a point source the object is the
// source plane z = 0; with M' = M·T(z(first)) the image lies at -B' n'/D' from the last vertex
// with lateral magnification 1/D'. An afocal system images a point source to a finite image too,
// so that image is given; it is nil only when the image is at infinity (D' = 0).
func Cardinals(p *optics.Path, k int, plane Plane, src *optics.Source) optics.Cardinal {
	out := optics.Cardinal{WavelengthNM: p.WavelengthsNM[k]}
	m, bound := systemWithBound(p, k, plane)
	out.ABCD = m.Array()
	first, last, ok := p.OpticalRange()
	if !ok {
		out.Afocal = true
		out.AngularMagnification = ptr(1)
		return out
	}
	n := p.IndexBefore(first, k)
	nImg := p.Surfaces[last].Index[k]

	if cancelled(m.C, bound.C) {
		out.Afocal = true
		out.AngularMagnification = ptr(n * m.D / nImg)
	} else {
		power := -m.C
		out.EFLMM = ptr(1 / power)
		out.BFLMM = ptr(-m.A * nImg / m.C)
		out.FFLMM = ptr(-m.D * n / m.C)
		front := n * (m.D - 1) / m.C
		rear := (1 - m.A) * nImg / m.C
		shift := (nImg - n) / power
		out.FrontPrincipalMM = ptr(front)
		out.RearPrincipalMM = ptr(rear)
		out.FrontNodalMM = ptr(front + shift)
		out.RearNodalMM = ptr(rear + shift)
	}

	if src == nil {
		return out
	}
	switch src.Kind {
	case optics.SourceCollimated:
		if !out.Afocal {
			out.ImageDistanceMM = ptr(*out.BFLMM)
		}
	case optics.SourcePoint, optics.SourceFiber:
		// The source plane sits in air (index 1) at z = 0; planes before the first optical vertex
		// do not bend rays, so the object space is one transfer.
		zFirst := p.Surfaces[first].PathMM
		t := Transfer(zFirst, n)
		full, fullBound := Mul(m, t), Mul(bound, abs(t))
		if !cancelled(full.D, fullBound.D) {
			out.ImageDistanceMM = ptr(-full.B * nImg / full.D)
			out.Magnification = ptr(1 / full.D)
		}
	}
	return out
}

func ptr(v float64) *float64 { return &v }
