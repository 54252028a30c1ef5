package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/speciesfile"
)

// TestFlagWords: identical engine entries (one per atom) are one Flag
// with a count; a group used as it stands is never "approximated by"
// itself; a group approximated by another keeps that wording.
func TestFlagWords(t *testing.T) {
	self := benson.Missing{Group: "Cd-(F)2", Approximation: "Cd-(F)2 (value from CF2=CF2) without halogen interactions", Note: "errors possible"}
	other := benson.Missing{Group: "CO-(O)(Cd)", Approximation: "CO-(O)(C)", Note: "nearest neighbour"}
	fs := distinctFlags([]benson.Missing{self, other, self})
	require.Len(t, fs, 2)
	assert.Equal(t, 2, fs[0].Count)
	assert.Equal(t, 1, fs[1].Count)
	assert.Equal(t, "Cd-(F)2 ×2 (used as it stands, value from CF2=CF2, without halogen interactions: errors possible)", FlagText(fs[0]))
	assert.Equal(t, "FLAGGED group", FlagHeading(fs[0]))
	assert.Equal(t, "CO-(O)(Cd) (approximated by CO-(O)(C): nearest neighbour)", FlagText(fs[1]))
	assert.Equal(t, "MISSING group", FlagHeading(fs[1]))
	assert.Equal(t, "derived from one molecule", unparenthesise("(derived from one molecule)"))
	// A group whose name is a prefix of the stand-in's is approximated,
	// not used as it stands.
	assert.False(t, UsedAsItStands(benson.Missing{Group: "C-(C)(H)3", Approximation: "C-(C)(H)3x"}))
}

// TestGroupCpGapWords: which group temperatures a cp line leaves out, and
// what kiln does at each.
func TestGroupCpGapWords(t *testing.T) {
	pts := func(T ...float64) []speciesfile.CpPoint {
		var out []speciesfile.CpPoint
		for _, x := range T {
			out = append(out, speciesfile.CpPoint{T: speciesfile.Number{SI: x}, Cp: speciesfile.Number{SI: 20}})
		}
		return out
	}
	for _, tc := range []struct {
		T    []float64
		want string
	}{
		{[]float64{300, 400, 500, 600, 800, 1000, 1500}, ""},
		{[]float64{298.15, 400, 500, 600, 700, 800, 1000, 1200, 1500}, ""},
		{[]float64{290, 400, 500, 600, 700, 800, 1000, 1200, 1500}, "Cp given at 290, 400, 500, 600, 700, 800, 1000, 1200 and 1500 K; 300 K interpolated linearly"},
		{[]float64{300}, "Cp given at 300 K only; 400–1500 K held at the 300 K value"},
		{[]float64{1000}, "Cp given at 1000 K only; 300, 400, 500, 600, 800 and 1500 K held at the 1000 K value"},
		{[]float64{300, 1000}, "Cp given at 300 and 1000 K only; 400–800 K interpolated linearly and 1500 K held at the 1000 K value"},
		{[]float64{300, 500, 1500}, "Cp given at 300, 500 and 1500 K; 400, 600, 800 and 1000 K interpolated linearly"},
	} {
		assert.Equal(t, tc.want, groupCpGap(pts(tc.T...)), "%v", tc.T)
	}
}

// TestCpFloorOneBound: the estimate's floor test and nonphysical-thermo use
// nasa.CpFloor from nasa.FloorFrom up.
func TestCpFloorOneBound(t *testing.T) {
	floor := nasa.CpFloor(5, false)
	i, ok := cpBelowFloor(5, false, []float64{250, 300, 400}, []float64{1, floor * 1.01, floor * 0.99})
	require.True(t, ok, "250 K is below FloorFrom and not tested")
	assert.Equal(t, 2, i)
	_, ok = cpBelowFloor(5, false, []float64{300}, []float64{floor})
	assert.False(t, ok, "the floor itself is allowed")
	_, _, below := cpFloorCheck([7]float64{40, 45, 50, 55, 60, 65, 70}, 5, false, false)
	assert.False(t, below)
	m, refuse, below := cpFloorCheck([7]float64{8, 9, 10, 11, 12, 13, 14}, 5, false, true)
	require.True(t, below)
	assert.Equal(t, CpFloorGroup, m.Group)
	assert.Equal(t, 300.0, refuse.T)
	assert.Contains(t, FitRefusal(refuse, Units{}), "the estimated Cp at 300 K is 1.91 cal/(mol·K), below 7.95 cal/(mol·K)")
}

// TestCpHeldBelowLimit: a group sum that reaches the classical limit only
// at the top of the table, by a few per cent (C2F6, whose many
// low-frequency modes saturate early), is held at ceilingHoldAt of the
// limit and flagged, and the NASA-7 fit is then made; one that is far
// above it, or already at 300 K, is not held (cpCeilingCheck flags it and
// the fit refuses it).
func TestCpHeldBelowLimit(t *testing.T) {
	m, err := molecule.ParseSMILES("FC(F)(F)C(F)(F)F")
	require.NoError(t, err)
	e, err := estimate(newEstimateCache().lib, m, EstimateOptions{})
	require.NoError(t, err)
	require.Greater(t, e.cpInf, 0.0)
	assert.GreaterOrEqual(t, e.Group.Cp[6], e.cpInf, "the premise: the group sum reaches the limit at 1500 K")
	assert.InDelta(t, ceilingHoldAt*e.cpInf, e.Cp[6], 1e-9)
	assert.Equal(t, e.Group.Cp[0], e.Cp[0], "values below the hold are kept")
	held := false
	for _, f := range e.Flags() {
		held = held || f.Missing.Group == CpHeldGroup
		assert.False(t, BeyondBound(f.Missing), "%+v", f)
	}
	assert.True(t, held)
	p, _, err := e.NASA7()
	require.NoError(t, err)
	assert.Less(t, p.Cp(1500), e.cpInf)

	var cp [7]float64
	for i := range cp {
		cp[i] = 100
	}
	_, _, ok := cpCeilingHold(cp, 90, 5000)
	assert.False(t, ok, "an excess from 300 K is not held")
	cp[6] = 120
	for i := range cp[:6] {
		cp[i] = 50
	}
	_, _, ok = cpCeilingHold(cp, 100, 5000)
	assert.False(t, ok, "an excess of 20 %% is not held")
}
