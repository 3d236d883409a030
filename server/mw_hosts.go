package server

import (
	"net"
	"net/http"
	"strings"

	"raytable/optics"
)

// loopbackHosts are always allowed: a page opened on this machine reaches the server by them.
var loopbackHosts = []string{"localhost", "127.0.0.1", "::1"}

// DefaultAllowedHosts is the allow-list of `raytable serve` without --allowed-hosts: the host of
// the listen address (unless it is a wildcard such as 0.0.0.0 or empty) and the loopback names.
func DefaultAllowedHosts(listenAddr string) []string {
	hosts := append([]string(nil), loopbackHosts...)
	host, _, err := net.SplitHostPort(listenAddr)
	if err != nil {
		host = listenAddr
	}
	host = hostName(host)
	if ip := net.ParseIP(host); host == "" || (ip != nil && ip.IsUnspecified()) {
		return hosts
	}
	for _, h := range hosts {
		if h == host {
			return hosts
		}
	}
	return append(hosts, host)
}

// ParseAllowedHosts reads a comma-separated list of host names, as --allowed-hosts takes it.
// Spaces and empty items are dropped.
func ParseAllowedHosts(list string) []string {
	var hosts []string
	for _, h := range strings.Split(list, ",") {
		if h = strings.TrimSpace(h); h != "" {
			hosts = append(hosts, h)
		}
	}
	return hosts
}

// hostName lowers a host, strips the brackets of an IPv6 literal and a trailing dot, so that
// "LOCALHOST.", "localhost" and "[::1]" compare as names.
func hostName(h string) string {
	h = strings.ToLower(strings.TrimSuffix(h, "."))
	return strings.TrimSuffix(strings.TrimPrefix(h, "["), "]")
}

// checkHosts answers 421 to a request whose Host header is not on the allow-list, with any port.
// A page on another site can make a browser send requests here under that site's own name by
// pointing its name at this address (DNS rebinding); such requests carry the foreign name in Host,
// so checking it keeps them out even on loopback.
func checkHosts(allowed []string, fail func(http.ResponseWriter, *http.Request, error)) func(http.Handler) http.Handler {
	names := make(map[string]bool, len(allowed))
	for _, h := range allowed {
		names[hostName(h)] = true
	}
	return func(next http.Handler) http.Handler {
		return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			host, _, err := net.SplitHostPort(r.Host)
			if err != nil {
				host = r.Host // no port
			}
			if !names[hostName(host)] {
				shown := r.Host
				if shown == "" {
					shown = "none"
				}
				fail(w, r, optics.Errorf(eWrongHost, "this server does not answer for the host %q; start it with --allowed-hosts naming the host you open it by", shown))
				return
			}
			next.ServeHTTP(w, r)
		})
	}
}
