package benson

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/reflib"
)

// A ketenyl radical R–C•=C=O (↔ R–C≡C–O•) has no increment of its own: the
// estimate is flagged and its uncertainty widened by widenStabiliser however
// the radical is spelled, and spellings of one radical agree on whether it
// is estimated and on the number (a structure with a cumulated ketene is one
// resonance structure among others, not a reason to refuse the species).
func TestKetenylRadical(t *testing.T) {
	for _, spellings := range [][]string{
		{"C[C]=C=O", "CC#C[O]"},
		{"O=C=[C]c1ccccc1", "[O]C#Cc1ccccc1", "O=C=C=C1[CH]C=CC=C1"},
		{"[CH]=C=C=C=O", "C#CC#C[O]", "C#C[C]=C=O"},
	} {
		var first *Result
		for _, smi := range spellings {
			e := heteroEstimate(t, smi)
			flagged := false
			for _, m := range e.Missing {
				if m.Group == "HBI: "+ketenylSite {
					flagged = true
				}
			}
			assert.True(t, flagged, "%s: %v", smi, e.Missing)
			assert.GreaterOrEqual(t, e.Uncertainty/calorie/1000, widenStabiliser, smi)
			if first == nil {
				first = e
				continue
			}
			assert.Equal(t, resultKey(first), resultKey(e), "%s vs %s", smi, spellings[0])
		}
	}
	// a closed-shell cumulated ketene is still refused
	_, err := Estimate(parse(t, "O=C=C=C=O"), Options{})
	require.Error(t, err)
}

// The widening is the size of the error kiln's own data show: HCCO estimated
// as ketene plus the vinylic increment against the reference library's
// HCCO.
func TestKetenylWidening(t *testing.T) {
	m, err := molecule.ParseSMILES("[CH]=C=O")
	require.NoError(t, err)
	sp, ok := reflib.New().Lookup(m, 0)
	require.True(t, ok, "HCCO is a reference-library species")
	e, err := Estimate(m, Options{})
	require.NoError(t, err)
	d := math.Abs(e.Hf298-sp.Hf298) / calorie / 1000
	t.Logf("HCCO: estimate %.2f, library %.2f kcal/mol", e.Hf298/calorie/1000, sp.Hf298/calorie/1000)
	assert.InDelta(t, d, widenStabiliser, 0.5)
}
