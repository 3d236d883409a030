package server

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
	"math/rand/v2"
	"net/http"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"raytable/optics"
)

// The crash test's shape: cycles of serving, each killed without warning after a random time.
const (
	crashCycles    = 12
	crashWriters   = 2                      // concurrent importers, so that a kill can land mid-write
	crashMinLife   = 100 * time.Millisecond // shortest time a server lives before its kill
	crashMaxLife   = 900 * time.Millisecond
	crashSeed      = 20260302 // fixed so that a failure repeats; change it to explore other moments
	crashStartWait = 10 * time.Second
)

// TestCrashKeepsAcknowledgedRevisions runs the real server on a file store, imports benches from
// several clients at once, and kills the process (SIGKILL, no shutdown) at random moments. After
// every restart each revision the server had acknowledged with a 303 must be there, its bench.json
// byte for byte the canonical encoding of the file that was posted: an answer the client got is a
// promise that the write is on disk.
func TestCrashKeepsAcknowledgedRevisions(t *testing.T) {
	if testing.Short() {
		t.Skip("builds and kills the server; skipped with -short")
	}
	bin := buildRaytable(t)
	storePath := filepath.Join(t.TempDir(), "crash.db")
	rng := rand.New(rand.NewPCG(crashSeed, 0))
	acked := map[string][]byte{} // revision id -> the canonical bench it must hold
	var mu sync.Mutex
	client := &http.Client{
		Timeout:       5 * time.Second,
		CheckRedirect: func(*http.Request, []*http.Request) error { return http.ErrUseLastResponse },
	}
	sent := 0
	for cycle := range crashCycles {
		cmd, base := startServer(t, bin, storePath)
		checkAcknowledged(t, client, base, acked, cycle)

		life := crashMinLife + time.Duration(rng.Int64N(int64(crashMaxLife-crashMinLife)))
		stop := make(chan struct{})
		var wg sync.WaitGroup
		for w := range crashWriters {
			seed := rng.Uint64()
			wg.Go(func() {
				r := rand.New(rand.NewPCG(seed, uint64(w)))
				for n := 0; ; n++ {
					select {
					case <-stop:
						return
					default:
					}
					body, canonical := crashBench(t, fmt.Sprintf("cycle %d writer %d bench %d", cycle, w, n), r)
					id, ok := importOnce(client, base, body)
					if !ok {
						continue // refused or cut off by the kill: no promise was made
					}
					mu.Lock()
					acked[id] = canonical
					sent++
					mu.Unlock()
				}
			})
		}
		time.Sleep(life)
		if err := cmd.Process.Signal(syscall.SIGKILL); err != nil {
			t.Fatal(err)
		}
		cmd.Wait()
		close(stop)
		wg.Wait()
	}
	cmd, base := startServer(t, bin, storePath)
	defer func() { cmd.Process.Kill(); cmd.Wait() }()
	checkAcknowledged(t, client, base, acked, crashCycles)
	t.Logf("%d cycles, %d acknowledged revisions, all present after every restart", crashCycles, sent)
	if sent < crashCycles {
		t.Errorf("only %d revisions were acknowledged over %d cycles; the test proved little", sent, crashCycles)
	}
}

// crashBench is the demo bench with its own title and a random first gap, as posted and as the
// store must encode it.
func crashBench(t *testing.T, title string, r *rand.Rand) (posted, canonical []byte) {
	posted = demoWith(t, func(b map[string]any) {
		b["title"] = title
		demoElement(b, 0)["gap_mm"] = 50 + float64(r.IntN(10_000))/100
	})
	b, err := optics.Decode(posted)
	if err != nil {
		t.Error(err)
		return posted, nil
	}
	canonical, err = optics.Encode(b)
	if err != nil {
		t.Error(err)
	}
	return posted, canonical
}

// importOnce posts a bench file and returns the new revision's id if the server answered 303.
func importOnce(client *http.Client, base string, body []byte) (string, bool) {
	resp, err := client.Post(base+"/import", "application/json", bytes.NewReader(body))
	if err != nil {
		return "", false
	}
	io.Copy(io.Discard, resp.Body)
	resp.Body.Close()
	id, ok := strings.CutPrefix(resp.Header.Get("Location"), "/r/")
	return id, ok && resp.StatusCode == http.StatusSeeOther
}

var servingAt = regexp.MustCompile(`serving at (http://[0-9.:]+)/`)

// startServer runs `raytable serve` on a free port of 127.0.0.1 and returns it with its base URL,
// read from the line it prints once it listens.
func startServer(t *testing.T, bin, storePath string) (*exec.Cmd, string) {
	t.Helper()
	cmd := exec.Command(bin, "serve", "--addr", "127.0.0.1:0", "--store", storePath)
	stdout, err := cmd.StdoutPipe()
	if err != nil {
		t.Fatal(err)
	}
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	found := make(chan string, 1)
	go func() {
		sc := bufio.NewScanner(stdout)
		for sc.Scan() {
			if m := servingAt.FindStringSubmatch(sc.Text()); m != nil {
				found <- m[1]
				break
			}
		}
		io.Copy(io.Discard, stdout)
	}()
	select {
	case base := <-found:
		return cmd, base
	case <-time.After(crashStartWait):
		cmd.Process.Kill()
		cmd.Wait()
		t.Fatalf("the server did not start within %v; stderr:\n%s", crashStartWait, stderr.String())
		return nil, ""
	}
}

// checkAcknowledged fetches every acknowledged revision's bench.json and compares it with the
// canonical encoding of what was posted.
func checkAcknowledged(t *testing.T, client *http.Client, base string, acked map[string][]byte, cycle int) {
	t.Helper()
	for id, want := range acked {
		resp, err := client.Get(base + "/r/" + id + "/bench.json")
		if err != nil {
			t.Fatalf("after %d kills: GET %s: %v", cycle, id, err)
		}
		got, err := io.ReadAll(resp.Body)
		resp.Body.Close()
		if err != nil {
			t.Fatal(err)
		}
		if resp.StatusCode != http.StatusOK {
			t.Errorf("after %d kills: acknowledged revision %s answers %d", cycle, id, resp.StatusCode)
			continue
		}
		if !bytes.Equal(got, want) {
			t.Errorf("after %d kills: revision %s holds\n%s\nwant\n%s", cycle, id, truncate(string(got), 400), truncate(string(want), 400))
		}
	}
}
