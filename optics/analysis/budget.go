package analysis

import (
	"context"
	"fmt"

	"raytable/optics"
)

// RunContext computes the report of a bench that Validate (or Decode) has accepted, within a
// work budget and a deadline. Before anything is traced it estimates the work (RayFaces) and
// refuses a bench over optics.MaxRayFaces with an *optics.Error of code optics.EOverBudget that
// says what to reduce; while computing it checks ctx per arm, per fan of rays and per spacing
// step, and once ctx is done it stops with code optics.EDeadline. Otherwise it returns what
// RunValid returns.
func RunContext(ctx context.Context, b *optics.Bench) (*optics.Report, error) {
	arms := optics.ResolveArms(b)
	if n := rayFaces(arms); n > optics.MaxRayFaces {
		return nil, overBudget(n)
	}
	if err := deadlineErr(ctx); err != nil {
		return nil, err
	}
	return runArmsContext(ctx, b, arms)
}

// CheckBudget refuses a bench whose report would exceed the work budget, with the error
// RunContext gives it. The server calls it before storing a bench, so that nothing is stored that
// could not be shown (README, 'Limits and who can see what').
func CheckBudget(b *optics.Bench) error {
	if n := RayFaces(b); n > optics.MaxRayFaces {
		return overBudget(n)
	}
	return nil
}

// RayFaces estimates the work of b's report: the exact rays of every arm (each with its
// paraxial twin) times the faces of that arm's path, summed over the arms. Each ray-face is a
// trace step, a hit in the report and its JSON and a point of the drawings.
func RayFaces(b *optics.Bench) int { return rayFaces(optics.ResolveArms(b)) }

func rayFaces(arms []optics.Arm) int {
	total := 0
	for _, a := range arms {
		p := optics.BuildPath(a.Bench)
		total += rayCount(&a.Bench.Source, len(p.WavelengthsNM)) * len(p.Surfaces)
	}
	return total
}

// rayCount is how many rays trace.AimedRays starts for a source over k wavelengths: the explicit
// rays, and one fan per field (at least the axial one) and wavelength.
func rayCount(src *optics.Source, k int) int {
	fields := len(src.FieldAnglesDeg)
	if src.Diverging() {
		fields = len(src.ObjectHeightsMM)
	}
	return len(src.Rays) + max(fields, 1)*k*max(src.FanRayCount(), 0)
}

func overBudget(n int) error {
	return optics.Errorf(optics.EOverBudget,
		"the bench would trace %s ray-faces (rays times the faces they cross, over all arms); at most %s are allowed: use fewer field angles, object heights, wavelengths, fan rays, explicit rays, elements or splitters",
		thousands(n), thousands(optics.MaxRayFaces))
}

// deadlineErr is nil while ctx runs, and the EDeadline error once it is done.
func deadlineErr(ctx context.Context) error {
	if ctx.Err() == nil {
		return nil
	}
	return optics.Errorf(optics.EDeadline,
		"computing the bench took longer than raytable allows for one request; use fewer field angles, wavelengths, fan rays or elements")
}

// thousands writes n with commas between groups of three digits: 2,400,000.
func thousands(n int) string {
	s := fmt.Sprint(n)
	for i := len(s) - 3; i > 0; i -= 3 {
		s = s[:i] + "," + s[i:]
	}
	return s
}
