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
