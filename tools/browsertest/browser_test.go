// Package browsertest drives the built page in headless Chromium (Debian's
// chromium package, which make test installs) and checks it as a person
// would use it. It never skips: without Chromium the tests fail and say how
// to install it.
package browsertest

import (
	"context"
	"crypto/rand"
	"fmt"
	"html"
	"math"
	"net/http/httptest"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/log"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"

	"midrank/core"
	"midrank/core/display"
	"midrank/core/sealed"
	"midrank/core/tables"
	"midrank/core/testfiles"
	"midrank/tools/internal/sitebuild"
	"midrank/tools/internal/static"
)

// browser is one page in a fresh Chromium with a record of every request
// and console message it made.
type browser struct {
	ctx      context.Context
	origin   string
	mu       sync.Mutex
	requests []string
	console  []string
}

func (b *browser) record(list *[]string, s string) {
	b.mu.Lock()
	defer b.mu.Unlock()
	*list = append(*list, s)
}

func (b *browser) snapshot() (requests, console []string) {
	b.mu.Lock()
	defer b.mu.Unlock()
	return append([]string(nil), b.requests...), append([]string(nil), b.console...)
}

var (
	buildOnce sync.Once
	built     string
	buildErr  error
)

// site builds the site once for all tests of this package.
func site(t testing.TB) string {
	t.Helper()
	buildOnce.Do(func() {
		built, buildErr = os.MkdirTemp("", "midrank-site")
		if buildErr == nil {
			var log strings.Builder
			if _, err := sitebuild.Build("../..", built, &log); err != nil {
				buildErr = fmt.Errorf("%v\n%s", err, log.String())
			}
		}
	})
	if buildErr != nil {
		t.Fatalf("building the site: %v", buildErr)
	}
	return built
}

// start serves the built site on loopback with the production headers and
// opens it in Chromium.
func start(t testing.TB) *browser {
	t.Helper()
	srv := httptest.NewServer(static.Handler(os.DirFS(site(t))))
	t.Cleanup(srv.Close)
	return open(t, srv.URL+"/", srv.URL+"/")
}

// open starts a fresh Chromium with the flags this machine needs, records
// every request and console message, and navigates to url. Requests are
// expected to start with origin.
func open(t testing.TB, url, origin string) *browser {
	t.Helper()
	chromium, err := exec.LookPath("chromium")
	if err != nil {
		t.Fatal("Chromium is needed for the browser tests: make test installs it (apt-get install chromium)")
	}
	opts := []chromedp.ExecAllocatorOption{
		chromedp.ExecPath(chromium),
		chromedp.Headless, chromedp.NoSandbox, chromedp.DisableGPU, chromedp.NoFirstRun,
		chromedp.Flag("disable-quic", true),
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true),
		chromedp.UserDataDir(t.TempDir()),
		chromedp.WindowSize(1200, 900),
	}
	b := &browser{origin: origin}
	actx, cancelAlloc := chromedp.NewExecAllocator(context.Background(), opts...)
	ctx, cancelCtx := chromedp.NewContext(actx, chromedp.WithListener(func(ev any) {
		switch e := ev.(type) {
		case *network.EventRequestWillBeSent:
			b.record(&b.requests, e.Request.URL)
		case *runtime.EventConsoleAPICalled:
			var parts []string
			for _, a := range e.Args {
				parts = append(parts, string(a.Value)+a.Description)
			}
			b.record(&b.console, string(e.Type)+": "+strings.Join(parts, " "))
		case *runtime.EventExceptionThrown:
			text := e.ExceptionDetails.Text
			if e.ExceptionDetails.Exception != nil {
				text += " " + e.ExceptionDetails.Exception.Description
			}
			b.record(&b.console, "exception: "+text)
		case *log.EventEntryAdded:
			b.record(&b.console, string(e.Entry.Level)+": "+e.Entry.Text)
		}
	}))
	t.Cleanup(func() { cancelCtx(); cancelAlloc() })
	b.ctx = ctx
	if err := chromedp.Do(ctx, chromedp.Navigate(url)); err != nil {
		t.Fatal(err)
	}
	return b
}

// checkRequests fails for any request outside the page's own origin and
// for console messages that report a blocked load or an error.
func (b *browser) checkRequests(t *testing.T) {
	t.Helper()
	requests, console := b.snapshot()
	if len(requests) == 0 {
		t.Fatal("no requests were recorded")
	}
	for _, u := range requests {
		if !strings.HasPrefix(u, b.origin) && !strings.HasPrefix(u, "data:") && !strings.HasPrefix(u, "blob:") {
			t.Errorf("request outside %s: %s", b.origin, u)
		}
	}
	for _, m := range console {
		if strings.Contains(m, "Content Security Policy") || strings.HasPrefix(m, "exception") || strings.HasPrefix(m, "error") {
			t.Errorf("console: %s", m)
		}
	}
}

// waitFor polls a JavaScript condition until it holds.
func (b *browser) waitFor(t testing.TB, condition string) {
	t.Helper()
	if _, err := chromedp.Run(b.ctx, chromedp.Poll[bool](condition, chromedp.WithPollingTimeout(60*time.Second))); err != nil {
		t.Fatalf("waiting for %s: %v", condition, err)
	}
}

func (b *browser) text(t testing.TB, selector string) string {
	t.Helper()
	ctx, cancel := context.WithTimeout(b.ctx, 60*time.Second)
	defer cancel()
	s, err := chromedp.Run(ctx, chromedp.TextContent(selector))
	if err != nil {
		t.Fatalf("reading %s: %v", selector, err)
	}
	return s
}

// analyse replaces the data and presses Analyse, waiting for the status
// line to change so that the previous result is not read by mistake.
func (b *browser) analyse(t *testing.T, data string) {
	t.Helper()
	if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("status").textContent = ""`)); err != nil {
		t.Fatal(err)
	}
	if err := chromedp.Do(b.ctx, chromedp.SetValue("#data", data), chromedp.Click("#analyse")); err != nil {
		t.Fatal(err)
	}
	b.waitFor(t, `/^(Done|The data could not)/.test(document.getElementById("status").textContent)`)
}

// startLongRun starts a Monte Carlo analysis of data with 100 million
// resamples and waits until it reports progress.
func (b *browser) startLongRun(t *testing.T, data string) {
	t.Helper()
	if err := chromedp.Do(b.ctx,
		chromedp.SetValue("#data", data), chromedp.SetValue("#pvalue", "monte-carlo"),
		chromedp.SetValue("#resamples", "100000000"), chromedp.Click("#analyse")); err != nil {
		t.Fatal(err)
	}
	b.waitFor(t, `document.getElementById("status").textContent.startsWith("Resamples")`)
}

// saved presses a download button and returns the file the page made,
// caught instead of saved.
func (b *browser) saved(t *testing.T, button string) string {
	t.Helper()
	return b.savedBy(t, `#`+button)
}

// savedBy is saved for the button that a CSS selector finds.
func (b *browser) savedBy(t *testing.T, selector string) string {
	t.Helper()
	catch := `URL.createObjectURL = (blob) => { window.savedBlob = blob; return "data:,"; }; HTMLAnchorElement.prototype.click = () => {}; ` +
		`document.querySelector(` + strconv.Quote(selector) + `).click(); true`
	if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](catch)); err != nil {
		t.Fatal(err)
	}
	text, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`window.savedBlob.text()`, chromedp.EvalAwaitPromise))
	if err != nil {
		_, console := b.snapshot()
		t.Fatal(err, console)
	}
	return text
}

// printed prints the page on A4 to a PDF file in the temporary folder, for
// a person to look at, and gives its text.
func (b *browser) printed(t *testing.T, name string) string {
	t.Helper()
	pdf, err := chromedp.Run(b.ctx, func(ctx context.Context, target *chromedp.Target) ([]byte, error) {
		res, err := cdp.Call(ctx, target, page.PrintToPDF, page.PrintToPDFParams{PaperWidth: 8.27, PaperHeight: 11.69}) // A4, in inches
		return res.Data, err
	})
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(os.TempDir(), name)
	if err := os.WriteFile(path, pdf, 0o644); err != nil {
		t.Fatal(err)
	}
	t.Logf("printed page for review: %s", path)
	return pdfText(t, path)
}

// unescaped finds a character that Markdown would read as a tag, a link or
// an image when no backslash stands before it.
var unescaped = regexp.MustCompile(`(^|[^\\])[<\[!]`)

// markdownText is Markdown with its backslash escapes read, as it renders.
func markdownText(md string) string {
	return regexp.MustCompile(`\\(.)`).ReplaceAllString(md, "$1")
}

// keep writes a downloaded file to the temporary folder, for a person to
// look at.
func keep(t *testing.T, name, text string) {
	t.Helper()
	path := filepath.Join(os.TempDir(), name)
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	t.Logf("download kept for review: %s", path)
}

// screenshot saves the page as it stands to the temporary folder, for a
// person to look at.
func (b *browser) screenshot(t *testing.T, name string) {
	t.Helper()
	png, err := chromedp.Run(b.ctx, chromedp.FullScreenshot(100))
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(os.TempDir(), name)
	if err := os.WriteFile(path, png, 0o644); err != nil {
		t.Fatal(err)
	}
	t.Logf("screenshot for review: %s", path)
}

// pdfText is the text of a PDF file, its spaces and line breaks as single
// spaces, read by poppler's pdftotext (Debian's
// poppler-utils, which make test installs).
func pdfText(t *testing.T, path string) string {
	t.Helper()
	out, err := exec.Command("pdftotext", path, "-").Output()
	if err != nil {
		t.Fatalf("pdftotext (make test installs Debian's poppler-utils): %v", err)
	}
	return strings.Join(strings.Fields(string(out)), " ") // a heading wrapped over lines reads as one
}

// hasWords reports whether every word of heading is in text: a heading
// printed over two lines of its cell is read out of the PDF with other
// cells' words between its own, in an order that depends on the layout.
// That each heading prints whole is checked in the page with print styles.
func hasWords(text, heading string) bool {
	for _, word := range strings.Fields(heading) {
		if !strings.Contains(text, word) {
			return false
		}
	}
	return true
}

// shown formats a statistic by the core's display policy, which the page
// shows.
func shown(v float64) string {
	return display.Statistic.Format(v)
}

// smokeTest is what every way of hosting the page must pass: the demo
// renders the core's decision and figures. It returns the demo and the
// core's result for it.
func (b *browser) smokeTest(t *testing.T) ([]byte, *core.Result) {
	t.Helper()
	b.waitFor(t, `document.getElementById("decision").textContent.length > 0`)
	demo, err := os.ReadFile("../../site/demo.tsv")
	if err != nil {
		t.Fatal(err)
	}
	want, err := core.Analyze(demo, core.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if got := b.text(t, "#decision"); got != want.Decision {
		t.Errorf("decision on the page:\n%s\nwant:\n%s", got, want.Decision)
	}
	if got := b.text(t, `[data-result="h"]`); got != shown(want.H) {
		t.Errorf("H shown as %q, want %q", got, shown(want.H))
	}
	if got := b.text(t, `[data-result="df"]`); got != strconv.Itoa(want.DF) {
		t.Errorf("df shown as %q, want %d", got, want.DF)
	}
	return demo, want
}

func TestPage(t *testing.T) {
	b := start(t)
	var demo []byte
	var want *core.Result
	t.Run("demo renders its decision", func(t *testing.T) {
		demo, want = b.smokeTest(t)
		if got := b.text(t, "#result-line"); got != want.ResultLine {
			t.Errorf("result line %q, the core's %q", got, want.ResultLine)
		}
		// the passphrase form is for sealed links only
		if shown, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("unlock").checkVisibility()`)); err != nil || shown {
			t.Errorf("the passphrase form shows on a page opened without a sealed link (%v)", err)
		}
	})
	if want == nil {
		t.FailNow()
	}

	t.Run("pairs and letters match the core", func(t *testing.T) {
		ph := want.PostHoc
		rows, err := chromedp.Run(b.ctx, chromedp.Evaluate[int](`document.querySelectorAll("#pairs-table tbody tr").length`))
		if err != nil {
			t.Fatal(err)
		}
		if rows != len(ph.Pairs) {
			t.Errorf("%d pair rows, want %d", rows, len(ph.Pairs))
		}
		letters, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.querySelectorAll("#groups-table tbody tr")].map(r => r.lastElementChild.textContent)`))
		if err != nil {
			t.Fatal(err)
		}
		for i, g := range want.Groups {
			if letters[i] != ph.Letters[g.Label] {
				t.Errorf("group %s shows letters %q, want %q", g.Label, letters[i], ph.Letters[g.Label])
			}
		}
	})

	t.Run("every column of the core's tables is in the page, the CSV files and both reports", func(t *testing.T) {
		// the tables as the core defines them: a column added there must
		// show in each rendering, with each row's cells as the core shows them
		report, md := b.saved(t, "save-html"), b.saved(t, "save-markdown")
		csvs := map[string]string{"groups": b.saved(t, "save-groups"), "pairs": b.saved(t, "save-pairs")}
		for name, text := range map[string]string{"midrank-report.html": report, "midrank-report.md": md,
			"midrank-groups.csv": csvs["groups"], "midrank-pairs.csv": csvs["pairs"]} {
			keep(t, name, text)
		}
		md = markdownText(md)
		for _, tab := range tables.Of(want) {
			page, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](map[string]string{
				"figures": `[...document.querySelectorAll("#figures dt")].map((d) => d.textContent)`,
				"groups":  `[...document.querySelectorAll("#groups-table th")].map((th) => th.textContent)`,
				"pairs":   `[...document.querySelectorAll("#pairs-table th")].map((th) => th.textContent)`}[tab.Name]))
			if err != nil {
				t.Fatal(err)
			}
			for i, c := range tab.Columns {
				if !slices.ContainsFunc(page, func(h string) bool { return strings.HasPrefix(h, c.Heading) }) {
					t.Errorf("%s: column %q is not on the page (%q)", tab.Name, c.Heading, page)
				}
				if h := html.EscapeString(c.Heading); !strings.Contains(report, "<th>"+h+"</th>") && !strings.Contains(report, "<td>"+h+"</td>") {
					t.Errorf("%s: column %q is not in the HTML report", tab.Name, c.Heading)
				}
				if !strings.Contains(md, "| "+c.Heading+" |") {
					t.Errorf("%s: column %q is not in the Markdown report", tab.Name, c.Heading)
				}
				if csv, ok := csvs[tab.Name]; ok && !strings.Contains(strings.SplitN(csv, "\r\n", 2)[0], c.Key) {
					t.Errorf("%s: column %q is not in the CSV file's header %q", tab.Name, c.Key, strings.SplitN(csv, "\r\n", 2)[0])
				}
				if tab.Name == "figures" && !strings.Contains(md, "| "+c.Heading+" | "+tab.Rows[0][i].Text+" |") {
					t.Errorf("figures: %q is not shown as %q in the Markdown report", c.Heading, tab.Rows[0][i].Text)
				}
			}
			// every row as the core shows it (its digits by the display policy), in both reports
			for _, row := range tab.Rows {
				if tab.Name == "figures" {
					break
				}
				texts, cells := make([]string, len(row)), make([]string, len(row))
				for i, c := range row {
					texts[i], cells[i] = c.Text, "<td>"+html.EscapeString(c.Text)+"</td>"
				}
				if !strings.Contains(md, "| "+strings.Join(texts, " | ")+" |") {
					t.Errorf("%s: the row %q is not in the Markdown report as shown", tab.Name, texts)
				}
				if !strings.Contains(report, "<tr>"+strings.Join(cells, "")+"</tr>") {
					t.Errorf("%s: the row %q is not in the HTML report as shown", tab.Name, texts)
				}
			}
		}
	})

	t.Run("pictures show every group and value", func(t *testing.T) {
		counts, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]int](`[
			document.querySelectorAll("#plot-values svg rect[fill=none]").length,
			document.querySelectorAll("#plot-values svg circle, #plot-values svg rect:not([fill=none]), #plot-values svg path").length,
			document.querySelectorAll("#plot-ranks svg text").length]`))
		if err != nil {
			t.Fatal(err)
		}
		if counts[0] != want.K || counts[1] != want.N {
			t.Errorf("value plot has %d boxes and %d markers, want %d and %d", counts[0], counts[1], want.K, want.N)
		}
		if caption := b.text(t, "#plot-ranks-caption"); !strings.Contains(caption, "Mean rank of each group") {
			t.Errorf("mean-rank caption %q", caption)
		}
	})

	t.Run("screenshot", func(t *testing.T) { b.screenshot(t, "midrank-results.png") })

	t.Run("prints the results on A4 with every heading, tables within the paper and page numbers", func(t *testing.T) {
		text := b.printed(t, "midrank-results.pdf")
		for _, tab := range tables.Of(want) {
			for _, c := range tab.Columns {
				if !hasWords(text, c.Heading) {
					t.Errorf("the printed results lack the %s table's heading %q", tab.Name, c.Heading)
				}
			}
		}
		for _, s := range []string{"Page 1 of ", "Page 2 of ", "printed " + time.Now().UTC().Format("2006-01-02"), "All 41 values are listed."} {
			if !strings.Contains(text, s) {
				t.Errorf("the printed results lack %q", s)
			}
		}
		for _, s := range []string{"Download", "Copy this line", "Passphrase"} {
			if strings.Contains(text, s) {
				t.Errorf("the printed results show the control %q", s)
			}
		}
		// A4 is 210 mm wide; less the page's margins of 14 mm a side, 182 mm are printed
		const printable = 182 / 25.4 * 96 // CSS pixels
		media := func(m string) chromedp.Action[chromedp.Void] {
			return chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
				_, err := cdp.Call(ctx, tg, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: m})
				return err
			})
		}
		if err := chromedp.Do(b.ctx, media("print"), chromedp.EmulateViewport(int64(math.Floor(printable)), 1000)); err != nil {
			t.Fatal(err)
		}
		wide, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.querySelectorAll("#results table, #results figure, #results dl")]
			.filter((el) => el.checkVisibility()).filter((el) => el.getBoundingClientRect().width > `+strconv.Itoa(int(math.Floor(printable)))+` + 0.5)
			.map((el) => (el.id || el.className) + " " + Math.round(el.getBoundingClientRect().width) + " px")`))
		if err != nil {
			t.Fatal(err)
		}
		if len(wide) > 0 {
			t.Errorf("printed wider than the paper's %.0f px: %q", printable, wide)
		}
		headings, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.querySelectorAll("#results th, #results dt")]
			.filter((el) => el.checkVisibility() && el.getBoundingClientRect().width > 0 && el.scrollWidth <= el.clientWidth + 1).map((el) => el.textContent)`))
		if err != nil {
			t.Fatal(err)
		}
		for _, tab := range tables.Of(want) {
			for _, c := range tab.Columns {
				if !slices.ContainsFunc(headings, func(h string) bool { return strings.HasPrefix(h, c.Heading) }) {
					t.Errorf("with print styles the %s table's heading %q is hidden or cut", tab.Name, c.Heading)
				}
			}
		}
		if err := chromedp.Do(b.ctx, media(""), chromedp.EmulateViewport(1200, 900)); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("the headline is in view after the first analysis at 1280 by 800, and pictures keep their text size at 390 px", func(t *testing.T) {
		if err := chromedp.Do(b.ctx, chromedp.EmulateViewport(1280, 800)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.querySelector("#plot-values svg").getAttribute("width") > 720`)
		below, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`scrollTo(0, 0), ["result-line", "decision", "plot-values"]
			.filter((id) => document.getElementById(id).getBoundingClientRect().bottom > innerHeight)`))
		if err != nil {
			t.Fatal(err)
		}
		if len(below) > 0 {
			t.Errorf("at 1280 by 800 these are below the first screen: %q", below)
		}
		b.screenshot(t, "midrank-first-screen.png")
		if err := chromedp.Do(b.ctx, chromedp.EmulateViewport(390, 800)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.querySelector("#plot-values svg").getAttribute("width") < 400`)
		small, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.querySelectorAll("#results svg text")]
			.filter((t) => t.getBoundingClientRect().height > 0 && parseFloat(getComputedStyle(t).fontSize) * t.closest("svg").getBoundingClientRect().width / t.closest("svg").viewBox.baseVal.width < 11)
			.map((t) => t.textContent)`))
		if err != nil {
			t.Fatal(err)
		}
		if len(small) > 0 {
			t.Errorf("at 390 px these pictures' texts are smaller than 11 px: %q", small)
		}
		if err := chromedp.Do(b.ctx, chromedp.EmulateViewport(1200, 900)); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("the tables copy as HTML and as text", func(t *testing.T) {
		catch := `navigator.clipboard.write = async (items) => { window.copied = items; }; document.getElementById("copy-tables").click(); true`
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](catch)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `window.copied !== undefined`)
		forms, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`Promise.all(["text/html", "text/plain"].map((type) => window.copied[0].getType(type).then((blob) => blob.text())))`, chromedp.EvalAwaitPromise))
		if err != nil {
			t.Fatal(err)
		}
		if got := strings.Count(forms[0], "<table>"); got != len(tables.Of(want)) {
			t.Errorf("the copied HTML holds %d tables, want %d:\n%.300s", got, len(tables.Of(want)), forms[0])
		}
		for _, g := range want.Groups {
			if !strings.Contains(forms[1], "\n"+g.Label+"\t") {
				t.Errorf("the copied text has no row for %s, its cells separated by tabs:\n%.600s", g.Label, forms[1])
			}
		}
	})

	t.Run("a pasted case shows the command line's H", func(t *testing.T) {
		data, err := os.ReadFile("../../testdata/cases/plantgrowth_long.csv")
		if err != nil {
			t.Fatal(err)
		}
		r, err := core.Analyze(data, core.Options{})
		if err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data))
		if got := b.text(t, `[data-result="h"]`); got != shown(r.H) {
			t.Errorf("H shown as %q, want %q", got, shown(r.H))
		}
	})

	t.Run("a table of many columns: the reading says why, and the columns are chosen in menus", func(t *testing.T) {
		// R's ChickWeight as write.csv writes it: its first code column is
		// Time, so the reading offers Diet, which the analyst then chooses
		data, err := os.ReadFile("../../testdata/reading/chickweight.csv")
		if err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data))
		if got := b.text(t, "#read-reason"); !strings.Contains(got, `groups from column "Time"`) || !strings.Contains(got, `groups from "Diet"`) {
			t.Errorf("the reading says %q, want Time read and Diet offered", got)
		}
		menu, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.getElementById("group").options].map((o) => o.text)`))
		if err != nil || len(menu) != 5 || !strings.HasPrefix(menu[4], "Diet (4 different, 578 numbers, 0 blank") {
			t.Errorf("group menu %q (%v), want every column with what it holds", menu, err)
		}
		// the other reading is one click away, with the groups and values it gives
		offer, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("status").textContent = "";
			const offer = [...document.querySelectorAll("#read-alternatives button")].find((b) => b.textContent.includes('groups from "Diet"'));
			offer.click(); offer.textContent`))
		if err != nil || !strings.Contains(offer, "4 groups, 578 values") {
			t.Errorf("the offer to read groups from Diet says %q (%v), want 4 groups and 578 values", offer, err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		// R 4.2.2: kruskal.test(weight ~ Diet, ChickWeight): chi-squared = 24.45, df = 3 (testdata/reading/expected.tsv)
		if h, df := b.text(t, `[data-result="h"]`), b.text(t, `[data-result="df"]`); h != "24.45" || df != "3" {
			t.Errorf("with Diet chosen: H %s on %s df, want R's 24.45 on 3", h, df)
		}
		b.screenshot(t, "midrank-columns-chosen.png")
		// the choice is the analyst's until they undo it: back to the reading's
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("measure").value = "";
			const c = document.getElementById("group"); c.value = ""; c.dispatchEvent(new Event("change")); true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done") && document.querySelector('[data-result="df"]').textContent === "11"`)
	})

	t.Run("several measures: the overview as the core shows it, each measure in full and back, reports, CSV and a link of the whole battery", func(t *testing.T) {
		// R's airquality (testdata/battery, written by tools/reference/battery.R): four measures by Month,
		// whose H, p and adjusted p core/battery_test.go checks against R's kruskal.test and p.adjust
		data, err := os.ReadFile("../../testdata/battery/airquality.csv")
		if err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data))
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("status").textContent = "";
			document.getElementById("group").value = "Month";
			document.getElementById("measures-box").open = true;
			for (const c of document.querySelectorAll("#measures-list input")) c.checked = ["Ozone", "Solar.R", "Wind", "Temp"].includes(c.value);
			document.getElementById("measures-box").dispatchEvent(new Event("change", { bubbles: true })); true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent === "Done: 4 measures."`)
		want, err := core.AnalyzeMeasures(context.Background(), data, core.Options{Group: "Month", Measures: []string{"Ozone", "Solar.R", "Wind", "Temp"}}, nil)
		if err != nil {
			t.Fatal(err)
		}
		overview := tables.Overview(want)
		rows, err := chromedp.Run(b.ctx, chromedp.Evaluate[[][]string](`[...document.querySelectorAll("#battery-table tbody tr")].map((tr) => [...tr.cells].map((td) => td.textContent))`))
		if err != nil || len(rows) != len(overview.Rows) {
			t.Fatalf("overview rows %q (%v), want %d", rows, err, len(overview.Rows))
		}
		for i, row := range overview.Rows {
			for j, cell := range row {
				if rows[i][j] != cell.Text {
					t.Errorf("overview row %d column %s: %q, want the core's %q", i+1, overview.Columns[j].Key, rows[i][j], cell.Text)
				}
			}
		}
		if got := b.text(t, "#battery-summary"); got != want.Summary || !strings.Contains(got, "3 differ (Ozone, Wind, Temp)") {
			t.Errorf("summary %q, want the core's %q, three measures named as differing", got, want.Summary)
		}
		cells, _ := chromedp.Run(b.ctx, chromedp.Evaluate[int](`document.querySelectorAll("#plot-battery svg g[tabindex] title").length`))
		if cells != 4*5 {
			t.Errorf("the picture has %d cells with their values, want 4 measures × 5 months", cells)
		}
		// sorted by effect size: Temp (the largest ε²) first
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("battery-sort-effect").click(); true`)); err != nil {
			t.Fatal(err)
		}
		if first := b.text(t, "#battery-table tbody tr td"); first != "Temp" {
			t.Errorf("sorted by effect size, the first measure is %q, want Temp", first)
		}
		b.screenshot(t, "midrank-measures.png")
		fitsAndReads(t, b)
		// each measure's name is printed in the summary (if it differs), its row of the overview and the picture
		printed, summary := b.printed(t, "midrank-measures.pdf"), b.text(t, "#battery-summary")
		for _, m := range want.Measures {
			if got, w := strings.Count(printed, m.Measure), strings.Count(summary, m.Measure)+2; got != w {
				t.Errorf("the printed overview names %s %d times, want %d (its row is missing)", m.Measure, got, w)
			}
		}
		for _, s := range []string{"Sort by", "The reports show in full", "Download"} {
			if strings.Contains(printed, s) {
				t.Errorf("the printed overview shows the control %q", s)
			}
		}
		// one measure in full, then back
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`[...document.querySelectorAll("#battery-table button")].find((x) => x.textContent === "Wind").click(); true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `!document.getElementById("results").hidden && document.getElementById("battery").hidden`)
		if got, w := b.text(t, `[data-result="h"]`), display.Statistic.Format(want.Measures[2].Result.H); got != w {
			t.Errorf("Wind in full: H %q, want %q", got, w)
		}
		if got, w := b.text(t, "#drill-note"), display.PValue.Format(*want.Measures[2].PAdjustedAcross); !strings.Contains(got, "Wind. Its p adjusted across the measures: "+w) {
			t.Errorf("Wind in full says %q, want its adjusted p %s", got, w)
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("back-to-battery").click(); true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("results").hidden && !document.getElementById("battery").hidden`)
		// the reports: the overview, then each measure in full (or only those that differ)
		report := b.saved(t, "save-battery-html")
		for _, m := range want.Measures {
			if !strings.Contains(report, "<h2>"+m.Measure+"</h2>") || !strings.Contains(report, html.EscapeString(m.Result.ResultLine)) {
				t.Errorf("the HTML report lacks %s in full", m.Measure)
			}
			// each measure's pictures, drawn for the report from its own figures
			section := report[strings.Index(report, "<h2>"+m.Measure+"</h2>"):]
			if next := strings.Index(section[4:], "<h2>"); next >= 0 {
				section = section[:next+4]
			}
			if strings.Count(section, "<svg") != 2 || !strings.Contains(section, "Mean rank of each group") || !strings.Contains(section, ">"+m.Result.Groups[0].Label+"<") {
				t.Errorf("the HTML report's section on %s lacks its two pictures", m.Measure)
			}
		}
		keep(t, "midrank-measures-report.html", report)
		if _, err := chromedp.Run(b.ctx, chromedp.SetValue("#battery-report", "differ")); err != nil {
			t.Fatal(err)
		}
		md := b.saved(t, "save-battery-markdown")
		if strings.Contains(md, "## Solar.R") || !strings.Contains(md, "## Ozone") || !strings.Contains(md, "3 of the 4 measures follow in full") {
			t.Errorf("the Markdown report of the measures that differ:\n%.600s", md)
		}
		keep(t, "midrank-measures-report.md", md)
		if csv := b.saved(t, "save-overview"); strings.Count(csv, "\r\n") != 5 || !strings.HasPrefix(csv, "measure,values,groups,h,") {
			t.Errorf("overview CSV:\n%s", csv)
		}
		if svg := b.saved(t, "save-battery-svg"); !strings.Contains(svg, "Where each group lies on each measure") || strings.Count(svg, "<title>") < 20 {
			t.Errorf("the battery's picture as SVG:\n%.300s", svg)
		}
		// a link carries the whole battery
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("link-passphrase").value = ""; document.getElementById("make-link").click(); true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("link-text").value.includes("#r1.") && document.getElementById("battery").contains(document.getElementById("link-box"))`)
		url, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("link-text").value`))
		r := open(t, url, b.origin)
		r.waitFor(t, `document.getElementById("status").textContent === "Done: 4 measures."`)
		if got := r.text(t, "#battery-summary"); !strings.Contains(got, "3 differ (Ozone, Wind, Temp)") {
			t.Errorf("the reopened battery says %q", got)
		}
		// back to one measure for the tests that follow
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("measures-all").checked = false;
			for (const c of document.querySelectorAll("#measures-list input")) c.checked = false;
			document.getElementById("group").value = ""; document.getElementById("measures-box").open = false; true`)); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("a spreadsheet opens in the tab, its sheets in a menu", func(t *testing.T) {
		// R's npk written by openpyxl behind a sheet of notes (testdata/sheets, tools/reference/sheets.py)
		file, err := filepath.Abs("../../testdata/sheets/npk.xlsx")
		if err != nil {
			t.Fatal(err)
		}
		if err := chromedp.Do(b.ctx, chromedp.SetUploadFiles("#file", []string{file})); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `!document.getElementById("sheet-row").hidden && document.getElementById("data").value.startsWith("Note")`)
		sheets, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.getElementById("sheet").options].map((o) => o.text)`))
		if err != nil || strings.Join(sheets, "|") != "About|npk" {
			t.Errorf("sheet menu %q (%v), want About|npk", sheets, err)
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("status").textContent = "";
			const s = document.getElementById("sheet"); s.value = "2"; s.dispatchEvent(new Event("change")); true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("data").value.startsWith("block") && document.getElementById("status").textContent.startsWith("Done")`)
		// R 4.2.2: kruskal.test(yield ~ block, npk): chi-squared = 8.3684, df = 5 (testdata/reading/expected.tsv)
		if h, df := b.text(t, `[data-result="h"]`), b.text(t, `[data-result="df"]`); h != "8.37" || df != "5" {
			t.Errorf("npk from the spreadsheet: H %s on %s df, want R's 8.37 on 5", h, df)
		}
		b.screenshot(t, "midrank-spreadsheet.png")
	})

	t.Run("a table of counts shows each group level by level", func(t *testing.T) {
		// R's esoph as a counts table (testdata/counts, tools/reference/counts.R)
		data, err := os.ReadFile("../../testdata/counts/esoph_counts.csv")
		if err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data))
		// R 4.2.2: kruskal.test on the rep()-expanded counts: 13.83 on 5 df (testdata/counts/expected.tsv)
		if h, df := b.text(t, `[data-result="h"]`), b.text(t, `[data-result="df"]`); h != "13.83" || df != "5" {
			t.Errorf("esoph counts: H %s on %s df, want R's 13.83 on 5", h, df)
		}
		rows, err := chromedp.Run(b.ctx, chromedp.Evaluate[int](`document.querySelectorAll("#levels-table tbody tr").length +
			100 * document.querySelectorAll("#plot-levels rect").length`))
		// 6 groups × 4 levels: 24 rows, 24 bar segments and 4 legend swatches
		if err != nil || rows != 24+100*28 || b.text(t, "#levels-box h3") == "" {
			t.Errorf("levels table and bars: %d (%v), want 24 rows and 28 rectangles", rows, err)
		}
		b.screenshot(t, "midrank-counts.png")
	})

	t.Run("an exact p-value is shown with its method", func(t *testing.T) {
		// midranks A 3.5, 5, 6; B 7, 8, 9; C 1, 2, 3.5 (a tie at 3): the most extreme split of the
		// scores, reached by its 3! relabellings × 2 placings of the tied pair = 12 of the
		// 9!/(3!)³ = 1,680 deals, so p = 12/1680 = 0.00714 (complete enumeration, by hand)
		data := "A,B,C\n3,8,2\n5,6,1\n4,9,3\n"
		r, err := core.Analyze([]byte(data), core.Options{})
		if err != nil {
			t.Fatal(err)
		}
		b.analyse(t, data)
		if got := b.text(t, `[data-result="p_method"]`); got != "exact permutation" || r.PMethod != "exact" {
			t.Errorf("method shown as %q (core: %s), want exact permutation", got, r.PMethod)
		}
		if got, want := b.text(t, `[data-result="p_value"]`), display.PValue.Format(r.PValue); got != want || r.PValue > 0.0072 || r.PValue < 0.0071 {
			t.Errorf("p shown as %q, want %q", got, want)
		}
	})

	t.Run("a trend along the groups' order is tested, shown and reported as the core does", func(t *testing.T) {
		// R's warpbreaks: breaks by tension L, M, H (testdata/trend), whose Kendall z, −3.34, core/trend checks against R's cor.test
		data, err := os.ReadFile("../../testdata/trend/warpbreaks.csv")
		if err != nil {
			t.Fatal(err)
		}
		r, err := core.Analyze(data, core.Options{Trend: "decreasing"})
		if err != nil || r.Trend == nil {
			t.Fatal(err)
		}
		want := tables.Trend(r)
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#trend", "decreasing")); err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data))
		shown, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.querySelectorAll("#trend-figures dd")].map((d) => d.textContent)`))
		if err != nil {
			t.Fatal(err)
		}
		for i, c := range want.Columns {
			if i >= len(shown) || shown[i] != want.Rows[0][i].Text {
				t.Errorf("trend %s shown as %q, core %q", c.Key, shown, want.Rows[0][i].Text)
				break
			}
		}
		if got := b.text(t, "#decision"); !strings.Contains(got, "the values tend to fall: the Jonckheere–Terpstra test") {
			t.Errorf("decision %q", got)
		}
		if report := b.saved(t, "save-html"); !strings.Contains(report, "Trend along the groups&#39; order") || !strings.Contains(report, want.Rows[0][4].Text) {
			t.Errorf("the HTML report lacks the trend table")
		}
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#trend", "none")); err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data))
		if hidden, _ := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("trend-box").hidden`)); !hidden {
			t.Error("the trend stays on screen when none is asked for")
		}
	})

	t.Run("each group compared with a reference group chosen among the groups", func(t *testing.T) {
		// R's PlantGrowth; core/reference_group_test.go checks these p-values against R's p.adjust over the two comparisons
		data, err := os.ReadFile("../../testdata/reference/plantgrowth.csv")
		if err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data)) // the groups of this text become the menu's choices
		r, err := core.Analyze(data, core.Options{Reference: "ctrl"})
		if err != nil {
			t.Fatal(err)
		}
		all := tables.Of(r)
		want := all[len(all)-1] // the pairs come last
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#reference", "ctrl")); err != nil {
			t.Fatal(err)
		}
		b.analyse(t, string(data))
		rows, err := chromedp.Run(b.ctx, chromedp.Evaluate[[][]string](`[...document.querySelectorAll("#pairs-table tbody tr")].map((tr) => [...tr.cells].map((td) => td.textContent))`))
		if err != nil {
			t.Fatal(err)
		}
		if len(rows) != 2 {
			t.Fatalf("%d rows of pairs, want the 2 comparisons with ctrl: %q", len(rows), rows)
		}
		for i, row := range want.Rows {
			for j, cell := range row {
				if rows[i][j] != cell.Text {
					t.Errorf("row %d column %s shown as %q, core %q", i, want.Columns[j].Key, rows[i][j], cell.Text)
				}
			}
		}
		if got := b.text(t, "#pairs-hint"); !strings.Contains(got, "with ctrl") {
			t.Errorf("pairs hint %q", got)
		}
		if hidden, _ := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("matrix-box").hidden`)); !hidden {
			t.Error("the matrix of every pair is shown beside comparisons with a reference group")
		}
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#reference", "")); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("a bad cell is reported with its place", func(t *testing.T) {
		b.analyse(t, "A,B,C\n1,2,3\n4,five,6\n")
		if got := b.text(t, "#problem"); !strings.Contains(got, "line 3, column 2") || !strings.Contains(got, `"five"`) {
			t.Errorf("problem shown as %q, want line 3, column 2 and the cell", got)
		}
	})

	t.Run("an exact p beyond the budget is refused in the form's own words", func(t *testing.T) {
		var data strings.Builder
		data.WriteString("A,B,C,D\n")
		for i := range 15 { // four groups of 15 untied values
			fmt.Fprintf(&data, "%d,%d,%d,%d\n", 4*i+1, 4*i+2, 4*i+3, 4*i+4)
		}
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#pvalue", "exact")); err != nil {
			t.Fatal(err)
		}
		b.analyse(t, data.String())
		got := b.text(t, "#problem")
		for _, want := range []string{`p-value “exact permutation”: the exact distribution for groups of 15, 15, 15 and 15 is beyond the budget`, `Choose “Monte Carlo” or “choose for me” instead.`} {
			if !strings.Contains(got, want) {
				t.Errorf("problem shown as %q, want %q", got, want)
			}
		}
		if strings.Contains(got, "monte-carlo") || strings.Contains(got, `pvalue "exact"`) {
			t.Errorf("problem shown as %q, in the command line's words", got)
		}
		if hidden, _ := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("results").hidden`)); !hidden {
			t.Error("results stay on screen beside data they are not from")
		}
		b.screenshot(t, "midrank-refused.png")
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#pvalue", "auto")); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("every unreadable cell is marked in the preview", func(t *testing.T) {
		b.analyse(t, "A,B,C\n1,2,3\n4,five,6\nx,5,6\n")
		marked, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](
			`[...document.querySelectorAll("#preview-rows td.bad")].map((td) => td.textContent + " @ " + td.title)`))
		if err != nil {
			t.Fatal(err)
		}
		if len(marked) != 2 || !strings.HasPrefix(marked[0], "five @ line 3, column 2") || !strings.HasPrefix(marked[1], "x @ line 4, column 1") {
			t.Errorf("marked cells %q, want five at line 3, column 2 and x at line 4, column 1", marked)
		}
		if got := b.text(t, "#problem-list"); !strings.Contains(got, "line 4, column 1") {
			t.Errorf("problem list %q, want both problems", got)
		}
	})

	t.Run("groups are left out, renamed and reordered, undone, and kept over a reload", func(t *testing.T) {
		data := "North,South,East\n3,8,2\n5,6,1\n4,9,3\n7,1,5\n"
		b.analyse(t, data)
		// each change analyses again: clear the status, act, wait for "Done"
		change := func(js string) {
			t.Helper()
			if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[any](`document.getElementById("status").textContent = ""; `+js+`; null`)); err != nil {
				t.Fatal(err)
			}
			b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		}
		groups := func() []string {
			t.Helper()
			labels, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.querySelectorAll("#groups-table tbody tr")].map((tr) => tr.cells[0].textContent)`))
			if err != nil {
				t.Fatal(err)
			}
			return labels
		}
		change(`document.querySelector('[aria-label="Include East in the test"]').click()`)
		want, err := core.Analyze([]byte(data), core.Options{Exclude: []string{"East"}})
		if err != nil {
			t.Fatal(err)
		}
		if got := b.text(t, `[data-result="h"]`); got != shown(want.H) || !strings.Contains(b.text(t, "#decision"), "Left out of this comparison by request: East.") {
			t.Errorf("without East: H %q (core %s), decision %q", got, shown(want.H), b.text(t, "#decision"))
		}
		change(`{ const box = document.querySelector('[aria-label="Name to show for North"]'); box.value = "North <site>"; box.dispatchEvent(new Event("change")); }`)
		change(`document.querySelector('[aria-label="Move South up"]').click()`)
		if got := groups(); !slices.Equal(got, []string{"South", "North <site>"}) {
			t.Errorf("groups after rename and move: %q", got)
		}
		change(`document.getElementById("undo").click()`)
		if got := groups(); !slices.Equal(got, []string{"North <site>", "South"}) {
			t.Errorf("groups after undoing the move: %q", got)
		}
		if md := markdownText(b.saved(t, "save-markdown")); !strings.Contains(md, "\u201cNorth\u201d is shown as \u201cNorth <site>\u201d") ||
			!strings.Contains(md, "Left out by request: \u201cEast\u201d (4 values, 0 missing)") {
			t.Errorf("the Markdown report does not say which groups were renamed and left out:\n%.400s", md)
		}
		if err := chromedp.Do(b.ctx, chromedp.Reload()); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		if got := groups(); !slices.Equal(got, []string{"North <site>", "South"}) {
			t.Errorf("groups after a reload: %q", got)
		}
		change(`document.getElementById("reset-edits").click()`)
		if got := groups(); !slices.Equal(got, []string{"North", "South", "East"}) {
			t.Errorf("groups after going back to the text's groups: %q", got)
		}
	})

	t.Run("the ranking lists by rank, tied values together", func(t *testing.T) {
		b.analyse(t, "A,B\n3,1\n2,3\n5,2\n")
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[any](`{ const s = document.getElementById("rank-order"); s.value = "ranked"; s.dispatchEvent(new Event("change")); } null`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.querySelector("#rank-rows tr td:nth-child(3)")?.textContent === "1"`)
		rows, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](`[...document.querySelectorAll("#rank-rows tr")].map((tr) => [...tr.cells].slice(0, 4).map((c) => c.textContent).join(" "))`))
		if err != nil {
			t.Fatal(err)
		}
		// line, group, value, rank: hand-worked midranks
		want := []string{"2 B 1 1", "3 A 2 2.5", "4 B 2 2.5", "2 A 3 4.5", "3 B 3 4.5", "4 A 5 6"}
		if !slices.Equal(rows, want) {
			t.Errorf("rows by rank %q, want %q", rows, want)
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[any](`{ const s = document.getElementById("rank-order"); s.value = "ranks"; s.dispatchEvent(new Event("change")); } null`)); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("a hostile label stays text", func(t *testing.T) {
		label := `<img src=x onerror=alert(1)>`
		b.analyse(t, label+",B\n1,2\n3,4\n5,6\n")
		images, err := chromedp.Run(b.ctx, chromedp.Evaluate[int](`document.querySelectorAll("main img").length`))
		if err != nil {
			t.Fatal(err)
		}
		if got := b.text(t, "#groups-table tbody td"); got != label || images != 0 {
			t.Errorf("label cell %q with %d images, want the label as text and no image", got, images)
		}
	})

	t.Run("a share link reopens the analysis", func(t *testing.T) {
		data := "Team A,Team B,Team C\n4,5,2\n3,5,1\n4,4,2\n5,5,3\n"
		b.analyse(t, data)
		// a changed setting is analysed again before a link can be made
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`{ const a = document.getElementById("alpha"); a.value = "0.1"; a.dispatchEvent(new Event("change")); } true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done") && !document.getElementById("results").classList.contains("stale")`)
		if err := chromedp.Do(b.ctx, chromedp.Click("#make-link")); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("link-text").value.includes("#r1.")`)
		url, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("link-text").value`))
		if err != nil {
			t.Fatal(err)
		}
		r := open(t, url, b.origin)
		r.waitFor(t, `document.getElementById("decision").textContent.length > 0`)
		want, err := core.Analyze([]byte(data), core.Options{Alpha: 0.1})
		if err != nil {
			t.Fatal(err)
		}
		if got := r.text(t, "#decision"); got != want.Decision {
			t.Errorf("reopened decision:\n%s\nwant:\n%s", got, want.Decision)
		}
		alpha, _ := chromedp.Run(r.ctx, chromedp.Evaluate[string](`document.getElementById("alpha").value`))
		if alpha != "0.1" {
			t.Errorf("alpha restored as %q", alpha)
		}
		// sealed with a passphrase: the reopened page asks for it, refuses a
		// wrong one and stays usable, and opens with the right one
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#link-passphrase", "amber fox"), chromedp.Click("#make-link")); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("link-text").value.includes("#s1.")`)
		sealedURL, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("link-text").value`))
		if strings.Contains(sealedURL, "Team") {
			t.Errorf("the sealed link shows its data: %s", sealedURL)
		}
		// the page seals with Web Crypto; the command line's Go must open it
		_, fragment, _ := strings.Cut(sealedURL, "#")
		raw, err := sealed.Open("#"+fragment, "amber fox")
		if err != nil {
			t.Fatalf("Go cannot open the page's sealed link: %v", err)
		}
		if req, err := core.ParseRequest(raw); err != nil || req.Data != data || req.Alpha != 0.1 {
			t.Errorf("the page's sealed link holds %+v, %v", req, err)
		}
		s := open(t, sealedURL, b.origin)
		s.waitFor(t, `!document.getElementById("unlock").hidden && !document.getElementById("analyse").disabled`)
		if err := chromedp.Do(s.ctx, chromedp.SetValue("#unlock-passphrase", "grey fox"), chromedp.Click("#unlock-open")); err != nil {
			t.Fatal(err)
		}
		s.waitFor(t, `!document.getElementById("problem").hidden`)
		if got := s.text(t, "#problem"); !strings.Contains(got, "passphrase does not open") {
			t.Errorf("a wrong passphrase shows %q", got)
		}
		if err := chromedp.Do(s.ctx, chromedp.SetValue("#unlock-passphrase", "amber fox"), chromedp.Click("#unlock-open")); err != nil {
			t.Fatal(err)
		}
		s.waitFor(t, `document.getElementById("decision").textContent.length > 0`)
		if got := s.text(t, "#decision"); got != want.Decision {
			t.Errorf("the unsealed decision:\n%s\nwant:\n%s", got, want.Decision)
		}

		// and a link sealed by Go opens in the page
		goSealed, err := sealed.Seal(core.Request{Data: data, Options: core.Options{Alpha: 0.1}}.JSON(), "slate owl", rand.Reader)
		if err != nil {
			t.Fatal(err)
		}
		g := open(t, b.origin+"/"+goSealed, b.origin)
		g.waitFor(t, `!document.getElementById("unlock").hidden && !document.getElementById("analyse").disabled`)
		if err := chromedp.Do(g.ctx, chromedp.SetValue("#unlock-passphrase", "slate owl"), chromedp.Click("#unlock-open")); err != nil {
			t.Fatal(err)
		}
		g.waitFor(t, `document.getElementById("decision").textContent.length > 0`)
		if got := g.text(t, "#decision"); got != want.Decision {
			t.Errorf("the Go-sealed link's decision:\n%s\nwant:\n%s", got, want.Decision)
		}

		broken := open(t, b.origin+"#r1.$$$", b.origin)
		broken.waitFor(t, `!document.getElementById("problem").hidden`)
		if got := broken.text(t, "#problem"); !strings.Contains(got, "cannot be opened") {
			t.Errorf("a broken link shows %q", got)
		}
	})

	t.Run("Cancel stops a long Monte Carlo run at once", func(t *testing.T) {
		b.startLongRun(t, string(demo))
		b.waitFor(t, `!document.getElementById("progress").hidden`)
		if err := chromedp.Do(b.ctx, chromedp.Click("#cancel")); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Cancelled") && document.getElementById("progress").hidden`)
		// the restarted worker answers the next request
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#pvalue", "asymptotic"), chromedp.SetValue("#resamples", "100000")); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `!document.getElementById("analyse").disabled`)
		b.analyse(t, string(demo))
		if got := b.text(t, `[data-result="p_method"]`); got != "chi-square approximation" {
			t.Errorf("after Cancel the next analysis shows method %q", got)
		}
	})

	t.Run("a new analysis stops a running one instead of waiting for it", func(t *testing.T) {
		b.startLongRun(t, string(demo))
		if err := chromedp.Do(b.ctx, chromedp.SetValue("#pvalue", "asymptotic"), chromedp.SetValue("#resamples", "100000")); err != nil {
			t.Fatal(err)
		}
		started := time.Now()
		b.analyse(t, string(demo))
		if got := b.text(t, `[data-result="p_method"]`); got != "chi-square approximation" {
			t.Errorf("the new analysis shows method %q", got)
		}
		t.Logf("the new analysis answered %v after the running one was stopped", time.Since(started).Round(time.Millisecond))
	})

	t.Run("what was typed survives a reload until it is cleared", func(t *testing.T) {
		typed := "North,South,East\n3,8,2\n5,6,1\n4,9,3\n"
		b.analyse(t, typed)
		if err := chromedp.Do(b.ctx, chromedp.Reload()); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		got, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("data").value`))
		if err != nil || got != typed {
			t.Errorf("after a reload the data is %q (%v), want %q", got, err, typed)
		}
		if err := chromedp.Do(b.ctx, chromedp.Click("#forget"), chromedp.Reload()); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		got, _ = chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("data").value`))
		if got != string(demo) {
			t.Errorf("after clearing and a reload the data is %q, want the demo", got)
		}
	})

	t.Run("time for 100,000 pasted rows", func(t *testing.T) {
		// the rows are made in the page and pasted as a clipboard event, so
		// that the time is the page's, not the test driver's
		b.paste(t, `const sites = ["North", "South", "East", "West"];
			let text = "site,minutes\n";
			for (let i = 0; i < 100000; i++) text += sites[i % 4] + "," + ((i * 7919) % 240) + "." + (i % 10) + "\n";`)
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		ms := b.number(t, sincePaste)
		inPage, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.documentElement.dataset.analysisMs`))
		t.Logf("100,000 rows: %.0f ms from the paste to rendered results (analysis %s ms: until the answer + rendering; figures for the notes, not pass marks)", ms, inPage)
		if got := b.text(t, `[data-result="df"]`); got != "3" {
			t.Errorf("df shown as %q, want 3", got)
		}
		if got := b.text(t, "#held-note"); !strings.Contains(got, "100,001 lines") {
			t.Errorf("held text note %q, want its line count", got)
		}
		// the next analysis starts from the text box again
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[any](`document.getElementById("held-clear").click(); null`)); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("time to open a 20 MB spreadsheet", func(t *testing.T) {
		// 1,000,000 rows × 4 columns (core/testfiles.BigXLSX): opened, made text, previewed and analysed in the tab
		file := filepath.Join(t.TempDir(), "visits.xlsx")
		data := testfiles.BigXLSX(1_000_000)
		if err := os.WriteFile(file, data, 0o644); err != nil {
			t.Fatal(err)
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.getElementById("status").textContent = ""; window.openedAt = performance.now(); true`)); err != nil {
			t.Fatal(err)
		}
		if err := chromedp.Do(b.ctx, chromedp.SetUploadFiles("#file", []string{file})); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `!document.getElementById("held").hidden`)
		opened, err := chromedp.Run(b.ctx, chromedp.Evaluate[float64](`performance.now() - window.openedAt`))
		if err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		ms, err := chromedp.Run(b.ctx, chromedp.Evaluate[float64](`performance.now() - window.openedAt`))
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("a %.1f MB .xlsx of 1,000,000 rows: its sheet in the tab as text %.0f ms, and analysed with pairs and rendered %.0f ms after choosing the file (figures for the notes, not pass marks)",
			float64(len(data))/(1<<20), opened, ms)
		if got := b.text(t, `[data-result="df"]`); got != "7" {
			t.Errorf("df shown as %q, want 7 (8 sites)", got)
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[any](`document.getElementById("held-clear").click(); null`)); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("module ready time", func(t *testing.T) {
		ms, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.documentElement.dataset.moduleReadyMs`))
		if err != nil || ms == "" {
			t.Fatalf("no ready time recorded: %v", err)
		}
		t.Logf("the module was ready %s ms after its bytes arrived (a figure for the notes, not a pass mark)", ms)
	})

	t.Run("the HTML report holds the decision and keeps labels as text", func(t *testing.T) {
		b.analyse(t, "<i>Ward</i>,B\n1,2\n3,4\n5,6\n")
		html := b.saved(t, "save-html")
		decision := b.text(t, "#decision")
		escaped := strings.NewReplacer("&", "&amp;", "<", "&lt;", ">", "&gt;", `"`, "&quot;", "'", "&#39;").Replace(decision)
		if !strings.Contains(html, escaped) || !strings.Contains(html, "&lt;i&gt;Ward&lt;/i&gt;") || strings.Contains(html, "<i>Ward") || !strings.Contains(html, "<svg") {
			t.Errorf("the report lacks the decision, the escaped label or the pictures:\n%.600s", html)
		}
	})

	t.Run("downloads escape labels for their format", func(t *testing.T) {
		b.analyse(t, "\"=HYPERLINK(\"\"http://x\"\")\",<script>x</script>,\"two\nlines\",![](http://t/p.png)\n1,2,3,4\n5,6,7,8\n9,10,11,12\n")
		groups := b.saved(t, "save-groups")
		if !strings.Contains(groups, `"'=HYPERLINK(""http://x"")"`) || strings.Contains(groups, "\n=HYPERLINK") {
			t.Errorf("the groups CSV does not neutralise the formula label:\n%s", groups)
		}
		md := b.saved(t, "save-markdown")
		if unescaped.MatchString(md) || strings.Contains(md, "two\nlines") || !strings.Contains(md, `\<script\>x\</script\>`) ||
			!strings.Contains(md, `\!\[\](http\://t/p.png)`) || !strings.Contains(md, "two lines") {
			t.Errorf("the Markdown report does not escape the labels:\n%s", md)
		}
		html := b.saved(t, "save-html")
		if !strings.Contains(html, `<meta http-equiv="Content-Security-Policy" content="default-src 'none'`) {
			t.Errorf("the HTML report carries no policy of its own:\n%.400s", html)
		}
	})

	t.Run("a failing module is reported, restarted, and the text kept", func(t *testing.T) {
		typed := "North,South,East\n3,8,2\n5,6,1\n4,9,3\n"
		b.analyse(t, typed)
		// a BigInt in the options of the next analysis makes the worker's
		// JSON.stringify throw, as a fault inside the module would; the
		// patch undoes itself, so the analyses after it are as usual
		inject := `const post = Worker.prototype.postMessage;
			Worker.prototype.postMessage = function (m) {
				if (m && m.kind === "analyze") { Worker.prototype.postMessage = post; m = { ...m, options: { ...m.options, alpha: 1n } }; }
				return post.call(this, m);
			}; true`
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](inject)); err != nil {
			t.Fatal(err)
		}
		b.analyse(t, typed)
		if got := b.text(t, "#problem"); !strings.Contains(got, "The statistics module stopped") {
			t.Errorf("problem %q, want the module's failure", got)
		}
		b.screenshot(t, "midrank-module-failed.png")
		if got, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("data").value`)); got != typed {
			t.Errorf("after the failure the text is %q, want %q", got, typed)
		}
		b.analyse(t, typed)
		if got := b.text(t, "#status"); !strings.HasPrefix(got, "Done") {
			t.Errorf("after the restart the status is %q, want Done", got)
		}
	})

	t.Run("after a page that stopped mid-analysis, the kept text waits for Analyse", func(t *testing.T) {
		typed := "North,South,East\n3,8,2\n5,6,1\n4,9,3\n"
		b.analyse(t, typed)
		// as if the page died during an analysis: the flag outlives the unload
		// (this listener runs after the page's own, which clears it)
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`addEventListener("pagehide", () => localStorage.setItem("midrank.running.v1", "1")); true`)); err != nil {
			t.Fatal(err)
		}
		if err := chromedp.Do(b.ctx, chromedp.Reload()); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Waiting for you")`)
		if got := b.text(t, "#problem"); !strings.Contains(got, "did not finish") {
			t.Errorf("problem %q, want the note that the last analysis did not finish", got)
		}
		b.screenshot(t, "midrank-stopped-before.png")
		if err := chromedp.Do(b.ctx, chromedp.Click("#analyse")); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done") && localStorage.getItem("midrank.running.v1") === null`)
	})

	t.Run("a full storage is said, and the page works on", func(t *testing.T) {
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`window.realSet = Storage.prototype.setItem; Storage.prototype.setItem = () => { throw new DOMException("full", "QuotaExceededError"); }; true`)); err != nil {
			t.Fatal(err)
		}
		b.analyse(t, "A,B,C\n1,2,3\n4,5,6\n7,8,9\n")
		if got := b.text(t, "#kept-note"); !strings.Contains(got, "storage is full") || !strings.HasPrefix(b.text(t, "#status"), "Done") {
			t.Errorf("kept note %q, status %q", got, b.text(t, "#status"))
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`Storage.prototype.setItem = realSet; true`)); err != nil {
			t.Fatal(err)
		}
		b.analyse(t, "A,B,C\n1,2,3\n4,5,6\n7,8,10\n")
		if got := b.text(t, "#kept-note"); !strings.Contains(got, "is kept in this browser") {
			t.Errorf("with storage working again the note says %q", got)
		}
	})

	t.Run("results of a changed text are marked until the new analysis answers", func(t *testing.T) {
		b.analyse(t, "North,South,East\n3,8,2\n5,6,1\n4,9,3\n")
		// Monte Carlo is not rerun as one types, so the change stays unanalysed
		change := `{ const p = document.getElementById("pvalue"); p.value = "monte-carlo"; p.dispatchEvent(new Event("change"));
			const d = document.getElementById("data"); d.value = "North,South,East\n1,8,2\n5,6,1\n4,9,3\n"; d.dispatchEvent(new Event("input")); } true`
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](change)); err != nil {
			t.Fatal(err)
		}
		stale := `document.getElementById("results").classList.contains("stale") && !document.getElementById("stale-note").hidden &&
			document.getElementById("save-html").closest("[inert]") !== null && document.getElementById("copy-decision").closest("[inert]") !== null`
		if ok, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](stale)); err != nil || !ok {
			t.Errorf("after a change the results are not marked out of date (%v)", err)
		}
		b.screenshot(t, "midrank-stale.png")
		if err := chromedp.Do(b.ctx, chromedp.Click("#analyse")); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done") && !document.getElementById("results").classList.contains("stale")`)
		if ok, _ := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`document.querySelector("#results [inert]") === null`)); !ok {
			t.Error("the new results are still inert")
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`{ const p = document.getElementById("pvalue"); p.value = "auto"; p.dispatchEvent(new Event("change")); } true`)); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("a medium-sized text is analysed after a pause in typing", func(t *testing.T) {
		// 40,000 characters: above the size analysed at every keystroke, below the size held out of the box
		fill := `{ const rows = ["site,minutes"]; for (let i = 0; rows.join("\n").length < 40000; i++) rows.push("S" + (i % 3) + "," + (i % 17));
			const d = document.getElementById("data"); d.value = rows.join("\n") + "\n"; d.dispatchEvent(new Event("input")); } true`
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](fill)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done") && !document.getElementById("results").classList.contains("stale") && document.getElementById("decision").textContent.includes("S0, S1 and S2")`)
	})

	t.Run("a link put into the address of an open tab is opened", func(t *testing.T) {
		data := "Team A,Team B,Team C\n4,5,2\n3,5,1\n4,4,2\n5,5,3\n"
		fragment, err := core.ShareLink([]byte(data), core.Options{})
		if err != nil {
			t.Fatal(err)
		}
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`location.hash = "`+fragment+`"; true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("data").value.startsWith("Team A") && document.getElementById("status").textContent.startsWith("Done")`)
		if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](`location.hash = "#r2.abc"; true`)); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("problem").textContent.includes('format "r2"')`)
	})

	t.Run("fits 360 px and keeps text contrast at 4.5:1, light and dark", func(t *testing.T) {
		// the demo, and a table of counts (R's esoph), whose groups are shown level by level too
		counts, err := os.ReadFile("../../testdata/counts/esoph_counts.csv")
		if err != nil {
			t.Fatal(err)
		}
		for _, data := range []string{string(counts), string(demo)} {
			b.analyse(t, data)
			fitsAndReads(t, b)
		}
	})

	t.Run("nothing is requested from another origin", func(t *testing.T) {
		b.checkRequests(t)
	})
}

// TestBlockedLoadIsSeen: a fetch the security policy blocks never appears
// as a network event; the console check must still catch it.
func TestBlockedLoadIsSeen(t *testing.T) {
	b := start(t)
	b.smokeTest(t)
	if _, err := chromedp.Run(b.ctx, chromedp.Evaluate[any](`fetch("http://192.0.2.1/probe").catch(() => 0); null`)); err != nil {
		t.Fatal(err)
	}
	deadline := time.Now().Add(10 * time.Second)
	for time.Now().Before(deadline) {
		_, console := b.snapshot()
		for _, m := range console {
			if strings.Contains(m, "Content Security Policy") && strings.Contains(m, "192.0.2.1") {
				return
			}
		}
		time.Sleep(100 * time.Millisecond)
	}
	_, console := b.snapshot()
	t.Errorf("the blocked fetch left no console message; console: %q", console)
}

// TestOfflineFile opens the single-file build from disk with the network
// switched off and analyses the demo: the same decision and H as the core.
func TestOfflineFile(t *testing.T) {
	path := filepath.Join(site(t), sitebuild.OfflineName)
	b := open(t, "about:blank", "file://")
	offline := chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := cdp.Call(ctx, tg, network.EmulateNetworkConditionsByRule, network.EmulateNetworkConditionsByRuleParams{
			MatchedNetworkConditions: []*network.Conditions{{Offline: true, DownloadThroughput: -1, UploadThroughput: -1}}})
		return err
	})
	if err := chromedp.Do(b.ctx, offline, chromedp.Navigate("file://"+path)); err != nil {
		t.Fatal(err)
	}
	b.smokeTest(t)
	requests, _ := b.snapshot()
	var kept []string
	for _, u := range requests {
		if u != "about:blank" {
			kept = append(kept, u)
		}
	}
	b.requests = kept
	b.checkRequests(t)
}

// fitsAndReads checks that the page as it stands fits 360 px and keeps
// text contrast at 4.5:1, light and dark.
func fitsAndReads(t *testing.T, b *browser) {
	t.Helper()
	// contrast is the WCAG 2 ratio of each visible text element's colour
	// and the first opaque background behind it
	check := `(() => {
		const rgb = (c) => c.match(/[\d.]+/g).map(Number);
		const lum = ([r, g, b]) => [r, g, b].map((v) => { v /= 255; return v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4; })
			.reduce((s, v, i) => s + v * [0.2126, 0.7152, 0.0722][i], 0);
		const back = (el) => { for (; el; el = el.parentElement) { const c = getComputedStyle(el).backgroundColor; if (rgb(c)[3] !== 0 && c !== "rgba(0, 0, 0, 0)") return c; } return "rgb(255, 255, 255)"; };
		const worst = [];
		for (const el of document.querySelectorAll("main *, .masthead *, .colophon *")) {
			if (!el.checkVisibility() || el.disabled || ![...el.childNodes].some((n) => n.nodeType === 3 && n.textContent.trim())) continue;
			const a = lum(rgb(getComputedStyle(el).color)), b = lum(rgb(back(el)));
			const ratio = (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
			if (ratio < 4.5) worst.push(el.tagName + "." + el.className + " " + ratio.toFixed(2) + " " + el.textContent.slice(0, 30));
		}
		return worst.concat(document.scrollingElement.scrollWidth > innerWidth ? ["page scrolls sideways: " + document.scrollingElement.scrollWidth] : []);
	})()`
	for _, scheme := range []string{"light", "dark"} {
		media := chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{
				Features: []*emulation.MediaFeature{{Name: "prefers-color-scheme", Value: scheme}}})
			return err
		})
		if err := chromedp.Do(b.ctx, media, chromedp.EmulateViewport(360, 800)); err != nil {
			t.Fatal(err)
		}
		problems, err := chromedp.Run(b.ctx, chromedp.Evaluate[[]string](check))
		if err != nil {
			t.Fatal(err)
		}
		if len(problems) > 0 {
			t.Errorf("%s at 360 px: %d problems, e.g. %q", scheme, len(problems), problems[:min(5, len(problems))])
		}
	}
	if err := chromedp.Do(b.ctx, chromedp.EmulateViewport(1200, 900)); err != nil {
		t.Fatal(err)
	}
}
