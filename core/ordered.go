package core

import (
	"context"
	"errors"
	"fmt"
	"math"
	"strings"

	"midrank/core/display"
	"midrank/core/jsonlite"
	"midrank/core/montecarlo"
	"midrank/core/rank"
	"midrank/core/report"
	"midrank/core/trend"
)

// Trend is the Jonckheere–Terpstra test of a trend along the groups' order
// (see package trend): the answer's "trend", null when not asked for.
type Trend struct {
	Order       []string `json:"order"`       // the groups' labels in the order tested
	Alternative string   `json:"alternative"` // increasing, decreasing or two-sided
	Statistic   float64  `json:"statistic"`   // J
	Expected    float64  `json:"expected"`    // E(J) when there is no trend
	Variance    float64  `json:"variance"`    // Var(J), corrected for ties
	Z           float64  `json:"z"`           // (J − E(J))/√Var(J)
	P           float64  `json:"p"`
	PMethod     string   `json:"p_method"` // exact, monte-carlo or asymptotic (the normal approximation)
	PExact      *float64 `json:"p_exact"`  // null when not computed
	PNormal     float64  `json:"p_normal"`
	// MonteCarlo is how p was estimated when by Monte Carlo, else null
	MonteCarlo *MonteCarlo `json:"monte_carlo"`
	// CriticalExact is the least extreme J that the exact distribution
	// makes significant at alpha (two-sided: the upper one at alpha/2), and
	// AttainedAlpha its tail probability; null when not computed or when no
	// J is that rare.
	CriticalExact *float64 `json:"exact_critical_value"`
	AttainedAlpha *float64 `json:"exact_attained_alpha"`
	Significant   bool     `json:"significant"`
	TauB          float64  `json:"tau_b"`      // Kendall's τ_b between the groups' order and the values
	TauBSize      string   `json:"tau_b_size"` // τ_b in words (see TauSize)
	Reason        string   `json:"p_method_reason"`
}

// tauBands put |τ_b| into words: Cohen's (1988) benchmarks for a
// correlation r of 0.1, 0.3 and 0.5, carried over to Kendall's τ by
// Greiner's relation τ = (2/π)·arcsin r for normal data (Kendall 1970,
// §10.3) — about 0.064, 0.19 and 0.33 (from memory; common practice is to
// read τ with r's benchmarks, which makes it look smaller than it is).
var tauBands = []struct {
	r    float64
	word string
}{{0.1, "negligible"}, {0.3, "small"}, {0.5, "moderate"}, {math.Inf(1), "large"}}

// TauSize puts Kendall's τ_b into words by tauBands.
func TauSize(tau float64) string {
	for _, b := range tauBands {
		if math.Abs(tau) < 2/math.Pi*math.Asin(min(b.r, 1)) {
			return b.word
		}
	}
	return tauBands[len(tauBands)-1].word
}

// TauSizeRule says how TauSize words τ_b, for readers.
func TauSizeRule() string {
	var parts []string
	for i, b := range tauBands[:len(tauBands)-1] {
		parts = append(parts, fmt.Sprintf("%s below %s", b.word, display.Effect.Format(2/math.Pi*math.Asin(b.r))))
		if i == len(tauBands)-2 {
			parts = append(parts, fmt.Sprintf("%s from there", tauBands[i+1].word))
		}
	}
	return strings.Join(parts, ", ") + " (Cohen's benchmarks for a correlation of 0.1, 0.3 and 0.5 carried over to Kendall's τ by τ = (2/π)·arcsin r, from memory)"
}

// testTrend runs the Jonckheere–Terpstra test on a ranking whose groups are
// numbered in their order, finding p as the H test does (see pvalueOf):
// exact when asked for or automatic and the distribution fits its budget;
// else by Monte Carlo when asked for, or automatically for a group under 5
// values or heavy ties (c, the tie correction) if the draws fit; else by the
// normal approximation. Each answer says how and why.
func testTrend(ctx context.Context, s settings, ranking rank.Ranking, labels []string, c float64, progress Progress) (*Trend, error) {
	t, err := trend.Compute(ranking)
	if errors.Is(err, trend.ErrNoSpread) {
		return nil, nil // nothing to test; the warnings say why the data cannot vary
	}
	if err != nil {
		return nil, err
	}
	alt := s.trend
	out := &Trend{Order: labels, Alternative: string(alt), Statistic: t.J, Expected: t.Expected, Variance: t.Variance, Z: t.Z,
		PNormal: t.Normal(alt), TauB: t.TauB, TauBSize: TauSize(t.TauB)}
	out.P, out.PMethod, out.Reason = out.PNormal, string(PValueAsymptotic), report.TrendNormal
	method, automatic := s.pvalue, false
	if method == PValueAuto || method == PValueExact {
		d, err := trend.Exact(ctx, ranking)
		switch {
		case err == nil:
			p := d.P(t.Doubled, alt)
			out.P, out.PExact, out.PMethod, out.Reason = p, &p, string(PValueExact), report.TrendExact
			if x, attained, ok := d.Critical(s.alpha, alt); ok {
				j := float64(x) / 2
				out.CriticalExact, out.AttainedAlpha = &j, &attained
			}
			out.Significant = report.Significant(out.P, s.alpha)
			return out, nil
		case !errors.Is(err, trend.ErrTooLarge):
			return nil, err
		}
		out.Reason = report.TrendTooLarge
		if rough, fits := monteCarloInstead(ranking, c, s.resamples); rough && fits {
			method, automatic = PValueMonteCarlo, true
		}
	}
	if method == PValueMonteCarlo {
		var mcProgress montecarlo.Progress
		if progress != nil {
			mcProgress = func(done, total int) { progress("trend", done, total) }
		}
		mc, err := trend.MonteCarlo(ctx, ranking, t.Doubled, alt, s.resamples, s.seed, mcProgress)
		if err != nil {
			return nil, err
		}
		out.P, out.PMethod = mc.P, string(PValueMonteCarlo)
		out.MonteCarlo = &MonteCarlo{Resamples: mc.Resamples, Seed: mc.Seed, Exceed: mc.Exceed, CILow: mc.Low, CIHigh: mc.High}
		out.Reason = report.TrendMonteCarlo(mc.Resamples, mc.Seed, automatic)
	}
	out.Significant = report.Significant(out.P, s.alpha)
	return out, nil
}

// writeTrend writes the trend test with the names of Trend's json tags, or
// null.
func writeTrend(w *jsonlite.Writer, t *Trend) {
	if t == nil {
		w.Null()
		return
	}
	w.BeginObject()
	w.Key("order")
	w.Strings(t.Order)
	w.StringMember("alternative", t.Alternative)
	w.FloatMember("statistic", t.Statistic)
	w.FloatMember("expected", t.Expected)
	w.FloatMember("variance", t.Variance)
	w.FloatMember("z", t.Z)
	w.FloatMember("p", t.P)
	w.StringMember("p_method", t.PMethod)
	w.OptFloatMember("p_exact", t.PExact)
	w.FloatMember("p_normal", t.PNormal)
	w.Key("monte_carlo")
	writeMonteCarlo(w, t.MonteCarlo)
	w.OptFloatMember("exact_critical_value", t.CriticalExact)
	w.OptFloatMember("exact_attained_alpha", t.AttainedAlpha)
	w.BoolMember("significant", t.Significant)
	w.FloatMember("tau_b", t.TauB)
	w.StringMember("tau_b_size", t.TauBSize)
	w.StringMember("p_method_reason", t.Reason)
	w.EndObject()
}
