package analysis

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestRefusalMessage: a species the estimator refuses gets one
// missing-thermo error that names the atom as written (1-based, in the
// SMILES order) and the reason, gives the advice once, and does not leak
// the engine package's name.
func TestRefusalMessage(t *testing.T) {
	res := analyzeText(t, "species Z C[Si](C)(C)C\nspecies W CC[N+](C)(C)C\n")
	var msgs []string
	for _, d := range res.Diagnostics {
		if d.Code == speciesfile.CodeMissingThermo {
			msgs = append(msgs, d.Message)
		}
	}
	require.Len(t, msgs, 2, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "Z has no thermo block and kiln cannot estimate it: atom 1 (C) has a neighbour of type Si")
	assert.Contains(t, msgs[1], "atom 3 (N) has charge +1")
	for _, m := range msgs {
		assert.NotContains(t, m, "benson")
		assert.Equal(t, 1, strings.Count(m, "thermo block;")+strings.Count(m, "thermo-table block"), m)
		assert.True(t, strings.HasSuffix(m, "; add a nasa7 or thermo-table block"), m)
	}
}

// TestRefusalSpinState: a library structure in a spin state the library
// does not hold is refused for that reason (not for a missing group).
func TestRefusalSpinState(t *testing.T) {
	res := analyzeText(t, "species O2s O=O\n  multiplicity 1\n")
	var msgs []string
	for _, d := range res.Diagnostics {
		if d.Code == speciesfile.CodeMissingThermo {
			msgs = append(msgs, d.Message)
		}
	}
	require.Len(t, msgs, 1, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "multiplicity 1 has no data: the reference library holds this structure only as O2, multiplicity 3")
}
