package molecule

import (
	"math/big"
	"math/rand"
	"testing"
)

// TestProdMatchesBigInt checks the uint64-with-overflow product σ is
// accumulated in against math/big on random sequences of the operations σ
// uses (factors, factorials, products of products, halving), many of them
// crossing 2^64.
func TestProdMatchesBigInt(t *testing.T) {
	r := rand.New(rand.NewSource(1))
	for trial := 0; trial < 2000; trial++ {
		p, want := oneProd(), big.NewInt(1)
		for step := 0; step < 1+r.Intn(30); step++ {
			switch r.Intn(4) {
			case 0:
				k := uint64(r.Intn(5000))
				p.mulUint(k)
				want.Mul(want, new(big.Int).SetUint64(k))
			case 1:
				k := r.Intn(25) // beyond the 20! table too
				p.mulFactorial(k)
				if k > 1 {
					want.Mul(want, new(big.Int).MulRange(1, int64(k)))
				}
			case 2:
				q, wq := oneProd(), big.NewInt(1)
				for j := 0; j < r.Intn(6); j++ {
					k := uint64(1 + r.Intn(1<<20))
					q.mulUint(k)
					wq.Mul(wq, new(big.Int).SetUint64(k))
				}
				p.mul(q)
				want.Mul(want, wq)
			case 3:
				p.halve()
				want.Rsh(want, 1)
			}
			if got := p.int(); got.Cmp(want) != 0 {
				t.Fatalf("trial %d step %d: prod %s, big.Int %s", trial, step, got, want)
			}
			if p.isZero() != (want.Sign() == 0) {
				t.Fatalf("trial %d step %d: isZero %v for %s", trial, step, p.isZero(), want)
			}
		}
	}
}
