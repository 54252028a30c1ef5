package nasa

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestClassicalLimits(t *testing.T) {
	// Exact multiples of R by the formulas in the doc comment.
	cases := []struct {
		name           string
		n              int
		linear         bool
		rotors         int
		wantCp0, wantI float64 // in units of R
	}{
		{"Ar", 1, false, 0, 2.5, 2.5},
		{"N2", 2, true, 0, 3.5, 4.5},
		{"CO2", 3, true, 0, 3.5, 7.5},
		{"H2O", 3, false, 0, 4, 7},
		{"CH4", 5, false, 0, 4, 13},
		{"C2H6", 8, false, 1, 4, 21.5},
	}
	for _, c := range cases {
		cp0, cpInf := ClassicalLimits(c.n, c.linear, c.rotors)
		assert.InDelta(t, c.wantCp0*R, cp0, 1e-12, c.name)
		assert.InDelta(t, c.wantI*R, cpInf, 1e-12, c.name)
	}
	cp0, cpInf := ClassicalLimits(0, false, 0)
	assert.Zero(t, cp0)
	assert.Zero(t, cpInf)
}

func TestWilhoitFit(t *testing.T) {
	for _, m := range tenSpecies {
		cps, cp0, cpInf := m.points()
		w, err := FitWilhoit(benson, cps, cp0, cpInf)
		require.NoError(t, err, m.name)
		// Limits hold by construction of the form; tolerances are rounding
		// (T→0) and the 1/T approach to Cp∞ (1e-5 relative at 1e9 K).
		assert.InDelta(t, cp0, w.Cp(1e-9), 1e-9, "%s Cp(0)", m.name)
		assert.InEpsilon(t, cpInf, w.Cp(1e9), 1e-5, "%s Cp(∞)", m.name)
		assert.True(t, w.monotone(), m.name)
		// Near the input points: the RRHO curves are smooth, a 5-parameter
		// Wilhoit follows them within 2 %.
		for i, T := range benson {
			assert.InEpsilon(t, cps[i], w.Cp(T), 0.02, "%s Cp at %v K", m.name, T)
		}
		for T := 1.0; T < 1e5; T *= 1.1 {
			assert.LessOrEqual(t, w.Cp(T), cpInf*(1+1e-12), "%s below Cp∞ at %v K", m.name, T)
			assert.GreaterOrEqual(t, w.Cp(T), cp0*(1-1e-3), "%s above Cp0 at %v K", m.name, T)
		}
	}
}

func TestWilhoitIntegrals(t *testing.T) {
	w := Wilhoit{Cp0: 4 * R, CpInf: 13 * R, B: 640, A: [4]float64{-0.8, 18, -51, 34}, H0: -66000, S0: 10}
	gauss := func(f func(float64) float64, a, b float64) float64 { // composite Simpson, 4000 panels
		const n = 4000
		h := (b - a) / n
		s := f(a) + f(b)
		for i := 1; i < n; i++ {
			wt := 2.0
			if i%2 == 1 {
				wt = 4
			}
			s += wt * f(a+float64(i)*h)
		}
		return s * h / 3
	}
	// H is exactly H0 at 0 K and its derivative is Cp; S differences are ∫Cp/T.
	assert.InDelta(t, w.H0, w.H(0), 1e-9)
	for _, r := range [][2]float64{{0, 300}, {300, 1500}, {1500, 6000}} {
		assert.InEpsilon(t, gauss(w.Cp, r[0], r[1]), w.H(r[1])-w.H(r[0]), 1e-8, "H %v", r)
		if r[0] > 0 {
			assert.InEpsilon(t, gauss(func(T float64) float64 { return w.Cp(T) / T }, r[0], r[1]), w.S(r[1])-w.S(r[0]), 1e-8, "S %v", r)
		}
	}
}

func TestWilhoitAtomAndErrors(t *testing.T) {
	w, err := FitWilhoit([]float64{300, 1000}, []float64{2.5 * R, 2.5 * R}, 2.5*R, 2.5*R)
	require.NoError(t, err)
	assert.InDelta(t, 2.5*R, w.Cp(2000), 1e-12)
	_, err = FitWilhoit([]float64{300}, []float64{30, 40}, 4*R, 13*R)
	assert.Error(t, err)
	_, err = FitWilhoit(nil, nil, 4*R, 13*R)
	assert.Error(t, err)
	_, err = FitWilhoit([]float64{300}, []float64{30}, 0, 13*R)
	assert.Error(t, err)
	_, err = FitWilhoit([]float64{math.Inf(1)}, []float64{30}, 4*R, 13*R)
	assert.Error(t, err)
	// A single point still gives a monotone curve through the limits.
	w, err = FitWilhoit([]float64{500}, []float64{45}, 4*R, 13*R)
	require.NoError(t, err)
	assert.InEpsilon(t, 45, w.Cp(500), 1e-6, "one point, B alone fits it exactly")
}
