package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/benson"
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
