package server

import (
	"bytes"
	"net/http"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// storeSplit stores the demo with a splitter after its second lens whose reflected arm holds a
// mirror and a dump, and returns its id.
func (ts *testServer) storeSplit(t *testing.T) string {
	t.Helper()
	b := benchtest.Load(t, "demo-bench.json")
	bs := optics.DefaultElement(optics.TypeSplitter)
	bs.ID = "BS1"
	m := optics.DefaultElement(optics.TypeMirror)
	m.ID, m.TurnDeg = "M5", new(-90.0)
	d := optics.DefaultElement(optics.TypeDump)
	d.ID = "D5"
	bs.Reflected = []optics.Element{m, d}
	b.Elements = append(b.Elements[:3], append([]optics.Element{bs}, b.Elements[3:]...)...)
	data, err := optics.Encode(b)
	if err != nil {
		t.Fatal(err)
	}
	return redirectID(t, ts.do(t, http.MethodPost, "/import", bytes.NewReader(data), "application/json"))
}

// TestNestedListButtons presses the buttons of a nested list through the plain form: add to the
// arm, move and delete in it; each stores the edited bench.
func TestNestedListButtons(t *testing.T) {
	ts := newTestServer(t)
	id := ts.storeSplit(t)
	cases := []struct {
		action, addType string
		check           func(b *optics.Bench) bool
	}{
		{"add-in:elements[3].reflected", "thin-lens", func(b *optics.Bench) bool {
			r := b.Elements[3].Reflected
			return len(r) == 3 && r[2].Type == optics.TypeThinLens && r[2].ID == "F2"
		}},
		{"down-at:elements[3].reflected[0]", "", func(b *optics.Bench) bool { return b.Elements[3].Reflected[1].ID == "M5" }},
		{"delete-at:elements[3].reflected[1]", "", func(b *optics.Bench) bool {
			r := b.Elements[3].Reflected
			return len(r) == 2 && r[0].ID == "D5" && r[1].ID == "F2"
		}},
	}
	for _, c := range cases {
		vals := ts.pageForm(t, id)
		vals.Set("action", c.action)
		if c.addType != "" {
			vals.Set("_add:elements[3].reflected", c.addType)
		}
		rec := ts.postForm(t, "/r/"+id+"/edit", vals)
		if rec.Code != http.StatusSeeOther {
			t.Fatalf("%s: %d %s", c.action, rec.Code, rec.Body.String())
		}
		next := redirectID(t, rec)
		b, _ := ts.bench(t, next)
		if !c.check(b) {
			t.Errorf("%s gave %+v", c.action, b.Elements[3].Reflected)
		}
		id = next
	}
}

// TestNestedBadInput: a wrong value in a nested list or a further source is shown at its own
// input, 422, and nothing is stored.
func TestNestedBadInput(t *testing.T) {
	ts := newTestServer(t)
	id := ts.storeSplit(t)
	cases := []struct{ name, value, want string }{
		{"elements[3].reflected[0].gap_mm", "far", "far"},
		{"elements[3].reflected[1].gap_mm", "", "required"},
		{"elements[3].dichroic", `{"edge": 5}`, "not a dichroic edge"},
		{"elements[3].reflect", "half", "half"},
		{"elements[3].thickness_mm", "thick", "thick"},
	}
	for _, c := range cases {
		before := ts.count(t)
		vals := ts.pageForm(t, id)
		vals.Set(c.name, c.value)
		vals.Set("action", "save")
		rec := ts.postForm(t, "/r/"+id+"/edit", vals)
		if rec.Code != http.StatusUnprocessableEntity {
			t.Errorf("%s=%q: status %d, want 422", c.name, c.value, rec.Code)
			continue
		}
		if ts.count(t) != before {
			t.Errorf("%s=%q: a design was stored", c.name, c.value)
		}
		msg := fieldError(t, parseHTML(t, rec.Body.Bytes()), c.name)
		if !strings.Contains(msg, c.want) {
			t.Errorf("%s=%q: message at the input %q, want it to say %q", c.name, c.value, msg, c.want)
		}
	}
}

// TestSourceButtons adds a laser and deletes it again; a delete naming no laser is a problem.
func TestSourceButtons(t *testing.T) {
	b := benchtest.Load(t, "demo-bench.json")
	if ps := applyAction(b, "add-source", nil); ps != nil || len(b.MoreSources) != 1 || b.MoreSources[0].ID == "" {
		t.Fatalf("add-source: %v, %d further sources", ps, len(b.MoreSources))
	}
	form := buildForm("x", b, benchValues(b), nil)
	if len(form.MoreSources) != 1 || form.MoreSources[0].DeleteAction != "delete-source:0" {
		t.Fatalf("the form shows %d further sources", len(form.MoreSources))
	}
	if ps := applyAction(b, "delete-source:1", nil); len(ps) != 1 || ps[0].Path != "action" {
		t.Errorf("delete-source:1 with one laser: %v", ps)
	}
	if ps := applyAction(b, "delete-source:0", nil); ps != nil || len(b.MoreSources) != 0 {
		t.Errorf("delete-source:0: %v, %d left", ps, len(b.MoreSources))
	}
}

// TestUnknownArmIsTheMainLine: a bench page or side view asked for an arm the bench does not have
// shows the main line, exactly as without the question (the id keys no drawing of its own).
func TestUnknownArmIsTheMainLine(t *testing.T) {
	ts := newTestServer(t)
	id := ts.startDemo(t)
	for _, path := range []string{"/r/" + id, "/r/" + id + "/side.svg"} {
		plain := ts.get(t, path)
		asked := ts.get(t, path+"?arm=nowhere")
		if plain.Code != http.StatusOK || asked.Code != http.StatusOK || plain.Body.String() != asked.Body.String() {
			t.Errorf("%s?arm=nowhere: %d, and it differs from %s (%d)", path, asked.Code, path, plain.Code)
		}
	}
}

// TestNestedProblemsFindTheirPlace: a problem is shown at its input when it has one, else in the
// group of the element or list it is about, the innermost one.
func TestNestedProblemsFindTheirPlace(t *testing.T) {
	b := benchtest.Load(t, "demo-bench.json")
	bs := optics.DefaultElement(optics.TypeSplitter)
	bs.ID = "BS1"
	bs.Reflected = []optics.Element{optics.DefaultElement(optics.TypeMirror)}
	b.Elements = append([]optics.Element{bs}, b.Elements...)
	problems := []optics.Problem{
		{Path: "elements[0].reflected[0].gap_mm", Message: "at the input"},
		{Path: "elements[0].reflected[0].faces_mm", Message: "in the nested element"},
		{Path: "elements[0].reflected", Message: "in the arm"},
		{Path: "elements[0].dichroic.edge_nm", Message: "at the dichroic"},
	}
	f := buildForm("x", b, benchValues(b), problems)
	arm := f.Elements[0].Arms[0]
	nested := arm.Elements[0]
	var gapErr, dichroicErr string
	for _, fl := range nested.Fields {
		if fl.Name == "elements[0].reflected[0].gap_mm" {
			gapErr = fl.Error
		}
	}
	for _, fl := range f.Elements[0].Fields {
		if fl.Name == "elements[0].dichroic" {
			dichroicErr = fl.Error
		}
	}
	checks := []struct{ where, got, want string }{
		{"nested gap input", gapErr, "at the input"},
		{"nested element group", strings.Join(nested.Errors, "; "), "faces_mm: in the nested element"},
		{"arm group", strings.Join(arm.Errors, "; "), "in the arm"},
		{"dichroic input", dichroicErr, "edge_nm: at the dichroic"},
		{"splitter group", strings.Join(f.Elements[0].Errors, "; "), ""},
		{"form", strings.Join(f.Errors, "; "), ""},
	}
	for _, c := range checks {
		if c.got != c.want {
			t.Errorf("%s shows %q, want %q", c.where, c.got, c.want)
		}
	}
}
