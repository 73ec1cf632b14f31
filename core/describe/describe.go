// Package describe summarises one group of values: median, quartiles and range.
package describe

// Method names the quantile definition used, for reports.
const Method = "linear interpolation between order statistics (Hyndman & Fan 1996, type 7)"

// Summary is the five-number summary of a group.
type Summary struct {
	Min, Q1, Median, Q3, Max float64
}

// Summarise describes values sorted in ascending order; it needs at least one.
func Summarise(sorted []float64) Summary {
	return SummariseAt(len(sorted), func(i int) float64 { return sorted[i] })
}

// SummariseAt describes n ≥ 1 values given by at(i), the i-th smallest
// (from 0); it calls at only for the ranks OrderStatistics(n) lists, so a
// caller can fetch just those.
func SummariseAt(n int, at func(int) float64) Summary {
	return Summary{
		Min:    at(0),
		Q1:     quantileAt(n, 0.25, at),
		Median: quantileAt(n, 0.5, at),
		Q3:     quantileAt(n, 0.75, at),
		Max:    at(n - 1),
	}
}

// OrderStatistics lists in ascending order, without repeats, the 0-based
// ranks of the values that SummariseAt(n, at) reads.
func OrderStatistics(n int) []int {
	var ranks []int
	SummariseAt(n, func(i int) float64 {
		if len(ranks) == 0 || ranks[len(ranks)-1] < i {
			ranks = append(ranks, i)
		}
		return 0
	})
	return ranks
}

// Quantile returns the p-quantile (0 ≤ p ≤ 1) of values sorted in ascending
// order, by Hyndman & Fan's (1996) definition 7, the default of R's quantile
// and of numpy.percentile:
//
//	h = (n−1)·p,  Q(p) = x[⌊h⌋] + (h − ⌊h⌋)·(x[⌊h⌋+1] − x[⌊h⌋])
//
// with x indexed from 0. Hyndman, R. J. & Fan, Y. (1996). Sample quantiles in
// statistical packages. The American Statistician 50(4), 361–365.
func Quantile(sorted []float64, p float64) float64 {
	return quantileAt(len(sorted), p, func(i int) float64 { return sorted[i] })
}

// quantileAt is Quantile over n values given by at; the ranks it reads
// increase from call to call within SummariseAt, as OrderStatistics needs.
func quantileAt(n int, p float64, at func(int) float64) float64 {
	h := float64(float64(n-1) * p)
	lo := int(h)
	if lo >= n-1 {
		return at(n - 1)
	}
	frac := h - float64(lo)
	if frac == 0 {
		return at(lo)
	}
	x := at(lo)
	return x + float64(frac*(at(lo+1)-x))
}
