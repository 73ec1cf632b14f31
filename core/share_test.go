package core

import (
	"errors"
	"testing"

	"midrank/core/link"
)

func TestShareLinkRoundTrip(t *testing.T) {
	seed := uint64(42)
	opt := Options{Layout: "long", Alpha: 0.01, PValue: "monte-carlo", Resamples: 5000, Seed: &seed, PostHoc: "dscf", Adjust: "bh"}
	data := "site,minutes\nNorth,3\nSouth,4\nNorth,5\n<img src=x onerror=alert(1)>,7\n"
	frag, err := ShareLink([]byte(data), opt)
	if err != nil {
		t.Fatal(err)
	}
	r, err := OpenLink(frag)
	if err != nil {
		t.Fatal(err)
	}
	if r.Data != data || r.Layout != "long" || r.Alpha != 0.01 || *r.Seed != 42 || r.PostHoc != "dscf" || r.Adjust != "bh" || r.Resamples != 5000 {
		t.Errorf("OpenLink(ShareLink) = %+v", r)
	}
	a, _ := Encode(mustAnalyze(t, []byte(data), opt))
	b, _ := Encode(mustAnalyze(t, []byte(r.Data), r.Options))
	if string(a) != string(b) {
		t.Error("the reopened request analyses differently")
	}
}

func mustAnalyze(t *testing.T, data []byte, opt Options) *Result {
	t.Helper()
	r, err := Analyze(data, opt)
	if err != nil {
		t.Fatal(err)
	}
	return r
}

func TestOpenLinkRefuses(t *testing.T) {
	for _, req := range []string{`{"data":"A,B\n1,2","alhpa":0.1}`, `{"data":"A,B","alpha":7}`, `[1,2,3]`, `{"data":`} {
		_, err := OpenLink(link.Encode([]byte(req)))
		var le *link.Error
		var oe *OptionError
		if !errors.As(err, &le) && !errors.As(err, &oe) {
			t.Errorf("OpenLink(%s) error %v, want a link or option error", req, err)
		}
	}
}
