package browsertest

import (
	"context"
	"fmt"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"

	"midrank/core"
)

// TestMonteCarloOnEveryCore: with four cores, the three helper workers
// start when Monte Carlo is chosen, the Monte Carlo estimates of
// H and of the trend are each shared with them, and the
// page's decision (both p-values, their intervals, the seed) is the command
// line's, which draws the same seeded chunks alone (the module's TestFarm
// and core/trend's tests check the counts to the last bit).
func TestMonteCarloOnEveryCore(t *testing.T) {
	b := withCores(t, 4)
	text := hundredScores()
	if n := workers(t, b); n != 1 {
		t.Errorf("%d workers before Monte Carlo is chosen, want 1 (the helpers start only for it)", n)
	}
	// chosen as an analyst chooses it: the three helpers start then, before Analyse
	b.number(t, `const p = document.getElementById("pvalue"); p.value = "monte-carlo"; p.dispatchEvent(new Event("change", { bubbles: true })); 0`)
	for began := time.Now(); workers(t, b) != 4; time.Sleep(50 * time.Millisecond) {
		if time.Since(began) > 10*time.Second {
			t.Fatalf("%d workers 10 s after Monte Carlo was chosen, want 4", workers(t, b))
		}
	}
	if err := chromedp.Do(b.ctx, chromedp.SetValue("#resamples", "200000"), chromedp.SetValue("#seed", "5"), chromedp.SetValue("#trend", "increasing")); err != nil {
		t.Fatal(err)
	}
	b.analyse(t, text)
	want, err := core.Analyze([]byte(text), core.Options{PValue: "monte-carlo", Resamples: 200_000, Seed: new(uint64(5)), Trend: "increasing"})
	if err != nil {
		t.Fatal(err)
	}
	if got := b.text(t, "#decision"); got != want.Decision {
		t.Errorf("the page's decision:\n%s\nthe command line's:\n%s", got, want.Decision)
	}
	parts, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.documentElement.dataset.monteCarloParts ?? "0"`))
	if err != nil || parts != "6" {
		t.Errorf("%s parts of the estimates went to helpers, want 3 of each (%v)", parts, err)
	}
	if !strings.Contains(want.Decision, "Jonckheere") || want.Trend.PMethod != "monte-carlo" {
		t.Errorf("the trend was not estimated by Monte Carlo: %+v", want.Trend)
	}
}

// workers counts the page's Web Workers, as Chromium lists its targets.
func workers(t *testing.T, b *browser) int {
	t.Helper()
	infos, err := chromedp.Targets(b.ctx)
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, info := range infos {
		if info.Type == "worker" {
			n++
		}
	}
	return n
}

// withCores opens the page in a fresh browser that says it has this many
// cores, once the demo's first result is on screen.
func withCores(tb testing.TB, cores int64) *browser {
	tb.Helper()
	b := start(tb)
	b.waitFor(tb, `document.getElementById("status").textContent.startsWith("Done")`)
	override := chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := cdp.Call(ctx, tg, emulation.SetHardwareConcurrencyOverride, emulation.SetHardwareConcurrencyOverrideParams{HardwareConcurrency: cores})
		return err
	})
	if err := chromedp.Do(b.ctx, override, chromedp.Reload()); err != nil {
		tb.Fatal(err)
	}
	b.waitFor(tb, fmt.Sprintf(`document.getElementById("status").textContent.startsWith("Done") && navigator.hardwareConcurrency === %d`, cores))
	return b
}

// hundredScores is a table of 100 scores in four units, for the Monte
// Carlo estimates.
func hundredScores() string {
	var text strings.Builder
	text.WriteString("unit,score\n")
	for i := range 100 {
		fmt.Fprintf(&text, "U%d,%d\n", i%4+1, (i*37)%23+i%4)
	}
	return text.String()
}
