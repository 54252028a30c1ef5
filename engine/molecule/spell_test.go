package molecule

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestSMILESMessageHints: reader errors for common mistakes say what to
// write, at the same position as before: a pyrrole-type n without its H, an
// electron, carbon monoxide as C#O, an onium atom outside brackets, a
// charged bracket atom with too many bonds.
func TestSMILESMessageHints(t *testing.T) {
	cases := []struct {
		smiles   string
		pos      int
		msg, not string
	}{
		{"c1cc[n]c1", 0, "aromatic ring cannot be kekulized: a pyrrole-type aromatic n needs its H ([nH]", ""},
		{"[n]1cccc1", 0, "pyrrolyl: [N]1C=CC=C1", ""},
		{"CCc1ccnc1", 2, "needs its H ([nH]", ""},
		{"c1cccc1", 0, "aromatic ring cannot be kekulized", "[nH]"},
		{"[e-]", 1, "electron, not an element: electrons and ions are not supported", "aromatic"},
		{"C#O", 2, "oxygen with valence 3 (carbon monoxide is written [C-]#[O+] or [C]=O)", ""},
		{"CO(C)C", 1, "oxygen with valence 3 (an atom outside brackets carries no charge: if it is charged, write it in brackets, as [O+])", ""},
		{"C(C)(C)(C)(C)C", 0, "carbon with valence 5", "charge"},
		{"C=[N+]=[O-]", 7, "oxygen with charge -1 and valence 2", ""},
	}
	for _, c := range cases {
		se := requireSMILESError(t, c.smiles, c.pos, c.msg)
		if c.not != "" {
			assert.NotContains(t, se.Msg, c.not, c.smiles)
		}
	}
}

// TestWithHydrogenRemoved: the inverse of WithHydrogenAdded, and whether
// the hydrogens were implied.
func TestWithHydrogenRemoved(t *testing.T) {
	m, err := ParseSMILES("N(=O)=O")
	require.NoError(t, err)
	assert.True(t, m.ImplicitHydrogens(0))
	r, err := m.WithHydrogenRemoved(0)
	require.NoError(t, err)
	assert.Equal(t, "NO2", r.Formula())
	assert.Equal(t, 1, r.UnpairedElectrons())
	back, err := r.WithHydrogenAdded(0)
	require.NoError(t, err)
	assert.Equal(t, m.Canonical(), back.Canonical())
	_, err = m.WithHydrogenRemoved(1)
	assert.Error(t, err, "O has no H")
	b, err := ParseSMILES("[NH](=O)=O")
	require.NoError(t, err)
	assert.False(t, b.ImplicitHydrogens(0))
}
