package browsertest

import (
	"bytes"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

// runs is how many times each figure is taken; the median is reported.
const runs = 5

// BenchmarkPage measures the page in headless Chromium by its own
// performance marks (site/app.js: "midrank:asked" when an analysis is asked
// for, "midrank:shown" when its results are on screen): the median of five
// runs of each, as a figure (make bench-page), never a pass mark.
func BenchmarkPage(b *testing.B) {
	b.Run("load to the demo's first result", func(b *testing.B) {
		// a fresh browser each time: the module is fetched, compiled and run anew
		figure(b, "ms/first-result", func() float64 {
			page := start(b)
			page.waitFor(b, `document.getElementById("status").textContent.startsWith("Done")`)
			return page.number(b, `performance.getEntriesByName("midrank:shown")[0].startTime`)
		})
	})
	page := start(b)
	page.waitFor(b, `document.getElementById("status").textContent.startsWith("Done")`)
	b.Run("100,000 rows pasted to results", func(b *testing.B) {
		figure(b, "ms/result", func() float64 {
			page.paste(b, `const sites = ["North", "South", "East", "West"];
				let text = "site,minutes\n";
				for (let i = 0; i < 100000; i++) text += sites[i % 4] + "," + ((i * 7919) % 240) + "." + (i % 10) + "\n";`)
			page.waitFor(b, `document.getElementById("status").textContent.startsWith("Done")`)
			return page.number(b, sincePaste)
		})
	})
	b.Run("10,000,000 values opened from a file", func(b *testing.B) {
		file := filepath.Join(b.TempDir(), "waits.csv")
		if err := os.WriteFile(file, tenMillion(), 0o644); err != nil {
			b.Fatal(err)
		}
		peak := 0
		figure(b, "ms/file-result", func() float64 {
			// the same file chosen again is a change only once the input is emptied
			page.number(b, `document.getElementById("file").value = ""; document.getElementById("status").textContent = ""; performance.mark("midrank:opened"); 0`)
			if err := chromedp.Do(page.ctx, chromedp.SetUploadFiles("#file", []string{file})); err != nil {
				b.Fatal(err)
			}
			for began := time.Now(); !strings.HasPrefix(page.text(b, "#status"), "Done"); time.Sleep(100 * time.Millisecond) {
				if time.Since(began) > 2*time.Minute {
					b.Fatalf("no result after 2 minutes: %q", page.text(b, "#status"))
				}
				peak = max(peak, tabMemory())
			}
			return page.number(b, `performance.getEntriesByName("midrank:shown").at(-1).startTime - performance.getEntriesByName("midrank:opened").at(-1).startTime`)
		})
		b.ReportMetric(float64(peak), "MB/tab-peak")
		page.number(b, `document.getElementById("held-clear")?.click(); 0`)
	})
	b.Run("Monte Carlo, 2,000,000 resamples of 100 values in 4 groups, on every core", func(b *testing.B) {
		monteCarlo(b, page)
	})
	b.Run("60 measures × 5,000 rows × 8 groups", func(b *testing.B) {
		figure(b, "ms/battery", func() float64 {
			// the columns of numbers come from a fixed arithmetic sequence, so that every run is the same
			page.paste(b, `let text = "unit," + Array.from({ length: 60 }, (_, j) => "item" + (j + 1)).join(",") + "\n";
				for (let i = 0; i < 5000; i++) {
					const row = ["U" + (i % 8 + 1)];
					for (let j = 0; j < 60; j++) row.push(((i * 7919 + j * 104729) % 1000) / 10 + (i % 8) * (j % 3));
					text += row.join(",") + "\n";
				}`)
			page.waitFor(b, `document.getElementById("status").textContent.startsWith("Done")`)
			page.number(b, `(() => {
				document.getElementById("status").textContent = "";
				const all = document.getElementById("measures-all");
				all.checked = true;
				all.dispatchEvent(new Event("change", { bubbles: true }));
				return 0;
			})()`)
			page.waitFor(b, `document.getElementById("status").textContent === "Done: 60 measures."`)
			split, _ := chromedp.Run(page.ctx, chromedp.Evaluate[string](`document.documentElement.dataset.analysisMs`))
			b.Logf("battery: until the answer + rendering, ms: %s", split)
			return page.number(b, `performance.getEntriesByName("midrank:analysis").at(-1).duration`)
		})
		page.number(b, `document.getElementById("held-clear")?.click(); 0`)
	})
	b.Run("Monte Carlo, 2,000,000 resamples of 100 values in 4 groups, one worker", func(b *testing.B) {
		monteCarlo(b, withCores(b, 1)) // a fresh browser told it has one core, so that the page starts no helper
	})
}

// monteCarlo reports the page's Monte Carlo resamples per second, from
// asking to results, on the workers the page starts: a first run, which
// warms the engine's optimising tier up, is logged on its own, then the
// median of five.
func monteCarlo(b *testing.B, page *browser) {
	// Monte Carlo chosen as an analyst chooses it, which starts the helpers
	if err := chromedp.Do(page.ctx, chromedp.SetValue("#data", hundredScores()), chromedp.SetValue("#resamples", "2000000")); err != nil {
		b.Fatal(err)
	}
	page.number(b, `const p = document.getElementById("pvalue"); p.value = "monte-carlo"; p.dispatchEvent(new Event("change", { bubbles: true })); 0`)
	time.Sleep(time.Second) // while the analyst moves to Analyse
	run := func() float64 {
		page.number(b, `document.getElementById("status").textContent = ""; document.getElementById("analyse").click(); 0`)
		page.waitFor(b, `document.getElementById("status").textContent.startsWith("Done")`)
		return 2e6 / page.number(b, `performance.getEntriesByName("midrank:analysis").at(-1).duration / 1000`)
	}
	b.Logf("first run: %.0f resamples/s", run())
	figure(b, "resamples/s", run)
	if err := chromedp.Do(page.ctx, chromedp.SetValue("#pvalue", "auto"), chromedp.SetValue("#resamples", "100000")); err != nil {
		b.Fatal(err)
	}
}

// sincePaste is the time from the last paste to the results of the
// analysis it started, by the page's marks.
const sincePaste = `performance.getEntriesByName("midrank:shown").at(-1).startTime - performance.getEntriesByName("midrank:pasted").at(-1).startTime`

// tenMillion is a long table of 10,000,000 waiting times in 5 sites, one
// decimal each, about 108 MB.
func tenMillion() []byte {
	sites := []string{"North", "South", "East", "West", "Central"}
	var buf bytes.Buffer
	buf.WriteString("site,minutes\n")
	x := uint64(1)
	for i := range 10_000_000 {
		x = x*6364136223846793005 + 1442695040888963407
		fmt.Fprintf(&buf, "%s,%d.%d\n", sites[i%5], (x>>40)%240+uint64(i%5), (x>>20)%10)
	}
	return buf.Bytes()
}

// tabMemory is the resident memory of the largest renderer process of
// Chromium (the tab, with its workers), in MB, by ps; 0 where ps is missing.
func tabMemory() int {
	out, err := exec.Command("ps", "-C", "chromium", "-o", "rss=,args=").Output()
	if err != nil {
		return 0
	}
	largest := 0
	for _, line := range strings.Split(string(out), "\n") {
		fields := strings.Fields(line)
		if len(fields) > 1 && strings.Contains(line, "--type=renderer") {
			kb, _ := strconv.Atoi(fields[0])
			largest = max(largest, kb/1024)
		}
	}
	return largest
}

// figure runs measure runs times and reports the median as unit.
func figure(b *testing.B, unit string, measure func() float64) {
	var got []float64
	for range runs {
		got = append(got, measure())
	}
	slices.Sort(got)
	b.ReportMetric(got[len(got)/2], unit)
	b.Logf("%s: %v", unit, got)
}

// number evaluates a JavaScript expression to a number.
func (b *browser) number(tb testing.TB, expression string) float64 {
	tb.Helper()
	v, err := chromedp.Run(b.ctx, chromedp.Evaluate[float64](expression))
	if err != nil {
		tb.Fatalf("%s: %v", expression, err)
	}
	return v
}

// paste runs script, which builds a text in the variable text, and pastes
// that text into the data box as a clipboard event, marking
// "midrank:pasted" just before, so that the time is the page's, not the
// driver's.
func (b *browser) paste(tb testing.TB, script string) {
	tb.Helper()
	b.number(tb, `(() => {`+script+`
		document.getElementById("status").textContent = "";
		const clipboard = new DataTransfer();
		clipboard.setData("text/plain", text);
		performance.mark("midrank:pasted");
		document.getElementById("data").dispatchEvent(new ClipboardEvent("paste", { clipboardData: clipboard, bubbles: true, cancelable: true }));
		return text.length;
	})()`)
}
