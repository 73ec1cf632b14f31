package core

import (
	"encoding/json"
	"errors"

	"midrank/core/table"
)

// Encode renders a result as the JSON that the command line's --json and
// the WebAssembly module both return, followed by a newline.
func Encode(r *Result) ([]byte, error) {
	b, err := json.Marshal(r)
	if err != nil {
		return nil, err
	}
	return append(b, '\n'), nil
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
	b, _ := json.Marshal(ErrorBody{d}) // strings and ints only: cannot fail
	return append(b, '\n')
}
