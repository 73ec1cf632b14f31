// Package core is Midrank's statistics core. One entry point, Analyze, serves
// the command line and the WebAssembly module, and Encode turns its result
// into the JSON both of them print, so the two answer with the same bytes.
//
// The work is split by job: package table reads the text, rank gives midranks,
// describe summarises each group, kruskal computes the H test and its effect
// sizes, and report words the decision.
package core

import (
	"cmp"
	"context"
	"fmt"
	"midrank/core/bootstrap"
	"slices"
	"sync"

	"midrank/core/describe"
	"midrank/core/kruskal"
	"midrank/core/protect"
	"midrank/core/rank"
	"midrank/core/report"
	"midrank/core/table"
)

// Version is the version of the statistics core, reported in every result.
const Version = "0.1.0"

// MaxNamedGroups is the most groups whose medians the decision names one by
// one; with more, a paragraph of them would not be read.
const MaxNamedGroups = 12

// ListLimit is the number of entries up to which the per-value ranking and
// the tie table are part of the result; larger lists are served in pages by
// Result.Page. The measures of a battery share it.
const ListLimit = 200_000

// Group is the summary of one group, in input order.
type Group struct {
	Label    string  `json:"label"`
	InData   string  `json:"label_in_data"` // the label as written in the data, before any renaming
	N        int     `json:"n"`
	Missing  int     `json:"missing"`
	RankSum  float64 `json:"rank_sum"`
	MeanRank float64 `json:"mean_rank"`
	Median   float64 `json:"median"`
	Q1       float64 `json:"q1"`
	Q3       float64 `json:"q3"`
	Min      float64 `json:"min"`
	Max      float64 `json:"max"`
}

// RankedValue is one observation with its rank, for the audit trail.
type RankedValue struct {
	Group  string  `json:"group"`
	Value  float64 `json:"value"`
	Rank   float64 `json:"rank"`
	Line   int     `json:"line"`   // 1-based line of the input it came from
	Shared int     `json:"shared"` // how many observations share this value (1 if untied)
}

// Result is the complete outcome of an analysis. Its JSON form never holds
// NaN or Infinity: undefined figures are pointers, and null when nil.
type Result struct {
	Version            string      `json:"version"`
	N                  int         `json:"n"`
	K                  int         `json:"k"`
	Missing            int         `json:"missing"`
	Alpha              float64     `json:"alpha"`
	Input              Input       `json:"input"`
	Groups             []Group     `json:"groups"`
	Levels             *Levels     `json:"levels"` // a table of counts' groups level by level, null otherwise
	H                  float64     `json:"h"`
	HUncorrected       float64     `json:"h_uncorrected"`
	TieCorrection      float64     `json:"tie_correction"`
	DF                 int         `json:"df"`
	PAsymptotic        float64     `json:"p_asymptotic"`
	PExact             *float64    `json:"p_exact"`
	PMonteCarlo        *float64    `json:"p_monte_carlo"`
	PValue             float64     `json:"p_value"`
	PMethod            string      `json:"p_method"`
	PMethodReason      string      `json:"p_method_reason"`
	CriticalValue      float64     `json:"critical_value"`
	ExactCriticalValue *float64    `json:"exact_critical_value"` // smallest attained H with P(H ≥ h) ≤ alpha
	ExactAttainedAlpha *float64    `json:"exact_attained_alpha"` // P(H ≥ exact_critical_value)
	MonteCarlo         *MonteCarlo `json:"monte_carlo"`
	Significant        bool        `json:"significant"`
	EpsilonSquared     float64     `json:"epsilon_squared"`
	EpsilonSquaredSize string      `json:"epsilon_squared_size"`
	// EpsilonSquaredInterval is ε²'s percentile bootstrap interval, nil
	// when there are more values than EffectBudget allows.
	EpsilonSquaredInterval *bootstrap.Interval `json:"epsilon_squared_interval"`
	EtaSquared             *float64            `json:"eta_squared"`
	EtaSquaredSize         *string             `json:"eta_squared_size"`
	QuantileMethod         string              `json:"quantile_method"`
	Ranks                  []RankedValue       `json:"ranks"`
	RanksComplete          bool                `json:"ranks_complete"` // false: ranks is empty, ask Page for them
	Ties                   []rank.Tie          `json:"ties"`
	TiesTotal              int                 `json:"ties_total"`
	TiesComplete           bool                `json:"ties_complete"` // false: ties is empty, ask Page for them
	PostHoc                *PostHoc            `json:"posthoc"`       // null when no post-hoc method was asked for
	Trend                  *Trend              `json:"trend"`         // null when no trend test was asked for (or the values cannot vary)
	// Protection says which groups what is shared hides (see
	// Options.MinGroupSize), null when protection is off
	Protection *Protection `json:"protection"`
	Warnings   []string    `json:"warnings"`
	Decision   string      `json:"decision"`
	// ResultLine is the result in one line, as reports write it:
	// "H(2) = 7.99, p = .018, ε² = 0.28, N = 30" (see report.ResultLine)
	ResultLine string `json:"result_line"`

	table      *table.Table
	ranking    rank.Ranking
	pairsAsked bool          // a post-hoc method was asked for
	plan       protect.Plan  // the groups what is shared hides
	choice     report.Choice // how p was found, for PMethodReason
	byRank     struct {
		once  sync.Once
		order []int32 // indices of the values, smallest first, stable
	}
}

// rankOrder sorts the values' indices by value once, when first asked.
func (r *Result) rankOrder() []int32 {
	r.byRank.once.Do(func() {
		order := make([]int32, r.N)
		for i := range order {
			order[i] = int32(i)
		}
		values := r.table.Values
		slices.SortStableFunc(order, func(a, b int32) int { return cmp.Compare(values[a], values[b]) })
		r.byRank.order = order
	})
	return r.byRank.order
}

// Analyze reads data with the given options and runs the Kruskal–Wallis test.
// Errors are *OptionError for unusable settings and *table.Error for data
// that cannot be analysed.
func Analyze(data []byte, opt Options) (*Result, error) {
	return AnalyzeContext(context.Background(), data, opt, nil)
}

// AnalyzeContext is Analyze for long computations (exact and Monte Carlo
// p-values): it stops when ctx is done, returning ctx.Err(), and tells
// progress, when not nil, how far it is.
func AnalyzeContext(ctx context.Context, data []byte, opt Options, progress Progress) (*Result, error) {
	s, t, _, from, err := opt.readTable(data)
	if err != nil {
		return nil, err
	}
	r, err := analyzeTable(ctx, t, s, progress)
	if r != nil {
		from.describe(&r.Input)
	}
	return r, err
}

// readTable checks the options and reads the table: it gives the
// settings, the table, the text read (data as UTF-8, or the chosen sheet of
// a spreadsheet file) and where it came from.
func (o Options) readTable(data []byte) (settings, *table.Table, []byte, source, error) {
	s, err := o.validate()
	if err != nil {
		return s, nil, nil, source{}, err
	}
	text, from, err := textOf(data, o.Sheet)
	if err != nil {
		return s, nil, nil, source{}, err
	}
	t, err := table.Parse(text, s.read)
	if err != nil {
		return s, nil, nil, source{}, err
	}
	return s, t, text, from, nil
}

// analyzeTable applies the group edits to a table just read and analyses it.
func analyzeTable(ctx context.Context, t *table.Table, s settings, progress Progress) (*Result, error) {
	if err := t.Regroup(s.edits); err != nil {
		return nil, err
	}
	ranking := rank.Rank(t.Values, t.Groups, len(t.Labels))
	sizes := ranking.Sizes
	if err := checkGroups(t, sizes); err != nil {
		return nil, err
	}
	if len(ranking.Ties) == 1 && ranking.Ties[0].Count == len(t.Values) {
		return nil, &table.Error{
			Reason: fmt.Sprintf("all %d values are equal (%s), so there is nothing to rank", len(t.Values), report.Number(t.Values[0])),
			Fix:    "the test needs at least two different values"}
	}

	r := &Result{Version: Version, N: len(t.Values), K: len(t.Labels), Alpha: s.alpha, table: t, ranking: ranking}
	r.Input = describeInput(t)
	r.Groups = summarise(t, ranking)
	r.Levels = levelsOf(t, r.Groups)
	for _, m := range t.Missing {
		r.Missing += m
	}

	test := kruskal.Compute(sizes, ranking.RankSums, ranking.TieSum)
	r.H, r.HUncorrected, r.TieCorrection, r.DF = test.H, test.HUncorrected, test.TieCorrection, test.DF
	r.PAsymptotic = test.P
	pv, err := pvalueOf(ctx, s, ranking, test.P, test.TieCorrection, progress)
	if err != nil {
		return nil, err
	}
	r.PMethod, r.PValue, r.PMethodReason, r.choice = string(pv.method), pv.p, pv.reason, pv.choice
	r.PExact, r.ExactCriticalValue, r.ExactAttainedAlpha, r.MonteCarlo = pv.exact, pv.critical, pv.attained, pv.monteCarlo
	if pv.monteCarlo != nil {
		r.PMonteCarlo = &pv.p
	}
	r.CriticalValue = kruskal.CriticalValue(s.alpha, test.DF)
	r.Significant = report.Significant(r.PValue, s.alpha)
	r.EpsilonSquared = kruskal.EpsilonSquared(test.H, r.N)
	r.EpsilonSquaredSize = kruskal.Size(r.EpsilonSquared)
	if b := effectResamples(r.N, s.effectBudget); b > 0 {
		interval, err := bootstrap.EpsilonSquared(ctx, ranking, b, s.seed)
		if err != nil {
			return nil, err
		}
		r.EpsilonSquaredInterval = &interval
	}
	if eta, ok := kruskal.EtaSquared(test.H, r.N, r.K); ok {
		size := kruskal.Size(eta)
		r.EtaSquared, r.EtaSquaredSize = &eta, &size
	}
	r.QuantileMethod = describe.Method
	if r.PostHoc, err = comparePairs(ctx, s, ranking, r.Groups, r.H); err != nil {
		return nil, err
	}
	r.pairsAsked = s.pairs
	if s.trend != "" {
		if r.Trend, err = testTrend(ctx, s, ranking, t.Labels, r.TieCorrection, progress); err != nil {
			return nil, err
		}
	}

	r.TiesTotal = len(ranking.Ties)
	r.RanksComplete = r.N <= s.listLimit
	r.Ranks = []RankedValue{}
	if r.RanksComplete {
		r.Ranks = r.Page(ListRanks, 0, r.N).Ranks
	}
	r.TiesComplete = r.TiesTotal <= s.listLimit
	r.Ties = []rank.Tie{}
	if r.TiesComplete && r.TiesTotal > 0 {
		r.Ties = ranking.Ties
	}

	r.Warnings = warnings(r, protect.Plan{}, false)
	r.plan = protect.For(sizes, s.minGroupSize)
	if s.minGroupSize > 0 {
		r.Protection = protectionOf(r)
	}
	facts := r.facts(protect.Plan{})
	r.Decision = report.Decision(facts)
	r.ResultLine = report.ResultLine(facts)
	return r, nil
}

// checkGroups refuses data where a group has no values or fewer than two
// groups have any.
func checkGroups(t *table.Table, sizes []int) error {
	for i, s := range sizes {
		if s == 0 {
			return &table.Error{Group: t.Labels[i],
				Reason: fmt.Sprintf("it has no values (%d cells are missing)", t.Missing[i]),
				Fix:    "fill in its values, or remove the group from the data"}
		}
	}
	if len(sizes) < 2 {
		e := &table.Error{
			Reason: "the data holds fewer than two groups",
			Fix:    "the test compares two or more groups: give each group its own column under a label (wide layout), or write each value as a line \"group, value\" (long layout)"}
		if len(sizes) == 1 {
			e.Group = t.Labels[0]
			e.Reason = "this is the only group in the data"
		}
		return e
	}
	return nil
}

// summarise builds the group summaries. The quartiles need only a few order
// statistics of each group; one pass over the sorted sample picks them out,
// so no group's values are copied or sorted again.
func summarise(t *table.Table, ranking rank.Ranking) []Group {
	sizes := ranking.Sizes
	wanted := make([][]int, len(sizes)) // ranks within the group, ascending
	picked := make([][]float64, len(sizes))
	for g, n := range sizes {
		wanted[g] = describe.OrderStatistics(n)
		picked[g] = make([]float64, 0, len(wanted[g]))
	}
	seen := make([]int, len(sizes))
	for i, g := range ranking.Groups {
		if w := wanted[g]; len(picked[g]) < len(w) && w[len(picked[g])] == seen[g] {
			picked[g] = append(picked[g], ranking.Sorted[i])
		}
		seen[g]++
	}
	groups := make([]Group, len(sizes))
	for g, n := range sizes {
		d := describe.SummariseAt(n, func(rank int) float64 {
			j, _ := slices.BinarySearch(wanted[g], rank)
			return picked[g][j]
		})
		sum := ranking.RankSums[g]
		groups[g] = Group{
			Label: t.Labels[g], InData: t.Source[g], N: n, Missing: t.Missing[g],
			RankSum: sum, MeanRank: sum / float64(n),
			Median: d.Median, Q1: d.Q1, Q3: d.Q3, Min: d.Min, Max: d.Max,
		}
	}
	return groups
}

// List names a list that Page serves.
type List string

const (
	ListRanks  List = "ranks"  // every value with its rank, in the order of the text
	ListRanked List = "ranked" // the same, smallest value first (ties together, each tie in text order)
	ListTies   List = "ties"
)

// Lists are the names Page serves.
var Lists = []List{ListRanks, ListRanked, ListTies}

// PageOf is one page of a list: the entries from Offset on.
type PageOf struct {
	List   List          `json:"list"`
	Offset int           `json:"offset"`
	Total  int           `json:"total"`
	Ranks  []RankedValue `json:"ranks,omitempty"`
	Ties   []rank.Tie    `json:"ties,omitempty"`
}

// Page returns up to count entries of the per-value ranking (in input order
// or by rank) or of the tie table (in ascending order of value), from offset
// on.
func (r *Result) Page(list List, offset, count int) PageOf {
	p := PageOf{List: list, Offset: offset}
	switch list {
	case ListRanks, ListRanked:
		p.Total = r.N
	case ListTies:
		p.Total = len(r.ranking.Ties)
	}
	offset = min(max(offset, 0), p.Total)
	end := offset + min(max(count, 0), p.Total-offset) // no overflow, whatever count
	p.Offset = offset
	if list == ListTies {
		p.Ties = r.ranking.Ties[offset:end]
		return p
	}
	p.Ranks = make([]RankedValue, 0, end-offset)
	var order []int32
	if list == ListRanked {
		order = r.rankOrder()
	}
	for at := offset; at < end; at++ {
		i := at
		if order != nil {
			i = int(order[at])
		}
		v := r.table.Values[i]
		rank, shared := r.ranking.RankOf(v)
		p.Ranks = append(p.Ranks, RankedValue{
			Group: r.table.Labels[r.table.Groups[i]], Value: v, Rank: rank,
			Line: int(r.table.Lines[i]), Shared: shared,
		})
	}
	return p
}
