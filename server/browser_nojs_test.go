package server_test

import (
	"context"
	"net/url"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/log"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/chromedp"

	"raytable/server/store"
)

const (
	// typedGapMM is the new gap of L2 typed into the form; the demo has 147.1 there.
	typedGapMM = "162.5"
	// pathTol is the tolerance on a difference of two printed path lengths (the page prints about
	// five significant digits, so 0.01 mm on a few hundred mm).
	pathTol = 0.02
)

// navigations records what the browser did with the documents it loaded: every redirect it
// followed and every document answered with 422, which the no-script path expects once.
type navigations struct {
	mu        sync.Mutex
	redirects []redirect
	invalid   []string // URLs answered 422
}

type redirect struct {
	status   int64
	from, to string
}

// listen passes every event on to seen, except the expected 422 of an invalid edit, which it
// keeps apart so that the test can count it (with the console line the browser logs for it).
func (n *navigations) listen(seen *problems) func(ev any) {
	return func(ev any) {
		switch ev := ev.(type) {
		case *network.EventRequestWillBeSent:
			if ev.RedirectResponse != nil && ev.Type == network.ResourceTypeDocument {
				n.mu.Lock()
				n.redirects = append(n.redirects, redirect{ev.RedirectResponse.Status, ev.RedirectResponse.URL, ev.Request.URL})
				n.mu.Unlock()
			}
		case *network.EventResponseReceived:
			if ev.Response != nil && ev.Response.Status == 422 && ev.Type == network.ResourceTypeDocument {
				n.mu.Lock()
				n.invalid = append(n.invalid, ev.Response.URL)
				n.mu.Unlock()
				return
			}
		case *log.EventEntryAdded:
			// The browser also logs the 422 as a failed resource; it is the expected answer.
			if ev.Entry != nil && ev.Entry.Source == log.EntrySourceNetwork && strings.Contains(ev.Entry.Text, "status of 422") &&
				strings.HasSuffix(ev.Entry.URL, "/edit") {
				return
			}
		}
		seen.listen(ev)
	}
}

// lastRedirect returns the most recent document redirect.
func (n *navigations) lastRedirect() (redirect, int) {
	n.mu.Lock()
	defer n.mu.Unlock()
	if len(n.redirects) == 0 {
		return redirect{}, 0
	}
	return n.redirects[len(n.redirects)-1], len(n.redirects)
}

// systemValueJS reads a value of the system table by the start of its row label.
func systemValueJS(label string) string {
	return `(Array.from(document.querySelectorAll('[data-testid=system-values] tbody tr'))
		.find(tr => tr.cells[0].textContent.startsWith(` + quote(label) + `)) || {cells: [{}, {textContent: ''}]}).cells[1].textContent`
}

// TestBrowserWithoutJavaScript uses the page as a browser without scripts does: plain form posts
// and redirects. It starts from the demo, types a new gap and presses the save button, follows the
// 303 to a new revision with new numbers while the old link keeps the old design, submits a bad
// value and sees the field marked with no revision stored, and compares the two revisions from
// the history page.
func TestBrowserWithoutJavaScript(t *testing.T) {
	start := time.Now()
	var seen problems
	var nav navigations
	tab := browserTab(t, nav.listen(&seen))
	base := startServer(t)
	defer seen.check(t)

	// Scripts off for this tab before anything loads.
	if err := chromedp.Do(tab, chromedp.Func(func(ctx context.Context, tgt *chromedp.Target) error {
		_, err := cdp.Call(ctx, tgt, emulation.SetScriptExecutionDisabled, emulation.SetScriptExecutionDisabledParams{Value: true})
		return err
	})); err != nil {
		t.Fatalf("disable scripts: %v", err)
	}

	// follow clicks a plain submit button and waits for the document it leads to.
	follow := func(what, sel string) int64 {
		t.Helper()
		resp, err := chromedp.RunResponse(tab, chromedp.Click(chromedp.CSS(sel)))
		if err != nil {
			t.Fatalf("%s: %v", what, err)
		}
		return resp.Status
	}
	open := func(path, ready string) {
		t.Helper()
		if err := chromedp.Do(tab, chromedp.Navigate(base+path), chromedp.WaitReady(chromedp.CSS(ready))); err != nil {
			t.Fatalf("open %s: %v", path, err)
		}
	}
	gapSel := `input[name="` + gapName + `"]`
	gapValueJS := `document.querySelector('` + gapSel + `').value`
	bflJS, imageJS := systemValueJS("BFL"), systemValueJS("image distance")
	stepsJS := `document.querySelectorAll('[data-testid=history-step]').length`
	recentJS := `document.querySelectorAll('[data-testid=recent] li').length`

	// Home page, start from the demo with the plain form button.
	open("/", `[data-testid=start-demo]`)
	if status := follow("start from the demo", `[data-testid=start-demo]`); status != 200 {
		t.Fatalf("demo led to status %d", status)
	}
	first := js[string](t, tab, revisionJS)
	if !store.ValidID(first) {
		t.Fatalf("revision id %q", first)
	}
	if r, _ := nav.lastRedirect(); r.status != 303 || !strings.HasSuffix(r.to, "/r/"+first) {
		t.Errorf("starting the demo: redirect %+v, want a 303 to /r/%s", r, first)
	}
	// Proof that the page's script did not run: with it every gap gets a slider.
	if n := js[int](t, tab, `document.querySelectorAll('input[type=range]').length`); n != 0 {
		t.Fatalf("%d sliders on the page: scripts are running", n)
	}
	oldGap, oldBFL, oldImage := js[string](t, tab, gapValueJS), js[string](t, tab, bflJS), js[string](t, tab, imageJS)
	if oldGap == "" || oldBFL == "" || oldImage == "" {
		t.Fatalf("demo page: gap %q, BFL %q, image distance %q", oldGap, oldBFL, oldImage)
	}
	if oldGap == typedGapMM {
		t.Fatalf("the demo already has gap %s; pick another value", typedGapMM)
	}

	// Type a new gap and press the plain save button: a 303 to a new revision.
	if err := chromedp.Do(tab,
		chromedp.Clear(chromedp.CSS(gapSel)),
		chromedp.SendKeys(chromedp.CSS(gapSel), typedGapMM),
	); err != nil {
		t.Fatalf("type the gap: %v", err)
	}
	_, before := nav.lastRedirect()
	if status := follow("save", `[data-testid=save]`); status != 200 {
		t.Fatalf("save led to status %d", status)
	}
	second := js[string](t, tab, revisionJS)
	r, after := nav.lastRedirect()
	if after != before+1 || r.status != 303 || !strings.HasSuffix(r.from, "/r/"+first+"/edit") || !strings.HasSuffix(r.to, "/r/"+second) {
		t.Errorf("save: redirect %+v (%d new), want one 303 from /r/%s/edit to /r/%s", r, after-before, first, second)
	}
	if second == first || !store.ValidID(second) {
		t.Fatalf("save shows revision %q, want a new one (first %q)", second, first)
	}
	if got := js[string](t, tab, `location.pathname`); got != "/r/"+second {
		t.Errorf("URL %s after saving, want /r/%s", got, second)
	}
	if got := js[string](t, tab, gapValueJS); got != typedGapMM {
		t.Errorf("saved gap shows %q, want %s", got, typedGapMM)
	}
	newBFL, newImage := js[string](t, tab, bflJS), js[string](t, tab, imageJS)
	if newBFL == oldBFL || newImage == oldImage {
		t.Errorf("numbers did not change: BFL %s -> %s, image distance %s -> %s", oldBFL, newBFL, oldImage, newImage)
	}

	// The old link still shows the old design.
	open("/r/"+first, `[data-testid=bench-page]`)
	if got := js[string](t, tab, gapValueJS); got != oldGap {
		t.Errorf("the first revision's gap now %q, want %q", got, oldGap)
	}
	if got := js[string](t, tab, bflJS); got != oldBFL {
		t.Errorf("the first revision's BFL now %q, want %q", got, oldBFL)
	}

	// Count the stored designs two ways before the bad edit.
	open("/r/"+second+"/history", `[data-testid=history]`)
	stepsBefore := js[int](t, tab, stepsJS)
	open("/", `[data-testid=recent]`)
	recentBefore := js[int](t, tab, recentJS)
	if stepsBefore != 2 || recentBefore != 2 {
		t.Errorf("before the bad edit: %d history steps and %d recent designs, want 2 and 2", stepsBefore, recentBefore)
	}

	// A bad value: the page comes back (422) with the field marked, the typed text kept, and no
	// revision stored.
	open("/r/"+second, gapSel)
	if err := chromedp.Do(tab,
		chromedp.Clear(chromedp.CSS(gapSel)),
		chromedp.SendKeys(chromedp.CSS(gapSel), "abc"),
	); err != nil {
		t.Fatalf("type a bad gap: %v", err)
	}
	_, before = nav.lastRedirect()
	if status := follow("save a bad gap", `[data-testid=save]`); status != 422 {
		t.Errorf("a bad gap led to status %d, want 422", status)
	}
	if _, after := nav.lastRedirect(); after != before {
		t.Errorf("a bad gap was followed by %d redirects, want none", after-before)
	}
	if got := js[string](t, tab, `location.pathname`); got != "/r/"+second+"/edit" {
		t.Errorf("URL %s after a bad edit, want the form's own /r/%s/edit", got, second)
	}
	if got := js[string](t, tab, revisionJS); got != second {
		t.Errorf("the bad edit shows revision %s, want still %s", got, second)
	}
	field := js[map[string]string](t, tab, `(() => {
		const f = document.querySelector('[data-testid=field][data-field="`+gapName+`"]');
		if (!f) return {};
		const input = f.querySelector('input'), err = f.querySelector('[data-testid=field-error]');
		return {bad: String(f.classList.contains('bad')), value: input.value, invalid: input.getAttribute('aria-invalid'),
			message: err ? err.textContent : ''};
	})()`)
	if field["bad"] != "true" || field["invalid"] != "true" || strings.TrimSpace(field["message"]) == "" {
		t.Errorf("the gap field is not marked with a message beside it: %v", field)
	}
	if field["value"] != "abc" {
		t.Errorf("the typed text became %q, want abc kept", field["value"])
	}
	if n := js[int](t, tab, `document.querySelectorAll('[data-testid=field-error]').length`); n != 1 {
		t.Errorf("%d fields marked, want only the gap", n)
	}
	if n := js[int](t, tab, `document.querySelectorAll('[data-testid=form-invalid]').length`); n != 1 {
		t.Error("no notice that nothing was saved")
	}
	nav.mu.Lock()
	invalid := append([]string(nil), nav.invalid...)
	nav.mu.Unlock()
	if len(invalid) != 1 || !strings.HasSuffix(invalid[0], "/r/"+second+"/edit") {
		t.Errorf("422 answers %q, want exactly one for /r/%s/edit", invalid, second)
	}
	open("/r/"+second+"/history", `[data-testid=history]`)
	if got := js[int](t, tab, stepsJS); got != stepsBefore {
		t.Errorf("%d history steps after the bad edit, want %d", got, stepsBefore)
	}
	if got := js[string](t, tab, `document.querySelector('[data-testid=history-step].current').dataset.revision`); got != second {
		t.Errorf("history's current step %s, want %s", got, second)
	}
	changes := js[string](t, tab, `Array.from(document.querySelectorAll('[data-testid=change]')).map(c => c.textContent).join('; ')`)
	if want := "L2 gap_mm " + oldGap + " -> " + typedGapMM; !strings.Contains(changes, want) {
		t.Errorf("history changes %q lack %q", changes, want)
	}

	// Compare from the history page's link: both revisions, the changed rows marked.
	if status := follow("compare from history", `[data-testid=history-compare]`); status != 200 {
		t.Fatalf("compare led to status %d", status)
	}
	if got := js[string](t, tab, `location.search`); got != "?a="+first+"&b="+second {
		t.Errorf("compare query %q, want a=%s&b=%s", got, first, second)
	}
	sides := js[[]string](t, tab, `['A', 'B'].map(k => { const a = document.querySelector('[data-testid=compare-' + k + '] h2 a'); return a ? a.getAttribute('href') : ''; })`)
	if len(sides) != 2 || sides[0] != "/r/"+first || sides[1] != "/r/"+second {
		t.Errorf("compare sides link to %q, want /r/%s and /r/%s", sides, first, second)
	}
	if n := js[int](t, tab, `document.querySelectorAll('[data-testid=compare] [data-testid=side-view] > svg').length`); n != 2 {
		t.Errorf("compare shows %d side views, want 2", n)
	}
	rows := js[map[string][]string](t, tab, `Object.fromEntries(Array.from(document.querySelectorAll('[data-testid=compare-table] tbody tr'))
		.map(tr => [tr.cells[0].textContent, [tr.cells[1].textContent, tr.cells[2].textContent, String(tr.hasAttribute('data-changed') && tr.classList.contains('marked'))]]))`)
	if row := rows["BFL (mm)"]; len(row) != 3 || row[0] != oldBFL || row[1] != newBFL || row[2] != "true" {
		t.Errorf("compare BFL row %q, want %s, %s, marked", row, oldBFL, newBFL)
	}
	// L2 moved by exactly the change of its gap; L1 in front of it did not move.
	if row := rows["L2 along the path (mm)"]; len(row) != 3 || row[2] != "true" {
		t.Errorf("compare row of L2's path %q, want marked", row)
	} else {
		a, errA := strconv.ParseFloat(row[0], 64)
		b, errB := strconv.ParseFloat(row[1], 64)
		g0, _ := strconv.ParseFloat(oldGap, 64)
		g1, _ := strconv.ParseFloat(typedGapMM, 64)
		if errA != nil || errB != nil || !within(b-a, g1-g0, pathTol) {
			t.Errorf("L2 path %s -> %s, want a shift of %g mm (the gap change)", row[0], row[1], g1-g0)
		}
	}
	if row := rows["L1 along the path (mm)"]; len(row) != 3 || row[0] != row[1] || row[2] != "false" {
		t.Errorf("compare row of L1's path %q, want equal and unmarked", row)
	}
	if u, err := url.Parse(js[string](t, tab, `location.href`)); err != nil || u.Path != "/compare" {
		t.Errorf("compare page at %v", u)
	}
	t.Logf("no-script browser test took %v", time.Since(start).Round(time.Millisecond))
}

func within(got, want, tol float64) bool {
	d := got - want
	return d <= tol && d >= -tol
}
