package diagram

import (
	"bytes"
	"encoding/xml"
	"errors"
	"io"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/analysis"
	"raytable/optics/benchtest"
)

// FuzzDrawings draws the side view, the table view and the printable plan of every bench the
// decoder accepts. None may panic, each must be well-formed XML, and none may write a NaN or an
// infinity into a coordinate or a label. Benches heavier than benchtest.Light are skipped. Seeds:
// every testdata bench, plus testdata/fuzz/FuzzDrawings.
func FuzzDrawings(f *testing.F) {
	for _, data := range benchtest.BenchFiles(f) {
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		b, err := optics.Decode(data)
		if err != nil || !benchtest.Light(b) {
			return
		}
		r := analysis.RunValid(b)
		drawings := []struct {
			name string
			svg  []byte
		}{
			{"side", Side(r, SideOptions{})},
			{"side exaggerated", Side(r, SideOptions{Exaggeration: 5, ShowParaxial: true})},
			{"table", Table(r, TableOptions{})},
			{"plan", Plan(r)},
		}
		for _, d := range drawings {
			checkSVG(t, d.name, d.svg)
		}
	})
}

// checkSVG fails when svg is not well-formed XML or writes a NaN or an infinity into an attribute
// (coordinates, sizes, paths). Text and labels are left alone: a title may say "Infrared".
func checkSVG(t *testing.T, name string, svg []byte) {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(svg))
	for {
		tok, err := dec.Token()
		if errors.Is(err, io.EOF) {
			return
		}
		if err != nil {
			t.Fatalf("%s drawing is not well-formed XML: %v", name, err)
		}
		el, ok := tok.(xml.StartElement)
		if !ok {
			continue
		}
		for _, a := range el.Attr {
			if a.Name.Local == "aria-label" || a.Name.Local == "id" || strings.HasPrefix(a.Name.Local, "data-") {
				continue // words of the bench's own, not numbers
			}
			if strings.Contains(a.Value, "NaN") || strings.Contains(a.Value, "Inf") {
				t.Fatalf("%s drawing writes <%s %s=%q>", name, el.Name.Local, a.Name.Local, a.Value)
			}
		}
	}
}
