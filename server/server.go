package server

import (
	"bytes"
	"cmp"
	"io"
	"log/slog"
	"net/http"
	"strings"
	"time"

	"github.com/a-h/templ"
	"github.com/go-chi/chi/v5"
	"github.com/go-chi/chi/v5/middleware"

	"raytable/optics"
	"raytable/server/store"
	"raytable/web/static"
	"raytable/web/view"
)

// Store keeps immutable revisions. Bolt (server/store) is the file store; Mem is for tests.
type Store interface {
	// Put stores a new revision; an id that exists already is an error.
	Put(rev store.Revision) error
	// Get returns a revision, or an error with code optics.ENotFound.
	Get(id string) (store.Revision, error)
}

// Config is what a Server needs. Store is required; the rest have defaults.
type Config struct {
	Store  Store
	Logger *slog.Logger     // default: discard
	Now    func() time.Time // default: time.Now
	Random io.Reader        // source of revision ids; default crypto/rand

	// CacheEntries is how many stored revisions keep their computed report, drawings and numbers
	// (least recently used forgotten first). 0 means the default, 64; a negative value keeps none.
	CacheEntries int
	// CacheBytes bounds the estimated bytes of the kept results as well (least recently used
	// forgotten first). 0 means the default, 256 MiB; a negative value keeps none.
	CacheBytes int64
	// ComputeDeadline is how long computing one report may take before the request is answered
	// 503 (optics.EDeadline). 0 means the default, 5 s.
	ComputeDeadline time.Duration
	// Analyze computes the report of a bench that has passed Validate; default analysis.RunValid,
	// as the server computes no other (a stored revision passed before it was saved, a preview
	// just before). Tests count calls through it.
	Analyze func(*optics.Bench) (*optics.Report, error)
	// AllowedHosts are the names the server answers for, in the Host header with any port; others
	// get 421 (mw_hosts.go). Empty means the loopback names only; `raytable serve` adds the listen
	// address's host (DefaultAllowedHosts).
	AllowedHosts []string
	// WritesPerMinute is how many revisions one client address may store a minute (bursts of 20);
	// 0 means the default, DefaultWritesPerMinute; a negative value sets no limit.
	WritesPerMinute int
}

// Server answers raytable's web requests.
type Server struct {
	store  Store
	log    *slog.Logger
	now    func() time.Time
	random io.Reader
	router chi.Router
	hosts  []string // the Host allow-list
	// analyze computes a report; the cache keeps it for stored revisions (compute.go).
	analyze  func(*optics.Bench) (*optics.Report, error)
	cache    *revCache
	writes   *writeLimiter // nil: no limit
	deadline time.Duration // of each computation (compute.go)
}

// New builds a server and its routes.
func New(cfg Config) *Server {
	s := &Server{store: cfg.Store, log: cfg.Logger, now: cfg.Now, random: cfg.Random, analyze: cfg.Analyze}
	if s.log == nil {
		s.log = slog.New(slog.DiscardHandler)
	}
	if s.now == nil {
		s.now = time.Now
	}
	s.deadline = cfg.ComputeDeadline
	if s.deadline <= 0 {
		s.deadline = defaultComputeDeadline
	}
	if s.analyze == nil {
		s.analyze = s.analyzeWithin
	}
	entries, bytes := cfg.CacheEntries, cfg.CacheBytes
	if entries == 0 {
		entries = defaultCacheEntries
	}
	if bytes == 0 {
		bytes = defaultCacheBytes
	}
	s.cache = newRevCache(entries, bytes)
	s.hosts = cfg.AllowedHosts
	if len(s.hosts) == 0 {
		s.hosts = loopbackHosts
	}
	if perMinute := cmp.Or(cfg.WritesPerMinute, DefaultWritesPerMinute); perMinute > 0 {
		s.writes = newWriteLimiter(perMinute, s.now)
	}
	s.router = s.routes()
	return s
}

// ServeHTTP makes Server an http.Handler.
func (s *Server) ServeHTTP(w http.ResponseWriter, r *http.Request) { s.router.ServeHTTP(w, r) }

func (s *Server) routes() chi.Router {
	r := chi.NewRouter()
	// GetHead answers HEAD on every GET route, for link checkers and curl -I.
	// The Host and origin checks come before any handler, so a refused request reads and stores
	// nothing; the write limit comes after them, so a refused request costs the client nothing.
	r.Use(logRequests(s.log), securityHeaders, recoverPanics(s.log, s.failStatus), checkHosts(s.hosts, s.fail), sameOrigin(s.fail),
		limitBody(maxBodyBytes), s.limitWrites(s.writes), middleware.GetHead,
		// Pages, drawings and reports are text that shrinks five- to tenfold; a shared link
		// opens fast on a slow lab network.
		middleware.Compress(5, "text/html", "image/svg+xml", "application/json", "text/css", "text/javascript", "application/javascript"))
	r.NotFound(func(w http.ResponseWriter, r *http.Request) { s.failStatus(w, r, http.StatusNotFound) })
	r.MethodNotAllowed(func(w http.ResponseWriter, r *http.Request) { s.failStatus(w, r, http.StatusMethodNotAllowed) })

	r.Get("/", s.home)
	r.Post("/import", s.importBench)
	// GET and HEAD never store: they show the start button, which posts.
	r.Get("/demo", s.demoPage)
	r.Post("/demo", s.demo)
	r.Get("/demo/{name}", s.demoNamedPage)
	r.Post("/demo/{name}", s.demoNamed)
	r.Get("/compare", s.compare)
	r.Handle("/static/*", http.StripPrefix("/static/", staticFiles()))
	// Browsers ask for /favicon.ico by themselves, e.g. when a drawing is opened on its own.
	r.Get("/favicon.ico", func(w http.ResponseWriter, r *http.Request) {
		r.URL.Path = "/icon.svg"
		staticFiles().ServeHTTP(w, r)
	})
	r.Route("/r/{id}", func(r chi.Router) {
		r.Use(middleware.GetHead) // the mount matches HEAD above; its own routes need it again
		r.Get("/", s.benchPage)
		r.Get("/view", s.presentPage)
		r.Get("/history", s.history)
		r.Get("/bench.json", s.benchJSON)
		r.Get("/report.json", s.reportJSON)
		r.Get("/side.svg", s.sideSVG)
		r.Get("/table.svg", s.tableSVG)
		r.Get("/plan.svg", s.planSVG)
		r.Post("/edit", s.edit)
		r.Post("/preview", s.preview)
	})
	return r
}

// staticFiles serves the embedded CSS and script. They are small and change with the binary, so
// browsers revalidate them on each load.
func staticFiles() http.Handler {
	fs := http.FileServerFS(static.Files)
	return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		if r.URL.Path == "" || strings.HasSuffix(r.URL.Path, "/") {
			http.NotFound(w, r) // files only, no folder listings
			return
		}
		w.Header().Set("Cache-Control", "no-cache")
		fs.ServeHTTP(w, r)
	})
}

// HTTPServer wraps a handler in an http.Server with timeouts, so slow or idle clients cannot hold
// connections for ever.
func HTTPServer(h http.Handler, log *slog.Logger) *http.Server {
	if log == nil {
		log = slog.New(slog.DiscardHandler)
	}
	return &http.Server{
		Handler:           h,
		ReadHeaderTimeout: 5 * time.Second,
		ReadTimeout:       20 * time.Second,
		WriteTimeout:      60 * time.Second,
		IdleTimeout:       120 * time.Second,
		MaxHeaderBytes:    64 << 10,
		ErrorLog:          slog.NewLogLogger(log.Handler(), slog.LevelWarn),
	}
}

// render writes a page with a status. It renders into a buffer first so that a failure midway
// becomes a clean 500 instead of half a page.
func (s *Server) render(w http.ResponseWriter, r *http.Request, status int, c templ.Component) {
	var buf bytes.Buffer
	if err := c.Render(r.Context(), &buf); err != nil {
		s.log.Error("render failed", "path", r.URL.Path, "err", err)
		http.Error(w, "the page could not be drawn", http.StatusInternalServerError)
		return
	}
	w.Header().Set("Content-Type", "text/html; charset=utf-8")
	w.WriteHeader(status)
	w.Write(buf.Bytes())
}

// fail answers an error with its status and an error page; internal errors are logged.
func (s *Server) fail(w http.ResponseWriter, r *http.Request, err error) {
	status := statusOf(err)
	if storeRefusal(err) {
		s.log.Warn("store refused a write", "method", r.Method, "path", r.URL.Path, "err", err)
	} else if status >= 500 {
		s.log.Error("request failed", "method", r.Method, "path", r.URL.Path, "err", err)
	}
	s.render(w, r, status, view.Error(errorPage(status, err)))
}

// failStatus answers with an error page for a bare status.
func (s *Server) failStatus(w http.ResponseWriter, r *http.Request, status int) {
	p := errorPage(status, nil)
	switch status {
	case http.StatusNotFound:
		p.Message = "There is nothing at " + r.URL.Path + ". Designs live at links that start with /r/."
	case http.StatusMethodNotAllowed:
		p.Message = r.Method + " is not accepted at " + r.URL.Path + "."
	}
	s.render(w, r, status, view.Error(p))
}
