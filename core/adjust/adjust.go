// Package adjust corrects p-values for multiple comparisons, each method as
// R's p.adjust defines it (monotone in the raw p-values, capped at 1).
package adjust

import (
	"fmt"
	"math"
	"slices"
)

// Method is a way of adjusting, named by its request key.
type Method string

// The methods.
const (
	Holm       Method = "holm"
	Bonferroni Method = "bonferroni"
	Sidak      Method = "sidak"
	Hochberg   Method = "hochberg"
	BH         Method = "bh"
	BY         Method = "by"
	None       Method = "none"
)

// Methods lists the methods in the order they are offered.
var Methods = []Method{Holm, Bonferroni, Sidak, Hochberg, BH, BY, None}

// words are each method's label in a menu and its name in prose.
var words = map[Method]struct{ label, prose string }{
	Holm:       {"Holm", "Holm's step-down method (Holm 1979)"},
	Bonferroni: {"Bonferroni", "the Bonferroni correction"},
	Sidak:      {"Šidák", "the Šidák correction (Šidák 1967)"},
	Hochberg:   {"Hochberg", "Hochberg's step-up method (Hochberg 1988)"},
	BH:         {"Benjamini–Hochberg (false discovery rate)", "the Benjamini–Hochberg false discovery rate (Benjamini & Hochberg 1995)"},
	BY:         {"Benjamini–Yekutieli (false discovery rate)", "the Benjamini–Yekutieli false discovery rate (Benjamini & Yekutieli 2001)"},
	None:       {"none", "no adjustment"},
}

// Known tells whether m is one of Methods.
func (m Method) Known() bool { _, ok := words[m]; return ok }

// Label is the method's name in a menu.
func (m Method) Label() string { return words[m].label }

// Name is the method's name in prose.
func (m Method) Name() string { return words[m].prose }

// Adjust returns the adjusted p-values of p by method. With m the number of
// p-values and p₍₁₎ ≤ … ≤ p₍m₎ the sorted ones:
//
//	bonferroni  min(1, m·p)
//	sidak       1 − (1 − p)^m, as −expm1(m·log1p(−p)) so small p keep their digits
//	holm        max over j ≤ i of min(1, (m − j + 1)·p₍j₎)
//	hochberg    min over j ≥ i of min(1, (m − j + 1)·p₍j₎)
//	bh          min over j ≥ i of min(1, m/j·p₍j₎)
//	by          min over j ≥ i of min(1, (Σ 1/l)·m/j·p₍j₎)
//	none        p
func Adjust(p []float64, method Method) ([]float64, error) {
	m := float64(len(p))
	out := make([]float64, len(p))
	order := make([]int32, len(p)) // ascending p, ties in input order (int32: the module's one stable sort of indices)
	for i := range order {
		order[i] = int32(i)
	}
	slices.SortStableFunc(order, func(a, b int32) int {
		switch {
		case p[a] < p[b]:
			return -1
		case p[a] > p[b]:
			return 1
		}
		return 0
	})
	switch method {
	case None:
		copy(out, p)
	case Bonferroni:
		for i, v := range p {
			out[i] = math.Min(1, float64(m*v))
		}
	case Sidak:
		for i, v := range p {
			out[i] = math.Min(1, -math.Expm1(float64(m*math.Log1p(-v))))
		}
	case Holm:
		run := 0.0
		for j, i := range order {
			run = math.Max(run, math.Min(1, float64((m-float64(j))*p[i])))
			out[i] = run
		}
	case Hochberg, BH, BY:
		factor := 1.0
		if method == BY {
			factor = 0
			for l := 1; l <= len(p); l++ {
				factor += 1 / float64(l)
			}
		}
		run := 1.0
		for j := len(order) - 1; j >= 0; j-- {
			i := order[j]
			rank := float64(j + 1)
			var v float64
			if method == Hochberg {
				v = float64((m - rank + 1) * p[i])
			} else {
				v = float64(factor * m / rank * p[i])
			}
			run = math.Min(run, math.Min(1, v))
			out[i] = run
		}
	default:
		return nil, fmt.Errorf("adjust: unknown method %q", method)
	}
	return out, nil
}
