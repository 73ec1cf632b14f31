package browsertest

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"

	"midrank/core/testfiles"
)

// TestTextFileEncodings: R's chickwts saved as spreadsheets save text —
// UTF-16LE with its mark and tabs ("Unicode text"), Windows-1252 with
// semicolons — with one feed renamed to a label with accents, opens with
// the label whole, and the page says how the file was read.
func TestTextFileEncodings(t *testing.T) {
	text, utf16le, cp1252, err := testfiles.Exports(os.DirFS("../../testdata"))
	if err != nil {
		t.Fatal(err)
	}
	b := start(t)
	b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
	for _, c := range []struct {
		name, encoding string
		data           []byte
	}{{"unicode.txt", "UTF-16LE", utf16le}, {"windows.csv", "Windows-1252", cp1252}, {"plain.csv", "", text}} {
		file := filepath.Join(t.TempDir(), c.name)
		if err := os.WriteFile(file, c.data, 0o644); err != nil {
			t.Fatal(err)
		}
		b.number(t, `document.getElementById("file").value = ""; document.getElementById("status").textContent = ""; 0`)
		if err := chromedp.Do(b.ctx, chromedp.SetUploadFiles("#file", []string{file})); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		if groups := b.text(t, "#groups-table"); !strings.Contains(groups, testfiles.AccentedFeed) {
			t.Errorf("%s: the label with accents is not whole: %.300s", c.name, groups)
		}
		note, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("file-note").hidden ? "" : document.getElementById("file-note").textContent`))
		if said := strings.Contains(note, c.name+": the file is") && strings.Contains(note, c.encoding); c.encoding != "" && !said || c.encoding == "" && note != "" {
			t.Errorf("%s: the page says %q of how it was read", c.name, note)
		}
	}
}
