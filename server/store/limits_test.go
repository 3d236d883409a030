package store

import (
	"bytes"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"raytable/optics"
)

// benchOf is a JSON object of exactly n bytes.
func benchOf(n int) []byte {
	const head, tail = `{"title":"`, `"}`
	return []byte(head + strings.Repeat("x", n-len(head)-len(tail)) + tail)
}

// TestPutRefusesWhatCannotBeReadBack: a bench file above optics.MaxBenchBytes would be stored and
// then refused on every read, so Put refuses it as a rule (EInvalid) naming the limit; one at the
// limit is stored and reads back whole.
func TestPutRefusesWhatCannotBeReadBack(t *testing.T) {
	for name, open := range stores(t) {
		t.Run(name, func(t *testing.T) {
			s := open()
			at := Revision{ID: mustID(t), Created: time.Now(), Bench: benchOf(optics.MaxBenchBytes)}
			if err := s.Put(at); err != nil {
				t.Fatalf("a bench of exactly %d bytes: %v", optics.MaxBenchBytes, err)
			}
			if got, err := s.Get(at.ID); err != nil || !bytes.Equal(got.Bench, at.Bench) {
				t.Errorf("the largest bench read back as %d bytes, %v", len(got.Bench), err)
			}
			over := Revision{ID: mustID(t), Created: time.Now(), Bench: benchOf(optics.MaxBenchBytes + 1)}
			err := s.Put(over)
			if optics.ErrorCode(err) != optics.EInvalid || !strings.Contains(err.Error()+problemText(err), "1048576") {
				t.Errorf("a bench one byte over: %v (%s), want EInvalid naming 1048576", err, problemText(err))
			}
			if _, err := s.Get(over.ID); optics.ErrorCode(err) != optics.ENotFound {
				t.Errorf("the refused bench was stored: %v", err)
			}
		})
	}
}

func problemText(err error) string {
	var lines []string
	for _, p := range optics.ErrorProblems(err) {
		lines = append(lines, p.String())
	}
	return strings.Join(lines, "; ")
}

// TestBoltSizeLimit: past its size limit the store refuses writes with EFull and goes on reading.
func TestBoltSizeLimit(t *testing.T) {
	s, err := OpenBoltWith(filepath.Join(t.TempDir(), "small.db"), BoltOptions{MaxBytes: 256 << 10})
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	var stored []Revision
	for i := 0; ; i++ {
		rev := Revision{ID: mustID(t), Created: time.Unix(int64(i), 0), Bench: benchOf(20 << 10)}
		err := s.Put(rev)
		if err != nil {
			if optics.ErrorCode(err) != EFull || !strings.Contains(err.Error(), "may grow to 262144 bytes") {
				t.Fatalf("write %d: %v, want EFull naming the limit", i, err)
			}
			break
		}
		stored = append(stored, rev)
		if i > 20 {
			t.Fatal("a 256 KiB store took more than 20 benches of 20 KiB")
		}
	}
	if size, _ := s.Size(); size > 256<<10 || len(stored) < 2 {
		t.Errorf("stopped at %d bytes after %d benches; limit 256 KiB", size, len(stored))
	}
	for _, rev := range stored {
		if got, err := s.Get(rev.ID); err != nil || !bytes.Equal(got.Bench, rev.Bench) {
			t.Errorf("reading %s after the store filled: %v", rev.ID, err)
		}
	}
}

// TestBoltReadOnly: a store opened read-only serves what it holds and refuses every write.
func TestBoltReadOnly(t *testing.T) {
	path := filepath.Join(t.TempDir(), "ro.db")
	s, err := OpenBolt(path)
	if err != nil {
		t.Fatal(err)
	}
	rev := Revision{ID: mustID(t), Created: time.Now(), Bench: []byte(benchFile)}
	if err := s.Put(rev); err != nil {
		t.Fatal(err)
	}
	s.Close()
	ro, err := OpenBoltWith(path, BoltOptions{ReadOnly: true})
	if err != nil {
		t.Fatal(err)
	}
	defer ro.Close()
	if got, err := ro.Get(rev.ID); err != nil || !bytes.Equal(got.Bench, rev.Bench) {
		t.Errorf("read-only Get: %v", err)
	}
	if n, err := ro.Count(); n != 1 || err != nil {
		t.Errorf("read-only Count = %d, %v", n, err)
	}
	err = ro.Put(Revision{ID: mustID(t), Created: time.Now(), Bench: []byte(benchFile)})
	if optics.ErrorCode(err) != EReadOnly {
		t.Errorf("read-only Put: %v, want EReadOnly", err)
	}
}
