package store

import (
	"crypto/rand"
	"encoding/base32"
	"encoding/json"
	"fmt"
	"io"
	"regexp"
	"time"

	"raytable/optics"
)

// IDBytes is the number of random bytes in a revision id: 120 bits, so one id says nothing about
// another and guessing one is hopeless.
const IDBytes = 15

// idEncoding writes ids in lower-case base32 without padding: 24 characters, safe in URLs.
var idEncoding = base32.NewEncoding("abcdefghijklmnopqrstuvwxyz234567").WithPadding(base32.NoPadding)

var idPattern = regexp.MustCompile(`^[a-z2-7]{24}$`)

// Revision is one stored design. It never changes after Put. The bolt file keeps it as a record
// (record.go).
type Revision struct {
	ID      string
	Parent  string // "" for a design started from scratch, the demo or an import
	Created time.Time
	Bench   json.RawMessage // the canonical bench file, encoded once (optics.Encode); kept as it is
	Summary string          // one line for lists: the title, or what changed
}

// NewID returns a fresh random id read from r (crypto/rand.Reader when r is nil).
func NewID(r io.Reader) (string, error) {
	if r == nil {
		r = rand.Reader
	}
	var b [IDBytes]byte
	if _, err := io.ReadFull(r, b[:]); err != nil {
		return "", optics.Errorf(optics.EInternal, "cannot make a revision id: %v", err)
	}
	return idEncoding.EncodeToString(b[:]), nil
}

// ValidID reports whether s has the shape of a revision id. Anything else cannot exist.
func ValidID(s string) bool { return idPattern.MatchString(s) }

func notFound(id string) error {
	return optics.Errorf(optics.ENotFound, "there is no design %q", id)
}

func exists(id string) error {
	return optics.Errorf(optics.EInternal, "revision %s already exists; revisions never change", id)
}

// Codes of the store's refusals to write; the server answers them 507 and 503 (server/errors.go).
const (
	EFull     = "store_full" // the store has reached its size limit, or its disk is full
	EReadOnly = "read_only"  // the store was opened read-only
)

func checkPut(rev Revision) error {
	if !ValidID(rev.ID) {
		return optics.Errorf(optics.EInternal, "revision id %q is not a valid id", rev.ID)
	}
	if rev.Parent != "" && !ValidID(rev.Parent) {
		return optics.Errorf(optics.EInternal, "parent id %q is not a valid id", rev.Parent)
	}
	if len(rev.Bench) == 0 {
		return optics.Errorf(optics.EInternal, "revision %s has no bench", rev.ID)
	}
	// What is stored must read back: a bench file above the decoder's limit would be kept and then
	// refused by every route that shows it. Refuse it now, as the rule it breaks.
	if len(rev.Bench) > optics.MaxBenchBytes {
		return optics.Invalid([]optics.Problem{{Message: fmt.Sprintf(
			"the bench file would be %d bytes; a stored bench holds at most %d bytes (1 MiB): remove elements or explicit rays",
			len(rev.Bench), optics.MaxBenchBytes)}})
	}
	// A record embeds the bench as it is (record.go): it must be a JSON object from its first byte.
	if rev.Bench[0] != '{' || !json.Valid(rev.Bench) {
		return optics.Errorf(optics.EInternal, "revision %s: the bench is not a JSON object", rev.ID)
	}
	return nil
}
