package server

import (
	"math"
	"net/http"
	"strings"
	"testing"
)

// TestEditRefusesBodiesThatAreNotForms posts bodies that are not forms, or are broken forms, to the
// routes that read the edit form. Each answers a 4xx page saying what is wrong, and nothing is
// stored. Before, a JSON or text body was read as an empty form: a 422 listing every field as
// missing, which hides the real mistake.
func TestEditRefusesBodiesThatAreNotForms(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	n := ts.count(t)
	for _, tc := range []struct {
		name, ct, body string
		status         int
		want           string
	}{
		{"json", "application/json", `{"title": "x"}`, http.StatusUnsupportedMediaType, "Content-Type was application/json"},
		{"text", "text/plain", "title=x", http.StatusUnsupportedMediaType, "Content-Type was text/plain"},
		{"no content type", "", "title=x", http.StatusUnsupportedMediaType, "Content-Type was none"},
		{"garbled content type", "multipart/form-data; boundary=\"", "x", http.StatusUnsupportedMediaType, "application/x-www-form-urlencoded or multipart/form-data"},
		{"multipart without boundary", "multipart/form-data", "x", http.StatusBadRequest, "could not be read"},
		{"multipart garbage", "multipart/form-data; boundary=zz", "garbage", http.StatusBadRequest, "could not be read"},
		{"multipart cut short", "multipart/form-data; boundary=zz", "--zz\r\nContent-Disposition: form-data; name=\"title\"\r\n\r\nabc", http.StatusBadRequest, "could not be read"},
		{"urlencoded bad escape", "application/x-www-form-urlencoded", "title=%zz", http.StatusBadRequest, "could not be read"},
	} {
		for _, route := range []string{"edit", "preview"} {
			t.Run(tc.name+"/"+route, func(t *testing.T) {
				rec := ts.do(t, http.MethodPost, "/r/"+id+"/"+route, strings.NewReader(tc.body), tc.ct)
				if rec.Code != tc.status {
					t.Fatalf("status %d, want %d; body %s", rec.Code, tc.status, truncate(rec.Body.String(), 300))
				}
				msg := text(one(t, parseHTML(t, rec.Body.Bytes()), "error-message"))
				if !strings.Contains(msg, tc.want) {
					t.Errorf("message %q, want one containing %q", msg, tc.want)
				}
			})
		}
	}
	if ts.count(t) != n {
		t.Errorf("revisions %d -> %d: a refused body stored something", n, ts.count(t))
	}
}

// TestDuplicateFieldIsAProblem sends a field twice. A browser never does, so rather than silently
// keeping the first copy the edit is refused with the field named; nothing is stored.
func TestDuplicateFieldIsAProblem(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	for _, field := range []string{"elements[1].gap_mm", "title", "wavelengths_nm", "elements[0].faces_mm", "notes"} {
		t.Run(field, func(t *testing.T) {
			vals := ts.pageForm(t, id)
			vals.Add(field, vals.Get(field)) // the same value twice: only the repetition is wrong
			n := ts.count(t)
			rec := ts.postForm(t, "/r/"+id+"/edit", vals)
			if rec.Code != http.StatusUnprocessableEntity {
				t.Fatalf("status %d, want 422", rec.Code)
			}
			if ts.count(t) != n {
				t.Errorf("revisions %d -> %d: a duplicated field stored something", n, ts.count(t))
			}
			if msg := fieldError(t, parseHTML(t, rec.Body.Bytes()), field); !strings.Contains(msg, "was sent 2 times") {
				t.Errorf("message beside %s: %q, want one saying it was sent 2 times", field, msg)
			}
		})
	}
}

// TestNegativeZeroIsStoredAsZero types "-0" into a gap: the stored bench holds 0, and the history
// line reads "-> 0", not "-> -0".
func TestNegativeZeroIsStoredAsZero(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	vals := ts.pageForm(t, id)
	vals.Set("elements[4].gap_mm", "-0")
	next := redirectID(t, ts.postForm(t, "/r/"+id+"/edit", vals))
	b, rev := ts.bench(t, next)
	if gap := b.Elements[4].GapMM; gap != 0 || math.Signbit(gap) {
		t.Errorf("gap stored as %v, want +0", gap)
	}
	if strings.Contains(rev.Summary, "-> -0") {
		t.Errorf("summary %q shows a negative zero", rev.Summary)
	}
}

// TestCompareNamesTheMissingEntry: a compare with one entry left empty says that entry is empty,
// not that it is malformed.
func TestCompareNamesTheMissingEntry(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	for _, tc := range []struct{ query, want string }{
		{"?a=" + id, "The second entry is empty"},
		{"?b=" + id, "The first entry is empty"},
		{"?a=" + id + "&b=%20", "The second entry is empty"},
		{"?a=x&b=" + id, "The first entry is not a design link or id"},
	} {
		rec := ts.get(t, "/compare"+tc.query)
		if rec.Code != http.StatusBadRequest {
			t.Errorf("compare%s: %d, want 400", tc.query, rec.Code)
		}
		if body := rec.Body.String(); !strings.Contains(body, tc.want) {
			t.Errorf("compare%s: no message %q", tc.query, tc.want)
		}
	}
}
