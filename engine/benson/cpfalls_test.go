package benson

import (
	"testing"

	"github.com/stretchr/testify/require"
)

// TestCpFallsFlagged: a group sum whose Cp falls with temperature
// (perhalogenated cyclopropanes: the Cp of their C-(X)2(C)2 groups falls
// above 1000 K) is flagged and its uncertainty widened; ordinary molecules
// are not flagged.
func TestCpFallsFlagged(t *testing.T) {
	has := func(e *Result) bool {
		for _, m := range e.Missing {
			if m.Group == cpFallsGroup {
				return true
			}
		}
		return false
	}
	for _, s := range []string{"FC1(F)C(F)(F)C1(F)F", "ClC1(Cl)C(Cl)(Cl)C1(Cl)Cl"} {
		e := estimate(t, s, Options{})
		require.True(t, has(e), "%s: Cp %v", s, e.Cp)
	}
	for _, s := range []string{"CCCC", "CC(C)(C)C", "c1ccccc1", "C1CC2CCC1C2", "OCC=O"} {
		e := estimate(t, s, Options{})
		require.False(t, has(e), "%s: Cp %v", s, e.Cp)
		for i := 1; i < len(e.Cp); i++ {
			require.GreaterOrEqual(t, e.Cp[i], 0.998*e.Cp[i-1], "%s at %g K", s, StdTemps[i])
		}
	}
}
