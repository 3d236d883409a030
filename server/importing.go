package server

import (
	"encoding/json"
	"io"
	"mime"
	"net/http"
	"strings"

	"github.com/go-chi/chi/v5"

	"raytable/optics"
	"raytable/server/demo"
	"raytable/server/store"
	"raytable/web/view"
)

// importBench stores a bench file sent as the request body (JSON) or as a form (file field
// `bench`, or pasted text in `bench_text`) and answers 303 to the new revision, which joins this browser's recent designs. Other bodies answer 415. A body that is not
// a bench file (broken JSON, an unknown key, a wrong type) answers 400, a well-formed bench that
// breaks a rule 422 as the edit form does (statusByCode), with every problem named by its path:
// as JSON to a JSON request, on the start page otherwise.
func (s *Server) importBench(w http.ResponseWriter, r *http.Request) {
	ct := r.Header.Get("Content-Type")
	mt, _, _ := mime.ParseMediaType(ct)
	isForm := mt == "multipart/form-data" || mt == "application/x-www-form-urlencoded"
	if !isForm && mt != "application/json" {
		// A page on another site may post text/plain without asking first; the origin check
		// refuses it, and this keeps a bench from arriving in any body a browser form can make
		// up without the page's own form.
		if ct == "" {
			ct = "none"
		}
		writeJSONError(w, http.StatusUnsupportedMediaType, optics.Errorf(eUnsupported,
			"send the bench as application/json, or as a form (multipart/form-data or application/x-www-form-urlencoded); Content-Type was %s", ct))
		return
	}
	data, err := importData(r, isForm)
	if err == nil && len(strings.TrimSpace(string(data))) == 0 {
		msg := "no bench file was given: choose a file or paste its JSON"
		err = &optics.Error{Code: eBadRequest, Message: msg, Problems: []optics.Problem{{Message: msg}}}
	}
	var b *optics.Bench
	if err == nil {
		b, err = optics.Decode(data)
		err = malformedOrRule(data, err)
	}
	var rev store.Revision
	if err == nil {
		rev, err = s.storeValid(b, "imported")
	}
	if err != nil {
		status := statusOf(err)
		if status >= 500 && !storeRefusal(err) {
			s.fail(w, r, err)
			return
		}
		if !isForm {
			writeJSONError(w, status, err)
			return
		}
		p := view.HomePage{ImportError: problemLines(err)}
		if len(data) <= maxBodyBytes {
			p.ImportText = string(data)
		}
		s.renderHome(w, r, status, p)
		return
	}
	s.openRevision(w, r, rev.ID)
}

// malformedOrRule sorts a failed Decode: a body that is not a bench file at all (broken JSON, an
// unknown key, a wrong type) is a bad request (400); a well-formed bench that breaks a rule keeps
// its EInvalid code (422). Only DecodeTrusted, which reads as strictly but judges no rule, tells
// the two apart, so it runs on the refused body alone.
func malformedOrRule(data []byte, err error) error {
	var e *optics.Error
	if !asOptics(err, &e) || e.Code != optics.EInvalid {
		return err
	}
	if _, readErr := optics.DecodeTrusted(data); readErr == nil {
		return err
	}
	return &optics.Error{Code: eBadRequest, Message: e.Message, Problems: e.Problems}
}

// importData reads the bench file from the body or the form.
func importData(r *http.Request, isForm bool) ([]byte, error) {
	if !isForm {
		data, err := io.ReadAll(r.Body)
		if err != nil {
			return nil, bodyError(err)
		}
		return data, nil
	}
	if _, err := postedForm(r); err != nil {
		return nil, err
	}
	if r.MultipartForm != nil {
		if files := r.MultipartForm.File["bench"]; len(files) > 0 && files[0].Size > 0 {
			f, err := files[0].Open()
			if err != nil {
				return nil, bodyError(err)
			}
			defer f.Close()
			data, err := io.ReadAll(io.LimitReader(f, maxBodyBytes+1))
			if err != nil {
				return nil, bodyError(err)
			}
			return data, nil
		}
	}
	if t := r.PostForm.Get("bench_text"); strings.TrimSpace(t) != "" {
		return []byte(t), nil
	}
	return []byte(r.PostForm.Get("bench")), nil
}

func problemLines(err error) []string {
	var lines []string
	for _, p := range optics.ErrorProblems(err) {
		lines = append(lines, p.String())
	}
	if len(lines) == 0 {
		lines = []string{err.Error()}
	}
	return lines
}

// jsonError is the body of a failed JSON request.
type jsonError struct {
	Error    string           `json:"error"`
	Problems []optics.Problem `json:"problems,omitempty"`
}

func writeJSONError(w http.ResponseWriter, status int, err error) {
	body := jsonError{Error: err.Error(), Problems: optics.ErrorProblems(err)}
	var e *optics.Error
	if asOptics(err, &e) && e.Message != "" {
		body.Error = e.Message
	}
	w.Header().Set("Content-Type", "application/json")
	w.WriteHeader(status)
	json.NewEncoder(w).Encode(body)
}

// demo stores a fresh copy of the demo bench and answers 303 to it.
func (s *Server) demo(w http.ResponseWriter, r *http.Request) {
	s.startFrom(w, r, demo.Bench, "the demo")
}

// demoPage answers GET /demo with the button that starts the demo: a GET stores nothing.
func (s *Server) demoPage(w http.ResponseWriter, r *http.Request) {
	s.render(w, r, http.StatusOK, view.StartOne(view.StartChoice{}))
}

// demoNamedPage answers GET /demo/{name} with the button that starts that bench.
func (s *Server) demoNamedPage(w http.ResponseWriter, r *http.Request) {
	st, ok := demo.StartNamed(chi.URLParam(r, "name"))
	if !ok {
		s.fail(w, r, optics.Errorf(optics.ENotFound, "there is no start bench %q", chi.URLParam(r, "name")))
		return
	}
	s.render(w, r, http.StatusOK, view.StartOne(startChoice(st)))
}

// startChoice is how the pages offer a start bench: a button posting to /demo/{name}.
func startChoice(st demo.Start) view.StartChoice {
	return view.StartChoice{Action: "/demo/" + st.Name, Button: st.Button, About: st.About, TestID: "start-" + st.Name}
}

// demoNamed stores a fresh copy of one of the other start benches (demo.Starts).
func (s *Server) demoNamed(w http.ResponseWriter, r *http.Request) {
	st, ok := demo.StartNamed(chi.URLParam(r, "name"))
	if !ok {
		s.fail(w, r, optics.Errorf(optics.ENotFound, "there is no start bench %q", chi.URLParam(r, "name")))
		return
	}
	s.startFrom(w, r, st.Bench, "the "+st.Name+" demo")
}

// startFrom stores a fresh copy of an embedded bench, adds it to this browser's recent designs and
// answers 303 to it.
func (s *Server) startFrom(w http.ResponseWriter, r *http.Request, data []byte, name string) {
	b, err := optics.Decode(data)
	if err != nil {
		s.fail(w, r, optics.Errorf(optics.EInternal, "the embedded bench %s does not decode: %v", name, err))
		return
	}
	rev, err := s.storeValid(b, "started from "+name)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	s.openRevision(w, r, rev.ID)
}

// storeValid stores a bench that Decode has just read and checked as a new revision without a
// parent: the bench is encoded once, canonically, and not checked again.
func (s *Server) storeValid(b *optics.Bench, start string) (store.Revision, error) {
	data, err := optics.EncodeValid(b)
	if err != nil {
		return store.Revision{}, err
	}
	return s.storeBench(b, data, nil, start)
}
