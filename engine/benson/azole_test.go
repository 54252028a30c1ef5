package benson

import (
	"errors"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// heteroRef returns the row of testdata/thermo/nsx.tsv with the given name.
func heteroRef(t *testing.T, name string) heteroRow {
	t.Helper()
	for _, r := range readHeteroRef(t) {
		if r.name == name {
			return r
		}
	}
	require.Failf(t, "no row", "%s is not in nsx.tsv", name)
	return heteroRow{}
}

// TestAzoleGroupFit: Naz-(Cd) and Naz-(N) are the least-squares fit to the
// four azole train rows (groups_azole.tsv header), so the residuals are
// orthogonal to each group's counts: Σ count × (estimate − reference) = 0
// per group, to the table's rounding. Each row stays within 1.5 kcal/mol
// (largest residual of the fit 1.19, imidazole), and none carries a ΔHf° flag.
func TestAzoleGroupFit(t *testing.T) {
	normal := map[string]float64{"Naz-(Cd)": 0, "Naz-(N)": 0}
	for _, name := range []string{"imidazole", "pyrazole", "oxazole", "1H-1,2,4-triazole"} {
		r := heteroRef(t, name)
		require.Equal(t, "train", r.split, name)
		e := estimate(t, r.smiles, Options{})
		d := e.Hf298/calorie/1000 - r.hf
		t.Logf("%-18s estimate %6.2f, reference %6.2f, %+.2f kcal/mol", name, e.Hf298/calorie/1000, r.hf, d)
		assert.LessOrEqual(t, math.Abs(d), 1.5, name)
		for _, m := range e.Missing {
			assert.True(t, entropyOnly(m), "%s: a ΔHf° flag %q", name, m.Group)
		}
		hasNaz := false
		for _, g := range e.Groups {
			if _, ok := normal[g.Name]; ok {
				normal[g.Name] += float64(g.Count) * d
				hasNaz = true
			}
		}
		assert.True(t, hasNaz, "%s: %v", name, e.Groups)
	}
	for g, v := range normal {
		assert.InDelta(t, 0, v, 0.05, "%s: Σ count × residual (kcal/mol) — not the least-squares value", g)
	}
}

// An azole is typed from the graph: every spelling of one molecule
// (aromatic or Kekulé, either position of the [nH] of a symmetric tautomer,
// any atom order) gives the same groups and values; the two tautomers of a
// methylimidazole are two molecules and differ.
func TestAzoleSpellings(t *testing.T) {
	for _, set := range [][]string{
		{"c1cnc[nH]1", "[nH]1ccnc1", "c1c[nH]cn1", "C1=CN=CN1", "N1C=CN=C1", "n1c[nH]cc1"},
		{"c1cc[nH]n1", "[nH]1nccc1", "n1[nH]ccc1", "C1=CC=NN1", "N1N=CC=C1", "c1cn[nH]c1"},
		{"Cn1ccnc1", "CN1C=CN=C1", "c1cn(C)cn1", "n1ccn(C)c1"},
		{"c1cocn1", "C1=COC=N1", "o1ccnc1"},
		{"c1cscn1", "C1=CSC=N1", "s1ccnc1"},
		{"c1nc[nH]n1", "N1C=NC=N1", "[nH]1cncn1"},
	} {
		want := estimate(t, set[0], Options{})
		for _, smi := range set[1:] {
			e := estimate(t, smi, Options{})
			assert.InDelta(t, want.Hf298, e.Hf298, 1e-6, "%s vs %s", smi, set[0])
			assert.InDelta(t, want.S298, e.S298, 1e-6, "%s vs %s", smi, set[0])
			assert.Equal(t, groupNames(want), groupNames(e), "%s vs %s", smi, set[0])
		}
	}
	four := estimate(t, "Cc1c[nH]cn1", Options{}) // 4-methylimidazole: CH3 next to =N–
	five := estimate(t, "Cc1cnc[nH]1", Options{}) // 5-methylimidazole: CH3 next to N–H
	assert.Contains(t, groupNames(four), "Cd-(Naz)(C)")
	assert.Contains(t, groupNames(five), "Cd-(N)(C)")
	assert.NotEqual(t, four.Hf298, five.Hf298)
}

// Azoles outside what the groups were derived for are refused, naming what
// is missing: an N=N ring bond (1,2,3-triazoles, tetrazole) as unsupported,
// isoxazole, 1,3,4-oxadiazole and benzimidazole as missing groups that a
// `group` statement can supply.
func TestAzoleRefusals(t *testing.T) {
	for _, smi := range []string{"c1c[nH]nn1", "C1=CNN=N1", "c1nn[nH]n1", "c1nn[nH]c1"} {
		_, err := Estimate(parse(t, smi), Options{})
		var u *UnsupportedError
		require.True(t, errors.As(err, &u), "%s: %v", smi, err)
		assert.Contains(t, u.Reason, "1,2,3-triazole", smi)
	}
	for smi, group := range map[string]string{
		"c1cnoc1":          "Naz-(O)",
		"c1nnco1":          "Naz-(Naz)",
		"c1ccc2[nH]cnc2c1": "Cb-(Naz)",
	} {
		_, err := Estimate(parse(t, smi), Options{})
		var mg *MissingGroupError
		require.True(t, errors.As(err, &mg), "%s: %v", smi, err)
		assert.Equal(t, group, mg.Group, smi)
	}
}

// The azole ring takes its parent ring's correction, whose S° and Cp are
// derived (pyrrole, thiophene: rrho_test.go; furan: furan_test.go) and carry
// no flag; an S-donor azole (thiazole) carries a ΔHf° flag, which widens its
// uncertainty, unless a Naz group is supplied by the user.
func TestAzoleFlags(t *testing.T) {
	for smi, want := range map[string][]string{
		"c1cnc[nH]1": nil,
		"c1cocn1":    nil,
		"c1cscn1":    {thiazoleGroup},
	} {
		e := estimate(t, smi, Options{})
		var got []string
		for _, m := range e.Missing {
			got = append(got, m.Group)
		}
		assert.ElementsMatch(t, want, got, smi)
	}
	plain := estimate(t, "c1cocn1", Options{})
	thz := estimate(t, "c1cscn1", Options{})
	assert.Greater(t, thz.Uncertainty, plain.Uncertainty, "the thiazole flag widens ΔHf°")
	u, err := Estimate(parse(t, "c1cscn1"), Options{UserGroups: []GroupValue{{Name: "Naz-(Cd)", Hf298: 11.59 * calorie * 1000, S298: 6.18 * calorie, Source: "test"}}})
	require.NoError(t, err)
	for _, m := range u.Missing {
		assert.NotEqual(t, thiazoleGroup, m.Group)
	}
}
