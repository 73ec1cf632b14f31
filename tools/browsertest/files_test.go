package browsertest

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
	"unicode/utf16"

	"github.com/chromedp/chromedp"
)

// TestTextFileEncodings: R's chickwts saved as spreadsheets save text —
// UTF-16LE with its mark and tabs ("Unicode text"), Windows-1252 with
// semicolons — with one feed renamed to a label with accents, opens with
// the label whole, and the page says how the file was read.
func TestTextFileEncodings(t *testing.T) {
	raw, err := os.ReadFile("../../testdata/protect/chickwts.csv")
	if err != nil {
		t.Fatal(err)
	}
	text := strings.ReplaceAll(strings.ReplaceAll(string(raw), `"`, ""), "linseed", "graine de lin à Zürich")
	utf16le := []byte{0xFF, 0xFE}
	for _, u := range utf16.Encode([]rune(strings.ReplaceAll(text, ",", "\t"))) {
		utf16le = append(utf16le, byte(u), byte(u>>8))
	}
	var cp1252 []byte
	for _, r := range strings.ReplaceAll(text, ",", ";") {
		cp1252 = append(cp1252, byte(r)) // à and ü are their code points in Windows-1252
	}
	b := start(t)
	b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
	for _, c := range []struct {
		name, encoding string
		data           []byte
	}{{"unicode.txt", "UTF-16LE", utf16le}, {"windows.csv", "Windows-1252", cp1252}, {"plain.csv", "", []byte(text)}} {
		file := filepath.Join(t.TempDir(), c.name)
		if err := os.WriteFile(file, c.data, 0o644); err != nil {
			t.Fatal(err)
		}
		b.number(t, `document.getElementById("file").value = ""; document.getElementById("status").textContent = ""; 0`)
		if err := chromedp.Do(b.ctx, chromedp.SetUploadFiles("#file", []string{file})); err != nil {
			t.Fatal(err)
		}
		b.waitFor(t, `document.getElementById("status").textContent.startsWith("Done")`)
		if groups := b.text(t, "#groups-table"); !strings.Contains(groups, "graine de lin à Zürich") {
			t.Errorf("%s: the label with accents is not whole: %.300s", c.name, groups)
		}
		note, _ := chromedp.Run(b.ctx, chromedp.Evaluate[string](`document.getElementById("file-note").hidden ? "" : document.getElementById("file-note").textContent`))
		if said := strings.Contains(note, c.name+": the file is") && strings.Contains(note, c.encoding); c.encoding != "" && !said || c.encoding == "" && note != "" {
			t.Errorf("%s: the page says %q of how it was read", c.name, note)
		}
	}
}
