package server

import (
	"bytes"
	"log/slog"
	"net/http"
	"net/http/httptest"
	"strconv"
	"strings"
	"testing"
)

func TestLogRequests(t *testing.T) {
	for _, tc := range []struct {
		status    int
		body      string
		wantLevel string
	}{
		{0, "hello", "INFO"}, // no WriteHeader: 200
		{http.StatusNotFound, "nope", "INFO"},
		{http.StatusInternalServerError, "", "ERROR"},
	} {
		var logs bytes.Buffer
		h := logRequests(slog.New(slog.NewTextHandler(&logs, nil)))(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			if tc.status != 0 {
				w.WriteHeader(tc.status)
			}
			w.Write([]byte(tc.body))
		}))
		rec := httptest.NewRecorder()
		h.ServeHTTP(rec, httptest.NewRequest(http.MethodGet, "/r/abc", nil))
		want := tc.status
		if want == 0 {
			want = http.StatusOK
		}
		line := logs.String()
		for _, part := range []string{"level=" + tc.wantLevel, "method=GET", "path=/r/abc", "status=" + itoa(want), "bytes=" + itoa(len(tc.body))} {
			if !strings.Contains(line, part) {
				t.Errorf("log line %q lacks %q", line, part)
			}
		}
		if rec.Code != want || rec.Body.String() != tc.body {
			t.Errorf("response %d %q changed by the logger", rec.Code, rec.Body.String())
		}
	}
}

func itoa(n int) string { return strconv.Itoa(n) }
