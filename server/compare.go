package server

import (
	"math"
	"net/http"
	"regexp"
	"strings"

	"raytable/optics"
	"raytable/web/diagram"
	"raytable/web/view"
)

// linkID finds a revision id in what was pasted: a bare id or any link containing /r/{id}.
var linkID = regexp.MustCompile(`(?:^|/r/)([a-z2-7]{24})(?:$|[/?#])`)

func idFromInput(s string) (string, bool) {
	m := linkID.FindStringSubmatch(strings.TrimSpace(s))
	if m == nil {
		return "", false
	}
	return m[1], true
}

// compare shows two revisions on one common scale with every number of both. Without inputs it
// shows only the form.
func (s *Server) compare(w http.ResponseWriter, r *http.Request) {
	q := r.URL.Query()
	p := view.ComparePage{InputA: q.Get("a"), InputB: q.Get("b")}
	if strings.TrimSpace(p.InputA) == "" && strings.TrimSpace(p.InputB) == "" {
		s.render(w, r, http.StatusOK, view.Compare(p))
		return
	}
	status := http.StatusOK
	var ds [2]design
	for i, in := range []string{p.InputA, p.InputB} {
		name := []string{"first", "second"}[i]
		id, ok := idFromInput(in)
		if !ok {
			p.Errors = append(p.Errors, "The "+name+" entry is not a design link or id: paste a link such as /r/… or the id itself.")
			status = http.StatusBadRequest
			continue
		}
		d, err := s.loadID(id)
		if err != nil {
			if optics.ErrorCode(err) != optics.ENotFound {
				s.fail(w, r, err)
				return
			}
			p.Errors = append(p.Errors, "The "+name+" design ("+id+") does not exist.")
			if status == http.StatusOK {
				status = http.StatusNotFound
			}
			continue
		}
		ds[i] = d
	}
	if len(p.Errors) > 0 {
		s.render(w, r, status, view.Compare(p))
		return
	}
	ra, err := s.report(ds[0])
	if err != nil {
		s.fail(w, r, err)
		return
	}
	rb, err := s.report(ds[1])
	if err != nil {
		s.fail(w, r, err)
		return
	}
	// One common scale: the larger path length and the coarser mm-per-px of the two.
	so := diagram.SideOptions{WidthPX: pageSideWidthPX, HeightPX: pageSideHeightPX}
	so.Exaggeration = math.Min(autoExaggeration(ra, so), autoExaggeration(rb, so))
	so.ZMaxMM = math.Max(diagram.PathLengthMM(ra), diagram.PathLengthMM(rb))
	so.MMPerPX = math.Max(diagram.SideMMPerPX(ra, so), diagram.SideMMPerPX(rb, so))
	to := diagram.TableOptions{WidthPX: pageTableWidthPX}
	to.MMPerPX = math.Max(diagram.TableMMPerPX(ds[0].bench, ra, to), diagram.TableMMPerPX(ds[1].bench, rb, to))
	side := func(d design, rep *optics.Report) view.CompareSide {
		return view.CompareSide{
			ID: d.rev.ID, URL: "/r/" + d.rev.ID, Title: title(d.bench),
			SideSVG:  inlineSVG(diagram.Side(rep, so)),
			TableSVG: inlineSVG(diagram.Table(d.bench, rep, to)),
		}
	}
	p.A, p.B = side(ds[0], ra), side(ds[1], rb)
	p.Rows, p.Changed = compareRows(ra, rb)
	p.HasResult = true
	p.InputA, p.InputB = ds[0].rev.ID, ds[1].rev.ID
	s.render(w, r, http.StatusOK, view.Compare(p))
}
