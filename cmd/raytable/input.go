package main

import (
	"errors"
	"fmt"
	"io"
	"os"

	"raytable/optics"
	"raytable/optics/analysis"
)

// maxBenchBytes caps a bench file read from disk or standard input.
const maxBenchBytes = 1 << 20

// computeBench reads, decodes and computes a bench from a path, or from standard input for "-".
// On failure it prints what went wrong and returns the exit status to use.
func computeBench(e env, path string) (*optics.Report, int) {
	data, err := readInput(e, path)
	if err != nil {
		fmt.Fprintf(e.stderr, "raytable: %v\n", err)
		return nil, exitInvalid
	}
	b, err := optics.Decode(data) // Decode validates; the report then needs no second check
	if err == nil {
		return analysis.RunValid(b), exitOK
	}
	if code := optics.ErrorCode(err); code == optics.EInternal {
		fmt.Fprintf(e.stderr, "raytable: internal failure: %v\n", err)
		return nil, exitInternal
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

func readInput(e env, path string) ([]byte, error) {
	var r io.Reader = e.stdin
	if path != "-" {
		f, err := os.Open(path)
		if err != nil {
			return nil, err
		}
		defer f.Close()
		r = f
	}
	data, err := io.ReadAll(io.LimitReader(r, maxBenchBytes+1))
	if err != nil {
		return nil, err
	}
	if len(data) > maxBenchBytes {
		return nil, errors.New(displayName(path) + " is larger than 1 MiB")
	}
	return data, nil
}

func displayName(path string) string {
	if path == "-" {
		return "standard input"
	}
	return path
}
