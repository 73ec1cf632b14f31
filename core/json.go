package core

import (
	"errors"
	"strconv"

	"midrank/core/jsonlite"
	"midrank/core/rank"
	"midrank/core/table"
)

// Encode renders a result as the JSON that the command line's --json and
// the WebAssembly module both return, followed by a newline. Keys follow the
// json tags of Result, in order; the tests check the bytes against
// encoding/json.
func Encode(r *Result) ([]byte, error) {
	var w jsonlite.Writer
	w.Grow(4096 + 80*len(r.Ranks) + 40*len(r.Ties)) // a listed value takes about 70 bytes
	w.BeginObject()
	w.StringMember("version", r.Version)
	w.IntMember("n", r.N)
	w.IntMember("k", r.K)
	w.IntMember("missing", r.Missing)
	w.FloatMember("alpha", r.Alpha)
	w.Key("input")
	writeInput(&w, r.Input)
	w.Key("groups")
	w.BeginArray()
	for _, g := range r.Groups {
		w.BeginObject()
		w.StringMember("label", g.Label)
		w.StringMember("label_in_data", g.InData)
		for _, f := range []struct {
			name string
			v    float64
		}{{"n", float64(g.N)}, {"missing", float64(g.Missing)}, {"rank_sum", g.RankSum}, {"mean_rank", g.MeanRank},
			{"median", g.Median}, {"q1", g.Q1}, {"q3", g.Q3}, {"min", g.Min}, {"max", g.Max}} {
			w.Key(f.name)
			w.Float(f.v)
		}
		w.EndObject()
	}
	w.EndArray()
	w.Key("levels")
	writeLevels(&w, r.Levels)
	w.FloatMember("h", r.H)
	w.FloatMember("h_uncorrected", r.HUncorrected)
	w.FloatMember("tie_correction", r.TieCorrection)
	w.IntMember("df", r.DF)
	w.FloatMember("p_asymptotic", r.PAsymptotic)
	w.OptFloatMember("p_exact", r.PExact)
	w.OptFloatMember("p_monte_carlo", r.PMonteCarlo)
	w.FloatMember("p_value", r.PValue)
	w.StringMember("p_method", r.PMethod)
	w.StringMember("p_method_reason", r.PMethodReason)
	w.FloatMember("critical_value", r.CriticalValue)
	w.OptFloatMember("exact_critical_value", r.ExactCriticalValue)
	w.OptFloatMember("exact_attained_alpha", r.ExactAttainedAlpha)
	w.Key("monte_carlo")
	writeMonteCarlo(&w, r.MonteCarlo)
	w.BoolMember("significant", r.Significant)
	w.FloatMember("epsilon_squared", r.EpsilonSquared)
	w.StringMember("epsilon_squared_size", r.EpsilonSquaredSize)
	w.Key("epsilon_squared_interval")
	if ci := r.EpsilonSquaredInterval; ci == nil {
		w.Null()
	} else {
		w.BeginObject()
		w.FloatMember("low", ci.Low)
		w.FloatMember("high", ci.High)
		w.FloatMember("level", ci.Level)
		w.IntMember("resamples", ci.Resamples)
		w.Key("seed")
		w.Uint(ci.Seed)
		w.EndObject()
	}
	w.OptFloatMember("eta_squared", r.EtaSquared)
	w.Key("eta_squared_size")
	w.OptString(r.EtaSquaredSize)
	w.StringMember("quantile_method", r.QuantileMethod)
	w.Key("ranks")
	writeRanks(&w, r.Ranks)
	w.BoolMember("ranks_complete", r.RanksComplete)
	w.Key("ties")
	writeTies(&w, r.Ties)
	w.IntMember("ties_total", r.TiesTotal)
	w.BoolMember("ties_complete", r.TiesComplete)
	w.Key("posthoc")
	writePostHoc(&w, r.PostHoc)
	w.Key("trend")
	writeTrend(&w, r.Trend)
	w.Key("protection")
	writeProtection(&w, r.Protection)
	w.Key("warnings")
	writeStrings(&w, r.Warnings)
	w.StringMember("decision", r.Decision)
	w.StringMember("result_line", r.ResultLine)
	w.EndObject()
	if err := w.Err(); err != nil {
		return nil, err
	}
	return append(w.Bytes(), '\n'), nil
}

// writeRanks writes the per-value list, the longest part of a response,
// element by element into one scratch buffer: labels are quoted once per
// group, and no call is made per member.
func writeRanks(w *jsonlite.Writer, ranks []RankedValue) {
	w.BeginArray()
	quoted := map[string][]byte{}
	var buf []byte
	for _, v := range ranks {
		q, ok := quoted[v.Group]
		if !ok {
			q = jsonlite.AppendString(nil, v.Group)
			quoted[v.Group] = q
		}
		buf = append(buf[:0], `{"group":`...)
		buf = append(buf, q...)
		buf = append(buf, `,"value":`...)
		buf = w.AppendFloat(buf, v.Value)
		buf = append(buf, `,"rank":`...)
		buf = w.AppendFloat(buf, v.Rank)
		buf = append(buf, `,"line":`...)
		buf = strconv.AppendInt(buf, int64(v.Line), 10)
		buf = append(buf, `,"shared":`...)
		buf = strconv.AppendInt(buf, int64(v.Shared), 10)
		buf = append(buf, '}')
		w.Raw(buf)
	}
	w.EndArray()
}

func writeTies(w *jsonlite.Writer, ties []rank.Tie) {
	w.BeginArray()
	for _, t := range ties {
		w.BeginObject()
		w.FloatMember("value", t.Value)
		w.IntMember("count", t.Count)
		w.EndObject()
	}
	w.EndArray()
}

func writeInput(w *jsonlite.Writer, in Input) {
	w.BeginObject()
	w.StringMember("layout", in.Layout)
	w.Key("sheet")
	w.OptString(in.Sheet)
	w.StringMember("encoding", in.Encoding)
	w.StringMember("separator", in.Separator)
	w.StringMember("decimal_mark", in.DecimalMark)
	w.StringMember("thousands", in.Thousands)
	w.BoolMember("header", in.Header)
	w.StringMember("measure", in.Measure)
	w.StringMember("group_column", in.GroupColumn)
	w.StringMember("measure_column", in.MeasureColumn)
	w.Key("count_column")
	w.OptString(in.CountColumn)
	w.Key("levels")
	writeStrings(w, in.Levels)
	w.Key("unit")
	w.OptString(in.Unit)
	w.IntMember("unit_cells", in.UnitCells)
	w.StringMember("reason", in.Reason)
	w.Key("other_readings")
	w.OptString(in.OtherReadings)
	w.Key("alternatives")
	w.BeginArray()
	for _, a := range in.Alternatives {
		w.BeginObject()
		w.StringMember("layout", a.Layout)
		w.StringMember("group", a.Group)
		w.StringMember("measure", a.Measure)
		w.StringMember("words", a.Words)
		w.IntMember("groups", a.Groups)
		w.IntMember("values", a.Values)
		w.EndObject()
	}
	w.EndArray()
	w.Key("other_numbers")
	w.OptString(in.OtherNumbers)
	w.Key("excluded")
	writeLeft(w, in.Excluded)
	w.EndObject()
}

func writeLeft(w *jsonlite.Writer, groups []Left) {
	w.BeginArray()
	for _, e := range groups {
		w.BeginObject()
		w.StringMember("label", e.Label)
		w.IntMember("n", e.N)
		w.IntMember("missing", e.Missing)
		w.EndObject()
	}
	w.EndArray()
}

// ErrorBody is the JSON form of an error: {"error": {...}}. Line, column,
// group, found, option and reason are null when the error is not tied to
// them; for a setting, found is the value given.
type ErrorBody struct {
	Error ErrorDetail `json:"error"`
}

// ErrorDetail describes what went wrong and where. Problems lists every
// cell of the data that could not be read (the first is the one described),
// or the data problem itself; it is empty for a setting.
type ErrorDetail struct {
	Message  string          `json:"message"`
	Line     *int            `json:"line"`
	Column   *int            `json:"column"`
	Group    *string         `json:"group"`
	Found    *string         `json:"found"`
	Option   *string         `json:"option"`
	Reason   *string         `json:"reason"`  // for a setting: what is wrong, without the setting's name and value
	Instead  []string        `json:"instead"` // for a setting: its values that would do, if any
	Problems []ProblemDetail `json:"problems"`
}

// ProblemDetail is one data problem and its place.
type ProblemDetail struct {
	Message string  `json:"message"`
	Line    *int    `json:"line"`
	Column  *int    `json:"column"`
	Group   *string `json:"group"`
	Found   *string `json:"found"`
}

func problemOf(te *table.Error) ProblemDetail {
	d := ProblemDetail{Message: te.Error()}
	if te.Line > 0 {
		d.Line = &te.Line
	}
	if te.Column > 0 {
		d.Column = &te.Column
	}
	if te.Group != "" {
		d.Group = &te.Group
	}
	if te.Found != "" {
		d.Found = &te.Found
	}
	return d
}

// Detail describes any error, with the place filled in for data problems
// and the setting for *OptionError.
func Detail(err error) ErrorDetail {
	d := ErrorDetail{Message: err.Error(), Instead: []string{}, Problems: []ProblemDetail{}}
	var ps table.Problems
	var te *table.Error
	var oe *OptionError
	switch {
	case errors.As(err, &ps):
		for _, e := range ps {
			d.Problems = append(d.Problems, problemOf(e))
		}
		first := d.Problems[0]
		d.Line, d.Column, d.Group, d.Found = first.Line, first.Column, first.Group, first.Found
	case errors.As(err, &te):
		first := problemOf(te)
		d.Line, d.Column, d.Group, d.Found = first.Line, first.Column, first.Group, first.Found
		d.Problems = append(d.Problems, first)
	case errors.As(err, &oe):
		d.Option, d.Reason, d.Found = &oe.Option, &oe.Reason, &oe.Value
		d.Instead = append(d.Instead, oe.Instead...)
	}
	return d
}

// EncodeError renders any error as ErrorBody JSON.
func EncodeError(err error) []byte {
	var w jsonlite.Writer
	w.BeginObject()
	w.Key("error")
	writeDetail(&w, Detail(err))
	w.EndObject()
	return append(w.Bytes(), '\n')
}

func writeDetail(w *jsonlite.Writer, d ErrorDetail) {
	w.BeginObject()
	writePlace(w, ProblemDetail{d.Message, d.Line, d.Column, d.Group, d.Found})
	w.Key("option")
	w.OptString(d.Option)
	w.Key("reason")
	w.OptString(d.Reason)
	w.Key("instead")
	w.Strings(d.Instead)
	w.Key("problems")
	writeProblems(w, d.Problems)
	w.EndObject()
}

func writeProblems(w *jsonlite.Writer, ps []ProblemDetail) {
	w.BeginArray()
	for _, p := range ps {
		w.BeginObject()
		writePlace(w, p)
		w.EndObject()
	}
	w.EndArray()
}

// writePlace writes a problem's members into an open object.
func writePlace(w *jsonlite.Writer, p ProblemDetail) {
	w.StringMember("message", p.Message)
	w.Key("line")
	w.OptInt(p.Line)
	w.Key("column")
	w.OptInt(p.Column)
	w.Key("group")
	w.OptString(p.Group)
	w.Key("found")
	w.OptString(p.Found)
}

// EncodePage renders one page of a list as JSON.
func EncodePage(p PageOf) ([]byte, error) {
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("list", string(p.List))
	w.IntMember("offset", p.Offset)
	w.IntMember("total", p.Total)
	if len(p.Ranks) > 0 {
		w.Key("ranks")
		writeRanks(&w, p.Ranks)
	}
	if len(p.Ties) > 0 {
		w.Key("ties")
		writeTies(&w, p.Ties)
	}
	w.EndObject()
	if err := w.Err(); err != nil {
		return nil, err
	}
	return append(w.Bytes(), '\n'), nil
}

// writeStrings writes a list of strings, null for none.
func writeStrings(w *jsonlite.Writer, list []string) {
	if list == nil {
		w.Null()
		return
	}
	w.BeginArray()
	for _, s := range list {
		w.String(s)
	}
	w.EndArray()
}

// writeMonteCarlo writes how a p-value was estimated by Monte Carlo, or null.
func writeMonteCarlo(w *jsonlite.Writer, mc *MonteCarlo) {
	if mc == nil {
		w.Null()
		return
	}
	w.BeginObject()
	w.IntMember("resamples", mc.Resamples)
	w.Key("seed")
	w.Uint(mc.Seed)
	w.IntMember("exceed", mc.Exceed)
	w.FloatMember("ci_low", mc.CILow)
	w.FloatMember("ci_high", mc.CIHigh)
	w.EndObject()
}
