package core

import (
	"fmt"
	"slices"

	"midrank/core/adjust"
	"midrank/core/posthoc"
	"midrank/core/protect"
	"midrank/core/table"
	"midrank/core/trend"
)

// settings are validated options in the form the analysis uses.
type settings struct {
	read      table.Options
	edits     table.Edits
	alpha     float64
	pvalue    PValueMethod
	resamples int
	seed      uint64
	pairs     bool // a pairwise comparison was asked for, by posthoc
	posthoc   posthoc.Method
	adjust    adjust.Method
	trend     trend.Alternative // "" when no trend test was asked for
	reference string            // the reference group's label as written in the data, "" for every pair
	// minGroupSize: groups under it are hidden in what is shared (0: none)
	minGroupSize int
	// effectBudget bounds the work of ε²'s interval (see EffectBudget)
	effectBudget int
	// listLimit bounds the values and tie blocks listed in the answer (see ListLimit)
	listLimit int
}

// Check reports the first setting that cannot be used, nil when every one
// can.
func (o Options) Check() error {
	_, err := o.validate()
	return err
}

// validate checks every option and fills in the defaults.
func (o Options) validate() (settings, error) {
	s := settings{alpha: o.Alpha, edits: table.Edits{Order: o.Order, Exclude: o.Exclude, Rename: o.Rename}, effectBudget: EffectBudget, listLimit: ListLimit}
	layout, ok := table.ParseLayout(o.Layout)
	if !ok {
		return s, &OptionError{Option: "layout", Value: o.Layout, Reason: "choose auto, wide, long or counts"}
	}
	s.read.Layout = layout
	s.read.Group, s.read.Measure, s.read.Count = o.Group, o.Measure, o.Count
	if len(o.Measures) > 0 && o.Measures[0] != AllMeasures {
		if o.Measure != "" && len(o.Measures) == 1 && o.Measure != o.Measures[0] {
			return s, &OptionError{Option: "measures", Value: o.Measures[0], Reason: "give the measure column once, as measure or as measures"}
		}
		s.read.Measure = o.Measures[0] // the reading and the preview follow the first
	}
	if o.AdjustAcross != "" && !slices.Contains(AcrossMethods, adjust.Method(o.AdjustAcross)) {
		return s, &OptionError{Option: "adjust_across", Value: o.AdjustAcross, Reason: "choose bh (Benjamini–Hochberg) or holm"}
	}
	switch o.Separator {
	case "", "auto":
	case "tab":
		s.read.Separator = '\t'
	case "semicolon":
		s.read.Separator = ';'
	case "comma":
		s.read.Separator = ','
	default:
		return s, &OptionError{Option: "separator", Value: o.Separator, Reason: "choose auto, tab, semicolon or comma"}
	}
	if s.read.Decimal, ok = table.ParseDecimal(o.Decimal); !ok {
		return s, &OptionError{Option: "decimal", Value: o.Decimal, Reason: "choose auto, point or comma"}
	}
	if s.read.Thousands, ok = table.ParseThousands(o.Thousands); !ok {
		return s, &OptionError{Option: "thousands", Value: o.Thousands, Reason: "choose auto, none, comma, point, space or apostrophe"}
	}
	if s.read.Decimal != table.NoMark && s.read.Decimal == s.read.Thousands {
		return s, &OptionError{Option: "thousands", Value: o.Thousands, Reason: "the decimal mark is the " + o.Decimal + "; choose another thousands separator, or none"}
	}
	if s.alpha == 0 {
		s.alpha = DefaultAlpha
	}
	if !(s.alpha > 0 && s.alpha < 1) {
		return s, &OptionError{Option: "alpha", Value: fmt.Sprint(o.Alpha), Reason: "the significance level must lie strictly between 0 and 1, for example 0.05"}
	}
	var err error
	if s.pvalue, err = choose[PValueMethod]("pvalue", o.PValue); err != nil {
		return s, err
	}
	if s.posthoc, err = choose[posthoc.Method]("posthoc", o.PostHoc); err != nil {
		return s, err
	}
	s.pairs = s.posthoc != NoPairs
	if s.adjust, err = choose[adjust.Method]("adjust", o.Adjust); err != nil {
		return s, err
	}
	if s.reference = o.Reference; s.reference != "" {
		switch {
		case !s.pairs:
			return s, &OptionError{Option: "reference", Value: o.Reference, Reason: "no pairs are compared (posthoc none): choose dunn, conover or mann-whitney to compare each group with it"}
		case s.posthoc.ComparesAllPairs():
			return s, &OptionError{Option: "reference", Value: o.Reference, Reason: s.posthoc.Name() + " compares every pair with every other; to compare each group with one reference group choose dunn, conover or mann-whitney"}
		}
	}
	if s.trend, err = choose[trend.Alternative]("trend", o.Trend); err != nil {
		return s, err
	}
	if s.trend == NoTrend {
		s.trend = ""
	}
	s.resamples = o.Resamples
	switch {
	case s.resamples == 0:
		s.resamples = DefaultResamples
	case s.resamples < 1 || s.resamples > MaxResamples:
		return s, &OptionError{Option: "resamples", Value: fmt.Sprint(o.Resamples), Reason: fmt.Sprintf("choose a whole number from 1 to %d, for example %d", MaxResamples, DefaultResamples)}
	}
	if s.minGroupSize = o.MinGroupSize; s.minGroupSize < 0 || s.minGroupSize > MaxMinGroupSize {
		return s, &OptionError{Option: "min_group_size", Value: fmt.Sprint(o.MinGroupSize), Reason: fmt.Sprintf("choose a whole number from 0 (no protection) to %d, for example %d", MaxMinGroupSize, protect.Suggested)}
	}
	s.seed = DefaultSeed
	if o.Seed != nil {
		if *o.Seed > MaxSeed {
			return s, &OptionError{Option: "seed", Value: fmt.Sprint(*o.Seed), Reason: fmt.Sprintf("a seed is a whole number from 0 to %d", uint64(MaxSeed))}
		}
		s.seed = *o.Seed
	}
	return s, nil
}
