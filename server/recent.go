package server

import (
	"net/http"
	"slices"
	"strings"
	"time"

	"raytable/optics"
	"raytable/server/store"
)

// The home page lists the designs this browser made or opened, never everyone's: their ids live in
// a cookie of the browser's own (README, "Who can see what").
const (
	// recentCount is how many designs the cookie keeps and the home page lists. 12 ids of 24
	// characters keep the cookie near 300 bytes, far below the 4 KiB browsers keep.
	recentCount  = 12
	recentCookie = "raytable_recent"
	// recentMaxAge is how long a browser keeps the list without a visit.
	recentMaxAge = 365 * 24 * time.Hour
)

// recentIDs reads the cookie: valid ids only, each once, at most recentCount, most recently made
// or opened first. A garbled or foreign value counts as no list.
func recentIDs(r *http.Request) []string {
	c, err := r.Cookie(recentCookie)
	if err != nil {
		return nil
	}
	var ids []string
	for _, id := range strings.Split(c.Value, ".") {
		if store.ValidID(id) && !slices.Contains(ids, id) && len(ids) < recentCount {
			ids = append(ids, id)
		}
	}
	return ids
}

// rememberRevision puts a revision first in this browser's recent list, dropping the oldest beyond
// recentCount. HttpOnly keeps it from scripts; SameSite=Lax keeps other sites' requests from
// carrying it.
func rememberRevision(w http.ResponseWriter, r *http.Request, id string) {
	ids := append([]string{id}, slices.DeleteFunc(recentIDs(r), func(old string) bool { return old == id })...)
	if len(ids) > recentCount {
		ids = ids[:recentCount]
	}
	http.SetCookie(w, &http.Cookie{
		Name: recentCookie, Value: strings.Join(ids, "."), Path: "/", MaxAge: int(recentMaxAge / time.Second),
		HttpOnly: true, SameSite: http.SameSiteLaxMode, Secure: r.TLS != nil,
	})
}

// openRevision remembers a revision just made and answers 303 to its page.
func (s *Server) openRevision(w http.ResponseWriter, r *http.Request, id string) {
	rememberRevision(w, r, id)
	http.Redirect(w, r, "/r/"+id, http.StatusSeeOther)
}

// recentRevisions are the stored revisions of this browser's list, newest first by creation.
// Ids no longer stored are left out.
func (s *Server) recentRevisions(r *http.Request) ([]store.Revision, error) {
	var revs []store.Revision
	for _, id := range recentIDs(r) {
		rev, err := s.store.Get(id)
		if optics.ErrorCode(err) == optics.ENotFound {
			continue
		}
		if err != nil {
			return nil, err
		}
		revs = append(revs, rev)
	}
	slices.SortStableFunc(revs, func(a, b store.Revision) int { return b.Created.Compare(a.Created) })
	return revs, nil
}
