package analysis

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestGroupThermo checks the integrated model (as for a thermo table, no
// tail: Cp held above the last point) against closed forms: with a
// constant Cp, H(T) = H298 + Cp (T − 298.15) and S(T) = S298 + Cp ln(T/298.15);
// with Cp linear in T the integrals are exact too.
func TestGroupThermo(t *testing.T) {
	T := []float64{300, 400, 500, 600, 800, 1000, 1500}
	flat := []float64{50, 50, 50, 50, 50, 50, 50}
	g := newGroupThermo(-1e5, 200, T, flat)
	for _, x := range []float64{298.15, 350, 1000, 2000, 2500} {
		assert.InDelta(t, -1e5+50*(x-298.15), g.H(x), 1e-6, "H at %g", x)
		assert.InDelta(t, 200+50*math.Log(x/298.15), g.S(x), 1e-9, "S at %g", x)
	}
	// Cp = 20 + 0.05 T up to 1500 K, then held at 95.
	lin := make([]float64, len(T))
	for i, x := range T {
		lin[i] = 20 + 0.05*x
	}
	g = newGroupThermo(0, 100, T, lin)
	h := func(x float64) float64 { return 20*(x-298.15) + 0.025*(x*x-298.15*298.15) }
	s := func(x float64) float64 { return 20*math.Log(x/298.15) + 0.05*(x-298.15) }
	for _, x := range []float64{298.15, 450, 1200, 1500} {
		assert.InDelta(t, h(x), g.H(x), 1e-6, "H at %g", x)
		assert.InDelta(t, 100+s(x), g.S(x), 1e-9, "S at %g", x)
		assert.InDelta(t, 20+0.05*x, g.Cp(x), 1e-9)
	}
	assert.InDelta(t, h(1500)+95*500, g.H(2000), 1e-6, "Cp held at its 1500 K value above")
	assert.InDelta(t, 95, g.Cp(2400), 1e-9)
}
