package analysis

import (
	"context"
	"strings"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
	"raytable/optics/paraxial"
	"raytable/optics/trace"
)

// TestRayCountIsTraced keeps the budget's ray count equal to the rays trace.AimedRays starts, on
// the shared benches of every source kind and shape.
func TestRayCountIsTraced(t *testing.T) {
	for _, name := range []string{"demo-bench.json", "michelson-bench.json", "combiner-bench.json", "fibre-bench.json", "relay-bench.json", "periscope-bench.json"} {
		b := benchtest.Load(t, name)
		for _, a := range optics.ResolveArms(b) {
			p := optics.BuildPath(a.Bench)
			tan := analyzeTan(a.Bench, p)
			if got, want := rayCount(&a.Bench.Source, len(p.WavelengthsNM)), len(trace.AimedRays(a.Bench, p, fanAim(a.Bench, tan))); got != want {
				t.Errorf("%s arm %s: budget counts %d rays, the trace starts %d", name, a.ID, got, want)
			}
		}
	}
}

// overBudget is the demo bench with every field angle and wavelength the caps allow and the
// largest fans: 16 x 16 x 201 rays through 10 faces, 514,560 ray-faces, far over the budget.
func overBudgetBench(t *testing.T) *optics.Bench {
	b := loadDemo(t)
	b.WavelengthsNM, b.Source.FieldAnglesDeg = nil, nil
	for i := range optics.MaxWavelengths {
		b.WavelengthsNM = append(b.WavelengthsNM, 450+10*float64(i))
		b.Source.FieldAnglesDeg = append(b.Source.FieldAnglesDeg, 0.001*float64(i))
	}
	fan := optics.MaxFanRays
	b.Source.FanRays = &fan
	if err := optics.Validate(b); err != nil {
		t.Fatal(err)
	}
	return b
}

// TestBudget: a bench over the budget is refused with EOverBudget, saying the numbers and what to
// reduce, before anything is computed: even a context that is already done (which any traced step
// would answer with EDeadline) gets the budget's answer. Within the budget, a done context gives
// EDeadline, and a live one the report RunValid gives.
func TestBudget(t *testing.T) {
	over := overBudgetBench(t)
	if n := RayFaces(over); n != 16*16*201*10+10 {
		t.Errorf("RayFaces = %d, want %d (16 fields x 16 wavelengths x 201 rays and 1 explicit ray, 10 faces)", n, 16*16*201*10+10)
	}
	done, cancel := context.WithCancel(context.Background())
	cancel()
	before := optics.Validations()
	_, err := RunContext(done, over)
	if optics.ErrorCode(err) != optics.EOverBudget {
		t.Fatalf("over the budget: %v (code %s), want %s", err, optics.ErrorCode(err), optics.EOverBudget)
	}
	for _, want := range []string{"514,570 ray-faces", "at most 25,000", "fewer field angles"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("message %q lacks %q", err, want)
		}
	}
	if optics.Validations() != before {
		t.Errorf("RunContext checked the rules again")
	}

	demo := loadDemo(t)
	if _, err := RunContext(done, demo); optics.ErrorCode(err) != optics.EDeadline {
		t.Errorf("a done context: %v, want code %s", err, optics.EDeadline)
	}
	got, err := RunContext(context.Background(), demo)
	if err != nil {
		t.Fatal(err)
	}
	if want := RunValid(demo); len(got.Rays) != len(want.Rays) || got.System.EFLMM == nil || *got.System.EFLMM != *want.System.EFLMM {
		t.Errorf("RunContext differs from RunValid: %d rays vs %d", len(got.Rays), len(want.Rays))
	}
}

// TestDeadlineStopsMidway: a context that ends while the rays are traced stops the computation
// at the next fan with EDeadline; the fan check is every optics.MaxFanRays rays.
func TestDeadlineStopsMidway(t *testing.T) {
	b := loadDemo(t)
	ctx, cancel := context.WithCancel(context.Background())
	p := optics.BuildPath(b)
	places := make([]optics.ElementPlace, len(b.Elements))
	cancel()
	if _, _, err := traceRays(ctx, b, p, places, analyzeTan(b, p)); optics.ErrorCode(err) != optics.EDeadline {
		t.Errorf("traceRays with a done context: %v", err)
	}
	if _, _, err := spacingTolerances(ctx, b, p, analyzeTan(b, p)); optics.ErrorCode(err) != optics.EDeadline {
		t.Errorf("spacingTolerances with a done context: %v", err)
	}
}

func analyzeTan(b *optics.Bench, p *optics.Path) paraxial.Result {
	return paraxial.Analyze(b, p, 0, paraxial.Tangential)
}
