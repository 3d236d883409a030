package main

import (
	"context"
	"encoding/json"
	"errors"
	"flag"
	"fmt"

	"raytable/optics"
)

// runReport prints the computed numbers of one bench file: aligned tables by default, the
// raytable/report/v1 JSON with --json.
func runReport(_ context.Context, e env) int {
	asJSON, r, code := fileCommand(e, "report", "json", "print the report as JSON (format raytable/report/v1)")
	if r == nil {
		return code
	}
	if asJSON {
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

// fileCommand parses the arguments of a subcommand that takes one bench file and one boolean
// flag, then reads and computes the bench. A nil report means the command is over: code says how.
func fileCommand(e env, name, flagName, flagHelp string) (bool, *optics.Report, int) {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(e.stderr)
	on := fs.Bool(flagName, false, flagHelp)
	fs.Usage = func() {
		fmt.Fprintf(e.stderr, "usage: raytable %s FILE|- [--%s]\n", name, flagName)
		fs.PrintDefaults()
	}
	path, code, ok := oneFileArg(fs, e.args)
	if !ok {
		return false, nil, code
	}
	r, code := computeBench(e, path)
	return *on, r, code
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
