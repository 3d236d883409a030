package server

import (
	"net/http"
	"net/url"
	"strings"

	"raytable/optics"
	"raytable/server/demo"
	"raytable/web/view"
)

func (s *Server) home(w http.ResponseWriter, r *http.Request) {
	s.renderHome(w, r, http.StatusOK, view.HomePage{})
}

func (s *Server) renderHome(w http.ResponseWriter, r *http.Request, status int, p view.HomePage) {
	revs, err := s.recentRevisions(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	for _, st := range demo.Starts {
		p.Starts = append(p.Starts, startChoice(st))
	}
	for _, rev := range revs {
		p.Recent = append(p.Recent, view.Recent{
			URL: "/r/" + rev.ID, Title: rev.Summary, Created: rev.Created.UTC().Format("2006-01-02 15:04 UTC"),
		})
	}
	s.render(w, r, status, view.Home(p))
}

// benchPage shows a revision with its form, diagrams and numbers.
func (s *Server) benchPage(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	paraxial := r.URL.Query().Get("paraxial") == "1"
	rep, err := s.report(d)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	arm := view.KnownArm(rep, r.URL.Query().Get("arm"))
	res, err := s.revResult(d, view.PageDrawing.WithParaxial(paraxial).WithArm(arm))
	if err != nil {
		s.fail(w, r, err)
		return
	}
	form := buildForm(d.rev.ID, d.bench, benchValues(d.bench), nil)
	if arm != "" { // previews while a slider moves keep showing this arm
		form.PreviewURL += "?arm=" + url.QueryEscape(arm)
	}
	p := s.benchPageModel(d, paraxial, form, res)
	if arm != "" {
		p.Links.SideSVG = addQuery(p.Links.SideSVG, "arm="+url.QueryEscape(arm))
	}
	rememberRevision(w, r, d.rev.ID)
	s.render(w, r, http.StatusOK, view.Bench(p))
}

func (s *Server) benchPageModel(d design, paraxial bool, form view.BenchForm, res view.Result) view.BenchPage {
	return view.BenchPage{ID: d.rev.ID, Title: view.BenchTitle(d.bench), Created: when(d), Links: links(d, paraxial), Form: form, Result: res}
}

// presentPage is the read-only view for showing a design to someone.
func (s *Server) presentPage(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	paraxial := r.URL.Query().Get("paraxial") == "1"
	res, err := s.revResult(d, view.PresentDrawing.WithParaxial(paraxial))
	if err != nil {
		s.fail(w, r, err)
		return
	}
	rememberRevision(w, r, d.rev.ID)
	s.render(w, r, http.StatusOK, view.Present(view.PresentPage{
		ID: d.rev.ID, Title: view.BenchTitle(d.bench), Notes: d.bench.Notes, Created: when(d),
		Links: links(d, paraxial), Result: res,
	}))
}

// maxHistory bounds the parent chain shown on one history page.
const maxHistory = 200

// history walks the parent chain from a revision back to its first ancestor.
func (s *Server) history(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	p := view.HistoryPage{ID: d.rev.ID, Title: view.BenchTitle(d.bench), Links: links(d, false)}
	cur := d
	for step := 0; ; step++ {
		if step == maxHistory {
			p.Truncated = true
			break
		}
		hs := view.HistoryStep{ID: cur.rev.ID, URL: "/r/" + cur.rev.ID, Created: when(cur), Title: view.BenchTitle(cur.bench), Current: step == 0}
		if cur.rev.Parent == "" {
			p.Steps = append(p.Steps, hs)
			break
		}
		parent, err := s.loadID(cur.rev.Parent)
		if err != nil {
			if optics.ErrorCode(err) != optics.ENotFound {
				s.fail(w, r, err)
				return
			}
			hs.Changes = []string{"(its parent is no longer stored)"}
			p.Steps = append(p.Steps, hs)
			break
		}
		hs.Changes = optics.Diff(parent.bench, cur.bench)
		if len(hs.Changes) == 0 {
			hs.Changes = []string{"no change"}
		}
		hs.CompareURL = "/compare?a=" + parent.rev.ID + "&b=" + cur.rev.ID
		p.Steps = append(p.Steps, hs)
		cur = parent
	}
	s.render(w, r, http.StatusOK, view.History(p))
}

// addQuery appends one query parameter to a link that may have others.
func addQuery(link, param string) string {
	if strings.Contains(link, "?") {
		return link + "&" + param
	}
	return link + "?" + param
}
