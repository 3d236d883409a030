package server

import (
	"bytes"
	"context"
	"encoding/json"
	"net/http"
	"time"

	"github.com/go-chi/chi/v5"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/server/store"
	"raytable/web/diagram"
	"raytable/web/view"
)

// defaultComputeDeadline is how long one report may take to compute when Config does not say. A
// bench within the work budget (optics.MaxRayFaces) takes at most about a second on two cores;
// the deadline is the guard for a machine that is busy or slow.
const defaultComputeDeadline = 5 * time.Second

// analyzeWithin is the server's analysis: the work budget (an over-budget bench is refused with
// optics.EOverBudget, 422, before anything is traced), then the computation under the deadline
// (optics.EDeadline, 503, once it passes). The deadline runs from the start of the computation,
// not from the request: a cached report serves every later request, so one client leaving does
// not stop the work another is waiting for.
func (s *Server) analyzeWithin(b *optics.Bench) (*optics.Report, error) {
	ctx, cancel := context.WithTimeout(context.Background(), s.deadline)
	defer cancel()
	return analysis.RunContext(ctx, b)
}

// design is one stored revision, decoded.
type design struct {
	rev   store.Revision
	bench *optics.Bench
}

// load finds the revision named in the URL. A malformed id cannot exist, so it is 404 like a
// missing one, without asking the store.
func (s *Server) load(r *http.Request) (design, error) {
	return s.loadID(chi.URLParam(r, "id"))
}

func (s *Server) loadID(id string) (design, error) {
	if !store.ValidID(id) {
		return design{}, optics.Errorf(optics.ENotFound, "there is no design %q", id)
	}
	rev, err := s.store.Get(id)
	if err != nil {
		return design{}, err
	}
	// The decoded bench is kept with the revision's other results, so a page view of a kept
	// revision decodes nothing; handlers only read it.
	b, err := memo(s.cache, id, artifact{kind: artBench}, func() (*optics.Bench, error) {
		// Trusted: storeBench is the only writer of revisions, and it stores a bench only after
		// Validate accepted it, as its one encoding; a revision never changes after that. Checking
		// the rules again on every read would only repeat that verdict.
		b, err := optics.DecodeTrusted(rev.Bench)
		if err != nil {
			// The bytes were encoded by this program; failing now is a bug, not the user's input.
			return nil, optics.Errorf(optics.EInternal, "stored revision %s no longer decodes: %v", id, err)
		}
		return b, nil
	})
	if err != nil {
		return design{}, err
	}
	return design{rev: rev, bench: b}, nil
}

// report is the report of a stored revision, computed once and then kept in the cache. A valid
// bench always gives one; an unsaved bench (a preview) is computed with s.analyze directly.
func (s *Server) report(d design) (*optics.Report, error) {
	return memo(s.cache, d.rev.ID, artifact{kind: artReport}, func() (*optics.Report, error) {
		return s.analyze(d.bench)
	})
}

// reportJSONBytes is a stored revision's report as `raytable report --json` prints it.
func (s *Server) reportJSONBytes(d design) ([]byte, error) {
	rep, err := s.report(d)
	if err != nil {
		return nil, err
	}
	return memo(s.cache, d.rev.ID, artifact{kind: artReportJSON}, func() ([]byte, error) {
		var buf bytes.Buffer
		enc := json.NewEncoder(&buf)
		enc.SetIndent("", "  ")
		if err := enc.Encode(rep); err != nil {
			return nil, err
		}
		return buf.Bytes(), nil
	})
}

// revResult is a stored revision's diagrams and numbers at the sizes o gives.
func (s *Server) revResult(d design, o view.DrawOptions) (view.Result, error) {
	rep, err := s.report(d)
	if err != nil {
		return view.Result{}, err
	}
	return memo(s.cache, d.rev.ID, artifact{kind: artResult, opts: o}, func() (view.Result, error) {
		return view.NewResult(rep, o), nil
	})
}

// revSVG is one standalone drawing of a stored revision: artSideSVG (at the page size, with or
// without the paraxial overlay, of one arm), artTableSVG or artPlanSVG.
func (s *Server) revSVG(d design, kind string, paraxial bool, arm string) ([]byte, error) {
	rep, err := s.report(d)
	if err != nil {
		return nil, err
	}
	a := artifact{kind: kind}
	if kind == artSideSVG {
		a.opts = view.PageDrawing.WithParaxial(paraxial).WithArm(view.KnownArm(rep, arm))
	}
	return memo(s.cache, d.rev.ID, a, func() ([]byte, error) {
		switch kind {
		case artSideSVG:
			side := view.SideReport(rep, a.opts.Arm)
			return diagram.Side(side, a.opts.Side(side)), nil
		case artTableSVG:
			return diagram.Table(rep, view.PageDrawing.Table()), nil
		case artPlanSVG:
			return diagram.Plan(rep), nil
		}
		return nil, optics.Errorf(optics.EInternal, "no drawing named %q", kind)
	})
}

// links are the addresses of one revision's pages.
func links(d design, paraxial bool) view.Links {
	base := "/r/" + d.rev.ID
	l := view.Links{
		Share: base, Edit: base, View: base + "/view", History: base + "/history",
		BenchJSON: base + "/bench.json", ReportJSON: base + "/report.json",
		SideSVG: base + "/side.svg", TableSVG: base + "/table.svg", PlanSVG: base + "/plan.svg",
		Paraxial: base + "?paraxial=1", ParaxialOn: paraxial,
	}
	if paraxial {
		l.Paraxial = base
		l.SideSVG += "?paraxial=1"
	}
	if d.rev.Parent != "" {
		l.CompareParent = "/compare?a=" + d.rev.Parent + "&b=" + d.rev.ID
	}
	return l
}

// when writes a revision's time for people, in UTC so that shared links read the same everywhere.
func when(d design) string { return d.rev.Created.UTC().Format("2006-01-02 15:04 UTC") }
