package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"runtime/debug"

	"raytable/optics"
	"raytable/optics/analysis"
)

// maxBenchBytes caps a bench file read from disk or standard input.
const maxBenchBytes = 1 << 20

// inputError is a failure to read the input that the user can fix: a missing or unreadable file,
// a directory, a file too large. Its message is the failure's own.
type inputError struct{ err error }

func (e inputError) Error() string { return e.err.Error() }

// computeBench reads, decodes and computes a bench from a path, or from standard input for "-".
// On failure it prints what went wrong and returns the exit status to use: 2 for input the user
// can fix (a bench that breaks a rule, a cap or the work budget), 1 for an internal failure,
// a panic included (Go's own exit status for a panic would be 2, and read as bad input).
func computeBench(e env, path string) (r *optics.Report, code int) {
	defer func() {
		if p := recover(); p != nil {
			fmt.Fprintf(e.stderr, "raytable: internal failure: %v\n%s", p, debug.Stack())
			r, code = nil, exitInternal
		}
	}()
	data, err := readInput(e, path)
	if err != nil {
		fmt.Fprintf(e.stderr, "raytable: %v\n", err)
		if errors.As(err, new(inputError)) {
			return nil, exitInvalid
		}
		return nil, exitInternal
	}
	b, err := optics.Decode(data) // Decode validates; the report then needs no second check
	if err == nil {
		// The command line has no deadline: the work budget bounds the time, and the user can
		// interrupt.
		r, err = analysis.RunContext(context.Background(), b)
	}
	if err == nil {
		return r, exitOK
	}
	switch optics.ErrorCode(err) {
	case optics.EInternal:
		fmt.Fprintf(e.stderr, "raytable: internal failure: %v\n", err)
		return nil, exitInternal
	case optics.EOverBudget:
		fmt.Fprintf(e.stderr, "raytable: %s is too large to compute:\n  %v\n", displayName(path), err)
		return nil, exitInvalid
	}
	fmt.Fprintf(e.stderr, "raytable: %s is not a valid bench:\n", displayName(path))
	if problems := optics.ErrorProblems(err); len(problems) > 0 {
		for _, p := range problems {
			fmt.Fprintf(e.stderr, "  %s\n", p)
		}
	} else {
		fmt.Fprintf(e.stderr, "  %v\n", err)
	}
	return nil, exitInvalid
}

// readInput reads the bench bytes. A file that cannot be opened or is too large is the user's to
// fix (inputError); a read that fails after the file opened is an environment failure.
func readInput(e env, path string) ([]byte, error) {
	var r io.Reader = e.stdin
	if path != "-" {
		f, err := os.Open(path)
		if err != nil {
			return nil, inputError{err}
		}
		defer f.Close()
		if st, err := f.Stat(); err == nil && st.IsDir() {
			return nil, inputError{fmt.Errorf("%s is a directory, not a bench file", path)}
		}
		r = f
	}
	data, err := io.ReadAll(io.LimitReader(r, maxBenchBytes+1))
	if err != nil {
		return nil, err
	}
	if len(data) > maxBenchBytes {
		return nil, inputError{errors.New(displayName(path) + " is larger than 1 MiB")}
	}
	return data, nil
}

func displayName(path string) string {
	if path == "-" {
		return "standard input"
	}
	return path
}
