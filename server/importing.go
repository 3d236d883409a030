package server

import (
	"encoding/json"
	"github.com/go-chi/chi/v5"
	"io"
	"mime"
	"net/http"
	"strings"

	"raytable/optics"
	"raytable/server/demo"
	"raytable/server/store"
	"raytable/web/view"
)

// importBench stores a bench file sent as the request body (JSON) or as a form (file field
// `bench`, or pasted text in `bench_text`) and answers 303 to the new revision. A body that is not
// a bench file (broken JSON, an unknown key, a wrong type) answers 400, a well-formed bench that
// breaks a rule 422 as the edit form does (statusByCode), with every problem named by its path:
// as JSON to a JSON request, on the start page otherwise.
func (s *Server) importBench(w http.ResponseWriter, r *http.Request) {
	mt, _, _ := mime.ParseMediaType(r.Header.Get("Content-Type"))
	isForm := mt == "multipart/form-data" || mt == "application/x-www-form-urlencoded"
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
	http.Redirect(w, r, "/r/"+rev.ID, http.StatusSeeOther)
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

// demoNamed stores a fresh copy of one of the other start benches (demo.Starts).
func (s *Server) demoNamed(w http.ResponseWriter, r *http.Request) {
	st, ok := demo.StartNamed(chi.URLParam(r, "name"))
	if !ok {
		s.fail(w, r, optics.Errorf(optics.ENotFound, "there is no start bench %q", chi.URLParam(r, "name")))
		return
	}
	s.startFrom(w, r, st.Bench, "the "+st.Name+" demo")
}

// startFrom stores a fresh copy of an embedded bench and answers 303 to it.
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
	http.Redirect(w, r, "/r/"+rev.ID, http.StatusSeeOther)
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
