package browsertest

import (
	"fmt"
	"os"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"

	"midrank/core"
	"midrank/core/findings"
	"midrank/core/link"
	"midrank/core/sealed"
	"midrank/core/testfiles"
)

// TestSharedOutputs: with small groups protected, everything that leaves
// the tab (both reports, the CSV files, a picture saved, the copied
// paragraph, a results-only link, plain and sealed) holds none of the
// values and no figure of the hidden groups, while the page itself shows
// everything, marked as not shared; a results-only link opens read-only.
// The data is R's chickwts, every weight made distinctive
// (testfiles.Chicks), horsebean cut to 4 chicks.
func TestSharedOutputs(t *testing.T) {
	data, weights, err := testfiles.Chicks(os.DirFS("../../testdata"), map[string]int{"horsebean": 4, "meatmeal": 10})
	if err != nil {
		t.Fatal(err)
	}
	opt := core.Options{MinGroupSize: 5}
	want, err := core.Analyze(data, opt)
	if err != nil {
		t.Fatal(err)
	}
	b := start(t)
	b.waitFor(t, `document.getElementById("decision").textContent.length > 0`)
	if err := chromedp.Do(b.ctx, chromedp.SetValue("#min_group_size", "5")); err != nil {
		t.Fatal(err)
	}
	b.analyse(t, string(data))
	if got := b.text(t, "#protect-note"); !strings.HasPrefix(got, "Not shared") || !strings.Contains(got, "horsebean") {
		t.Errorf("the page does not say what is not shared: %q", got)
	}
	if got := b.text(t, "#decision"); got != want.Decision { // the page, private, shows everything
		t.Errorf("the page's decision is not the analysis's:\n%s\nwant\n%s", got, want.Decision)
	}
	clean := func(what, text string) {
		t.Helper()
		for _, w := range weights {
			if strings.Contains(text, strings.TrimRight(w, "0")) {
				t.Errorf("%s holds the weight %s", what, w)
			}
		}
		if strings.Contains(text, "n = 4") || strings.Contains(text, "has 4 values") {
			t.Errorf("%s gives the hidden group's size", what)
		}
	}
	for _, button := range []string{"save-html", "save-markdown", "save-groups", "save-pairs"} {
		text := b.saved(t, button)
		clean(button, text)
		if button == "save-html" || button == "save-markdown" {
			if !strings.Contains(text, "Small groups protected") || !strings.Contains(text, want.SharedDecision()[:80]) {
				t.Errorf("%s does not say which protection was applied, or lacks the decision as shared", button)
			}
		}
	}
	svg := b.savedBy(t, `.save-svg[data-plot="plot-values"]`)
	clean("the picture saved", svg)
	if !strings.Contains(svg, "not shown") {
		t.Errorf("the picture saved does not mark the hidden groups")
	}

	// a results-only link: Go opens it; it holds no value
	if err := chromedp.Do(b.ctx, chromedp.Click(`input[name=link-kind][value=results]`), chromedp.Click("#make-link")); err != nil {
		t.Fatal(err)
	}
	b.waitFor(t, `document.getElementById("link-text").value.includes("#f1.")`)
	url, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("link-text").value`))
	if note := b.text(t, "#link-note"); !strings.Contains(note, "results only") {
		t.Errorf("the share panel does not say what the link holds: %q", note)
	}
	_, fragment, _ := strings.Cut(url, "#")
	raw, err := link.Decode("#" + fragment)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := findings.Open(raw); err != nil {
		t.Fatal(err)
	}
	clean("the results-only link", string(raw))

	// opened, it shows the results read-only: no ranks, no mean ranks
	r := open(t, url, b.origin)
	r.waitFor(t, `document.getElementById("decision").textContent.length > 0`)
	if got := r.text(t, "#decision"); got != want.SharedDecision() {
		t.Errorf("the opened link's decision:\n%s\nwant\n%s", got, want.SharedDecision())
	}
	if got := r.text(t, "#shared-note"); !strings.HasPrefix(got, "Results only") {
		t.Errorf("the opened link does not say it holds results only: %q", got)
	}
	hidden, _ := chromedp.Run(r.ctx, chromedp.Evaluate[bool](`document.getElementById("ranks-box").hidden && document.getElementById("mean-ranks-box").hidden`))
	if !hidden {
		t.Error("the opened link shows ranks or mean ranks")
	}
	clean("the opened link's HTML report", r.saved(t, "save-html"))
	r.screenshot(t, "midrank-results-only.png")

	// sealed: Go opens the page's sealed results; the page opens them
	if err := chromedp.Do(b.ctx, chromedp.SetValue("#link-passphrase", "amber fox"), chromedp.Click("#make-link")); err != nil {
		t.Fatal(err)
	}
	b.waitFor(t, `document.getElementById("link-text").value.includes("#s1.")`)
	sealedURL, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("link-text").value`))
	_, fragment, _ = strings.Cut(sealedURL, "#")
	if raw, err := sealed.Open("#"+fragment, "amber fox"); err != nil || !link.CarriesResults(raw) {
		t.Fatalf("the sealed results link opens in Go as %.60q, %v", raw, err)
	}
	s := open(t, sealedURL, b.origin)
	s.waitFor(t, `!document.getElementById("unlock").hidden && !document.getElementById("analyse").disabled`)
	if err := chromedp.Do(s.ctx, chromedp.SetValue("#unlock-passphrase", "amber fox"), chromedp.Click("#unlock-open")); err != nil {
		t.Fatal(err)
	}
	s.waitFor(t, `document.getElementById("decision").textContent.length > 0`)
	if got := s.text(t, "#decision"); got != want.SharedDecision() {
		t.Errorf("the sealed results' decision:\n%s\nwant\n%s", got, want.SharedDecision())
	}

	// several measures at once: the weights and the same chicks' weights
	// made distinctive another way; the battery's reports and overview hold
	// no value, and a measure opened from the overview gives a results link
	var battery strings.Builder
	battery.WriteString("feed,weight,again\n")
	for i, line := range strings.Split(strings.TrimSpace(string(data)), "\n")[1:] {
		feed, w, _ := strings.Cut(line, ",")
		fmt.Fprintf(&battery, "%s,%s,%d.%d\n", feed, w, 1000+i, 7*i%10)
	}
	b.analyse(t, battery.String())
	if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("status").textContent = "";
		document.getElementById("group").value = "feed";
		document.getElementById("measures-all").checked = true;
		document.getElementById("measures-box").dispatchEvent(new Event("change", { bubbles: true })); true`)); err != nil {
		t.Fatal(err)
	}
	b.waitFor(t, `document.getElementById("status").textContent === "Done: 2 measures."`)
	if got := b.text(t, "#battery-protect-note"); !strings.HasPrefix(got, "Not shared") {
		t.Errorf("the overview does not say what is not shared: %q", got)
	}
	for _, button := range []string{"save-battery-html", "save-battery-markdown", "save-overview"} {
		text := b.saved(t, button)
		clean(button, text)
		if button != "save-overview" && (!strings.Contains(text, "Small groups protected") || strings.Contains(text, "Where each group lies")) {
			t.Errorf("%s does not say its protection, or holds the picture of every group's mean rank", button)
		}
	}
	if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("link-passphrase").value = ""; true`)); err != nil {
		t.Fatal(err)
	}
	if err := chromedp.Do(b.ctx, chromedp.Click(`#battery-table tbody tr:nth-child(2) button`), chromedp.Click(`input[name=link-kind][value=results]`), chromedp.Click("#make-link")); err != nil {
		t.Fatal(err)
	}
	b.waitFor(t, `document.getElementById("link-text").value.includes("#f1.") || !document.getElementById("problem").hidden`)
	if problem, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("problem").hidden ? "" : document.getElementById("problem").textContent`)); problem != "" {
		t.Fatalf("making a measure's results link: %s", problem)
	}
	url, _ = chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("link-text").value`))
	_, fragment, _ = strings.Cut(url, "#")
	if raw, err = link.Decode("#" + fragment); err != nil {
		t.Fatal(err)
	}
	clean("a measure's results-only link", string(raw))
	if !strings.Contains(string(raw), `"measure":"again"`) {
		t.Errorf("the measure's link does not carry the measure opened: %.200s", raw)
	}
}
