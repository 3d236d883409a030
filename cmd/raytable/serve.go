package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io/fs"
	"log/slog"
	"net"
	"net/http"
	"syscall"
	"time"

	"raytable/server"
	"raytable/server/store"
)

// Defaults of `raytable serve`.
const (
	defaultAddr     = "127.0.0.1:8080"
	defaultStore    = "raytable.db"
	defaultStoreMB  = 1024
	shutdownTimeout = 10 * time.Second
)

// runServe starts the web server: it opens the store, listens (so that a busy port fails at once),
// prints the URL and serves until ctx is cancelled, then shuts down gracefully.
func runServe(ctx context.Context, e env) int {
	fs := flag.NewFlagSet("serve", flag.ContinueOnError)
	fs.SetOutput(e.stderr)
	addr := fs.String("addr", envOr(e, "RAYTABLE_ADDR", defaultAddr), "address to listen on (environment RAYTABLE_ADDR)")
	storePath := fs.String("store", envOr(e, "RAYTABLE_STORE", defaultStore), "file that holds the designs (environment RAYTABLE_STORE)")
	hostList := fs.String("allowed-hosts", envOr(e, "RAYTABLE_ALLOWED_HOSTS", ""),
		"comma-separated host names the server answers for, with any port; default the --addr host, localhost, 127.0.0.1 and [::1] (environment RAYTABLE_ALLOWED_HOSTS)")
	maxStoreMB := fs.Int64("max-store-mb", defaultStoreMB, "largest the store may grow, in MiB; past it saving answers 507 and viewing goes on (0: no limit)")
	readOnly := fs.Bool("read-only", false, "serve the store without writing to it; saving answers 503")
	writesPerMinute := fs.Int("writes-per-minute", server.DefaultWritesPerMinute, "designs one client address may save a minute, in bursts of up to 20 (0 or less: no limit)")
	fs.Usage = func() {
		fmt.Fprintln(e.stderr, "usage: raytable [serve] [--addr HOST:PORT] [--store FILE] [--max-store-mb N] [--read-only] [--writes-per-minute N] [--allowed-hosts NAME,...]")
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
	st, err := openStore(*storePath, store.BoltOptions{MaxBytes: *maxStoreMB << 20, ReadOnly: *readOnly}, log)
	if err != nil {
		ln.Close()
		fmt.Fprintf(e.stderr, "raytable: %v\n", err)
		return exitInternal
	}
	defer st.Close()
	hosts := allowedHosts(*hostList, *addr)
	if *writesPerMinute <= 0 {
		*writesPerMinute = -1 // server.Config: negative is no limit, 0 the default
	}
	srv := server.HTTPServer(server.New(server.Config{Store: st, Logger: log, AllowedHosts: hosts, WritesPerMinute: *writesPerMinute}), log)
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

// allowedHosts is the Host allow-list: the names given, or else the default for the listen
// address (server.DefaultAllowedHosts). Names given replace the default rather than add to it, so
// a server behind a proxy can answer for the proxy's name alone.
func allowedHosts(list, addr string) []string {
	if hosts := server.ParseAllowedHosts(list); len(hosts) > 0 {
		return hosts
	}
	return server.DefaultAllowedHosts(addr)
}

// openStore opens the store for writing, or read-only when asked. A store file that cannot be
// opened for writing (no permission, a read-only file system) is still served, read-only, with
// a log line saying why: the designs in it stay viewable.
func openStore(path string, opt store.BoltOptions, log *slog.Logger) (*store.Bolt, error) {
	st, err := store.OpenBoltWith(path, opt)
	if err == nil || opt.ReadOnly || !cannotWrite(err) {
		return st, err
	}
	opt.ReadOnly = true
	ro, roErr := store.OpenBoltWith(path, opt)
	if roErr != nil {
		return nil, err
	}
	log.Warn("serving the store read-only: it cannot be opened for writing", "store", path, "err", err)
	return ro, nil
}

// cannotWrite reports whether opening failed for want of write access rather than of the file.
func cannotWrite(err error) bool {
	return errors.Is(err, fs.ErrPermission) || errors.Is(err, syscall.EROFS)
}

func envOr(e env, key, def string) string {
	if v := e.getenv(key); v != "" {
		return v
	}
	return def
}
