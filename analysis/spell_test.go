package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/speciesfile"
)

// TestRefusalReadsImplicitHydrogen: N(=O)=O, the usual mistaken spelling of
// NO2, is HNO2 (the N takes an implicit H); the refusal says what was read
// and how to write the radical of the reference library, in check and in
// estimate. A refused structure one H away from a library radical in the
// other direction gets the note too; one with no such neighbour does not.
func TestRefusalReadsImplicitHydrogen(t *testing.T) {
	res := analyzeText(t, "species hno2 N(=O)=O\nspecies x O[N]O\n")
	msgs := messagesWithCode(res, speciesfile.CodeMissingGroup)
	require.Len(t, msgs, 1, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "hno2: no value for group NO2-(H)")
	assert.Contains(t, msgs[0], "N(=O)=O is read as HNO2: its N takes 1 implicit H")
	assert.Contains(t, msgs[0], "NO2, is in the reference library: write it [O]N=O or [N](=O)=O")
	// HO–N•–OH: the parent's missing group O-(N)(H) is no route (the site
	// has no increment either), so the site is what the refusal names.
	thermo := messagesWithCode(res, speciesfile.CodeMissingThermo)
	require.Len(t, thermo, 1, "%v", res.Diagnostics)
	assert.Contains(t, thermo[0], "x has no thermo block and kiln cannot estimate it: no hydrogen-bond increment is at hand for a radical site of type oxyaminyl")
	assert.NotContains(t, thermo[0], "reference library")

	ws := NewWorkspace("", nil, DefaultSettings())
	for smi, want := range map[string]string{
		"N(=O)=O":    "implicit H",
		"[NH](=O)=O": "its N carries 1 H;",
		"[N]=[N]":    "the radical with one more H on its N, NNH, is in the reference library",
	} {
		m, err := molecule.ParseSMILES(smi)
		require.NoError(t, err)
		_, err = ws.EstimateMolecule(m, EstimateOptions{})
		require.Error(t, err, smi)
		assert.Contains(t, RefusalReason(err), want, smi)
	}
	// a radical one H fewer than a radical is another species: [S]O (HOS)
	// is not pointed to the SO diradical
	m, err := molecule.ParseSMILES("[S]O")
	require.NoError(t, err)
	_, err = ws.EstimateMolecule(m, EstimateOptions{})
	require.Error(t, err)
	assert.NotContains(t, RefusalReason(err), "reference library")
}
