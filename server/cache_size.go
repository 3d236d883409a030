package server

import (
	"raytable/optics"
	"raytable/web/view"
)

// Estimated bytes of what a cache entry keeps, for the cache's byte bound. The per-ray, per-hit
// and per-sample sizes are Go's sizes of optics.Ray, optics.Hit and optics.BeamSample with the
// strings and slice headers they carry, rounded up; TestCacheSizeEstimate measures the heap a
// report takes and checks the estimate against it.
const (
	hitBytes        = 96       // optics.Hit: element id header, face, paraxial and exact point
	rayBytes        = 320      // optics.Ray without its hits: name, field, status, start
	sampleBytes     = 160      // optics.BeamSample of both planes
	reportBaseBytes = 64 << 10 // the rest of a report: tables per element, warnings, board
	benchBytes      = 64 << 10 // a decoded bench: at most optics.MaxElements elements
	resultBaseBytes = 32 << 10 // a view.Result besides its drawings: the numbers panel
)

// sizeOf estimates the bytes a cached value holds.
func sizeOf(v any) int64 {
	switch v := v.(type) {
	case []byte:
		return int64(len(v))
	case *optics.Report:
		return reportSize(v)
	case view.Result:
		return resultBaseBytes + int64(len(v.SideSVG)+len(v.TableSVG))
	case *optics.Bench:
		return benchBytes
	}
	return reportBaseBytes
}

// reportSize counts the rays, hits and beam samples of a report and of each arm's own report.
func reportSize(r *optics.Report) int64 {
	arms := r.ArmFull
	if len(arms) == 0 {
		arms = []*optics.Report{r}
	}
	var n int64
	for _, a := range arms {
		n += reportBaseBytes
		for i := range a.Rays {
			n += rayBytes + hitBytes*int64(len(a.Rays[i].Hits))
		}
		if a.Beam != nil {
			n += sampleBytes * int64(len(a.Beam.Samples))
		}
	}
	return n
}
