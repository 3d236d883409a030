package material

import "strings"

// FieldError is one broken rule in material input. Field is a path relative to the material
// definition using its JSON names ("sellmeier.c_um2[2]", "range_nm", "nd"), empty when the whole
// value (such as a glass code string) is at fault. Callers prefix it with where the material sits.
type FieldError struct {
	Field string
	Rule  string
}

func (e FieldError) Error() string {
	if e.Field == "" {
		return e.Rule
	}
	return e.Field + ": " + e.Rule
}

// InputError lists every broken rule found in one material definition, in input order.
type InputError []FieldError

func (e InputError) Error() string {
	parts := make([]string, len(e))
	for i, fe := range e {
		parts[i] = fe.Error()
	}
	return strings.Join(parts, "; ")
}

// errOrNil keeps a nil InputError from becoming a non-nil error interface.
func errOrNil(problems InputError) error {
	if len(problems) == 0 {
		return nil
	}
	return problems
}
