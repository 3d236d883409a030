package server

import (
	"errors"
	"net/http"
	"strings"

	"raytable/optics"
	"raytable/web/view"
)

// Codes of the server's own errors, about the HTTP request rather than the bench in it.
const (
	eBadRequest  = "bad_request" // the body cannot be read as what it claims to be
	eUnsupported = "unsupported" // the body is of a type the route does not take
)

// statusByCode is the one table from error codes to HTTP statuses. A bad import body is the
// exception: it answers 400 (see importBench), since the request itself is what is wrong.
var statusByCode = map[string]int{
	optics.EInvalid:    http.StatusUnprocessableEntity,
	optics.ENotFound:   http.StatusNotFound,
	optics.ETooLarge:   http.StatusRequestEntityTooLarge,
	optics.EInternal:   http.StatusInternalServerError,
	optics.EOverBudget: http.StatusUnprocessableEntity,
	optics.EDeadline:   http.StatusServiceUnavailable,
	eBadRequest:        http.StatusBadRequest,
	eUnsupported:       http.StatusUnsupportedMediaType,
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
	http.StatusNotFound:              "No such page or design",
	http.StatusMethodNotAllowed:      "That page does not take this kind of request",
	http.StatusRequestEntityTooLarge: "That is too large",
	http.StatusUnsupportedMediaType:  "That kind of request body is not accepted here",
	http.StatusUnprocessableEntity:   "The bench breaks a rule",
	http.StatusInternalServerError:   "Something went wrong on our side",
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

func asOptics(err error, target **optics.Error) bool { return errors.As(err, target) }
