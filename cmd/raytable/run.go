package main

import (
	"context"
	"fmt"
	"io"
)

// Exit statuses.
const (
	exitOK       = 0
	exitInternal = 1 // a failure that is not the user's input
	exitInvalid  = 2 // bad input or bad usage
)

// env is what a subcommand gets from the process: arguments, environment and streams.
type env struct {
	args   []string
	getenv func(string) string
	stdin  io.Reader
	stdout io.Writer
	stderr io.Writer
}

type command struct {
	name    string
	summary string
	run     func(ctx context.Context, e env) int
}

func commands() []command {
	return []command{
		{"serve", "start the web server (the default)", runServe},
		{"report", "print the computed numbers of a bench file", runReport},
		{"plan", "print the breadboard placement list of a bench file", runPlan},
	}
}

// run dispatches to a subcommand; with no arguments it serves.
func run(ctx context.Context, args []string, getenv func(string) string, stdin io.Reader, stdout, stderr io.Writer) int {
	name := "serve"
	if len(args) > 0 && (args[0] == "help" || args[0] == "-h" || args[0] == "--help") {
		usage(stdout)
		return exitOK
	}
	if len(args) > 0 && len(args[0]) > 0 && args[0][0] != '-' {
		name, args = args[0], args[1:]
	}
	for _, c := range commands() {
		if c.name == name {
			return c.run(ctx, env{args: args, getenv: getenv, stdin: stdin, stdout: stdout, stderr: stderr})
		}
	}
	fmt.Fprintf(stderr, "raytable: unknown command %q\n", name)
	usage(stderr)
	return exitInvalid
}

func usage(w io.Writer) {
	fmt.Fprintln(w, "usage: raytable [command] [flags]")
	fmt.Fprintln(w)
	for _, c := range commands() {
		fmt.Fprintf(w, "  %-8s %s\n", c.name, c.summary)
	}
	fmt.Fprintln(w)
	fmt.Fprintln(w, "Run 'raytable COMMAND -h' for the flags of a command.")
}
