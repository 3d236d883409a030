package beam

import (
	"math"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/internal/approx"
	"raytable/optics/numfmt"
)

// The beam leaving a thin lens, the last element: its waist where Self's formula puts it (S. A.
// Self, Applied Optics 22, 658, 1983), radius m·w0, Rayleigh range π w0'²/(M²λ) and far-field
// half-angle θ = M²λ/(π w0') (ISO 11146-1 definitions; from memory).
func TestOutputBeamAfterThinLens(t *testing.T) {
	cases := []struct {
		name                string
		w0, sMM, fMM, m2, l float64
	}{
		{"waist on the lens", 0.5, 0, 100, 1, 1064},
		{"waist 300 mm before a 250 mm lens, M² 1.3", 1, 300, 250, 1.3, 632.8},
		{"diverging lens: virtual waist", 0.8, 50, -100, 1, 532},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			p := buildPath(c.l, thinLens("F", 400, c.fMM))
			rep, _ := Propagate(beamBench(c.l, c.w0, 400-c.sMM, c.m2), p)
			o := rep.Output
			if o == nil || o.After != "F" {
				t.Fatalf("output %+v", o)
			}
			zR := RayleighRangeMM(c.w0, c.l, c.m2)
			sOut, m := selfWaist(c.sMM, zR, c.fMM)
			w1 := m * c.w0
			for _, pl := range []optics.OutputWaist{o.T, o.S} {
				approx.Check(t, "waist from the lens (Self 1983)", pl.FromLastMM, sOut, approx.VeryClose*math.Max(1, math.Abs(sOut)))
				approx.Check(t, "waist radius (Self 1983)", pl.RadiusMM, w1, approx.VeryClose)
				approx.Check(t, "Rayleigh range π w0²/(M²λ)", pl.RayleighMM, math.Pi*w1*w1/(c.m2*c.l*1e-6), approx.VeryClose)
				approx.Check(t, "divergence M²λ/(π w0)", pl.DivergenceRad, c.m2*c.l*1e-6/(math.Pi*w1), approx.VeryClose)
			}
			if c.fMM < 0 && !(o.T.FromLastMM < 0) {
				t.Errorf("a diverging lens leaves a virtual waist, got %v", o.T.FromLastMM)
			}
		})
	}
}

// A beam focused into a thick flat plate of index n: paraxially the waist moves n times as deep as
// the air focus lay behind the face, keeps its radius, and its Rayleigh range in the glass is
// π w0² n/(M²λ), n times the one in air (from memory).
func TestGlassWaistInPlate(t *testing.T) {
	const w0, f, m2, n = 1.0, 100.0, 1.2, 1.5
	zR := RayleighRangeMM(w0, nd, m2)
	sOut, m := selfWaist(0, zR, f) // the source waist sits on the lens
	w1 := m * w0
	const before = 5.0 // mm: the air focus would lie this far behind the plate's face
	p := buildPath(nd, thinLens("F", 100, f), lens("P", sOut-before, 0, 0, 30, n), plane("S", 20, 0))
	rep, _ := Propagate(beamBench(nd, w0, 100, m2), p)
	if len(rep.GlassWaists) != 1 {
		t.Fatalf("glass waists %+v", rep.GlassWaists)
	}
	g := rep.GlassWaists[0]
	if g.Element != "P" || g.RadiusTMM == nil || g.RadiusSMM == nil {
		t.Fatalf("glass waist %+v", g)
	}
	approx.Check(t, "depth n·5 mm", g.DepthMM, n*before, 1e-9)
	approx.Check(t, "index", g.Index, n, 0)
	approx.Check(t, "radius unchanged by a flat face", *g.RadiusTMM, w1, approx.VeryClose)
	approx.Check(t, "Rayleigh range π w0² n/(M²λ)", *g.RayleighTMM, math.Pi*w1*w1*n/(m2*nd*1e-6), approx.VeryClose)
	approx.Check(t, "n times the air one", *g.RayleighSMM/(math.Pi*w1*w1/(m2*nd*1e-6)), n, approx.VeryClose)
	if len(waistAfter(rep, "F")) != 0 {
		t.Errorf("the waist in glass is not a waist in air: %+v", rep.Waists)
	}
}

// A screen placed off the beam's focus by more than the Rayleigh range is named, with the side
// and the distance; one within it, or a collimated beam whose waist lies far upstream, is not.
func TestFocusMissesScreen(t *testing.T) {
	const w0, f = 1.0, 100.0
	zR := RayleighRangeMM(w0, nd, 1)
	sOut, m := selfWaist(0, zR, f)
	zR1 := RayleighRangeMM(m*w0, nd, 1) // about 3.4 mm
	cases := []struct {
		name   string
		lensF  float64
		gapMM  float64
		want   string // "" no warning
		wantMM float64
	}{
		{"screen at the focus", f, sOut, "", 0},
		{"screen half a Rayleigh range short", f, sOut - zR1/2, "", 0},
		{"screen 10 mm short", f, sOut - 10, "behind S", 10},
		{"screen 12 mm long", f, sOut + 12, "in front of S", 12},
		{"weak lens, screen close", 1e5, 50, "", 0},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			b := beamBench(nd, w0, 100, 1)
			b.Elements = []optics.Element{{ID: "F", Type: optics.TypeThinLens}, {ID: "S", Type: optics.TypeScreen}}
			p := buildPath(nd, thinLens("F", 100, c.lensF), plane("S", c.gapMM, 0))
			_, warns := Propagate(b, p)
			var got []optics.Warning
			for _, w := range warns {
				if w.Code == optics.WarnFocusMissesScreen {
					got = append(got, w)
				}
			}
			if c.want == "" {
				if len(got) != 0 {
					t.Fatalf("unexpected %+v", got)
				}
				return
			}
			if len(got) != 1 || got[0].Element != "S" || !strings.Contains(got[0].Message, c.want) ||
				!strings.Contains(got[0].Message, "focuses "+numfmt.Rough.Format(c.wantMM)+" mm") {
				t.Fatalf("want %q %v mm, got %+v", c.want, c.wantMM, got)
			}
		})
	}
}
