// Package demo holds the benches the home page offers to start from: copies of testdata's
// demo-bench.json, michelson-bench.json and combiner-bench.json embedded in the binary (a test
// keeps each equal to its testdata file).
package demo

import _ "embed"

// Bench is the demo bench file.
//
//go:embed demo-bench.json
var Bench []byte

var (
	//go:embed michelson-bench.json
	michelson []byte
	//go:embed combiner-bench.json
	combiner []byte
)

// Start is a bench the home page offers beside the demo.
type Start struct {
	Name   string // in the address it is posted to: /demo/{Name}
	File   string // its file name, here and in testdata
	Button string
	About  string
	Bench  []byte
}

// Starts are the branching benches offered beside the demo, in the order the page shows them.
var Starts = []Start{
	{Name: "michelson", File: "michelson-bench.json", Button: "Start from a Michelson interferometer",
		About: "A splitter sends a red laser to two end mirrors a quarter millimetre apart in distance; both returns meet again on a screen.", Bench: michelson},
	{Name: "combiner", File: "combiner-bench.json", Button: "Start from two lasers combined",
		About: "A green laser joins an infrared one on a dichroic; one lens focuses both on a screen.", Bench: combiner},
}

// StartNamed finds a start bench by name.
func StartNamed(name string) (Start, bool) {
	for _, s := range Starts {
		if s.Name == name {
			return s, true
		}
	}
	return Start{}, false
}
