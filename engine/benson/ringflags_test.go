package benson

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The thiane ring correction's ΔHf° was derived from thiane (train row of
// testdata/thermo/nsx.tsv), which it reproduces with no ΔHf° flag; its S°
// and Cp are tetrahydropyran's and flagged (S/Cp only: the ΔHf° uncertainty
// stays the class's), unless ring:thiane is supplied.
func TestThianeRing(t *testing.T) {
	r := heteroRef(t, "thiane")
	require.Equal(t, "train", r.split)
	count := func(e *Result) int {
		n := 0
		for _, m := range e.Missing {
			if m.Group == thianeEntropyGroup {
				n++
				assert.True(t, entropyOnly(m))
			}
		}
		return n
	}
	for _, smi := range []string{r.smiles, "S1CCCCC1", "C1CSCCC1"} {
		e := estimate(t, smi, Options{})
		assert.InDelta(t, r.hf, e.Hf298/calorie/1000, 0.01, smi)
		assert.Equal(t, 1, count(e), "%s: %v", smi, e.Missing)
		require.Len(t, e.Missing, 1, smi)
		assert.InDelta(t, maeToSigma*classMAE[e.Class]*calorie*1000, e.Uncertainty, 1e-6, smi)
		names := map[string]bool{}
		for _, c := range e.Corrections {
			names[c.Name] = true
		}
		assert.True(t, names["ring strain: thiane"], "%s: %v", smi, e.Corrections)
	}
	// a substituted thiane takes the same ring
	m := estimate(t, "CC1CCCCS1", Options{})
	assert.Equal(t, 1, count(m))
	// the other sulfur rings are not flagged this way
	assert.Zero(t, count(estimate(t, "C1CCSC1", Options{})))
	u, err := Estimate(parse(t, "C1CCSCC1"), Options{UserGroups: []GroupValue{{Name: "ring:thiane", Hf298: -0.52 * calorie * 1000, S298: 16.3 * calorie, Source: "test"}}})
	require.NoError(t, err)
	assert.Zero(t, count(u))
}
