package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
	"testing/iotest"

	"midrank/core"
	"midrank/core/findings"
	"midrank/core/link"
	"midrank/core/sealed"
	"midrank/core/tables"
	"midrank/core/testfiles"
)

// flagsOf turns a case's options JSON into flags: the flags carry the
// request keys' names.
func flagsOf(t *testing.T, path string) []string {
	if path == "" {
		return nil
	}
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var m map[string]any
	if err := json.Unmarshal(b, &m); err != nil {
		t.Fatal(err)
	}
	var flags []string
	for k, v := range m {
		switch v := v.(type) {
		case []any: // a list option is a repeated flag
			for _, item := range v {
				flags = append(flags, fmt.Sprintf("--%s=%v", k, item))
			}
		case map[string]any:
			for from, to := range v {
				flags = append(flags, fmt.Sprintf("--%s=%s=%v", k, from, to))
			}
		default:
			flags = append(flags, fmt.Sprintf("--%s=%v", k, v))
		}
	}
	name := func(flag string) string { n, _, _ := strings.Cut(flag, "="); return n }
	slices.SortStableFunc(flags, func(a, b string) int { return strings.Compare(name(a), name(b)) }) // repeated flags keep their order
	return flags
}

// TestJSONMatchesGolden: --json prints byte for byte the answer the core
// pins in testdata/cases (which the module must give too), with exit
// status 0 for an analysis, 1 for data that cannot be analysed and 2 for a
// setting that cannot be used.
func TestJSONMatchesGolden(t *testing.T) {
	const dir = "../../testdata/cases"
	cases, err := testfiles.Cases(os.DirFS(dir))
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range cases {
		var stdout, stderr bytes.Buffer
		options := ""
		if c.Options != "" {
			options = filepath.Join(dir, c.Options)
		}
		args := append(append([]string{"--json"}, flagsOf(t, options)...), filepath.Join(dir, c.Input))
		code := run(args, nil, &stdout, &stderr)
		want, err := os.ReadFile(filepath.Join(dir, c.Golden))
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(stdout.Bytes(), want) {
			t.Errorf("%s: midrank %s printed\n%.300s\nwant\n%.300s", c.Name, strings.Join(args, " "), stdout.Bytes(), want)
		}
		wantCode := exitOK
		switch {
		case strings.HasPrefix(c.Name, "error_option"):
			wantCode = exitSettings
		case strings.HasPrefix(c.Name, "error_"):
			wantCode = exitData
		}
		if code != wantCode || (code != exitOK) != (stderr.Len() > 0) {
			t.Errorf("%s: exit %d with stderr %q, want exit %d", c.Name, code, stderr.String(), wantCode)
		}
	}
}

func TestExitStatus(t *testing.T) {
	const data = "A,B,C\n1,2,3\n4,5,6\n"
	const battery = "site,wait,stay\nA,3,1\nA,4,2\nB,8,2\nB,9,3\nC,1,5\nC,2,4\n"
	tests := []struct {
		args   []string
		stdin  string
		code   int
		stdout string // a piece of what standard output must hold
		stderr string // a piece of what standard error must hold
	}{
		{[]string{"-"}, data, exitOK, "In plain words", ""},
		{[]string{"--ranks", "-"}, data, exitOK, "Every value with its rank", ""},
		{[]string{"--alpha", "1.5", "-"}, data, exitSettings, "", "strictly between 0 and 1"},
		{[]string{"--json", "--alpha", "1.5", "-"}, data, exitSettings, `"option":"alpha"`, "alpha"},
		{[]string{"--json", "--alpha", "high", "-"}, data, exitSettings, `"option":"alpha"`, `alpha "high"`},
		{[]string{"--alpha", "0", "-"}, data, exitSettings, "", "strictly between 0 and 1"},
		{[]string{"--alpha", "-0", "-"}, data, exitSettings, "", "strictly between 0 and 1"},
		{[]string{"--alpha", "0x1p-4", "-"}, data, exitSettings, "", "decimal number"},
		{[]string{"--resamples", "0", "-"}, data, exitSettings, "", "from 1 to"},
		{[]string{"--seed", "", "-"}, data, exitSettings, "", "whole number"},
		{[]string{"--link", "--passphrase", "", "-"}, data, exitSettings, "", "--passphrase is empty"},
		{[]string{"--open", "-"}, "#r2.abc", exitData, "", "cannot be opened"},
		{[]string{"--open", "@/nonexistent/link.txt"}, "", exitData, "", "cannot read the link"},
		{[]string{"--posthoc", "conover", "--adjust", "bh", "-"}, data, exitOK, "Pairs of groups", ""},
		{[]string{"--json", "--pvalue", "monte-carlo", "--resamples", "2000", "--seed", "9", "-"}, data, exitOK, `"resamples":2000,"seed":9`, ""},
		{[]string{"--pvalue", "exact", "-"}, wideUntied(4, 15), exitSettings, "", "beyond the budget"},
		{[]string{"--pvalue", "exact", "-"}, wideUntied(4, 15), exitSettings, "", "; choose monte-carlo or auto"},
		{[]string{"--json", "--pvalue", "exact", "-"}, wideUntied(4, 15), exitSettings, `"option":"pvalue","reason":"the exact distribution for groups of 15, 15, 15 and 15 is beyond the budget`, ""},
		{[]string{"--json", "--pvalue", "exact", "-"}, wideUntied(4, 15), exitSettings, `"instead":["monte-carlo","auto"]`, ""},
		{[]string{"--seed", "9007199254740992", "-"}, data, exitSettings, "", "from 0 to 9007199254740991"},
		{[]string{"--resamples", "-5", "-"}, data, exitSettings, "", "from 1 to"},
		{[]string{"--posthoc", "tukey", "-"}, data, exitSettings, "", "choose one of"},
		{[]string{"--seed", "x", "-"}, data, exitSettings, "", "whole number"},
		{[]string{"--layout", "diagonal", "-"}, data, exitSettings, "", "auto, wide, long or counts"},
		{[]string{"--nonsense", "-"}, data, exitSettings, "", "flag provided but not defined"},
		{[]string{}, data, exitSettings, "", "give one input file"},
		{[]string{"/nonexistent/file.csv"}, "", exitData, "", "cannot read the input"},
		{[]string{"--json", "-"}, "A,B\n1,x\n", exitData, `"line":2,"column":2`, "line 2, column 2"},
		{[]string{"-h"}, "", exitOK, "usage: midrank", ""},
		// several measures: the overview first, each measure's p adjusted across them
		{[]string{"--group", "site", "--measure", "wait", "--measure", "stay", "-"}, battery, exitOK, "Measures at a glance", ""},
		{[]string{"--json", "--group", "site", "--measure", "all", "--adjust-across", "holm", "-"}, battery, exitOK, `"adjust_across":"holm","summary":"2 measures compared`, ""},
		{[]string{"--json", "--group", "site", "--measure", "all", "--adjust-across", "holm", "-"}, battery, exitOK, `"measures":[{"measure":"wait","p_adjusted_across":`, ""},
		{[]string{"--group", "site", "--measure", "all", "--adjust-across", "bonferroni", "-"}, battery, exitSettings, "", "choose bh"},
		// small groups protected, and what a link carries
		{[]string{"--min-group-size", "3", "-"}, "A,B,C\n1,2,3\n4,5,6\n7,8,9\n", exitOK, "Small groups protected (fewer than 3 values): no group", ""},
		{[]string{"--min-group-size", "4", "-"}, "A,B,C\n1,2,3\n4,5,6\n7,8,9\n", exitOK, "< 4", ""},
		{[]string{"--min-group-size", "-1", "-"}, data, exitSettings, "", "from 0 (no protection)"},
		{[]string{"--json", "--min-group-size", "4", "-"}, data, exitOK, `{"findings":1,`, ""},
		{[]string{"--ranks", "--min-group-size", "4", "-"}, data, exitSettings, "", "--ranks lists every value"},
		{[]string{"--share", "results", "-"}, data, exitSettings, "", "add --link"},
		{[]string{"--link", "--share", "everything", "-"}, data, exitSettings, "", "choose data"},
		{[]string{"--link", "--share", "results", "-"}, data, exitOK, "#f1.", ""},
		{[]string{"--link", "--share", "results", "--group", "site", "--measure", "all", "-"}, battery, exitSettings, "", "one measure's results"},
		{[]string{"--min-group-size", "3", "--group", "site", "--measure", "all", "-"}, battery, exitOK, "Small groups protected: “A”, “B” and “C” have fewer than 3 values (every", ""},
		{[]string{"--json", "--min-group-size", "3", "--group", "site", "--measure", "all", "-"}, battery, exitOK, `"overview":{"title":"Measures at a glance"`, ""},
		{[]string{"--open", "-"}, "#f1.q1ZKSSxJVLJS8kgsSsovLdIJyixLLSrOTEnlMjTSMTLkMrTQMTblUtJRSswpyAAqNNAzMKwFAA", exitData, "", "results only"},
	}
	for _, tt := range tests {
		var stdout, stderr bytes.Buffer
		code := run(tt.args, strings.NewReader(tt.stdin), &stdout, &stderr)
		if code != tt.code || !strings.Contains(stdout.String(), tt.stdout) || !strings.Contains(stderr.String(), tt.stderr) {
			t.Errorf("midrank %v: exit %d\nstdout %.200q\nstderr %q\nwant exit %d, stdout with %q, stderr with %q",
				tt.args, code, stdout.String(), stderr.String(), tt.code, tt.stdout, tt.stderr)
		}
	}
}

// TestOpenLinkFromInput: a link too long for a command line is read from
// standard input (--open -) or a file (--open @FILE).
func TestOpenLinkFromInput(t *testing.T) {
	const data = "A,B,C\n1,2,3\n4,5,6\n"
	var made, stderr bytes.Buffer
	if code := run([]string{"--link", "--alpha", "0.1", "-"}, strings.NewReader(data), &made, &stderr); code != exitOK {
		t.Fatalf("--link: exit %d, %s", code, stderr.String())
	}
	file := t.TempDir() + "/link.txt"
	if err := os.WriteFile(file, made.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, args := range [][]string{{"--json", "--open", "-"}, {"--json", "--open", "@" + file}} {
		var stdout bytes.Buffer
		code := run(args, bytes.NewReader(made.Bytes()), &stdout, &stderr)
		if code != exitOK || !strings.Contains(stdout.String(), `"alpha":0.1`) || !strings.Contains(stdout.String(), `"n":6`) {
			t.Errorf("midrank %v: exit %d, %.200s %s", args, code, stdout.String(), stderr.String())
		}
	}
}

func TestWrap(t *testing.T) {
	got := wrap("It gives H = 7.988 and p = 0.0184 here.", 16, "")
	for _, line := range strings.Split(got, "\n") {
		if strings.HasSuffix(line, " =") || strings.HasPrefix(line, "=") || strings.HasSuffix(line, " p") {
			t.Errorf("wrap broke around '=': %q", got)
		}
	}
}

// wideUntied writes k groups of n distinct values in the wide layout.
func wideUntied(k, n int) string {
	var b strings.Builder
	for g := range k {
		if g > 0 {
			b.WriteString(",")
		}
		fmt.Fprintf(&b, "g%d", g+1)
	}
	b.WriteString("\n")
	for i := range n {
		for g := range k {
			if g > 0 {
				b.WriteString(",")
			}
			fmt.Fprintf(&b, "%d", i*k+g)
		}
		b.WriteString("\n")
	}
	return b.String()
}

// TestLinkRoundTrip: --link prints a link that --open analyses to the same
// JSON, for one measure and for several.
func TestLinkRoundTrip(t *testing.T) {
	for _, tt := range []struct {
		data     string
		settings []string
	}{
		{"A,B,C\n1,2,3\n4,5,6\n7,8,9\n", []string{"--alpha", "0.1", "--posthoc", "dscf"}},
		{"site,wait,stay\nA,3,1\nA,4,2\nB,8,2\nB,9,3\nC,1,5\nC,2,4\n", []string{"--group", "site", "--measure", "all", "--adjust-across", "holm"}},
	} {
		var link, direct, reopened, stderr bytes.Buffer
		if code := run(append(append([]string{"--link", "--link-base", "http://intranet/midrank/"}, tt.settings...), "-"), strings.NewReader(tt.data), &link, &stderr); code != exitOK {
			t.Fatalf("--link: exit %d: %s", code, stderr.String())
		}
		if !strings.HasPrefix(link.String(), "http://intranet/midrank/#r1.") {
			t.Fatalf("link %q", link.String())
		}
		run(append(append([]string{"--json"}, tt.settings...), "-"), strings.NewReader(tt.data), &direct, &stderr)
		if code := run([]string{"--json", "--open", strings.TrimSpace(link.String())}, nil, &reopened, &stderr); code != exitOK {
			t.Fatalf("--open: exit %d: %s", code, stderr.String())
		}
		if direct.String() != reopened.String() || direct.Len() == 0 {
			t.Errorf("%v: the reopened link analyses differently:\n%.200s\n%.200s", tt.settings, direct.String(), reopened.String())
		}
	}
	var out, stderr bytes.Buffer
	if code := run([]string{"--open", "#r1.$$$"}, nil, &out, &stderr); code != exitData || !strings.Contains(stderr.String(), "cannot be opened") {
		t.Errorf("a broken link: exit %d, %q", code, stderr.String())
	}
}

// TestResultsLink: --link --share results carries the results as shared
// (package findings), plain or sealed, and nothing of the data.
func TestResultsLink(t *testing.T) {
	// groups of 4: medians and quartiles interpolate; no difference of two
	// values is a value
	const data = "A,B,C\n101.17,202.53,303.71\n104.59,205.23,306.37\n107.73,208.61,309.29\n110.31,211.97,312.43\n"
	for _, extra := range [][]string{nil, {"--passphrase", "blue kite"}} {
		var out, stderr bytes.Buffer
		if code := run(append([]string{"--link", "--share", "results", "--min-group-size", "2"}, append(extra, "-")...), strings.NewReader(data), &out, &stderr); code != exitOK {
			t.Fatalf("%v: exit %d: %s", extra, code, stderr.String())
		}
		fragment := strings.TrimSpace(out.String())
		var raw []byte
		var err error
		if extra == nil {
			raw, err = link.Decode(fragment)
		} else {
			raw, err = sealed.Open(fragment, "blue kite")
		}
		if err != nil {
			t.Fatalf("%v: %v", extra, err)
		}
		if _, err := findings.Open(raw); err != nil || !link.CarriesResults(raw) {
			t.Fatalf("%v: %v", extra, err)
		}
		for _, v := range strings.FieldsFunc(data[6:], func(r rune) bool { return r == ',' || r == '\n' }) {
			if strings.Contains(string(raw), v) {
				t.Errorf("%v: the results link holds the value %s", extra, v)
			}
		}
		stderr.Reset()
		args := []string{"--open", fragment}
		if extra != nil {
			args = append(args, extra...)
		}
		if code := run(args, nil, &out, &stderr); code != exitData || !strings.Contains(stderr.String(), "results only") {
			t.Errorf("%v: --open of a results link: exit %d, %q", extra, code, stderr.String())
		}
	}
}

func TestSealedLink(t *testing.T) {
	const data = "A,B\n1,2\n3,4\n5,6\n"
	var link, out, stderr bytes.Buffer
	if code := run([]string{"--link", "--passphrase", "blue kite", "-"}, strings.NewReader(data), &link, &stderr); code != exitOK || !strings.HasPrefix(link.String(), "#s1.") {
		t.Fatalf("--link --passphrase: exit %d, %q, %s", code, link.String(), stderr.String())
	}
	if code := run([]string{"--json", "--open", strings.TrimSpace(link.String()), "--passphrase", "blue kite"}, nil, &out, &stderr); code != exitOK || !strings.Contains(out.String(), `"n":6`) {
		t.Errorf("--open with the passphrase: exit %d, %.100s", code, out.String())
	}
	stderr.Reset()
	if code := run([]string{"--open", strings.TrimSpace(link.String()), "--passphrase", "red kite"}, nil, &out, &stderr); code != exitData || !strings.Contains(stderr.String(), "passphrase does not open") {
		t.Errorf("--open with a wrong passphrase: exit %d, %q", code, stderr.String())
	}
}

// TestTextShowsEveryColumn: the text report walks the core's tables, so
// every column of their definition is there, with each cell as the core
// shows it (R's PlantGrowth, as the golden case writes it).
func TestTextShowsEveryColumn(t *testing.T) {
	data, err := os.ReadFile("../../testdata/cases/plantgrowth_long.csv")
	if err != nil {
		t.Fatal(err)
	}
	var out, stderr bytes.Buffer
	if code := run([]string{"-"}, bytes.NewReader(data), &out, &stderr); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	r, err := core.Analyze(data, core.Options{})
	if err != nil {
		t.Fatal(err)
	}
	text := out.String()
	for _, tab := range tables.Of(r) {
		for i, c := range tab.Columns {
			if !strings.Contains(text, c.Heading) {
				t.Errorf("%s: column %q is not in the text", tab.Name, c.Heading)
			}
			for _, row := range tab.Rows {
				if !strings.Contains(text, row[i].Text) {
					t.Errorf("%s: cell %q of %q is not in the text", tab.Name, row[i].Text, c.Heading)
				}
			}
		}
	}
}

// TestReadInput: a file read into a buffer of its size, standard input
// growing from a byte at a time, an empty file, and a failing reader.
func TestReadInput(t *testing.T) {
	text := strings.Repeat("North,12.5\nSouth,7\n", 1000) // 19,000 bytes: more than the first 4,096 of standard input
	file := filepath.Join(t.TempDir(), "data.csv")
	empty := filepath.Join(t.TempDir(), "empty.csv")
	if err := os.WriteFile(file, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(empty, nil, 0o644); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name  string
		stdin io.Reader
		want  string
	}{
		{file, nil, text},
		{"-", iotest.OneByteReader(strings.NewReader(text)), text},
		{empty, nil, ""},
	} {
		got, err := readInput(c.name, c.stdin)
		if err != nil || string(got) != c.want {
			t.Errorf("%s: %d bytes (%v), want %d", c.name, len(got), err, len(c.want))
		}
	}
	if _, err := readInput("-", iotest.ErrReader(errors.New("disk gone"))); err == nil || !strings.Contains(err.Error(), "cannot read the input: disk gone") {
		t.Errorf("a failing reader: %v", err)
	}
}
