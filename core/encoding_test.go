package core

import (
	"math"
	"os"
	"strings"
	"testing"

	"midrank/core/testfiles"
	"midrank/core/textenc"
)

// TestTextFileEncodings: R's chickwts (testdata/protect, written by
// tools/reference/protect.R) saved as spreadsheets save text — UTF-16LE
// with its mark and tabs ("Unicode text"), and Windows-1252 with semicolons
// — with one feed renamed to a label with accents, is read as the UTF-8
// file is: the same groups and H, and the reading says the encoding.
func TestTextFileEncodings(t *testing.T) {
	text, utf16le, cp1252, err := testfiles.Exports(os.DirFS("../testdata"))
	if err != nil {
		t.Fatal(err)
	}
	want, err := Analyze(text, Options{})
	if err != nil {
		t.Fatal(err)
	}
	// R 4.2.2: kruskal.test(weight ~ feed, data = chickwts)$statistic
	if math.Abs(want.H-37.342717694256208) > 1e-12 {
		t.Fatalf("chickwts: H = %.17g, R 37.342717694256208", want.H)
	}
	for _, c := range []struct {
		name string
		data []byte
		enc  textenc.Encoding
	}{{"UTF-16LE", utf16le, textenc.UTF16LE}, {"Windows-1252", cp1252, textenc.Windows1252}} {
		r, err := Analyze(c.data, Options{})
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if r.H != want.H || len(r.Groups) != len(want.Groups) || r.Groups[1].Label != testfiles.AccentedFeed {
			t.Errorf("%s: H %v, groups %v; want H %v, the label with its accents", c.name, r.H, r.Groups, want.H)
		}
		if r.Input.Encoding != string(c.enc) || !strings.Contains(r.Input.Reason, string(c.enc)) {
			t.Errorf("%s: read as %q: %s", c.name, r.Input.Encoding, r.Input.Reason)
		}
	}
	if want.Input.Encoding != "UTF-8" || strings.Contains(want.Input.Reason, "UTF-8") {
		t.Errorf("UTF-8: %q, %s", want.Input.Encoding, want.Input.Reason)
	}
}
