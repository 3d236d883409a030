package view

import (
	"bytes"
	"math"
	"strings"

	"raytable/optics"
	"raytable/web/diagram"
)

// Drawing sizes in px: the bench page, and the larger presentation view.
const (
	pageSideWidthPX     = 960
	pageSideHeightPX    = 360
	pageTableWidthPX    = 960
	presentSideWidthPX  = 1400
	presentSideHeightPX = 520
	presentTableWidthPX = 1400
)

// DrawOptions choose how a result is drawn: the sizes of the two views and the paraxial overlay.
// It is comparable, so that a cache can key drawings by it.
type DrawOptions struct {
	SideWidthPX, SideHeightPX, TableWidthPX int
	Paraxial                                bool
	Arm                                     string // the arm the side view shows; "" the main one
}

var (
	// PageDrawing is the size of the diagrams on the bench page, the compare page and the
	// standalone SVG downloads.
	PageDrawing = DrawOptions{SideWidthPX: pageSideWidthPX, SideHeightPX: pageSideHeightPX, TableWidthPX: pageTableWidthPX}
	// PresentDrawing is the larger size of the presentation view.
	PresentDrawing = DrawOptions{SideWidthPX: presentSideWidthPX, SideHeightPX: presentSideHeightPX, TableWidthPX: presentTableWidthPX}
)

// WithParaxial is o with the paraxial overlay on or off.
func (o DrawOptions) WithParaxial(on bool) DrawOptions {
	o.Paraxial = on
	return o
}

// Side is the side view's options at o's size, with the automatic vertical exaggeration.
func (o DrawOptions) Side(r *optics.Report) diagram.SideOptions {
	so := diagram.SideOptions{WidthPX: o.SideWidthPX, HeightPX: o.SideHeightPX, ShowParaxial: o.Paraxial}
	so.Exaggeration = AutoExaggeration(r, so)
	return so
}

// WithArm is o showing arm id in the side view; the main arm is the default and so is "".
func (o DrawOptions) WithArm(id string) DrawOptions {
	if id == MainArm {
		id = ""
	}
	o.Arm = id
	return o
}

// Table is the table view's options at o's size.
func (o DrawOptions) Table() diagram.TableOptions {
	return diagram.TableOptions{WidthPX: o.TableWidthPX}
}

// NewResult draws a computed bench: the side and table views inline, and the numbers.
// The side view shows one arm (o.Arm; the main one by default) and the result lists the arms to
// choose from.
func NewResult(r *optics.Report, o DrawOptions) Result {
	side := SideReport(r, o.Arm)
	return Result{
		SideSVG:  InlineSVG(diagram.Side(side, o.Side(side))),
		TableSVG: InlineSVG(diagram.Table(r, o.Table())),
		Numbers:  NumbersPanel(r),
		Arms:     armLinks(r, o.Arm),
		Power:    optics.PowerLevels(r),
	}
}

// CompareSides draws two computed benches on one common scale at the page size: the longer path,
// the coarser mm-per-px and the smaller vertical exaggeration of the two, so that equal lengths
// look equal side by side.
func CompareSides(ba *optics.Bench, ra *optics.Report, bb *optics.Bench, rb *optics.Report) (a, b CompareSide) {
	o := PageDrawing
	so := diagram.SideOptions{WidthPX: o.SideWidthPX, HeightPX: o.SideHeightPX}
	so.Exaggeration = math.Min(AutoExaggeration(ra, so), AutoExaggeration(rb, so))
	so.ZMaxMM = math.Max(diagram.PathLengthMM(ra), diagram.PathLengthMM(rb))
	so.MMPerPX = math.Max(diagram.SideMMPerPX(ra, so), diagram.SideMMPerPX(rb, so))
	to := o.Table()
	to.MMPerPX = math.Max(diagram.TableMMPerPX(ra, to), diagram.TableMMPerPX(rb, to))
	side := func(bench *optics.Bench, rep *optics.Report) CompareSide {
		return CompareSide{
			Title:    BenchTitle(bench),
			SideSVG:  InlineSVG(diagram.Side(rep, so)),
			TableSVG: InlineSVG(diagram.Table(rep, to)),
		}
	}
	return side(ba, ra), side(bb, rb)
}

// InlineSVG drops the XML prolog and leading comments of a standalone SVG so that it can sit
// inside an HTML page.
func InlineSVG(svg []byte) string {
	if i := bytes.Index(svg, []byte("<svg")); i > 0 {
		svg = svg[i:]
	}
	return strings.TrimSpace(string(svg))
}

// BenchTitle is the title a bench is shown under; an untitled one gets a plain name.
func BenchTitle(b *optics.Bench) string {
	if strings.TrimSpace(b.Title) == "" {
		return "Untitled bench"
	}
	return b.Title
}
