package montecarlo

import (
	"fmt"
	"math"
	"math/big"
)

// reach decides, exactly, whether a deal's statistic reaches the observed
// one. Deals are ordered by
//
//	X = Σᵢ sᵢ²/nᵢ,
//
// sᵢ the sum of the scores dealt to group i of size nᵢ: H is an increasing
// affine function of X for fixed scores. X is first found in float64 with a
// proven error bound; only when a deal's X lies within that bound of the
// observed X is the question settled with integers: Σᵢ (L/nᵢ)·sᵢ², L the
// least common multiple of the sizes, in math/big, which cannot overflow
// whatever the sizes (a product in int64 does: four groups of 701, 753, 811
// and 785 values have L ≈ 3.4·10¹¹).
//
// The bound: sᵢ is exact in float64 (|sᵢ| < 2⁵³, checked), sᵢ², the
// reciprocal 1/nᵢ and their product each round once, so a term carries a
// relative error of at most 3u (u = 2⁻⁵³, to first order), and a sum of k
// non-negative terms at most (k−1)u more (Higham 2002, Accuracy and Stability
// of Numerical Algorithms, §4.2). Both X's are thus within (k+3)·u·X of
// their true values; twice that, doubled again for the second-order terms,
// is the band.
type reach struct {
	inv      []float64  // 1/nᵢ
	observed float64    // X of the observed deal, in float64
	band     float64    // relative: closer than band·X is settled exactly
	factor   []*big.Int // L/nᵢ
	exact    *big.Int   // Σ (L/nᵢ)·sᵢ² of the observed deal
}

// maxExactSum is the largest group sum that float64 holds exactly.
const maxExactSum = 1 << 53

func newReach(sizes []int, observedSums []int64, total int64) (*reach, error) {
	if total >= maxExactSum || total < 0 {
		return nil, fmt.Errorf("montecarlo: scores add up to %d, beyond the %d that the comparison holds exactly", total, int64(maxExactSum))
	}
	k := len(sizes)
	r := &reach{inv: make([]float64, k), factor: make([]*big.Int, k), band: float64(4 * float64(k+3) * 0x1p-53)}
	l := big.NewInt(1)
	var g big.Int
	for i, n := range sizes {
		r.inv[i] = 1 / float64(n)
		bn := big.NewInt(int64(n))
		l.Mul(l, bn.Div(bn, g.GCD(nil, nil, l, bn)))
	}
	for i, n := range sizes {
		r.factor[i] = new(big.Int).Div(l, big.NewInt(int64(n)))
	}
	r.observed = r.approx(observedSums)
	r.exact = r.exactValue(observedSums, new(big.Int))
	return r, nil
}

// approx is X in float64.
func (r *reach) approx(sums []int64) float64 {
	x := 0.0
	for i, s := range sums {
		f := float64(s)
		x += float64(f * f * r.inv[i])
	}
	return x
}

// exactValue sets v to Σ (L/nᵢ)·sᵢ² = L·X and returns it.
func (r *reach) exactValue(sums []int64, v *big.Int) *big.Int {
	v.SetInt64(0)
	var sq big.Int
	for i, s := range sums {
		sq.SetInt64(s)
		sq.Mul(&sq, &sq)
		v.Add(v, sq.Mul(&sq, r.factor[i]))
	}
	return v
}

// reaches tells whether the deal with these group sums has X ≥ the
// observed X.
func (r *reach) reaches(sums []int64) bool {
	x := r.approx(sums)
	margin := float64(r.band * math.Max(x, r.observed))
	switch {
	case x-r.observed > margin:
		return true
	case r.observed-x > margin:
		return false
	}
	var v big.Int
	return r.exactValue(sums, &v).Cmp(r.exact) >= 0
}
