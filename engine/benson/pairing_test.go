package benson

import (
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
// estimated as two independent sites); benzynes and σ,π diradicals are
// refused with it; single σ and π radicals are not affected.
func TestSpinConflictRefused(t *testing.T) {
	for _, pair := range [][]string{
		{"C=C[CH]", "[CH]=C[CH2]"},
		{"CC(=O)[CH]", "[CH]=C([O])C"},
		{"C=C1C=C[C]C=C1", "[CH2]c1cc[c]cc1"},
		{"C=C1[CH][C]=CC=C1", "[CH2]c1c[c]ccc1"},
		{"[c]1cc[c]cc1", "[c]1c[c]ccc1"},
	} {
		for _, smi := range pair {
			_, err := Estimate(parse(t, smi), Options{})
			require.Error(t, err, smi)
			assert.Regexp(t, "unpaired electron", err.Error(), smi)
		}
	}
}
