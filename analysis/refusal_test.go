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
	msgs := messagesWithCode(res, speciesfile.CodeMissingThermo)
	require.Len(t, msgs, 2, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "Z has no thermo block and kiln cannot estimate it: atom 2 (Si): unsupported element Si")
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
	msgs := messagesWithCode(res, speciesfile.CodeMissingThermo)
	require.Len(t, msgs, 1, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "multiplicity 1 has no data: the reference library holds this structure only as O2, multiplicity 3")
}

// TestApproximationAdvice: a missing group is to be defined with a `group`
// statement; an approximation that is not a group (a radical site without
// an increment, an unknown ring system) is not, and the advice says what
// does replace it.
func TestApproximationAdvice(t *testing.T) {
	res := analyzeText(t, "species P C=C[CH]C=C\nspecies V ClC(=C)C\n")
	byName := map[string]string{}
	for _, m := range messagesWithCode(res, speciesfile.CodeMissingGroup) {
		byName[strings.SplitN(m, ":", 2)[0]] = m
	}
	require.Contains(t, byName, "P", "%v", res.Diagnostics)
	assert.NotContains(t, byName["P"], "`group` statement")
	assert.Contains(t, byName["P"], "estimated with an approximation kiln has no data for: ")
	assert.Contains(t, byName["P"], "HBI: radical delocalised")
	assert.Contains(t, byName["P"], "HBI dS, dCp: allylic", "the S°/Cp flag is reported as estimate and hover show it")
	assert.Contains(t, byName["P"], "thermo block")
	require.Contains(t, byName, "V", "%v", res.Diagnostics)
	assert.Contains(t, byName["V"], "no value for group Cd-(Cl)(C)")
	assert.Contains(t, byName["V"], "`group` statement")
}

// messagesWithCode returns the messages of the diagnostics with code.
func messagesWithCode(res *Result, code string) []string {
	var out []string
	for _, d := range res.Diagnostics {
		if d.Code == code {
			out = append(out, d.Message)
		}
	}
	return out
}
