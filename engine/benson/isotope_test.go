package benson

import (
	"errors"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Isotopologues are refused with a reason, never estimated as the natural
// species; the molecule keeps the isotope (formula C2H5D).
func TestIsotopesRefused(t *testing.T) {
	for _, smi := range []string{"CC[2H]", "[13CH3]C", "C[18OH]"} {
		m := parse(t, smi)
		_, err := Estimate(m, Options{})
		require.Error(t, err, smi)
		var ue *UnsupportedError
		require.True(t, errors.As(err, &ue), smi)
		assert.Contains(t, ue.Reason, "isotope-labelled", smi)
	}
	assert.Equal(t, "C2H5D", parse(t, "CC[2H]").Formula())
}
