package main

import (
	"bufio"
	"context"
	"io"
	"net"
	"net/http"
	"path/filepath"
	"regexp"
	"slices"
	"strings"
	"sync"
	"testing"
	"time"
)

// syncBuffer is a writer several goroutines may use.
type syncBuffer struct {
	mu sync.Mutex
	b  strings.Builder
}

func (s *syncBuffer) Write(p []byte) (int, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.b.Write(p)
}

func (s *syncBuffer) String() string {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.b.String()
}

func serveEnv(args []string, vars map[string]string, stdout, stderr io.Writer) env {
	return env{args: args, getenv: func(k string) string { return vars[k] }, stdin: strings.NewReader(""), stdout: stdout, stderr: stderr}
}

func TestServeBadFlags(t *testing.T) {
	for _, args := range [][]string{{"--nope"}, {"--addr"}, {"extra"}} {
		var out, errOut syncBuffer
		if code := runServe(context.Background(), serveEnv(args, nil, &out, &errOut)); code != exitInvalid {
			t.Errorf("serve %v: exit %d, want %d", args, code, exitInvalid)
		}
	}
}

func TestServeBusyPortFailsAtOnce(t *testing.T) {
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		t.Fatal(err)
	}
	defer ln.Close()
	var out, errOut syncBuffer
	args := []string{"--addr", ln.Addr().String(), "--store", filepath.Join(t.TempDir(), "s.db")}
	done := make(chan int, 1)
	go func() { done <- runServe(context.Background(), serveEnv(args, nil, &out, &errOut)) }()
	select {
	case code := <-done:
		if code != exitInternal || !strings.Contains(errOut.String(), "cannot listen") {
			t.Errorf("exit %d, stderr %q", code, errOut.String())
		}
	case <-time.After(10 * time.Second):
		t.Fatal("serve on a busy port did not return")
	}
}

var urlLine = regexp.MustCompile(`http://(127\.0\.0\.1:\d+)/`)

// TestServeStartsAndStops runs the real command with settings from the environment, fetches the
// start page and the demo, and stops it through the context.
func TestServeStartsAndStops(t *testing.T) {
	storePath := filepath.Join(t.TempDir(), "designs.db")
	pr, pw := io.Pipe()
	var errOut syncBuffer
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	done := make(chan int, 1)
	vars := map[string]string{"RAYTABLE_ADDR": "127.0.0.1:0", "RAYTABLE_STORE": storePath}
	go func() {
		done <- run(ctx, nil, func(k string) string { return vars[k] }, strings.NewReader(""), pw, &errOut)
		pw.Close()
	}()

	line, err := bufio.NewReader(pr).ReadString('\n')
	if err != nil {
		t.Fatalf("no URL printed: %v (stderr %s)", err, errOut.String())
	}
	go io.Copy(io.Discard, pr)
	m := urlLine.FindStringSubmatch(line)
	if m == nil || !strings.Contains(line, storePath) {
		t.Fatalf("printed %q, want the URL and the store path", line)
	}
	base := "http://" + m[1]
	client := &http.Client{Timeout: 10 * time.Second, CheckRedirect: func(*http.Request, []*http.Request) error { return http.ErrUseLastResponse }}
	resp, err := client.Get(base + "/")
	if err != nil {
		t.Fatal(err)
	}
	resp.Body.Close()
	if resp.StatusCode != http.StatusOK {
		t.Errorf("GET /: %d", resp.StatusCode)
	}
	// A name not on the default list, as a rebound DNS name would bring, is refused.
	req, err := http.NewRequest(http.MethodGet, base+"/", nil)
	if err != nil {
		t.Fatal(err)
	}
	req.Host = "rebound.example"
	resp, err = client.Do(req)
	if err != nil {
		t.Fatal(err)
	}
	resp.Body.Close()
	if resp.StatusCode != http.StatusMisdirectedRequest {
		t.Errorf("GET / as rebound.example: %d, want 421", resp.StatusCode)
	}
	resp, err = client.Post(base+"/demo", "", nil)
	if err != nil {
		t.Fatal(err)
	}
	resp.Body.Close()
	if resp.StatusCode != http.StatusSeeOther || !strings.HasPrefix(resp.Header.Get("Location"), "/r/") {
		t.Errorf("POST /demo: %d %q", resp.StatusCode, resp.Header.Get("Location"))
	}

	cancel()
	select {
	case code := <-done:
		if code != exitOK {
			t.Errorf("exit %d after shutdown, stderr %s", code, errOut.String())
		}
	case <-time.After(15 * time.Second):
		t.Fatal("server did not stop after the context ended")
	}
	if !strings.Contains(errOut.String(), "stopped") {
		t.Errorf("no stop line in the log: %s", errOut.String())
	}
}

func TestAllowedHosts(t *testing.T) {
	for _, tc := range []struct {
		list, addr string
		want       []string
	}{
		{"", "127.0.0.1:8080", []string{"localhost", "127.0.0.1", "::1"}},
		{"", "10.1.2.3:8080", []string{"localhost", "127.0.0.1", "::1", "10.1.2.3"}},
		{"", "0.0.0.0:8080", []string{"localhost", "127.0.0.1", "::1"}},
		{"bench.lab, localhost", "0.0.0.0:8080", []string{"bench.lab", "localhost"}}, // given names replace the default
		{" , ", "10.1.2.3:8080", []string{"localhost", "127.0.0.1", "::1", "10.1.2.3"}},
	} {
		if got := allowedHosts(tc.list, tc.addr); !slices.Equal(got, tc.want) {
			t.Errorf("allowedHosts(%q, %q) = %q, want %q", tc.list, tc.addr, got, tc.want)
		}
	}
}
