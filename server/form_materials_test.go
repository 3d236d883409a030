package server

import (
	"encoding/json"
	"net/http"
	"reflect"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/server/demo"
)

// TestFormMaterialsReadLikeAFile: the form's materials field is read by the bench file's own
// reader, so a mistake in it gives the problems, paths and messages that the same materials in an
// imported file give, and the page shows them beside the field.
func TestFormMaterialsReadLikeAFile(t *testing.T) {
	const materials = `{"oil": {"index": 1.5, "colour": "amber"}, "oil": {"index": 1.6}}`
	want := []optics.Problem{
		{Path: "materials.oil", Message: "appears more than once"},
		{Path: "materials.oil.colour", Message: "unknown field (allowed: sellmeier, range_nm, nd, vd, index)"},
	}

	file := strings.Replace(string(demo.Bench), `"elements"`, `"materials": `+materials+`, "elements"`, 1)
	ts := newTestServer(t)
	rec := ts.do(t, http.MethodPost, "/import", strings.NewReader(file), "application/json")
	var body jsonError
	if err := json.Unmarshal(rec.Body.Bytes(), &body); err != nil || rec.Code != http.StatusBadRequest {
		t.Fatalf("import: %d %s", rec.Code, rec.Body.String())
	}
	if !reflect.DeepEqual(body.Problems, want) {
		t.Errorf("import problems\n%v\nwant\n%v", body.Problems, want)
	}

	id := ts.startDemo(t)
	vals := ts.pageForm(t, id)
	vals.Set("materials", materials)
	vals.Set("action", "save")
	if _, problems := parseBenchForm(vals); !reflect.DeepEqual(problems, want) {
		t.Errorf("form problems\n%v\nwant\n%v", problems, want)
	}
	n := ts.count(t)
	rec = ts.postForm(t, "/r/"+id+"/edit", vals)
	if rec.Code != http.StatusUnprocessableEntity || ts.count(t) != n {
		t.Fatalf("edit: status %d, revisions %d -> %d; want 422 and nothing stored", rec.Code, n, ts.count(t))
	}
	msg := fieldError(t, parseHTML(t, rec.Body.Bytes()), "materials")
	if !strings.Contains(msg, "appears more than once") || !strings.Contains(msg, "colour: unknown field") {
		t.Errorf("beside the materials field: %q", msg)
	}
}
