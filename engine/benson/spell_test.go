package benson

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Tests of spellings that name a structure kiln estimates in another form,
// and of the refusals that point to the spelling it reads (tester7
// findings 9, 10, 15 and 16).

// A sulfoxide or sulfone written charge-separated (as many databases and
// toolkits write it) is estimated as its S=O structure, with the same
// numbers and symmetry; a sulfonium ion and an amine oxide stay refused,
// and the refusal names both readings.
func TestChargeSeparatedSulfurOxide(t *testing.T) {
	for _, c := range [][2]string{
		{"C[S+](C)[O-]", "CS(C)=O"},
		{"C[S+2]([O-])([O-])C", "CS(C)(=O)=O"},
		{"C[S+](=O)([O-])C", "CS(C)(=O)=O"},
		{"[O-][S+](CC)CC", "O=S(CC)CC"},
	} {
		a, b := estimate(t, c[0], Options{}), estimate(t, c[1], Options{})
		assert.Equal(t, resultKey(b), resultKey(a), c[0])
		assert.Equal(t, groupCounts(b), groupCounts(a), c[0])
	}
	for _, smi := range []string{"C[S+](C)C", "C[N+](C)(C)[O-]", "C[S+2]([O-])C"} {
		_, err := Estimate(parse(t, smi), Options{})
		require.Error(t, err, smi)
	}
	_, err := Estimate(parse(t, "C[N+](C)(C)[O-]"), Options{})
	require.Error(t, err)
	assert.Contains(t, err.Error(), "sulfoxides and sulfones")
}

// A salt of disconnected ions is refused as disconnected parts, not as a
// charge-separated structure; a refused azole centre's message reads "atom
// 3 (N) has no group: …".
func TestRefusalWording(t *testing.T) {
	for _, smi := range []string{"[Br-].[NH4+]", "C[N+](C)(C)C.[Cl-]"} {
		_, err := Estimate(parse(t, smi), Options{})
		require.Error(t, err, smi)
		assert.Contains(t, err.Error(), "2 disconnected parts", smi)
		assert.NotContains(t, err.Error(), "charge-separated", smi)
	}
	_, err := Estimate(parse(t, "c1nnn[nH]1"), Options{})
	require.Error(t, err)
	assert.Contains(t, err.Error(), "atom 3 (N) has no group: no group in the tables has a centre of type NazN")
}
