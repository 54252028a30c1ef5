package benson

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The uncertainty of a polycyclic system without a tabulated value is
// widened by the spread of the system strain beyond the sum of rings across
// the systems that have one; widenSystem must be that spread.
func TestSystemWidening(t *testing.T) {
	l := lookupTable(nil)
	require.NotEmpty(t, l.systems)
	sum, n := 0.0, 0
	for _, sys := range l.systems {
		e := estimate(t, sys.parent.m.SMILES, Options{})
		excess, found := 0.0, false
		for _, c := range e.Corrections {
			if strings.HasPrefix(c.Name, "ring system strain: ") {
				excess += c.Hf298 / calorie / 1000
				found = true
			}
		}
		require.True(t, found, "%s matches its own row", sys.name)
		t.Logf("%-34s strain beyond the sum of rings %6.2f kcal/mol", sys.name, excess)
		sum += excess * excess
		n++
	}
	rms := math.Sqrt(sum / float64(n))
	t.Logf("RMS over %d systems: %.2f kcal/mol", n, rms)
	assert.InDelta(t, rms, widenSystem, 0.05, "widenSystem drifted from the systems table")

	// a bridged system without a value is flagged, and its ± covers the spread
	for _, s := range []string{"C1CC2CCC(C1)C2", "C1=CC2CCC(C1)C2", "C1CC2CC1C2"} {
		e := estimate(t, s, Options{})
		flagged := false
		for _, m := range e.Missing {
			if strings.HasPrefix(m.Group, "ring system:") {
				flagged = true
			}
		}
		require.True(t, flagged, "%s: %+v", s, e.Missing)
		assert.GreaterOrEqual(t, e.Uncertainty/calorie/1000, widenSystem, s)
	}
	// norbornadiene has its published value now and is not flagged as a system
	nbd := estimate(t, "C1=CC2C=CC1C2", Options{})
	assert.InDelta(t, 59.2, nbd.Hf298/calorie/1000, 0.1)
}
