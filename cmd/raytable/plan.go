package main

import (
	"context"
	"encoding/csv"
	"fmt"
	"strings"
	"text/tabwriter"

	"raytable/optics/layout"
)

// runPlan prints the breadboard placement list of a bench: where each mount's post goes and the
// nearest hole of the grid. --csv writes it for spreadsheets, with formula-like cells made inert.
func runPlan(_ context.Context, e env) int {
	asCSV, r, code := fileCommand(e, "plan", "csv", "print the placement list as CSV")
	if r == nil {
		return code
	}
	rows := layout.PlacementRows(r.Placement)
	if asCSV {
		cw := csv.NewWriter(e.stdout)
		if err := cw.WriteAll(rows); err != nil {
			fmt.Fprintf(e.stderr, "raytable: %v\n", err)
			return exitInternal
		}
		return exitOK
	}
	tw := tabwriter.NewWriter(e.stdout, 0, 0, 2, ' ', 0)
	for _, row := range rows {
		fmt.Fprintln(tw, strings.Join(row, "\t"))
	}
	if len(r.Warnings) > 0 {
		fmt.Fprintln(tw)
		for _, w := range r.Warnings {
			fmt.Fprintf(tw, "warning [%s] %s\t%s\n", w.Code, w.Element, w.Message)
		}
	}
	if err := tw.Flush(); err != nil {
		fmt.Fprintf(e.stderr, "raytable: %v\n", err)
		return exitInternal
	}
	return exitOK
}
