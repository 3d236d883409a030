package store

import (
	"bytes"
	"encoding/json"
	"fmt"
	"time"
)

// record is a revision as the bolt file keeps it: a JSON object whose bench member is the bench
// file itself, byte for byte. Revisions written before this layout kept the bench as a base64
// string (the default for a []byte in encoding/json) in the same member, before the summary;
// readRecord still reads them.
type record struct {
	ID      string          `json:"id"`
	Parent  string          `json:"parent,omitempty"`
	Created time.Time       `json:"created"`
	Summary string          `json:"summary"`
	Bench   json.RawMessage `json:"bench,omitempty"`
}

// jsonSpace is what JSON allows between tokens.
const jsonSpace = " \t\r\n"

// writeRecord lays out a revision as a record. encoding/json compacts a RawMessage it writes and
// escapes <, > and & in it, which would change the bytes the store was given, so the bench is
// appended as it is, as the last member: everything between its opening brace and the record's
// closing one is then the bench, its trailing newline included.
func writeRecord(rev Revision) ([]byte, error) {
	head, err := json.Marshal(record{ID: rev.ID, Parent: rev.Parent, Created: rev.Created, Summary: rev.Summary})
	if err != nil {
		return nil, fmt.Errorf("encode revision %s: %w", rev.ID, err)
	}
	out := make([]byte, 0, len(head)+len(`,"bench":`)+len(rev.Bench))
	out = append(out, head[:len(head)-1]...) // without its closing brace
	out = append(out, `,"bench":`...)
	out = append(out, rev.Bench...)
	return append(out, '}'), nil
}

// readRecord reads a record of either layout.
func readRecord(data []byte) (Revision, error) {
	var rec record
	if err := json.Unmarshal(data, &rec); err != nil {
		return Revision{}, err
	}
	rev := Revision{ID: rec.ID, Parent: rec.Parent, Created: rec.Created, Summary: rec.Summary}
	if len(rec.Bench) > 0 && rec.Bench[0] == '"' {
		// The base64 layout: the string decodes to the bench bytes.
		var bench []byte
		if err := json.Unmarshal(rec.Bench, &bench); err != nil {
			return Revision{}, err
		}
		rev.Bench = bench
		return rev, nil
	}
	// The raw layout. Unmarshal hands over the bench without the whitespace that followed it; as
	// the last member (writeRecord), that whitespace is what sits before the closing brace.
	rev.Bench = rec.Bench
	if len(rev.Bench) == 0 {
		return rev, nil
	}
	inner := bytes.TrimRight(data, jsonSpace)
	inner = inner[:len(inner)-1] // the record's closing brace
	if value := bytes.TrimRight(inner, jsonSpace); bytes.HasSuffix(value, rec.Bench) {
		rev.Bench = append(rev.Bench, inner[len(value):]...)
	}
	return rev, nil
}
