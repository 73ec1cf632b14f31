package describe

import (
	"fmt"
	"testing"
)

func TestQuantile(t *testing.T) {
	// R 4.2.2: quantile(c(1, 2, 4, 7, 11), c(0, .1, .25, .5, .9, 1), type = 7)
	// gives 1.0 1.4 2.0 4.0 9.4 11.0
	x := []float64{1, 2, 4, 7, 11}
	tests := []struct{ p, want float64 }{{0, 1}, {0.1, 1.4}, {0.25, 2}, {0.5, 4}, {0.9, 9.4}, {1, 11}}
	for _, tt := range tests {
		if got := Quantile(x, tt.p); got != tt.want && (got-tt.want > 1e-14 || tt.want-got > 1e-14) {
			t.Errorf("Quantile(%v, %v) = %v, want %v", x, tt.p, got, tt.want)
		}
	}
	if got := Quantile([]float64{5}, 0.75); got != 5 {
		t.Errorf("Quantile of one value = %v, want 5", got)
	}
}

func ExampleSummarise() {
	s := Summarise([]float64{3, 5, 8, 13})
	fmt.Printf("%+v\n", s)
	// Output: {Min:3 Q1:4.5 Median:6.5 Q3:9.25 Max:13}
}
