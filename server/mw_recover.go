package server

import (
	"log/slog"
	"net/http"
	"runtime/debug"
)

// recoverPanics turns a panic in a handler into a logged 500 page, so one bad request never takes
// the server down and never shows a stack trace to the user.
func recoverPanics(log *slog.Logger, fail func(w http.ResponseWriter, r *http.Request, status int)) func(http.Handler) http.Handler {
	return func(next http.Handler) http.Handler {
		return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			defer func() {
				p := recover()
				if p == nil {
					return
				}
				if p == http.ErrAbortHandler {
					panic(p) // the server's own signal to drop the connection
				}
				log.Error("panic in handler", "method", r.Method, "path", r.URL.Path, "panic", p, "stack", string(debug.Stack()))
				fail(w, r, http.StatusInternalServerError)
			}()
			next.ServeHTTP(w, r)
		})
	}
}
