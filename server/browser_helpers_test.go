package server_test

import (
	"context"
	"encoding/json"
	"net/http"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

// browserTab starts headless chromium with the flags every browser test uses (no sandbox, background
// networking, component updates and sync off, a throw-away profile) and opens one tab whose
// events go to listen. Everything is closed when the test ends; the whole session is bounded by
// browserTimeout.
func browserTab(t *testing.T, listen func(ev any)) context.Context {
	t.Helper()
	chromium := findChromium(t)
	ctx, cancel := context.WithTimeout(context.Background(), browserTimeout)
	opts := append(chromedp.DefaultExecAllocatorOptions[:],
		chromedp.ExecPath(chromium),
		chromedp.Headless,
		chromedp.NoSandbox,
		chromedp.DisableGPU,
		chromedp.NoFirstRun,
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true),
		chromedp.UserDataDir(t.TempDir()),
		chromedp.WindowSize(1400, 1000),
	)
	allocCtx, cancelAlloc := chromedp.NewExecAllocator(ctx, opts...)
	tab, cancelTab := chromedp.NewContext(allocCtx, chromedp.WithListener(listen))
	t.Cleanup(func() {
		cancelTab()
		cancelAlloc()
		cancel()
	})
	return tab
}

// pollGo evaluates expr every 50 ms from the test side until it is true. Unlike chromedp.Poll it
// needs no timer inside the page, so it also works where the page may not run scripts.
func pollGo(t *testing.T, ctx context.Context, what, expr string) {
	t.Helper()
	deadline := time.Now().Add(20 * time.Second)
	for {
		ok, err := chromedp.Run(ctx, chromedp.Evaluate[bool](expr))
		if err == nil && ok {
			return
		}
		if time.Now().After(deadline) {
			state, _ := chromedp.Run(ctx, chromedp.Evaluate[string](`location.href + ' | ' + document.title`))
			t.Fatalf("waiting until %s: last error %v; the page: %s", what, err, state)
		}
		time.Sleep(50 * time.Millisecond)
	}
}

// getJSON fetches a URL outside the browser and decodes its JSON body into v.
func getJSON(t *testing.T, url string, v any) {
	t.Helper()
	resp, err := http.Get(url)
	if err != nil {
		t.Fatal(err)
	}
	defer resp.Body.Close()
	if resp.StatusCode != http.StatusOK {
		t.Fatalf("GET %s: status %d", url, resp.StatusCode)
	}
	if err := json.NewDecoder(resp.Body).Decode(v); err != nil {
		t.Fatalf("GET %s: %v", url, err)
	}
}
