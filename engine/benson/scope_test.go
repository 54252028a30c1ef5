package benson

import (
	"errors"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// A species is one molecule: disconnected structures are refused, with the
// reason, whatever the parts are.
func TestDisconnectedRefused(t *testing.T) {
	for _, s := range []string{"CC.CC", "[CH2]C.[CH2]C", "OO.OO", "C.C", "C12C3C4C1C5C2C3C45.C12C3C4C1C5C2C3C45", "c1ccccc1.O"} {
		_, err := Estimate(parse(t, s), Options{})
		var u *UnsupportedError
		require.True(t, errors.As(err, &u), "%s: %v", s, err)
		assert.Contains(t, u.Reason, "disconnected", s)
	}
	estimate(t, "CCCC", Options{}) // one part: estimated
}

// Spin states without hydrogen-bond-increment data are refused: two
// unpaired electrons on one atom, or on bonded atoms, in any multiplicity.
func TestSpinStatesWithoutDataRefused(t *testing.T) {
	for _, c := range []struct {
		smiles string
		mult   int
	}{
		{"C=[C]", 0}, {"C=[C]", 1}, {"C=[C]", 3}, {"[C]#[C]", 0}, {"[C]#[C]", 1},
		{"C[CH]", 0}, {"CC[C]C", 0}, {"[CH]=[CH]", 0}, {"C[N]", 0}, {"O=C=[C]", 0},
		{"[CH2][CH2]", 0},
	} {
		_, err := Estimate(parse(t, c.smiles), Options{Multiplicity: c.mult})
		var u *UnsupportedError
		require.True(t, errors.As(err, &u), "%s ×%d: %v", c.smiles, c.mult, err)
	}
	// separated radical centres and ordinary radicals are still estimated
	for _, s := range []string{"[CH2]CC[CH2]", "C[CH2]", "[CH2]C=C", "[O]O"} {
		estimate(t, s, Options{})
	}
}
