package server

import (
	"bytes"
	"encoding/json"
	"io"
	"mime/multipart"
	"net/http"
	"net/http/httptest"
	"strings"
	"testing"

	"raytable/server/demo"
)

func multipartBody(t testing.TB, field, filename string, data []byte) (*bytes.Buffer, string) {
	t.Helper()
	var buf bytes.Buffer
	mw := multipart.NewWriter(&buf)
	var err error
	if filename != "" {
		var w io.Writer
		w, err = mw.CreateFormFile(field, filename)
		if err == nil {
			_, err = w.Write(data)
		}
	} else {
		err = mw.WriteField(field, string(data))
	}
	if err != nil {
		t.Fatal(err)
	}
	mw.Close()
	return &buf, mw.FormDataContentType()
}

func TestImport(t *testing.T) {
	ts := newTestServer(t)
	good := demo.Bench
	bad := []byte(strings.Replace(string(demo.Bench), `"gap_mm": 100`, `"gap_mm": -5, "colour": "red"`, 1))
	if bytes.Equal(bad, good) {
		t.Fatal("the bad bench fixture did not change the demo")
	}
	file := func(data []byte) (*bytes.Buffer, string) { return multipartBody(t, "bench", "bench.json", data) }
	paste := func(data []byte) (*bytes.Buffer, string) { return multipartBody(t, "bench_text", "", data) }

	t.Run("json body", func(t *testing.T) {
		id := redirectID(t, ts.do(t, http.MethodPost, "/import", bytes.NewReader(good), "application/json"))
		b, rev := ts.bench(t, id)
		if b.Title == "" || rev.Parent != "" {
			t.Errorf("imported %q with parent %q", b.Title, rev.Parent)
		}
	})
	t.Run("file upload", func(t *testing.T) {
		body, ct := file(good)
		redirectID(t, ts.do(t, http.MethodPost, "/import", body, ct))
	})
	t.Run("pasted text", func(t *testing.T) {
		body, ct := paste(good)
		redirectID(t, ts.do(t, http.MethodPost, "/import", body, ct))
	})
	t.Run("bad json body names the paths", func(t *testing.T) {
		n := ts.count(t)
		rec := ts.do(t, http.MethodPost, "/import", bytes.NewReader(bad), "application/json")
		if rec.Code != http.StatusBadRequest {
			t.Fatalf("status %d, want 400", rec.Code)
		}
		var got jsonError
		if err := json.Unmarshal(rec.Body.Bytes(), &got); err != nil {
			t.Fatal(err)
		}
		paths := map[string]bool{}
		for _, p := range got.Problems {
			paths[p.Path] = true
		}
		if !paths["elements[0].colour"] || !paths["elements[0].gap_mm"] {
			t.Errorf("problems %v, want elements[0].colour and elements[0].gap_mm", got.Problems)
		}
		if ts.count(t) != n {
			t.Error("a bad import stored a revision")
		}
	})
	t.Run("bad paste re-renders the start page", func(t *testing.T) {
		body, ct := paste(bad)
		rec := ts.do(t, http.MethodPost, "/import", body, ct)
		if rec.Code != http.StatusBadRequest {
			t.Fatalf("status %d, want 400", rec.Code)
		}
		doc := parseHTML(t, rec.Body.Bytes())
		if got := text(one(t, doc, "import-errors")); !strings.Contains(got, "elements[0].colour") {
			t.Errorf("import errors %q", got)
		}
		ta := findAll(one(t, doc, "import-form"), byTag("textarea"))[0]
		if ta.FirstChild == nil || !strings.Contains(ta.FirstChild.Data, `"colour": "red"`) {
			t.Error("the pasted text was not kept")
		}
	})
	t.Run("a well-formed bench that breaks a rule is 422", func(t *testing.T) {
		n := ts.count(t)
		rule := bytes.Replace(good, []byte(`"gap_mm": `), []byte(`"gap_mm": -`), 1)
		pasted, ct := paste(rule)
		for name, rec := range map[string]*httptest.ResponseRecorder{
			"json":  ts.do(t, http.MethodPost, "/import", bytes.NewReader(rule), "application/json"),
			"paste": ts.do(t, http.MethodPost, "/import", pasted, ct),
		} {
			if rec.Code != http.StatusUnprocessableEntity || !strings.Contains(rec.Body.String(), "gap_mm") {
				t.Errorf("%s: status %d, want 422 naming gap_mm: %s", name, rec.Code, truncate(rec.Body.String(), 300))
			}
		}
		if ts.count(t) != n {
			t.Error("a bench that breaks a rule was stored")
		}
	})
	t.Run("syntax error", func(t *testing.T) {
		rec := ts.do(t, http.MethodPost, "/import", strings.NewReader(`{"format": `), "application/json")
		if rec.Code != http.StatusBadRequest {
			t.Errorf("status %d, want 400", rec.Code)
		}
	})
	t.Run("empty", func(t *testing.T) {
		body, ct := paste(nil)
		if rec := ts.do(t, http.MethodPost, "/import", body, ct); rec.Code != http.StatusBadRequest {
			t.Errorf("status %d, want 400", rec.Code)
		}
	})
}

func TestOversizedBodyIs413(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	huge := bytes.Repeat([]byte(" "), 2<<20)
	n := ts.count(t)
	for _, tc := range []struct {
		name, path, ct string
		body           func() *bytes.Buffer
	}{
		{"json import", "/import", "application/json", func() *bytes.Buffer { return bytes.NewBuffer(huge) }},
		{"form import", "/import", "application/x-www-form-urlencoded", func() *bytes.Buffer { return bytes.NewBufferString("bench_text=" + string(huge)) }},
		{"edit", "/r/" + id + "/edit", "application/x-www-form-urlencoded", func() *bytes.Buffer { return bytes.NewBufferString("title=" + string(huge)) }},
		{"preview", "/r/" + id + "/preview", "application/x-www-form-urlencoded", func() *bytes.Buffer { return bytes.NewBufferString("title=" + string(huge)) }},
	} {
		t.Run(tc.name, func(t *testing.T) {
			rec := ts.do(t, http.MethodPost, tc.path, tc.body(), tc.ct)
			if rec.Code != http.StatusRequestEntityTooLarge {
				t.Fatalf("status %d, want 413", rec.Code)
			}
			if !strings.Contains(rec.Body.String(), "1 MiB") {
				t.Errorf("413 without a message: %s", truncate(rec.Body.String(), 300))
			}
		})
	}
	if body, ct := multipartBody(t, "bench", "big.json", huge); true {
		if rec := ts.do(t, http.MethodPost, "/import", body, ct); rec.Code != http.StatusRequestEntityTooLarge {
			t.Errorf("multipart import: %d, want 413", rec.Code)
		}
	}
	if ts.count(t) != n {
		t.Error("an oversized request stored a revision")
	}
}
