package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestNitroSpellingsOneStructure: the charge-separated and the pentavalent
// spellings of a nitro group are one structure (a duplicate-species
// warning), with one estimate.
func TestNitroSpellingsOneStructure(t *testing.T) {
	res := analyzeText(t, "species A C[N+](=O)[O-]\nspecies B CN(=O)=O\n")
	dups := messagesWithCode(res, speciesfile.CodeDuplicateSpecies)
	require.Len(t, dups, 1, "%v", res.Diagnostics)
	assert.Contains(t, dups[0], "B has the same structure as A")
	a, b := res.ByName["A"], res.ByName["B"]
	require.NotNil(t, a.Estimate)
	require.NotNil(t, b.Estimate)
	assert.Equal(t, a.Estimate.Hf298, b.Estimate.Hf298)
	assert.Equal(t, a.Estimate.S298, b.Estimate.S298)
}
