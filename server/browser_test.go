package server_test

import (
	"context"
	"fmt"
	"net"
	"net/http"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/log"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"

	"raytable/server"
	"raytable/server/store"
)

// browserTimeout bounds the whole browser session; a slow CI runner needs a generous one.
const browserTimeout = 2 * time.Minute

// findChromium returns Debian's chromium. Without it the test is skipped on a workstation, but
// fails in CI (CI=true), where .ci/run installs it: the browser test must run there.
func findChromium(t *testing.T) string {
	for _, name := range []string{"chromium", "chromium-browser"} {
		if p, err := exec.LookPath(name); err == nil {
			return p
		}
	}
	if os.Getenv("CI") == "true" {
		t.Fatal("chromium is not installed, and CI=true: the browser test must run in CI (apt-get install -y chromium)")
	}
	t.Skip("chromium is not installed; install it (apt-get install -y chromium) to run the browser test")
	return ""
}

// problems collects everything that must not happen in the browser: failed requests, error
// statuses, console errors, uncaught exceptions and error log entries (CSP violations among them).
type problems struct {
	mu    sync.Mutex
	lines []string
}

func (p *problems) add(format string, args ...any) {
	p.mu.Lock()
	defer p.mu.Unlock()
	p.lines = append(p.lines, fmt.Sprintf(format, args...))
}

func (p *problems) listen(ev any) {
	switch ev := ev.(type) {
	case *network.EventLoadingFailed:
		p.add("request failed: %s (%s)", ev.ErrorText, ev.Type)
	case *network.EventResponseReceived:
		if ev.Response != nil && ev.Response.Status >= 400 {
			p.add("response %d for %s", ev.Response.Status, ev.Response.URL)
		}
	case *runtime.EventConsoleAPICalled:
		if ev.Type == runtime.ConsoleAPICalledTypeError || ev.Type == runtime.ConsoleAPICalledTypeAssert {
			var parts []string
			for _, a := range ev.Args {
				parts = append(parts, string(a.Value)+a.Description)
			}
			p.add("console %s: %s", ev.Type, strings.Join(parts, " "))
		}
	case *runtime.EventExceptionThrown:
		p.add("uncaught exception: %s", ev.ExceptionDetails.Text)
	case *log.EventEntryAdded:
		if ev.Entry != nil && ev.Entry.Level == log.EntryLevelError {
			p.add("log error (%s): %s %s", ev.Entry.Source, ev.Entry.Text, ev.Entry.URL)
		}
	}
}

func (p *problems) check(t *testing.T) {
	t.Helper()
	p.mu.Lock()
	defer p.mu.Unlock()
	for _, l := range p.lines {
		t.Error(l)
	}
}

func startServer(t *testing.T) string {
	t.Helper()
	st, err := store.OpenBolt(filepath.Join(t.TempDir(), "browser.db"))
	if err != nil {
		t.Fatal(err)
	}
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		t.Fatal(err)
	}
	srv := server.HTTPServer(server.New(server.Config{Store: st}), nil)
	go srv.Serve(ln)
	t.Cleanup(func() {
		ctx, cancel := context.WithTimeout(context.Background(), 5*time.Second)
		defer cancel()
		srv.Shutdown(ctx)
		st.Close()
	})
	return "http://" + ln.Addr().String()
}

// js runs an expression and returns its value.
func js[T any](t *testing.T, ctx context.Context, expr string) T {
	t.Helper()
	v, err := chromedp.Run(ctx, chromedp.Evaluate[T](expr))
	if err != nil {
		t.Fatalf("evaluate %s: %v", expr, err)
	}
	return v
}

// waitFor polls an expression until it is true.
func waitFor(t *testing.T, ctx context.Context, what, expr string) {
	t.Helper()
	if _, err := chromedp.Run(ctx, chromedp.Poll[bool](expr, chromedp.WithPollingTimeout(30*time.Second))); err != nil {
		state, _ := chromedp.Run(ctx, chromedp.Evaluate[string](`location.href + ' | ' + document.title + ' | ' +
			Array.from(document.querySelectorAll('.problems, [data-testid=field-error], [data-testid=form-invalid], [data-testid=error-page]')).map(e => e.textContent).join(' / ')`))
		t.Fatalf("waiting until %s: %v; the page: %s", what, err, state)
	}
}

const (
	revisionJS = `document.querySelector('[data-testid=bench-page]').dataset.revision`
	numbersJS  = `document.querySelector('[data-testid=elements-table]').textContent`
	gapName    = `elements[2].gap_mm`
)

// TestBrowser drives the real page in chromium: start from the demo, drag a gap slider (live
// preview, nothing stored), release it (a new revision), type a gap and save, open the share link
// in a fresh browser context, compare the two revisions, with no failed request and no console
// error along the way.
func TestBrowser(t *testing.T) {
	base := startServer(t)
	var seen problems
	defer seen.check(t) // also after a failed step, to show what the browser saw
	tab := browserTab(t, seen.listen)

	// Home page, start from the demo.
	if err := chromedp.Do(tab,
		chromedp.Navigate(base+"/"),
		chromedp.WaitVisible(chromedp.CSS(`[data-testid=start-demo]`)),
		chromedp.Click(chromedp.CSS(`[data-testid=start-demo]`)),
		chromedp.WaitVisible(chromedp.CSS(`[data-testid=bench-page]`)),
		chromedp.WaitReady(chromedp.CSS(`input[type=range][data-for="`+gapName+`"]`)),
	); err != nil {
		t.Fatalf("start from the demo: %v", err)
	}
	first := js[string](t, tab, revisionJS)
	firstNumbers := js[string](t, tab, numbersJS)
	if !store.ValidID(first) {
		t.Fatalf("revision id %q", first)
	}
	if n := js[int](t, tab, `document.querySelectorAll('[data-testid=side-view] > svg, [data-testid=table-view] > svg').length`); n != 2 {
		t.Errorf("%d inline diagrams, want 2", n)
	}

	// Drag the slider: the numbers change from the preview, and nothing is stored yet.
	js[bool](t, tab, `(() => { const s = document.querySelector('input[type=range][data-for="`+gapName+`"]');
		s.value = '160'; s.dispatchEvent(new Event('input', {bubbles: true})); return true; })()`)
	waitFor(t, tab, "the preview changes the numbers", numbersJS+` !== `+quote(firstNumbers))
	if got := js[string](t, tab, revisionJS); got != first {
		t.Errorf("dragging stored a revision: %s", got)
	}
	if got := js[string](t, tab, `location.pathname`); got != "/r/"+first {
		t.Errorf("dragging changed the URL to %s", got)
	}

	// Release it: the edit is stored as a new revision and the URL follows.
	js[bool](t, tab, `(() => { const s = document.querySelector('input[type=range][data-for="`+gapName+`"]');
		s.dispatchEvent(new Event('change', {bubbles: true})); return true; })()`)
	waitFor(t, tab, "a new revision is shown", revisionJS+` !== `+quote(first))
	second := js[string](t, tab, revisionJS)
	if got := js[string](t, tab, `location.pathname`); got != "/r/"+second {
		t.Errorf("URL %s after the edit, want /r/%s", got, second)
	}
	if got := js[string](t, tab, `document.querySelector('input[name="`+gapName+`"]').value`); got != "160" {
		t.Errorf("gap shows %q after the edit, want 160", got)
	}
	secondNumbers := js[string](t, tab, numbersJS)
	if secondNumbers == firstNumbers {
		t.Error("the stored edit shows the old numbers")
	}

	// Type a gap with a unit and save with the button (fetch, no full reload).
	if err := chromedp.Do(tab,
		chromedp.SetValue(chromedp.CSS(`input[name="elements[3].gap_mm"]`), "4 in"),
		chromedp.Click(chromedp.CSS(`[data-testid=save]`)),
	); err != nil {
		t.Fatal(err)
	}
	waitFor(t, tab, "the typed edit is stored", revisionJS+` !== `+quote(second))
	if got := js[string](t, tab, `document.querySelector('input[name="elements[3].gap_mm"]').value`); got != "101.6" {
		t.Errorf("4 in stored as %q, want 101.6 (mm)", got)
	}

	// Open the share link of the second revision in a fresh browser context: the same design.
	fresh, cancelFresh := chromedp.NewContext(tab, chromedp.WithNewBrowserContext(), chromedp.WithListener(seen.listen))
	defer cancelFresh()
	if err := chromedp.Do(fresh,
		chromedp.Navigate(base+"/r/"+second),
		chromedp.WaitVisible(chromedp.CSS(`[data-testid=bench-page]`)),
	); err != nil {
		t.Fatalf("open the share link: %v", err)
	}
	if got := js[string](t, fresh, revisionJS); got != second {
		t.Errorf("share link shows revision %s, want %s", got, second)
	}
	if got := js[string](t, fresh, numbersJS); got != secondNumbers {
		t.Error("the share link shows other numbers than the editor did")
	}
	if got := js[string](t, fresh, `document.querySelector('input[name="`+gapName+`"]').value`); got != "160" {
		t.Errorf("share link gap %q, want 160", got)
	}

	// Compare the two revisions from the compare-with-parent link.
	if err := chromedp.Do(fresh,
		chromedp.Click(chromedp.CSS(`[data-testid=compare-parent-link]`)),
		chromedp.WaitVisible(chromedp.CSS(`[data-testid=compare-table]`)),
	); err != nil {
		t.Fatalf("compare: %v", err)
	}
	if n := js[int](t, fresh, `document.querySelectorAll('[data-testid=compare-table] tr[data-changed]').length`); n == 0 {
		t.Error("compare marks no changed number")
	}
	if n := js[int](t, fresh, `document.querySelectorAll('[data-testid=compare] [data-testid=side-view] > svg').length`); n != 2 {
		t.Errorf("compare shows %d side views, want 2", n)
	}
	if got := js[string](t, fresh, `location.search`); got != "?a="+first+"&b="+second {
		t.Errorf("compare query %q", got)
	}

	// The page also works without the script: the first revision is unchanged.
	resp, err := http.Get(base + "/r/" + first + "/bench.json")
	if err != nil || resp.StatusCode != http.StatusOK {
		t.Fatalf("first revision: %v %v", resp, err)
	}
	resp.Body.Close()
}

func quote(s string) string {
	r := strings.NewReplacer(`\`, `\\`, "`", "\\`", "$", `\$`)
	return "`" + r.Replace(s) + "`"
}
