package report

import (
	"strings"
	"testing"
)

func TestDecision(t *testing.T) {
	base := Facts{Labels: []string{"North", "South", "East"}, Sizes: []int{8, 9, 4}, Measure: "minutes",
		H: 7.1234, DF: 2, P: 0.0284, Method: "asymptotic", Alpha: 0.05, Epsilon: 0.356, Size: "large"}
	tests := []struct {
		name    string
		change  func(*Facts)
		says    []string
		saysNot []string
	}{
		{"significant", func(*Facts) {},
			[]string{"3 groups (North, South and East; 21 values in all)", `on "minutes"`, "H = 7.12 with 2 degrees of freedom and p = .028",
				"is statistically significant", "does not say which groups differ", "ε² = 0.36 is large",
				"Group East has fewer than 5 values", "similar shape", Caution},
			[]string{"not statistically significant"}},
		{"not significant", func(f *Facts) { f.P = 0.31 },
			[]string{"is not statistically significant", "not proof that they are the same", Caution},
			[]string{"which groups differ"}},
		{"at alpha exactly", func(f *Facts) { f.P = 0.05 }, []string{"is statistically significant"}, nil},
		{"exact p needs no approximation caution", func(f *Facts) { f.Method = "exact" },
			[]string{"exact permutation p-value"}, []string{"approximation behind p"}},
		{"tiny p", func(f *Facts) { f.P = 3e-12 }, []string{"p < .001"}, nil},
		{"unreachable", func(f *Facts) { f.Method, f.Unreachable, f.P = "exact", true, 0.2 },
			[]string{"no arrangement of the ranks is rare enough"}, nil},
		{"Monte Carlo straddling alpha", func(f *Facts) {
			f.Method, f.P, f.Resamples, f.Seed, f.Low, f.High = "monte-carlo", 0.049, 1000, 3, 0.034, 0.067
		}, []string{"1,000 resamples, random reshuffles of the ranks among the groups (seed 3)", "from .034 to .067", "not firm"}, []string{"approximation behind p"}},
	}
	for _, tt := range tests {
		f := base
		tt.change(&f)
		got := Decision(f)
		for _, s := range tt.says {
			if !strings.Contains(got, s) {
				t.Errorf("%s: decision lacks %q:\n%s", tt.name, s, got)
			}
		}
		for _, s := range tt.saysNot {
			if strings.Contains(got, s) {
				t.Errorf("%s: decision has %q:\n%s", tt.name, s, got)
			}
		}
	}
}

// TestNumber: prose shows figures as the tables do (four significant
// digits, an exponent below 0.0001 and from a million up).
func TestNumber(t *testing.T) {
	for v, want := range map[float64]string{0: "0", 7.98823: "7.988", 0.05: "0.05", 12345.678: "12350", 3.2e-7: "3.2e-7", 2.5e6: "2.5e6"} {
		if got := Number(v); got != want {
			t.Errorf("Number(%v) = %q, want %q", v, got, want)
		}
	}
}

func TestDecisionPairs(t *testing.T) {
	f := Facts{Labels: []string{"A", "B", "C"}, Sizes: []int{8, 8, 8}, H: 9, DF: 2, P: 0.011, Method: "asymptotic", Alpha: 0.05,
		Epsilon: 0.39, Size: "large", PairMethod: "Dunn's test (Dunn 1964)", AdjustName: "Holm's step-down method (Holm 1979)", PairsTested: 3,
		Differences: []Difference{{Higher: "C", Lower: "A", PAdjusted: 0.008, Superiority: 0.84, Shift: 4.5}},
		Medians:     []float64{10, 12, 15}, Q1: []float64{8, 9, 13}, Q3: []float64{11, 14, 18.25}}
	got := Decision(f)
	for _, s := range []string{"Medians (lower to upper quartile): A 10 (8 to 11, n = 8); B 12 (9 to 14, n = 8); C 15 (13 to 18.25, n = 8).",
		"All 3 pairs of groups were compared with Dunn's test", "controlled with Holm's",
		"Values in C tend to be higher than in A, by 4.5 (the Hodges–Lehmann estimate of the shift): adjusted p = .008, probability of superiority 0.84.",
		"The other 2 pairs show no significant difference."} {
		if !strings.Contains(got, s) {
			t.Errorf("decision lacks %q:\n%s", s, got)
		}
	}
	f.P = 0.3
	if got := Decision(f); !strings.Contains(got, "shown for completeness and should not be read as findings") || strings.Contains(got, "tend to be higher") {
		t.Errorf("not significant overall, but:\n%s", got)
	}
}

// TestResultLine: the one-line result, with p as APA 7 writes it.
func TestResultLine(t *testing.T) {
	tests := []struct {
		f    Facts
		want string
	}{
		// R's PlantGrowth: kruskal.test(weight ~ group) gives 7.9882 on 2 df, p = 0.01842 (R 4.2.2); ε² = H/(N − 1)
		{Facts{Sizes: []int{10, 10, 10}, H: 7.988228749443715, DF: 2, P: 0.018423236420019286, Method: "asymptotic", Epsilon: 7.988228749443715 / 29},
			"H(2) = 7.99, p = .018, ε² = 0.28, N = 30"},
		{Facts{Sizes: []int{600, 700}, H: 40, DF: 1, P: 2e-10, Method: "asymptotic", Epsilon: 0.03}, "H(1) = 40.00, p < .001, ε² = 0.03, N = 1,300"},
		{Facts{Sizes: []int{4, 4, 4}, H: 0.5, DF: 2, P: 0.9996, Method: "exact", Epsilon: 0.05}, "H(2) = 0.50, p > .999 (exact), ε² = 0.05, N = 12"},
		{Facts{Sizes: []int{5, 5, 5}, H: 6.1, DF: 2, P: 0.0405, Method: "monte-carlo", Epsilon: 0.44}, "H(2) = 6.10, p = .041 (Monte Carlo), ε² = 0.44, N = 15"},
	}
	for _, tt := range tests {
		if got := ResultLine(tt.f); got != tt.want {
			t.Errorf("ResultLine = %q, want %q", got, tt.want)
		}
	}
}

// TestBatterySummary: the battery's sentence names the measures that
// differ and those that could not be analysed, and ends with the caution.
func TestBatterySummary(t *testing.T) {
	tests := []struct {
		measures, analysed int
		differ             []string
		says               string
	}{
		{4, 4, nil, "none differs at the 0.05 level"},
		{4, 4, []string{"Wind"}, "one differs (Wind) at the 0.05 level"},
		{4, 3, []string{"Ozone", "Temp"}, "2 differ (Ozone, Temp) at the 0.05 level after their p-values were adjusted across the measures by Holm's step-down method (Holm 1979). One measure could not be analysed"},
		{5, 3, nil, "2 measures could not be analysed"},
	}
	for _, tt := range tests {
		got := BatterySummary(tt.measures, tt.analysed, "Month", tt.differ, 0.05, "Holm's step-down method (Holm 1979)")
		if !strings.Contains(got, tt.says) || !strings.HasSuffix(got, Caution) {
			t.Errorf("BatterySummary(%d, %d, %q) = %q, want it to say %q", tt.measures, tt.analysed, tt.differ, got, tt.says)
		}
	}
}
