package adjust

import (
	"bufio"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"
)

// TestAgainstR: every method against R's p.adjust on the same raw p-values
// (testdata/reference/padjust.tsv, made by tools/reference/padjust.R).
func TestAgainstR(t *testing.T) {
	f, err := os.Open("../../testdata/reference/padjust.tsv")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	s := bufio.NewScanner(f)
	s.Scan()
	raw := parse(strings.TrimPrefix(s.Text(), "# raw p-values: "))
	s.Scan()
	checked := 0
	for s.Scan() {
		c := strings.Split(s.Text(), "\t")
		want := parse(c[1])
		got, err := Adjust(raw, Method(c[0]))
		if err != nil {
			t.Fatal(err)
		}
		for i := range want {
			tol := 1e-12 * want[i]
			if c[0] == "sidak" && raw[i] < 1e-9 {
				// R's 1 − (1 − p)^m loses digits here; expm1 keeps them
				tol = 1e-4 * want[i]
			}
			if math.Abs(got[i]-want[i]) > tol {
				t.Errorf("%s: adjusted[%d] = %.17g, want %.17g (%s)", c[0], i, got[i], want[i], c[2])
			}
		}
		checked++
	}
	if checked != 7 {
		t.Errorf("checked %d methods, want 7", checked)
	}
}

func parse(s string) []float64 {
	var out []float64
	for _, f := range strings.Split(s, ",") {
		v, _ := strconv.ParseFloat(f, 64)
		out = append(out, v)
	}
	return out
}

// TestInvariants: adjusted ≥ raw, Holm ≤ Bonferroni, BH ≤ BY, capped at 1.
func TestInvariants(t *testing.T) {
	p := []float64{0.3, 0.001, 0.02, 0.02, 0.5, 0.049, 1}
	holm, _ := Adjust(p, "holm")
	bonf, _ := Adjust(p, "bonferroni")
	bh, _ := Adjust(p, "bh")
	by, _ := Adjust(p, "by")
	for _, m := range Methods {
		adj, _ := Adjust(p, m)
		for i := range p {
			if adj[i] < p[i] || adj[i] > 1 {
				t.Errorf("%s: adjusted %v for raw %v", m, adj[i], p[i])
			}
		}
	}
	for i := range p {
		if holm[i] > bonf[i] || bh[i] > by[i] {
			t.Errorf("p %v: holm %v bonferroni %v bh %v by %v", p[i], holm[i], bonf[i], bh[i], by[i])
		}
	}
}

func ExampleAdjust() {
	adj, _ := Adjust([]float64{0.01, 0.04, 0.03}, "holm")
	fmt.Printf("%.2f\n", adj)
	// Output: [0.03 0.06 0.06]
}
