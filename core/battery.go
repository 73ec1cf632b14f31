package core

import (
	"cmp"
	"context"
	"runtime"
	"strconv"
	"sync"

	"midrank/core/adjust"
	"midrank/core/jsonlite"
	"midrank/core/report"
	"midrank/core/table"
)

// AllMeasures, as the only measure asked for, asks for every numeric
// column but the group column (and a count column or a row number).
const AllMeasures = "all"

// DefaultAcross is how the measures' p-values are adjusted across the
// measures unless asked otherwise: Benjamini–Hochberg's false discovery
// rate, the usual choice for a battery of survey items or indicators, where
// some false findings among many are tolerated; Holm controls the chance of
// any false finding.
const DefaultAcross = adjust.BH

// AcrossMethods are the adjustments offered across measures.
var AcrossMethods = []adjust.Method{adjust.BH, adjust.Holm}

// Battery is several measures compared across the same groups, each
// analysed as on its own (its own missing values, p method and pairs), with
// the measures' p-values adjusted across the battery. That adjustment is
// separate from the adjustment across pairs within a measure.
type Battery struct {
	GroupColumn  string        // the group column's header
	AdjustAcross adjust.Method // bh or holm
	Measures     []Measured    // in the order asked, or the columns' order for "all"
	// Summary says in plain words which measures differ after the
	// adjustment across measures (see report.BatterySummary).
	Summary string
}

// Measured is one measure of a battery: its analysis, or why it has none.
type Measured struct {
	Measure string
	Result  *Result // nil when the measure could not be analysed
	Err     error   // why, when Result is nil
	// PAdjustedAcross is the measure's p adjusted across the measures
	// that were analysed; nil when the measure was not
	PAdjustedAcross *float64
}

// DiffersAcross reports whether the measure differs between the groups
// after its p-value was adjusted across the measures: adjusted p ≤ alpha.
func (m Measured) DiffersAcross() bool {
	return m.Result != nil && report.Significant(*m.PAdjustedAcross, m.Result.Alpha)
}

// AnalyzeMeasures runs the test on each of the measure columns
// opt.Measures of a long table, by header or 1-based number, or on every
// numeric column when they are {AllMeasures}, against the same group
// column (opt.Group, or the one the reading finds), and adjusts the
// p-values across the measures by opt.AdjustAcross (DefaultAcross when
// empty). The measures run in parallel; progress, when not nil, is told
// ("measures", done, total) as each measure is done. Errors that
// stop the whole battery are *OptionError or *table.Error; a measure that
// cannot be analysed keeps its error in its Measured.
func AnalyzeMeasures(ctx context.Context, data []byte, opt Options, progress Progress) (*Battery, error) {
	across, measures := cmp.Or(adjust.Method(opt.AdjustAcross), DefaultAcross), opt.Measures
	s, t, text, from, err := opt.readTable(data)
	if err != nil {
		return nil, err
	}
	if t.Layout != table.LayoutLong {
		return nil, &table.Error{Reason: "several measures need a table with one row per person or case: a column of groups and a column for each measure",
			Fix: "choose the group column (--group on the command line)"}
	}
	if len(measures) == 1 && measures[0] == AllMeasures {
		measures = numericColumns(t)
		if len(measures) == 0 {
			return nil, &table.Error{Reason: "no column but the group column holds numbers", Fix: "choose the measure columns by name"}
		}
	}
	b := &Battery{GroupColumn: t.Profile.Columns[t.GroupColumn-1].Name, AdjustAcross: across, Measures: make([]Measured, len(measures))}
	var wg sync.WaitGroup
	var mu sync.Mutex // over done and progress
	done := 0
	work := make(chan int)
	for range min(runtime.GOMAXPROCS(0), len(measures)) {
		wg.Go(func() {
			for i := range work {
				one := s
				one.read.Group, one.read.Measure = strconv.Itoa(t.GroupColumn), measures[i]
				// ε²'s intervals and the lists of values share one analysis's budgets (the rest is paged)
				one.effectBudget, one.listLimit = EffectBudget/len(measures), ListLimit/len(measures)
				m := Measured{Measure: measures[i]}
				mt, err := t.Remeasure(text, one.read)
				if err == nil {
					m.Measure = mt.Measure
					m.Result, err = analyzeTable(ctx, mt, one, nil)
				}
				if m.Result != nil {
					from.describe(&m.Result.Input)
				}
				m.Err = err
				b.Measures[i] = m
				if progress != nil {
					mu.Lock()
					done++
					progress("measures", done, len(measures))
					mu.Unlock()
				}
			}
		})
	}
	for i := range measures {
		work <- i
	}
	close(work)
	wg.Wait()
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	var ps []float64
	for _, m := range b.Measures {
		if m.Result != nil {
			ps = append(ps, m.Result.PValue)
		}
	}
	adjusted, err := adjust.Adjust(ps, across)
	if err != nil {
		return nil, err
	}
	var differ []string
	for i := range b.Measures {
		if m := &b.Measures[i]; m.Result != nil {
			m.PAdjustedAcross, adjusted = &adjusted[0], adjusted[1:]
			if m.DiffersAcross() {
				differ = append(differ, m.Measure)
			}
		}
	}
	b.Summary = report.BatterySummary(len(b.Measures), len(ps), b.GroupColumn, differ, s.alpha, across.Name())
	return b, nil
}

// numericColumns are the 1-based numbers of a long table's columns that
// hold numbers and no text, but the group and count columns and a row
// number (1, 2, 3…).
func numericColumns(t *table.Table) []string {
	var out []string
	for i, c := range t.Profile.Columns {
		if n := i + 1; n != t.GroupColumn && n != t.CountColumn && c.Numbers > 0 && c.Text == 0 && !c.Counting {
			out = append(out, strconv.Itoa(n))
		}
	}
	return out
}

// EncodeBattery writes a battery as JSON: {"version", "group_column",
// "adjust_across", "summary", "measures": [{"measure", "p_adjusted_across",
// "differs_across", …the measure's result as Encode writes it…} or
// {"measure", "error"}]}.
func EncodeBattery(b *Battery) ([]byte, error) {
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("version", Version)
	w.StringMember("group_column", b.GroupColumn)
	w.StringMember("adjust_across", string(b.AdjustAcross))
	w.StringMember("summary", b.Summary)
	w.Key("measures")
	w.BeginArray()
	for _, m := range b.Measures {
		var head jsonlite.Writer
		head.BeginObject()
		head.StringMember("measure", m.Measure)
		var body []byte
		if m.Result == nil {
			body = EncodeError(m.Err)
		} else {
			head.FloatMember("p_adjusted_across", *m.PAdjustedAcross)
			head.BoolMember("differs_across", m.DiffersAcross())
			var err error
			if body, err = Encode(m.Result); err != nil {
				return nil, err
			}
		}
		// the measure's own members (body without its braces' opening and
		// its closing newline) follow the ones above, in one object
		w.Raw(append(append(head.Bytes(), ','), body[1:len(body)-1]...))
	}
	w.EndArray()
	w.EndObject()
	if err := w.Err(); err != nil {
		return nil, err
	}
	return append(w.Bytes(), '\n'), nil
}
