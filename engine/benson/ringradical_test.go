package benson

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
)

// A radical site in a 3- or 4-membered ring, or one delocalised around a
// ring, takes the ring parent's published C–H bond enthalpy where one is at
// hand (cyclopropyl: cyclopropane 12.7 + 106.3 − 52.10 = 66.9 kcal/mol;
// cyclopentadienyl: 32.1 + 81.5 − 52.10 = 61.5, Luo 2007, from memory), and
// is flagged with a wider uncertainty otherwise.
func TestRingRadicalSites(t *testing.T) {
	kcal := func(e *Result) float64 { return e.Hf298 / calorie / 1000 }
	ringFlags := func(e *Result) int {
		n := 0
		for _, m := range e.Missing {
			if strings.HasPrefix(m.Group, "ring radical") {
				n++
			}
		}
		return n
	}
	cp := estimate(t, "C1[CH]C1", Options{})
	assert.InDelta(t, 66.9, kcal(cp), 1.0, "cyclopropyl")
	assert.Equal(t, 0, ringFlags(cp), "the measured site itself is not an approximation")
	c5 := estimate(t, "C1=CC=C[CH]1", Options{})
	assert.InDelta(t, 61.5, kcal(c5), 1.0, "cyclopentadienyl")
	assert.Equal(t, 0, ringFlags(c5))
	open := estimate(t, "[CH]1CCCCC1", Options{})
	assert.Equal(t, 0, ringFlags(open), "a six-ring site is an open-chain site")
	for _, s := range []string{"C=C1[CH]C1", "C[C]1CC1", "[CH]1C=C1", "C1=CC=CC=C[CH]1", "C1[CH]O1", "C1=C[CH]C1", "CC1=CC=C[CH]1"} {
		e := estimate(t, s, Options{})
		assert.Equal(t, 1, ringFlags(e), "%s: %+v", s, e.Missing)
		assert.Greater(t, e.Uncertainty/calorie/1000, 3.0, s)
	}
}
