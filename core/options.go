package core

import (
	"bytes"
	"encoding/json"
	"fmt"
	"slices"
	"strings"

	"midrank/core/adjust"
	"midrank/core/posthoc"
	"midrank/core/table"
)

// Options are the settings of one analysis. The JSON names are the request
// keys of the WebAssembly module and of share links; the command line's
// flags carry the same names. Zero values mean the defaults.
type Options struct {
	Layout    string  `json:"layout,omitempty"`    // auto (default), wide, long
	Separator string  `json:"separator,omitempty"` // auto (default), tab, semicolon, comma
	Decimal   string  `json:"decimal,omitempty"`   // auto (default: comma accepted unless comma separates), point
	Alpha     float64 `json:"alpha,omitempty"`     // significance level, default 0.05
	PValue    string  `json:"pvalue,omitempty"`    // auto (default), asymptotic, exact, monte-carlo
	Resamples int     `json:"resamples,omitempty"` // Monte Carlo resamples, default 100,000
	Seed      *uint64 `json:"seed,omitempty"`      // Monte Carlo seed, default 1
	PostHoc   string  `json:"posthoc,omitempty"`   // dunn (default), conover, dscf, mann-whitney, none
	Adjust    string  `json:"adjust,omitempty"`    // holm (default), bonferroni, sidak, hochberg, bh, by, none
}

// Defaults and ranges of the settings.
const (
	DefaultAlpha     = 0.05 // common practice
	DefaultResamples = 100_000
	DefaultSeed      = 1
	MaxResamples     = 100_000_000
	// MaxSeed is 2⁵³ − 1, the largest whole number JavaScript holds exactly,
	// so that a seed survives the page, its links and its JSON unchanged.
	MaxSeed = 1<<53 - 1
)

// OptionError is a setting that cannot be used.
type OptionError struct {
	Option string // the request key, e.g. "alpha"
	Value  string // the value given
	Reason string // what is wrong and what to do
}

func (e *OptionError) Error() string {
	return fmt.Sprintf("%s %q: %s", e.Option, e.Value, e.Reason)
}

// The method names of each setting; the first is the default.
var (
	pvalueMethods  = []string{"auto", "asymptotic", "exact", "monte-carlo"}
	posthocMethods = posthoc.Methods
	adjustMethods  = adjust.Methods
)

// DecodeOptions reads options from JSON, refusing unknown keys so that a
// misspelt setting is not silently ignored. Empty input means the defaults.
func DecodeOptions(data []byte) (Options, error) {
	var o Options
	if len(bytes.TrimSpace(data)) == 0 {
		return o, nil
	}
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&o); err != nil {
		return o, &OptionError{Option: "options", Value: string(data), Reason: "not valid options JSON (" + err.Error() + ")"}
	}
	return o, nil
}

// settings are validated options in the form the analysis uses.
type settings struct {
	read      table.Options
	alpha     float64
	pvalue    string
	resamples int
	seed      uint64
	posthoc   string
	adjust    string
}

// validate checks every option and fills in the defaults.
func (o Options) validate() (settings, error) {
	s := settings{alpha: o.Alpha, pvalue: o.PValue, posthoc: o.PostHoc, adjust: o.Adjust}
	layout, ok := table.ParseLayout(o.Layout)
	if !ok {
		return s, &OptionError{"layout", o.Layout, "choose auto, wide or long"}
	}
	s.read.Layout = layout
	switch o.Separator {
	case "", "auto":
	case "tab":
		s.read.Separator = '\t'
	case "semicolon":
		s.read.Separator = ';'
	case "comma":
		s.read.Separator = ','
	default:
		return s, &OptionError{"separator", o.Separator, "choose auto, tab, semicolon or comma"}
	}
	switch o.Decimal {
	case "", "auto":
	case "point":
		s.read.DecimalPoint = true
	default:
		return s, &OptionError{"decimal", o.Decimal, "choose auto or point"}
	}
	if s.alpha == 0 {
		s.alpha = DefaultAlpha
	}
	if !(s.alpha > 0 && s.alpha < 1) {
		return s, &OptionError{"alpha", fmt.Sprint(o.Alpha), "the significance level must lie strictly between 0 and 1, for example 0.05"}
	}
	var err error
	if s.pvalue, err = choose("pvalue", o.PValue, pvalueMethods); err != nil {
		return s, err
	}
	if s.posthoc, err = choose("posthoc", o.PostHoc, posthocMethods); err != nil {
		return s, err
	}
	if s.adjust, err = choose("adjust", o.Adjust, adjustMethods); err != nil {
		return s, err
	}
	s.resamples = o.Resamples
	switch {
	case s.resamples == 0:
		s.resamples = DefaultResamples
	case s.resamples < 1 || s.resamples > MaxResamples:
		return s, &OptionError{"resamples", fmt.Sprint(o.Resamples), fmt.Sprintf("choose a whole number from 1 to %d, for example %d", MaxResamples, DefaultResamples)}
	}
	s.seed = DefaultSeed
	if o.Seed != nil {
		if *o.Seed > MaxSeed {
			return s, &OptionError{"seed", fmt.Sprint(*o.Seed), fmt.Sprintf("a seed is a whole number from 0 to %d", uint64(MaxSeed))}
		}
		s.seed = *o.Seed
	}
	return s, nil
}

// choose checks a method name against the known ones; "" is the first.
func choose(option, value string, known []string) (string, error) {
	if value == "" {
		return known[0], nil
	}
	if slices.Contains(known, value) {
		return value, nil
	}
	return "", &OptionError{option, value, "choose one of " + strings.Join(known, ", ")}
}
