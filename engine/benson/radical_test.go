package benson

import (
	"bufio"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
)

// radicalRef is one row of testdata/thermo/radicals.tsv.
type radicalRef struct {
	name, smiles string
	s, cp300     float64 // NaN when not entered
}

func readRadicals(t *testing.T) []radicalRef {
	t.Helper()
	f, err := os.Open("../../testdata/thermo/radicals.tsv")
	require.NoError(t, err, "the radical reference file is part of the accuracy test")
	defer f.Close()
	var out []radicalRef
	sc := bufio.NewScanner(f)
	header := true
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || strings.TrimSpace(line) == "" {
			continue
		}
		if header {
			header = false
			continue
		}
		c := strings.Split(line, "\t")
		require.Len(t, c, 5, line)
		num := func(s string) float64 {
			if s == "" {
				return math.NaN()
			}
			v, err := strconv.ParseFloat(s, 64)
			require.NoError(t, err, line)
			return v
		}
		out = append(out, radicalRef{name: c[0], smiles: c[1], s: num(c[2]), cp300: num(c[3])})
	}
	require.NoError(t, sc.Err())
	return out
}

// Radical S° and Cp against published values: the statistical-mechanics
// treatment of radical sites (radical.go). Aim (issue 12): S° MAE ≤ 1.0
// cal/(mol K), none off by more than 2.5.
func TestRadicalEntropy(t *testing.T) {
	rows := readRadicals(t)
	require.GreaterOrEqual(t, len(rows), 15)
	ncp := 0
	for _, r := range rows {
		if !math.IsNaN(r.cp300) {
			ncp++
		}
	}
	require.GreaterOrEqual(t, ncp, 15, "radical Cp is validated against at least 15 published values (issue 12)")
	var s, cp errStat
	for _, r := range rows {
		e := estimate(t, r.smiles, Options{})
		ds := e.S298/calorie - r.s
		dcp := e.Cp[0]/calorie - r.cp300
		s.add(ds, r.name)
		cp.add(dcp, r.name)
		t.Logf("%-14s S %6.2f ref %6.2f  dS %+5.2f   Cp300 %6.2f dCp %+5.2f  σ=%d", r.name, e.S298/calorie, r.s, ds, e.Cp[0]/calorie, dcp, e.SymmetryNumber)
	}
	t.Logf("radicals: S° MAE %.2f max %.2f (%s), n=%d; Cp300 MAE %.2f max %.2f (%s), n=%d",
		s.mae(), s.max, s.worst, s.n, cp.mae(), cp.max, cp.worst, cp.n)
	if s.mae() > radicalSAim {
		t.Errorf("radical S° MAE %.2f cal/(mol K) > %.2f", s.mae(), radicalSAim)
	}
	if s.max > 2.5 {
		t.Errorf("radical S° off by %.2f cal/(mol K) for %s (> 2.5)", s.max, s.worst)
	}
	if cp.mae() > radicalCpAim {
		t.Errorf("radical Cp300 MAE %.2f cal/(mol K) > %.2f", cp.mae(), radicalCpAim)
	}
}

// radicalSAim and radicalCpAim are the S° and Cp(300 K) MAEs the radical
// treatment must keep (cal/(mol K)): measured 0.51 and 0.63 (run of
// 2026-12-03, 15 radicals each, after the umbrella mode was made to replace
// a C–H bend instead of adding a mode; 0.52 and 0.69 before) plus a margin
// of 0.2. The aim for S° is 1.0, so the tighter bound applies; it
// sets no Cp aim.
const (
	radicalSAim  = 0.71
	radicalCpAim = 0.83
)

// A radical centre with several stabilising neighbours takes the most
// stabilising one's increment, whatever the spelling, and says so
// (radical.go, rules 1 and 2).
func TestRadicalSitePriority(t *testing.T) {
	for _, c := range []struct {
		spellings []string
		site      string
		several   string // "" when no flag is expected
	}{
		// Radicals with resonance structures are estimated as their most
		// stable one (resonance.go), whose site here has one stabiliser: the
		// enol, enol-ether and dienyl forms carry the other neighbour as
		// structure, so no several-stabilisers flag (pentadienyl-type
		// delocalisation is flagged separately, TestDelocalisedFlag).
		{[]string{"CC([C](C)O)=C", "C[C](O)C(C)=C", "O[C](C)C(=C)C", "C=C(C)[C](O)C"}, "allylic", ""},
		{[]string{"C=C[CH]OC", "CO[CH]C=C"}, "allylic", ""},
		{[]string{"C=C[CH]C=C", "C(=C)[CH]C=C"}, "allylic", ""},
		{[]string{"c1ccccc1[CH]O", "O[CH]c1ccccc1"}, "benzylic", "benzylic, alpha-hydroxy"},
		{[]string{"C#C[CH]C=C", "C=C[CH]C#C"}, "allylic", ""},
		{[]string{"CC[CH]O", "O[CH]CC"}, "alpha-hydroxy", ""},
		{[]string{"C=CC[CH2]", "[CH2]CC=C"}, "primary", ""},
	} {
		var ref *Result
		for _, s := range c.spellings {
			e := estimate(t, s, Options{})
			require.Equal(t, 1, correctionCount(e, "HBI: "+c.site), "%s: %v", s, e.Corrections)
			flag := ""
			for _, m := range e.Missing {
				if after, ok := strings.CutPrefix(m.Group, "HBI: radical site with several stabilising neighbours ("); ok {
					flag = strings.TrimSuffix(after, ")")
				}
			}
			require.Equal(t, c.several, flag, "%s: %+v", s, e.Missing)
			if ref == nil {
				ref = e
				continue
			}
			require.Equal(t, ref.Hf298, e.Hf298, s)
			require.Equal(t, ref.S298, e.S298, s)
			require.Equal(t, ref.Cp, e.Cp, s)
			require.Equal(t, ref.Uncertainty, e.Uncertainty, s)
		}
	}
}

// The priority order of stabilising neighbours follows the bond
// dissociation enthalpies of the loaded HBI tables: most stabilising
// (weakest C–H bond) first.
func TestStabiliserOrder(t *testing.T) {
	l := lookupTable(nil)
	prev := 0.0
	for _, s := range stabilisers {
		h, ok := l.hbi[s.site]
		require.True(t, ok, s.site)
		require.GreaterOrEqual(t, h.bde, prev, "%s (%s) is ranked after a less stabilising neighbour", s.kind, s.site)
		prev = h.bde
	}
}

// TestDelocalisedFlag: a radical shared by three or more open-chain sites
// (pentadienyl type) is flagged, whatever resonance structure is written;
// allyl, propargyl and benzyl, whose increments are measured on the
// delocalised radicals themselves, are not.
func TestDelocalisedFlag(t *testing.T) {
	flagged := func(smiles string) bool {
		for _, m := range estimate(t, smiles, Options{}).Missing {
			if m.Group == delocalisedGroup {
				return true
			}
		}
		return false
	}
	for _, s := range []string{"C=C[CH]C=C", "[CH2]C=CC=C", "C=CC=C[O]", "C#C[CH]C=C"} {
		require.True(t, flagged(s), s)
	}
	for _, s := range []string{"C=C[CH2]", "[CH2]C=C", "[CH2]C#C", "C=C=[CH]", "[CH2]c1ccccc1", "C[CH]C"} {
		require.False(t, flagged(s), s)
	}
}
