package store

import (
	"bytes"
	"encoding/json"
	"path/filepath"
	"strings"
	"testing"
	"time"

	bolt "go.etcd.io/bbolt"
)

// benchFile has what the raw layout must keep exactly: indentation over several lines, characters
// that encoding/json would escape (<, >, &) and the trailing newline optics.Encode writes.
const benchFile = "{\n  \"format\": \"raytable/bench/v1\",\n  \"title\": \"<relay & stop>\",\n  \"wavelengths_nm\": [632.8, 532]\n}\n"

// oldRevision is the Revision type as the store marshalled it before records kept raw JSON: the
// bench was a []byte, which encoding/json writes as a base64 string.
type oldRevision struct {
	ID      string    `json:"id"`
	Parent  string    `json:"parent,omitempty"`
	Created time.Time `json:"created"`
	Bench   []byte    `json:"bench"`
	Summary string    `json:"summary"`
}

// TestBoltReadsBase64Records writes revisions in the old layout straight into a bbolt file, as a
// store of the previous version left it, and reads them back through Get and Recent.
func TestBoltReadsBase64Records(t *testing.T) {
	path := filepath.Join(t.TempDir(), "old.db")
	base := time.Date(2026, 1, 2, 3, 4, 5, 0, time.UTC)
	olds := []oldRevision{
		{ID: mustID(t), Created: base, Bench: []byte(benchFile), Summary: "started from the demo"},
		{Created: base.Add(time.Minute), Bench: []byte(`{"a":2}`), Summary: "L2 gap_mm 150 → 165.1"},
	}
	olds[1].ID, olds[1].Parent = mustID(t), olds[0].ID
	db, err := bolt.Open(path, 0o600, nil)
	if err != nil {
		t.Fatal(err)
	}
	err = db.Update(func(tx *bolt.Tx) error {
		revs, err := tx.CreateBucket(bucketRevisions)
		if err != nil {
			return err
		}
		byTime, err := tx.CreateBucket(bucketByTime)
		if err != nil {
			return err
		}
		for _, old := range olds {
			data, err := json.Marshal(old)
			if err != nil {
				return err
			}
			if !bytes.Contains(data, []byte(`"bench":"e`)) { // base64 of '{' begins with 'e'
				t.Errorf("the old layout should hold the bench as a base64 string: %s", data)
			}
			if err := revs.Put([]byte(old.ID), data); err != nil {
				return err
			}
			if err := byTime.Put(timeKey(old.Created, old.ID), []byte(old.ID)); err != nil {
				return err
			}
		}
		return nil
	})
	db.Close()
	if err != nil {
		t.Fatal(err)
	}

	s, err := OpenBolt(path)
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	for _, old := range olds {
		got, err := s.Get(old.ID)
		if err != nil {
			t.Fatal(err)
		}
		if got.ID != old.ID || got.Parent != old.Parent || !got.Created.Equal(old.Created) || got.Summary != old.Summary {
			t.Errorf("Get(%s) = %+v, want %+v", old.ID, got, old)
		}
		if !bytes.Equal(got.Bench, old.Bench) {
			t.Errorf("bench read back as %q, want %q", got.Bench, old.Bench)
		}
	}
	recent, err := s.Recent(10)
	if err != nil {
		t.Fatal(err)
	}
	if len(recent) != 2 || recent[0].ID != olds[1].ID || !bytes.Equal(recent[1].Bench, olds[0].Bench) {
		t.Errorf("Recent over old records: %+v", recent)
	}
	// A new revision beside the old ones is written in the raw layout; both read.
	fresh := Revision{ID: mustID(t), Parent: olds[1].ID, Created: base.Add(time.Hour), Bench: []byte(benchFile), Summary: "new"}
	if err := s.Put(fresh); err != nil {
		t.Fatal(err)
	}
	if got, err := s.Get(fresh.ID); err != nil || !bytes.Equal(got.Bench, fresh.Bench) {
		t.Errorf("new revision beside old ones: %q, %v", got.Bench, err)
	}
}

// TestBoltKeepsBenchRaw: the record holds the bench as JSON, not base64, and gives back exactly
// the bytes it was given.
func TestBoltKeepsBenchRaw(t *testing.T) {
	path := filepath.Join(t.TempDir(), "raw.db")
	s, err := OpenBolt(path)
	if err != nil {
		t.Fatal(err)
	}
	rev := Revision{ID: mustID(t), Created: time.Date(2026, 1, 2, 3, 4, 5, 0, time.UTC), Bench: []byte(benchFile), Summary: `a "quoted" <summary>`}
	if err := s.Put(rev); err != nil {
		t.Fatal(err)
	}
	got, err := s.Get(rev.ID)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got.Bench, rev.Bench) || got.Summary != rev.Summary {
		t.Errorf("read back bench %q summary %q, want %q and %q", got.Bench, got.Summary, rev.Bench, rev.Summary)
	}
	s.Close()

	db, err := bolt.Open(path, 0o600, &bolt.Options{ReadOnly: true})
	if err != nil {
		t.Fatal(err)
	}
	defer db.Close()
	err = db.View(func(tx *bolt.Tx) error {
		data := tx.Bucket(bucketRevisions).Get([]byte(rev.ID))
		if !bytes.Contains(data, []byte(`"bench":`+benchFile)) {
			t.Errorf("the record does not hold the bench file as it is:\n%s", data)
		}
		var probe map[string]json.RawMessage
		if err := json.Unmarshal(data, &probe); err != nil {
			t.Errorf("the record is not JSON: %v\n%s", err, data)
		}
		if !strings.HasPrefix(string(probe["bench"]), `{`) {
			t.Errorf("bench member %q is not an object", probe["bench"])
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
}

// TestPutRefusesNonObjectBench: the record embeds the bench as it is, so anything but a JSON
// object (from its first byte) would make the record unreadable or ambiguous with base64.
func TestPutRefusesNonObjectBench(t *testing.T) {
	for name, open := range stores(t) {
		t.Run(name, func(t *testing.T) {
			s := open()
			for _, bench := range []string{`"eyJhIjoxfQ=="`, `{"a":`, ` {"a":1}`, `[1]`, `{"a":1} x`} {
				if err := s.Put(Revision{ID: mustID(t), Bench: []byte(bench)}); err == nil {
					t.Errorf("Put with bench %q succeeded", bench)
				}
			}
		})
	}
}
