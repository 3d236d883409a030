package analysis

import (
	"reflect"
	"testing"

	"raytable/optics"
)

// TestRunValidIsRunWithoutTheCheck: for a bench Decode accepted, RunValid gives the very report Run
// gives, and checks the rules no further time.
func TestRunValidIsRunWithoutTheCheck(t *testing.T) {
	b := loadDemo(t)
	want, err := Run(b)
	if err != nil {
		t.Fatal(err)
	}
	before := optics.Validations()
	got := RunValid(b)
	if n := optics.Validations() - before; n != 0 {
		t.Errorf("RunValid checked the rules %d times, want 0", n)
	}
	if !reflect.DeepEqual(got, want) {
		t.Error("RunValid and Run give different reports for the demo bench")
	}
}
