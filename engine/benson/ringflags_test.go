package benson

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The thiane ring correction's ΔHf° was derived from thiane (train row of
// testdata/thermo/nsx.tsv), which it reproduces with no ΔHf° flag; its S°
// and Cp are tetrahydropyran's and flagged (S/Cp only: the ΔHf° uncertainty
// stays the class's), unless ring:thiane is supplied.
func TestThianeRing(t *testing.T) {
	r := heteroRef(t, "thiane")
	require.Equal(t, "train", r.split)
	count := func(e *Result) int {
		n := 0
		for _, m := range e.Missing {
			if m.Group == thianeEntropyGroup {
				n++
				assert.True(t, entropyOnly(m))
			}
		}
		return n
	}
	for _, smi := range []string{r.smiles, "S1CCCCC1", "C1CSCCC1"} {
		e := estimate(t, smi, Options{})
		assert.InDelta(t, r.hf, e.Hf298/calorie/1000, 0.01, smi)
		assert.Equal(t, 1, count(e), "%s: %v", smi, e.Missing)
		require.Len(t, e.Missing, 1, smi)
		assert.InDelta(t, maeToSigma*classError(e.Class)*calorie*1000, e.Uncertainty, 1e-6, smi)
		names := map[string]bool{}
		for _, c := range e.Corrections {
			names[c.Name] = true
		}
		assert.True(t, names["ring strain: thiane"], "%s: %v", smi, e.Corrections)
	}
	// a substituted thiane takes the same ring
	m := estimate(t, "CC1CCCCS1", Options{})
	assert.Equal(t, 1, count(m))
	// the other sulfur rings are not flagged this way
	assert.Zero(t, count(estimate(t, "C1CCSC1", Options{})))
	u, err := Estimate(parse(t, "C1CCSCC1"), Options{UserGroups: []GroupValue{{Name: "ring:thiane", Hf298: -0.52 * calorie * 1000, S298: 16.3 * calorie, Source: "test"}}})
	require.NoError(t, err)
	assert.Zero(t, count(u))
}

// A benzene ring fused to two others across opposite bonds (anthracene's
// middle ring) is flagged, in any spelling: the Cbf groups cannot tell it
// from naphthalene's fusion and anthracene comes out about 3 kcal/mol low.
// Angular and peri fusion (phenanthrene, chrysene, triphenylene, pyrene)
// are not flagged. The flag widens ΔHf° by at least widenRing.
func TestAceneFlag(t *testing.T) {
	flags := func(smi string) int {
		n := 0
		for _, m := range estimate(t, smi, Options{}).Missing {
			if m.Group == aceneGroup {
				n++
			}
		}
		return n
	}
	for _, smi := range []string{
		"c1ccc2cc3ccccc3cc2c1", "c1cc2cc3ccccc3cc2cc1", "C1=CC=C2C=C3C=CC=CC3=CC2=C1", // anthracene
		"c1ccc2cc3cc4ccccc4cc3cc2c1",   // tetracene
		"c1ccc2c(c1)ccc1cc3ccccc3cc12", // benz[a]anthracene
		"Cc1c2ccccc2cc2ccccc12",        // 9-methylanthracene
	} {
		assert.Equal(t, 1, flags(smi), smi)
	}
	for _, smi := range []string{
		"c1ccc2ccccc2c1", "c1ccc2c(c1)ccc1ccccc12", "c1ccc2c(c1)ccc1c2ccc2ccccc21",
		"c1ccc2c(c1)c1ccccc1c1ccccc21", "c1cc2ccc3cccc4ccc(c1)c2c34", "c1ccc(cc1)-c1ccccc1",
	} {
		assert.Zero(t, flags(smi), smi)
	}
	a := estimate(t, "c1ccc2cc3ccccc3cc2c1", Options{})
	p := estimate(t, "c1ccc2c(c1)ccc1ccccc12", Options{})
	assert.GreaterOrEqual(t, a.Uncertainty, widenRing*calorie*1000, "the acene flag widens ΔHf°")
	assert.Less(t, p.Uncertainty, widenRing*calorie*1000)
}

// An exocyclic C=N on a three- or four-membered ring (an imine or iminyl
// radical) takes the exocyclic C=C ring's strain as the approximation,
// flagged and widened: the plain cycloalkane correction leaves out some 13
// kcal/mol on cyclopropane. On larger rings the exocyclic double bond adds
// no correction, as for C=C.
func TestExocyclicImineRing(t *testing.T) {
	for smi, flagged := range map[string]bool{
		"N=C1CC1": true, "[N]=C1CC1": true, "N=C1CCC1": true, "[N]=C1CCC1": true,
		"C=C1CC1": false, "N=C1CCCCC1": false,
	} {
		e := estimate(t, smi, Options{})
		ring := false
		for _, m := range e.Missing {
			ring = ring || strings.HasPrefix(m.Group, "ring:")
		}
		assert.Equal(t, flagged, ring, "%s: %v", smi, e.Missing)
		if flagged {
			assert.Greater(t, e.Uncertainty/calorie/1000, 5.0, smi)
		}
	}
	e := estimate(t, "N=C1CC1", Options{})
	found := false
	for _, c := range e.Corrections {
		found = found || c.Name == "ring strain: methylenecyclopropane"
	}
	assert.True(t, found, "%v", e.Corrections)
}
