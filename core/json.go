package core

import (
	"errors"
	"slices"
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
	w.BeginObject()
	w.Key("version")
	w.String(r.Version)
	w.Key("n")
	w.Int(int64(r.N))
	w.Key("k")
	w.Int(int64(r.K))
	w.Key("missing")
	w.Int(int64(r.Missing))
	w.Key("alpha")
	w.Float(r.Alpha)
	w.Key("input")
	w.BeginObject()
	w.Key("layout")
	w.String(r.Input.Layout)
	w.Key("separator")
	w.String(r.Input.Separator)
	w.Key("decimal_mark")
	w.String(r.Input.DecimalMark)
	w.Key("header")
	w.Bool(r.Input.Header)
	w.Key("measure")
	w.String(r.Input.Measure)
	w.EndObject()
	w.Key("groups")
	w.BeginArray()
	for _, g := range r.Groups {
		w.BeginObject()
		w.Key("label")
		w.String(g.Label)
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
	w.Key("h")
	w.Float(r.H)
	w.Key("h_uncorrected")
	w.Float(r.HUncorrected)
	w.Key("tie_correction")
	w.Float(r.TieCorrection)
	w.Key("df")
	w.Int(int64(r.DF))
	w.Key("p_asymptotic")
	w.Float(r.PAsymptotic)
	w.Key("p_exact")
	w.OptFloat(r.PExact)
	w.Key("p_monte_carlo")
	w.OptFloat(r.PMonteCarlo)
	w.Key("p_value")
	w.Float(r.PValue)
	w.Key("p_method")
	w.String(r.PMethod)
	w.Key("p_method_reason")
	w.String(r.PMethodReason)
	w.Key("critical_value")
	w.Float(r.CriticalValue)
	w.Key("exact_critical_value")
	w.OptFloat(r.ExactCriticalValue)
	w.Key("exact_attained_alpha")
	w.OptFloat(r.ExactAttainedAlpha)
	w.Key("monte_carlo")
	if mc := r.MonteCarlo; mc == nil {
		w.Null()
	} else {
		w.BeginObject()
		w.Key("resamples")
		w.Int(int64(mc.Resamples))
		w.Key("seed")
		w.Uint(mc.Seed)
		w.Key("exceed")
		w.Int(int64(mc.Exceed))
		w.Key("ci_low")
		w.Float(mc.CILow)
		w.Key("ci_high")
		w.Float(mc.CIHigh)
		w.EndObject()
	}
	w.Key("significant")
	w.Bool(r.Significant)
	w.Key("epsilon_squared")
	w.Float(r.EpsilonSquared)
	w.Key("epsilon_squared_size")
	w.String(r.EpsilonSquaredSize)
	w.Key("eta_squared")
	w.OptFloat(r.EtaSquared)
	w.Key("eta_squared_size")
	w.OptString(r.EtaSquaredSize)
	w.Key("quantile_method")
	w.String(r.QuantileMethod)
	w.Key("ranks")
	writeRanks(&w, r.Ranks)
	w.Key("ranks_complete")
	w.Bool(r.RanksComplete)
	w.Key("ties")
	writeTies(&w, r.Ties)
	w.Key("ties_total")
	w.Int(int64(r.TiesTotal))
	w.Key("ties_complete")
	w.Bool(r.TiesComplete)
	w.Key("posthoc")
	writePostHoc(&w, r.PostHoc)
	w.Key("warnings")
	w.BeginArray()
	for _, m := range r.Warnings {
		w.String(m)
	}
	w.EndArray()
	w.Key("decision")
	w.String(r.Decision)
	w.EndObject()
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
		buf = jsonlite.AppendFloat(buf, v.Value)
		buf = append(buf, `,"rank":`...)
		buf = jsonlite.AppendFloat(buf, v.Rank)
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
		w.Key("value")
		w.Float(t.Value)
		w.Key("count")
		w.Int(int64(t.Count))
		w.EndObject()
	}
	w.EndArray()
}

func writePostHoc(w *jsonlite.Writer, ph *PostHoc) {
	if ph == nil {
		w.Null()
		return
	}
	w.BeginObject()
	w.Key("method")
	w.String(ph.Method)
	w.Key("adjust")
	w.String(ph.Adjust)
	w.Key("confidence")
	w.Float(ph.Confidence)
	w.Key("pairs")
	w.BeginArray()
	for _, p := range ph.Pairs {
		w.BeginObject()
		w.Key("a")
		w.String(p.A)
		w.Key("b")
		w.String(p.B)
		w.Key("statistic")
		w.Float(p.Statistic)
		w.Key("p")
		w.Float(p.P)
		w.Key("p_adjusted")
		w.Float(p.PAdjusted)
		w.Key("significant")
		w.Bool(p.Significant)
		w.Key("exact")
		w.Bool(p.Exact)
		for _, f := range []struct {
			name string
			v    float64
		}{{"probability_of_superiority", p.ProbSuperiority}, {"cliffs_delta", p.CliffsDelta},
			{"hodges_lehmann", p.Shift}, {"hodges_lehmann_low", p.ShiftLow}, {"hodges_lehmann_high", p.ShiftHigh}} {
			w.Key(f.name)
			w.Float(f.v)
		}
		w.EndObject()
	}
	w.EndArray()
	w.Key("letters")
	w.BeginObject()
	labels := make([]string, 0, len(ph.Letters))
	for l := range ph.Letters {
		labels = append(labels, l)
	}
	slices.Sort(labels) // as encoding/json orders map keys
	for _, l := range labels {
		w.Key(l)
		w.String(ph.Letters[l])
	}
	w.EndObject()
	w.EndObject()
}

// ErrorBody is the JSON form of an error: {"error": {...}}. Line, column,
// group, found and option are null when the error is not tied to them.
type ErrorBody struct {
	Error ErrorDetail `json:"error"`
}

// ErrorDetail describes what went wrong and where.
type ErrorDetail struct {
	Message string  `json:"message"`
	Line    *int    `json:"line"`
	Column  *int    `json:"column"`
	Group   *string `json:"group"`
	Found   *string `json:"found"`
	Option  *string `json:"option"`
}

// EncodeError renders any error as ErrorBody JSON, with the place filled in
// for *table.Error and the setting for *OptionError.
func EncodeError(err error) []byte {
	d := ErrorDetail{Message: err.Error()}
	var te *table.Error
	var oe *OptionError
	switch {
	case errors.As(err, &te):
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
	case errors.As(err, &oe):
		d.Option = &oe.Option
	}
	var w jsonlite.Writer
	w.BeginObject()
	w.Key("error")
	w.BeginObject()
	w.Key("message")
	w.String(d.Message)
	w.Key("line")
	w.OptInt(d.Line)
	w.Key("column")
	w.OptInt(d.Column)
	w.Key("group")
	w.OptString(d.Group)
	w.Key("found")
	w.OptString(d.Found)
	w.Key("option")
	w.OptString(d.Option)
	w.EndObject()
	w.EndObject()
	return append(w.Bytes(), '\n')
}

// EncodePage renders one page of a list as JSON.
func EncodePage(p PageOf) []byte {
	var w jsonlite.Writer
	w.BeginObject()
	w.Key("list")
	w.String(string(p.List))
	w.Key("offset")
	w.Int(int64(p.Offset))
	w.Key("total")
	w.Int(int64(p.Total))
	if len(p.Ranks) > 0 {
		w.Key("ranks")
		writeRanks(&w, p.Ranks)
	}
	if len(p.Ties) > 0 {
		w.Key("ties")
		writeTies(&w, p.Ties)
	}
	w.EndObject()
	return append(w.Bytes(), '\n')
}
