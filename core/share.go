package core

import (
	"bytes"
	"encoding/json"

	"midrank/core/link"
)

// Request is a whole analysis request, the data with its options: what a
// share link carries. Its JSON keys are the module's request keys plus "data".
type Request struct {
	Data string `json:"data"`
	Options
}

// ShareLink packs data and options into a link fragment (package link). The
// link holds the data itself: whoever has the link can read it.
func ShareLink(data []byte, opt Options) (string, error) {
	if _, err := opt.validate(); err != nil {
		return "", err
	}
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetEscapeHTML(false)
	if err := enc.Encode(Request{Data: string(data), Options: opt}); err != nil {
		return "", err
	}
	return link.Encode(bytes.TrimSuffix(b.Bytes(), []byte("\n"))), nil
}

// OpenLink unpacks a link fragment into the data and options it carries,
// refusing unknown keys and settings that cannot be used.
func OpenLink(fragment string) (Request, error) {
	raw, err := link.Decode(fragment)
	if err != nil {
		return Request{}, err
	}
	var r Request
	dec := json.NewDecoder(bytes.NewReader(raw))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&r); err != nil {
		return Request{}, &link.Error{Reason: "what it holds is not a Midrank request (" + err.Error() + ")"}
	}
	if _, err := r.Options.validate(); err != nil {
		return Request{}, err
	}
	return r, nil
}
