package diagram

import (
	"bytes"
	"fmt"
	"math"
	"strings"
	"testing"

	"raytable/optics"
)

func TestEscaping(t *testing.T) {
	// Titles and ids are user input: '<' and '&' must reach the reader as typed, escaped exactly
	// once in the document.
	r := fixtureReport()
	r.Title = `a<b & "c"`
	r.Elements[0].ID = "L<1>"
	b := fixtureBench()
	b.Title = r.Title
	for name, out := range map[string][]byte{
		"side":  Side(r, SideOptions{}),
		"table": Table(boarded(b, r), TableOptions{}),
		"plan":  Plan(boarded(b, r)),
	} {
		root := parseSVG(t, out)
		if !strings.Contains(root.attr("aria-label"), `a<b & "c"`) {
			t.Errorf("%s: aria-label %q", name, root.attr("aria-label"))
		}
		titles := root.all(func(m xnode) bool { return m.XMLName.Local == "title" })
		if len(titles) == 0 || !strings.HasSuffix(titles[0].Text, `: a<b & "c"`) {
			t.Errorf("%s: document title %q", name, titles[0].Text)
		}
		if bytes.Contains(out, []byte("&amp;lt;")) || bytes.Contains(out, []byte("<b &")) {
			t.Errorf("%s: text escaped twice or not at all", name)
		}
		if name == "side" && !hasText(root, "L<1>") {
			t.Errorf("%s: element label L<1> not drawn as typed", name)
		}
	}
}

// TestControlCharactersStayWellFormed gives a title with control characters (a form or a bench
// file can carry them). XML 1.0 forbids them in a document, so a standalone drawing that wrote one
// raw, e.g. in the aria-label, would not open at all; each is replaced by U+FFFD.
func TestControlCharactersStayWellFormed(t *testing.T) {
	r := fixtureReport()
	r.Title = "a\x00b\x07c\x1bd"
	b := fixtureBench()
	b.Title = r.Title
	for name, out := range map[string][]byte{
		"side":  Side(r, SideOptions{}),
		"table": Table(boarded(b, r), TableOptions{}),
		"plan":  Plan(boarded(b, r)),
	} {
		root := parseSVG(t, out) // strict: fails on a forbidden character
		if got, want := root.attr("aria-label"), "a\uFFFDb\uFFFDc\uFFFDd"; !strings.HasSuffix(got, want) {
			t.Errorf("%s: aria-label %q, want it to end with %q", name, got, want)
		}
	}
}

func TestNoNonFiniteNumbers(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	r := fixtureReport()
	r.Rays[0].Hits[2].Exact.YMM = nan
	r.Rays[1].Hits[1].Exact.Dir = [3]float64{0, inf, 1}
	r.Rays[2].Start.YMM = inf
	r.Beam.Samples[3].WTMM = inf
	r.Beam.Samples[4].PathMM = nan
	r.Elements[1].SemiDiameterMM = fp(nan)
	r.Elements[2].Faces[0].RadiusMM = fp(inf)
	r.Elements[3].TableXMM = nan
	r.Placement[0].HeadingDeg = nan
	r.Placement[1].MountWidthMM = inf
	w := nan
	r.Beam.Waists[0].RadiusTMM = &w
	r.WavelengthsNM = append(r.WavelengthsNM, nan)
	b := fixtureBench()
	b.Table.HoleOffsetMM = fp(nan)
	for name, out := range map[string][]byte{
		"side":     Side(r, SideOptions{Exaggeration: nan, MMPerPX: nan, ZMaxMM: inf}),
		"table":    Table(boarded(b, r), TableOptions{MMPerPX: inf}),
		"plan":     Plan(boarded(b, r)),
		"paraxial": Side(r, SideOptions{ShowParaxial: true}),
	} {
		parseSVG(t, out)
		for _, bad := range []string{"NaN", "Inf"} {
			if bytes.Contains(out, []byte(bad)) {
				t.Errorf("%s contains %s", name, bad)
			}
		}
	}
}

func TestEmptyInputs(t *testing.T) {
	unlimited := fixtureReport()
	for i := range unlimited.Elements {
		unlimited.Elements[i].SemiDiameterMM = nil
		for k := range unlimited.Elements[i].Faces {
			unlimited.Elements[i].Faces[k].SemiDiameterMM = nil
		}
	}
	noRays := fixtureReport()
	noRays.Rays, noRays.Beam = nil, nil
	cases := map[string][]byte{
		"side nil":           Side(nil, SideOptions{}),
		"table nil":          Table(nil, TableOptions{}),
		"plan nil":           Plan(nil),
		"side empty":         Side(&optics.Report{}, SideOptions{ShowParaxial: true, Exaggeration: 10}),
		"table no bench":     Table(fixtureReport(), TableOptions{}),
		"plan no table size": Plan(boarded(&optics.Bench{}, fixtureReport())),
		"side unlimited":     Side(unlimited, SideOptions{}),
		"table unlimited":    Table(boarded(fixtureBench(), unlimited), TableOptions{}),
		"side no rays":       Side(noRays, SideOptions{ShowParaxial: true}),
		"table no rays":      Table(boarded(fixtureBench(), noRays), TableOptions{}),
	}
	for name, out := range cases {
		parseSVG(t, out)
		if len(out) == 0 {
			t.Errorf("%s: empty output", name)
		}
	}
	// Unlimited elements are drawn with a nominal size from the rays: the lens outline exists.
	root := parseSVG(t, cases["side unlimited"])
	if got := root.count("elements", "polygon"); got != 1 {
		t.Errorf("unlimited lens outlines = %d, want 1", got)
	}
}

func TestNiceLength(t *testing.T) {
	// Scale bars use 1-2-5 steps (common practice for chart scales).
	for _, c := range []struct{ in, want float64 }{{37, 20}, {100, 100}, {0.3, 0.2}, {9.99, 5}, {1, 1}, {0, 1}} {
		if got := niceLength(c.in); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("niceLength(%g) = %g, want %g", c.in, got, c.want)
		}
	}
}

func TestWrap(t *testing.T) {
	lines := wrap("aaa bbb ccc dddddddddd e", 7)
	want := []string{"aaa bbb", "ccc", "ddddddd", "ddd e"}
	if fmt.Sprint(lines) != fmt.Sprint(want) {
		t.Errorf("wrap = %q, want %q", lines, want)
	}
	if strings.Join(wrap(optics.CautionText(), 60), " ") != optics.CautionText() {
		t.Error("wrapping loses words")
	}
}
