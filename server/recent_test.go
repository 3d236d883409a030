package server

import (
	"net/http"
	"net/http/httptest"
	"strings"
	"testing"

	"raytable/server/demo"
)

// recentLinks are the designs the home page lists for the browser of ts.
func recentLinks(t *testing.T, ts *testServer) []string {
	t.Helper()
	var hrefs []string
	for _, a := range findAll(one(t, parseHTML(t, ts.get(t, "/").Body.Bytes()), "recent"), byTag("a")) {
		h, _ := attr(a, "href")
		hrefs = append(hrefs, strings.TrimPrefix(h, "/r/"))
	}
	return hrefs
}

// TestRecentIsPerBrowser: the home page lists what this browser made or opened, newest first by
// creation, and nothing of another browser's.
func TestRecentIsPerBrowser(t *testing.T) {
	alice := newTestServer(t)
	a1 := alice.startDemo(t)
	a2 := redirectID(t, alice.do(t, http.MethodPost, "/demo/"+demo.Starts[0].Name, nil, ""))
	bob := &testServer{Server: alice.Server, mem: alice.mem} // the same server, a browser without cookies
	if got := recentLinks(t, bob); len(got) != 0 {
		t.Fatalf("a new browser sees %q, want none", got)
	}
	b1 := bob.startDemo(t)
	if got := recentLinks(t, bob); len(got) != 1 || got[0] != b1 {
		t.Errorf("bob sees %q, want only his %s", got, b1)
	}
	if got := recentLinks(t, alice); len(got) != 2 || got[0] != a2 || got[1] != a1 {
		t.Errorf("alice sees %q, want %s then %s", got, a2, a1)
	}
	// Opening a link adds the design: bob opens alice's first one.
	if rec := bob.get(t, "/r/"+a1); rec.Code != http.StatusOK {
		t.Fatalf("GET /r/%s: %d", a1, rec.Code)
	}
	if got := recentLinks(t, bob); len(got) != 2 || got[0] != b1 || got[1] != a1 {
		t.Errorf("after opening %s bob sees %q, want %s then %s (newest made first)", a1, got, b1, a1)
	}
}

func TestRecentCookie(t *testing.T) {
	ts := newTestServer(t)
	var ids []string
	for range recentCount + 3 {
		ids = append(ids, ts.startDemo(t))
	}
	c := ts.cookies[recentCookie]
	if c == nil {
		t.Fatal("no recent cookie was set")
	}
	if !c.HttpOnly || c.SameSite != http.SameSiteLaxMode || c.Path != "/" || c.Secure {
		t.Errorf("cookie HttpOnly %v SameSite %v Path %q Secure %v; want HttpOnly, Lax, /, not Secure over plain HTTP", c.HttpOnly, c.SameSite, c.Path, c.Secure)
	}
	// 12 ids of 24 letters and 11 dots: the list stays bounded however many designs are made.
	if len(c.Value) != recentCount*25-1 {
		t.Errorf("cookie value is %d bytes, want %d", len(c.Value), recentCount*25-1)
	}
	got := recentLinks(t, ts)
	if len(got) != recentCount || got[0] != ids[len(ids)-1] || got[recentCount-1] != ids[3] {
		t.Errorf("home lists %d designs from %v to %v; want %d, the newest %s to %s", len(got), first(got), last(got), recentCount, ids[len(ids)-1], ids[3])
	}
}

func first(s []string) string {
	if len(s) == 0 {
		return ""
	}
	return s[0]
}

func last(s []string) string {
	if len(s) == 0 {
		return ""
	}
	return s[len(s)-1]
}

func TestRecentIDsIgnoresGarbage(t *testing.T) {
	valid := strings.Repeat("a", 24)
	other := strings.Repeat("b", 24)
	for _, tc := range []struct {
		value string
		want  []string
	}{
		{"", nil},
		{"garbage", nil},
		{valid, []string{valid}},
		{valid + "." + valid + "." + other, []string{valid, other}}, // each once
		{"../etc." + valid + ".ABC", []string{valid}},
		{strings.Repeat(valid+".", 3) + strings.Repeat(other+"x.", 20), []string{valid}},
	} {
		req := httptest.NewRequest(http.MethodGet, "/", nil)
		req.AddCookie(&http.Cookie{Name: recentCookie, Value: tc.value})
		got := recentIDs(req)
		if strings.Join(got, ",") != strings.Join(tc.want, ",") {
			t.Errorf("cookie %q: ids %q, want %q", truncate(tc.value, 40), got, tc.want)
		}
	}
}

// TestRecentSkipsMissing: an id in the cookie that the store no longer holds is left out.
func TestRecentSkipsMissing(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	gone := strings.Repeat("z", 24)
	req := httptest.NewRequest(http.MethodGet, "/", nil)
	req.AddCookie(&http.Cookie{Name: recentCookie, Value: gone + "." + id})
	rec := httptest.NewRecorder()
	ts.ServeHTTP(rec, req)
	if rec.Code != http.StatusOK {
		t.Fatalf("home with a missing id: %d", rec.Code)
	}
	links := findAll(one(t, parseHTML(t, rec.Body.Bytes()), "recent"), byTag("a"))
	if len(links) != 1 {
		t.Fatalf("home lists %d designs, want 1", len(links))
	}
	if h, _ := attr(links[0], "href"); h != "/r/"+id {
		t.Errorf("link %q, want /r/%s", h, id)
	}
}
