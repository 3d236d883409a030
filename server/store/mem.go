package store

import (
	"bytes"
	"sort"
	"sync"
)

// Mem is an in-memory store for tests. It copies revisions in and out so callers cannot change
// what it holds.
type Mem struct {
	mu   sync.RWMutex
	revs map[string]Revision
}

// NewMem returns an empty in-memory store.
func NewMem() *Mem { return &Mem{revs: map[string]Revision{}} }

// Put stores a new revision; an existing id is an error.
func (m *Mem) Put(rev Revision) error {
	if err := checkPut(rev); err != nil {
		return err
	}
	m.mu.Lock()
	defer m.mu.Unlock()
	if _, ok := m.revs[rev.ID]; ok {
		return exists(rev.ID)
	}
	rev.Bench = bytes.Clone(rev.Bench)
	m.revs[rev.ID] = rev
	return nil
}

// Get returns the revision with id, or an optics.ENotFound error.
func (m *Mem) Get(id string) (Revision, error) {
	m.mu.RLock()
	defer m.mu.RUnlock()
	rev, ok := m.revs[id]
	if !ok {
		return Revision{}, notFound(id)
	}
	rev.Bench = bytes.Clone(rev.Bench)
	return rev, nil
}

// Recent returns up to n revisions, newest first.
func (m *Mem) Recent(n int) ([]Revision, error) {
	m.mu.RLock()
	all := make([]Revision, 0, len(m.revs))
	for _, r := range m.revs {
		all = append(all, r)
	}
	m.mu.RUnlock()
	sort.Slice(all, func(i, j int) bool {
		if !all[i].Created.Equal(all[j].Created) {
			return all[i].Created.After(all[j].Created)
		}
		return all[i].ID > all[j].ID
	})
	if n >= 0 && len(all) > n {
		all = all[:n]
	}
	return all, nil
}

// Count returns the number of stored revisions.
func (m *Mem) Count() (int, error) {
	m.mu.RLock()
	defer m.mu.RUnlock()
	return len(m.revs), nil
}

// Close does nothing; it lets Mem stand where a Bolt store does.
func (m *Mem) Close() error { return nil }
