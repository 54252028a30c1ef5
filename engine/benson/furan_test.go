package benson

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The furan ring correction's S° and Cp were derived from furan's measured
// values (corrections.tsv): furan is estimated within rounding of its Cp(T)
// (testdata/thermo/train.tsv) and S° (testdata/thermo/nsx.tsv) and carries
// no flag. (The pyrrole ring took the same S° and Cp until they were derived
// from pyrrole's rigid-rotor harmonic-oscillator values: rrho_test.go.)
func TestFuranRing(t *testing.T) {
	var furan *refRow
	for _, r := range readRef(t, "../../testdata/thermo/train.tsv") {
		if r.smiles == "c1ccoc1" {
			furan = &r
		}
	}
	require.NotNil(t, furan, "furan is a training row")
	e := estimate(t, "c1ccoc1", Options{})
	assert.Empty(t, e.Missing)
	for k, T := range StdTemps {
		if math.IsNaN(furan.cp[k]) {
			continue
		}
		// 0.02: the correction was rounded to 0.01 cal/(mol K) per column
		assert.InDelta(t, furan.cp[k], e.Cp[k]/calorie, 0.02, "furan Cp(%.0f K)", T)
	}
	s := heteroRef(t, "furan")
	require.Equal(t, "train", s.split)
	assert.InDelta(t, s.s, e.S298/calorie, 0.02, "furan S°")
	for _, smi := range []string{"C1=COC=C1", "o1cccc1"} {
		o := estimate(t, smi, Options{})
		assert.InDelta(t, e.S298, o.S298, 1e-9, smi)
		assert.Empty(t, o.Missing, smi)
	}

	// Held-out pyrrole's S°, now from its RRHO ring correction: it was 1.4
	// cal/(mol K) high with furan's.
	p := heteroRef(t, "pyrrole")
	require.Equal(t, "heldout", p.split)
	pe := estimate(t, p.smiles, Options{})
	d := pe.S298/calorie - p.s
	t.Logf("pyrrole (held out) S°: estimate %.2f, reference %.2f, %+.2f cal/(mol K)", pe.S298/calorie, p.s, d)
	assert.LessOrEqual(t, math.Abs(d), 0.5)
	assert.Empty(t, pe.Missing)
}

// The thiophene ring correction's Cp is derived from thiophene's RRHO Cp
// (rrho_test.go) and carries no flag, nor do the methylthiophenes; the
// estimate's uncertainty is the class's. Its Cp(300 K) was 1.15 cal/(mol K)
// below thiophene's published Cp(298.15 K) with cyclopentene's ring Cp; now
// the gap is the 298 -> 300 K rise only.
func TestThiopheneCp(t *testing.T) {
	for _, smi := range []string{"c1ccsc1", "Cc1cccs1", "Cc1ccsc1"} {
		e := estimate(t, smi, Options{})
		assert.Empty(t, e.Missing, smi)
		assert.InDelta(t, maeToSigma*classError(e.Class)*calorie*1000, e.Uncertainty, 1e-6, smi)
	}
	th := estimate(t, "c1ccsc1", Options{})
	require.Equal(t, 300.0, StdTemps[0])
	d := th.Cp[0] - thiopheneCp298
	t.Logf("thiophene Cp: published %.2f J/(mol K) (298.15 K), estimate %.2f (300 K), %+.2f", thiopheneCp298, th.Cp[0], d)
	assert.InDelta(t, 0.4, d, 0.3, "Cp(300 K) - Cp(298.15 K) of thiophene is a few tenths of a J/(mol K)")
}
