package benson

import (
	"math"
	"os"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The furan ring correction's S° and Cp were derived from furan's measured
// values (corrections.tsv): furan is estimated within rounding of its Cp(T)
// (testdata/thermo/train.tsv) and S° (testdata/thermo/nsx.tsv) and carries
// no flag. The pyrrole ring takes the same S° and Cp (flagged): held-out
// pyrrole's S° then comes within 1.5 cal/(mol K) (it was 3.9 low with the
// recalled tabulated furan S).
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

	p := heteroRef(t, "pyrrole")
	require.Equal(t, "heldout", p.split)
	pe := estimate(t, p.smiles, Options{})
	d := pe.S298/calorie - p.s
	t.Logf("pyrrole (held out) S°: estimate %.2f, reference %.2f, %+.2f cal/(mol K)", pe.S298/calorie, p.s, d)
	assert.LessOrEqual(t, math.Abs(d), 1.5)
	flagged := false
	for _, m := range pe.Missing {
		flagged = flagged || m.Group == pyrroleEntropyGroup
	}
	assert.True(t, flagged, "pyrrole's S° and Cp are carried over from furan: flagged")
}

// The thiophene ring correction's Cp was derived from thiophene's ideal-gas
// Cp(T) (testdata/thermo/ringcp.tsv), its ΔHf° and S° from thiophene's
// (nsx.tsv): thiophene is reproduced within rounding, and no thiophene ring
// carries a flag, in any spelling.
func TestThiopheneRing(t *testing.T) {
	cp := readRingCp(t)["thiophene"]
	e := estimate(t, "c1ccsc1", Options{})
	for k, T := range StdTemps {
		// 0.02: the correction was rounded to 0.01 cal/(mol K) per column
		assert.InDelta(t, cp[k], e.Cp[k]/calorie, 0.02, "thiophene Cp(%.0f K)", T)
	}
	r := heteroRef(t, "thiophene")
	assert.InDelta(t, r.hf, e.Hf298/calorie/1000, 0.01)
	assert.InDelta(t, r.s, e.S298/calorie, 0.01)
	for _, smi := range []string{"c1ccsc1", "C1=CSC=C1", "Cc1cccs1", "s1cccc1C", "Cc1ccsc1"} {
		assert.Empty(t, estimate(t, smi, Options{}).Missing, smi)
	}
}

// readRingCp reads testdata/thermo/ringcp.tsv: Cp (cal/(mol K)) at StdTemps
// by name.
func readRingCp(t *testing.T) map[string][7]float64 {
	t.Helper()
	b, err := os.ReadFile("../../testdata/thermo/ringcp.tsv")
	require.NoError(t, err)
	out := map[string][7]float64{}
	for _, line := range strings.Split(string(b), "\n") {
		if line == "" || strings.HasPrefix(line, "#") || strings.HasPrefix(line, "name\t") {
			continue
		}
		c := strings.Split(line, "\t")
		require.Len(t, c, 10, line)
		var cp [7]float64
		for k := range cp {
			cp[k], err = strconv.ParseFloat(c[2+k], 64)
			require.NoError(t, err, line)
		}
		out[c[0]] = cp
	}
	require.NotEmpty(t, out)
	return out
}
