package nasa

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// propaneLike builds a known, sound two-range polynomial for round-trip
// tests. Low block: a1…a5 of the C3H8 entry of GRI-Mech 3.0 (Smith et al.
// 1999), from memory (Cp/R ≈ 8.9 at 300 K, 21.0 at 1000 K). High block,
// constructed here: with u = T − TMid and U = THigh − TMid,
// Cp/R = L + s (u − u²/U + u³/(3U²)), where L and s are the low block's Cp/R
// and slope at TMid; its slope s(1 − u/U)² is never negative, so the
// polynomial is continuous in Cp and dCp/dT and monotone. a6, a7 come from
// hf298, s298 and continuity of H and S, computed independently of the
// package code.
func propaneLike(hf298, s298, tMid, tHigh float64) NASA7 {
	p := NASA7{TLow: 300, TMid: tMid, THigh: tHigh}
	p.Low = [7]float64{0.93355381, 0.026424579, 6.1059727e-06, -2.1977499e-08, 9.5149253e-12}
	lo := p.Low
	cpLow := func(T float64) float64 { return lo[0] + lo[1]*T + lo[2]*T*T + lo[3]*T*T*T + lo[4]*T*T*T*T }
	L := cpLow(tMid)
	s := lo[1] + 2*lo[2]*tMid + 3*lo[3]*tMid*tMid + 4*lo[4]*tMid*tMid*tMid
	U := tHigh - tMid
	// Polynomial in u: c0 + c1 u + c2 u² + c3 u³; expand u = T − tMid.
	c := [4]float64{L, s, -s / U, s / (3 * U * U)}
	binom := [4][4]float64{{1}, {1, 1}, {1, 2, 1}, {1, 3, 3, 1}}
	for j := 0; j < 4; j++ {
		for k := 0; k <= j; k++ { // u^j = Σ C(j,k) T^k (−tMid)^(j−k)
			p.High[k] += c[j] * binom[j][k] * math.Pow(-tMid, float64(j-k))
		}
	}
	hInt := func(a [7]float64, T float64) float64 {
		return a[0]*T + a[1]*T*T/2 + a[2]*math.Pow(T, 3)/3 + a[3]*math.Pow(T, 4)/4 + a[4]*math.Pow(T, 5)/5
	}
	sInt := func(a [7]float64, T float64) float64 {
		return a[0]*math.Log(T) + a[1]*T + a[2]*T*T/2 + a[3]*math.Pow(T, 3)/3 + a[4]*math.Pow(T, 4)/4
	}
	p.Low[5] = hf298/R - hInt(p.Low, 298.15)
	p.Low[6] = s298/R - sInt(p.Low, 298.15)
	p.High[5] = hInt(p.Low, tMid) + p.Low[5] - hInt(p.High, tMid)
	p.High[6] = sInt(p.Low, tMid) + p.Low[6] - sInt(p.High, tMid)
	return p
}

func TestEvaluateFormulas(t *testing.T) {
	p := propaneLike(-104680, 270.2, 1000, 3000)
	// H and S must be the integrals of Cp and Cp/T; check with Simpson's rule
	// (error ~1e-12 relative for these smooth integrands with 2000 panels).
	simpson := func(f func(float64) float64, a, b float64) float64 {
		const n = 2000
		h := (b - a) / n
		s := f(a) + f(b)
		for i := 1; i < n; i++ {
			w := 2.0
			if i%2 == 1 {
				w = 4
			}
			s += w * f(a+float64(i)*h)
		}
		return s * h / 3
	}
	for _, r := range [][2]float64{{300, 900}, {1100, 2900}, {300, 2900}} {
		dh := simpson(p.Cp, r[0], r[1])
		ds := simpson(func(T float64) float64 { return p.Cp(T) / T }, r[0], r[1])
		assert.InEpsilon(t, dh, p.H(r[1])-p.H(r[0]), 1e-9, "H(%v)-H(%v)", r[1], r[0])
		assert.InEpsilon(t, ds, p.S(r[1])-p.S(r[0]), 1e-9, "S(%v)-S(%v)", r[1], r[0])
	}
	assert.InDelta(t, p.H(500)-500*p.S(500), p.G(500), 1e-9, "G = H − TS")
	assert.True(t, p.InRange(300))
	assert.True(t, p.InRange(3000))
	assert.False(t, p.InRange(299.9))
	assert.False(t, p.InRange(3000.1))
	// At exactly TMid the High block is used.
	q := p
	q.Low[0] += 1
	assert.Equal(t, R*cpR(&q.High, 1000), q.Cp(1000))
}

func TestFitRoundTrip(t *testing.T) {
	const hf, s = -104680.0, 270.2 // propane, TRC tables, from memory (inputs only)
	want := propaneLike(hf, s, 1000, 3000)
	var T, Cp []float64
	for x := 300.0; x <= 3000; x += 25 {
		T = append(T, x)
		Cp = append(Cp, want.Cp(x))
	}
	cp0, cpInf := ClassicalLimits(11, false, 2)
	got, rep, err := Fit(hf, s, T, Cp, cp0, cpInf, FitOptions{TLow: 300, TMid: 1000, THigh: 3000})
	require.NoError(t, err)
	// Points every 25 K leave no gap for Wilhoit fill, so the data are a
	// polynomial of the fitted family satisfying every constraint and the
	// least-squares fit must return it; 1e-6 allows for rounding in the
	// ill-conditioned monomial basis.
	assert.False(t, rep.Extrapolated)
	assert.Less(t, rep.MaxCpRelResidual, 1e-6)
	for x := 300.0; x <= 3000; x += 10 {
		assert.InEpsilon(t, want.Cp(x), got.Cp(x), 1e-6, "Cp at %v K", x)
		assert.InEpsilon(t, want.H(x), got.H(x), 1e-6, "H at %v K", x)
		assert.InEpsilon(t, want.S(x), got.S(x), 1e-6, "S at %v K", x)
	}
}

func TestFitTenSpecies(t *testing.T) {
	for _, m := range tenSpecies {
		t.Run(m.name, func(t *testing.T) {
			cps, cp0, cpInf := m.points()
			p, rep, err := Fit(m.hf, m.s, benson, cps, cp0, cpInf, FitOptions{})
			require.NoError(t, err)
			assert.True(t, rep.Extrapolated, "Benson points end at 1500 K, THigh is 5000 K")
			// The brief's acceptance limits: 0.01 kJ/mol and 0.01 J/(mol K).
			assert.InDelta(t, m.hf, p.H(298.15), 10, "ΔHf°298")
			assert.InDelta(t, m.s, p.S(298.15), 0.01, "S°298")
			for i, T := range benson {
				assert.InEpsilon(t, cps[i], p.Cp(T), 0.02, "Cp at %v K", T)
			}
			assert.InDelta(t, rep.MaxCpRelResidual, 0, 0.02)
			// Joins are exact up to rounding: far inside DefaultTolerances.
			assert.InDelta(t, R*cpR(&p.Low, p.TMid), R*cpR(&p.High, p.TMid), 1e-6, "Cp join")
			assert.InDelta(t, R*dcpR(&p.Low, p.TMid), R*dcpR(&p.High, p.TMid), 1e-9, "dCp/dT join")
			assert.InDelta(t, R*hR(&p.Low, p.TMid), R*hR(&p.High, p.TMid), 1e-3, "H join")
			assert.InDelta(t, R*sR(&p.Low, p.TMid), R*sR(&p.High, p.TMid), 1e-6, "S join")
			assert.Empty(t, Check(p, DefaultTolerances(), cpInf))
			// Monotone and below the classical ceiling on a 1 K grid (1e-6 R
			// is rounding-level slack).
			peak := 0.0
			for T := p.TLow; T <= p.THigh; T++ {
				c := p.Cp(T)
				require.GreaterOrEqual(t, c, peak-1e-6*R, "Cp falls at %v K", T)
				require.LessOrEqual(t, c, cpInf+1e-6, "Cp above Cp∞ at %v K", T)
				peak = math.Max(peak, c)
			}
			// The extrapolation must stay physically close to the true
			// RRHO curve it never saw: within 6 % up to 3000 K (the Wilhoit
			// form cannot know the exact vibrational spectrum; 6 % is a
			// loose physical-plausibility bound, not a tuned value).
			for _, T := range []float64{2000, 2500, 3000} {
				assert.InEpsilon(t, m.cp(T), p.Cp(T), 0.06, "extrapolated Cp at %v K", T)
			}
		})
	}
}

func TestFitPoly(t *testing.T) {
	// Dense data from the round-trip polynomial to 3000 K: FitPoly must
	// return it (same reasoning as TestFitRoundTrip).
	want := propaneLike(-104680, 270.2, 1000, 3000)
	var T, Cp []float64
	for x := 200.0; x <= 3000; x += 100 {
		T = append(T, x)
		Cp = append(Cp, want.Cp(x))
	}
	got, rep, err := FitPoly(-104680, 270.2, T, Cp, FitOptions{TLow: 300, TMid: 1000, THigh: 3000})
	require.NoError(t, err)
	assert.False(t, rep.Extrapolated)
	for x := 300.0; x <= 3000; x += 50 {
		assert.InEpsilon(t, want.Cp(x), got.Cp(x), 1e-6, "Cp at %v K", x)
	}
	// Non-monotone data (Cp falling, as for the O atom) are fitted without
	// the monotone constraint.
	var Td, Cd []float64
	for x := 300.0; x <= 5000; x += 100 {
		Td = append(Td, x)
		Cd = append(Cd, R*(2.6+0.2*math.Exp(-x/400)))
	}
	_, rep, err = FitPoly(249000, 161, Td, Cd, FitOptions{})
	require.NoError(t, err)
	assert.Less(t, rep.MaxCpRelResidual, 0.005, "smooth data, 0.5 %")
	_, _, err = FitPoly(0, 100, []float64{300, 400, 1500}, []float64{30, 31, 40}, FitOptions{})
	assert.Error(t, err, "too few points per range")
}

func TestFitRejectsInvalid(t *testing.T) {
	cp0, cpInf := ClassicalLimits(5, false, 0)
	good := []float64{35, 40, 46, 52, 63, 72, 87}
	cases := map[string]struct {
		hf, s      float64
		T, Cp      []float64
		cp0, cpInf float64
		opt        FitOptions
	}{
		"length mismatch":   {0, 186, benson, good[:3], cp0, cpInf, FitOptions{}},
		"empty":             {0, 186, nil, nil, cp0, cpInf, FitOptions{}},
		"NaN Cp":            {0, 186, benson, []float64{35, math.NaN(), 46, 52, 63, 72, 87}, cp0, cpInf, FitOptions{}},
		"negative T":        {0, 186, []float64{-300}, []float64{35}, cp0, cpInf, FitOptions{}},
		"zero Cp":           {0, 186, []float64{300}, []float64{0}, cp0, cpInf, FitOptions{}},
		"infinite hf":       {math.Inf(1), 186, benson, good, cp0, cpInf, FitOptions{}},
		"limits swapped":    {0, 186, benson, good, cpInf, cp0, FitOptions{}},
		"no limits":         {0, 186, benson, good, 0, 0, FitOptions{}},
		"above ceiling":     {0, 186, benson, good, cp0, 80, FitOptions{}},
		"ranges out":        {0, 186, benson, good, cp0, cpInf, FitOptions{TLow: 300, TMid: 6000, THigh: 5000}},
		"points all beyond": {0, 186, []float64{6000}, []float64{100}, cp0, cpInf, FitOptions{}},
	}
	for name, c := range cases {
		_, _, err := Fit(c.hf, c.s, c.T, c.Cp, c.cp0, c.cpInf, c.opt)
		assert.Error(t, err, name)
	}
}

func BenchmarkFit(b *testing.B) {
	m := tenSpecies[8] // C2H6
	cps, cp0, cpInf := m.points()
	for b.Loop() {
		if _, _, err := Fit(m.hf, m.s, benson, cps, cp0, cpInf, FitOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}
