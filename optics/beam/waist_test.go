package beam

import (
	"math"
	"testing"

	"raytable/optics/internal/approx"
)

// A concave mirror of radius R tilted by the incidence i has tangential and sagittal focal lengths
// (R/2)·cos i and (R/2)/cos i (Coddington). A beam with its waist on the mirror then has separate
// t and s waists, each where Self 1983 puts it for that focal length, listed as two entries with
// the other plane's fields null.
func TestTiltedConcaveMirror(t *testing.T) {
	const r, turn, w0 = 200.0, 90.0, 1.0
	i := (180 - turn) / 2 * math.Pi / 180
	ft, fs := r/2*math.Cos(i), r/2/math.Cos(i)
	p := buildPath(nd, mirror("M1", 100, r, turn), plane("S", 400, 0))
	rep, _ := Propagate(beamBench(nd, w0, 100, 1), p)
	ws := waistAfter(rep, "M1")
	if len(ws) != 2 {
		t.Fatalf("waists after M1: %+v", ws)
	}
	zR := RayleighRangeMM(w0, nd, 1)
	tw, sw := ws[0], ws[1]
	if tw.RadiusTMM == nil || tw.RadiusSMM != nil || tw.RayleighSMM != nil || sw.RadiusSMM == nil || sw.RadiusTMM != nil || sw.RayleighTMM != nil {
		t.Fatalf("want a tangential-only then a sagittal-only entry: %+v %+v", tw, sw)
	}
	for _, c := range []struct {
		name           string
		pathMM, radius float64
		f              float64
	}{{"tangential", tw.PathMM, *tw.RadiusTMM, ft}, {"sagittal", sw.PathMM, *sw.RadiusSMM, fs}} {
		sOut, m := selfWaist(0, zR, c.f)
		if !approx.Abs(c.pathMM-100, sOut, approx.VeryClose*100) || !approx.Rel(c.radius, m*w0, approx.VeryClose) {
			t.Errorf("%s waist at %v radius %v; Self 1983 with f = %v: %v, %v", c.name, c.pathMM-100, c.radius, c.f, sOut, m*w0)
		}
	}
	// Leaving the mirror the two planes differ: R_t = -f_t, R_s = -f_s (thin-lens law).
	m := row(rep, "M1")
	if !approx.Rel(*m.RTMM, -ft, approx.VeryClose) || !approx.Rel(*m.RSMM, -fs, approx.VeryClose) {
		t.Errorf("R leaving %v %v, want %v %v", *m.RTMM, *m.RSMM, -ft, -fs)
	}
	if !approx.Rel(m.WSMM, w0, approx.VeryClose) || !approx.Rel(m.WTMM, w0, approx.VeryClose) {
		t.Errorf("w leaving the mirror %v %v, want %v in both (the mirror sits at the waist)", m.WTMM, m.WSMM, w0)
	}
}

// The list's conventions (README, 'Report, format raytable/report/v1', beam.waists): one entry
// when t and s coincide; a waist on an element's plane belongs to the gap ending there (after =
// the element before it, null before the first); none upstream of the source, inside glass,
// virtual or beyond the last element.
func TestWaistConventions(t *testing.T) {
	type want struct {
		after  string // "" = null
		pathMM float64
	}
	cases := []struct {
		name    string
		parts   []part
		waistAt float64
		want    []want
	}{
		{"waist on an element plane", []part{plane("A", 100, 0), plane("B", 100, 0)}, 100, []want{{"", 100}}},
		{"waist between elements", []part{plane("A", 100, 0), plane("B", 100, 0)}, 150, []want{{"A", 150}}},
		{"waist on the second plane", []part{plane("A", 100, 0), plane("B", 100, 0)}, 200, []want{{"A", 200}}},
		{"waist at the source", []part{plane("A", 100, 0)}, 0, []want{{"", 0}}},
		{"upstream of the source", []part{plane("A", 100, 0)}, -100, nil},
		{"beyond the last element", []part{plane("A", 100, 0)}, 300, nil},
		// f = 50 at 100 with zR >> f: the focus near 150 falls 7.5 mm inside a flat plate of
		// index 1.5 starting at 145 (the reduced distance 5 becomes 5·n in glass): not listed.
		{"focus inside glass", []part{thinLens("F", 100, 50), lens("W", 45, 0, 0, 10, 1.5), plane("S", 100, 0)}, 100, []want{{"", 100}}},
		{"diverging lens, virtual waist", []part{thinLens("F", 100, -50), plane("S", 500, 0)}, 100, []want{{"", 100}}},
		{"two waists", []part{thinLens("F", 100, 50), plane("S", 500, 0)}, 100, []want{{"", 100}, {"F", 150}}},
	}
	// waistPosTol is how far a listed waist may lie from where the case puts it: the foci of
	// f = 50 mm with zR = 11.8 m fall f³/zR² ≈ 1e-3 mm short of the geometric ones (Self 1983).
	const waistPosTol = 0.01 // mm
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			p := buildPath(nd, c.parts...)
			rep, _ := Propagate(beamBench(nd, 2, c.waistAt, 1), p)
			if len(rep.Waists) != len(c.want) {
				t.Fatalf("waists %d, want %d: %+v", len(rep.Waists), len(c.want), rep.Waists)
			}
			for k, w := range rep.Waists {
				got := ""
				if w.After != nil {
					got = *w.After
				}
				if got != c.want[k].after || !approx.Abs(w.PathMM, c.want[k].pathMM, waistPosTol) {
					t.Errorf("waist %d after %q at %v, want after %q at %v", k, got, w.PathMM, c.want[k].after, c.want[k].pathMM)
				}
				// Without tilted curved mirrors the two planes coincide: one entry, both filled.
				if w.RadiusTMM == nil || w.RadiusSMM == nil || *w.RadiusTMM != *w.RadiusSMM || w.RayleighTMM == nil || w.RayleighSMM == nil {
					t.Errorf("waist %d: %+v, want both planes filled", k, w)
				}
			}
		})
	}
}

// Every element gets a row, in element order, screens and apertures too; arriving and leaving
// radii differ across a thick lens.
func TestRowsForEveryElement(t *testing.T) {
	p := buildPath(hene, plane("A", 10, 5), lens("L", 50, 50, -50, 6, 1.5), mirror("M", 40, 0, -90), thinLens("F", 30, 100), plane("D", 100, 0))
	p.Surfaces[len(p.Surfaces)-1].Stops = true
	rep, _ := Propagate(beamBench(hene, 0.5, -100, 1), p)
	ids := []string{"A", "L", "M", "F", "D"}
	if len(rep.Elements) != len(ids) {
		t.Fatalf("rows %v", rep.Elements)
	}
	for k, id := range ids {
		if rep.Elements[k].ID != id {
			t.Errorf("row %d is %s, want %s", k, rep.Elements[k].ID, id)
		}
	}
	if l := row(rep, "L"); l.ArrivingWTMM == l.WTMM {
		t.Errorf("a 6 mm thick lens leaves w unchanged: %v", l.WTMM)
	}
	// The envelope ends at the dump: no tail after the end of the beam.
	if last := rep.Samples[len(rep.Samples)-1].PathMM; last != p.Surfaces[len(p.Surfaces)-1].PathMM {
		t.Errorf("samples end at %v, want the dump at %v", last, p.Surfaces[len(p.Surfaces)-1].PathMM)
	}
}
