package kinetics

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Masses in amu (IUPAC standard atomic weights, common practice).
const (
	mH   = 1.008
	mO2  = 31.998
	mCH3 = 15.035
)

func TestCollisionLimitValues(t *testing.T) {
	s := CollisionSettings{}
	// Unimolecular: kB T/h = 1.380649e-23·300/6.62607015e-34 = 6.250986e12 s-1.
	k1, ok := CollisionLimit(1, nil, nil, 300, s)
	require.True(t, ok)
	assert.InEpsilon(t, 6.250986e12, k1, 1e-6)

	// Bimolecular H + O2 at 300 K:
	//   d = (4.0 + 4.0·2^(1/3))/2 Å = (4.0 + 5.039684)/2 = 4.519842 Å
	//   μ = 1.008·31.998/32.006 amu = 0.977211 amu = 1.622705e-27 kg
	//   v = sqrt(8·1.380649e-23·300/(π·1.622705e-27)) = 2549.485 m/s
	//   k = 6.02214076e23 · π·(4.519842e-10)² · 2549.485 · 1e6 = 9.8537e14 cm3/mol/s
	k2, ok := CollisionLimit(2, []float64{mH, mO2}, []int{0, 2}, 300, s)
	require.True(t, ok)
	assert.InEpsilon(t, 9.8537e14, k2, 1e-4)

	// Factor scales the bound.
	k2f, _ := CollisionLimit(2, []float64{mH, mO2}, []int{0, 2}, 300, CollisionSettings{Factor: 3})
	assert.InEpsilon(t, 3*k2, k2f, 1e-12)

	// A fixed diameter override: 5 Å for both gives k ∝ 25/4.519842².
	fixed := CollisionSettings{Diameter: func(float64, int) float64 { return 5 }}
	k2d, _ := CollisionLimit(2, []float64{mH, mO2}, []int{0, 2}, 300, fixed)
	assert.InEpsilon(t, k2*25/(4.519842*4.519842), k2d, 1e-6)

	// Termolecular H + O2 + M at 300 K: the H + O2 collision rate over the
	// ideal-gas concentration at 1 bar,
	//   [M] = 1e5/(8.314462618·300) mol/m3 = 4.009077e-5 mol/cm3
	//   k3 ≤ 9.8537e14/4.009077e-5 = 2.45785e19 cm6/(mol2 s).
	k3, ok := CollisionLimit(3, []float64{mH, mO2}, []int{0, 2}, 300, s)
	require.True(t, ok)
	assert.InEpsilon(t, 2.45785e19, k3, 1e-4)
	// Three molecules (H + H + O2): the pair that collides fastest bounds
	// it, here H + O2 again (H + H: d = 4 Å, μ = 0.504 amu gives
	// 6.02214076e23·π·(4e-10)²·3549.0·1e6 = 1.0744e15, larger).
	k3h, ok := CollisionLimit(3, []float64{mH, mH, mO2}, []int{0, 0, 2}, 300, s)
	require.True(t, ok)
	assert.InEpsilon(t, 1.0744e15/4.009077e-5, k3h, 1e-3)
	// No bound above order 3 or for malformed input.
	_, ok = CollisionLimit(4, []float64{1, 1, 1, 1}, []int{0, 0, 0, 0}, 300, s)
	assert.False(t, ok)
	_, ok = CollisionLimit(3, []float64{mH}, []int{0}, 300, s)
	assert.False(t, ok)
	_, ok = CollisionLimit(2, []float64{mH, mH, mH}, []int{0, 0, 0}, 300, s)
	assert.False(t, ok)
	_, ok = CollisionLimit(2, []float64{mH, 0}, []int{0, 0}, 300, s)
	assert.False(t, ok, "unknown mass")

	// A + M with one molecule given: M is N2 (28.0134 amu, 2 heavy atoms),
	// the same as passing N2 explicitly.
	kM, ok := CollisionLimit(2, []float64{mH}, []int{0}, 300, s)
	require.True(t, ok)
	kN2, _ := CollisionLimit(2, []float64{mH, 28.0134}, []int{0, 2}, 300, s)
	assert.Equal(t, kN2, kM)
}

func TestDefaultDiameterAboveLennardJones(t *testing.T) {
	// Lennard-Jones σ (Å) from Reid, Prausnitz & Poling, The Properties of
	// Gases and Liquids, 4th ed. (1987), App. B, from memory, with heavy-atom
	// counts. The rule is meant as an upper envelope, so each must lie below.
	lj := []struct {
		name  string
		heavy int
		sigma float64
	}{
		{"H2", 0, 2.827}, {"H2O", 1, 2.641}, {"O2", 2, 3.467}, {"N2", 2, 3.798},
		{"CH4", 1, 3.758}, {"CO2", 3, 3.941}, {"C2H6", 2, 4.443}, {"C3H8", 3, 5.118},
		{"n-C4H10", 4, 4.687}, {"C6H6", 6, 5.349}, {"n-C6H14", 6, 5.949},
	}
	for _, m := range lj {
		assert.Greater(t, DefaultDiameter(0, m.heavy), m.sigma, m.name)
	}
}

func TestCollisionCheckFiresForHugeBimolecularA(t *testing.T) {
	// CH3 + CH3 with a constant k = 1e16 cm3/mol/s. The limit is
	// d = 4 Å, μ = 7.5175 amu: 2.7825e14 at 300 K and 8.0323e14 at 2500 K,
	// so the worst ratio is at 300 K: 1e16/2.7825e14 = 35.94.
	v := CollisionCheck(2, []float64{mCH3, mCH3}, []int{1, 1},
		Arrhenius{A: 1e16}.Rate, CollisionSettings{})
	require.NotNil(t, v)
	assert.InDelta(t, 300, v.T, 1e-9, "first grid point")
	assert.InEpsilon(t, 2.7825e14, v.Limit, 1e-4)
	assert.InEpsilon(t, 35.94, v.Ratio(), 1e-3)
	assert.Equal(t, 2, v.Order)
	assert.Equal(t, "k(300 K) = 1e16 cm³/(mol·s) exceeds the bimolecular collision limit 2.78e14 cm³/(mol·s) by a factor of 35.9", v.Message())
	v.Reverse = true
	assert.Contains(t, v.Message(), "reverse k(300 K)")

	// A generous enough factor silences it.
	assert.Nil(t, CollisionCheck(2, []float64{mCH3, mCH3}, []int{1, 1},
		Arrhenius{A: 1e16}.Rate, CollisionSettings{Factor: 40}))
}

func TestCollisionCheckSilentForSoundRates(t *testing.T) {
	// H + O2 → OH + O, k = 3.5e16 T^-0.7 exp(−8590/T): the large A is offset
	// by T^-0.7 and the barrier. Ratios to the limit: 2.4e-13 at 300 K,
	// 2.9e-5 at 1000 K, 1.7e-3 at 2500 K — far below 1 everywhere.
	hO2 := Arrhenius{A: 3.5e16, N: -0.7, Ea: 8590 * R}
	assert.Nil(t, CollisionCheck(2, []float64{mH, mO2}, []int{0, 2}, hO2.Rate, CollisionSettings{}))
	lim, _ := CollisionLimit(2, []float64{mH, mO2}, []int{0, 2}, 2500, CollisionSettings{})
	assert.InEpsilon(t, 1.66e-3, hO2.Rate(2500)/lim, 0.01)

	// A fast radical–radical recombination of typical size, 1e13 cm3/mol/s
	// (CH3 + CH3): ratio 0.036 at 300 K.
	assert.Nil(t, CollisionCheck(2, []float64{mCH3, mCH3}, []int{1, 1}, Arrhenius{A: 1e13}.Rate, CollisionSettings{}))

	// Unimolecular bond fission of illustrative size (A = 1e16 s-1,
	// Ea = 370 kJ/mol): k(2500 K) = 1e16·e^−17.80 = 1.86e8 s-1 ≪ 5.2e13 s-1.
	assert.Nil(t, CollisionCheck(1, nil, nil, Arrhenius{A: 1e16, Ea: 370e3}.Rate, CollisionSettings{}))
}

func TestCollisionCheckFindsWorstPoint(t *testing.T) {
	// k = 1e9 T² rises faster than the limit (∝ √T), so the worst point is
	// TMax: at 2500 K k = 6.25e15 against 8.0323e14 → ratio 7.781.
	v := CollisionCheck(2, []float64{mCH3, mCH3}, []int{1, 1}, Arrhenius{A: 1e9, N: 2}.Rate, CollisionSettings{})
	require.NotNil(t, v)
	assert.InDelta(t, 2500, v.T, 1e-9)
	assert.InEpsilon(t, 7.781, v.Ratio(), 1e-3)

	// Restricting the range below the crossing silences it: at 600 K,
	// k = 3.6e14 against 2.7825e14·√2 = 3.935e14.
	assert.Nil(t, CollisionCheck(2, []float64{mCH3, mCH3}, []int{1, 1}, Arrhenius{A: 1e9, N: 2}.Rate,
		CollisionSettings{TMin: 300, TMax: 600}))

	// Unimolecular constant 1e14 s-1: worst at 300 K, 1e14/6.250986e12 = 15.998.
	u := CollisionCheck(1, nil, nil, Arrhenius{A: 1e14}.Rate, CollisionSettings{})
	require.NotNil(t, u)
	assert.InEpsilon(t, 15.998, u.Ratio(), 1e-4)
	assert.Equal(t, "k(300 K) = 1e14 s⁻¹ exceeds the unimolecular collision limit 6.25e12 s⁻¹ by a factor of 16", u.Message())

	// NaN rates are skipped; above termolecular there is no bound.
	assert.Nil(t, CollisionCheck(1, nil, nil, func(float64) float64 { return math.NaN() }, CollisionSettings{}))
	assert.Nil(t, CollisionCheck(4, []float64{1, 1, 1, 28}, []int{0, 0, 0, 2}, Arrhenius{A: 1e30}.Rate, CollisionSettings{}))
}

// TestTermolecularBound: the bound grows as T^1.5, fires for an absurd
// three-body rate and not for sound ones.
func TestTermolecularBound(t *testing.T) {
	s := CollisionSettings{}
	lo, _ := CollisionLimit(3, []float64{mH, mO2}, []int{0, 2}, 300, s)
	hi, _ := CollisionLimit(3, []float64{mH, mO2}, []int{0, 2}, 1200, s)
	assert.InEpsilon(t, 8, hi/lo, 1e-9, "(1200/300)^1.5")

	// H + H + O2 with a constant 1e25 cm6/(mol2 s): worst at 300 K against
	// 1.0744e15/4.009077e-5 = 2.680e19 (the H + H pair).
	v := CollisionCheck(3, []float64{mH, mH, mO2}, []int{0, 0, 2}, Arrhenius{A: 1e25}.Rate, s)
	require.NotNil(t, v)
	assert.InDelta(t, 300, v.T, 1e-9)
	assert.InEpsilon(t, 2.680e19, v.Limit, 1e-3)
	assert.Equal(t, [2]int{0, 1}, v.Pair)
	assert.Equal(t, 3, v.Order)
	assert.Contains(t, v.Message(), "exceeds the termolecular collision limit 2.68e19 cm⁶/(mol²·s)")
	assert.Contains(t, v.Message(), "termolecular sanity bound: at 1 bar, k·[M] would outrun the two partners' collision rate")

	// Sound three-body rates of small radicals (illustrative magnitudes of
	// the usual size, from memory): H + O2 + M 2.8e18 T^-0.86 (1.9e16 at
	// 300 K), H + OH + M 3.8e22 T^-2 (4.2e17 at 300 K), O + O + M
	// 6.2e15 T^-0.5: all well below the bound everywhere.
	assert.Nil(t, CollisionCheck(3, []float64{mH, mO2}, []int{0, 2}, Arrhenius{A: 2.8e18, N: -0.86}.Rate, s))
	assert.Nil(t, CollisionCheck(3, []float64{mH, 17.007}, []int{0, 1}, Arrhenius{A: 3.8e22, N: -2}.Rate, s))
	assert.Nil(t, CollisionCheck(3, []float64{15.999, 15.999}, []int{1, 1}, Arrhenius{A: 6.2e15, N: -0.5}.Rate, s))
}

func TestSci(t *testing.T) {
	assert.Equal(t, "1e16", sci(1e16))
	assert.Equal(t, "2.78e14", sci(2.7825e14))
	assert.Equal(t, "1.5e-5", sci(1.5e-5))
	assert.Equal(t, "250", sci(250))
}
