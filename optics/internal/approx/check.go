package approx

import "testing"

// Check reports an error on t unless got is within e·max(|want|, 1) of want (Mixed), naming the
// quantity in the message.
func Check(t testing.TB, name string, got, want, e float64) {
	t.Helper()
	if !Mixed(got, want, e) {
		t.Errorf("%s = %.12g, want %.12g (tolerance %g)", name, got, want, e)
	}
}

// CheckPtr is Check for an optional value, such as a report field that is null when undefined: nil
// is an error too.
func CheckPtr(t testing.TB, name string, got *float64, want, e float64) {
	t.Helper()
	if got == nil {
		t.Errorf("%s = nil, want %.12g", name, want)
		return
	}
	Check(t, name, *got, want, e)
}
