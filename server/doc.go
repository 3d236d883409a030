// Package server is raytable's web front: chi routes for the bench page, its forms and exports,
// the presentation view, history and comparison, backed by a store of immutable revisions.
//
// Every accepted edit stores a new revision and answers 303 to its URL (POST-redirect-GET), so the
// page works with plain forms; the small script in web/static only makes the same requests with
// fetch. Errors from the optics package carry a code that one table (errors.go) maps to a status.
//
// The server wires HTTP to the rest: it decodes requests, reads and writes the store, runs the
// analysis and hands the results to web/view and web/diagram, which lay them out and draw them.
// Results of stored revisions are kept in a bounded cache (cache.go), since a revision never
// changes.
package server
