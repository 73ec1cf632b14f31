package core

// EffectResamples is the number of bootstrap resamples behind ε²'s interval
// (at least 1,000 for a 95% percentile interval: Efron & Tibshirani 1993,
// An Introduction to the Bootstrap, §19.3; common practice is 2,000).
const EffectResamples = 2000

// EffectBudget bounds the work of ε²'s interval: resamples × values (10
// million take about 0.1 s natively on one core, BenchmarkTenThousand in
// core/bootstrap). Up to 5,000 values get EffectResamples resamples, up to
// 10,000 fewer (never under MinEffectResamples), and larger samples no
// interval, so that an analysis stays quick enough to follow typing.
const (
	EffectBudget       = 10_000_000
	MinEffectResamples = 1000
)

// effectResamples is the number of resamples for ε²'s interval with n
// values within a budget of resamples × values, 0 for none. A single
// analysis has EffectBudget; the measures of a battery share it.
func effectResamples(n, budget int) int {
	b := min(EffectResamples, budget/n)
	if b < MinEffectResamples {
		return 0
	}
	return b
}
