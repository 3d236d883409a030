package server

import (
	"bytes"
	"encoding/json"
	"fmt"
	"net/http"
	"path/filepath"
	"strings"
	"syscall"
	"testing"

	"raytable/optics"
	"raytable/server/demo"
	"raytable/server/store"
)

// withRays is the demo bench with n explicit rays, encoded.
func withRays(t testing.TB, n int) []byte {
	t.Helper()
	b, err := optics.Decode(demo.Bench)
	if err != nil {
		t.Fatal(err)
	}
	b.Source.Rays = make([]optics.ExplicitRay, n)
	for i := range b.Source.Rays {
		b.Source.Rays[i] = optics.ExplicitRay{HeightMM: 0.125 + float64(i%7)*0.25, AngleDeg: 0.0625 * float64(i%3)}
	}
	data, err := optics.Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	return data
}

// TestLargestBenchReadsBackEverywhere: the demo with as many explicit rays as the cap allows
// (optics.MaxExplicitRays) is served by every route and given back byte for byte, and one ray more
// is refused at import with 422 naming the cap, storing nothing.
func TestLargestBenchReadsBackEverywhere(t *testing.T) {
	ts := newTestServer(t)
	data := withRays(t, optics.MaxExplicitRays)
	id := redirectID(t, ts.do(t, http.MethodPost, "/import", bytes.NewReader(data), "application/json"))
	for _, route := range []string{"", "/view", "/history", "/bench.json", "/report.json", "/side.svg", "/table.svg", "/plan.svg"} {
		rec := ts.get(t, "/r/"+id+route)
		if rec.Code != http.StatusOK {
			t.Errorf("%s of a bench with %d rays: status %d: %s", route, optics.MaxExplicitRays, rec.Code, truncate(rec.Body.String(), 200))
		}
	}
	if got := ts.get(t, "/r/"+id+"/bench.json").Body.Bytes(); !bytes.Equal(got, data) {
		t.Errorf("bench.json gave %d bytes back, want the %d imported", len(got), len(data))
	}
	n := ts.count(t)
	var over map[string]any // one ray more, written by hand since Encode refuses it
	if err := json.Unmarshal(data, &over); err != nil {
		t.Fatal(err)
	}
	src := over["source"].(map[string]any)
	src["rays"] = append(src["rays"].([]any), map[string]any{"height_mm": 0.5, "angle_deg": 0})
	overData, _ := json.Marshal(over)
	rec := ts.do(t, http.MethodPost, "/import", bytes.NewReader(overData), "application/json")
	if want := fmt.Sprintf("at most %d are allowed", optics.MaxExplicitRays); rec.Code != http.StatusUnprocessableEntity || !strings.Contains(rec.Body.String(), want) {
		t.Errorf("one ray more: status %d, want 422 with %q: %s", rec.Code, want, truncate(rec.Body.String(), 300))
	}
	if ts.count(t) != n {
		t.Error("a bench over the cap was stored")
	}
}

// fullDisk is a store whose disk has filled up: every Put fails as bbolt does then.
type fullDisk struct{ Store }

func (fullDisk) Put(store.Revision) error {
	return fmt.Errorf("write /var/lib/raytable.db: %w", syscall.ENOSPC)
}

// TestRefusedWritesKeepReads: a full disk, a store at its size limit and a read-only store each
// refuse a save with their own status and message, never a 500, and every page goes on.
func TestRefusedWritesKeepReads(t *testing.T) {
	mem := store.NewMem()
	seed := &testServer{Server: New(Config{Store: mem, AllowedHosts: testHosts}), mem: mem}
	id := seed.startDemo(t)

	small, err := store.OpenBoltWith(filepath.Join(t.TempDir(), "full.db"), store.BoltOptions{MaxBytes: 1})
	if err != nil {
		t.Fatal(err)
	}
	defer small.Close()
	roPath := filepath.Join(t.TempDir(), "ro.db")
	if s, err := store.OpenBolt(roPath); err != nil {
		t.Fatal(err)
	} else {
		s.Close()
	}
	ro, err := store.OpenBoltWith(roPath, store.BoltOptions{ReadOnly: true})
	if err != nil {
		t.Fatal(err)
	}
	defer ro.Close()

	for _, tc := range []struct {
		name   string
		st     Store
		status int
		says   string
	}{
		{"full disk", fullDisk{mem}, http.StatusInsufficientStorage, "disk that holds the store is full"},
		{"size limit", small, http.StatusInsufficientStorage, "may grow to 1 bytes"},
		{"read-only", ro, http.StatusServiceUnavailable, "read-only"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			ts := &testServer{Server: New(Config{Store: tc.st, AllowedHosts: testHosts}), mem: mem}
			checks := map[string]func() (int, string){
				"import": func() (int, string) {
					r := ts.do(t, http.MethodPost, "/import", bytes.NewReader(demo.Bench), "application/json")
					return r.Code, r.Body.String()
				},
				"demo": func() (int, string) {
					r := ts.do(t, http.MethodPost, "/demo", nil, "")
					return r.Code, r.Body.String()
				},
			}
			if tc.name == "full disk" { // the only store here that holds id
				vals := ts.pageForm(t, id)
				vals.Set("title", "renamed")
				vals.Set("action", "save")
				checks["edit"] = func() (int, string) {
					r := ts.postForm(t, "/r/"+id+"/edit", vals)
					return r.Code, r.Body.String()
				}
			}
			for what, do := range checks {
				if code, body := do(); code != tc.status || !strings.Contains(body, tc.says) {
					t.Errorf("%s: status %d, want %d saying %q: %s", what, code, tc.status, tc.says, truncate(body, 300))
				}
			}
			if rec := ts.get(t, "/"); rec.Code != http.StatusOK {
				t.Errorf("start page: status %d", rec.Code)
			}
			if tc.name == "full disk" {
				if rec := ts.get(t, "/r/"+id); rec.Code != http.StatusOK {
					t.Errorf("design page: status %d", rec.Code)
				}
			}
		})
	}
}
