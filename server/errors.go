package server

import (
	"errors"
	"net/http"
	"strings"
	"syscall"

	"raytable/optics"
	"raytable/server/store"
	"raytable/web/view"
)

// Codes of the server's own errors, about the HTTP request rather than the bench in it.
const (
	eBadRequest  = "bad_request"   // the body cannot be read as what it claims to be
	eUnsupported = "unsupported"   // the body is of a type the route does not take
	eForbidden   = "forbidden"     // a request that changes state came from a page of another site
	eWrongHost   = "wrong_host"    // the Host header is not one this server answers for
	eRateLimited = "rate_limited"  // this client has written too often; answered with Retry-After
	eStoreFull   = store.EFull     // the store reached its size limit, or its disk is full
	eReadOnly    = store.EReadOnly // the server serves its store without writing
)

// statusByCode is the one table from error codes to HTTP statuses: a malformed body 400, a
// well-formed bench that breaks a rule 422 (on /import as on the edit form), too large 413, too
// many writes 429, a full store 507, a read-only one 503.
var statusByCode = map[string]int{
	optics.EInvalid:    http.StatusUnprocessableEntity,
	optics.ENotFound:   http.StatusNotFound,
	optics.ETooLarge:   http.StatusRequestEntityTooLarge,
	optics.EInternal:   http.StatusInternalServerError,
	eBadRequest:        http.StatusBadRequest,
	eUnsupported:       http.StatusUnsupportedMediaType,
	eForbidden:         http.StatusForbidden,
	eWrongHost:         http.StatusMisdirectedRequest,
	eRateLimited:       http.StatusTooManyRequests,
	eStoreFull:         http.StatusInsufficientStorage,
	eReadOnly:          http.StatusServiceUnavailable,
	optics.EOverBudget: http.StatusUnprocessableEntity,
	optics.EDeadline:   http.StatusServiceUnavailable,
}

// statusOf maps an error to its status; anything not an *optics.Error is internal.
func statusOf(err error) int {
	if s, ok := statusByCode[optics.ErrorCode(err)]; ok {
		return s
	}
	return http.StatusInternalServerError
}

// titles are the headings of error pages by status.
var titles = map[int]string{
	http.StatusBadRequest:            "That request could not be read",
	http.StatusForbidden:             "That request came from another site",
	http.StatusNotFound:              "No such page or design",
	http.StatusMethodNotAllowed:      "That page does not take this kind of request",
	http.StatusRequestEntityTooLarge: "That is too large",
	http.StatusUnsupportedMediaType:  "That kind of request body is not accepted here",
	http.StatusMisdirectedRequest:    "This server does not answer for that name",
	http.StatusUnprocessableEntity:   "The bench breaks a rule",
	http.StatusInternalServerError:   "Something went wrong on our side",
	http.StatusTooManyRequests:       "Too many changes in a short time",
	http.StatusInsufficientStorage:   "The store is full",
	http.StatusServiceUnavailable:    "Designs cannot be saved here now",
}

// storeFailure names a write the store refused for want of space: a full disk is the store's
// own limit reached, 507 with a message, never a 500.
func storeFailure(err error) error {
	if errors.Is(err, syscall.ENOSPC) {
		return optics.Errorf(eStoreFull, "the disk that holds the store is full: no more designs can be saved here (ask whoever runs this server)")
	}
	return err
}

// errorPage makes the page for an error. Internal errors show a plain sentence, never details.
func errorPage(status int, err error) view.ErrorPage {
	p := view.ErrorPage{Status: status, Title: titles[status]}
	if p.Title == "" {
		p.Title = http.StatusText(status)
	}
	// Only internal failures hide their message; a deadline (503) says what to reduce.
	if status >= 500 && optics.ErrorCode(err) == optics.EInternal {
		p.Message = "The failure has been logged. Please try again, or go back to the start page."
		return p
	}
	var e *optics.Error
	if errors.As(err, &e) {
		p.Message = e.Message
		for _, pr := range e.Problems {
			p.Problems = append(p.Problems, pr.String())
		}
	} else if err != nil {
		p.Message = err.Error()
	}
	return p
}

// bodyError turns a failure to read a request body into an optics error: too large, or unreadable.
func bodyError(err error) error {
	var mb *http.MaxBytesError
	if errors.As(err, &mb) || strings.Contains(err.Error(), "request body too large") {
		return optics.Errorf(optics.ETooLarge, "the request is larger than %d bytes (1 MiB), the most raytable accepts", maxBodyBytes)
	}
	return optics.Errorf(eBadRequest, "the request body could not be read: %v", err)
}

// storeRefusal reports whether err is the store declining a write (full or read-only): a 5xx
// status whose message is for the user, since nothing failed.
func storeRefusal(err error) bool {
	c := optics.ErrorCode(err)
	return c == eStoreFull || c == eReadOnly
}

func asOptics(err error, target **optics.Error) bool { return errors.As(err, target) }
