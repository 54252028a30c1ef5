package equilibrium

import (
	"bufio"
	"context"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/reflib"
)

// librarySpecies returns the reference library's species (engine/reflib) as
// equilibrium species, keeping only the names given (all when none).
func librarySpecies(t testing.TB, names ...string) []Species {
	keep := map[string]bool{}
	for _, n := range names {
		keep[n] = true
	}
	var out []Species
	for _, s := range reflib.New().All() {
		if len(names) > 0 && !keep[s.Name] {
			continue
		}
		m, err := molecule.ParseSMILES(s.SMILES)
		require.NoError(t, err)
		p := s.Poly
		out = append(out, Species{Name: s.Name, Composition: m.Composition(), Thermo: &p})
	}
	require.True(t, len(names) == 0 || len(out) == len(names), "library lacks one of %v", names)
	return out
}

func feedOf(t testing.TB, sys *System, amounts map[string]float64) []float64 {
	feed := make([]float64, len(sys.Species()))
	for name, n := range amounts {
		j := sys.Index(name)
		require.GreaterOrEqual(t, j, 0, name)
		feed[j] = n
	}
	return feed
}

func solve(t testing.TB, sys *System, p Problem) *Result {
	r, err := sys.Solve(context.Background(), p)
	require.NoError(t, err)
	return r
}

const atm = 101325.0

// checkEquilibrium asserts what any converged result must satisfy: element
// balances, mole fractions summing to one, and the equilibrium condition
// G°_j/RT + ln(x_j P/P°) = Σ_i a_ij π_i for every species present (the
// minimum of G: no reaction among the species can lower it).
func checkEquilibrium(t *testing.T, sys *System, feed []float64, r *Result) {
	t.Helper()
	for _, el := range sys.elements {
		in, out := 0.0, 0.0
		for j, sp := range sys.Species() {
			in += feed[j] * float64(sp.Composition[el])
			out += r.Moles[j] * float64(sp.Composition[el])
		}
		// 1e-9 relative: the solver stops at 1e-11 of the largest total.
		assert.InDelta(t, in, out, 1e-9*math.Max(in, 1), "element %s balance", el)
	}
	sum := 0.0
	for _, x := range r.MoleFractions {
		sum += x
	}
	assert.InDelta(t, 1, sum, 1e-12)
	for j, sp := range sys.Species() {
		x := r.MoleFractions[j]
		if x < 1e-12 {
			continue
		}
		g := (sp.Thermo.H(r.T) - r.T*sp.Thermo.S(r.T)) / (R * r.T)
		lhs := g + math.Log(x*r.P/PStd)
		rhs := 0.0
		for el, c := range sp.Composition {
			rhs += float64(c) * r.ElementPotentials[el]
		}
		// 1e-6 in μ/RT is a relative error of 1e-6 in the amount.
		assert.InDelta(t, rhs, lhs, 1e-6, "equilibrium condition for %s", sp.Name)
	}
}

// TestMethaneAirFlame: stoichiometric methane–air (CH4 + 2 O2 + 7.52 N2) at
// 1 atm from 298.15 K burns at ≈ 2225 K adiabatically with dissociation
// (common practice). The reference library's thermochemistry is NIST-JANAF
// formation data with GRI-Mech 3.0 heat capacities; data sets of that
// quality agree on this temperature within about ±5 K, so 10 K is allowed.
func TestMethaneAirFlame(t *testing.T) {
	sys, err := NewSystem(librarySpecies(t))
	require.NoError(t, err)
	feed := feedOf(t, sys, map[string]float64{"CH4": 1, "O2": 2, "N2": 7.52})
	r := solve(t, sys, Problem{Feed: feed, T: 298.15, P: atm, Adiabatic: true})
	t.Logf("adiabatic flame temperature %.1f K (%d outer steps)", r.T, r.TemperatureIterations)
	assert.InDelta(t, 2225, r.T, 10)
	checkEquilibrium(t, sys, feed, r)
	// Enthalpy is conserved: H(products, T_ad) = H(feed, 298.15 K).
	h0 := 0.0
	for j, n := range feed {
		h0 += n * sys.Species()[j].Thermo.H(298.15)
	}
	assert.InDelta(t, h0, r.H, 1e-6*math.Abs(h0))
	// Main products: water and carbon dioxide, with CO and OH from
	// dissociation at the percent level.
	x := func(name string) float64 { return r.MoleFractions[sys.Index(name)] }
	assert.InDelta(t, 0.183, x("H2O"), 0.005)
	assert.InDelta(t, 0.085, x("CO2"), 0.005)
	assert.Greater(t, x("CO"), 0.005)
	assert.Greater(t, x("OH"), 0.001)
	// Without dissociation (only CO2, H2O, N2, O2 as products) the flame is
	// hotter: about 2330 K (common practice).
	small, err := NewSystem(librarySpecies(t, "CH4", "O2", "N2", "CO2", "H2O"))
	require.NoError(t, err)
	rc := solve(t, small, Problem{Feed: feedOf(t, small, map[string]float64{"CH4": 1, "O2": 2, "N2": 7.52}), T: 298.15, P: atm, Adiabatic: true})
	t.Logf("complete combustion %.1f K", rc.T)
	assert.InDelta(t, 2330, rc.T, 20)
}

// TestHydrogenFlames: stoichiometric hydrogen burns at ≈ 2380 K in air and
// ≈ 3080 K in oxygen at 1 atm from 298.15 K (common practice, from memory;
// ±20 K for the spread of data sets and of the quoted values).
func TestHydrogenFlames(t *testing.T) {
	sys, err := NewSystem(librarySpecies(t, "H2", "O2", "N2", "H2O", "OH", "H", "O", "HO2", "H2O2", "NO"))
	require.NoError(t, err)
	air := solve(t, sys, Problem{Feed: feedOf(t, sys, map[string]float64{"H2": 2, "O2": 1, "N2": 3.76}), T: 298.15, P: atm, Adiabatic: true})
	oxy := solve(t, sys, Problem{Feed: feedOf(t, sys, map[string]float64{"H2": 2, "O2": 1}), T: 298.15, P: atm, Adiabatic: true})
	t.Logf("H2–air %.1f K, H2–O2 %.1f K", air.T, oxy.T)
	assert.InDelta(t, 2380, air.T, 20)
	assert.InDelta(t, 3080, oxy.T, 20)
}

// TestMethaneAirConstantVolume: the same mixture burnt in a closed vessel
// reaches ≈ 2590 K (common practice, from memory; ±25 K for the spread of
// data sets) and conserves internal energy; the pressure follows the ideal
// gas law from the amounts.
func TestMethaneAirConstantVolume(t *testing.T) {
	sys, err := NewSystem(librarySpecies(t))
	require.NoError(t, err)
	feed := feedOf(t, sys, map[string]float64{"CH4": 1, "O2": 2, "N2": 7.52})
	r := solve(t, sys, Problem{Feed: feed, T: 298.15, P: atm, Adiabatic: true, ConstantVolume: true})
	t.Logf("constant-volume adiabatic temperature %.1f K, %.2f atm", r.T, r.P/atm)
	assert.InDelta(t, 2590, r.T, 25)
	checkEquilibrium(t, sys, feed, r)
	u0, n0 := 0.0, 0.0
	for j, n := range feed {
		u0 += n * (sys.Species()[j].Thermo.H(298.15) - R*298.15)
		n0 += n
	}
	assert.InDelta(t, u0, r.U, 1e-6*math.Abs(u0))
	assert.InEpsilon(t, atm*r.N*r.T/(n0*298.15), r.P, 1e-9)
	hp := solve(t, sys, Problem{Feed: feed, T: 298.15, P: atm, Adiabatic: true})
	assert.Greater(t, r.T, hp.T+200, "a closed vessel ends hotter than an open flame")
}

// janafLogKf reads log10 Kf(T) of a species from testdata/janaf (NIST-JANAF
// Thermochemical Tables, 4th ed., Chase 1998; see the files for how each
// column was entered).
func janafLogKf(t *testing.T, formula string) map[float64]float64 {
	f, err := os.Open(filepath.Join("..", "..", "testdata", "janaf", formula+".tsv"))
	require.NoError(t, err)
	defer f.Close()
	out := map[float64]float64{}
	var cols []string
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || strings.TrimSpace(line) == "" {
			continue
		}
		fields := strings.Split(line, "\t")
		if cols == nil {
			cols = fields
			continue
		}
		var T, k float64
		ok := false
		for i, c := range cols {
			if i >= len(fields) || fields[i] == "" {
				continue
			}
			v, err := strconv.ParseFloat(fields[i], 64)
			require.NoError(t, err)
			switch c {
			case "T_K":
				T = v
			case "log10_kf":
				k, ok = v, true
			}
		}
		if ok {
			out[T] = k
		}
	}
	require.NoError(t, sc.Err())
	return out
}

// bisect finds x in (lo, hi) with f(x) = 0 for f increasing.
func bisect(f func(float64) float64, lo, hi float64) float64 {
	for range 200 {
		mid := (lo + hi) / 2
		if f(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return (lo + hi) / 2
}

// TestDissociationAgreesWithJANAF compares degrees of dissociation at 1 bar
// with those implied by NIST-JANAF equilibrium constants of formation
// (testdata/janaf): for water over {H2O, H2, O2}, H2 over {H2, H} and O2
// over {O2, O}. The degree of dissociation α goes as K^(1/2) or K^(2/3)
// when small, so the 1.5 % allowed on α is about 2–3 % on K, i.e. 0.25–0.4
// kJ/mol in ΔG°: the agreement the library's polynomials have with JANAF
// (engine/reflib tests, 0.5 % in Cp and S).
func TestDissociationAgreesWithJANAF(t *testing.T) {
	type reaction struct {
		name    string
		species []string
		feed    string
		// alpha returns the equilibrium amounts of a dissociation α of one
		// mole of feed; k is the equilibrium constant at 1 bar from JANAF.
		amounts func(alpha float64) map[string]float64
		k       func(T float64) float64
		temps   []float64
	}
	h2o, h, o := janafLogKf(t, "H2O"), janafLogKf(t, "H"), janafLogKf(t, "O")
	cases := []reaction{
		{name: "H2O = H2 + 1/2 O2", species: []string{"H2O", "H2", "O2"}, feed: "H2O",
			amounts: func(a float64) map[string]float64 { return map[string]float64{"H2O": 1 - a, "H2": a, "O2": a / 2} },
			k:       func(T float64) float64 { return math.Pow(10, -h2o[T]) }, temps: []float64{2000, 2500, 3000}},
		{name: "H2 = 2 H", species: []string{"H2", "H"}, feed: "H2",
			amounts: func(a float64) map[string]float64 { return map[string]float64{"H2": 1 - a, "H": 2 * a} },
			k:       func(T float64) float64 { return math.Pow(10, 2*h[T]) }, temps: []float64{2000, 2500, 3000}},
		{name: "O2 = 2 O", species: []string{"O2", "O"}, feed: "O2",
			amounts: func(a float64) map[string]float64 { return map[string]float64{"O2": 1 - a, "O": 2 * a} },
			k:       func(T float64) float64 { return math.Pow(10, 2*o[T]) }, temps: []float64{2000, 2500, 3000}},
	}
	for _, c := range cases {
		sys, err := NewSystem(librarySpecies(t, c.species...))
		require.NoError(t, err)
		for _, T := range c.temps {
			K := c.k(T)
			// ln(Π x_p^ν_p / x_feed) − ln K at P = P°, for a dissociation α
			// of one mole of feed; a product's ν is its amount per unit α.
			qp := func(a float64) float64 {
				am := c.amounts(a)
				n := 0.0
				for _, v := range am {
					n += v
				}
				q := -math.Log(am[c.feed] / n)
				for name, v := range am {
					if name != c.feed {
						q += v / a * math.Log(v/n)
					}
				}
				return q - math.Log(K)
			}
			want := bisect(qp, 1e-12, 1-1e-12)
			r := solve(t, sys, Problem{Feed: feedOf(t, sys, map[string]float64{c.feed: 1}), T: T, P: PStd})
			got := 1 - r.Moles[sys.Index(c.feed)]
			t.Logf("%s at %.0f K: α = %.5f (JANAF %.5f, %+.2f %%)", c.name, T, got, want, 100*(got/want-1))
			assert.InEpsilon(t, want, got, 0.015, "%s at %.0f K", c.name, T)
		}
	}
}

// TestHydrogenOxygenSystem: the full H/O set at high temperature satisfies
// the equilibrium condition for every species and the element balances, and
// lower pressure dissociates more (Le Chatelier).
func TestHydrogenOxygenSystem(t *testing.T) {
	sys, err := NewSystem(librarySpecies(t, "H2", "O2", "H2O", "OH", "H", "O", "HO2", "H2O2"))
	require.NoError(t, err)
	feed := feedOf(t, sys, map[string]float64{"H2": 2, "O2": 1})
	hi := solve(t, sys, Problem{Feed: feed, T: 3000, P: 10 * atm})
	lo := solve(t, sys, Problem{Feed: feed, T: 3000, P: 0.1 * atm})
	checkEquilibrium(t, sys, feed, hi)
	checkEquilibrium(t, sys, feed, lo)
	w := sys.Index("H2O")
	assert.Less(t, lo.MoleFractions[w], hi.MoleFractions[w])
	// Constant T and V from the same feed at 3000 K and 1 atm: H2 + ½O2
	// combine to fewer moles, so the pressure falls below 1 atm.
	tv := solve(t, sys, Problem{Feed: feed, T: 3000, P: atm, ConstantVolume: true})
	checkEquilibrium(t, sys, feed, tv)
	assert.Less(t, tv.P, atm, "3 mol of H2 + O2 combine to fewer moles of H2O")
	assert.InEpsilon(t, tv.N*R*3000/tv.V, tv.P, 1e-12)
}

func TestErrors(t *testing.T) {
	ctx := context.Background()
	_, err := NewSystem(nil)
	assert.ErrorContains(t, err, "no species")
	sp := librarySpecies(t, "H2", "H")
	_, err = NewSystem(append(sp, sp[0]))
	assert.ErrorContains(t, err, "given twice")
	_, err = NewSystem([]Species{{Name: "X", Composition: map[string]int{"C": 1}}})
	assert.ErrorContains(t, err, "no thermochemistry")
	_, err = NewSystem([]Species{{Name: "X", Thermo: sp[0].Thermo}})
	assert.ErrorContains(t, err, "no elemental composition")

	sys, err := NewSystem(sp)
	require.NoError(t, err)
	_, err = sys.Solve(ctx, Problem{Feed: []float64{1}, T: 1000, P: atm})
	assert.ErrorContains(t, err, "feed has 1 amounts")
	_, err = sys.Solve(ctx, Problem{Feed: []float64{0, 0}, T: 1000, P: atm})
	assert.ErrorContains(t, err, "feed is empty")
	_, err = sys.Solve(ctx, Problem{Feed: []float64{-1, 2}, T: 1000, P: atm})
	assert.ErrorContains(t, err, "non-negative")
	_, err = sys.Solve(ctx, Problem{Feed: []float64{1, 0}, T: 100, P: atm})
	assert.ErrorContains(t, err, "outside")
	_, err = sys.Solve(ctx, Problem{Feed: []float64{1, 0}, T: 1000, P: 0})
	assert.ErrorContains(t, err, "pressure must be positive")
	_, err = sys.Solve(ctx, Problem{Feed: []float64{1, 0}, T: 3000, P: atm, MaxIterations: 2})
	var ce *ConvergenceError
	require.True(t, errors.As(err, &ce), "%v", err)
	assert.Equal(t, 2, ce.Iterations)
	cancelled, cancel := context.WithCancel(ctx)
	cancel()
	_, err = sys.Solve(cancelled, Problem{Feed: []float64{1, 0}, T: 1000, P: atm, Adiabatic: true})
	assert.Error(t, err)
}

// flat is a test thermo with constant H and S (Cp = 0).
type flat struct{ h, s float64 }

func (f flat) H(float64) float64 { return f.h }
func (f flat) S(float64) float64 { return f.s }

// TestAdiabaticOutOfRange: products that hold no heat (Cp = 0) cannot
// absorb the energy released, so no temperature up to TMax balances it;
// the search stops with a clear error instead of running on.
func TestAdiabaticOutOfRange(t *testing.T) {
	sys, err := NewSystem([]Species{
		{Name: "X", Composition: map[string]int{"C": 1}, Thermo: flat{0, 100}},
		{Name: "Y", Composition: map[string]int{"C": 1}, Thermo: flat{-1e6, 100}},
	})
	require.NoError(t, err)
	_, err = sys.Solve(context.Background(), Problem{Feed: []float64{1, 0}, T: 300, P: atm, Adiabatic: true})
	assert.ErrorContains(t, err, "above 6000 K")
	// Trace amounts far below the float64 range of a mole fraction's
	// neighbours are still exact: x_X/x_Y = exp(−(G_X − G_Y)/RT) = e^−377.
	sys2, err := NewSystem([]Species{
		{Name: "X", Composition: map[string]int{"C": 1}, Thermo: flat{1e6, 300}},
		{Name: "Y", Composition: map[string]int{"C": 1}, Thermo: flat{0, 100}},
	})
	require.NoError(t, err)
	r := solve(t, sys2, Problem{Feed: []float64{0, 1}, T: 300, P: atm})
	assert.InDelta(t, -((1e6-300*300)-(0-300*100))/(R*300), math.Log(r.MoleFractions[0]), 1e-6)
}

// TestExcludedSpecies: species holding an element the feed lacks take no
// part, and are listed.
func TestExcludedSpecies(t *testing.T) {
	sys, err := NewSystem(librarySpecies(t, "H2", "H", "N2", "NH3"))
	require.NoError(t, err)
	r := solve(t, sys, Problem{Feed: feedOf(t, sys, map[string]float64{"H2": 1}), T: 2500, P: atm})
	assert.ElementsMatch(t, []string{"N2", "NH3"}, r.Excluded)
	assert.Zero(t, r.Moles[sys.Index("NH3")])
}
