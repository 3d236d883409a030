package server

import (
	"bytes"
	"encoding/json"
	"encoding/xml"
	"io"
	"mime/multipart"
	"net/http"
	"os"
	"strings"
	"testing"

	"golang.org/x/net/html"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/server/demo"
)

func TestEmbeddedDemoMatchesTestdata(t *testing.T) {
	want, err := os.ReadFile("../testdata/demo-bench.json")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(demo.Bench, want) {
		t.Error("server/demo/demo-bench.json differs from testdata/demo-bench.json; copy it over")
	}
}

func TestHomePage(t *testing.T) {
	ts := newTestServer(t)
	rec := ts.get(t, "/")
	if rec.Code != http.StatusOK {
		t.Fatalf("GET /: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	for _, id := range []string{"demo-form", "import-form", "recent", "compare-form"} {
		one(t, doc, id)
	}
	if got := text(one(t, doc, "recent")); !strings.Contains(got, "None yet") {
		t.Errorf("empty store: recent list says %q", got)
	}
	id := ts.startDemo(t)
	doc = parseHTML(t, ts.get(t, "/").Body.Bytes())
	links := findAll(one(t, doc, "recent"), byTag("a"))
	if len(links) != 1 {
		t.Fatalf("recent lists %d designs, want 1", len(links))
	}
	if href, _ := attr(links[0], "href"); href != "/r/"+id {
		t.Errorf("recent link %q, want /r/%s", href, id)
	}
}

func TestDemoFlow(t *testing.T) {
	for _, method := range []string{http.MethodPost, http.MethodGet} {
		t.Run(method, func(t *testing.T) {
			ts := newTestServer(t)
			id := redirectID(t, ts.do(t, method, "/demo", nil, ""))
			rec := ts.get(t, "/r/"+id)
			if rec.Code != http.StatusOK {
				t.Fatalf("GET /r/%s: %d", id, rec.Code)
			}
			doc := parseHTML(t, rec.Body.Bytes())
			page := one(t, doc, "bench-page")
			if rev, _ := attr(page, "data-revision"); rev != id {
				t.Errorf("page revision %q, want %q", rev, id)
			}
			for _, tid := range []string{"side-view", "table-view"} {
				if n := len(findAll(one(t, doc, tid), byTag("svg"))); n == 0 {
					t.Errorf("%s holds no inline svg", tid)
				}
			}
			for _, tid := range []string{"numbers", "system-values", "elements-table", "ray-status", "beam-table", "waists", "placement", "warnings", "cautions", "links", "bench-form"} {
				one(t, doc, tid)
			}
			b, _ := ts.bench(t, id)
			if got := len(testIDs(doc, "element")); got != len(b.Elements) {
				t.Errorf("form shows %d elements, bench has %d", got, len(b.Elements))
			}
			if got := text(one(t, doc, "title")); got != b.Title {
				t.Errorf("title %q, want %q", got, b.Title)
			}
			if got := text(one(t, doc, "cautions")); !strings.Contains(got, "IEC 60825-1") || !strings.Contains(got, "not a safety assessment") {
				t.Errorf("cautions box lacks the standards and the estimate note: %q", got)
			}
		})
	}
}

func TestExports(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	b, rev := ts.bench(t, id)

	rec := ts.get(t, "/r/"+id+"/bench.json")
	if rec.Code != http.StatusOK || rec.Header().Get("Content-Type") != "application/json" {
		t.Fatalf("bench.json: %d %s", rec.Code, rec.Header().Get("Content-Type"))
	}
	canonical, err := optics.Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(rec.Body.Bytes(), canonical) || !bytes.Equal(rev.Bench, canonical) {
		t.Error("bench.json is not the canonical encoding of the stored bench")
	}

	// report.json must be byte for byte what `raytable report --json` prints (an indented encoder).
	rep, err := analysis.Run(b)
	if err != nil {
		t.Fatal(err)
	}
	var want bytes.Buffer
	enc := json.NewEncoder(&want)
	enc.SetIndent("", "  ")
	enc.Encode(rep)
	rec = ts.get(t, "/r/"+id+"/report.json")
	if rec.Code != http.StatusOK || !bytes.Equal(rec.Body.Bytes(), want.Bytes()) {
		t.Errorf("report.json: status %d, equal to the command's output: %v", rec.Code, bytes.Equal(rec.Body.Bytes(), want.Bytes()))
	}
	var decoded map[string]any
	if err := json.Unmarshal(rec.Body.Bytes(), &decoded); err != nil || decoded["format"] != optics.FormatReportV1 {
		t.Errorf("report.json format %v (%v)", decoded["format"], err)
	}

	for _, name := range []string{"side.svg", "side.svg?paraxial=1", "table.svg", "plan.svg"} {
		rec := ts.get(t, "/r/"+id+"/"+name)
		if rec.Code != http.StatusOK || rec.Header().Get("Content-Type") != "image/svg+xml" {
			t.Errorf("%s: %d %s", name, rec.Code, rec.Header().Get("Content-Type"))
			continue
		}
		var root struct{ XMLName xml.Name }
		if err := xml.Unmarshal(rec.Body.Bytes(), &root); err != nil || root.XMLName.Local != "svg" {
			t.Errorf("%s is not a standalone SVG document: root %v, %v", name, root.XMLName, err)
		}
	}
}

func TestPresentationView(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	rec := ts.get(t, "/r/"+id+"/view")
	if rec.Code != http.StatusOK {
		t.Fatalf("view: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	one(t, doc, "present-page")
	one(t, doc, "cautions")
	one(t, doc, "numbers")
	if forms := findAll(doc, byTag("form")); len(forms) != 0 {
		t.Errorf("presentation view has %d forms, want none", len(forms))
	}
	// Larger diagrams than the bench page.
	svg := findAll(one(t, doc, "side-view"), byTag("svg"))[0]
	if w, _ := attr(svg, "width"); strings.TrimSuffix(w, ".0") != "1400" {
		t.Errorf("presentation side view width %q, want 1400", w)
	}
}

func TestEditCreatesRevisionWithParent(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	before, beforeRev := ts.bench(t, id)
	vals := ts.pageForm(t, id)
	vals.Set("elements[2].gap_mm", "6.5 in") // 6.5 × 25.4 mm = 165.1 mm (the inch is 25.4 mm exactly, by definition)
	vals.Set("action", "save")
	newID := redirectID(t, ts.postForm(t, "/r/"+id+"/edit", vals))
	if newID == id {
		t.Fatal("edit reused the revision id")
	}
	after, rev := ts.bench(t, newID)
	if rev.Parent != id {
		t.Errorf("parent %q, want %q", rev.Parent, id)
	}
	const wantGapMM = 165.1
	if got := after.Elements[2].GapMM; got < wantGapMM-1e-9 || got > wantGapMM+1e-9 {
		t.Errorf("gap %v mm, want %v", got, wantGapMM)
	}
	_, orig := ts.bench(t, id)
	if !bytes.Equal(orig.Bench, beforeRev.Bench) {
		t.Error("the original revision changed")
	}
	if before.Elements[2].GapMM == after.Elements[2].GapMM {
		t.Error("the original and the new revision have the same gap")
	}
	if !strings.Contains(rev.Summary, before.Elements[2].ID+" gap_mm") {
		t.Errorf("summary %q does not say which gap changed", rev.Summary)
	}

	// Saving without a change stores nothing and leads back to the same revision.
	n := ts.count(t)
	same := ts.pageForm(t, newID)
	same.Set("action", "save")
	if got := redirectID(t, ts.postForm(t, "/r/"+newID+"/edit", same)); got != newID || ts.count(t) != n {
		t.Errorf("unchanged save went to %s and left %d revisions (was %d)", got, ts.count(t), n)
	}
}

func TestEditInvalidIs422AndStoresNothing(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	for _, tc := range []struct {
		name, field, typed, want string
		errField                 string
	}{
		{"not a length", "elements[1].gap_mm", "abc", `"abc" is not a length`, "elements[1].gap_mm"},
		{"bad face in list", "elements[0].faces_mm", "11.4, banana", "item 2", "elements[0].faces_mm"},
		{"NaN", "source.y_mm", "NaN", "is not a length", "source.y_mm"},
		{"overflow", "table.width_mm", "1e999", "too large", "table.width_mm"},
		{"broken rule from Validate", "elements[0].thicknesses_mm", "-3", "", "elements[0].thicknesses_mm"},
		{"wavelength out of range", "wavelengths_nm", "10 nm", "", "wavelengths_nm"},
		{"bad wavelength unit", "wavelengths_nm", "632.8 furlongs", "not a wavelength", "wavelengths_nm"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			vals := ts.pageForm(t, id)
			vals.Set(tc.field, tc.typed)
			vals.Set("elements[3].gap_mm", "99.5") // another edit that must not be lost either
			vals.Set("action", "save")
			n := ts.count(t)
			rec := ts.postForm(t, "/r/"+id+"/edit", vals)
			if rec.Code != http.StatusUnprocessableEntity {
				t.Fatalf("status %d, want 422", rec.Code)
			}
			if ts.count(t) != n {
				t.Errorf("revisions %d -> %d: an invalid edit stored something", n, ts.count(t))
			}
			doc := parseHTML(t, rec.Body.Bytes())
			one(t, doc, "form-invalid")
			msg := fieldError(t, doc, tc.errField)
			if msg == "" || !strings.Contains(msg, tc.want) {
				t.Errorf("message beside %s: %q, want one containing %q", tc.errField, msg, tc.want)
			}
			if got := inputValue(t, doc, tc.field); got != tc.typed {
				t.Errorf("input %s shows %q, want what was typed, %q", tc.field, got, tc.typed)
			}
			if got := inputValue(t, doc, "elements[3].gap_mm"); got != "99.5" {
				t.Errorf("the other edit was lost: %q", got)
			}
			if got := fieldError(t, doc, "elements[3].gap_mm"); got != "" {
				t.Errorf("a good field is marked: %q", got)
			}
		})
	}
}

func TestEditActions(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	base, _ := ts.bench(t, id)
	n := len(base.Elements)
	ids := func(b *optics.Bench) []string {
		var out []string
		for _, e := range b.Elements {
			out = append(out, e.ID)
		}
		return out
	}
	for _, tc := range []struct {
		name   string
		set    map[string]string
		check  func(t *testing.T, b *optics.Bench)
		status int
	}{
		{"add a mirror at the start", map[string]string{"action": "add", "add.type": "mirror", "add.at": "0"}, func(t *testing.T, b *optics.Bench) {
			if len(b.Elements) != n+1 || b.Elements[0].Type != optics.TypeMirror || b.Elements[0].TurnDeg == nil {
				t.Errorf("elements %v", ids(b))
			}
		}, http.StatusSeeOther},
		{"add each type at the end", map[string]string{"action": "add", "add.type": "dump", "add.at": "99"}, func(t *testing.T, b *optics.Bench) {
			if last := b.Elements[len(b.Elements)-1]; last.Type != optics.TypeDump || last.ID != "D1" {
				t.Errorf("last element %+v", last)
			}
		}, http.StatusSeeOther},
		{"delete", map[string]string{"action": "delete:1"}, func(t *testing.T, b *optics.Bench) {
			if len(b.Elements) != n-1 || b.Elements[1].ID != base.Elements[2].ID {
				t.Errorf("elements %v", ids(b))
			}
		}, http.StatusSeeOther},
		{"move down", map[string]string{"action": "down:0"}, func(t *testing.T, b *optics.Bench) {
			if b.Elements[0].ID != base.Elements[1].ID || b.Elements[1].ID != base.Elements[0].ID {
				t.Errorf("elements %v", ids(b))
			}
		}, http.StatusSeeOther},
		{"move up", map[string]string{"action": "up:2"}, func(t *testing.T, b *optics.Bench) {
			if b.Elements[1].ID != base.Elements[2].ID {
				t.Errorf("elements %v", ids(b))
			}
		}, http.StatusSeeOther},
		{"change type and apply", map[string]string{"action": "apply", "elements[5].type": "lens"}, func(t *testing.T, b *optics.Bench) {
			e := b.Elements[5]
			if e.Type != optics.TypeLens || e.ID != base.Elements[5].ID || len(e.FacesMM) != 2 || e.GapMM != base.Elements[5].GapMM {
				t.Errorf("converted element %+v", e)
			}
		}, http.StatusSeeOther},
		{"change source kind and apply", map[string]string{"action": "apply", "source.kind": "point"}, func(t *testing.T, b *optics.Bench) {
			if b.Source.Kind != optics.SourcePoint || b.Source.NA == nil || b.Source.SemiDiameterMM != nil {
				t.Errorf("source %+v", b.Source)
			}
		}, http.StatusSeeOther},
		{"add a ray", map[string]string{"action": "add-ray"}, func(t *testing.T, b *optics.Bench) {
			if len(b.Source.Rays) != len(base.Source.Rays)+1 {
				t.Errorf("rays %v", b.Source.Rays)
			}
		}, http.StatusSeeOther},
		{"delete a ray", map[string]string{"action": "delete-ray:0"}, func(t *testing.T, b *optics.Bench) {
			if len(b.Source.Rays) != len(base.Source.Rays)-1 {
				t.Errorf("rays %v", b.Source.Rays)
			}
		}, http.StatusSeeOther},
		{"move the first up", map[string]string{"action": "up:0"}, nil, http.StatusUnprocessableEntity},
		{"delete a missing one", map[string]string{"action": "delete:77"}, nil, http.StatusUnprocessableEntity},
		{"unknown action", map[string]string{"action": "explode"}, nil, http.StatusUnprocessableEntity},
		{"unknown type", map[string]string{"action": "add", "add.type": "prism"}, nil, http.StatusUnprocessableEntity},
	} {
		t.Run(tc.name, func(t *testing.T) {
			vals := ts.pageForm(t, id)
			for k, v := range tc.set {
				vals.Set(k, v)
			}
			before := ts.count(t)
			rec := ts.postForm(t, "/r/"+id+"/edit", vals)
			if rec.Code != tc.status {
				t.Fatalf("status %d, want %d\n%s", rec.Code, tc.status, truncate(rec.Body.String(), 500))
			}
			if tc.check == nil {
				if ts.count(t) != before {
					t.Error("a refused action stored a revision")
				}
				return
			}
			b, rev := ts.bench(t, redirectID(t, rec))
			if rev.Parent != id {
				t.Errorf("parent %q, want %q", rev.Parent, id)
			}
			tc.check(t, b)
		})
	}
}

func TestPreviewStoresNothing(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	vals := ts.pageForm(t, id)
	n := ts.count(t)

	vals.Set("elements[2].gap_mm", "160")
	rec := ts.postForm(t, "/r/"+id+"/preview", vals)
	if rec.Code != http.StatusOK {
		t.Fatalf("preview: %d", rec.Code)
	}
	frag := parseHTML(t, rec.Body.Bytes())
	for _, tid := range []string{"side-view", "table-view", "numbers"} {
		one(t, frag, tid)
	}
	if len(findAll(frag, byTag("form"))) != 0 || len(findAll(frag, byTag("header"))) != 0 {
		t.Error("preview answered more than the result fragment")
	}
	// The preview computes what was posted: L2's path position moves with its gap.
	orig := ts.get(t, "/r/"+id)
	if elementsText(t, orig.Body.Bytes()) == elementsText(t, rec.Body.Bytes()) {
		t.Error("preview numbers equal the stored ones although a gap changed")
	}

	vals.Set("elements[2].gap_mm", "wide")
	rec = ts.postForm(t, "/r/"+id+"/preview", vals)
	if rec.Code != http.StatusUnprocessableEntity || !strings.Contains(text(one(t, parseHTML(t, rec.Body.Bytes()), "result-problem")), "elements[2].gap_mm") {
		t.Errorf("bad preview: %d %s", rec.Code, truncate(rec.Body.String(), 300))
	}
	if ts.count(t) != n {
		t.Errorf("preview stored revisions: %d -> %d", n, ts.count(t))
	}
}

func elementsText(t testing.TB, body []byte) string {
	return text(one(t, parseHTML(t, body), "elements-table"))
}

func TestHistory(t *testing.T) {
	ts := newTestServer(t)
	first := ts.startDemo(t)
	b, _ := ts.bench(t, first)
	vals := ts.pageForm(t, first)
	vals.Set("elements[2].gap_mm", "160")
	second := redirectID(t, ts.postForm(t, "/r/"+first+"/edit", vals))
	vals = ts.pageForm(t, second)
	vals.Set("action", "delete:1")
	third := redirectID(t, ts.postForm(t, "/r/"+second+"/edit", vals))

	rec := ts.get(t, "/r/"+third+"/history")
	if rec.Code != http.StatusOK {
		t.Fatalf("history: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	steps := testIDs(doc, "history-step")
	if len(steps) != 3 {
		t.Fatalf("%d steps, want 3", len(steps))
	}
	wantIDs := []string{third, second, first}
	wantChange := []string{"removed " + b.Elements[1].ID, b.Elements[2].ID + " gap_mm " + formatNumber(b.Elements[2].GapMM) + " -> 160", ""}
	for i, s := range steps {
		if got, _ := attr(s, "data-revision"); got != wantIDs[i] {
			t.Errorf("step %d is %s, want %s", i, got, wantIDs[i])
		}
		var changes []string
		for _, c := range testIDs(s, "change") {
			changes = append(changes, text(c))
		}
		if wantChange[i] == "" {
			if len(changes) != 0 || len(testIDs(s, "history-compare")) != 0 {
				t.Errorf("first step lists changes %v or a compare link", changes)
			}
			continue
		}
		if !contains(changes, wantChange[i]) {
			t.Errorf("step %d changes %q, want %q among them", i, changes, wantChange[i])
		}
		cmp := testIDs(s, "history-compare")
		if href, _ := attr(cmp[0], "href"); len(cmp) != 1 || href != "/compare?a="+wantIDs[i+1]+"&b="+wantIDs[i] {
			t.Errorf("step %d compare link %q", i, href)
		}
	}
}

func contains(xs []string, x string) bool {
	for _, v := range xs {
		if v == x {
			return true
		}
	}
	return false
}

func TestCompare(t *testing.T) {
	ts := newTestServer(t)
	a := ts.startDemo(t)
	vals := ts.pageForm(t, a)
	vals.Set("elements[2].gap_mm", "160")
	b := redirectID(t, ts.postForm(t, "/r/"+a+"/edit", vals))

	// The compare-with-parent link of the new revision.
	page := parseHTML(t, ts.get(t, "/r/"+b).Body.Bytes())
	link, _ := attr(one(t, page, "compare-parent-link"), "href")
	if link != "/compare?a="+a+"&b="+b {
		t.Fatalf("compare with parent link %q", link)
	}
	rec := ts.get(t, link)
	if rec.Code != http.StatusOK {
		t.Fatalf("compare: %d", rec.Code)
	}
	doc := parseHTML(t, rec.Body.Bytes())
	for _, side := range []string{"compare-A", "compare-B"} {
		n := one(t, doc, side)
		one(t, n, "side-view")
		one(t, n, "table-view")
	}
	rows := findAll(one(t, doc, "compare-table"), func(n *html.Node) bool { return n.Data == "tr" && n.Parent.Data == "tbody" })
	changed := 0
	var l2Path *html.Node
	for _, r := range rows {
		if _, ok := attr(r, "data-changed"); ok {
			changed++
		}
		if th := findAll(r, byTag("th")); len(th) == 1 && text(th[0]) == "L2 along the path (mm)" {
			l2Path = r
		}
	}
	if changed == 0 || changed == len(rows) {
		t.Errorf("%d of %d rows marked changed", changed, len(rows))
	}
	if l2Path == nil {
		t.Fatal("no row for L2's position along the path")
	}
	if _, ok := attr(l2Path, "data-changed"); !ok {
		t.Error("L2's path position is not marked changed")
	}

	// Both side views share one scale: the same width and viewBox.
	svgA := findAll(one(t, one(t, doc, "compare-A"), "side-view"), byTag("svg"))[0]
	svgB := findAll(one(t, one(t, doc, "compare-B"), "side-view"), byTag("svg"))[0]
	for _, k := range []string{"width", "height", "viewBox"} {
		va, _ := attr(svgA, k)
		vb, _ := attr(svgB, k)
		if va != vb {
			t.Errorf("side views differ in %s: %q vs %q", k, va, vb)
		}
	}

	// A design compared with itself has no changed number; pasted links work as well as ids.
	rec = ts.get(t, "/compare?a=http://example.org/r/"+a+"/view&b="+a)
	if got := text(one(t, parseHTML(t, rec.Body.Bytes()), "changed-count")); rec.Code != http.StatusOK || !strings.HasPrefix(got, "0 numbers differ") {
		t.Errorf("self compare: %d %q", rec.Code, got)
	}
	for _, tc := range []struct {
		query  string
		status int
	}{
		{"", http.StatusOK},
		{"?a=nonsense&b=" + a, http.StatusBadRequest},
		{"?a=" + strings.Repeat("a", 24) + "&b=" + a, http.StatusNotFound},
	} {
		rec := ts.get(t, "/compare"+tc.query)
		if rec.Code != tc.status {
			t.Errorf("compare%s: %d, want %d", tc.query, rec.Code, tc.status)
		}
		one(t, parseHTML(t, rec.Body.Bytes()), "compare-form")
	}
}

func TestMissingRevisionIs404Page(t *testing.T) {
	ts := newTestServer(t)
	missing := strings.Repeat("b", 24)
	for _, path := range []string{
		"/r/" + missing, "/r/" + missing + "/view", "/r/" + missing + "/history", "/r/" + missing + "/bench.json",
		"/r/" + missing + "/report.json", "/r/" + missing + "/side.svg", "/r/" + missing + "/table.svg", "/r/" + missing + "/plan.svg",
		"/r/not-an-id", "/r/../../etc/passwd", "/nowhere", "/static/missing.js",
	} {
		rec := ts.get(t, path)
		if rec.Code != http.StatusNotFound {
			t.Errorf("GET %s: %d, want 404", path, rec.Code)
			continue
		}
		if strings.HasPrefix(path, "/static/") {
			continue
		}
		doc := parseHTML(t, rec.Body.Bytes())
		if st, _ := attr(one(t, doc, "error-page"), "data-status"); st != "404" {
			t.Errorf("GET %s: error page status %q", path, st)
		}
		if strings.Contains(rec.Body.String(), "goroutine") || strings.Contains(rec.Body.String(), ".go:") {
			t.Errorf("GET %s shows a trace", path)
		}
	}
	for _, path := range []string{"/r/" + missing + "/edit", "/r/" + missing + "/preview"} {
		if rec := ts.do(t, http.MethodPost, path, strings.NewReader("title=x"), "application/x-www-form-urlencoded"); rec.Code != http.StatusNotFound {
			t.Errorf("POST %s: %d, want 404", path, rec.Code)
		}
	}
	if rec := ts.do(t, http.MethodDelete, "/", nil, ""); rec.Code != http.StatusMethodNotAllowed {
		t.Errorf("DELETE /: %d, want 405", rec.Code)
	}
}

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

// TestPagesFollowTheCSP checks every page for what the Content-Security-Policy would block: inline
// scripts, inline event handlers and style attributes (in the SVGs too).
func TestPagesFollowTheCSP(t *testing.T) {
	ts := newTestServer(t)
	a := ts.startDemo(t)
	vals := ts.pageForm(t, a)
	vals.Set("elements[2].gap_mm", "160")
	b := redirectID(t, ts.postForm(t, "/r/"+a+"/edit", vals))
	for _, path := range []string{"/", "/r/" + b, "/r/" + b + "?paraxial=1", "/r/" + b + "/view", "/r/" + b + "/history", "/compare?a=" + a + "&b=" + b, "/compare", "/nowhere"} {
		rec := ts.get(t, path)
		if csp := rec.Header().Get("Content-Security-Policy"); csp != contentSecurityPolicy {
			t.Errorf("%s: CSP %q", path, csp)
		}
		doc := parseHTML(t, rec.Body.Bytes())
		for _, n := range findAll(doc, func(n *html.Node) bool { return n.Type == html.ElementNode }) {
			for _, at := range n.Attr {
				if at.Key == "style" || strings.HasPrefix(at.Key, "on") {
					t.Errorf("%s: <%s %s=%q> would be blocked by the CSP", path, n.Data, at.Key, truncate(at.Val, 60))
				}
			}
			if n.Data == "script" {
				if src, ok := attr(n, "src"); !ok || src != "/static/raytable.js" || n.FirstChild != nil {
					t.Errorf("%s: inline or foreign script", path)
				}
			}
			if n.Data == "style" {
				t.Errorf("%s: <style> element would be blocked by the CSP", path)
			}
		}
	}
}

func TestStaticFiles(t *testing.T) {
	ts := newTestServer(t)
	for path, ct := range map[string]string{"/static/raytable.css": "text/css; charset=utf-8", "/static/raytable.js": "text/javascript; charset=utf-8"} {
		rec := ts.get(t, path)
		if rec.Code != http.StatusOK || rec.Header().Get("Content-Type") != ct || rec.Body.Len() == 0 {
			t.Errorf("%s: %d %q %d bytes", path, rec.Code, rec.Header().Get("Content-Type"), rec.Body.Len())
		}
	}
}
