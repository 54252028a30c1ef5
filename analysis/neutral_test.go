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

// TestSulfoxideSpellingsOneStructure: a sulfoxide or sulfone written
// charge-separated is the species written with S=O (a duplicate-species
// warning, one estimate), as charge-separated nitro is.
func TestSulfoxideSpellingsOneStructure(t *testing.T) {
	res := analyzeText(t, "species A C[S+](C)[O-]\nspecies B CS(C)=O\nspecies C C[S+2]([O-])([O-])C\nspecies D CS(C)(=O)=O\n")
	dups := messagesWithCode(res, speciesfile.CodeDuplicateSpecies)
	require.Len(t, dups, 2, "%v", res.Diagnostics)
	assert.Contains(t, dups[0], "B has the same structure as A")
	assert.Contains(t, dups[1], "D has the same structure as C")
	for _, p := range [][2]string{{"A", "B"}, {"C", "D"}} {
		a, b := res.ByName[p[0]], res.ByName[p[1]]
		require.NotNil(t, a.Estimate, p[0])
		require.NotNil(t, b.Estimate, p[1])
		assert.Equal(t, a.Estimate.Hf298, b.Estimate.Hf298)
		assert.Equal(t, a.Estimate.S298, b.Estimate.S298)
	}
	c := compareTexts(t, map[string]string{
		"/w/a.kiln": "species dmso C[S+](C)[O-]\nspecies sulfone C[S+2]([O-])([O-])C\n",
		"/w/b.kiln": "species DMSO CS(C)=O\nspecies DMSO2 CS(C)(=O)=O\n",
	}, "/w/a.kiln", "/w/b.kiln")
	assert.Equal(t, map[string]string{"dmso": "DMSO", "sulfone": "DMSO2"}, pairNames(c))
}
