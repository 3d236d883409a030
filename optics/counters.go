package optics

import "sync/atomic"

// Work counters: how many times this process has checked the bench rules, encoded a bench and
// decoded one. They exist so that tests in other packages can prove that a request parses,
// validates and encodes a bench once (STYLE.md, "one representation per quantity on its way
// through"); an atomic add is all they cost, and nothing but tests should read them.
var validations, encodes, decodes atomic.Int64

// Validations is the number of times the bench rules have been checked: by Validate, and inside
// Decode and Encode.
func Validations() int64 { return validations.Load() }

// Encodes is the number of benches Encode and EncodeValid have written.
func Encodes() int64 { return encodes.Load() }

// Decodes is the number of bench files Decode and DecodeTrusted have read.
func Decodes() int64 { return decodes.Load() }
