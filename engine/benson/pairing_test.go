package benson

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestKekuleDiradicalRefused: radical sites that a resonance structure puts
// on bonded atoms pair into a bond (a Kekulé-type "diradical" is a
// closed-shell molecule written with its π bond broken), so summing them as
// independent sites would describe a high-spin state no table covers: the
// estimate is refused, naming the paired structure, the same for every
// spelling. Non-Kekulé diradicals (m-xylylene, trimethylenemethane) and
// sites with no conjugated path between them are estimated.
func TestKekuleDiradicalRefused(t *testing.T) {
	for _, c := range []struct {
		spellings []string
		paired    string // a closed-shell SMILES of the paired structure
	}{
		{[]string{"[O]c1ccc([O])cc1", "[O]C1=CC=C([O])C=C1", "c1cc([O])ccc1[O]"}, "O=C1C=CC(=O)C=C1"},
		{[]string{"[CH2]c1ccc([CH2])cc1", "C1=CC([CH2])=CC=C1[CH2]"}, "C=C1C=CC(=C)C=C1"},
		{[]string{"[CH2]C=C[CH2]", "C([CH2])=C[CH2]"}, "C=CC=C"},
		{[]string{"[CH2]C#C[CH2]"}, "C=C=C=C"},
	} {
		want := parse(t, c.paired).Canonical()
		for _, smi := range c.spellings {
			_, err := Estimate(parse(t, smi), Options{})
			require.Error(t, err, smi)
			assert.Contains(t, err.Error(), "pair up", smi)
			assert.Contains(t, err.Error(), "closed-shell molecule "+want, smi)
		}
	}
	for _, smi := range []string{"[CH2]c1cccc([CH2])c1", "C([CH2])([CH2])=C", "[CH2]CC[CH2]", "[CH2]C=C", "[O]CC[O]",
		"[c]1ccccc1", "C=[CH]"} {
		e, err := Estimate(parse(t, smi), Options{})
		require.NoError(t, err, smi)
		assert.GreaterOrEqual(t, e.Multiplicity, 2, smi)
	}
}

// TestSpinConflictRefused: a species one of whose spellings puts two
// unpaired electrons on one atom (a carbene) or on bonded atoms is refused
// whichever spelling is written (tester12: C=C[CH] was refused, [CH]=C[CH2]
// estimated as two independent sites); two σ sites in one aromatic ring
// (the benzynes) are refused by their own rule; σ sites in different rings
// are estimated, as is a single σ radical; past the resonance bound a
// polyradical is refused rather than decided by spelling.
func TestSpinConflictRefused(t *testing.T) {
	for _, c := range []struct{ written, respelled, want string }{
		{"C=C[CH]", "[CH]=C[CH2]", "a resonance structure of it"},
		{"CC(=O)[CH]", "[CH]=C([O])C", "a resonance structure of it"},
		{"C=C1C=C[C]C=C1", "[CH2]c1cc[c]cc1", "a resonance structure of it"},
		{"C=C1[CH][C]=CC=C1", "[CH2]c1c[c]ccc1", "a resonance structure of it"},
		{"[c]1cc[c]cc1", "[c]1ccc([c]c1)", "lie in one aromatic ring"},
		{"[c]1c[c]ccc1", "c1cc[c]c[c]1", "lie in one aromatic ring"},
	} {
		for _, smi := range []string{c.written, c.respelled} {
			_, err := Estimate(parse(t, smi), Options{})
			require.Error(t, err, smi)
			assert.Contains(t, err.Error(), "unpaired electron", smi)
		}
		_, err := Estimate(parse(t, c.respelled), Options{})
		assert.Contains(t, err.Error(), c.want, c.respelled)
	}
	for _, smi := range []string{"[c]1ccc(cc1)-c1cc[c]cc1", "[c]1ccc2c[c]ccc2c1", "[c]1ccccc1", "C=[CH]"} {
		_, err := Estimate(parse(t, smi), Options{})
		assert.NoError(t, err, smi)
	}
	long := "[CH2]" + strings.Repeat("C=C", 40) + "[CH2]"
	_, err := Estimate(parse(t, long), Options{})
	require.Error(t, err)
	assert.Contains(t, err.Error(), "resonance structures, more than kiln explores")
}
