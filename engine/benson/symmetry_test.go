package benson

import (
	"math"
	"math/big"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// A σ beyond int64 is carried exactly: only R ln σ enters S°, so the
// estimate is given, with the exact σ in SymmetryExact.
func TestHugeSymmetryNumber(t *testing.T) {
	smi := "C(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C"
	m := parse(t, smi)
	want, err := m.SymmetryNumber()
	require.NoError(t, err)
	require.False(t, want.IsInt64(), "the test needs σ beyond int64, got %s", want)
	e := estimate(t, smi, Options{})
	assert.Equal(t, want.String(), e.SymmetryExact)
	assert.Equal(t, 0, e.SymmetryNumber, "σ beyond int is not squeezed into the int field")
	wantLn, _ := new(big.Float).SetInt(want).Float64()
	var term *Term
	for i, c := range e.Corrections {
		if strings.HasPrefix(c.Name, "symmetry") {
			term = &e.Corrections[i]
		}
	}
	require.NotNil(t, term)
	assert.InDelta(t, -R*math.Log(wantLn), term.S298, 1e-9)
	assert.Equal(t, "symmetry -R ln "+want.String(), term.Name)
	// small σ: both fields agree
	e = estimate(t, "CC(C)(C)C", Options{})
	assert.Equal(t, 972, e.SymmetryNumber)
	assert.Equal(t, "972", e.SymmetryExact)
	assert.InDelta(t, math.Log(1e30), lnBig(new(big.Int).Exp(big.NewInt(10), big.NewInt(30), nil)), 1e-12)
}
