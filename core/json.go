package core

import (
	"bytes"
	"encoding/json"
	"errors"

	"midrank/core/table"
)

// Encode renders a result as the JSON that the command line's --json and
// the WebAssembly module both return, followed by a newline.
func Encode(r *Result) ([]byte, error) {
	return marshal(r)
}

// marshal writes v as one line of JSON without HTML escaping: labels such
// as "R&D" stay readable, and the page only ever sets them as text.
func marshal(v any) ([]byte, error) {
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetEscapeHTML(false)
	if err := enc.Encode(v); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// ErrorBody is the JSON form of an error: {"error": {...}}. Line, column,
// group and found are null when the error is not tied to them.
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
	b, _ := marshal(ErrorBody{d}) // strings and ints only: cannot fail
	return b
}

// EncodePage renders one page of a list as JSON.
func EncodePage(p PageOf) []byte {
	b, _ := marshal(p) // finite numbers and strings only: cannot fail
	return b
}
