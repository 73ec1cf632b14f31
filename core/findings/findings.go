// Package findings is what Midrank shares without the data: one analysis's
// results as outputs that leave the analyst's screen show them (package
// tables' Shared view: no single person's value, no per-value ranks, small
// groups protected when asked), as JSON and as a results-only link (#f1.),
// and the check of that JSON when a link is opened.
//
// The JSON, members in this order ("findings" first, see link.ResultsStart):
//
//	{"findings": 1, "version", "n", "k", "alpha", "measure", "significant",
//	 "reference": label or null, "p_method_reason", "result_line", "decision",
//	 "protection": sentence ("" when none), "warnings": [text, …],
//	 "options": {the settings that differ from the defaults},
//	 "groups": [{"label", "size" (text: "12", "< 5", "not shown"),
//	             "median", "q1", "q3", "mean_rank" (numbers, or null when not shown)}, …],
//	 "tables": {name: table, …} (as tables.Encode writes them)}
package findings

import (
	"strconv"

	"midrank/core"
	"midrank/core/jsonlite"
	"midrank/core/link"
	"midrank/core/tables"
)

// Format is the version of the JSON above; a link of another is refused.
const Format = 1

// Encode writes the results of r, analysed with opt, as they may be shared.
func Encode(r *core.Result, opt core.Options) ([]byte, error) {
	plan := r.Plan()
	var w jsonlite.Writer
	w.BeginObject()
	w.IntMember("findings", Format)
	w.StringMember("version", r.Version)
	w.IntMember("n", r.N)
	w.IntMember("k", r.K)
	w.FloatMember("alpha", r.Alpha)
	w.StringMember("measure", r.Input.Measure)
	w.BoolMember("significant", r.Significant)
	w.Key("reference")
	if r.PostHoc != nil && r.PostHoc.Reference != nil {
		w.String(*r.PostHoc.Reference)
	} else {
		w.Null()
	}
	w.StringMember("p_method_reason", r.SharedMethodReason())
	w.StringMember("result_line", r.ResultLine)
	w.StringMember("decision", r.SharedDecision())
	w.StringMember("protection", r.ProtectionNote())
	w.Key("warnings")
	w.Strings(r.SharedWarnings())
	w.Key("options")
	w.Raw(opt.JSON())
	w.Key("groups")
	w.BeginArray()
	for g, group := range r.Groups {
		w.BeginObject()
		w.StringMember("label", group.Label)
		size := strconv.Itoa(group.N)
		if plan.Hidden(g) {
			size = plan.Size(g)
		}
		w.StringMember("size", size)
		for _, f := range []struct {
			name  string
			v     float64
			shown bool
		}{{"median", group.Median, !plan.Hidden(g)}, {"q1", group.Q1, !plan.Hidden(g)}, {"q3", group.Q3, !plan.Hidden(g)},
			{"mean_rank", group.MeanRank, !plan.Any()}} {
			w.Key(f.name)
			if f.shown {
				w.Float(f.v)
			} else {
				w.Null()
			}
		}
		w.EndObject()
	}
	w.EndArray()
	shared, err := tables.Encode(tables.Shared(r))
	if err != nil {
		return nil, err
	}
	w.Key("tables")
	w.Raw(shared)
	w.EndObject()
	return w.Bytes(), w.Err()
}

// EncodeBattery writes the results of a battery of measures, analysed
// with opt, as they may be shared (the page's reports of a battery):
//
//	{"overview": the overview table as shared, "measures": [each measure's results as Encode writes them, or null]}
func EncodeBattery(b *core.Battery, opt core.Options) ([]byte, error) {
	return tables.EncodeMeasures(tables.SharedOverview(b), b, func(r *core.Result) ([]byte, error) { return Encode(r, opt) })
}

// Link is a results-only link to the results of r, analysed with opt.
func Link(r *core.Result, opt core.Options) (string, error) {
	b, err := Encode(r, opt)
	if err != nil {
		return "", err
	}
	return link.EncodeResults(b), nil
}
