package store

import (
	"bytes"
	"errors"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"

	"raytable/optics"
)

// revisionStore is what both implementations offer; the server declares its own copy.
type revisionStore interface {
	Put(Revision) error
	Get(string) (Revision, error)
	Recent(int) ([]Revision, error)
	Count() (int, error)
	Close() error
}

func stores(t *testing.T) map[string]func() revisionStore {
	return map[string]func() revisionStore{
		"mem": func() revisionStore { return NewMem() },
		"bolt": func() revisionStore {
			s, err := OpenBolt(filepath.Join(t.TempDir(), "test.db"))
			if err != nil {
				t.Fatal(err)
			}
			t.Cleanup(func() { s.Close() })
			return s
		},
	}
}

func mustID(t *testing.T) string {
	t.Helper()
	id, err := NewID(nil)
	if err != nil {
		t.Fatal(err)
	}
	return id
}

func TestNewIDShapeAndSpread(t *testing.T) {
	seen := map[string]bool{}
	for range 1000 {
		id := mustID(t)
		if !ValidID(id) {
			t.Fatalf("id %q does not match its own pattern", id)
		}
		if seen[id] {
			t.Fatalf("id %q repeated within 1000 draws", id)
		}
		seen[id] = true
	}
	// 24 base32 characters carry 120 bits, above the 96 the design asks for.
	if got := len(mustID(t)) * 5; got < 96 {
		t.Errorf("id carries %d bits, want >= 96", got)
	}
}

func TestValidID(t *testing.T) {
	for _, tc := range []struct {
		id   string
		want bool
	}{
		{"abcdefghijklmnopqrstuvwx", true},
		{"abcdefghijklmnopqrstuvw", false},  // 23 characters
		{"ABCDEFGHIJKLMNOPQRSTUVWX", false}, // upper case is not ours
		{"abcdefghijklmnopqrstuv01", false}, // 0 and 1 are not base32
		{"../../etc/passwdxxxxxxxx", false}, // path tricks
		{"", false},
	} {
		if got := ValidID(tc.id); got != tc.want {
			t.Errorf("ValidID(%q) = %v, want %v", tc.id, got, tc.want)
		}
	}
}

func TestPutGetImmutable(t *testing.T) {
	for name, open := range stores(t) {
		t.Run(name, func(t *testing.T) {
			s := open()
			base := time.Date(2026, 1, 2, 3, 4, 5, 0, time.UTC)
			a := Revision{ID: mustID(t), Created: base, Bench: []byte(`{"a":1}`), Summary: "first"}
			b := Revision{ID: mustID(t), Parent: a.ID, Created: base.Add(time.Second), Bench: []byte(`{"a":2}`), Summary: "second"}
			for _, r := range []Revision{a, b} {
				if err := s.Put(r); err != nil {
					t.Fatal(err)
				}
			}
			got, err := s.Get(b.ID)
			if err != nil {
				t.Fatal(err)
			}
			if got.Parent != a.ID || !got.Created.Equal(b.Created) || !bytes.Equal(got.Bench, b.Bench) || got.Summary != "second" {
				t.Errorf("Get returned %+v, want %+v", got, b)
			}
			// A second Put with the same id must fail and leave the first one as it was.
			changed := a
			changed.Bench = []byte(`{"a":99}`)
			if err := s.Put(changed); err == nil {
				t.Error("Put of an existing id succeeded; revisions must never change")
			}
			again, _ := s.Get(a.ID)
			if !bytes.Equal(again.Bench, a.Bench) {
				t.Errorf("revision changed to %s after a refused Put", again.Bench)
			}
			if n, _ := s.Count(); n != 2 {
				t.Errorf("Count = %d, want 2", n)
			}
			recent, err := s.Recent(10)
			if err != nil {
				t.Fatal(err)
			}
			if len(recent) != 2 || recent[0].ID != b.ID || recent[1].ID != a.ID {
				t.Errorf("Recent order wrong: %v", recent)
			}
			if one, _ := s.Recent(1); len(one) != 1 || one[0].ID != b.ID {
				t.Errorf("Recent(1) = %v, want only the newest", one)
			}
		})
	}
}

func TestGetMissingIsNotFound(t *testing.T) {
	for name, open := range stores(t) {
		t.Run(name, func(t *testing.T) {
			_, err := open().Get(mustID(t))
			if optics.ErrorCode(err) != optics.ENotFound {
				t.Errorf("Get of a missing id: code %q (%v), want %q", optics.ErrorCode(err), err, optics.ENotFound)
			}
		})
	}
}

func TestPutRejectsMalformed(t *testing.T) {
	for name, open := range stores(t) {
		t.Run(name, func(t *testing.T) {
			s := open()
			for _, r := range []Revision{
				{ID: "short", Bench: []byte("{}")},
				{ID: mustID(t), Parent: "bad parent", Bench: []byte("{}")},
				{ID: mustID(t)},
			} {
				if err := s.Put(r); err == nil {
					t.Errorf("Put(%+v) succeeded", r)
				}
			}
			if n, _ := s.Count(); n != 0 {
				t.Errorf("Count = %d after refused puts, want 0", n)
			}
		})
	}
}

func TestConcurrentPuts(t *testing.T) {
	for name, open := range stores(t) {
		t.Run(name, func(t *testing.T) {
			s := open()
			var wg sync.WaitGroup
			errs := make(chan error, 32)
			for i := range 32 {
				wg.Add(1)
				go func() {
					defer wg.Done()
					errs <- s.Put(Revision{ID: mustID(t), Created: time.Unix(int64(i), 0), Bench: []byte("{}")})
				}()
			}
			wg.Wait()
			close(errs)
			for err := range errs {
				if err != nil {
					t.Error(err)
				}
			}
			if n, _ := s.Count(); n != 32 {
				t.Errorf("Count = %d, want 32", n)
			}
		})
	}
}

func TestBoltReopenKeepsRevisions(t *testing.T) {
	path := filepath.Join(t.TempDir(), "reopen.db")
	s, err := OpenBolt(path)
	if err != nil {
		t.Fatal(err)
	}
	rev := Revision{ID: mustID(t), Created: time.Now().UTC(), Bench: []byte(`{"x":1}`)}
	if err := s.Put(rev); err != nil {
		t.Fatal(err)
	}
	s.Close()
	s, err = OpenBolt(path)
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	got, err := s.Get(rev.ID)
	if err != nil || !bytes.Equal(got.Bench, rev.Bench) {
		t.Errorf("after reopen: %v, %v", got, err)
	}
}

// TestBoltLockedFileSaysWhy opens a store file that another handle holds: the error says the file
// is locked by another process, where bbolt alone says only "timeout".
func TestBoltLockedFileSaysWhy(t *testing.T) {
	path := filepath.Join(t.TempDir(), "locked.db")
	s, err := OpenBolt(path)
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	_, err = OpenBolt(path)
	if err == nil || !strings.Contains(err.Error(), "locked by another process") || !strings.Contains(err.Error(), path) {
		t.Errorf("second open: %v, want a message naming the file and the lock", err)
	}
}

func TestNewIDReadFailure(t *testing.T) {
	_, err := NewID(bytes.NewReader([]byte{1, 2, 3}))
	if err == nil || optics.ErrorCode(err) != optics.EInternal {
		t.Errorf("short random source: err %v, want an internal error", err)
	}
	var e *optics.Error
	if !errors.As(err, &e) {
		t.Errorf("want *optics.Error, got %T", err)
	}
}
