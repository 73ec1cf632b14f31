package core

import (
	"bytes"
	"fmt"
	"maps"
	"slices"
	"strconv"
	"strings"

	"midrank/core/jsonlite"
	"midrank/core/table"
)

// Options are the settings of one analysis. The JSON names are the request
// keys of the WebAssembly module and of share links; the command line's
// flags carry the same names. Zero values mean the defaults.
type Options struct {
	Layout    string `json:"layout,omitempty"`    // auto (default), wide, long, counts
	Separator string `json:"separator,omitempty"` // auto (default), tab, semicolon, comma
	Decimal   string `json:"decimal,omitempty"`   // auto (default), point, comma
	Thousands string `json:"thousands,omitempty"` // auto (default), none, comma, point, space, apostrophe
	Group     string `json:"group,omitempty"`     // the column of group labels (header or 1-based number); implies long
	Measure   string `json:"measure,omitempty"`   // the column of values (header or 1-based number); implies long
	// Measures are several measure columns (headers or 1-based numbers), or
	// {AllMeasures}: each is analysed against the same groups (see
	// AnalyzeMeasures); one name alone is the same as Measure.
	Measures     []string `json:"measures,omitempty"`
	AdjustAcross string   `json:"adjust_across,omitempty"` // with several measures: bh (default) or holm
	Count        string   `json:"count,omitempty"`         // a column of counts: each row stands for that many values; implies long
	Sheet        string   `json:"sheet,omitempty"`         // a spreadsheet file's sheet, by name or 1-based number; default the first
	Alpha        float64  `json:"alpha,omitempty"`         // significance level, default 0.05
	PValue       string   `json:"pvalue,omitempty"`        // auto (default), asymptotic, exact, monte-carlo
	Resamples    int      `json:"resamples,omitempty"`     // Monte Carlo resamples, default 100,000
	Seed         *uint64  `json:"seed,omitempty"`          // Monte Carlo seed, default 1
	PostHoc      string   `json:"posthoc,omitempty"`       // dunn (default), conover, dscf, mann-whitney, none
	Adjust       string   `json:"adjust,omitempty"`        // holm (default), bonferroni, sidak, hochberg, bh, by, none
	// Reference, a group's label as written in the data, compares each other
	// group with it alone instead of every pair with every other (the
	// adjustment then runs over k−1 comparisons).
	Reference string `json:"reference,omitempty"`
	// Trend asks for the Jonckheere–Terpstra test along the groups' order
	// (the data's, or Order's): none (default), increasing, decreasing or
	// two-sided.
	Trend string `json:"trend,omitempty"`
	// MinGroupSize protects small groups in what is shared: groups with
	// fewer values (and those hidden with them, see package protect) show
	// no figures in reports, files and links; 0 (default) for none. The
	// analysis itself is the same.
	MinGroupSize int `json:"min_group_size,omitempty"`

	// Group edits, each naming groups by their labels as written in the data
	// (see table.Edits): the groups to put first, in order; the groups to
	// leave out; the names to show instead of labels.
	Order   []string          `json:"order,omitempty"`
	Exclude []string          `json:"exclude,omitempty"`
	Rename  map[string]string `json:"rename,omitempty"`
}

// Defaults and ranges of the settings.
const (
	DefaultAlpha     = 0.05 // common practice
	DefaultResamples = 100_000
	DefaultSeed      = 1
	MaxResamples     = 100_000_000
	MaxMinGroupSize  = 1000 // the largest threshold for protecting small groups
	// MaxSeed is 2⁵³ − 1, the largest whole number JavaScript holds exactly,
	// so that a seed survives the page, its links and its JSON unchanged.
	MaxSeed = 1<<53 - 1
)

// Several reports whether the options ask for several measures (a
// battery, see AnalyzeMeasures) rather than one.
func (o Options) Several() bool {
	return len(o.Measures) > 1 || len(o.Measures) == 1 && o.Measures[0] == AllMeasures
}

// ForLabels drops the group edits that name labels not among labels (see
// table.Edits.For).
func (o Options) ForLabels(labels []string) Options {
	e := table.Edits{Order: o.Order, Exclude: o.Exclude, Rename: o.Rename}.For(labels)
	o.Order, o.Exclude, o.Rename = e.Order, e.Exclude, e.Rename
	return o
}

// Defaults are the settings used where none is given, written out, for the
// page to show: the one place the defaults are kept is here.
func Defaults() Options {
	seed := uint64(DefaultSeed)
	return Options{Layout: "auto", Separator: "auto", Decimal: "auto", Thousands: "auto", Alpha: DefaultAlpha, PValue: Keys("pvalue")[0],
		Resamples: DefaultResamples, Seed: &seed, PostHoc: Keys("posthoc")[0], Adjust: Keys("adjust")[0], AdjustAcross: Keys("adjust_across")[0],
		Trend: Keys("trend")[0]}
}

// OptionError is a setting that cannot be used.
type OptionError struct {
	Option  string   // the request key, e.g. "alpha"
	Value   string   // the value given
	Reason  string   // what is wrong (and, without Instead, what to do)
	Instead []string // values of the same setting that would do, when there are some: the page names them by its own labels
}

func (e *OptionError) Error() string {
	s := fmt.Sprintf("%s %q: %s", e.Option, e.Value, e.Reason)
	if n := len(e.Instead); n > 0 {
		s += "; choose " + strings.Join(e.Instead[:n-1], ", ")
		if n > 1 {
			s += " or "
		}
		s += e.Instead[n-1]
	}
	return s
}

// DecodeOptions reads options from JSON, refusing unknown keys so that a
// misspelt setting is not silently ignored. Empty input means the defaults.
func DecodeOptions(data []byte) (Options, error) {
	var o Options
	if len(bytes.TrimSpace(data)) == 0 {
		return o, nil
	}
	names, values, err := jsonlite.ParseObject(data)
	if err == nil {
		err = o.set(names, values, nil)
	}
	if err != nil {
		return o, &OptionError{Option: "options", Value: string(data), Reason: "not valid options JSON (" + err.Error() + ")"}
	}
	return o, nil
}

// set assigns the members of a parsed object to the options; other names
// go to extra, or are an error when extra is nil. A null member keeps the
// default.
func (o *Options) set(names []string, values map[string]jsonlite.Value, extra func(name string, v jsonlite.Value) error) error {
	for _, name := range names {
		v := values[name]
		if v.Kind == jsonlite.Null {
			continue
		}
		text := map[string]*string{"layout": &o.Layout, "separator": &o.Separator, "decimal": &o.Decimal, "thousands": &o.Thousands, "group": &o.Group, "measure": &o.Measure, "count": &o.Count, "sheet": &o.Sheet,
			"pvalue": &o.PValue, "posthoc": &o.PostHoc, "adjust": &o.Adjust, "adjust_across": &o.AdjustAcross, "trend": &o.Trend, "reference": &o.Reference}
		if dst, ok := text[name]; ok {
			if v.Kind != jsonlite.String {
				return fmt.Errorf("%q must be a string", name)
			}
			*dst = v.Text
			continue
		}
		switch name {
		case "measures":
			if v.Kind != jsonlite.List {
				return fmt.Errorf("%q must be an array of column names or numbers", name)
			}
			o.Measures = v.Items
			if len(o.Measures) == 0 {
				o.Measures = nil // as when left out
			}
		case "order", "exclude":
			if v.Kind != jsonlite.List {
				return fmt.Errorf("%q must be an array of group labels", name)
			}
			items := v.Items
			if len(items) == 0 {
				items = nil // as when left out
			}
			if name == "order" {
				o.Order = items
			} else {
				o.Exclude = items
			}
		case "rename":
			if v.Kind != jsonlite.Record {
				return fmt.Errorf("%q must be an object from group labels to names", name)
			}
			o.Rename = nil
			for _, f := range v.Fields {
				if o.Rename == nil {
					o.Rename = map[string]string{}
				}
				o.Rename[f.Name] = f.Text
			}
		case "alpha":
			f, err := number(name, v)
			if err != nil {
				return err
			}
			if f == 0 { // zero in Options means the default; written out, it is a mistake
				return fmt.Errorf("%q must lie strictly between 0 and 1", name)
			}
			o.Alpha = f
		case "resamples":
			n, err := wholeNumber(name, v)
			if err != nil || n < 1 || n > MaxResamples {
				return fmt.Errorf("%q must be a whole number from 1 to %d", name, MaxResamples)
			}
			o.Resamples = int(n)
		case "min_group_size":
			n, err := wholeNumber(name, v)
			if err != nil || n < 0 || n > MaxMinGroupSize {
				return fmt.Errorf("%q must be a whole number from 0 to %d", name, MaxMinGroupSize)
			}
			o.MinGroupSize = int(n)
		case "seed":
			n, err := wholeNumber(name, v)
			if err != nil || n < 0 {
				return fmt.Errorf("%q must be a whole number from 0", name)
			}
			seed := uint64(n)
			o.Seed = &seed
		default:
			if extra == nil {
				return fmt.Errorf("unknown option %q", name)
			}
			if err := extra(name, v); err != nil {
				return err
			}
		}
	}
	return nil
}

func number(name string, v jsonlite.Value) (float64, error) {
	if v.Kind != jsonlite.Number {
		return 0, fmt.Errorf("%q must be a number", name)
	}
	return strconv.ParseFloat(v.Text, 64)
}

// wholeNumber reads an integer that fits int64 (written without fraction).
func wholeNumber(name string, v jsonlite.Value) (int64, error) {
	if v.Kind != jsonlite.Number {
		return 0, fmt.Errorf("%q must be a whole number", name)
	}
	n, err := strconv.ParseInt(v.Text, 10, 64)
	if err != nil {
		return 0, fmt.Errorf("%q must be a whole number", name)
	}
	return n, nil
}

// JSON renders the options that differ from the defaults as an object.
func (o Options) JSON() []byte {
	var w jsonlite.Writer
	w.BeginObject()
	o.write(&w)
	w.EndObject()
	return w.Bytes()
}

// write appends the options that differ from the defaults, with the names
// of their json tags, as members of an open object.
func (o Options) write(w *jsonlite.Writer) {
	for _, f := range []struct{ name, v string }{{"layout", o.Layout}, {"separator", o.Separator}, {"decimal", o.Decimal}, {"thousands", o.Thousands}, {"group", o.Group}, {"measure", o.Measure}, {"count", o.Count}, {"sheet", o.Sheet}} {
		if f.v != "" {
			w.Key(f.name)
			w.String(f.v)
		}
	}
	if o.Alpha != 0 {
		w.FloatMember("alpha", o.Alpha)
	}
	if o.PValue != "" {
		w.StringMember("pvalue", o.PValue)
	}
	if o.Resamples != 0 {
		w.IntMember("resamples", o.Resamples)
	}
	if o.Seed != nil {
		w.Key("seed")
		w.Uint(*o.Seed)
	}
	if o.MinGroupSize != 0 {
		w.IntMember("min_group_size", o.MinGroupSize)
	}
	if len(o.Measures) > 0 {
		w.Key("measures")
		w.Strings(o.Measures)
	}
	for _, f := range []struct{ name, v string }{{"adjust_across", o.AdjustAcross}, {"posthoc", o.PostHoc}, {"adjust", o.Adjust}, {"reference", o.Reference}, {"trend", o.Trend}} {
		if f.v != "" {
			w.Key(f.name)
			w.String(f.v)
		}
	}
	for _, f := range []struct {
		name  string
		items []string
	}{{"order", o.Order}, {"exclude", o.Exclude}} {
		if len(f.items) > 0 {
			w.Key(f.name)
			w.Strings(f.items)
		}
	}
	if len(o.Rename) > 0 {
		w.Key("rename")
		var fields []jsonlite.Field
		for _, from := range slices.Sorted(maps.Keys(o.Rename)) {
			fields = append(fields, jsonlite.Field{Name: from, Text: o.Rename[from]})
		}
		w.Fields(fields)
	}
}
