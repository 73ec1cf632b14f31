package core

import (
	"encoding/json"
	"math"
	"os"
	"strings"
	"testing"
)

// TestTrend: the trend test through Analyze on R's warpbreaks (breaks by
// tension L, M, H; testdata/trend), whose Kendall z with ties is
// −3.3447253403404678 and τ_b −0.36141506730234574 by R 4.2.2's cor.test
// (tools/reference/trend.R): the groups' order is the one set, reversing it
// turns the signs, the direction tested changes p, and the decision and the
// JSON speak of it.
func TestTrend(t *testing.T) {
	data, err := os.ReadFile("../testdata/trend/warpbreaks.csv")
	if err != nil {
		t.Fatal(err)
	}
	const z, tau = -3.3447253403404678, -0.36141506730234574
	for _, c := range []struct {
		order []string
		alt   string
		sign  float64
	}{
		{[]string{"L", "M", "H"}, "decreasing", 1},
		{[]string{"H", "M", "L"}, "increasing", -1},
		{[]string{"L", "M", "H"}, "two-sided", 1},
	} {
		r, err := Analyze(data, Options{Order: c.order, Trend: c.alt})
		if err != nil {
			t.Fatal(err)
		}
		tr := r.Trend
		if tr == nil {
			t.Fatalf("%v %s: no trend in the answer", c.order, c.alt)
		}
		if math.Abs(tr.Z-c.sign*z) > 1e-12 || math.Abs(tr.TauB-c.sign*tau) > 1e-12 {
			t.Errorf("%v: z %v τ_b %v, want %v %v", c.order, tr.Z, tr.TauB, c.sign*z, c.sign*tau)
		}
		if tr.PMethod != "exact" || tr.PExact == nil || !tr.Significant || math.Abs(*tr.PExact-tr.PNormal) > 0.3*tr.PNormal {
			t.Errorf("%v %s: p %v by %s (normal %v), want an exact p near the normal one", c.order, c.alt, tr.P, tr.PMethod, tr.PNormal)
		}
		way := map[float64]string{1: "the values tend to fall", -1: "the values tend to rise"}[c.sign]
		if !strings.Contains(r.Decision, way) || !strings.Contains(r.Decision, "Jonckheere–Terpstra") {
			t.Errorf("%v %s: decision %q", c.order, c.alt, r.Decision)
		}
		js, err := Encode(r)
		if err != nil {
			t.Fatal(err)
		}
		var back struct{ Trend Trend }
		if err := json.Unmarshal(js, &back); err != nil || back.Trend.Z != tr.Z || back.Trend.Alternative != c.alt {
			t.Errorf("JSON trend %+v (%v)", back.Trend, err)
		}
	}
	// the other direction finds nothing
	r, err := Analyze(data, Options{Order: []string{"L", "M", "H"}, Trend: "increasing"})
	if err != nil {
		t.Fatal(err)
	}
	if r.Trend.Significant || r.Trend.P < 0.99 || !strings.Contains(r.Decision, "finds no clear rising trend") {
		t.Errorf("increasing on falling data: p %v, decision %q", r.Trend.P, r.Decision)
	}
	if r, _ := Analyze(data, Options{}); r.Trend != nil {
		t.Errorf("a trend without asking: %+v", r.Trend)
	}
}

// TestTrendMonteCarlo: asked for Monte Carlo, the trend test's p is an
// estimate whose 99% interval holds the exact p of the same data (warpbreaks,
// testdata/trend), and the answer names how it was found.
func TestTrendMonteCarlo(t *testing.T) {
	data, err := os.ReadFile("../testdata/trend/warpbreaks.csv")
	if err != nil {
		t.Fatal(err)
	}
	exact, err := Analyze(data, Options{Trend: "two-sided"})
	if err != nil {
		t.Fatal(err)
	}
	mc, err := Analyze(data, Options{Trend: "two-sided", PValue: "monte-carlo", Resamples: 200_000})
	if err != nil {
		t.Fatal(err)
	}
	tr := mc.Trend
	if tr.PMethod != "monte-carlo" || tr.MonteCarlo == nil || *exact.Trend.PExact < tr.MonteCarlo.CILow || *exact.Trend.PExact > tr.MonteCarlo.CIHigh {
		t.Errorf("Monte Carlo trend %+v, exact p %v", tr, *exact.Trend.PExact)
	}
	if !strings.Contains(tr.Reason, "200,000 random deals") {
		t.Errorf("reason %q", tr.Reason)
	}
}
