package main

import (
	"fmt"
	"io"
	"slices"
	"strconv"
	"strings"
	"text/tabwriter"

	"midrank/core"
)

// tiesShown is how many tied values the report lists without --ranks.
const tiesShown = 10

// writeReport prints a result for people: the decision first, then the
// figures, the groups, the ties and, when asked, every rank.
func writeReport(w io.Writer, r *core.Result, showRanks bool) {
	in := r.Input
	read := fmt.Sprintf("%s layout, %s-separated, decimal %s", in.Layout, in.Separator, in.DecimalMark)
	if in.Header {
		read += fmt.Sprintf(", header line (values: %q)", in.Measure)
	}
	fmt.Fprintf(w, "Midrank %s · Kruskal–Wallis H test\nRead as %s; %d values in %d groups, %d missing.\n\n",
		r.Version, read, r.N, r.K, r.Missing)
	for _, g := range r.Groups {
		if g.Label != g.InData {
			fmt.Fprintf(w, "Group %q is shown as %q.\n", g.InData, g.Label)
		}
	}
	for _, e := range in.Excluded {
		fmt.Fprintf(w, "Group %q (%d values, %d missing) was left out by request.\n", e.Label, e.N, e.Missing)
	}
	if len(in.Excluded) > 0 || slices.ContainsFunc(r.Groups, func(g core.Group) bool { return g.Label != g.InData }) {
		fmt.Fprintln(w)
	}

	fmt.Fprintln(w, "In plain words")
	fmt.Fprintln(w, wrap(r.Decision, 78, "  "))
	fmt.Fprintln(w)

	fmt.Fprintln(w, "Figures")
	t := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(name, value string) { fmt.Fprintf(t, "  %s\t%s\n", name, value) }
	row("H, corrected for ties", num(r.H))
	row("H before the correction", num(r.HUncorrected))
	row("tie correction C", num(r.TieCorrection))
	row("degrees of freedom", strconv.Itoa(r.DF))
	row("p ("+r.PMethod+")", num(r.PValue))
	row(fmt.Sprintf("H needed at alpha %s", num(r.Alpha)), num(r.CriticalValue))
	row("significant at alpha", yesNo(r.Significant))
	row("epsilon squared, H/(N-1)", fmt.Sprintf("%s (%s)", num(r.EpsilonSquared), r.EpsilonSquaredSize))
	if r.EtaSquared != nil {
		row("eta squared, (H-k+1)/(N-k)", fmt.Sprintf("%s (%s)", num(*r.EtaSquared), *r.EtaSquaredSize))
	} else {
		row("eta squared, (H-k+1)/(N-k)", "undefined (N = k)")
	}
	t.Flush()
	fmt.Fprintln(w)

	fmt.Fprintln(w, "Groups (quartiles: "+r.QuantileMethod+")")
	t = tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(t, "  group\tvalues\tmissing\trank sum\tmean rank\tlowest\tlower quartile\tmedian\tupper quartile\thighest\t")
	for _, g := range r.Groups {
		fmt.Fprintf(t, "  %s\t%d\t%d\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t\n", g.Label, g.N, g.Missing,
			num(g.RankSum), num(g.MeanRank), num(g.Min), num(g.Q1), num(g.Median), num(g.Q3), num(g.Max))
	}
	t.Flush()
	fmt.Fprintln(w)

	writePairs(w, r)
	writeTies(w, r, showRanks)
	if showRanks {
		writeRanks(w, r)
	}
	if len(r.Warnings) > 0 {
		fmt.Fprintln(w, "Take note")
		for _, m := range r.Warnings {
			fmt.Fprintln(w, wrap("- "+m, 78, "  "))
		}
	}
}

func writePairs(w io.Writer, r *core.Result) {
	ph := r.PostHoc
	if ph == nil {
		return
	}
	fmt.Fprintf(w, "Pairs of groups (%s, p adjusted by %s; shift: Hodges–Lehmann, %s%% interval)\n", ph.Method, ph.Adjust, num(100*ph.Confidence))
	t := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(t, "  first\tsecond\tstatistic\tp\tadjusted p\tdiffer\tP(first > second)\tshift\tinterval\t")
	for _, p := range ph.Pairs {
		differ := ""
		if p.Significant {
			differ = "yes"
		}
		fmt.Fprintf(t, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s to %s\t\n", p.A, p.B, num(p.Statistic), num(p.P), num(p.PAdjusted), differ,
			strconv.FormatFloat(p.ProbSuperiority, 'f', 3, 64), num(p.Shift), num(p.ShiftLow), num(p.ShiftHigh))
	}
	t.Flush()
	fmt.Fprint(w, "  Letters (groups sharing a letter are not told apart):")
	for _, g := range r.Groups {
		fmt.Fprintf(w, " %s %s;", g.Label, ph.Letters[g.Label])
	}
	fmt.Fprintln(w)
	fmt.Fprintln(w)
}

func writeTies(w io.Writer, r *core.Result, all bool) {
	if r.TiesTotal == 0 {
		fmt.Fprintln(w, "No ties: every value occurs once.")
		fmt.Fprintln(w)
		return
	}
	if r.TiesTotal == 1 {
		fmt.Fprintln(w, "Tied values (1 value is shared by two or more observations)")
	} else {
		fmt.Fprintf(w, "Tied values (%d values are shared by two or more observations)\n", r.TiesTotal)
	}
	show := r.TiesTotal
	if !all {
		show = min(show, tiesShown)
	}
	t := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(t, "  value\tshared by\t")
	for _, tie := range r.Page(core.ListTies, 0, show).Ties {
		fmt.Fprintf(t, "  %s\t%d\t\n", num(tie.Value), tie.Count)
	}
	t.Flush()
	if show < r.TiesTotal {
		fmt.Fprintf(w, "  … %d more (--ranks lists them all)\n", r.TiesTotal-show)
	}
	fmt.Fprintln(w)
}

func writeRanks(w io.Writer, r *core.Result) {
	fmt.Fprintln(w, "Every value with its rank, in input order")
	t := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(t, "  line\tgroup\tvalue\trank\tshared by\t")
	const page = 4096
	for off := 0; off < r.N; off += page {
		for _, v := range r.Page(core.ListRanks, off, page).Ranks {
			fmt.Fprintf(t, "  %d\t%s\t%s\t%s\t%d\t\n", v.Line, v.Group, num(v.Value), num(v.Rank), v.Shared)
		}
	}
	t.Flush()
	fmt.Fprintln(w)
}

// num prints a figure with up to 6 significant digits.
func num(v float64) string {
	if v != 0 && (v < 1e-4 && v > -1e-4) {
		return strconv.FormatFloat(v, 'e', 4, 64)
	}
	return strconv.FormatFloat(v, 'g', 6, 64)
}

func yesNo(b bool) string {
	if b {
		return "yes"
	}
	return "no"
}

// wrap breaks text into lines of at most width characters, indented. It
// never breaks around "=", so that "p = 0.02" stays on one line.
func wrap(text string, width int, indent string) string {
	var b strings.Builder
	line := indent
	var words []string
	for _, w := range strings.Fields(text) {
		if n := len(words); n > 0 && (w == "=" || w == "<" || words[n-1] == "=" || words[n-1] == "<" ||
			strings.HasSuffix(words[n-1], " =") || strings.HasSuffix(words[n-1], " <")) {
			words[n-1] += " " + w
			continue
		}
		words = append(words, w)
	}
	for _, word := range words {
		if len([]rune(line))+1+len([]rune(word)) > width && line != indent {
			b.WriteString(line + "\n")
			line = indent
		}
		if line != indent {
			line += " "
		}
		line += word
	}
	b.WriteString(line)
	return b.String()
}
