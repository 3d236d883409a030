package analysis

import "raytable/optics"

// fillHeights sets each element's beam height above the table: the source's height_mm, else the
// table's beam_height_mm, changed by every periscope's rise_mm upstream (a periscope's own first
// vertex is still at the height the beam arrives with).
//
// layout.Walk is to carry the heights itself (with the periscopes' geometry); until it does, this
// fills them here, to the same rule, and only where Walk left every height at zero.
func fillHeights(places []optics.ElementPlace, b *optics.Bench) {
	for _, p := range places {
		if p.HeightMM != 0 {
			return // Walk has filled them
		}
	}
	h := b.Table.BeamHeightMM
	if b.Source.HeightMM != nil {
		h = *b.Source.HeightMM
	}
	for i := range places {
		places[i].HeightMM = h
		if i < len(b.Elements) && b.Elements[i].Type == optics.TypePeriscope && b.Elements[i].RiseMM != nil {
			h += *b.Elements[i].RiseMM
		}
	}
}
