package main

import (
	"context"
	"crypto/rand"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"os/signal"
	"slices"
	"strconv"
	"strings"

	"midrank/core"
	"midrank/core/findings"
	"midrank/core/link"
	"midrank/core/protect"
	"midrank/core/sealed"
	"midrank/core/table"
)

// Exit statuses.
const (
	exitOK       = 0 // analysed
	exitData     = 1 // the data cannot be analysed
	exitSettings = 2 // bad flags or values
	exitInternal = 3 // a fault of midrank itself
)

const usage = `usage: midrank [flags] FILE
Compares three or more independent groups with the Kruskal–Wallis H test.
FILE is delimited text in the wide layout (one column per group, labels in
the first line) or the long layout (one row per value: a column of group
labels or codes and a column of values, chosen with --group and --measure
or by the reading, which says why); - reads standard input.

flags:
`

// run is the whole command line; main only passes the process's streams.
func run(args []string, stdin io.Reader, stdout, stderr io.Writer) (code int) {
	defer func() {
		if p := recover(); p != nil {
			fmt.Fprintf(stderr, "midrank: internal error: %v; please report it, with the input and flags that caused it\n", p)
			code = exitInternal
		}
	}()
	fs := flag.NewFlagSet("midrank", flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	var opt core.Options
	// badValue keeps the last flag value refused, whose error the flag
	// package flattens into text: the JSON error names the option.
	var badValue *core.OptionError
	refuse := func(option, value, reason string) error {
		badValue = &core.OptionError{Option: option, Value: value, Reason: reason}
		return badValue
	}
	asJSON := fs.Bool("json", false, "print the result as JSON")
	showRanks := fs.Bool("ranks", false, "list every value with its rank, and every tie")
	printLink := fs.Bool("link", false, "print a share link instead of the report; --share says what it carries")
	share := fs.String("share", "data", "with --link: data (the data and settings, for a colleague who must run the analysis again) or results (the results only, without any value of any person)")
	linkBase := fs.String("link-base", "", "the page's address to put before the link fragment, e.g. http://intranet/midrank/")
	fromLink := fs.String("open", "", "analyse the data and settings of a share link (its #r1. or #s1. fragment or the whole address; - reads it from standard input, @FILE from a file) instead of FILE")
	passphrase := fs.String("passphrase", "", "with --link: seal the link with this passphrase; with --open: the passphrase of a sealed link (also read from MIDRANK_PASSPHRASE)")
	fs.StringVar(&opt.Layout, "layout", "auto", "auto, wide, long or counts (one row per group, a count per level of a scale)")
	fs.StringVar(&opt.Separator, "separator", "auto", "auto, tab, semicolon or comma")
	fs.StringVar(&opt.Group, "group", "", "the column of group labels or codes, by its header or its number from 1 (implies one row per value)")
	var measures []string
	fs.Func("measure", "the column of values, by its header or its number from 1 (implies one row per value); repeat for several measures, or write all for every numeric column", func(v string) error {
		measures = append(measures, v)
		return nil
	})
	adjustAcross := fs.String("adjust-across", string(core.DefaultAcross), "with several measures: how their p-values are adjusted across the measures, bh (Benjamini–Hochberg) or holm")
	fs.StringVar(&opt.Count, "count", "", "a column of counts, by its header or its number from 1: each row stands for that many values (implies one row per value)")
	fs.StringVar(&opt.Sheet, "sheet", "", "of an .xlsx or .ods file: the sheet to read, by its name or its number from 1 (default the first)")
	fs.StringVar(&opt.Decimal, "decimal", "auto", "auto (decided on every value read), point or comma")
	fs.StringVar(&opt.Thousands, "thousands", "auto", "the thousands separator: auto (decided on every value read), none, comma, point, space or apostrophe")
	fs.Func("alpha", fmt.Sprintf("significance level, strictly between 0 and 1 (default %v)", core.DefaultAlpha), func(v string) error {
		f, err := decimal(v)
		if err != nil || !(f > 0 && f < 1) {
			return refuse("alpha", v, "the significance level is a decimal number strictly between 0 and 1, for example 0.05")
		}
		opt.Alpha = f
		return nil
	})
	fs.StringVar(&opt.PValue, "pvalue", core.Keys("pvalue")[0], "how p is found: "+strings.Join(core.Keys("pvalue"), ", ")+" (auto: exact when it fits, else chi-square or Monte Carlo)")
	fs.Func("resamples", fmt.Sprintf("Monte Carlo resamples, 1 to %d (default %d)", core.MaxResamples, core.DefaultResamples), func(v string) error {
		n, err := strconv.Atoi(v)
		if err != nil || n < 1 || n > core.MaxResamples {
			return refuse("resamples", v, fmt.Sprintf("choose a whole number from 1 to %d, for example %d", core.MaxResamples, core.DefaultResamples))
		}
		opt.Resamples = n
		return nil
	})
	fs.Func("seed", fmt.Sprintf("Monte Carlo seed, a whole number from 0 to %d (default %d)", uint64(core.MaxSeed), core.DefaultSeed), func(v string) error {
		n, err := strconv.ParseUint(v, 10, 64)
		if err != nil || n > core.MaxSeed {
			return refuse("seed", v, fmt.Sprintf("a seed is a whole number from 0 to %d", uint64(core.MaxSeed)))
		}
		opt.Seed = &n
		return nil
	})
	fs.StringVar(&opt.PostHoc, "posthoc", core.Keys("posthoc")[0], "pairwise comparisons: "+strings.Join(core.Keys("posthoc"), ", "))
	fs.StringVar(&opt.Adjust, "adjust", core.Keys("adjust")[0], "multiplicity adjustment: "+strings.Join(core.Keys("adjust"), ", "))
	fs.StringVar(&opt.Reference, "reference", "", "compare each group with this one (its label as written in the data) instead of every pair; the adjustment runs over those comparisons")
	fs.Func("min-group-size", fmt.Sprintf("protect small groups in the report, its JSON and results links: groups with fewer values than this (%d is usual) show no figures, and no group's rank sum is shown; 0 for none", protect.Suggested), func(v string) error {
		n, err := strconv.Atoi(v)
		if err != nil || n < 0 || n > core.MaxMinGroupSize {
			return refuse("min_group_size", v, fmt.Sprintf("choose a whole number from 0 (no protection) to %d, for example %d", core.MaxMinGroupSize, protect.Suggested))
		}
		opt.MinGroupSize = n
		return nil
	})
	fs.StringVar(&opt.Trend, "trend", core.Keys("trend")[0], "test for a trend along the groups' order (as in the data, or set with --order), Jonckheere–Terpstra: "+strings.Join(core.Keys("trend"), ", "))
	fs.Func("order", "put the group with this label (as written in the data) next; repeat to set the order of several", func(label string) error {
		opt.Order = append(opt.Order, label)
		return nil
	})
	fs.Func("exclude", "leave out the group with this label; repeat for several", func(label string) error {
		opt.Exclude = append(opt.Exclude, label)
		return nil
	})
	fs.Func("rename", "LABEL=NAME: show the group LABEL as NAME; repeat for several", func(pair string) error {
		from, to, ok := strings.Cut(pair, "=")
		if !ok {
			return fmt.Errorf("write --rename LABEL=NAME, for example --rename \"B=North site\"")
		}
		if opt.Rename == nil {
			opt.Rename = map[string]string{}
		}
		opt.Rename[from] = to
		return nil
	})

	fail := func(code int, err error) int {
		fmt.Fprintln(stderr, "midrank:", err)
		if ps := core.Detail(err).Problems; len(ps) > 1 {
			for _, p := range ps {
				fmt.Fprintln(stderr, "  "+p.Message)
			}
		}
		if *asJSON {
			stdout.Write(core.EncodeError(err))
		}
		return code
	}
	if err := fs.Parse(args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			fmt.Fprint(stdout, usage)
			fs.SetOutput(stdout)
			fs.PrintDefaults()
			return exitOK
		}
		*asJSON = wantsJSON(args)
		if badValue != nil {
			return fail(exitSettings, badValue)
		}
		return fail(exitSettings, fmt.Errorf("%v (midrank -h lists the flags)", err))
	}
	if *fromLink != "" {
		if fs.NArg() != 0 {
			return fail(exitSettings, errors.New("give either a FILE or --open, not both"))
		}
	} else if fs.NArg() != 1 {
		return fail(exitSettings, errors.New("give one input file, or - for standard input (midrank -h lists the flags)"))
	}
	given := map[string]bool{}
	fs.Visit(func(f *flag.Flag) { given[f.Name] = true })
	if *share != "data" && *share != "results" {
		return fail(exitSettings, fmt.Errorf("--share %q: choose data (the link carries the data) or results (the results only)", *share))
	}
	if given["share"] && !*printLink {
		return fail(exitSettings, errors.New("--share says what a link carries; add --link"))
	}
	if *showRanks && opt.MinGroupSize > 0 {
		return fail(exitSettings, errors.New("--ranks lists every value, which protecting small groups (--min-group-size) must not; leave one of them out"))
	}
	if given["passphrase"] && *passphrase == "" {
		return fail(exitSettings, errors.New("--passphrase is empty; give a passphrase, or leave the flag out for an unsealed link"))
	}

	var data []byte
	var err error
	if *fromLink != "" {
		address, err := linkText(*fromLink, stdin)
		if err != nil {
			return fail(exitData, err)
		}
		_, fragment, _ := strings.Cut(address, "#")
		req, err := openLink("#"+fragment, passphraseOf(*passphrase))
		if err != nil {
			return fail(exitData, err)
		}
		data, opt = []byte(req.Data), req.Options
	} else if data, err = readInput(fs.Arg(0), stdin); err != nil {
		return fail(exitData, err)
	} else {
		if len(measures) == 1 && measures[0] != core.AllMeasures {
			opt.Measure = measures[0]
		} else {
			opt.Measures = measures
		}
		if given["adjust-across"] {
			opt.AdjustAcross = *adjustAcross
		}
	}
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	var result *core.Result
	var battery *core.Battery
	bar := newProgressBar(stderr)
	if opt.Several() {
		battery, err = core.AnalyzeMeasures(ctx, data, opt, bar.show)
	} else {
		result, err = core.AnalyzeContext(ctx, data, opt, bar.show)
	}
	bar.clear()
	if err != nil {
		return fail(exitFor(err), err)
	}
	if *printLink {
		var fragment string
		switch p := passphraseOf(*passphrase); {
		case *share == "results" && battery != nil:
			err = errors.New("a results-only link carries one measure's results: give one --measure")
		case *share == "results" && p != "":
			var b []byte
			if b, err = findings.Encode(result, opt); err == nil {
				fragment, err = sealed.Seal(b, p, rand.Reader)
			}
		case *share == "results":
			fragment, err = findings.Link(result, opt)
		case p != "":
			fragment, err = sealLink(data, opt, p)
		default:
			fragment, err = core.ShareLink(data, opt)
		}
		if err != nil {
			return fail(exitSettings, err)
		}
		fmt.Fprintln(stdout, *linkBase+fragment)
		return exitOK
	}
	if *asJSON {
		var b []byte
		switch {
		case battery != nil && opt.MinGroupSize > 0: // what leaves: the results as shared
			b, err = findings.EncodeBattery(battery, opt)
		case battery != nil:
			b, err = core.EncodeBattery(battery)
		case opt.MinGroupSize > 0:
			b, err = findings.Encode(result, opt)
		default:
			b, err = core.Encode(result)
		}
		if err != nil {
			return fail(exitInternal, err)
		}
		stdout.Write(b)
		return exitOK
	}
	if battery != nil {
		writeBattery(stdout, battery, *showRanks)
	} else {
		writeReport(stdout, result, *showRanks)
	}
	return exitOK
}

// exitFor is the exit status of an analysis that failed: a setting that
// cannot be used, else data that cannot be analysed.
func exitFor(err error) int {
	var oe *core.OptionError
	if errors.As(err, &oe) {
		return exitSettings
	}
	return exitData
}

// sealLink is a share link encrypted under a passphrase (package sealed).
func sealLink(data []byte, opt core.Options, passphrase string) (string, error) {
	if _, err := core.ShareLink(data, opt); err != nil { // checks the options
		return "", err
	}
	return sealed.Seal(core.Request{Data: string(data), Options: opt}.JSON(), passphrase, rand.Reader)
}

// openLink opens a plain or a sealed link.
func openLink(fragment, passphrase string) (core.Request, error) {
	if !sealed.Is(fragment) {
		return core.OpenLink(fragment)
	}
	raw, err := sealed.Open(fragment, passphrase)
	if err != nil {
		return core.Request{}, err
	}
	return core.ParseRequest(raw)
}

// passphraseOf prefers the flag and falls back to MIDRANK_PASSPHRASE, which
// keeps the passphrase out of the shell's history.
func passphraseOf(flagValue string) string {
	if flagValue != "" {
		return flagValue
	}
	return os.Getenv("MIDRANK_PASSPHRASE")
}

// wantsJSON finds --json among arguments that failed to parse, so that the
// error can still be given as JSON.
func wantsJSON(args []string) bool {
	for _, a := range args {
		switch a {
		case "--":
			return false
		case "-json", "--json", "-json=true", "--json=true":
			return true
		}
	}
	return false
}

// readInput reads FILE, or standard input for -, refusing more than
// table.MaxText bytes before reading them all.
func readInput(name string, stdin io.Reader) ([]byte, error) {
	in := stdin
	if name != "-" {
		f, err := os.Open(name)
		if err != nil {
			return nil, fmt.Errorf("cannot read the input: %w", err)
		}
		defer f.Close()
		in = f
	}
	// A file says its size: one buffer, which the reads fill straight
	// (growing a bytes.Buffer would first clear it, 17 MB for a million
	// values, while the collector's first cycle waits for that to end).
	size := 4096
	if f, ok := in.(*os.File); ok {
		if info, err := f.Stat(); err == nil && info.Mode().IsRegular() {
			size = int(min(info.Size(), table.MaxText)) + 1 // the byte more finds the end
		}
	}
	data := make([]byte, 0, size)
	for len(data) <= table.MaxText {
		if len(data) == cap(data) {
			data = slices.Grow(data, len(data))
		}
		n, err := in.Read(data[len(data):cap(data)])
		data = data[:len(data)+n]
		if err == io.EOF {
			break
		}
		if err != nil {
			return nil, fmt.Errorf("cannot read the input: %w", err)
		}
	}
	if len(data) > table.MaxText {
		return nil, fmt.Errorf("the input is larger than %d MB, the most that is read; analyse a part of it, or save only the group and value columns", table.MaxText>>20)
	}
	return data, nil
}

// linkText is the link that --open names: the value itself, standard input
// for -, or the file after @ (a long link does not fit on a command line).
func linkText(value string, stdin io.Reader) (string, error) {
	var in io.Reader
	switch {
	case value == "-":
		in = stdin
	case strings.HasPrefix(value, "@"):
		f, err := os.Open(value[1:])
		if err != nil {
			return "", fmt.Errorf("cannot read the link: %w", err)
		}
		defer f.Close()
		in = f
	default:
		return value, nil
	}
	b, err := io.ReadAll(io.LimitReader(in, link.MaxLink+1024))
	if err != nil {
		return "", fmt.Errorf("cannot read the link: %w", err)
	}
	return strings.TrimSpace(string(b)), nil
}

// decimal reads a plain decimal number as the data's cells are written
// (digits, a point, an exponent): Go's own syntax would also take
// hexadecimal, underscores, Inf and NaN, none of which a user means here.
func decimal(s string) (float64, error) {
	for _, c := range s {
		if !strings.ContainsRune("0123456789.eE+-", c) {
			return 0, fmt.Errorf("%q is not a decimal number", s)
		}
	}
	return strconv.ParseFloat(s, 64)
}
