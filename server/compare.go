package server

import (
	"net/http"
	"regexp"
	"strings"

	"raytable/optics"
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
		if strings.TrimSpace(in) == "" {
			p.Errors = append(p.Errors, "The "+name+" entry is empty: paste a link such as /r/… or the id of the design to compare.")
			status = http.StatusBadRequest
			continue
		}
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
	p.A, p.B = view.CompareSides(ds[0].bench, ra, ds[1].bench, rb)
	for i, side := range []*view.CompareSide{&p.A, &p.B} {
		side.ID, side.URL = ds[i].rev.ID, "/r/"+ds[i].rev.ID
	}
	p.Rows, p.Changed = view.CompareRows(ra, rb)
	p.HasResult = true
	p.InputA, p.InputB = ds[0].rev.ID, ds[1].rev.ID
	s.render(w, r, http.StatusOK, view.Compare(p))
}
