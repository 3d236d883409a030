package optics

import "math"

// MountRule sizes the mount footprint of an element that gives none of its own: width across the
// beam, depth along it (for a mirror: along its surface and along its normal). Each kind has one
// (Kind.Mount); optics/layout places the footprints.
type MountRule struct {
	SizedBy    string  // the field (a diameter or a width) the mount's width grows from; "" none
	AssumedMM  float64 // that field's value when the element does not give it
	MarginMM   float64 // the mount's width beyond that value
	MinWidthMM float64 // the narrowest the mount is, whatever the value
	DepthMM    float64 // the mount's depth along the beam; 0: as deep as it is wide (a square)
	LipMM      float64 // a thick element's mount reaches this far beyond its glass: depth at least length + lip
}

// Footprint is the mount the rule gives element e.
func (r MountRule) Footprint(e *Element) Mount {
	w := r.MarginMM
	if r.SizedBy != "" {
		size := r.AssumedMM
		if d := *(Field{Key: r.SizedBy}.In(e).(**float64)); d != nil && !math.IsNaN(*d) && !math.IsInf(*d, 0) && *d >= 0 {
			size = *d
		}
		w = size + r.MarginMM
	}
	w = max(w, r.MinWidthMM)
	depth := r.DepthMM
	if depth == 0 {
		depth = w
	}
	if l := e.LengthMM() + r.LipMM; r.LipMM > 0 && l > depth {
		depth = l
	}
	return Mount{WidthMM: w, DepthMM: depth}
}

// DefaultMount is the footprint of e's kind; an element of an unknown type gets a beam dump's.
func DefaultMount(e *Element) Mount {
	k, ok := KindOf(e.Type)
	if !ok {
		k, _ = KindOf(TypeDump)
	}
	return k.Mount.Footprint(e)
}
