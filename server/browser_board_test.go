package server_test

import (
	"context"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"raytable/optics"
	"raytable/server/store"
)

// Expected hole grid of the collide bench's table, 609.6 x 304.8 mm with the imperial grid.
// Common practice: 1/4-20 holes on a 1 in (25.4 mm) pitch, the first hole 0.5 in (12.7 mm) in from
// the front and left edges, and only holes whose centres lie inside the table. Across:
// 12.7 + 23*25.4 = 596.9 < 609.6 < 12.7 + 24*25.4, so 24 columns; along the depth:
// 12.7 + 11*25.4 = 292.1 < 304.8 < 12.7 + 12*25.4, so 12 rows.
const (
	collideColumns = 24
	collideRows    = 12
	collidePitchMM = 25.4
	collideWidthMM = 609.6
	// holeSpanTol is the relative tolerance on drawn positions: the SVG writes pixel coordinates
	// with one decimal (±0.05 px) over a span of several hundred pixels.
	holeSpanTol = 1e-3
	// checkBarMM is the length of the plan's check bar, measured with a ruler on the print.
	checkBarMM = 100
	// planScaleTol bounds the error of the printed size: coordinates are written with two decimals.
	planScaleTol = 1e-6
)

// TestBrowserBreadboard imports a bench built to collide, then checks in the live page that the
// table view draws the breadboard's hole grid to scale, that the mount collision is listed in the
// warnings and drawn in place, that the placement list has a row per element, that the laser
// cautions are shown on the bench page and the presentation view, and that the printable plan is
// sized in millimetres with its 100 mm check bar. No request may fail and the console must stay
// free of errors.
func TestBrowserBreadboard(t *testing.T) {
	start := time.Now()
	var seen problems
	tab := browserTab(t, seen.listen)
	base := startServer(t)
	defer seen.check(t) // also after a failed step, to show what the browser saw

	benchJSON, err := os.ReadFile(filepath.Join("..", "testdata", "collide-bench.json"))
	if err != nil {
		t.Fatal(err)
	}

	// Import by pasting the file into the home page's form (a plain form post and a 303).
	if err := chromedp.Do(tab,
		chromedp.Navigate(base+"/"),
		chromedp.WaitVisible(chromedp.CSS(`#import-text`)),
		chromedp.SetValue(chromedp.CSS(`#import-text`), string(benchJSON)),
	); err != nil {
		t.Fatalf("home page: %v", err)
	}
	resp, err := chromedp.RunResponse(tab, chromedp.Click(chromedp.CSS(`[data-testid=import-form] button[type=submit]`)))
	if err != nil {
		t.Fatalf("import: %v", err)
	}
	if resp.Status != 200 {
		t.Fatalf("import led to status %d at %s", resp.Status, resp.URL)
	}
	if err := chromedp.Do(tab, chromedp.WaitVisible(chromedp.CSS(`[data-testid=bench-page]`))); err != nil {
		t.Fatalf("bench page: %v", err)
	}
	id := js[string](t, tab, revisionJS)
	if !store.ValidID(id) {
		t.Fatalf("revision id %q", id)
	}
	if got := js[string](t, tab, `location.pathname`); got != "/r/"+id {
		t.Errorf("import landed on %s, want /r/%s", got, id)
	}
	var rep optics.Report
	getJSON(t, base+"/r/"+id+"/report.json", &rep)

	t.Run("hole grid", func(t *testing.T) {
		if rep.Holes.Columns != collideColumns || rep.Holes.Rows != collideRows {
			t.Errorf("report grid %d x %d, want %d x %d", rep.Holes.Columns, rep.Holes.Rows, collideColumns, collideRows)
		}
		want := rep.Holes.Columns * rep.Holes.Rows
		got := js[int](t, tab, `document.querySelectorAll('[data-testid=table-view] > svg .holes circle').length`)
		if got != want || got <= 100 {
			t.Errorf("table view draws %d holes, want columns*rows = %d (and more than 100)", got, want)
		}
		// Drawn to scale: the first and last hole centres of the grid span 23 pitches, which is
		// 23*25.4/609.6 of the drawn table's width (the table outline is the grey-filled rect
		// drawn in the same coordinates as the holes).
		span := js[[]float64](t, tab, `(() => {
			const svg = document.querySelector('[data-testid=table-view] > svg');
			const xs = Array.from(svg.querySelectorAll('.holes circle')).map(c => +c.getAttribute('cx'));
			const table = svg.querySelector('.holes').parentNode.querySelector('rect[fill="#f3f3ee"]');
			return [Math.max(...xs) - Math.min(...xs), table ? +table.getAttribute('width') : 0];
		})()`)
		wantRatio := float64(collideColumns-1) * collidePitchMM / collideWidthMM
		if span[1] <= 0 {
			t.Fatal("no table outline found beside the holes")
		}
		if r := span[0] / span[1]; math.Abs(r-wantRatio) > holeSpanTol {
			t.Errorf("hole span / table width = %.5f, want %.5f", r, wantRatio)
		}
	})

	t.Run("collision warning", func(t *testing.T) {
		overlap := -1
		for i, w := range rep.Warnings {
			if w.Code == "mounts-overlap" && strings.Contains(w.Message, "RL1") && strings.Contains(w.Message, "RL2") {
				overlap = i
				break
			}
		}
		if overlap < 0 {
			t.Fatalf("report has no mounts-overlap warning naming RL1 and RL2: %+v", rep.Warnings)
		}
		w := rep.Warnings[overlap]
		// The numbers panel lists it in plain words.
		items := js[[]string](t, tab, `Array.from(document.querySelectorAll('[data-testid=warnings] li')).map(li => li.textContent)`)
		found := false
		for _, s := range items {
			if strings.Contains(s, w.Message) && strings.Contains(s, "RL1") && strings.Contains(s, "RL2") {
				found = true
			}
		}
		if !found {
			t.Errorf("page warnings %q lack %q", items, w.Message)
		}
		// The table view marks it in place: a numbered marker titled with the code, its number the
		// warning's place in the legend.
		marker := js[[]string](t, tab, `(() => {
			const g = Array.from(document.querySelectorAll('[data-testid=table-view] > svg .warning-markers > g'))
				.find(g => (g.querySelector('title')?.textContent || '').startsWith('mounts-overlap:'));
			if (!g) return [];
			return [g.querySelector('title').textContent, g.querySelector('text').textContent, g.querySelector('circle').getAttribute('fill')];
		})()`)
		if len(marker) != 3 {
			t.Fatal("table view has no marker for the mounts-overlap warning")
		}
		if !strings.Contains(marker[0], "RL1") || !strings.Contains(marker[0], "RL2") {
			t.Errorf("marker title %q does not name RL1 and RL2", marker[0])
		}
		if marker[1] != fmt.Sprint(overlap+1) {
			t.Errorf("marker number %q, want %d", marker[1], overlap+1)
		}
		legend := js[string](t, tab, `document.querySelector('[data-testid=table-view] > svg').textContent`)
		if !strings.Contains(legend, fmt.Sprintf("%d.", overlap+1)) || !strings.Contains(legend, "mounts-overlap: the mounts of RL1") {
			t.Errorf("table view legend lacks the numbered mounts-overlap line")
		}
		// The two colliding footprints are outlined in red; footprints are drawn in placement order.
		strokes := js[[]string](t, tab, `Array.from(document.querySelectorAll('[data-testid=table-view] > svg .mounts polygon')).map(p => p.getAttribute('stroke'))`)
		if len(strokes) != len(rep.Placement) {
			t.Fatalf("%d footprints drawn, want one per placement (%d)", len(strokes), len(rep.Placement))
		}
		for i, p := range rep.Placement {
			if (p.ID == "RL1" || p.ID == "RL2") && strokes[i] != "#c62828" {
				t.Errorf("footprint of %s stroked %s, want the red collision outline", p.ID, strokes[i])
			}
		}
	})

	t.Run("placement list", func(t *testing.T) {
		rows := js[[][]string](t, tab, `Array.from(document.querySelectorAll('[data-testid=placement] tbody tr'))
			.map(tr => Array.from(tr.cells).map(td => td.textContent))`)
		if len(rep.Placement) != 3 {
			t.Errorf("report places %d elements, want 3 (RL1, RL2, TRAP)", len(rep.Placement))
		}
		if len(rows) != len(rep.Placement) {
			t.Fatalf("placement list has %d rows, report %d", len(rows), len(rep.Placement))
		}
		for i, p := range rep.Placement {
			want := []string{p.ID, p.Type}
			if p.HoleColumn > 0 {
				want = append(want, fmt.Sprint(p.HoleColumn), fmt.Sprint(p.HoleRow))
			}
			got := []string{rows[i][0], rows[i][1], rows[i][5], rows[i][6]}
			if strings.Join(got[:len(want)], " ") != strings.Join(want, " ") {
				t.Errorf("placement row %d: id, type, column, row = %q, want %q", i, got, want)
			}
		}
	})

	t.Run("cautions", func(t *testing.T) {
		checkCautions(t, tab, "bench page")
		if err := chromedp.Do(tab,
			chromedp.Navigate(base+"/r/"+id+"/view"),
			chromedp.WaitVisible(chromedp.CSS(`[data-testid=present-page]`)),
		); err != nil {
			t.Fatalf("presentation view: %v", err)
		}
		checkCautions(t, tab, "presentation view")
	})

	t.Run("printable plan", func(t *testing.T) {
		if err := chromedp.Do(tab,
			chromedp.Navigate(base+"/r/"+id+"/plan.svg"),
			chromedp.WaitReady(chromedp.CSS(`.check-bar`)),
		); err != nil {
			t.Fatalf("plan: %v", err)
		}
		plan := js[map[string]string](t, tab, `(() => {
			const s = document.documentElement, bar = document.querySelector('.check-bar');
			return {root: s.localName, width: s.getAttribute('width'), height: s.getAttribute('height'),
				viewBox: s.getAttribute('viewBox') || '', bar: bar ? bar.getAttribute('width') : '',
				cautions: (document.querySelector('.cautions-text') || {}).textContent || ''};
		})()`)
		if plan["root"] != "svg" {
			t.Fatalf("plan.svg opens as %q, not an SVG document", plan["root"])
		}
		if !strings.HasSuffix(plan["width"], "mm") || !strings.HasSuffix(plan["height"], "mm") {
			t.Fatalf("plan size %q x %q, want millimetres", plan["width"], plan["height"])
		}
		// Printed at 100 %, one user unit is width_mm / viewBox width millimetres; the check bar
		// must then measure exactly 100 mm.
		var vx, vy, vw, vh, wmm, barW float64
		if _, err := fmt.Sscanf(plan["viewBox"], "%g %g %g %g", &vx, &vy, &vw, &vh); err != nil || vw <= 0 {
			t.Fatalf("plan viewBox %q", plan["viewBox"])
		}
		if _, err := fmt.Sscanf(plan["width"], "%gmm", &wmm); err != nil {
			t.Fatalf("plan width %q", plan["width"])
		}
		if _, err := fmt.Sscanf(plan["bar"], "%g", &barW); err != nil {
			t.Fatalf("check bar width %q", plan["bar"])
		}
		if got := barW * wmm / vw; math.Abs(got-checkBarMM) > planScaleTol*checkBarMM {
			t.Errorf("check bar prints %.6f mm long, want %d", got, checkBarMM)
		}
		for _, s := range []string{"IEC 60825-1", "ANSI Z136.1"} {
			if !strings.Contains(plan["cautions"], s) {
				t.Errorf("plan cautions lack %s", s)
			}
		}
	})
	t.Logf("breadboard browser test took %v", time.Since(start).Round(time.Millisecond))
}

// checkCautions asserts that the laser cautions box is on the page, visible, and names the
// standards to follow.
func checkCautions(t *testing.T, ctx context.Context, where string) {
	t.Helper()
	if err := chromedp.Do(ctx, chromedp.WaitVisible(chromedp.CSS(`[data-testid=cautions]`))); err != nil {
		t.Fatalf("%s: cautions box: %v", where, err)
	}
	box := js[[]float64](t, ctx, `(() => { const r = document.querySelector('[data-testid=cautions]').getBoundingClientRect(); return [r.width, r.height]; })()`)
	if box[0] <= 0 || box[1] <= 0 {
		t.Errorf("%s: cautions box is %v px", where, box)
	}
	text := js[string](t, ctx, `document.querySelector('[data-testid=cautions]').textContent`)
	for _, s := range []string{"IEC 60825-1", "ANSI Z136.1", "eyewear"} {
		if !strings.Contains(text, s) {
			t.Errorf("%s: cautions lack %q", where, s)
		}
	}
}
