package link

import (
	"bytes"
	"compress/flate"
	"encoding/base64"
	"errors"
	"strings"
	"testing"
)

func TestRoundTrip(t *testing.T) {
	for _, req := range []string{`{}`, `{"data":"A,B\n1,2\n","alpha":0.01}`, strings.Repeat(`{"data":"x"}`, 1000)} {
		link := Encode([]byte(req))
		if !strings.HasPrefix(link, Prefix) || strings.ContainsAny(link[len(Prefix):], "+/=") {
			t.Errorf("Encode(%.30q) = %.40q: not base64url without padding", req, link)
		}
		got, err := Decode(link)
		if err != nil || string(got) != req {
			t.Errorf("Decode(Encode(%.30q)) = %.30q, %v", req, got, err)
		}
		if got, err := Decode(strings.TrimPrefix(link, "#")); err != nil || string(got) != req {
			t.Errorf("without '#': %.30q, %v", got, err)
		}
	}
}

// TestKnownLink decodes a fragment made outside the project, with Debian's
// Python 3.11.2: zlib.compressobj(9, zlib.DEFLATED, -15) for a raw DEFLATE
// stream (RFC 1951) and base64.urlsafe_b64encode with the '=' padding
// stripped (RFC 4648 §5).
func TestKnownLink(t *testing.T) {
	const frag = "#r1.q1ZKSSxJVLJS8kgsSsovLdIJyixLLSrOTEnlMjTSMTLkMrTQMTblUtJRSswpyAAqNNAzMKwFAA"
	const want = "{\"data\":\"Harbour,Riverside\n12,21\n18,35\n\",\"alpha\":0.01}"
	if got, err := Decode(frag); err != nil || string(got) != want {
		t.Errorf("Decode = %q, %v; want %q", got, err, want)
	}
}

func TestHostileLinks(t *testing.T) {
	// a DEFLATE bomb: 100 MB of zeros compress to about 100 kB
	var b bytes.Buffer
	w, _ := flate.NewWriter(&b, flate.BestCompression)
	w.Write(make([]byte, 100<<20))
	w.Close()
	bomb := Prefix + base64.RawURLEncoding.EncodeToString(b.Bytes())
	tests := []struct{ name, link, says string }{
		{"other prefix", "#q1abc", "does not start"},
		{"unknown format", "#r2.abc", `format "r2"`},
		{"bad base64", Prefix + "ab$cd", "character"},
		{"not deflate", Prefix + base64.RawURLEncoding.EncodeToString([]byte("hello, world")), "damaged"},
		{"truncated", Encode(make([]byte, 1<<20))[:100], "damaged"},
		{"bomb", bomb, "expands to more than"},
		{"too long", Prefix + strings.Repeat("A", MaxLink+1), "longer than"},
	}
	for _, tt := range tests {
		_, err := Decode(tt.link)
		var e *Error
		if !errors.As(err, &e) || !strings.Contains(err.Error(), tt.says) {
			t.Errorf("%s: error %v, want one saying %q", tt.name, err, tt.says)
		}
	}
}

// FuzzDecode: no panic, errors are *Error, and what decodes re-encodes to a
// link that decodes to the same bytes.
func FuzzDecode(f *testing.F) {
	f.Add(Encode([]byte(`{"data":"A,B\n1,2\n"}`)))
	f.Add("#r1.")
	f.Add("#r1.____")
	f.Fuzz(func(t *testing.T, fragment string) {
		out, err := Decode(fragment)
		if err != nil {
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("error %T %v", err, err)
			}
			return
		}
		again, err := Decode(Encode(out))
		if err != nil || !bytes.Equal(again, out) {
			t.Fatalf("round trip failed: %v", err)
		}
	})
}
