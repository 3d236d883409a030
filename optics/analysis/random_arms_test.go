package analysis

import (
	"encoding/json"
	"fmt"
	"math/rand/v2"
	"testing"

	"raytable/optics"
)

// randomArms makes a branching bench by hand as ResolveArms unfolds one: a random main bench and
// one to three arms that leave it at a random element (turned into a flat mirror pass, as a
// reflected pass through a splitter becomes) and go on through random elements of their own,
// sometimes ending on another pass through one of main's parts.
func randomArms(rng *rand.Rand) (*optics.Bench, []optics.Arm) {
	main := randomBench(rng)
	arms := []optics.Arm{{ID: "main", Source: "source", Bench: main, PowerFraction: 1}}
	for _, e := range main.Elements {
		arms[0].Part = append(arms[0].Part, e.ID)
	}
	for k := range 1 + rng.IntN(3) {
		at := rng.IntN(len(main.Elements))
		child := *main
		child.Elements = append([]optics.Element{}, main.Elements[:at]...)
		turn := []float64{90, -90, 45, 170}[rng.IntN(4)]
		child.Elements = append(child.Elements, optics.Element{ID: main.Elements[at].ID, Type: optics.TypeMirror, GapMM: main.Elements[at].GapMM, TurnDeg: &turn})
		a := optics.Arm{ID: fmt.Sprintf("%s.reflected", main.Elements[at].ID), Parent: "main", Source: "source", Own: at + 1,
			PowerFraction: rng.Float64(), Part: append(append([]string{}, arms[0].Part[:at]...), main.Elements[at].ID)}
		for _, e := range randomBench(rng).Elements {
			e.ID = fmt.Sprintf("A%d%s", k, e.ID)
			child.Elements = append(child.Elements, e)
			a.Part = append(a.Part, e.ID)
		}
		if rng.IntN(2) == 0 { // another pass through a part of main's
			p := main.Elements[rng.IntN(len(main.Elements))]
			part := p.ID
			p.ID = fmt.Sprintf("A%dpass", k)
			p.GapMM = []float64{0, 10, 100}[rng.IntN(3)]
			child.Elements = append(child.Elements, p)
			a.Part = append(a.Part, part)
		}
		a.Bench = &child
		arms = append(arms, a)
	}
	return main, arms
}

// TestRandomBranchingBenches runs seeded random branching benches (see randomArms) and checks
// that nothing panics and every report, and each arm's full report, encodes as JSON: no NaN or
// ±Inf anywhere.
func TestRandomBranchingBenches(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 2))
	ran := 0
	for i := range 400 {
		b, arms := randomArms(rng)
		valid := true
		for _, a := range arms {
			valid = valid && optics.Validate(a.Bench) == nil
		}
		if !valid {
			continue
		}
		ran++
		func() {
			defer func() {
				if p := recover(); p != nil {
					data, _ := json.Marshal(arms)
					t.Fatalf("bench %d: panic %v\narms: %s", i, p, data)
				}
			}()
			r := runArms(b, arms)
			if len(r.Arms) != len(arms) || len(r.Board.Arms) != len(arms) {
				t.Fatalf("bench %d: %d arm reports, %d board arms for %d arms", i, len(r.Arms), len(r.Board.Arms), len(arms))
			}
			for k, fr := range append([]*optics.Report{r}, r.ArmFull...) {
				if _, err := json.Marshal(fr); err != nil {
					data, _ := json.Marshal(arms)
					t.Fatalf("bench %d, report %d does not encode: %v\narms: %s", i, k, err, data)
				}
			}
		}()
	}
	if ran < 200 {
		t.Errorf("only %d of 400 random branching benches were valid: the generator is broken", ran)
	}
	t.Logf("%d random branching benches ran", ran)
}
