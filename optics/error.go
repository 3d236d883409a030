package optics

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

var inf = math.Inf(1)

// Error codes. The server maps each to an HTTP status, the command line to an exit status.
const (
	EInvalid  = "invalid"   // the input breaks a rule; Problems says where
	ENotFound = "not_found" // a stored design does not exist
	ETooLarge = "too_large" // the input is larger than raytable accepts
	EInternal = "internal"  // a bug or an environment failure

	EOverBudget = "over_budget" // the bench is valid but would cost more work than one report may (MaxRayFaces)
	EDeadline   = "deadline"    // computing took longer than the request allows
)

// Problem is one broken rule, at a JSON path such as "elements[2].faces_mm[0]".
type Problem struct {
	Path    string `json:"path"`
	Message string `json:"message"`
}

func (p Problem) String() string {
	if p.Path == "" {
		return p.Message
	}
	return p.Path + ": " + p.Message
}

// Error is raytable's error for anything a user can act on. Internal failures are plain errors.
type Error struct {
	Code     string
	Message  string
	Problems []Problem
}

func (e *Error) Error() string {
	if len(e.Problems) == 0 {
		return e.Message
	}
	lines := make([]string, 0, len(e.Problems)+1)
	if e.Message != "" {
		lines = append(lines, e.Message)
	}
	for _, p := range e.Problems {
		lines = append(lines, p.String())
	}
	return strings.Join(lines, "\n")
}

// Errorf returns an *Error with the given code and message.
func Errorf(code, format string, args ...any) *Error {
	return &Error{Code: code, Message: fmt.Sprintf(format, args...)}
}

// Invalid returns an EInvalid error carrying problems, or nil when there are none.
func Invalid(problems []Problem) error {
	if len(problems) == 0 {
		return nil
	}
	return &Error{Code: EInvalid, Message: fmt.Sprintf("the bench has %d problem(s)", len(problems)), Problems: problems}
}

// ErrorCode returns the code of an *Error in err's chain, or EInternal.
func ErrorCode(err error) string {
	var e *Error
	if errors.As(err, &e) {
		return e.Code
	}
	return EInternal
}

// ErrorProblems returns the problems of an *Error in err's chain.
func ErrorProblems(err error) []Problem {
	var e *Error
	if errors.As(err, &e) {
		return e.Problems
	}
	return nil
}
