package server

import (
	"bytes"
	"encoding/json"
	"encoding/xml"
	"net/http"
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
)

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
