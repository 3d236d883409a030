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
	db *bolt.DB
}

// OpenBolt opens (or creates) the store file at path. It waits at most one second for a file lock
// held by another process, so a second server on the same file fails instead of hanging.
func OpenBolt(path string) (*Bolt, error) {
	db, err := bolt.Open(path, 0o600, &bolt.Options{Timeout: time.Second})
	if errors.Is(err, berrors.ErrTimeout) {
		// bbolt says only "timeout"; the cause is nearly always a second server on the same file.
		return nil, fmt.Errorf("open store %s: the file is locked by another process (is another raytable serving it? stop it or choose another --store): %w", path, err)
	}
	if err != nil {
		return nil, fmt.Errorf("open store %s: %w", path, err)
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
	return &Bolt{db: db}, nil
}

// Close releases the file.
func (s *Bolt) Close() error { return s.db.Close() }

// Put stores a new revision and its time index entry in one transaction; an existing id is an error.
func (s *Bolt) Put(rev Revision) error {
	if err := checkPut(rev); err != nil {
		return err
	}
	data, err := writeRecord(rev)
	if err != nil {
		return err
	}
	return s.db.Update(func(tx *bolt.Tx) error {
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
		data := tx.Bucket(bucketRevisions).Get([]byte(id))
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
		revs := tx.Bucket(bucketRevisions)
		c := tx.Bucket(bucketByTime).Cursor()
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
		n = tx.Bucket(bucketRevisions).Stats().KeyN
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
