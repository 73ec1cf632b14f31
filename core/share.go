package core

import (
	"midrank/core/jsonlite"
	"midrank/core/link"
)

// Request is a whole analysis request, the data with its options: what a
// share link carries. Its JSON keys are the module's request keys plus "data".
type Request struct {
	Data string `json:"data"`
	Options
}

// JSON renders the request: "data" first, then the options that differ
// from the defaults.
func (r Request) JSON() []byte {
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("data", r.Data)
	r.Options.write(&w)
	w.EndObject()
	return w.Bytes()
}

// ShareLink packs data and options into a link fragment (package link). The
// link holds the data itself: whoever has the link can read it.
func ShareLink(data []byte, opt Options) (string, error) {
	if _, err := opt.validate(); err != nil {
		return "", err
	}
	return link.Encode(Request{Data: string(data), Options: opt}.JSON()), nil
}

// OpenLink unpacks a link fragment into the data and options it carries,
// refusing unknown keys and settings that cannot be used.
func OpenLink(fragment string) (Request, error) {
	raw, err := link.Decode(fragment)
	if err != nil {
		return Request{}, err
	}
	if link.Results(fragment) {
		return Request{}, errResultsOnly
	}
	return ParseRequest(raw)
}

var errResultsOnly = &link.Error{Reason: "it carries results only, without the data, so there is nothing to analyse; open it in the page to read the results"}

// ParseRequest reads request JSON (as a link carries it), refusing unknown
// keys and settings that cannot be used.
func ParseRequest(raw []byte) (Request, error) {
	if link.CarriesResults(raw) {
		return Request{}, errResultsOnly
	}
	var r Request
	names, values, err := jsonlite.ParseObject(raw)
	if err == nil {
		err = r.Options.set(names, values, func(name string, v jsonlite.Value) error {
			if name != "data" || v.Kind != jsonlite.String {
				return &link.Error{Reason: "it holds " + quote(name) + ", which is not part of a Midrank request"}
			}
			r.Data = v.Text
			return nil
		})
	}
	if err != nil {
		return Request{}, &link.Error{Reason: "what it holds is not a Midrank request (" + err.Error() + ")"}
	}
	if _, err := r.Options.validate(); err != nil {
		return Request{}, err
	}
	return r, nil
}

func quote(s string) string {
	var w jsonlite.Writer
	w.String(s)
	return string(w.Bytes())
}
