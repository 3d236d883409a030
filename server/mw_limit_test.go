package server

import (
	"errors"
	"io"
	"net/http"
	"net/http/httptest"
	"strings"
	"testing"
)

func TestLimitBody(t *testing.T) {
	for _, tc := range []struct {
		size    int
		tooLong bool
	}{{10, false}, {16, false}, {17, true}, {1000, true}} {
		var readErr error
		var n int
		h := limitBody(16)(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			data, err := io.ReadAll(r.Body)
			n, readErr = len(data), err
		}))
		h.ServeHTTP(httptest.NewRecorder(), httptest.NewRequest(http.MethodPost, "/", strings.NewReader(strings.Repeat("x", tc.size))))
		var mb *http.MaxBytesError
		if got := errors.As(readErr, &mb); got != tc.tooLong {
			t.Errorf("%d bytes: MaxBytesError %v (%v), want %v", tc.size, got, readErr, tc.tooLong)
		}
		if !tc.tooLong && n != tc.size {
			t.Errorf("%d bytes: read %d", tc.size, n)
		}
		if tc.tooLong && optics413(readErr) != http.StatusRequestEntityTooLarge {
			t.Errorf("%d bytes: bodyError status %d, want 413", tc.size, optics413(readErr))
		}
	}
}

func optics413(err error) int { return statusOf(bodyError(err)) }

// countingReader counts what was read of a body.
type countingReader struct {
	r io.Reader
	n int
}

func (c *countingReader) Read(p []byte) (int, error) {
	n, err := c.r.Read(p)
	c.n += n
	return n, err
}

// TestLimitBodyDrainsABoundedRest: after a 413 the rest of the body is read, up to maxDrainBytes
// and no more, so that the client can read the answer and a huge body cannot hold the server.
func TestLimitBodyDrainsABoundedRest(t *testing.T) {
	for _, tc := range []struct{ size, want int }{
		{1000, 1000},                          // all of a small rest
		{20 << 20, 17 + maxDrainBytes + 4096}, // the handler's read (with its buffer) and the bound
	} {
		body := &countingReader{r: strings.NewReader(strings.Repeat("x", tc.size))}
		h := limitBody(16)(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			_, err := io.ReadAll(r.Body)
			w.WriteHeader(optics413(err))
		}))
		rec := httptest.NewRecorder()
		h.ServeHTTP(rec, httptest.NewRequest(http.MethodPost, "/", body))
		if rec.Code != http.StatusRequestEntityTooLarge {
			t.Errorf("%d bytes: status %d, want 413", tc.size, rec.Code)
		}
		if body.n > tc.want || (tc.size < maxDrainBytes && body.n != tc.size) || body.n < maxDrainBytes && tc.size > maxDrainBytes {
			t.Errorf("%d bytes: %d read, want at most %d and all of a rest below %d", tc.size, body.n, tc.want, maxDrainBytes)
		}
	}
}
