package server

import (
	"net/http"
	"net/url"
	"strings"

	"raytable/optics"
)

// sameOrigin refuses with 403 every request that may change state (any method but GET, HEAD and
// OPTIONS) when it comes from a page of another site, so that a page elsewhere cannot post a bench
// or an edit through a visitor's browser. Browsers say where a request comes from in
// Sec-Fetch-Site: same-origin and none (typed in the address bar, a bookmark) pass; same-site and
// cross-site are refused. An older browser sends only Origin, which must name this request's host.
// A request with neither header does not come from a browser page (curl, scripts, the command
// line) and passes: such a client can send whatever it likes anyway.
func sameOrigin(fail func(http.ResponseWriter, *http.Request, error)) func(http.Handler) http.Handler {
	return func(next http.Handler) http.Handler {
		return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			if why := foreignOrigin(r); why != "" {
				fail(w, r, optics.Errorf(eForbidden, "%s is refused: %s; open raytable's own page and submit from there", r.Method+" "+r.URL.Path, why))
				return
			}
			next.ServeHTTP(w, r)
		})
	}
}

// foreignOrigin says why a request that may change state comes from elsewhere, "" when it does not.
func foreignOrigin(r *http.Request) string {
	switch r.Method {
	case http.MethodGet, http.MethodHead, http.MethodOptions:
		return ""
	}
	if site := r.Header.Get("Sec-Fetch-Site"); site != "" {
		if site == "same-origin" || site == "none" {
			return ""
		}
		return "it was sent from a page of another site (Sec-Fetch-Site: " + site + ")"
	}
	origin := r.Header.Get("Origin")
	if origin == "" {
		return ""
	}
	u, err := url.Parse(origin)
	if err != nil || u.Host == "" || !strings.EqualFold(u.Host, r.Host) {
		return "it was sent from " + origin + ", not from " + r.Host
	}
	return ""
}
