package server_test

import (
	"context"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/fetch"
	"github.com/chromedp/cdproto/log"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/chromedp"
)

// TestScriptKeepsFormAndFocus drives the script's edge cases in chromium:
//   - a save the server refuses with an error page (413 here) leaves the form as typed and says
//     why beside the save button, instead of replacing the form with the error page;
//   - after a save the keyboard focus is back on the same control (the slider, or the field
//     where Enter was pressed), not lost to the page body;
//   - a jump to an anchor on the same page does not reload it.
func TestScriptKeepsFormAndFocus(t *testing.T) {
	base := startServer(t)
	var seen problems
	defer seen.check(t)
	tab := browserTab(t, func(ev any) {
		// The 413 of the oversized save is the expected answer; everything else counts.
		switch ev := ev.(type) {
		case *network.EventResponseReceived:
			if ev.Response != nil && ev.Response.Status == 413 {
				return
			}
		case *log.EventEntryAdded:
			if ev.Entry != nil && strings.Contains(ev.Entry.Text, "status of 413") {
				return
			}
		}
		seen.listen(ev)
	})
	if err := chromedp.Do(tab,
		chromedp.Navigate(base+"/"),
		chromedp.WaitVisible(chromedp.CSS(`[data-testid=start-demo]`)),
		chromedp.Click(chromedp.CSS(`[data-testid=start-demo]`)),
		chromedp.WaitReady(chromedp.CSS(`input[type=range][data-for="`+gapName+`"]`)),
	); err != nil {
		t.Fatalf("start from the demo: %v", err)
	}
	first := js[string](t, tab, revisionJS)

	// A slider moved from the keyboard saves on each step; the focus stays on the slider.
	js[bool](t, tab, `(() => { const s = document.querySelector('input[type=range][data-for="`+gapName+`"]');
		s.focus(); s.value = '150'; s.dispatchEvent(new Event('input', {bubbles: true}));
		s.dispatchEvent(new Event('change', {bubbles: true})); return true; })()`)
	waitFor(t, tab, "the slider edit is stored", revisionJS+` !== `+quote(first))
	second := js[string](t, tab, revisionJS)
	if got := js[string](t, tab, `document.activeElement.type + ' ' + (document.activeElement.dataset.for || '')`); got != "range "+gapName {
		t.Errorf("after a slider save the focus is on %q, want the same slider", got)
	}

	// Enter in a field saves; the focus comes back to that field.
	if err := chromedp.Do(tab,
		chromedp.SetValue(chromedp.CSS(`input[name="elements[3].gap_mm"]`), "101"),
		chromedp.Focus(chromedp.CSS(`input[name="elements[3].gap_mm"]`)),
		chromedp.KeyEvent("\r"),
	); err != nil {
		t.Fatal(err)
	}
	waitFor(t, tab, "the typed edit is stored", revisionJS+` !== `+quote(second))
	third := js[string](t, tab, revisionJS)
	if got := js[string](t, tab, `document.activeElement.name || document.activeElement.tagName`); got != "elements[3].gap_mm" {
		t.Errorf("after Enter the focus is on %q, want elements[3].gap_mm", got)
	}

	// A same-page anchor: no reload, so what was typed stays.
	js[bool](t, tab, `(() => { document.querySelector('input[name=title]').value = 'typed, not saved'; location.hash = 'result'; return true; })()`)
	pollGo(t, tab, "the hash is set", `location.hash === '#result'`)
	js[bool](t, tab, `(() => { history.back(); return true; })()`)
	pollGo(t, tab, "back from the anchor", `location.hash === ''`)
	if got := js[string](t, tab, `document.querySelector('input[name=title]').value`); got != "typed, not saved" {
		t.Errorf("going back from an anchor reloaded the page: title %q", got)
	}

	// A save the server refuses with an error page: the form stays as typed, with the reason.
	js[bool](t, tab, `(() => { document.querySelector('textarea[name=notes]').value = 'x'.repeat(1100000); return true; })()`)
	if err := chromedp.Do(tab, chromedp.Click(chromedp.CSS(`[data-testid=save]`))); err != nil {
		t.Fatal(err)
	}
	waitFor(t, tab, "the refusal is shown", `!!document.querySelector('[data-testid=save-error]')`)
	msg := js[string](t, tab, `document.querySelector('[data-testid=save-error]').textContent`)
	if !strings.Contains(msg, "413") || !strings.Contains(msg, "1 MiB") {
		t.Errorf("save error %q, want the status and the server's reason", msg)
	}
	if got := js[string](t, tab, `document.querySelector('input[name=title]').value`); got != "typed, not saved" {
		t.Errorf("the form lost what was typed: title %q", got)
	}
	if got := js[bool](t, tab, `!!document.querySelector('#bench-form') && !document.querySelector('[data-testid=error-page]')`); !got {
		t.Error("the error page replaced the form")
	}
	if got := js[string](t, tab, revisionJS); got != third {
		t.Errorf("revision %s after a refused save, want %s", got, third)
	}
}

// TestScriptShowsTheLatestSave releases a slider twice while the first save is held back in the
// browser, so that its answer arrives after the second's. The page must end on the second save:
// before, whichever answer came last was shown, so the page (and its URL) went back to the older
// revision.
func TestScriptShowsTheLatestSave(t *testing.T) {
	base := startServer(t)
	var seen problems
	defer seen.check(t)
	paused := make(chan fetch.RequestID, 4)
	finished := make(chan network.RequestID, 16)
	var mu sync.Mutex
	edits := map[network.RequestID]bool{} // fetches of /edit, by the browser's request id
	tab := browserTab(t, func(ev any) {
		switch ev := ev.(type) {
		case *fetch.EventRequestPaused:
			paused <- ev.RequestID
			return
		case *network.EventRequestWillBeSent:
			if strings.HasSuffix(ev.Request.URL, "/edit") {
				mu.Lock()
				edits[ev.RequestID] = true
				mu.Unlock()
			}
		case *network.EventLoadingFinished:
			mu.Lock()
			isEdit := edits[ev.RequestID]
			mu.Unlock()
			if isEdit {
				finished <- ev.RequestID
			}
		}
		seen.listen(ev)
	})
	if err := chromedp.Do(tab,
		chromedp.Navigate(base+"/"),
		chromedp.WaitVisible(chromedp.CSS(`[data-testid=start-demo]`)),
		chromedp.Click(chromedp.CSS(`[data-testid=start-demo]`)),
		chromedp.WaitReady(chromedp.CSS(`input[type=range][data-for="`+gapName+`"]`)),
	); err != nil {
		t.Fatalf("start from the demo: %v", err)
	}
	call := func(what string, f func(ctx context.Context, tgt *chromedp.Target) error) {
		t.Helper()
		if err := chromedp.Do(tab, chromedp.Func(f)); err != nil {
			t.Fatalf("%s: %v", what, err)
		}
	}
	call("hold back edits", func(ctx context.Context, tgt *chromedp.Target) error {
		_, err := cdp.Call(ctx, tgt, fetch.Enable, fetch.EnableParams{Patterns: []*fetch.RequestPattern{{URLPattern: "*/edit"}}})
		return err
	})
	release := func(value string) {
		js[bool](t, tab, `(() => { const s = document.querySelector('input[type=range][data-for="`+gapName+`"]');
			s.value = '`+value+`'; s.dispatchEvent(new Event('change', {bubbles: true})); return true; })()`)
	}
	proceed := func(id fetch.RequestID) {
		call("let an edit through", func(ctx context.Context, tgt *chromedp.Target) error {
			_, err := cdp.Call(ctx, tgt, fetch.ContinueRequest, fetch.ContinueRequestParams{RequestID: id})
			return err
		})
	}
	wait := func(what string) fetch.RequestID {
		t.Helper()
		select {
		case id := <-paused:
			return id
		case <-time.After(20 * time.Second):
			t.Fatalf("waiting for %s", what)
			return ""
		}
	}
	gapJS := `document.querySelector('input[name="` + gapName + `"]').value`

	start := js[string](t, tab, revisionJS)
	release("120")
	older := wait("the first save")
	release("130") // the slider sets the field at once; the answer brings the revision
	newer := wait("the second save")
	proceed(newer)
	pollGo(t, tab, "the second save is shown", revisionJS+` !== `+quote(start))
	shown := "/r/" + js[string](t, tab, revisionJS)

	proceed(older)
	for range 2 { // both answers have arrived in the browser
		select {
		case <-finished:
		case <-time.After(20 * time.Second):
			t.Fatal("the held-back save did not finish")
		}
	}
	for range 10 { // give the script every chance to show the older answer
		if got := js[string](t, tab, gapJS); got != "130" {
			t.Fatalf("the page went back to the older save: gap %s", got)
		}
		time.Sleep(50 * time.Millisecond)
	}
	if got := "/r/" + js[string](t, tab, revisionJS); got != shown {
		t.Errorf("revision %s shown, want the latest save's %s", got, shown)
	}
	if got := js[string](t, tab, `location.pathname`); got != shown {
		t.Errorf("URL %s, want the latest save's %s", got, shown)
	}
}
