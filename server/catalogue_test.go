package server

import (
	"bytes"
	"fmt"
	"mime/multipart"
	"net/http"
	"net/http/httptest"
	"net/url"
	"runtime"
	"strings"
	"testing"
	"time"
)

// A catalogue of bad and heavy requests, each sent to one server in turn. Every case names the
// status it must get and a fragment of the message that names the problem; after the whole
// catalogue the server must still serve its start page and its heap must be back under a bound.
// The command line's share of the catalogue is in TestCommandLineCatalogue.

// importRuleStatus is what /import answers for a well-formed bench file that breaks a rule; a
// body that is not a bench file at all (a wrong type, an unknown or repeated key) is 400.
// Today it is 400, like a malformed body; README "Limits and who can see what" makes it 422, like
// the edit form, and this constant follows when that lands.
const importRuleStatus = http.StatusUnprocessableEntity

// caseDeadline bounds one case generously: it catches a request that hangs or computes without
// end, not a slow machine.
const caseDeadline = 10 * time.Second

// heapBoundBytes is the most live heap the test process may hold after the catalogue and a GC: the
// catalogue sends some 30 MB in all, and none of it may stay behind.
const heapBoundBytes = 128 << 20

type catalogueCase struct {
	name         string
	method, path string            // "{id}" in path is a stored demo revision
	header       map[string]string // Content-Type and any other request headers
	body         func(t testing.TB) []byte
	status       int
	want         string // a fragment of the message naming the problem (empty: status only)
	stores       bool   // the request stores a revision; otherwise the store must not grow
	hidden       string // after a 303: text that must not appear raw on the revision's page and drawings
	repeat       int    // send the request this many times; the last answer is checked
}

var (
	asJSON = map[string]string{"Content-Type": "application/json"}
	asForm = map[string]string{"Content-Type": "application/x-www-form-urlencoded"}
	// crossSite is what a browser sends with a form posted from another site.
	crossSite = map[string]string{"Content-Type": "application/x-www-form-urlencoded", "Origin": "https://elsewhere.example", "Sec-Fetch-Site": "cross-site"}
)

func literal(s string) func(testing.TB) []byte { return func(testing.TB) []byte { return []byte(s) } }

// demoChange is the demo bench file with one change.
func demoChange(change func(b map[string]any)) func(testing.TB) []byte {
	return func(t testing.TB) []byte { return demoWith(t, change) }
}

// formOf is the demo's edit form (as the page fills it) with changes; a nil value deletes a field.
func formOf(ts *testServer, id string, changes map[string]*string) func(testing.TB) []byte {
	return func(t testing.TB) []byte {
		vals := ts.pageForm(t, id)
		for k, v := range changes {
			if v == nil {
				vals.Del(k)
			} else {
				vals.Set(k, *v)
			}
		}
		return []byte(vals.Encode())
	}
}

func ptr(s string) *string { return &s }

// importForm is a bench file pasted into the start page's import form.
func importForm(bench string) func(testing.TB) []byte {
	return literal(url.Values{"bench_text": {bench}}.Encode())
}

// multipartFile is a multipart form with the bench file field holding size bytes of '{'.
func multipartFile(size int) (func(testing.TB) []byte, map[string]string) {
	var buf bytes.Buffer
	mw := multipart.NewWriter(&buf)
	ct := mw.FormDataContentType()
	return func(t testing.TB) []byte {
		buf.Reset()
		mw := multipart.NewWriter(&buf)
		if err := mw.SetBoundary(strings.TrimPrefix(ct, "multipart/form-data; boundary=")); err != nil {
			t.Fatal(err)
		}
		fw, err := mw.CreateFormFile("bench", "bench.json")
		if err != nil {
			t.Fatal(err)
		}
		fw.Write(bytes.Repeat([]byte("{"), size))
		mw.Close()
		return bytes.Clone(buf.Bytes())
	}, map[string]string{"Content-Type": ct}
}

// manyFields is a form of n fields that the edit form does not have.
func manyFields(n int) func(testing.TB) []byte {
	return func(testing.TB) []byte {
		var b strings.Builder
		for i := range n {
			fmt.Fprintf(&b, "f%d=1&", i)
		}
		return []byte(b.String())
	}
}

const markup = `<script>alert(1)</script><img src=x onerror=alert(2)>`

func catalogue(ts *testServer, id string) []catalogueCase {
	hugeFile, hugeFileCT := multipartFile(2 << 20)
	return []catalogueCase{
		// Import: bodies that are not a bench file.
		{name: "import empty body", method: "POST", path: "/import", header: asJSON, body: literal(""), status: 400, want: "no bench file was given"},
		{name: "import blank body", method: "POST", path: "/import", header: asJSON, body: literal(" \n\t "), status: 400, want: "no bench file was given"},
		{name: "import cut short", method: "POST", path: "/import", header: asJSON, body: literal(`{"format": "raytable/bench/v1",`), status: 400, want: "not valid JSON"},
		{name: "import array", method: "POST", path: "/import", header: asJSON, body: literal(`[]`), status: 400, want: "must be a JSON object"},
		{name: "import null", method: "POST", path: "/import", header: asJSON, body: literal(`null`), status: 400, want: "must be a JSON object"},
		{name: "import string", method: "POST", path: "/import", header: asJSON, body: literal(`"bench"`), status: 400, want: "must be a JSON object"},
		{name: "import two objects", method: "POST", path: "/import", header: asJSON, body: literal(`{} {}`), status: 400, want: "not valid JSON"},
		{name: "import NaN literal", method: "POST", path: "/import", header: asJSON, body: literal(`{"wavelengths_nm": [NaN]}`), status: 400, want: "not valid JSON"},
		{name: "import Infinity literal", method: "POST", path: "/import", header: asJSON, body: literal(`{"wavelengths_nm": [Infinity]}`), status: 400, want: "not valid JSON"},
		{name: "import binary", method: "POST", path: "/import", header: asJSON, body: literal("\x00\x01\xff\xfe"), status: 400, want: "not valid JSON"},
		{name: "import 20 MB body", method: "POST", path: "/import", header: asJSON, body: func(testing.TB) []byte { return bytes.Repeat([]byte(" "), 20<<20) }, status: 413, want: "1 MiB"},
		{name: "import 5,000-level nesting", method: "POST", path: "/import", header: asJSON, body: literal(`{"title": ` + nested(5000) + `}`), status: http.StatusBadRequest, want: "title"},
		{name: "import 20,000-level nesting", method: "POST", path: "/import", header: asJSON, body: literal(nested(20000)), status: 400, want: "not valid JSON"},

		// Import: wrong types and numbers out of range.
		{name: "wavelengths a string", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["wavelengths_nm"] = "red" }), status: http.StatusBadRequest, want: "wavelengths_nm"},
		{name: "table an array", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["table"] = []any{1, 2} }), status: http.StatusBadRequest, want: "table"},
		{name: "elements an object", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["elements"] = map[string]any{"L1": 1} }), status: http.StatusBadRequest, want: "elements"},
		{name: "gap a string", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["gap_mm"] = "100" }), status: http.StatusBadRequest, want: "elements[0].gap_mm"},
		{name: "fan rays a fraction", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoSource(b)["fan_rays"] = 2.5 }), status: http.StatusBadRequest, want: "source.fan_rays"},
		{name: "width 1e308", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["table"].(map[string]any)["width_mm"] = 1e308 }), status: importRuleStatus, want: "table.width_mm"},
		{name: "width 1e999", method: "POST", path: "/import", header: asJSON, body: func(t testing.TB) []byte {
			return bytes.Replace(demoWith(t, func(map[string]any) {}), []byte(`"width_mm":900`), []byte(`"width_mm":1e999`), 1)
		}, status: http.StatusBadRequest, want: "table.width_mm"},
		{name: "gap -1e308", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["gap_mm"] = -1e308 }), status: importRuleStatus, want: "elements[0].gap_mm"},
		{name: "wavelength 1e308", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["wavelengths_nm"] = []any{1e308} }), status: importRuleStatus, want: "wavelengths_nm[0]"},
		{name: "heading 1e308", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoSource(b)["heading_deg"] = 1e308 }), status: importRuleStatus, want: "source.heading_deg"},
		{name: "unknown field", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["colour"] = "red" }), status: http.StatusBadRequest, want: "colour: unknown field"},
		{name: "key given twice", method: "POST", path: "/import", header: asJSON, body: func(t testing.TB) []byte {
			return bytes.Replace(demoWith(t, func(map[string]any) {}), []byte(`"title":`), []byte(`"title":"a","title":`), 1)
		}, status: http.StatusBadRequest, want: "title"},
		{name: "format of another version", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["format"] = "raytable/bench/v9" }), status: importRuleStatus, want: "format"},

		// Import: heavy benches.
		{name: "10,000 elements", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["elements"] = manyElements(10_000) }), status: importRuleStatus, want: "at most 200"},
		{name: "100 further sources", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) {
			var more []any
			for i := range 100 {
				more = append(more, map[string]any{"id": fmt.Sprintf("S%d", i), "x_mm": 100, "y_mm": 100, "heading_deg": 0, "kind": "collimated", "semi_diameter_mm": 1, "elements": []any{}})
			}
			b["more_sources"] = more
		}), status: importRuleStatus, want: "at most 8"},
		{name: "100,000 fan rays", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoSource(b)["fan_rays"] = 100_000 }), status: importRuleStatus, want: "source.fan_rays"},
		{name: "5,000 wavelengths", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) {
			w := make([]any, 5000)
			for i := range w {
				w[i] = 400 + float64(i)*0.1
			}
			b["wavelengths_nm"] = w
		}), status: 422, want: "wavelengths_nm"},
		{name: "5,000 field angles", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) {
			a := make([]any, 5000)
			for i := range a {
				a[i] = float64(i) * 1e-4
			}
			demoSource(b)["field_angles_deg"] = a
		}), status: 422, want: "field_angles_deg"},
		{name: "290 KB with 9,636 explicit rays", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoSource(b)["rays"] = explicitRays(9636) }), status: 422, want: "rays"},

		// Import: text fields with control characters and markup, material names.
		{name: "title with a bell", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["title"] = "ring\x07" }), status: importRuleStatus, want: "control character"},
		{name: "notes with NUL", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["notes"] = "a\x00b" }), status: importRuleStatus, want: "notes"},
		{name: "element id with escape", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["id"] = "L\x1b[31m" }), status: importRuleStatus, want: "elements[0].id"},
		{name: "title 100,000 characters", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["title"] = strings.Repeat("x", 100_000) }), status: importRuleStatus, want: "at most 200"},
		{name: "title markup", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["title"] = markup }), status: 303, stores: true, hidden: "<script>alert(1)"},
		{name: "notes markup", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { b["notes"] = markup + "\n" + markup }), status: 303, stores: true, hidden: "<img src=x"},
		{name: "element id markup", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["id"] = "<b>L1</b>" }), status: importRuleStatus, want: "elements[0].id"},
		{name: "material a path", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["materials"] = []any{"../../../../etc/passwd"} }), status: importRuleStatus, want: "elements[0].materials[0]"},
		{name: "material markup", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["materials"] = []any{markup} }), status: importRuleStatus, want: "elements[0].materials[0]"},
		{name: "material 10,000 characters", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["materials"] = []any{strings.Repeat("glass", 2000)} }), status: importRuleStatus, want: "elements[0].materials[0]"},
		{name: "material glass code malformed", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["materials"] = []any{"code:12x"} }), status: importRuleStatus, want: "elements[0].materials[0]"},
		{name: "material with NUL", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) { demoElement(b, 0)["materials"] = []any{"fused-silica\x00"} }), status: importRuleStatus, want: "elements[0].materials[0]"},
		{name: "user material named with markup", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) {
			b["materials"] = map[string]any{markup: map[string]any{"index": 1.5}}
			demoElement(b, 0)["materials"] = []any{markup}
		}), status: 303, stores: true, hidden: "<script>alert(1)"},

		// Import through the start page's form.
		{name: "import form not JSON", method: "POST", path: "/import", header: asForm, body: importForm("not json"), status: 400, want: "not valid JSON"},
		{name: "import form bad escape", method: "POST", path: "/import", header: asForm, body: literal("bench_text=%zz"), status: 400, want: "could not be read"},
		{name: "import form 2 MiB file", method: "POST", path: "/import", header: hugeFileCT, body: hugeFile, status: 413, want: "1 MiB"},

		// The edit form and the preview.
		{name: "edit as JSON", method: "POST", path: "/r/{id}/edit", header: asJSON, body: literal(`{"title": "x"}`), status: 415, want: "Content-Type was application/json"},
		{name: "edit 100,000 fields", method: "POST", path: "/r/{id}/edit", header: asForm, body: manyFields(100_000), status: 400, want: "parameters exceeded limit"},
		{name: "edit 9,000 unknown fields", method: "POST", path: "/r/{id}/edit", header: asForm, body: manyFields(9_000), status: 422, want: "is required"},
		{name: "edit 2 MiB form", method: "POST", path: "/r/{id}/edit", header: asForm, body: func(testing.TB) []byte { return []byte("title=" + strings.Repeat("x", 2<<20)) }, status: 413, want: "1 MiB"},
		{name: "edit title with a bell", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"title": ptr("ring\x07")}), status: 422, want: "control character"},
		{name: "edit notes with NUL", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"notes": ptr("a\x00b")}), status: 422, want: "control character"},
		{name: "edit id with escape", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"elements[0].id": ptr("L\x1b")}), status: 422, want: "may use only letters, digits"},
		{name: "edit title markup", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"title": ptr(markup)}), status: 303, stores: true, hidden: "<script>alert(1)"},
		{name: "edit gap NaN", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"elements[0].gap_mm": ptr("NaN")}), status: 422, want: "NaN"},
		{name: "edit gap Infinity", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"elements[0].gap_mm": ptr("Inf")}), status: 422, want: "Inf"},
		{name: "edit gap 1e308", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"elements[0].gap_mm": ptr("1e308")}), status: 422, want: "is too large to be a length"},
		{name: "edit material markup", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"elements[0].materials": ptr(markup)}), status: 422, want: "alert"},
		{name: "edit fan rays 100,000", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"source.fan_rays": ptr("100000")}), status: 422, want: "201"},
		{name: "edit 5,000 wavelengths", method: "POST", path: "/r/{id}/edit", header: asForm, body: formOf(ts, id, map[string]*string{"wavelengths_nm": ptr(strings.TrimSuffix(strings.Repeat("532, ", 5000), ", "))}), status: 422, want: "5000 wavelengths"},
		{name: "preview 100,000 fan rays", method: "POST", path: "/r/{id}/preview", header: asForm, body: formOf(ts, id, map[string]*string{"source.fan_rays": ptr("100000")}), status: 422, want: "201"},
		{name: "edit of no revision", method: "POST", path: "/r/aaaaaaaaaaaaaaaaaaaaaaaa/edit", header: asForm, body: literal("title=x"), status: 404, want: `no design "aaaaaaaaaaaaaaaaaaaaaaaa"`},

		// Who may write, and how often.
		{name: "cross-site import", method: "POST", path: "/import", header: withHeaders(crossSite, "Content-Type", "application/json"), body: demoChange(func(map[string]any) {}), status: 403, want: "another site"},
		{name: "cross-site edit", method: "POST", path: "/r/{id}/edit", header: crossSite, body: formOf(ts, id, nil), status: 403, want: "another site"},
		{name: "foreign Host page", method: "GET", path: "/", header: map[string]string{"Host": "raytable.attacker.example"}, status: 421, want: "raytable.attacker.example"},
		{name: "foreign Host import", method: "POST", path: "/import", header: withHeaders(asJSON, "Host", "raytable.attacker.example"), body: demoChange(func(map[string]any) {}), status: 421, want: "raytable.attacker.example"},
		{name: "GET /demo stores nothing", method: "GET", path: "/demo", status: 200, want: "Start from the demo bench"},
		{name: "import over the work budget", method: "POST", path: "/import", header: asJSON, body: demoChange(func(b map[string]any) {
			angles := make([]any, 16)
			for k := range angles {
				angles[k] = 0.01 * float64(k)
			}
			demoSource(b)["field_angles_deg"], demoSource(b)["fan_rays"] = angles, 201
		}), status: 422, want: "at most 25,000 are allowed"},
		{name: "over the work budget", method: "POST", path: "/r/{id}/preview", header: asForm, body: formOf(ts, id, map[string]*string{"source.fan_rays": ptr("201"), "source.field_angles_deg": ptr(strings.TrimSuffix(strings.Repeat("0.01, ", 16), ", "))}), status: 422, want: "at most 25,000 are allowed"},

		// Routes and methods that do not exist.
		{name: "unknown route", method: "GET", path: "/nope", status: 404, want: "There is nothing at /nope"},
		{name: "unknown deep route", method: "GET", path: "/a/b/c/d/e/f", status: 404, want: "There is nothing at /a/b/c/d/e/f"},
		{name: "10,000-character path", method: "GET", path: "/" + strings.Repeat("p", 10_000), status: 404, want: "There is nothing at /ppp"},
		{name: "revision id not an id", method: "GET", path: "/r/..%2F..%2Fetc/", status: 404},
		{name: "revision that does not exist", method: "GET", path: "/r/aaaaaaaaaaaaaaaaaaaaaaaa/bench.json", status: 404, want: `no design "aaaaaaaaaaaaaaaaaaaaaaaa"`},
		{name: "drawing of no revision", method: "GET", path: "/r/aaaaaaaaaaaaaaaaaaaaaaaa/side.svg", status: 404, want: `no design "aaaaaaaaaaaaaaaaaaaaaaaa"`},
		{name: "DELETE the start page", method: "DELETE", path: "/", status: 405, want: "DELETE is not accepted at /"},
		{name: "PUT import", method: "PUT", path: "/import", header: asJSON, body: demoChange(func(map[string]any) {}), status: 405, want: "PUT is not accepted at /import"},
		{name: "GET import", method: "GET", path: "/import", status: 405, want: "GET is not accepted at /import"},
		{name: "POST the start page", method: "POST", path: "/", header: asForm, body: literal("a=1"), status: 405, want: "POST is not accepted at /"},
		{name: "PATCH an edit", method: "PATCH", path: "/r/{id}/edit", header: asForm, body: literal("a=1"), status: 405, want: "PATCH is not accepted"},
		{name: "GET an edit", method: "GET", path: "/r/{id}/edit", status: 405, want: "GET is not accepted"},
		{name: "OPTIONS import", method: "OPTIONS", path: "/import", status: 405, want: "OPTIONS is not accepted at /import"},
		{name: "static folder", method: "GET", path: "/static/", status: 404},
		{name: "static file that does not exist", method: "GET", path: "/static/nope.css", status: 404},
		{name: "start bench that does not exist", method: "POST", path: "/demo/nope", status: 404, want: `no start bench "nope"`},
		{name: "start bench named with markup", method: "POST", path: "/demo/" + url.PathEscape(markup), status: 404, want: "no start bench", hidden: "<script>alert(1)"},
		{name: "compare ids that do not exist", method: "GET", path: "/compare?a=aaaaaaaaaaaaaaaaaaaaaaaa&b=bbbbbbbbbbbbbbbbbbbbbbbb", status: 404, want: "does not exist"},
		{name: "compare text that is no id", method: "GET", path: "/compare?a=" + url.QueryEscape(markup) + "&b=x", status: 400, want: "not a design link or id", hidden: "<script>alert(1)"},
		{name: "drawing of an arm with markup", method: "GET", path: "/r/{id}/side.svg?arm=" + url.QueryEscape(markup), status: 200, hidden: "<script>alert(1)"},
		{name: "page with junk query", method: "GET", path: "/r/{id}/?paraxial=%00&arm=" + strings.Repeat("a", 5000), status: 200},
	}
}

func TestCatalogue(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	var before runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&before)
	cases := catalogue(ts, id)
	if len(cases) < 60 {
		t.Fatalf("the catalogue has %d cases; it is meant to hold at least 60", len(cases))
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			n := ts.count(t)
			start := time.Now()
			rec := sendCase(t, ts, c, strings.ReplaceAll(c.path, "{id}", id))
			if took := time.Since(start); took > caseDeadline {
				t.Errorf("took %v; every case must answer within %v", took, caseDeadline)
			}
			msg := messageText(rec.Header().Get("Content-Type"), rec.Body.Bytes())
			if rec.Code != c.status {
				t.Fatalf("status %d, want %d; message:\n%s", rec.Code, c.status, truncate(msg, 1500))
			}
			if !strings.Contains(msg, c.want) {
				t.Errorf("message does not contain %q:\n%s", c.want, truncate(msg, 1500))
			}
			if grew := ts.count(t) - n; grew != 0 && !c.stores {
				t.Errorf("the store grew by %d revisions; this request must store nothing", grew)
			}
			if c.hidden != "" {
				checkHidden(t, ts, rec, c.hidden)
			}
		})
	}
	if rec := ts.get(t, "/"); rec.Code != http.StatusOK {
		t.Errorf("after the catalogue GET / answers %d, want 200", rec.Code)
	}
	if rec := ts.get(t, "/r/"+id+"/"); rec.Code != http.StatusOK {
		t.Errorf("after the catalogue the demo revision answers %d, want 200", rec.Code)
	}
	var after runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&after)
	t.Logf("live heap %d KiB before the catalogue, %d KiB after", before.HeapAlloc>>10, after.HeapAlloc>>10)
	if after.HeapAlloc > heapBoundBytes {
		t.Errorf("live heap after the catalogue is %d MiB; at most %d MiB", after.HeapAlloc>>20, heapBoundBytes>>20)
	}
}

// sendCase sends the case's request, repeat times if asked, and returns the last answer.
func sendCase(t *testing.T, ts *testServer, c catalogueCase, target string) *httptest.ResponseRecorder {
	var rec *httptest.ResponseRecorder
	for range max(c.repeat, 1) {
		var body []byte
		if c.body != nil {
			body = c.body(t)
		}
		req := httptest.NewRequest(c.method, target, bytes.NewReader(body))
		for k, v := range c.header {
			if k == "Host" {
				req.Host = v
			}
			req.Header.Set(k, v)
		}
		rec = httptest.NewRecorder()
		ts.ServeHTTP(rec, req)
	}
	return rec
}

// checkHidden fails if text appears raw in the answer, or, after a redirect to a revision, on its
// page, its presentation page or any of its drawings.
func checkHidden(t *testing.T, ts *testServer, rec *httptest.ResponseRecorder, text string) {
	t.Helper()
	if bytes.Contains(rec.Body.Bytes(), []byte(text)) {
		t.Errorf("the answer holds %q unescaped", text)
	}
	loc := rec.Header().Get("Location")
	if rec.Code != http.StatusSeeOther || !strings.HasPrefix(loc, "/r/") {
		return
	}
	for _, sub := range []string{"/", "/view", "/history", "/side.svg", "/table.svg", "/plan.svg", "/report.json"} {
		page := ts.get(t, loc+sub)
		if page.Code != http.StatusOK {
			t.Errorf("GET %s%s: status %d", loc, sub, page.Code)
			continue
		}
		if bytes.Contains(page.Body.Bytes(), []byte(text)) {
			t.Errorf("GET %s%s holds %q unescaped", loc, sub, text)
		}
	}
}
