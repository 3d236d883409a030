package main

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"raytable/optics"
)

// writeText prints a report as aligned plain-text tables: system values, elements, spacing
// tolerances, media, rays, the beam and the warnings.
func writeText(w io.Writer, r *optics.Report) error {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	p := func(format string, args ...any) { fmt.Fprintf(tw, format, args...) }
	if r.Title != "" {
		p("%s\n", r.Title)
	}
	p("wavelengths\t%s nm (first is primary)\n\n", joinNums(r.WavelengthsNM))

	s := r.System
	p("SYSTEM at %s nm\ttangential\tsagittal\n", fmtNum(r.WavelengthsNM[0]))
	if !s.Optical {
		p("(no lens, thin lens or mirror on the bench)\n")
	} else {
		rows := []struct {
			label string
			t, s  string
		}{
			{"afocal", yesNo(s.Afocal), yesNo(s.Sagittal.Afocal)},
			{"EFL mm", opt(s.EFLMM), opt(s.Sagittal.EFLMM)},
			{"BFL mm", opt(s.BFLMM), opt(s.Sagittal.BFLMM)},
			{"FFL mm", opt(s.FFLMM), opt(s.Sagittal.FFLMM)},
			{"front principal plane mm", opt(s.FrontPrincipalMM), opt(s.Sagittal.FrontPrincipalMM)},
			{"rear principal plane mm", opt(s.RearPrincipalMM), opt(s.Sagittal.RearPrincipalMM)},
			{"image distance mm", opt(s.ImageDistanceMM), opt(s.Sagittal.ImageDistanceMM)},
			{"magnification", opt(s.Magnification), opt(s.Sagittal.Magnification)},
			{"angular magnification", opt(s.AngularMagnification), opt(s.Sagittal.AngularMagnification)},
			{"aperture stop", s.ApertureStop, s.Sagittal.ApertureStop},
			{"f-number", opt(s.FNumber), opt(s.Sagittal.FNumber)},
			{"image-side NA", opt(s.ImageNA), opt(s.Sagittal.ImageNA)},
			{"entrance pupil mm (from first vertex)", opt(s.EntrancePupilMM), opt(s.Sagittal.EntrancePupilMM)},
			{"entrance pupil radius mm", opt(s.EntrancePupilRadiusMM), opt(s.Sagittal.EntrancePupilRadiusMM)},
			{"exit pupil mm (from last vertex)", opt(s.ExitPupilMM), opt(s.Sagittal.ExitPupilMM)},
			{"exit pupil radius mm", opt(s.ExitPupilRadiusMM), opt(s.Sagittal.ExitPupilRadiusMM)},
			{"Lagrange invariant mm", opt(s.LagrangeInvariant), opt(s.Sagittal.LagrangeInvariant)},
			{"optical part path mm", fmtNum(s.FirstVertexPathMM) + " to " + fmtNum(s.LastVertexPathMM), ""},
		}
		for _, row := range rows {
			p("  %s\t%s\t%s\n", row.label, row.t, row.s)
		}
	}
	if len(r.Chromatic) > 1 {
		p("\nBY WAVELENGTH (tangential)\tEFL mm\tBFL mm\timage distance mm\n")
		for _, c := range r.Chromatic {
			p("  %s nm\t%s\t%s\t%s\n", fmtNum(c.WavelengthNM), opt(c.EFLMM), opt(c.BFLMM), opt(c.ImageDistanceMM))
		}
	}

	p("\nELEMENTS\ttype\tpath mm\ttable x mm\ttable y mm\theading in/out deg\tmarginal y mm\tchief y mm\tlargest ray mm\tclear radius mm\n")
	for _, e := range r.Elements {
		p("  %s\t%s\t%s\t%s\t%s\t%s/%s\t%s\t%s\t%s\t%s\n", e.ID, e.Type, fmtNum(e.PathMM), fmtNum(e.TableXMM), fmtNum(e.TableYMM),
			fmtNum(e.HeadingInDeg), fmtNum(e.HeadingOutDeg), fmtNum(e.MarginalYMM), fmtNum(e.ChiefYMM), fmtNum(e.MaxExactYMM), opt(e.SemiDiameterMM))
	}

	writeSpacing(p, r)

	if len(r.Media) > 0 {
		p("\nMEDIA\twavelength nm\tindex\tmodel\n")
		for _, m := range r.Media {
			note := m.Model
			if !m.InRange {
				note += " (outside its range)"
			}
			p("  %s\t%s\t%.6f\t%s\n", m.Material, fmtNum(m.WavelengthNM), m.Index, note)
		}
	}

	writeRayCounts(p, r)
	writeBlur(p, r)
	writeBeam(p, r.Beam)

	p("\nWARNINGS\n")
	if len(r.Warnings) == 0 {
		p("  none\n")
	}
	for _, wn := range r.Warnings {
		p("  [%s]\t%s\t%s\n", wn.Code, wn.Element, wn.Message)
	}
	return tw.Flush()
}

// writeSpacing prints how tightly each gap must be held and the allowance it is measured against.
func writeSpacing(p func(string, ...any), r *optics.Report) {
	if len(r.Spacing) == 0 {
		return
	}
	b := r.SpacingBasis
	switch b.Kind {
	case optics.SpacingDepthOfFocus:
		p("\nSPACING at %s nm: depth of focus ± %s mm at %s (lambda/(2 NA'^2), NA' %s)\n", fmtNum(b.WavelengthNM), opt(b.DepthOfFocusMM), b.Reference, opt(b.ImageNA))
		p("  id\tgap mm\timage shift per mm\tdefocus per mm\thold gap within ± mm\n")
		for _, s := range r.Spacing {
			p("  %s\t%s\t%s\t%s\t%s\n", s.ID, fmtNum(s.GapMM), opt(s.ImageShiftPerMM), opt(s.DefocusPerMM), opt(s.ToleranceMM))
		}
	case optics.SpacingDiffractionAngle:
		p("\nSPACING at %s nm: collimated output: divergence allowed %s rad (lambda/(pi w), w %s mm)\n", fmtNum(b.WavelengthNM), opt(b.DivergenceRad), opt(b.OutputRadiusMM))
		p("  id\tgap mm\tdivergence rad per mm\thold gap within ± mm\n")
		for _, s := range r.Spacing {
			p("  %s\t%s\t%s\t%s\n", s.ID, fmtNum(s.GapMM), opt(s.DivergencePerMM), opt(s.ToleranceMM))
		}
	}
	p("  (- : the gap does not matter to first order)\n")
}

func writeBlur(p func(string, ...any), r *optics.Report) {
	if len(r.Blur) == 0 {
		return
	}
	p("\nBLUR AT SCREENS\tfield\twavelength nm\trays\tRMS um\tlargest um\tAiry radius um\n")
	um := func(v float64) string { return fmtNum(v * 1000) }
	for _, b := range r.Blur {
		airy := "-"
		if b.AiryRadiusMM != nil {
			airy = um(*b.AiryRadiusMM)
		}
		p("  %s\t%s\t%s\t%d of %d\t%s\t%s\t%s\n", b.Element, b.Field, fmtNum(b.WavelengthNM), b.Rays, b.Traced, um(b.RMSMM), um(b.PeakMM), airy)
	}
}

func writeRayCounts(p func(string, ...any), r *optics.Report) {
	counts := map[string]int{}
	for _, ray := range r.Rays {
		counts[ray.Status]++
	}
	p("\nRAYS\t%d traced\tok %d\tclipped %d\ttir %d\tmissed %d\n", len(r.Rays),
		counts[optics.RayOK], counts[optics.RayClipped], counts[optics.RayTIR], counts[optics.RayMissed])
	for _, ray := range r.Rays {
		if ray.Status != optics.RayOK {
			p("  %s\t%s at %s\t%s\n", ray.Name, ray.Status, ray.StoppedAt, ray.Reason)
		}
	}
}

func writeBeam(p func(string, ...any), b *optics.BeamReport) {
	if b == nil {
		return
	}
	p("\nBEAM at %s nm, M² %s\tw_t mm\tw_s mm\tR_t mm\tR_s mm\ttransmitted\n", fmtNum(b.WavelengthNM), fmtNum(b.M2))
	for _, e := range b.Elements {
		p("  %s\t%s\t%s\t%s\t%s\t%.4f\n", e.ID, fmtNum(e.WTMM), fmtNum(e.WSMM), opt(e.RTMM), opt(e.RSMM), e.Transmitted)
	}
	p("\nWAISTS\tafter\tpath mm\tradius t/s mm\tRayleigh range t/s mm\n")
	for _, wst := range b.Waists {
		after := "source"
		if wst.After != nil {
			after = *wst.After
		}
		p("  \t%s\t%s\t%s / %s\t%s / %s\n", after, fmtNum(wst.PathMM), opt(wst.RadiusTMM), opt(wst.RadiusSMM), opt(wst.RayleighTMM), opt(wst.RayleighSMM))
	}
}

func opt(v *float64) string {
	if v == nil {
		return "-"
	}
	return fmtNum(*v)
}

// fmtNum prints six significant digits, without trailing zeros.
func fmtNum(v float64) string { return fmt.Sprintf("%.6g", v) }

func joinNums(vs []float64) string {
	parts := make([]string, len(vs))
	for i, v := range vs {
		parts[i] = fmtNum(v)
	}
	return strings.Join(parts, ", ")
}

func yesNo(b bool) string {
	if b {
		return "yes"
	}
	return "no"
}
