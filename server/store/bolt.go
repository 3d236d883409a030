package store

import (
	"encoding/binary"
	"errors"
	"fmt"
	"time"

	bolt "go.etcd.io/bbolt"
	berrors "go.etcd.io/bbolt/errors"

	"raytable/optics"
)

// Bucket names. revisions maps id -> revision record (record.go); by_time maps (created
// nanoseconds, id) -> id so that Recent can walk newest first without reading every revision.
var (
	bucketRevisions = []byte("revisions")
	bucketByTime    = []byte("by_time")
)

// Bolt keeps revisions in one bbolt file. bbolt is pure Go (no C toolchain, so the binary stays
// static), keeps everything in a single file next to the program, and gives serializable
// read-write transactions: a revision and its index entry are written together or not at all, so a
// crash never leaves half a design behind.
type Bolt struct {
	db       *bolt.DB
	maxBytes int64 // 0: no limit
	readOnly bool
}

// BoltOptions are the limits of a Bolt store.
type BoltOptions struct {
	// MaxBytes is the largest the store may grow: a write that would take it past this is refused
	// with EFull, and reads go on. 0 means no limit.
	MaxBytes int64
	// ReadOnly opens the file for reading only (a shared lock; the file is never created or
	// changed); every Put is refused with EReadOnly.
	ReadOnly bool
}

// OpenBolt opens (or creates) the store file at path, without limits.
func OpenBolt(path string) (*Bolt, error) { return OpenBoltWith(path, BoltOptions{}) }

// OpenBoltWith opens the store file at path with the given limits. It waits at most one second
// for a file lock held by another process, so a second server on the same file fails instead of
// hanging.
func OpenBoltWith(path string, opt BoltOptions) (*Bolt, error) {
	db, err := bolt.Open(path, 0o600, &bolt.Options{Timeout: time.Second, ReadOnly: opt.ReadOnly})
	if errors.Is(err, berrors.ErrTimeout) {
		// bbolt says only "timeout"; the cause is nearly always a second server on the same file.
		return nil, fmt.Errorf("open store %s: the file is locked by another process (is another raytable serving it? stop it or choose another --store): %w", path, err)
	}
	if err != nil {
		return nil, fmt.Errorf("open store %s: %w", path, err)
	}
	s := &Bolt{db: db, maxBytes: opt.MaxBytes, readOnly: opt.ReadOnly}
	if opt.ReadOnly {
		return s, nil // a file no server prepared has no buckets: it reads as empty
	}
	err = db.Update(func(tx *bolt.Tx) error {
		for _, name := range [][]byte{bucketRevisions, bucketByTime} {
			if _, err := tx.CreateBucketIfNotExists(name); err != nil {
				return err
			}
		}
		return nil
	})
	if err != nil {
		db.Close()
		return nil, fmt.Errorf("prepare store %s: %w", path, err)
	}
	return s, nil
}

// ReadOnly reports whether the store refuses every write.
func (s *Bolt) ReadOnly() bool { return s.readOnly }

// Size is the store's size in bytes, as its size limit counts it.
func (s *Bolt) Size() (int64, error) {
	var n int64
	err := s.db.View(func(tx *bolt.Tx) error { n = tx.Size(); return nil })
	return n, err
}

// Close releases the file.
func (s *Bolt) Close() error { return s.db.Close() }

// Put stores a new revision and its time index entry in one transaction; an existing id is an error.
func (s *Bolt) Put(rev Revision) error {
	if s.readOnly {
		return optics.Errorf(EReadOnly, "the store is read-only: designs can be viewed but not saved")
	}
	if err := checkPut(rev); err != nil {
		return err
	}
	data, err := writeRecord(rev)
	if err != nil {
		return err
	}
	return s.db.Update(func(tx *bolt.Tx) error {
		// The record, its index entry and their keys, twice over for the pages bbolt copies on write.
		if need := 2 * int64(len(data)+2*len(rev.ID)+8); s.maxBytes > 0 && tx.Size()+need > s.maxBytes {
			return optics.Errorf(EFull, "the store holds %d bytes and may grow to %d bytes (--max-store-mb): no more designs can be saved here; ask whoever runs this server", tx.Size(), s.maxBytes)
		}
		revs := tx.Bucket(bucketRevisions)
		if revs.Get([]byte(rev.ID)) != nil {
			return exists(rev.ID)
		}
		if err := revs.Put([]byte(rev.ID), data); err != nil {
			return err
		}
		return tx.Bucket(bucketByTime).Put(timeKey(rev.Created, rev.ID), []byte(rev.ID))
	})
}

// Get returns the revision with id, or an optics.ENotFound error.
func (s *Bolt) Get(id string) (Revision, error) {
	var rev Revision
	err := s.db.View(func(tx *bolt.Tx) error {
		revs := tx.Bucket(bucketRevisions)
		if revs == nil {
			return notFound(id)
		}
		data := revs.Get([]byte(id))
		if data == nil {
			return notFound(id)
		}
		var err error
		if rev, err = readRecord(data); err != nil {
			return optics.Errorf(optics.EInternal, "stored revision %s is unreadable: %v", id, err)
		}
		return nil
	})
	return rev, err
}

// Recent returns up to n revisions, newest first.
func (s *Bolt) Recent(n int) ([]Revision, error) {
	var out []Revision
	err := s.db.View(func(tx *bolt.Tx) error {
		revs, byTime := tx.Bucket(bucketRevisions), tx.Bucket(bucketByTime)
		if revs == nil || byTime == nil {
			return nil
		}
		c := byTime.Cursor()
		for k, id := c.Last(); k != nil && (n < 0 || len(out) < n); k, id = c.Prev() {
			rev, err := readRecord(revs.Get(id))
			if err != nil {
				return optics.Errorf(optics.EInternal, "stored revision %s is unreadable: %v", id, err)
			}
			out = append(out, rev)
		}
		return nil
	})
	return out, err
}

// Count returns the number of stored revisions.
func (s *Bolt) Count() (int, error) {
	var n int
	err := s.db.View(func(tx *bolt.Tx) error {
		if revs := tx.Bucket(bucketRevisions); revs != nil {
			n = revs.Stats().KeyN
		}
		return nil
	})
	return n, err
}

// timeKey sorts by creation time (big-endian nanoseconds since 1970, shifted so that times before
// 1970 sort first), then by id.
func timeKey(t time.Time, id string) []byte {
	k := make([]byte, 8, 8+len(id))
	binary.BigEndian.PutUint64(k, uint64(t.UnixNano())^(1<<63))
	return append(k, id...)
}
