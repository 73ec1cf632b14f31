package main

import (
	"fmt"
	"io"
	"slices"
	"strings"
	"text/tabwriter"

	"midrank/core"
	"midrank/core/display"
	"midrank/core/tables"
)

// tiesShown is how many tied values the report lists without --ranks.
const tiesShown = 10

// writeReport prints a result for people: the decision first, then the
// figures, the groups, the ties and, when asked, every rank; with small
// groups protected, the results as shared (no ties, no ranks).
func writeReport(w io.Writer, r *core.Result, showRanks bool) {
	decision, warnings, all := r.Decision, r.Warnings, tables.Of(r)
	if r.Protection != nil {
		decision, warnings, all = r.SharedDecision(), r.SharedWarnings(), tables.Shared(r)
	}
	in := r.Input
	read := fmt.Sprintf("%s layout, %s-separated, decimal %s", in.Layout, in.Separator, in.DecimalMark)
	if in.Encoding != "UTF-8" {
		read = in.Encoding + " text, " + read
	}
	if in.Thousands != "none" {
		read += fmt.Sprintf(", %s between thousands", in.Thousands)
	}
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
	fmt.Fprintln(w, "  "+r.ResultLine)
	fmt.Fprintln(w, wrap(decision, 78, "  "))
	fmt.Fprintln(w)
	if note := r.ProtectionNote(); note != "" {
		fmt.Fprintln(w, wrap(note, 78, ""))
		fmt.Fprintln(w)
	}

	for _, t := range all {
		writeTable(w, t)
	}
	if r.Protection == nil { // tied values are single people's values
		writeTies(w, r, showRanks)
	}
	if showRanks {
		writeRanks(w, r)
	}
	if len(warnings) > 0 {
		fmt.Fprintln(w, "Take note")
		for _, m := range warnings {
			fmt.Fprintln(w, wrap("- "+m, 78, "  "))
		}
	}
}

// writeTable prints a table of results as the core defines it: a list of
// figures one to a line, other tables as columns with a heading line; the
// letters of the groups, when there are pairs, follow the groups.
func writeTable(w io.Writer, t tables.Table) {
	fmt.Fprintln(w, t.Title)
	if t.Note != "" {
		fmt.Fprintln(w, wrap(t.Note, 78, "  "))
	}
	if t.List {
		tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		for i, c := range t.Columns {
			fmt.Fprintf(tw, "  %s\t%s\n", c.Heading, t.Rows[0][i].Text)
		}
		tw.Flush()
		fmt.Fprintln(w)
		return
	}
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprint(tw, " ")
	for _, c := range t.Columns {
		fmt.Fprintf(tw, " %s\t", c.Heading)
	}
	fmt.Fprintln(tw)
	for _, row := range t.Rows {
		fmt.Fprint(tw, " ")
		for _, cell := range row {
			fmt.Fprintf(tw, " %s\t", cell.Text)
		}
		fmt.Fprintln(tw)
	}
	tw.Flush()
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
		fmt.Fprintf(t, "  %s\t%d\t\n", display.AsRead.Format(tie.Value), tie.Count)
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
			fmt.Fprintf(t, "  %d\t%s\t%s\t%s\t%d\t\n", v.Line, v.Group, display.AsRead.Format(v.Value), display.AsRead.Format(v.Rank), v.Shared)
		}
	}
	t.Flush()
	fmt.Fprintln(w)
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

// writeBattery prints a battery of measures for people: the overview, then
// each measure's report, or why it could not be analysed.
// protected reports whether small groups are protected in a battery's
// report (each measure analysed has the same settings).
func protected(b *core.Battery) bool {
	return slices.ContainsFunc(b.Measures, func(m core.Measured) bool { return m.Result != nil && m.Result.Protection != nil })
}

func writeBattery(w io.Writer, b *core.Battery, showRanks bool) {
	fmt.Fprintf(w, "Midrank %s · Kruskal–Wallis H test on %d measures by %q\n\n%s\n\n", core.Version, len(b.Measures), b.GroupColumn, wrap(b.Summary, 78, ""))
	if protected(b) {
		writeTable(w, tables.SharedOverview(b))
	} else {
		writeTable(w, tables.Overview(b))
	}
	for _, m := range b.Measures {
		fmt.Fprintf(w, "\n%s\n%s\n", m.Measure, strings.Repeat("=", len([]rune(m.Measure))))
		if m.Result == nil {
			fmt.Fprintf(w, "Not analysed: %s\n", core.Detail(m.Err).Message)
			continue
		}
		fmt.Fprintf(w, "p adjusted across the measures: %s\n\n", display.PValue.Format(*m.PAdjustedAcross))
		writeReport(w, m.Result, showRanks)
	}
}
