package main

import (
	"fmt"
	"log/slog"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"

	"raytable/optics"
	"raytable/server/store"
)

// TestOpenStoreFallsBackToReadOnly: --read-only opens the store for reading, and a store file
// that cannot be opened for writing is served read-only with a log line saying why.
func TestOpenStoreFallsBackToReadOnly(t *testing.T) {
	path := filepath.Join(t.TempDir(), "designs.db")
	st, err := store.OpenBolt(path)
	if err != nil {
		t.Fatal(err)
	}
	st.Close()
	rev := func() store.Revision {
		id, _ := store.NewID(nil)
		return store.Revision{ID: id, Created: time.Now(), Bench: []byte(`{"title":"x"}`)}
	}

	var logs strings.Builder
	log := slog.New(slog.NewTextHandler(&logs, nil))
	ro, err := openStore(path, store.BoltOptions{ReadOnly: true}, log)
	if err != nil {
		t.Fatal(err)
	}
	if err := ro.Put(rev()); optics.ErrorCode(err) != store.EReadOnly {
		t.Errorf("--read-only: Put gave %v, want %s", err, store.EReadOnly)
	}
	ro.Close()

	for _, tc := range []struct {
		err  error
		want bool
	}{
		{fmt.Errorf("open store x: %w", &os.PathError{Op: "open", Path: "x", Err: syscall.EACCES}), true},
		{fmt.Errorf("open store x: %w", &os.PathError{Op: "open", Path: "x", Err: syscall.EROFS}), true},
		{fmt.Errorf("open store x: %w", &os.PathError{Op: "open", Path: "x", Err: syscall.ENOENT}), false},
	} {
		if got := cannotWrite(tc.err); got != tc.want {
			t.Errorf("cannotWrite(%v) = %v, want %v", tc.err, got, tc.want)
		}
	}

	if os.Geteuid() == 0 {
		t.Skip("root may write a file without write permission")
	}
	if err := os.Chmod(path, 0o400); err != nil {
		t.Fatal(err)
	}
	auto, err := openStore(path, store.BoltOptions{}, log)
	if err != nil {
		t.Fatalf("a store without write permission: %v, want it served read-only", err)
	}
	defer auto.Close()
	if !auto.ReadOnly() || !strings.Contains(logs.String(), "read-only") {
		t.Errorf("read-only %v, log %q", auto.ReadOnly(), logs.String())
	}
}
