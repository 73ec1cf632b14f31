package core

import (
	"slices"
	"strings"

	"midrank/core/adjust"
	"midrank/core/jsonlite"
	"midrank/core/posthoc"
	"midrank/core/trend"
)

// PValueMethod is how the p-value is found, named by its request key.
type PValueMethod string

// The ways to find the p-value; the answer's p_method is one of the last
// three.
const (
	PValueAuto       PValueMethod = "auto"
	PValueExact      PValueMethod = "exact"
	PValueMonteCarlo PValueMethod = "monte-carlo"
	PValueAsymptotic PValueMethod = "asymptotic"
)

// PValueMethods lists them in the order they are offered.
var PValueMethods = []PValueMethod{PValueAuto, PValueAsymptotic, PValueExact, PValueMonteCarlo}

// pvalueLabels name them in a menu.
var pvalueLabels = map[PValueMethod]string{
	PValueAuto: "choose for me", PValueExact: "exact permutation", PValueMonteCarlo: "Monte Carlo",
	PValueAsymptotic: "chi-square approximation",
}

// NoPairs is the posthoc key that asks for no pairwise comparison.
const NoPairs = "none"

// NoTrend is the trend key that asks for no trend test.
const NoTrend = "none"

// trendLabels name the trend test's alternatives in a menu.
var trendLabels = map[trend.Alternative]string{
	trend.Increasing: "values rise along the order", trend.Decreasing: "values fall along the order", trend.TwoSided: "values rise or fall along the order",
}

// Choice is one entry of a menu: the request key and the words shown.
type Choice struct{ Key, Label string }

// Menu is the choices of one option, in the order they are offered; the
// first is the default.
type Menu struct {
	Option  string
	Choices []Choice
}

// Menus are the options whose values are methods: the one list of their
// keys, from which the option parser, the command line's help and the
// page's menus are all made.
var Menus = []Menu{
	{"pvalue", choices(PValueMethods, func(m PValueMethod) string { return pvalueLabels[m] })},
	{"posthoc", append(choices(posthoc.Methods, posthoc.Method.Label), Choice{NoPairs, "no pairwise comparison"})},
	{"adjust", choices(adjust.Methods, adjust.Method.Label)},
	{"adjust_across", choices(AcrossMethods, adjust.Method.Label)},
	{"trend", append([]Choice{{NoTrend, "no trend test"}}, choices(trend.Alternatives, func(a trend.Alternative) string { return trendLabels[a] })...)},
}

func choices[M ~string](methods []M, label func(M) string) []Choice {
	out := make([]Choice, len(methods))
	for i, m := range methods {
		out[i] = Choice{string(m), label(m)}
	}
	return out
}

// Keys lists an option's keys, for help texts.
func Keys(option string) []string {
	for _, m := range Menus {
		if m.Option == option {
			keys := make([]string, len(m.Choices))
			for i, c := range m.Choices {
				keys[i] = c.Key
			}
			return keys
		}
	}
	return nil
}

// EncodeMenus renders Menus as JSON for the page: {"pvalue": [{"key",
// "label"}, …], …}.
func EncodeMenus() []byte {
	var w jsonlite.Writer
	w.BeginObject()
	for _, m := range Menus {
		w.Key(m.Option)
		w.BeginArray()
		for _, c := range m.Choices {
			w.BeginObject()
			w.StringMember("key", c.Key)
			w.StringMember("label", c.Label)
			w.EndObject()
		}
		w.EndArray()
	}
	w.EndObject()
	return w.Bytes()
}

// choose parses an option's key against its menu; "" is the default, the
// first choice.
func choose[M ~string](option, value string) (M, error) {
	keys := Keys(option)
	if value == "" {
		return M(keys[0]), nil
	}
	if slices.Contains(keys, value) {
		return M(value), nil
	}
	return "", &OptionError{Option: option, Value: value, Reason: "choose one of " + strings.Join(keys, ", ")}
}
