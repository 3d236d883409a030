package server

import (
	"bytes"
	"mime"
	"net/http"
	"net/url"
	"strings"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/server/store"
	"raytable/web/view"
)

// multipartMemory is how much of a multipart form is kept in memory; the body cap is the same.
const multipartMemory = maxBodyBytes

// postedForm parses a posted form, urlencoded or multipart, within the body cap. Any other body
// type is refused (415): Go would silently ignore it, and the edit would then read as a form
// with every field missing.
func postedForm(r *http.Request) (url.Values, error) {
	ct := r.Header.Get("Content-Type")
	mt, _, err := mime.ParseMediaType(ct)
	switch {
	case err == nil && mt == "multipart/form-data":
		err = r.ParseMultipartForm(multipartMemory)
	case err == nil && mt == "application/x-www-form-urlencoded":
		err = r.ParseForm()
	default:
		if ct == "" {
			ct = "none"
		}
		return nil, optics.Errorf(eUnsupported, "send the form as application/x-www-form-urlencoded or multipart/form-data (Content-Type was %s)", ct)
	}
	if err != nil {
		return nil, bodyError(err)
	}
	return r.PostForm, nil
}

// maxSummary bounds a revision's one-line summary.
const maxSummary = 200

// summarize is the line a revision shows in lists: what changed, or how it started.
func summarize(parent, b *optics.Bench, start string) string {
	s := view.BenchTitle(b)
	if parent == nil {
		s += " · " + start
	} else if lines := optics.Diff(parent, b); len(lines) > 0 {
		s += " · " + strings.Join(lines, "; ")
	}
	if len(s) > maxSummary {
		cut := maxSummary
		for cut > 0 && !utf8Start(s[cut]) {
			cut--
		}
		s = s[:cut] + "…"
	}
	return s
}

func utf8Start(c byte) bool { return c&0xC0 != 0x80 }

// storeBench saves a bench as a new revision and returns it. b has passed Validate and data is
// its one encoding (optics.EncodeValid); the store keeps those bytes as they are, and loadID
// relies on this being the only way a revision is written.
func (s *Server) storeBench(b *optics.Bench, data []byte, parent *design, start string) (store.Revision, error) {
	if err := analysis.CheckBudget(b); err != nil {
		return store.Revision{}, err // a design that could not be shown is not stored
	}
	id, err := store.NewID(s.random)
	if err != nil {
		return store.Revision{}, err
	}
	rev := store.Revision{ID: id, Created: s.now().UTC(), Bench: data}
	var pb *optics.Bench
	if parent != nil {
		rev.Parent = parent.rev.ID
		pb = parent.bench
	}
	rev.Summary = summarize(pb, b, start)
	return rev, storeFailure(s.store.Put(rev))
}

// problemsOf returns the problems of an EInvalid error, and ok=false for any other error.
func problemsOf(err error) ([]optics.Problem, bool) {
	if optics.ErrorCode(err) != optics.EInvalid {
		return nil, false
	}
	ps := optics.ErrorProblems(err)
	if len(ps) == 0 {
		ps = []optics.Problem{{Message: err.Error()}}
	}
	return ps, true
}

// readEdit parses the posted form into a bench and checks the rules on it, each once; problems are
// what the user must fix.
func readEdit(vals url.Values) (*optics.Bench, []optics.Problem, error) {
	b, problems := parseBenchForm(vals)
	if len(problems) > 0 {
		return b, problems, nil
	}
	if err := optics.Validate(b); err != nil {
		ps, ok := problemsOf(err)
		if !ok {
			return nil, nil, err
		}
		return b, ps, nil
	}
	return b, nil, nil
}

// edit stores the posted form as a new revision whose parent is this one and answers 303 to it.
// Invalid input re-renders the page with 422, each problem beside its field and the typed text
// kept; nothing is stored then.
func (s *Server) edit(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	vals, err := postedForm(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	b, problems, err := readEdit(vals)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	if len(problems) > 0 {
		values := benchValues(b)
		overlay(values, vals)
		s.invalidEdit(w, r, d, b, values, problems)
		return
	}
	action := vals.Get("action")
	if ps := applyAction(b, action, vals); len(ps) > 0 {
		values := benchValues(b)
		overlay(values, vals)
		s.invalidEdit(w, r, d, b, values, ps)
		return
	}
	// Save and apply store the bench checked above. An action that adds, deletes or moves an
	// element or ray made another bench (an element added to a full bench breaks the element
	// limit), so its result is checked as well; the posted fields had to pass first, as they must
	// whatever the button.
	if changesList(action) {
		if err := optics.Validate(b); err != nil {
			ps, ok := problemsOf(err)
			if !ok {
				s.fail(w, r, err)
				return
			}
			// The action changed the list, so the posted names no longer line up: show the bench itself.
			s.invalidEdit(w, r, d, b, benchValues(b), ps)
			return
		}
	}
	data, err := optics.EncodeValid(b)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	if bytes.Equal(data, d.rev.Bench) {
		http.Redirect(w, r, "/r/"+d.rev.ID, http.StatusSeeOther) // nothing changed: no new revision
		return
	}
	rev, err := s.storeBench(b, data, &d, "")
	if err != nil {
		s.fail(w, r, err)
		return
	}
	http.Redirect(w, r, "/r/"+rev.ID, http.StatusSeeOther)
}

// changesList reports whether the edit form's action changes the element or ray list (add,
// delete, up, down, add-ray, delete-ray) rather than storing the posted fields as they are ("",
// save, apply). applyAction has refused any other action before this is asked.
func changesList(action string) bool {
	verb, _, _ := strings.Cut(action, ":")
	return verb != "" && verb != "save" && verb != "apply"
}

// invalidEdit re-renders the bench page with the user's form and its problems (422). The diagrams
// and numbers are those of the stored revision, the last valid state.
func (s *Server) invalidEdit(w http.ResponseWriter, r *http.Request, d design, b *optics.Bench, values map[string]string, problems []optics.Problem) {
	var res view.Result
	if stored, err := s.revResult(d, view.PageDrawing); err == nil {
		res = stored
	} else {
		res.Problem = "The stored design could not be computed."
		s.log.Error("stored design does not compute", "id", d.rev.ID, "err", err)
	}
	form := buildForm(d.rev.ID, b, values, problems)
	s.render(w, r, http.StatusUnprocessableEntity, view.Bench(s.benchPageModel(d, false, form, res)))
}

// preview computes the posted form without storing anything and answers the diagrams and numbers
// as an HTML fragment, for the script to swap in while a slider moves.
func (s *Server) preview(w http.ResponseWriter, r *http.Request) {
	if _, err := s.load(r); err != nil {
		s.fail(w, r, err)
		return
	}
	vals, err := postedForm(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	b, problems, err := readEdit(vals)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	status := http.StatusOK
	var res view.Result
	if len(problems) > 0 {
		status = http.StatusUnprocessableEntity
		lines := make([]string, len(problems))
		for i, p := range problems {
			lines[i] = p.String()
		}
		res.Problem = "Cannot compute this: " + strings.Join(lines, "; ")
	} else {
		rep, err := s.analyze(b) // not a revision: never cached
		if err != nil {
			s.fail(w, r, err)
			return
		}
		res = view.NewResult(rep, view.PageDrawing.WithArm(view.KnownArm(rep, r.URL.Query().Get("arm"))))
	}
	s.render(w, r, status, view.ResultFragment(res))
}
