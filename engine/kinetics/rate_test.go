package kinetics

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestConcentration(t *testing.T) {
	// 1 bar, 1000 K: 1e5 / (8.314462618 · 1000) = 12.027236 mol/m3
	// = 1.2027236e-5 mol/cm3. Tolerance 1e-6 relative: the hand value has 7 digits.
	assert.InEpsilon(t, 1.2027236e-5, Concentration(1000, PStd), 1e-6)
	// 1 atm, 298.15 K: 101325 / (8.314462618 · 298.15) = 40.874 mol/m3.
	assert.InEpsilon(t, 4.0874e-5, Concentration(298.15, 101325), 1e-4)
}

func TestArrheniusEaInJoules(t *testing.T) {
	// A = 1e13, n = 0, Ea = 100 kJ/mol at 1000 K:
	// Ea/(R T) = 100000 / 8314.462618 = 12.027236;
	// exp(−12.027236) = exp(−12)·exp(−0.027236) = 6.144212e-6 · 0.973132 = 5.97913e-6
	// k = 5.97913e7. Relative tolerance 1e-5 for the 6-digit hand value.
	a := Arrhenius{A: 1e13, N: 0, Ea: 100e3}
	assert.InEpsilon(t, 5.97913e7, a.Rate(1000), 1e-5)

	// With a temperature exponent: 3.5e16 T^-0.7 exp(−71.4 kJ/mol /(R T)) at 1000 K:
	// 1000^-0.7 = 10^-2.1 = 7.94328e-3; 71400/8314.462618 = 8.587446;
	// exp(−8.587446) = 1.864316e-4
	// k = 3.5e16 · 7.94328e-3 · 1.864316e-4 = 5.18308e10 (1e-5: 6-digit factors).
	b := Arrhenius{A: 3.5e16, N: -0.7, Ea: 71.4e3}
	assert.InEpsilon(t, 5.18308e10, b.Rate(1000), 1e-5)

	// Ea = R T exactly gives A T^n / e (to rounding, 1e-12).
	c := Arrhenius{A: 2, N: 1, Ea: R * 500}
	assert.InEpsilon(t, 2*500/math.E, c.Rate(500), 1e-12)
}

func TestTroeHandComputed(t *testing.T) {
	// Demo parameters (not a real reaction), chosen so that Pr = 1:
	// k∞ = 1e13, k0 = 1e19 cm6/mol2/s, M = 1e-6 mol/cm3 → Pr = 1e19·1e-6/1e13 = 1.
	// α = 0.5, T3 = 100 K, T1 = 1000 K, T2 = 5000 K, T = 1000 K:
	//   Fcent = 0.5·e^-10 + 0.5·e^-1 + e^-5
	//         = 0.5·4.53999e-5 + 0.5·0.367879 + 6.737947e-3 = 0.1907004
	//   log Fcent = −0.719648
	//   c = −0.4 − 0.67·(−0.719648) = 0.082164
	//   n = 0.75 − 1.27·(−0.719648) = 1.663954
	//   f1 = (0 + 0.082164)/(1.663954 − 0.14·0.082164) = 0.082164/1.652451 = 0.049723
	//   log F = −0.719648/(1 + 0.049723²) = −0.719648/1.0024724 = −0.717874
	//   F = 10^−0.717874 = 0.191481
	//   k = 1e13 · 1/(1+1) · 0.191481 = 9.5741e11
	tr := &Troe{Alpha: 0.5, T3: 100, T1: 1000, T2: 5000, HasT2: true}
	f := Falloff{High: Arrhenius{A: 1e13}, Low: Arrhenius{A: 1e19}, Troe: tr}
	// Tolerances 1e-5 relative: the hand values carry 6 significant digits.
	assert.InEpsilon(t, 0.1907004, tr.Fcent(1000), 1e-5)
	assert.InEpsilon(t, 1.0, f.Pr(1000, 1e-6), 1e-12)
	assert.InEpsilon(t, 0.191481, tr.F(1000, 1), 1e-5)
	assert.InEpsilon(t, 9.5741e11, f.Rate(1000, 1e-6), 1e-4)

	// Same at M = 1e-5 (Pr = 10, log Pr = 1):
	//   f1 = (1 + 0.082164)/(1.663954 − 0.14·1.082164) = 1.082164/1.512451 = 0.715504
	//   log F = −0.719648/(1 + 0.511946) = −0.475975;  F = 0.334214
	//   k = 1e13 · 10/11 · 0.334214 = 3.03831e12
	assert.InEpsilon(t, 3.03831e12, f.Rate(1000, 1e-5), 1e-5)

	// Without T2: Fcent = 0.5·4.53999e-5 + 0.5·0.367879 = 0.1839624
	//   log Fcent = −0.735271, c = 0.092631, n = 1.683794
	//   f1 = 0.092631/(1.683794 − 0.012968) = 0.055441
	//   log F = −0.735271/1.0030737 = −0.733018;  F = 0.184919
	//   k(Pr = 1) = 0.5e13 · 0.184919 = 9.24596e11
	tr2 := &Troe{Alpha: 0.5, T3: 100, T1: 1000}
	f2 := Falloff{High: Arrhenius{A: 1e13}, Low: Arrhenius{A: 1e19}, Troe: tr2}
	assert.InEpsilon(t, 9.24596e11, f2.Rate(1000, 1e-6), 1e-5)
}

func TestTroeFcentBounds(t *testing.T) {
	// An unphysical α > 1 with T3 ≪ T1 makes Fcent negative; F must say so.
	tr := Troe{Alpha: 3, T3: 1e6, T1: 1}
	require.Less(t, tr.Fcent(1000), 0.0)
	assert.True(t, math.IsNaN(tr.F(1000, 1)))
	// Zero T3 drops its term (exp(−T/0) = 0): Fcent = α e^(−T/T1).
	assert.InEpsilon(t, 0.4*math.Exp(-1), Troe{Alpha: 0.4, T3: 0, T1: 1000}.Fcent(1000), 1e-12)
}

func TestLindemannLimits(t *testing.T) {
	f := Falloff{
		High: Arrhenius{A: 2e13, N: 0.3, Ea: 10e3},
		Low:  Arrhenius{A: 5e18, N: -1, Ea: 0},
	}
	T := 800.0
	k0, kinf := f.Low.Rate(T), f.High.Rate(T)
	// At 800 K: k0 = 5e18/800 = 6.25e15, k∞ = 2e13·800^0.3·exp(−1.5035) = 3.304e13.
	// M → 0: k = k0 M /(1+Pr); at M = 1e-15, Pr = 1.9e-13 so the relative
	// departure from k0·M is ~Pr; 1e-10 is a safe margin above it.
	M := 1e-15
	require.Less(t, f.Pr(T, M), 1e-12)
	assert.InEpsilon(t, k0*M, f.Rate(T, M), 1e-10)
	// M → ∞: k = k∞/(1 + 1/Pr); at M = 1e6, 1/Pr = 5.3e-9, so 1e-8.
	assert.InEpsilon(t, kinf, f.Rate(T, 1e6), 1e-8)
	assert.InEpsilon(t, kinf, f.Rate(T, math.Inf(1)), 1e-12)
	// Pr = 1 gives exactly half of k∞.
	Mhalf := kinf / k0
	assert.InEpsilon(t, kinf/2, f.Rate(T, Mhalf), 1e-12)
	assert.Equal(t, 0.0, f.Rate(T, 0))

	// Troe at the limits: M → 0 tends to k0·M·F(Pr→0), which is below k0·M.
	tf := f
	tf.Troe = &Troe{Alpha: 0.6, T3: 200, T1: 2000}
	assert.Less(t, tf.Rate(T, M), k0*M)
	assert.Equal(t, 0.0, tf.Rate(T, 0))
	assert.False(t, math.IsNaN(tf.Rate(T, math.Inf(1))))
}

func TestPressureTable(t *testing.T) {
	// Demo rows, out of order on purpose.
	p := PressureTable{
		{P: 1e6, Rate: Arrhenius{A: 1e13}},
		{P: 1e4, Rate: Arrhenius{A: 1e11}},
		{P: 1e5, Rate: Arrhenius{A: 4e11}},
		{P: 1e5, Rate: Arrhenius{A: 6e11}}, // same pressure: summed to 1e12
	}
	T := 1000.0
	// At the tabulated pressures (exact up to rounding, 1e-12).
	assert.InEpsilon(t, 1e11, p.Rate(T, 1e4), 1e-12)
	assert.InEpsilon(t, 1e12, p.Rate(T, 1e5), 1e-12)
	assert.InEpsilon(t, 1e13, p.Rate(T, 1e6), 1e-12)
	// Halfway in ln P between 1e4 and 1e5 (P = 10^4.5) the log-log line gives
	// the geometric mean sqrt(1e11·1e12) = 10^11.5 = 3.16228e11.
	assert.InEpsilon(t, 3.16228e11, p.Rate(T, math.Pow(10, 4.5)), 1e-5)
	// A quarter of the way between 1e5 and 1e6: 10^(12 + 0.25) = 1.77828e12.
	assert.InEpsilon(t, 1.77828e12, p.Rate(T, math.Pow(10, 5.25)), 1e-5)
	// Clamped outside the table.
	assert.InEpsilon(t, 1e11, p.Rate(T, 10), 1e-12)
	assert.InEpsilon(t, 1e13, p.Rate(T, 1e9), 1e-12)

	// A pair where log-log and linear interpolation disagree: at P = 10^5.5,
	// ln k = ln 1e12 + 0.5·ln 4 → k = 2e12, whereas linear in P would give
	// 1e12 + 3e12·(3.16228e5 − 1e5)/9e5 = 1.72076e12.
	q := PressureTable{{P: 1e5, Rate: Arrhenius{A: 1e12}}, {P: 1e6, Rate: Arrhenius{A: 4e12}}}
	assert.InEpsilon(t, 2e12, q.Rate(T, math.Pow(10, 5.5)), 1e-12)

	assert.True(t, math.IsNaN(PressureTable{}.Rate(T, 1e5)))
	neg := PressureTable{{P: 1e5, Rate: Arrhenius{A: -1}}, {P: 1e6, Rate: Arrhenius{A: 1}}}
	assert.True(t, math.IsNaN(neg.Rate(T, 3e5)))
}
