package nasa

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestTail checks, on the ten RRHO test molecules, that a Tail starts at
// its last point, stays inside TailRange, has H and S increments that are
// the integrals of its Cp, and follows the same curve as the NASA-7 fit
// made from the same points above them.
func TestTail(t *testing.T) {
	simpson := func(f func(float64) float64, a, b float64) float64 {
		const n = 2000
		h := (b - a) / n
		s := f(a) + f(b)
		for i := 1; i < n; i++ {
			s += float64(2+2*(i%2)) * f(a+float64(i)*h)
		}
		return s * h / 3
	}
	for _, m := range tenSpecies {
		cps, cp0, cpInf := m.points()
		tail, err := EstimateTail(benson, cps, cp0, cpInf)
		require.NoError(t, err, m.name)
		cp1 := cps[len(cps)-1]
		// Continuity is exact up to rounding.
		assert.InDelta(t, cp1, tail.Cp(1500), 1e-9*cp1, "%s Cp at T1", m.name)
		assert.Zero(t, tail.DH(1500), m.name)
		assert.Zero(t, tail.DS(1500), m.name)
		lo, hi := TailRange(cp1, cp0, cpInf)
		peak := cp1
		for T := 1500.0; T <= 6000; T += 10 {
			c := tail.Cp(T)
			assert.GreaterOrEqual(t, c, lo, "%s at %v K", m.name, T)
			assert.LessOrEqual(t, c, hi, "%s at %v K", m.name, T)
			// Monotone to FitWilhoit's tolerance (1e-3 of Cp∞ − Cp0, doubled by the scale cap).
			assert.GreaterOrEqual(t, c, peak-2e-3*(cpInf-cp0), "%s falls at %v K", m.name, T)
			peak = math.Max(peak, c)
		}
		// The closed-form integrals against Simpson's rule (error far
		// below 1e-6 relative for a smooth integrand on 2000 panels).
		for _, T := range []float64{1600, 2500, 5000} {
			assert.InEpsilon(t, simpson(tail.Cp, 1500, T), tail.DH(T), 1e-8, "%s ∫Cp dT to %v K", m.name, T)
			assert.InEpsilon(t, simpson(func(x float64) float64 { return tail.Cp(x) / x }, 1500, T), tail.DS(T), 1e-8, "%s ∫Cp/T dT to %v K", m.name, T)
		}
		// Above the points the fit follows W (weight-1 samples from 1600 K)
		// while the tail is W moved onto the last point: they agree to
		// about W's residual at 1500 K (0.1–0.6 % here; measured 0.07–0.75 %
		// between tail and fit, where Cp held at 1500 K is 7–23 % off).
		p, _, err := Fit(m.hf, m.s, benson, cps, cp0, cpInf, FitOptions{})
		require.NoError(t, err, m.name)
		for _, T := range []float64{1600, 2000, 2500, 3000, 4000} {
			assert.InEpsilon(t, p.Cp(T), tail.Cp(T), 0.01, "%s Cp at %v K: tail vs fit", m.name, T)
		}
	}
}

// TestTailHeld: without room to rise (last point at or above Cp∞) a Tail
// holds its last value.
func TestTailHeld(t *testing.T) {
	w := Wilhoit{Cp0: 4 * R, CpInf: 13 * R, B: 640}
	tail := NewTail(w, 1500, 14*R)
	assert.Equal(t, 14*R, tail.Cp(3000))
	assert.InDelta(t, 14*R*1500, tail.DH(3000), 1e-9)
	assert.InDelta(t, 14*R*math.Log(2), tail.DS(3000), 1e-12)
}

// TestFitSharedWilhoit: Fit given the Tail's Wilhoit curve of the same
// points makes the same polynomial, to the last bit, as Fit fitting the
// curve itself; a curve with other limits, or points outside the range,
// make it fit its own.
func TestFitSharedWilhoit(t *testing.T) {
	for _, m := range tenSpecies {
		cps, cp0, cpInf := m.points()
		tail, err := EstimateTail(benson, cps, cp0, cpInf)
		require.NoError(t, err)
		for _, opt := range []FitOptions{{}, {TMid: 1200, THigh: 3000}, {THigh: 1200}} {
			own, rep, err := Fit(m.hf, m.s, benson, cps, cp0, cpInf, opt)
			require.NoError(t, err)
			opt.Wilhoit = &tail.W
			shared, rep2, err := Fit(m.hf, m.s, benson, cps, cp0, cpInf, opt)
			require.NoError(t, err)
			assert.Equal(t, own, shared, "%s %+v", m.name, opt)
			assert.Equal(t, rep, rep2)
		}
		other := tail.W
		other.CpInf *= 1.5
		own, _, _ := Fit(m.hf, m.s, benson, cps, cp0, cpInf, FitOptions{})
		shared, _, _ := Fit(m.hf, m.s, benson, cps, cp0, cpInf, FitOptions{Wilhoit: &other})
		assert.Equal(t, own, shared, "%s: a curve with other limits is not used", m.name)
	}
}
