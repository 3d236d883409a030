package server

import "net/http"

// maxBodyBytes caps every request body: a bench file is far smaller (optics.MaxBenchBytes is the
// same 1 MiB), and a cap keeps one client from filling memory.
const maxBodyBytes = 1 << 20

// limitBody caps the request body at n bytes; reading past it fails with *http.MaxBytesError,
// which the handlers answer with 413 (see bodyError).
func limitBody(n int64) func(http.Handler) http.Handler {
	return func(next http.Handler) http.Handler {
		return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			r.Body = http.MaxBytesReader(w, r.Body, n)
			next.ServeHTTP(w, r)
		})
	}
}
