package benson

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

const siteChangesName = "radical site: inversion and internal-rotor changes"

func siteChangesTerm(e *Result) (Term, bool) {
	for _, c := range e.Corrections {
		if c.Name == siteChangesName {
			return c, true
		}
	}
	return Term{}, false
}

// A radical site whose bonds to the π system all lie in its ring (a planar
// ring-conjugated radical) loses no internal rotor and gains no torsion:
// no site-change term (radical.go, siteChange). It was −4.24 cal/(mol K)
// for cyclopentadienyl and pyrrolyl (tester7 finding 7). A site conjugated
// through an open-chain bond keeps the lost rotor.
func TestRingConjugatedSiteKeepsNoRotor(t *testing.T) {
	for _, s := range []string{"C1=CC=C[CH]1", "[N]1C=CC=C1", "C1=C[CH]CC1", "C1=C[CH]CCC1"} {
		e := estimate(t, s, Options{})
		_, ok := siteChangesTerm(e)
		assert.False(t, ok, "%s: %v", s, e.Corrections)
	}
	for _, s := range []string{"[CH2]C1=CCCCC1", "[CH2]C=C", "[CH2]c1ccccc1", "C1CC1[CH]C=C"} {
		e := estimate(t, s, Options{})
		c, ok := siteChangesTerm(e)
		require.True(t, ok, s)
		assert.Less(t, c.S298/calorie, -3.0, "%s: the rotor to the π system is lost", s)
	}
	// Statistical mechanics of cyclopentadienyl against its parent:
	// S(C5H5) − S(C5H6) = R ln(σ 2/10) + R ln 2 + the lost C–H modes
	// (≈ −1.9 cal/(mol K)); with the spurious rotor term it was −6.1.
	rad := estimate(t, "C1=CC=C[CH]1", Options{})
	parent := estimate(t, "C1=CC=CC1", Options{})
	require.Equal(t, 10, rad.SymmetryNumber)
	want := R*math.Log(2.0/10.0) + R*math.Ln2
	for _, nu := range lostCH {
		want -= harmonicS(nu, t298)
	}
	assert.InDelta(t, want/calorie, (rad.S298-parent.S298)/calorie, 0.05)
}

// A bond inside a ring is no internal rotor: a saturated ring site keeps
// its soft umbrella mode (it replaces a C–H bend) but frees no rotor
// (cyclohexyl, cyclopentyl: +2.0 cal/(mol K) before); an open-chain site
// frees one per C–C bond (isopropyl: two).
func TestRingSiteFreesNoRingRotor(t *testing.T) {
	umbrella := (harmonicS(inversionWavenumber, t298) - harmonicS(lostCH[2], t298)) / calorie
	for _, c := range []struct {
		smiles string
		freed  int
	}{
		{"[CH]1CCCCC1", 0}, {"[CH]1CCCC1", 0}, {"C[C]1CCCCC1", 1}, {"C[CH]C", 2}, {"C[C](C)C", 3},
	} {
		e := estimate(t, c.smiles, Options{})
		term, ok := siteChangesTerm(e)
		require.True(t, ok, c.smiles)
		assert.InDelta(t, umbrella+float64(c.freed)*freedRotorS, term.S298/calorie, 1e-9, c.smiles)
	}
}
