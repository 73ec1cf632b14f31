package core

import (
	"bytes"
	"encoding/json"
	"flag"
	"os"
	"path/filepath"
	"testing"

	"midrank/core/testfiles"
)

// casesDir holds the example cases (see package testfiles).
const casesDir = "../testdata/cases"

var update = flag.Bool("update", false, "rewrite the expected answers in testdata/cases")

// answer is what the command line's --json and the module return for a case.
func answer(data, options []byte) []byte {
	opt, err := DecodeOptions(options)
	if err != nil {
		return EncodeError(err)
	}
	r, err := Analyze(data, opt)
	if err != nil {
		return EncodeError(err)
	}
	b, err := Encode(r)
	if err != nil {
		return EncodeError(err)
	}
	return b
}

// TestGolden pins the complete JSON answer of every case in testdata/cases.
// Its figures are checked against R and scipy in TestAgainstReferences; this
// test keeps every other byte from changing unnoticed.
func TestGolden(t *testing.T) {
	cases, err := testfiles.Cases(os.DirFS(casesDir))
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range cases {
		data, err := os.ReadFile(filepath.Join(casesDir, c.Input))
		if err != nil {
			t.Fatal(err)
		}
		var options []byte
		if c.Options != "" {
			if options, err = os.ReadFile(filepath.Join(casesDir, c.Options)); err != nil {
				t.Fatal(err)
			}
		}
		got := answer(data, options)
		if *update {
			if err := os.WriteFile(filepath.Join(casesDir, c.Golden), got, 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		want, err := os.ReadFile(filepath.Join(casesDir, c.Golden))
		if err != nil {
			t.Fatalf("%s: %v (go test ./core -update writes it)", c.Name, err)
		}
		if !bytes.Equal(got, want) {
			t.Errorf("%s: answer differs from %s (go test ./core -update rewrites it)\ngot:  %.300s\nwant: %.300s", c.Name, c.Golden, got, want)
		}
	}
}

// TestDemoIsACase keeps the page's invented demo data among the cases.
func TestDemoIsACase(t *testing.T) {
	site, err := os.ReadFile("../site/demo.tsv")
	if err != nil {
		t.Fatal(err)
	}
	c, err := os.ReadFile("../testdata/cases/clinic_demo_invented.tsv")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(site, c) {
		t.Error("site/demo.tsv and testdata/cases/clinic_demo_invented.tsv differ; copy one over the other")
	}
}

// stdJSON is what encoding/json writes for v, HTML escaping off, as the
// hand-written encoders promise to match.
func stdJSON(t *testing.T, v any) []byte {
	t.Helper()
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetEscapeHTML(false)
	if err := enc.Encode(v); err != nil {
		t.Fatal(err)
	}
	return b.Bytes()
}

// TestEncodeMatchesStructTags: the hand-written encoder gives exactly what
// encoding/json gives for Result's json tags (HTML escaping off), for every
// case, so the tags stay the documentation of the format.
func TestEncodeMatchesStructTags(t *testing.T) {
	cases, err := testfiles.Cases(os.DirFS(casesDir))
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range cases {
		data, _ := os.ReadFile(filepath.Join(casesDir, c.Input))
		var options []byte
		if c.Options != "" {
			options, _ = os.ReadFile(filepath.Join(casesDir, c.Options))
		}
		opt, err := DecodeOptions(options)
		var r *Result
		if err == nil {
			r, err = Analyze(data, opt)
		}
		if err != nil {
			if got, want := EncodeError(err), stdJSON(t, ErrorBody{Detail(err)}); !bytes.Equal(got, want) {
				t.Errorf("%s: EncodeError differs from encoding/json:\n%s\n%s", c.Name, got, want)
			}
			continue
		}
		if got, _ := Encode(r); !bytes.Equal(got, stdJSON(t, r)) {
			t.Errorf("%s: Encode differs from encoding/json", c.Name)
		}
		p := r.Page(ListRanks, 1, 3)
		if got, err := EncodePage(p); err != nil || !bytes.Equal(got, stdJSON(t, p)) {
			t.Errorf("%s: EncodePage = %s, %v; encoding/json %s", c.Name, got, err, stdJSON(t, p))
		}
	}
}
