package server

import (
	"io"
	"net/http"
)

// maxBodyBytes caps every request body: a bench file is far smaller (optics.MaxBenchBytes is the
// same 1 MiB), and a cap keeps one client from filling memory.
const maxBodyBytes = 1 << 20

// maxDrainBytes is how much of a body the handler left unread is read and dropped after the
// answer: a client still sending when the server closes the connection gets a reset instead of
// the 413 (or 429) page, so the server first takes a bounded amount more before it closes.
const maxDrainBytes = 4 << 20

// limitBody caps the request body at n bytes; reading past it fails with *http.MaxBytesError,
// which the handlers answer with 413 (see bodyError). After the answer, up to maxDrainBytes of
// what is left is read and dropped so that the client can read that answer.
func limitBody(n int64) func(http.Handler) http.Handler {
	return func(next http.Handler) http.Handler {
		return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			body := r.Body
			r.Body = http.MaxBytesReader(w, body, n)
			next.ServeHTTP(w, r)
			if body != nil && body != http.NoBody {
				http.NewResponseController(w).Flush()
				io.CopyN(io.Discard, body, maxDrainBytes)
			}
		})
	}
}
