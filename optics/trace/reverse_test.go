package trace

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"raytable/optics"
	"raytable/optics/internal/approx"
)

// reversed builds the path seen by light running backwards from the plane at z = length: the
// mirror image z -> length - z, surfaces in the opposite order, every curvature negated (a centre
// downstream becomes upstream), the index after each surface the one that was before it, and a
// final plane where the source was.
func reversed(p *optics.Path, length float64) *optics.Path {
	var out []optics.Surface
	for j := len(p.Surfaces) - 1; j >= 0; j-- {
		s := p.Surfaces[j]
		s.PathMM = length - s.PathMM
		s.Curvature = -s.Curvature
		s.Index = []float64{p.IndexBefore(j, 0)}
		out = append(out, s)
	}
	out = append(out, plane("source", length, inf))
	return &optics.Path{WavelengthsNM: p.WavelengthsNM, Surfaces: out}
}

// The principle of reversibility of light (Helmholtz; e.g. Born and Wolf, Principles of Optics,
// ch. 3, geometrical optics; section from memory): a ray traced forward, turned round and traced back through the same surfaces
// in reverse returns to its starting point with the opposite direction.
func TestRayReversibility(t *testing.T) {
	const length = 200.0
	const reverseTol = 1e-9 // mm and direction cosines after 400 mm there and back; rounding leaves 1.4e-14 here
	systems := map[string]*optics.Path{
		"biconvex":       path(face(30, 1.0/60, 1.6), face(38, -1.0/80, 1)),
		"cemented pair":  path(face(40, 1.0/45, 1.52), face(47, -1.0/40, 1.72), face(49, -1.0/150, 1)),
		"meniscus+thin":  path(face(20, 1.0/25, 1.8), face(25, 1.0/60, 1), thin(90, 70)),
		"negative+plate": path(face(20, -1.0/30, 1.5), face(23, 1.0/30, 1), face(60, 0, 1.45), face(70, 0, 1)),
	}
	rng := rand.New(rand.NewPCG(1, 1))
	for name, p := range systems {
		p.Surfaces = append(p.Surfaces, plane("end", length, inf))
		back := reversed(p, length)
		for i := range 50 {
			s := Start{
				Pos: r3.Vec{X: rng.Float64()*6 - 3, Y: rng.Float64()*6 - 3, Z: 0},
				Dir: unit(r3.Vec{X: rng.Float64()*0.1 - 0.05, Y: rng.Float64()*0.1 - 0.05, Z: 1}),
			}
			t.Run(fmt.Sprintf("%s/%02d", name, i), func(t *testing.T) {
				end := last(mustTrace(t, p, s))
				turned := Start{Pos: r3.Vec{X: end.Pos.X, Y: end.Pos.Y, Z: 0}, Dir: r3.Vec{X: -end.Dir.X, Y: -end.Dir.Y, Z: end.Dir.Z}}
				home := last(mustTrace(t, back, turned))
				if d := math.Hypot(home.Pos.X-s.Pos.X, home.Pos.Y-s.Pos.Y); !approx.Abs(d, 0, reverseTol) {
					t.Errorf("came back %.3g mm away: %+v vs start %+v", d, home.Pos, s.Pos)
				}
				if d := norm(r3.Sub(home.Dir, r3.Vec{X: -s.Dir.X, Y: -s.Dir.Y, Z: s.Dir.Z})); !approx.Abs(d, 0, reverseTol) {
					t.Errorf("came back with direction %+v, want the reverse of %+v", home.Dir, s.Dir)
				}
			})
		}
	}
}
