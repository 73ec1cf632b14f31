// Package link packs an analysis request into the fragment of a URL, which
// browsers never send to a server, so that a result can be shared by
// sending an address:
//
//	#r1.<base64url without padding (RFC 4648 §5) of the raw DEFLATE stream (RFC 1951) of the request JSON>
//
// or, for a link that carries the results but not the data (package
// findings), the same packing of their JSON after #f1.
//
// Decoding is bounded: a link longer than MaxLink characters or expanding
// beyond MaxJSON bytes is refused before it can exhaust memory.
package link

import (
	"bytes"
	"compress/flate"
	"encoding/base64"
	"errors"
	"fmt"
	"io"
	"strings"
)

// Prefix starts every link fragment that carries the data and settings;
// ResultsPrefix one that carries the results only.
const (
	Prefix        = "#r1."
	ResultsPrefix = "#f1."
)

// Limits of decoding. A browser keeps addresses of at most about 2 MB
// (Chromium's limit), so a longer link could not have arrived whole; and a
// link carries a table for a colleague, not a data warehouse: a DEFLATE bomb
// (up to 1032:1) is refused once 16 MB are unpacked, 0.03 to 0.3 s on this
// project's machine, natively and in the module.
const (
	MaxLink = 2 << 20  // characters of a fragment
	MaxJSON = 16 << 20 // bytes of the request it expands to
)

// Error is a link that cannot be opened.
type Error struct{ Reason string }

func (e *Error) Error() string { return "the link cannot be opened: " + e.Reason }

// Encode packs request JSON into a fragment.
func Encode(request []byte) string { return encode(Prefix, request) }

// EncodeResults packs the JSON of results into a fragment.
func EncodeResults(results []byte) string { return encode(ResultsPrefix, results) }

func encode(prefix string, request []byte) string {
	var b bytes.Buffer
	w, _ := flate.NewWriter(&b, flate.BestCompression) // the level is valid: no error
	w.Write(request)                                   // a bytes.Buffer does not fail
	w.Close()
	return prefix + base64.RawURLEncoding.EncodeToString(b.Bytes())
}

// Decode unpacks a fragment (with or without the leading '#') of either
// kind into the JSON it carries; Results tells the kind.
func Decode(fragment string) ([]byte, error) {
	if !strings.HasPrefix(fragment, "#") {
		fragment = "#" + fragment
	}
	if !strings.HasPrefix(fragment, Prefix) && !strings.HasPrefix(fragment, ResultsPrefix) {
		if version, _, ok := strings.Cut(fragment[1:], "."); ok && isVersion(version) {
			return nil, &Error{fmt.Sprintf("it is in format %q, which this version of Midrank does not know (it reads %q and %q links); open it with the version that made it, or make the link again here", version, Prefix, ResultsPrefix)}
		}
		return nil, &Error{fmt.Sprintf("it does not start with %q or %q; copy the whole address", Prefix, ResultsPrefix)}
	}
	body := fragment[len(Prefix):] // both prefixes have its length
	if len(body) > MaxLink {
		return nil, &Error{fmt.Sprintf("it is longer than %d characters", MaxLink)}
	}
	packed, err := base64.RawURLEncoding.DecodeString(body)
	if err != nil {
		var bad base64.CorruptInputError
		if errors.As(err, &bad) {
			return nil, &Error{fmt.Sprintf("character %d is not part of a link; it may have been cut or changed in transit", int(bad)+len(Prefix)+1)}
		}
		return nil, &Error{"it is damaged (" + err.Error() + ")"}
	}
	r := flate.NewReader(bytes.NewReader(packed))
	defer r.Close()
	var out bytes.Buffer
	out.Grow(min(MaxJSON+1, 8*len(packed))) // text unpacks to a few times its size
	_, err = out.ReadFrom(io.LimitReader(r, MaxJSON+1))
	if err != nil {
		return nil, &Error{"it is damaged or incomplete (" + err.Error() + ")"}
	}
	if out.Len() > MaxJSON {
		return nil, &Error{fmt.Sprintf("it expands to more than %d MB", MaxJSON>>20)}
	}
	return out.Bytes(), nil
}

// isVersion tells whether s looks like a link format's name: a letter and
// digits, as "r1" and "s1".
// ResultsStart begins the JSON of results (package findings writes it
// first), so that a sealed link, whose prefix does not tell, can be told
// apart from one with the data once opened.
const ResultsStart = `{"findings":`

// CarriesResults reports whether opened link JSON holds results only.
func CarriesResults(json []byte) bool { return bytes.HasPrefix(json, []byte(ResultsStart)) }

// Results reports whether a fragment is a results-only link.
func Results(fragment string) bool {
	return strings.HasPrefix(strings.TrimPrefix(fragment, "#"), ResultsPrefix[1:])
}

func isVersion(s string) bool {
	if len(s) < 2 || len(s) > 4 || s[0] < 'a' || s[0] > 'z' {
		return false
	}
	for _, c := range s[1:] {
		if c < '0' || c > '9' {
			return false
		}
	}
	return true
}
