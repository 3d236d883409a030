package beam

import (
	"strings"
	"testing"

	"raytable/optics"
)

func pointBench() *optics.Bench {
	return &optics.Bench{WavelengthsNM: []float64{hene}, Source: optics.Source{Kind: optics.SourcePoint}}
}

func collimatedBench() *optics.Bench {
	return &optics.Bench{WavelengthsNM: []float64{hene}, Source: optics.Source{Kind: optics.SourceCollimated}}
}

func find(ws []optics.Warning, code optics.WarningCode, element string) (optics.Warning, bool) {
	for _, w := range ws {
		if w.Code == code && w.Element == element {
			return w, true
		}
	}
	return optics.Warning{}, false
}

// Back-reflections: a face concave towards the incoming light reflects like a concave mirror of
// the same radius and focuses a collimated beam at R/2 in front of it (mirror focal length R/2,
// Hecht, Optics, 4th ed., §5.4, from memory; README, 'Report, format raytable/report/v1', Frames,
// for the concave mirror as a positive lens). Light reflected inside glass comes out with its
// remaining distance divided by n (reduced thickness; the plate shift t(1 - 1/n)).
func TestBackReflectionFocus(t *testing.T) {
	cases := []struct {
		name    string
		bench   *optics.Bench
		parts   []part
		warn    bool
		element string
		texts   []string
	}{
		// face at 10, focus R/2 = 20 mm back: 10 mm behind the source plane.
		{"concave face near the source", collimatedBench(), []part{lens("L", 10, -40, 0, 3, 1.5)}, true, "L",
			[]string{"face 0 of L", "10 mm behind the source plane"}},
		// face at 500, focus at 480, an iris at 470.
		{"ghost focus on an iris upstream", collimatedBench(), []part{plane("A", 470, 10), lens("L", 30, -40, 0, 3, 1.5)}, true, "L",
			[]string{"face 0 of L", "10 mm from A"}},
		{"ghost focus far from everything", collimatedBench(), []part{lens("L", 500, -40, 0, 3, 1.5)}, false, "L", nil},
		{"convex face", collimatedBench(), []part{lens("L", 500, 40, -1000, 3, 1.5)}, false, "L", nil},
		// Inner face R = -51.5 (concave seen from inside): R/2 = 25.75 mm in glass, 4 mm of it inside,
		// then (25.75 - 4)/1.5 = 14.5 mm in air: 4.5 mm from an iris at 190 mm.
		{"inner face through the glass", collimatedBench(), []part{plane("A", 190, 10), lens("L", 10, 0, -51.5, 4, 1.5)}, true, "L",
			[]string{"face 1 of L", "4.5 mm from A"}},
		// A point source at the centre of curvature of a face is imaged back onto itself.
		{"source at the centre of curvature", pointBench(), []part{lens("L", 100, -100, 0, 3, 1.5)}, true, "L",
			[]string{"face 0 of L", "source"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			ws := SafetyWarnings(c.bench, buildPath(hene, c.parts...))
			w, ok := find(ws, CodeBackReflection, c.element)
			if ok != c.warn {
				t.Fatalf("warning %v, want %v: %v", ok, c.warn, ws)
			}
			for _, s := range c.texts {
				if !strings.Contains(w.Message, s) {
					t.Errorf("message %q lacks %q", w.Message, s)
				}
			}
		})
	}
}

// Foci in or near glass, from the paraxial bundle and from the beam. A thin lens f = 50 at 100
// focuses at 150; a plate of thickness t and index n moves the focus by t(1 - 1/n) (the
// plane-parallel plate's focal shift, from memory; paraxial's TestPlateShiftsFocus checks it).
func TestFocusInOrNearGlass(t *testing.T) {
	cases := []struct {
		name    string
		parts   []part
		code    optics.WarningCode // "" = no focus warning
		element string
		text    string
	}{
		// plate from 145: the focus lies (150 - 145)·1.5 = 7.5 mm inside.
		{"focus in a plate", []part{thinLens("F", 100, 50), lens("W", 45, 0, 0, 10, 1.5), plane("S", 100, 0)}, CodeFocusInGlass, "W", "7.5 mm after its face 0"},
		{"focus before a plate", []part{thinLens("F", 100, 50), lens("W", 50.5, 0, 0, 10, 1.5), plane("S", 100, 0)}, CodeFocusNearGlass, "W", "0.5 mm before face 0 of W"},
		// plate 147.5..150.5 shifts the focus by 3(1 - 1/1.5) = 1 to 151: 0.5 mm behind its face 1.
		{"focus behind a plate", []part{thinLens("F", 100, 50), lens("W", 47.5, 0, 0, 3, 1.5), plane("S", 100, 0)}, CodeFocusNearGlass, "W", "0.5 mm after face 1 of W"},
		{"focus well clear", []part{thinLens("F", 100, 50), lens("W", 60, 0, 0, 3, 1.5), plane("S", 100, 0)}, "", "W", ""},
		{"no light after a dump", []part{thinLens("F", 100, 50), {id: "D", kind: optics.Plane, gapMM: 10, stops: true}, lens("W", 40, 0, 0, 10, 1.5)}, "", "W", ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			p := buildPath(nd, c.parts...)
			para := SafetyWarnings(collimatedBench(), p)
			_, beamWarns := Propagate(beamBench(nd, 3, 100, 1), p) // zR = 26.6 m >> f: nearly the same focus
			for _, set := range []struct {
				name string
				ws   []optics.Warning
			}{{"paraxial", para}, {"beam", beamWarns}} {
				if c.code == "" {
					for _, w := range set.ws {
						if w.Code == CodeFocusInGlass || w.Code == CodeFocusNearGlass {
							t.Errorf("%s: unexpected %v", set.name, w)
						}
					}
					continue
				}
				w, ok := find(set.ws, c.code, c.element)
				if !ok {
					t.Fatalf("%s: no %s for %s in %v", set.name, c.code, c.element, set.ws)
				}
				if !strings.Contains(w.Message, c.text) || !strings.Contains(w.Message, "tangential and sagittal planes") {
					t.Errorf("%s: message %q lacks %q", set.name, w.Message, c.text)
				}
			}
		})
	}
}

// A tilted concave mirror focuses the two planes apart; a plate placed at the tangential focus only
// sees a tangential focus inside.
func TestFocusPlaneNamed(t *testing.T) {
	// R = 200 at 90°: f_t = 70.7, f_s = 141.4. Plate 68..74 holds the tangential focus only.
	p := buildPath(hene, mirror("M", 100, 200, 90), lens("W", 68, 0, 0, 6, 1.5), plane("S", 300, 0))
	ws := SafetyWarnings(collimatedBench(), p)
	w, ok := find(ws, CodeFocusInGlass, "W")
	if !ok || !strings.HasSuffix(w.Message, "(tangential plane).") {
		t.Fatalf("want a tangential-only focus in W: %v", ws)
	}
}

func TestSafetyNoPanic(t *testing.T) {
	if SafetyWarnings(nil, nil) != nil || SafetyWarnings(collimatedBench(), &optics.Path{}) != nil {
		t.Fatal("empty input gives warnings")
	}
	b := collimatedBench()
	b.Source.Kind = "laser"
	if SafetyWarnings(b, buildPath(hene, lens("L", 10, -40, 0, 3, 1.5))) != nil {
		t.Fatal("unknown source kind gives warnings")
	}
}
