package benson

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"kiln.dev/kiln/engine/reflib"
)

// The fluorinated methyl radicals are pyramidal (molecule.PyramidalRadical):
// estimated from their parents without the reference library, their S°
// must agree with the library's published values (NASA/TP-2002-211556) to
// within 0.5 cal/(mol K). With the planar σ (6 and 2) both came out R ln 2
// (1.38) low: CF3 62.00 against 63.22, CHF2 60.27 against 61.66.
func TestPyramidalRadicalEntropy(t *testing.T) {
	lib := reflib.New()
	for _, c := range []struct {
		smiles string
		sigma  int
	}{
		{"F[C](F)F", 3}, {"F[CH]F", 1},
	} {
		m := parse(t, c.smiles)
		ref, ok := lib.Lookup(m, 0)
		require.True(t, ok, c.smiles)
		e := estimate(t, c.smiles, Options{})
		assert.Equal(t, c.sigma, e.SymmetryNumber, c.smiles)
		d := (e.S298 - ref.S298) / calorie
		t.Logf("%-10s S° %.2f, library %.2f (%s): %+.2f cal/(mol K)", c.smiles, e.S298/calorie, ref.S298/calorie, ref.Name, d)
		assert.LessOrEqual(t, math.Abs(d), 0.5, c.smiles)
	}
	// No inversion or freed-rotor change at a pyramidal centre, even one
	// whose increment is that of an alkyl-like site (α-hydroxy here).
	for _, s := range []string{"F[C](F)F", "C[C](F)F", "O[C](F)F", "FC(F)(F)[C](F)F"} {
		e, err := Estimate(parse(t, s), Options{})
		require.NoError(t, err, s)
		assert.Zero(t, correctionCount(e, "radical site: inversion and internal-rotor changes"), s)
	}
	// A CF2• centre conjugated with a double bond or a benzene ring is
	// planar with it (allyl- and benzyl-like): not pyramidal, and it takes
	// the site change of its allylic or benzylic parent site.
	for _, s := range []string{"C=C[C](F)F", "F[C](F)c1ccccc1"} {
		m := parse(t, s)
		for i := range m.Atoms {
			assert.False(t, m.PyramidalRadical(i), "%s atom %d", s, i)
		}
		e, err := Estimate(m, Options{})
		require.NoError(t, err, s)
		assert.Equal(t, 1, correctionCount(e, "radical site: inversion and internal-rotor changes"), s)
	}
}
