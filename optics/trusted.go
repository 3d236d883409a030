package optics

import "encoding/json"

// DecodeTrusted reads a bench file that this program wrote itself with Encode or EncodeValid from
// a bench Validate had accepted, such as a stored revision. It reads as strictly as Decode (broken
// JSON, an unknown key or a wrong type is an EInvalid *Error) but does not check the bench rules
// again: the bytes passed them before they were written, and a file that never changes cannot
// start breaking them. Input from anywhere else goes through Decode.
func DecodeTrusted(data []byte) (*Bench, error) {
	decodes.Add(1)
	if !json.Valid(data) {
		var probe any // Unmarshal says where the syntax fails
		return nil, Invalid([]Problem{syntaxProblem(data, json.Unmarshal(data, &probe))})
	}
	r := &reader{}
	b := r.bench(data)
	if b == nil || len(r.problems) > 0 {
		return nil, Invalid(r.problems)
	}
	return b, nil
}
