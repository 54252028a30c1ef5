package benson

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The furan ring correction's S° and Cp are flagged (S/Cp only: the ΔHf°
// uncertainty stays the class's), and the flag's note states a Cp
// discrepancy the validation data show: furan's estimated Cp against
// testdata/thermo/train.tsv.
func TestFuranRingFlag(t *testing.T) {
	for _, smi := range []string{"c1ccoc1", "Cc1ccco1", "C1=COC=C1"} {
		e := estimate(t, smi, Options{})
		flags := 0
		for _, m := range e.Missing {
			if m.Group == furanEntropyGroup {
				flags++
				assert.True(t, entropyOnly(m))
			}
		}
		assert.Equal(t, 1, flags, "%s: %v", smi, e.Missing)
		if len(e.Missing) == 1 {
			assert.InDelta(t, maeToSigma*classMAE[e.Class]*calorie*1000, e.Uncertainty, 1e-6,
				"%s: an S/Cp-only flag leaves the ΔHf° uncertainty of the class", smi)
		}
	}
	// a supplied ring:furan replaces the correction and its flag
	u, err := Estimate(parse(t, "c1ccoc1"), Options{UserGroups: []GroupValue{{Name: "ring:furan", Hf298: -5.9 * calorie * 1000, S298: 30 * calorie, Source: "test"}}})
	require.NoError(t, err)
	for _, m := range u.Missing {
		assert.NotEqual(t, furanEntropyGroup, m.Group)
	}

	// the discrepancy the note states (1.5–2.2 cal/(mol K) from 400 K on)
	var furan *refRow
	for _, r := range readRef(t, "../../testdata/thermo/train.tsv") {
		if r.smiles == "c1ccoc1" {
			furan = &r
		}
	}
	require.NotNil(t, furan, "furan is a training row")
	e := estimate(t, "c1ccoc1", Options{})
	for k, T := range StdTemps {
		if math.IsNaN(furan.cp[k]) || T < 400 {
			continue
		}
		d := e.Cp[k]/calorie - furan.cp[k]
		t.Logf("furan Cp(%.0f K): estimate %.2f, reference %.2f, %+.2f cal/(mol K)", T, e.Cp[k]/calorie, furan.cp[k], d)
		assert.GreaterOrEqual(t, d, 1.4, "%.0f K: the flag's note is out of date", T)
		assert.LessOrEqual(t, d, 2.3, "%.0f K: the flag's note is out of date", T)
	}
}

// The thiophene ring correction's Cp, taken as furan's, is flagged (Cp
// only), unless ring:thiophene is supplied; a saturated S ring is not.
func TestThiopheneCpFlag(t *testing.T) {
	count := func(e *Result) int {
		n := 0
		for _, m := range e.Missing {
			if m.Group == thiopheneCpGroup {
				n++
				assert.True(t, entropyOnly(m))
			}
		}
		return n
	}
	for _, smi := range []string{"c1ccsc1", "Cc1cccs1"} {
		e := estimate(t, smi, Options{})
		assert.Equal(t, 1, count(e), "%s: %v", smi, e.Missing)
		if len(e.Missing) == 1 {
			assert.InDelta(t, maeToSigma*classMAE[e.Class]*calorie*1000, e.Uncertainty, 1e-6, smi)
		}
	}
	assert.Zero(t, count(estimate(t, "C1CCSC1", Options{})))
	u, err := Estimate(parse(t, "c1ccsc1"), Options{UserGroups: []GroupValue{{Name: "ring:thiophene", Hf298: 1.36 * calorie * 1000, S298: 22.84 * calorie, Source: "test"}}})
	require.NoError(t, err)
	assert.Zero(t, count(u))
}
