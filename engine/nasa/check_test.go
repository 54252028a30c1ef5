package nasa

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func kinds(ps []Problem) []string {
	var k []string
	for _, p := range ps {
		k = append(k, p.Kind+"/"+p.Part)
	}
	return k
}

func TestCheckSound(t *testing.T) {
	p := propaneLike(-104680, 270.2, 1000, 3000)
	_, cpInf := ClassicalLimits(11, false, 2)
	assert.Empty(t, Check(p, DefaultTolerances(), cpInf))
	assert.Empty(t, Check(p, Tolerances{}, 0), "zero tolerances mean defaults")
	// Argon: constant Cp = 2.5 R.
	ar := NASA7{TLow: 200, TMid: 1000, THigh: 6000}
	ar.Low[0], ar.High[0] = 2.5, 2.5
	ar.Low[5], ar.High[5] = -745.375, -745.375
	assert.Empty(t, Check(ar, Tolerances{}, 2.5*R))
}

func TestCheckBroken(t *testing.T) {
	sound := propaneLike(-104680, 270.2, 1000, 3000)
	_, cpInf := ClassicalLimits(11, false, 2)
	linear := func(c0, c1 float64) NASA7 { // both blocks Cp/R = c0 + c1 T: continuous
		p := NASA7{TLow: 300, TMid: 1000, THigh: 5000}
		p.Low[0], p.Low[1] = c0, c1
		p.High = p.Low
		return p
	}
	cases := []struct {
		name     string
		p        NASA7
		cpMax    float64
		wantKind string
		wantPart string
		contains string
	}{
		{"sign of high a2 swapped", func() NASA7 { p := sound; p.High[1] = -p.High[1]; return p }(), cpInf, KindDiscontinuity, "tmid", "Cp jumps"},
		{"low a6 shifted", func() NASA7 { p := sound; p.Low[5] += 50; return p }(), cpInf, KindDiscontinuity, "tmid", "H jumps"},
		{"high a7 shifted", func() NASA7 { p := sound; p.High[6] += 0.1; return p }(), cpInf, KindDiscontinuity, "tmid", "S jumps"},
		{"TMid above THigh", func() NASA7 { p := sound; p.TMid = 4000; return p }(), cpInf, KindNonphysical, "ranges", "increasing order"},
		{"TLow above TMid", func() NASA7 { p := sound; p.TLow = 1200; return p }(), cpInf, KindNonphysical, "ranges", "increasing order"},
		{"Cp decreasing", linear(20, -0.002), 0, KindNonphysical, "low", "falls"},
		{"Cp negative", linear(1, -0.001), 0, KindNonphysical, "high", "not positive"},
		{"above ceiling", sound, 20 * R, KindNonphysical, "high", "classical limit"},
		{"NaN coefficient", func() NASA7 { p := sound; p.High[3] = math.NaN(); return p }(), cpInf, KindNonphysical, "high", "not all finite"},
	}
	for _, c := range cases {
		ps := Check(c.p, DefaultTolerances(), c.cpMax)
		require.NotEmpty(t, ps, c.name)
		found := false
		for _, p := range ps {
			if p.Kind == c.wantKind && p.Part == c.wantPart && strings.Contains(p.Message, c.contains) {
				found = true
			}
		}
		assert.True(t, found, "%s: want %s/%s %q, got %v", c.name, c.wantKind, c.wantPart, c.contains, ps)
	}
	// A shift of a6 that stays inside the tolerance is not reported: the
	// default H tolerance is 0.01 R × 1000 K ≈ 83 J/mol, 5 J/mol is below.
	p := sound
	p.Low[5] += 5 / R
	assert.Empty(t, Check(p, DefaultTolerances(), cpInf), "%v", kinds(Check(p, DefaultTolerances(), cpInf)))
}

// TestCpFloor: the floor is 95 % of the classical Cp0 (exact multiples of
// R), and BelowFloor finds the first sampled point under it from 296.15 K up.
func TestCpFloor(t *testing.T) {
	assert.InDelta(t, 0.95*2.5*R, CpFloor(1, false), 1e-12)
	assert.InDelta(t, 0.95*3.5*R, CpFloor(2, true), 1e-12)
	assert.InDelta(t, 0.95*4*R, CpFloor(3, false), 1e-12)
	assert.Zero(t, CpFloor(0, false))
	// Cp/R = 3 + 0.001 T: 3.3 R at 300 K, under the 3.8 R floor of a
	// non-linear molecule until 800 K; the low block is sampled every 16 K
	// from 200 K, and 296 K lies below 296.15 K, so 312 K is the first.
	p := NASA7{TLow: 200, TMid: 1000, THigh: 3000, Low: [7]float64{3, 1e-3}, High: [7]float64{3, 1e-3}}
	part, T, cp, ok := BelowFloor(p, CpFloor(3, false))
	require.True(t, ok)
	assert.Equal(t, "low", part)
	assert.InDelta(t, 312, T, 1e-9)
	assert.InDelta(t, R*(3+0.312), cp, 1e-9)
	// Above the floor everywhere: nothing.
	p.Low[0], p.High[0] = 4, 4
	_, _, _, ok = BelowFloor(p, CpFloor(3, false))
	assert.False(t, ok)
	// Only in the high block: Cp/R = 4.2 − 2e-4 T falls under 3.8 above
	// 2000 K; samples every 40 K from 1000 K, so 2040 K.
	p.High = [7]float64{4.2, -2e-4}
	part, T, _, ok = BelowFloor(p, CpFloor(3, false))
	require.True(t, ok)
	assert.Equal(t, "high", part)
	assert.InDelta(t, 2040, T, 1e-9)
}
