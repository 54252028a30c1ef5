package analysis

import (
	"testing"

	"kiln.dev/kiln/engine/molecule"
)

// TestInvariantSpellings checks the duplicate-search fingerprint: spellings
// of one structure share it (atom order, Kekulé or aromatic rings, explicit
// hydrogens), and a set of isomers and near-isomers (same atoms, different
// bonds, hydrogens, radical sites or charges) has no two alike.
func TestInvariantSpellings(t *testing.T) {
	same := [][]string{
		{"CCO", "OCC", "C(O)C", "[CH3][CH2][OH]"},
		{"c1ccccc1C", "Cc1ccccc1", "C1=CC=CC=C1C", "c1cc(C)ccc1"},
		{"CC(C)C[CH2]", "[CH2]CC(C)C", "C(C)(C)C[CH2]"},
		{"O=C1CCCC1", "C1CCC(=O)C1"},
	}
	inv := func(s string) string {
		m, err := molecule.ParseSMILES(s)
		if err != nil {
			t.Fatalf("%s: %v", s, err)
		}
		return invariant(m)
	}
	for _, group := range same {
		for _, s := range group[1:] {
			if inv(s) != inv(group[0]) {
				t.Errorf("%s and %s: different fingerprints for one structure", group[0], s)
			}
		}
	}
	distinct := []string{"CCCC", "CC(C)C", "C=CCC", "CC=CC", "C=C(C)C", "C1CCC1", "CC1CC1",
		"CCC[CH2]", "CC[CH]C", "CCO", "COC", "CC[O]", "C[CH]O", "[CH2]CO", "CC=O", "C=CO",
		"CC(=O)O", "OCC=O", "C[C-]=O", "CC[O-]", "[CH3][CH2]", "C=C", "C#C", "c1ccccc1", "C1=CCC=CC1", "C1CC=CC=C1"}
	seen := map[string]string{}
	for _, s := range distinct {
		k := inv(s)
		if prev, ok := seen[k]; ok {
			t.Errorf("%s and %s share a fingerprint", prev, s)
		}
		seen[k] = s
	}
}
