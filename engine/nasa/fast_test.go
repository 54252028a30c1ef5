package nasa

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"
)

// matrixFamily is an explicit list of inequality rows, for testing lsi.
type matrixFamily struct {
	rows [][]float64
	rhs  []float64
}

func (f *matrixFamily) size() int { return len(f.rows) }

func (f *matrixFamily) row(i int, g []float64) float64 {
	copy(g, f.rows[i])
	return f.rhs[i]
}

func (f *matrixFamily) slacks(u, s []float64) {
	for i, r := range f.rows {
		s[i] = dot(r, u) - f.rhs[i]
	}
}

// TestLSIMatchesReference compares lsi with the slow reference solver
// (gonum SVD + Lawson–Hanson NNLS over all constraints) on random
// least-squares problems with random inequalities, many of them active. The
// optimum of a strictly convex problem is unique, so both must agree; 1e-7
// relative allows for the conditioning of the random problems.
func TestLSIMatchesReference(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	withActive := 0
	for trial := range 300 {
		n := 1 + rng.IntN(8)
		m := n + rng.IntN(20)
		nc := rng.IntN(30)
		a := make([]float64, m*n)
		b := make([]float64, m)
		for i := range a {
			a[i] = rng.NormFloat64()
		}
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		// Constraints g·u ≥ h satisfied by u = 0 when h ≤ 0 (feasible set
		// never empty).
		fam := &matrixFamily{}
		for range nc {
			g := make([]float64, n)
			for k := range g {
				g[k] = rng.NormFloat64()
			}
			fam.rows = append(fam.rows, g)
			fam.rhs = append(fam.rhs, -rng.Float64())
		}
		ad := mat.NewDense(m, n, append([]float64(nil), a...))
		var ineq []refRow
		for i, g := range fam.rows {
			ineq = append(ineq, refRow{c: g, rhs: fam.rhs[i]})
		}
		want, err := refConstrainedLSQ(ad, b, nil, ineq, 1e-9)
		require.NoError(t, err, "trial %d", trial)

		qa, qb := append([]float64(nil), a...), append([]float64(nil), b...)
		householderQR(qa, m, n, qb)
		require.True(t, triRank(qa, n, n, 1e-12))
		got := make([]float64, n)
		_, err = lsi(qa, n, n, qb[:n], fam, 1e-9, got, nil)
		require.NoError(t, err, "trial %d", trial)
		scale := 1.0
		for _, v := range want {
			scale = math.Max(scale, math.Abs(v))
		}
		for k := range got {
			assert.InDelta(t, want[k], got[k], 1e-7*scale, "trial %d u[%d]", trial, k)
		}
		// A warm start from the final active set must return the same
		// optimum.
		act, err := lsi(qa, n, n, qb[:n], fam, 1e-9, got, nil)
		require.NoError(t, err)
		if len(act) > 0 {
			withActive++
		}
		again := make([]float64, n)
		_, err = lsi(qa, n, n, qb[:n], fam, 1e-9, again, act)
		require.NoError(t, err)
		for k := range got {
			assert.InDelta(t, got[k], again[k], 1e-9*scale, "trial %d warm u[%d]", trial, k)
		}
	}
	assert.Greater(t, withActive, 150, "most trials must have active inequalities")
}

// TestSlacksMatchRows checks the fast Horner slacks of both inequality
// families against their explicit rows; they must agree to rounding (1e-9 of
// the row magnitude).
func TestSlacksMatchRows(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	fams := []struct {
		f ineqFamily
		n int
	}{
		{newPolyIneq(FitOptions{TLow: 300, TMid: 1000, THigh: 5000}, true, 30*R), nPoly},
		{newPolyIneq(FitOptions{TLow: 200, TMid: 1500, THigh: 3000}, false, 20*R), nPoly},
		{newPolyIneq(FitOptions{TLow: 300, TMid: 1000, THigh: 5000}, true, 0), nPoly},
		{&wilhoitIneq{nA: 4}, 4},
		{&wilhoitIneq{nA: 2}, 2},
	}
	for fi, c := range fams {
		u := make([]float64, c.n)
		for k := range u {
			u[k] = 10 * rng.NormFloat64()
		}
		s := make([]float64, c.f.size())
		c.f.slacks(u, s)
		g := make([]float64, c.n)
		for i := range s {
			h := c.f.row(i, g)
			mag := math.Abs(h)
			for k := range g {
				mag += math.Abs(g[k] * u[k])
			}
			assert.InDelta(t, dot(g, u)-h, s[i], 1e-9*(1+mag), "family %d, inequality %d", fi, i)
		}
	}
}

// TestSolvePolyMatchesReference compares solvePoly with the reference
// null-space/NNLS solver on the Fit problems of the ten test species (Wilhoit
// fill to 5000 K, ceiling and monotonicity). Both solve the same strictly
// convex problem, so the fitted Cp must agree; 1e-6 relative allows for the
// conditioning of the monomial basis.
func TestSolvePolyMatchesReference(t *testing.T) {
	opt, err := FitOptions{}.withDefaults()
	require.NoError(t, err)
	for _, m := range tenSpecies {
		cps, cp0, cpInf := m.points()
		w, err := FitWilhoit(benson, cps, cp0, cpInf)
		require.NoError(t, err)
		var samples []sample
		for i, T := range benson {
			samples = append(samples, sample{T: T, Cp: cps[i], W: pointWeight})
		}
		for T := 1600.0; T <= 5000; T += 50 {
			samples = append(samples, sample{T: T, Cp: w.Cp(T), W: 1})
		}
		got, err := solvePoly(m.hf, m.s, samples, opt, true, cpInf)
		require.NoError(t, err, m.name)
		want, err := refSolvePoly(m.hf, m.s, samples, opt, true, cpInf)
		require.NoError(t, err, m.name)
		for T := 300.0; T <= 5000; T += 25 {
			assert.InEpsilon(t, want.Cp(T), got.Cp(T), 1e-6, "%s Cp at %v K", m.name, T)
		}
	}
}

// TestFitWilhoitMatchesReference compares the pruned grid + Brent search
// with the reference dense grid + 25 golden-section steps. The fast search
// locates B to about 1e-4 in ln B, the reference to about 1e-6; near a
// minimum the sum of squares is quadratic in ln B, so both sums agree to far
// better than 1e-5 relative, and the fast one must not be worse by more.
func TestFitWilhoitMatchesReference(t *testing.T) {
	sse := func(w Wilhoit, T, Cp []float64) float64 {
		s := 0.0
		for i := range T {
			r := (w.Cp(T[i]) - Cp[i]) / Cp[i]
			s += r * r
		}
		return s
	}
	for _, m := range tenSpecies {
		cps, cp0, cpInf := m.points()
		got, err := FitWilhoit(benson, cps, cp0, cpInf)
		require.NoError(t, err, m.name)
		want, err := refFitWilhoit(benson, cps, cp0, cpInf)
		require.NoError(t, err, m.name)
		assert.LessOrEqual(t, sse(got, benson, cps), sse(want, benson, cps)*(1+1e-5), m.name)
		assert.InEpsilon(t, want.B, got.B, 1e-3, "%s B", m.name)
	}
}

// TestDenseMonotoneExact checks the stationary-point test of denseMonotone
// against a brute-force scan on a 0.05 K grid for random quartic blocks,
// joined continuously in Cp at TMid. Cases whose scanned fall lies near
// the threshold fallTolerance are skipped: the scan itself is not exact
// there.
func TestDenseMonotoneExact(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 6))
	checked, falling := 0, 0
	for range 400 {
		p := NASA7{TLow: 300, TMid: 1000, THigh: 5000}
		// A rising trend plus a random wiggle of random size.
		for _, a := range []*[7]float64{&p.Low, &p.High} {
			amp := math.Pow(10, -8+6*rng.Float64())
			a[0] = 5
			a[1] = 0.002 + amp*rng.NormFloat64()
			a[2] = amp * 1e-3 * rng.NormFloat64()
			a[3] = amp * 1e-6 * rng.NormFloat64()
			a[4] = amp * 1e-9 * rng.NormFloat64()
		}
		p.High[0] += cpR(&p.Low, p.TMid) - cpR(&p.High, p.TMid)
		peak, fall := math.Inf(-1), 0.0
		for T := p.TLow; T <= p.THigh; T += 0.05 {
			a := &p.Low
			if T > p.TMid {
				a = &p.High
			}
			c := R * cpR(a, T)
			fall = math.Max(fall, peak-c)
			peak = math.Max(peak, c)
		}
		// fallTolerance varies with T; skip falls between 0.9 × its
		// smallest and 1.1 × its largest value over the range.
		tolLo := fallTolerance(p, p.TLow, &p.Low, &p.Low, p.TLow)
		tolHi := fallTolerance(p, p.THigh, &p.High, &p.High, p.THigh)
		if fall > 0.9*tolLo && fall < 1.1*tolHi {
			continue
		}
		checked++
		err := denseMonotone(p)
		if fall > tolHi {
			falling++
			assert.Error(t, err, "scanned fall %g", fall)
		} else {
			assert.NoError(t, err, "scanned fall %g", fall)
		}
	}
	// Both outcomes must be well represented for the test to mean anything.
	assert.Greater(t, checked, 300)
	assert.Greater(t, falling, 50)
	assert.Greater(t, checked-falling, 50)
}

// hexaneCp is n-hexane's heat capacity by group additivity, 2 C-(C)(H)3 +
// 4 C-(C)2(H)2, at the temperatures of benson (J/(mol K)); group values
// Benson, Thermochemical Kinetics 2nd ed. (1976) Table A.1, from memory (the
// same numbers as engine/benson/groups.tsv).
func hexaneCp() []float64 {
	ch3 := []float64{6.19, 7.84, 9.40, 10.79, 13.02, 14.77, 17.58}
	ch2 := []float64{5.50, 6.95, 8.25, 9.35, 11.07, 12.34, 14.20}
	cp := make([]float64, len(ch3))
	for i := range cp {
		cp[i] = (2*ch3[i] + 4*ch2[i]) * 4.184 // cal → J
	}
	return cp
}

// BenchmarkFitHexane fits a typical larger alkane: n-hexane from group
// values, 20 atoms, 5 internal rotors. ΔHf°298 = 2(−10.00) + 4(−5.00)
// kcal/mol (Cohen, JPCRD 25 (1996) group values, as in groups.tsv) and S°298
// = 2(30.41) + 4(9.42) − R ln 18 cal/(mol K) (Benson 1976 groups, symmetry
// number 18); they are fit inputs only.
func BenchmarkFitHexane(b *testing.B) {
	cp := hexaneCp()
	hf := -40.0 * 4184
	s := (2*30.41+4*9.42)*4.184 - R*math.Log(18)
	cp0, cpInf := ClassicalLimits(20, false, 5)
	for b.Loop() {
		if _, _, err := Fit(hf, s, benson, cp, cp0, cpInf, FitOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkFitTenSpecies fits each of the ten test molecules once per
// iteration (reported time is for ten fits).
func BenchmarkFitTenSpecies(b *testing.B) {
	type in struct {
		cp          []float64
		cp0, cpInf  float64
		hf, s298, _ float64
	}
	var ins []in
	for _, m := range tenSpecies {
		cps, cp0, cpInf := m.points()
		ins = append(ins, in{cp: cps, cp0: cp0, cpInf: cpInf, hf: m.hf, s298: m.s})
	}
	for b.Loop() {
		for _, x := range ins {
			if _, _, err := Fit(x.hf, x.s298, benson, x.cp, x.cp0, x.cpInf, FitOptions{}); err != nil {
				b.Fatal(err)
			}
		}
	}
}

// TestFitHexane checks the properties Fit promises on the hexane benchmark
// input (a molecule larger than the ten test species).
func TestFitHexane(t *testing.T) {
	cp := hexaneCp()
	hf := -40.0 * 4184
	s := (2*30.41+4*9.42)*4.184 - R*math.Log(18)
	cp0, cpInf := ClassicalLimits(20, false, 5)
	p, rep, err := Fit(hf, s, benson, cp, cp0, cpInf, FitOptions{})
	require.NoError(t, err)
	assert.Less(t, rep.MaxCpRelResidual, 0.02, "input points within 2 %")
	assert.InDelta(t, hf, p.H(Tref), 1e-6*math.Abs(hf), "H(298.15) exact up to rounding")
	assert.InDelta(t, s, p.S(Tref), 1e-9*s, "S(298.15) exact up to rounding")
	assert.Empty(t, Check(p, DefaultTolerances(), cpInf))
	peak := 0.0
	for T := p.TLow; T <= p.THigh; T++ {
		c := p.Cp(T)
		require.GreaterOrEqual(t, c, peak-1e-6*R, "Cp falls at %v K", T)
		require.LessOrEqual(t, c, cpInf+1e-6, "Cp above Cp∞ at %v K", T)
		peak = math.Max(peak, c)
	}
}
