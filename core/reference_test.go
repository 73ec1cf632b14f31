package core

import (
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// referenceValue is one figure computed outside the project, with the
// program and call that computed it.
type referenceValue struct {
	dataset, quantity string
	value             float64
	source            string
}

// readReference reads a TSV written by tools/reference/generate.sh.
func readReference(t *testing.T, name string) []referenceValue {
	t.Helper()
	var out []referenceValue
	for _, c := range readTSV(t, name) {
		v, err := strconv.ParseFloat(c[2], 64)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		out = append(out, referenceValue{c[0], c[1], v, c[3]})
	}
	return out
}

// TestAgainstReferences compares every figure of the open datasets of R's
// `datasets` package (airquality, PlantGrowth, InsectSprays, chickwts,
// mtcars, infert) and
// of Hollander & Wolfe (1973, p. 116) with R's stats package and
// scipy.stats; the source of each value is in the TSV beside it.
func TestAgainstReferences(t *testing.T) {
	refs := append(readReference(t, "r_stats.tsv"), readReference(t, "scipy.tsv")...)
	results := map[string]*Result{}
	for _, ref := range refs {
		r, ok := results[ref.dataset]
		if !ok {
			data, err := os.ReadFile(filepath.Join("..", "testdata", "reference", ref.dataset+".csv"))
			if err != nil {
				t.Fatal(err)
			}
			if r, err = Analyze(data, Options{}); err != nil {
				t.Fatalf("%s: %v", ref.dataset, err)
			}
			results[ref.dataset] = r
		}
		got, tol := figure(t, r, ref.quantity)
		if d := math.Abs(got - ref.value); d > tol*math.Max(1, math.Abs(ref.value)) {
			t.Errorf("%s %s = %.17g, want %.17g (%s)", ref.dataset, ref.quantity, got, ref.value, ref.source)
		}
	}
	if len(results) != 7 {
		t.Errorf("checked %d datasets, want 7", len(results))
	}
}

// figure picks a quantity named in the reference files from a result, with
// the relative tolerance it is held to.
func figure(t *testing.T, r *Result, quantity string) (float64, float64) {
	name, label, _ := strings.Cut(quantity, ":")
	group := func() Group {
		for _, g := range r.Groups {
			if g.Label == label {
				return g
			}
		}
		t.Fatalf("no group %q", label)
		return Group{}
	}
	switch name {
	case "h":
		return r.H, 1e-12
	case "df":
		return float64(r.DF), 0
	case "p":
		return r.PAsymptotic, 1e-10
	case "tie_correction":
		return r.TieCorrection, 1e-14
	case "critical_value_0.05":
		return r.CriticalValue, 1e-10
	case "rank_sum":
		return group().RankSum, 0
	case "q1":
		return group().Q1, 1e-14
	case "median":
		return group().Median, 1e-14
	case "q3":
		return group().Q3, 1e-14
	}
	t.Fatalf("unknown quantity %q", quantity)
	return 0, 0
}
