package server

import (
	"math"
	"net"
	"net/http"
	"strconv"
	"strings"
	"sync"
	"time"

	"golang.org/x/time/rate"

	"raytable/optics"
)

// Defaults of the write limit: a person editing a design saves a few times a minute; a burst
// lets a quick run of button presses through.
const (
	DefaultWritesPerMinute = 60
	writeBurst             = 20
	// maxRateClients bounds the table of clients; past it the idlest are forgotten (a forgotten
	// client starts again with a full burst, which is what an idle one would have anyway).
	maxRateClients = 10000
)

// writeLimiter keeps one token bucket per client address.
type writeLimiter struct {
	mu      sync.Mutex
	perSec  rate.Limit
	burst   int
	max     int
	now     func() time.Time
	clients map[string]*rateClient
}

type rateClient struct {
	lim  *rate.Limiter
	seen time.Time
}

func newWriteLimiter(perMinute int, now func() time.Time) *writeLimiter {
	return &writeLimiter{perSec: rate.Limit(float64(perMinute) / 60), burst: writeBurst, max: maxRateClients,
		now: now, clients: map[string]*rateClient{}}
}

// wait is zero when client may write now, else how long until it may.
func (l *writeLimiter) wait(client string) time.Duration {
	l.mu.Lock()
	defer l.mu.Unlock()
	now := l.now()
	c, ok := l.clients[client]
	if !ok {
		if len(l.clients) >= l.max {
			l.evict(now)
		}
		c = &rateClient{lim: rate.NewLimiter(l.perSec, l.burst)}
		l.clients[client] = c
	}
	c.seen = now
	res := c.lim.ReserveN(now, 1)
	if d := res.DelayFrom(now); d > 0 {
		res.CancelAt(now) // a refused write costs nothing
		return d
	}
	return 0
}

// evict forgets every client whose bucket has filled up again (it is as good as new), or when
// none has, the one seen longest ago.
func (l *writeLimiter) evict(now time.Time) {
	var oldest string
	for k, c := range l.clients {
		if c.lim.TokensAt(now) >= float64(l.burst) {
			delete(l.clients, k)
		} else if oldest == "" || c.seen.Before(l.clients[oldest].seen) {
			oldest = k
		}
	}
	if len(l.clients) >= l.max {
		delete(l.clients, oldest)
	}
}

// isWrite reports whether a request stores a revision: every POST but the preview, which
// computes and stores nothing, and GET /demo, which starts a design.
func isWrite(r *http.Request) bool {
	if r.Method == http.MethodGet || r.Method == http.MethodHead {
		return r.URL.Path == "/demo"
	}
	return r.Method == http.MethodPost && !strings.HasSuffix(r.URL.Path, "/preview")
}

// clientAddr is the host of the connection's remote address: the limit counts per machine,
// whatever port a connection comes from.
func clientAddr(r *http.Request) string {
	host, _, err := net.SplitHostPort(r.RemoteAddr)
	if err != nil {
		return r.RemoteAddr
	}
	return host
}

// limitWrites answers 429 with Retry-After to a client that writes faster than the limit; reads
// are never limited. A nil limiter lets everything through.
func (s *Server) limitWrites(l *writeLimiter) func(http.Handler) http.Handler {
	return func(next http.Handler) http.Handler {
		if l == nil {
			return next
		}
		return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			if isWrite(r) {
				if d := l.wait(clientAddr(r)); d > 0 {
					secs := int(math.Ceil(d.Seconds()))
					w.Header().Set("Retry-After", strconv.Itoa(secs))
					s.fail(w, r, optics.Errorf(eRateLimited, "too many changes from your address: this server takes %d a minute; try again in %d s", l.perMinute(), secs))
					return
				}
			}
			next.ServeHTTP(w, r)
		})
	}
}

func (l *writeLimiter) perMinute() int { return int(math.Round(float64(l.perSec) * 60)) }
