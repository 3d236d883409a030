package main

import (
	"context"
	"encoding/json"
	"errors"
	"flag"
	"fmt"
)

// runReport prints the computed numbers of one bench file: aligned tables by default, the
// raytable/report/v1 JSON with --json.
func runReport(_ context.Context, e env) int {
	fs := flag.NewFlagSet("report", flag.ContinueOnError)
	fs.SetOutput(e.stderr)
	asJSON := fs.Bool("json", false, "print the report as JSON (format raytable/report/v1)")
	fs.Usage = func() {
		fmt.Fprintln(e.stderr, "usage: raytable report FILE|- [--json]")
		fs.PrintDefaults()
	}
	path, code, ok := oneFileArg(fs, e.args)
	if !ok {
		return code
	}
	_, r, code := readBench(e, path)
	if code != exitOK {
		return code
	}
	if *asJSON {
		enc := json.NewEncoder(e.stdout)
		enc.SetIndent("", "  ")
		if err := enc.Encode(r); err != nil {
			fmt.Fprintf(e.stderr, "raytable: %v\n", err)
			return exitInternal
		}
		return exitOK
	}
	if err := writeText(e.stdout, r); err != nil {
		fmt.Fprintf(e.stderr, "raytable: %v\n", err)
		return exitInternal
	}
	return exitOK
}

// oneFileArg parses flags placed before or after a single FILE argument. On failure it returns
// the exit status: 0 after -h (the usage was asked for), 2 for bad usage.
func oneFileArg(fs *flag.FlagSet, args []string) (string, int, bool) {
	var files []string
	for {
		if err := fs.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				return "", exitOK, false
			}
			return "", exitInvalid, false
		}
		args = fs.Args()
		if len(args) == 0 {
			break
		}
		files = append(files, args[0])
		args = args[1:]
	}
	if len(files) != 1 {
		fs.Usage()
		return "", exitInvalid, false
	}
	return files[0], exitOK, true
}
