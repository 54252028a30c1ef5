package benson

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestCarbonylEtherRingFlagged: a ring with an ether O and a ring carbonyl
// (lactone, cyclic anhydride, cyclic carbonate) takes its ether ring's
// correction flagged, naming the ring carbonyls, and widened; the ether ring
// itself is not flagged.
func TestCarbonylEtherRingFlagged(t *testing.T) {
	for smi, want := range map[string]string{
		"O=C1CCCO1":     "ring:tetrahydrofuran ring with 1 ring carbonyl",
		"O=C1CCC(=O)O1": "ring:tetrahydrofuran ring with 2 ring carbonyls",
		"O=C1CCCCO1":    "ring:tetrahydropyran ring with 1 ring carbonyl",
		"O=C1OCCO1":     "ring:1,3-dioxolane ring with 1 ring carbonyl",
	} {
		e := estimate(t, smi, Options{})
		found := false
		for _, m := range e.Missing {
			found = found || m.Group == want
		}
		assert.True(t, found, "%s: %v", smi, e.Missing)
		assert.GreaterOrEqual(t, e.Uncertainty/calorie/1000, widenRing, smi)
	}
	e := estimate(t, "C1CCOC1", Options{})
	for _, m := range e.Missing {
		assert.False(t, strings.HasPrefix(m.Group, "ring"), "tetrahydrofuran: %v", m)
	}
}

// TestQuinoneWidened: a carbocycle with two ring carbonyls and two ring C=C
// bonds (p-benzoquinone, 15.6 kcal/mol low) is widened by widenQuinone; a
// cyclohexenone and a saturated cycloalkanone are not.
func TestQuinoneWidened(t *testing.T) {
	q := estimate(t, "O=C1C=CC(=O)C=C1", Options{})
	assert.GreaterOrEqual(t, q.Uncertainty/calorie/1000, widenQuinone)
	c := estimate(t, "O=C1CCCC1", Options{})
	assert.Less(t, c.Uncertainty/calorie/1000, widenRing)
	assert.True(t, quinoneRing("ring:C6 ring with 2 ring carbonyls, 2 double bonds"))
	assert.False(t, quinoneRing("ring:C4 ring with 1 ring carbonyls, 0 double bonds"))
	assert.False(t, quinoneRing("ring:C6 ring with 1 ring carbonyls, 1 double bonds"), "cyclohexenone")
	e := estimate(t, "O=C1C=CCCC1", Options{})
	assert.Less(t, e.Uncertainty/calorie/1000, widenQuinone, "cyclohexenone")
}
