package diagram

import (
	"fmt"
	"testing"

	"raytable/optics"
)

// benchReport is the fixture with 300 rays (three wavelengths, 100 heights each, a few clipped).
func benchReport() *optics.Report {
	r := fixtureReport()
	r.Rays = nil
	r.WavelengthsNM = []float64{632.8, 532, 450}
	for _, nm := range r.WavelengthsNM {
		for k := range 100 {
			y0 := -3.5 + 7*float64(k)/99
			if k%25 == 0 {
				r.Rays = append(r.Rays, fixtureRay(fmt.Sprintf("%g/%d", nm, k), nm, y0, optics.RayClipped, "A1", "cut by the iris"))
				continue
			}
			r.Rays = append(r.Rays, fixtureRay(fmt.Sprintf("%g/%d", nm, k), nm, y0, optics.RayOK, "", ""))
		}
	}
	return r
}

func BenchmarkSide(b *testing.B) {
	r := benchReport()
	o := SideOptions{Exaggeration: 4, ShowParaxial: true}
	var n int
	for b.Loop() {
		n = len(Side(r, o))
	}
	b.ReportMetric(float64(n), "bytes/svg")
}

func BenchmarkTable(b *testing.B) {
	bench, r := fixtureBench(), benchReport()
	bench.Table = optics.Table{Grid: optics.GridMetric25, WidthMM: 900, DepthMM: 600}
	boarded(bench, r)
	var n int
	for b.Loop() {
		n = len(Table(r, TableOptions{}))
	}
	b.ReportMetric(float64(n), "bytes/svg")
}

func BenchmarkPlan(b *testing.B) {
	bench, r := fixtureBench(), benchReport()
	bench.Table = optics.Table{Grid: optics.GridMetric25, WidthMM: 900, DepthMM: 600}
	boarded(bench, r)
	var n int
	for b.Loop() {
		n = len(Plan(r))
	}
	b.ReportMetric(float64(n), "bytes/svg")
}
