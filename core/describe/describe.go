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
	return Summary{
		Min:    sorted[0],
		Q1:     Quantile(sorted, 0.25),
		Median: Quantile(sorted, 0.5),
		Q3:     Quantile(sorted, 0.75),
		Max:    sorted[len(sorted)-1],
	}
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
	h := float64(len(sorted)-1) * p
	lo := int(h)
	if lo >= len(sorted)-1 {
		return sorted[len(sorted)-1]
	}
	frac := h - float64(lo)
	if frac == 0 {
		return sorted[lo]
	}
	return sorted[lo] + frac*(sorted[lo+1]-sorted[lo])
}
