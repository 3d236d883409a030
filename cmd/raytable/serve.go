package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"log/slog"
	"net"
	"net/http"
	"time"

	"raytable/server"
	"raytable/server/store"
)

// Defaults of `raytable serve`.
const (
	defaultAddr     = "127.0.0.1:8080"
	defaultStore    = "raytable.db"
	shutdownTimeout = 10 * time.Second
)

// runServe starts the web server: it opens the store, listens (so that a busy port fails at once),
// prints the URL and serves until ctx is cancelled, then shuts down gracefully.
func runServe(ctx context.Context, e env) int {
	fs := flag.NewFlagSet("serve", flag.ContinueOnError)
	fs.SetOutput(e.stderr)
	addr := fs.String("addr", envOr(e, "RAYTABLE_ADDR", defaultAddr), "address to listen on (environment RAYTABLE_ADDR)")
	storePath := fs.String("store", envOr(e, "RAYTABLE_STORE", defaultStore), "file that holds the designs (environment RAYTABLE_STORE)")
	fs.Usage = func() {
		fmt.Fprintln(e.stderr, "usage: raytable [serve] [--addr HOST:PORT] [--store FILE]")
		fs.PrintDefaults()
	}
	if err := fs.Parse(e.args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK
		}
		return exitInvalid
	}
	if fs.NArg() > 0 {
		fmt.Fprintf(e.stderr, "raytable serve: unexpected argument %q\n", fs.Arg(0))
		fs.Usage()
		return exitInvalid
	}
	log := slog.New(slog.NewTextHandler(e.stderr, nil))

	ln, err := net.Listen("tcp", *addr)
	if err != nil {
		fmt.Fprintf(e.stderr, "raytable: cannot listen on %s: %v\n", *addr, err)
		return exitInternal
	}
	st, err := store.OpenBolt(*storePath)
	if err != nil {
		ln.Close()
		fmt.Fprintf(e.stderr, "raytable: %v\n", err)
		return exitInternal
	}
	defer st.Close()
	srv := server.HTTPServer(server.New(server.Config{Store: st, Logger: log}), log)
	fmt.Fprintf(e.stdout, "raytable is serving at http://%s/ (designs in %s); press Ctrl+C to stop\n", ln.Addr(), *storePath)

	done := make(chan error, 1)
	go func() { done <- srv.Serve(ln) }()
	select {
	case err := <-done:
		fmt.Fprintf(e.stderr, "raytable: server stopped: %v\n", err)
		return exitInternal
	case <-ctx.Done():
	}
	shutCtx, cancel := context.WithTimeout(context.Background(), shutdownTimeout)
	defer cancel()
	if err := srv.Shutdown(shutCtx); err != nil {
		fmt.Fprintf(e.stderr, "raytable: shutdown: %v\n", err)
		return exitInternal
	}
	if err := <-done; err != nil && !errors.Is(err, http.ErrServerClosed) {
		fmt.Fprintf(e.stderr, "raytable: %v\n", err)
		return exitInternal
	}
	log.Info("stopped")
	return exitOK
}

func envOr(e env, key, def string) string {
	if v := e.getenv(key); v != "" {
		return v
	}
	return def
}
