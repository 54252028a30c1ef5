package molecule

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestChiralityClasses checks that every OpenSMILES chirality class is read
// (kept verbatim, hydrogens after it still counted) and that invalid marks
// are errors at the mark, not swallowed into the next token.
func TestChiralityClasses(t *testing.T) {
	for _, c := range []struct {
		smiles, chir string
		h            int
	}{
		{"F[C@TH1H](Cl)Br", "@TH1", 1},
		{"F[C@TH2H](Cl)Br", "@TH2", 1},
		{"F[C@H](Cl)Br", "@", 1},
		{"F[C@@H](Cl)Br", "@@", 1},
		{"C[C@AL1]=C=CC", "@AL1", 0},
		{"F[Pt@SP1](F)(Cl)Cl", "@SP1", 0},
		{"F[Pt@SP3](F)(Cl)Cl", "@SP3", 0},
		{"S[As@TB1](F)(Cl)(Br)N", "@TB1", 0},
		{"S[As@TB20](F)(Cl)(Br)N", "@TB20", 0},
		{"C[Co@OH1](C)(C)(C)(C)C", "@OH1", 0},
		{"C[Co@OH30](C)(C)(C)(C)C", "@OH30", 0},
	} {
		m, err := ParseSMILES(c.smiles)
		require.NoError(t, err, c.smiles)
		assert.Equal(t, c.chir, m.Atoms[1].Chirality, c.smiles)
		assert.Equal(t, c.h, m.Atoms[1].HCount, c.smiles)
	}
}

func TestReaderRejects(t *testing.T) {
	cases := []struct {
		smiles string
		pos    int
		msg    string
	}{
		{"F[C@F](Cl)Br", 4, "invalid chirality \"@F\""},
		{"F[C@N]Cl", 4, "invalid chirality \"@N\""},
		{"C[C@TH3H](F)Cl", 6, "out of range"},
		{"C[C@OH31](F)Cl", 6, "out of range"},
		{"C[C@TB](F)Cl", 4, "needs a number"},
		{"CoC", 1, "aromatic atom \"o\" not in a ring"},
		{"c", 0, "not in a ring"},
		{"Cc1ccccc1c", 9, "not in a ring"},
		{"C[nH]C", 1, "not in a ring"},
		{"C(C.)C", 3, "'.' must be followed by an atom"},
		{"C(.)C", 2, "'.' must be followed by an atom"},
		{"C..C", 1, "'.' must be followed by an atom"},
		{".C", 0, "'.' with no atom before it"},
		{"C.", 1, "SMILES ends with '.'"},
		{"C:C", 1, "aromatic bond ':' not in a ring"},
		{"c1ccccc1:C", 8, "aromatic bond ':' not in a ring"},
		{"CClC", 1, "chlorine with valence 2"},
		{"CBr(C)C", 1, "bromine with valence 3"},
		{"FF(F)F", 1, "fluorine with valence 3"},
		{"CI=C", 1, "iodine with valence 3"},
	}
	for _, c := range cases {
		requireSMILESError(t, c.smiles, c.pos, c.msg)
	}
	// still accepted: halogens in brackets may take higher valences, and a
	// dot after a closed branch separates components; per the OpenSMILES
	// grammar (chain ::= chain dot branched_atom; branch ::= '(' dot chain
	// ')') a dot may also stand inside a branch or open it.
	for _, s := range []string{"F[Cl](F)F", "C(C)C.C", "ClCl", "c1ccccc1.[Na+]", "C[I+]C", "C(C.C)C", "CC(.C)C", "C(.C)", "c1ccccc1-c1ccccc1", "c1:c:c:c:c:c:1"} {
		_, err := ParseSMILES(s)
		assert.NoError(t, err, s)
	}
}

// Dots inside branches follow the grammar: the branch root keeps its
// place, the atom after the dot starts a new component.
func TestDotInBranch(t *testing.T) {
	a, err := ParseSMILES("C(C.C)C")
	require.NoError(t, err)
	b, err := ParseSMILES("CCC.C")
	require.NoError(t, err)
	assert.Equal(t, b.Canonical(), a.Canonical())
	c, err := ParseSMILES("CC(.C)C")
	require.NoError(t, err)
	assert.Equal(t, b.Canonical(), c.Canonical())
}
