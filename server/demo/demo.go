// Package demo holds the demo bench offered on the home page: a copy of testdata/demo-bench.json
// embedded in the binary (a test keeps the two identical).
package demo

import _ "embed"

// Bench is the demo bench file.
//
//go:embed demo-bench.json
var Bench []byte
