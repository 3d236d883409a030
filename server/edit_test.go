package server

import (
	"bytes"
	"net/http"
	"strings"
	"testing"

	"raytable/optics"
)

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
