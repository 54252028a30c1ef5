package benson

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"kiln.dev/kiln/engine/molecule"
)

func parse(t testing.TB, smiles string) *molecule.Molecule {
	t.Helper()
	m, err := molecule.ParseSMILES(smiles)
	require.NoError(t, err, smiles)
	return m
}

func estimate(t testing.TB, smiles string, opts Options) *Result {
	t.Helper()
	e, err := Estimate(parse(t, smiles), opts)
	require.NoError(t, err, smiles)
	return e
}

func groupCounts(e *Result) map[string]int {
	out := map[string]int{}
	for _, g := range e.Groups {
		out[g.Name] += g.Count
	}
	return out
}

func correctionCount(e *Result, name string) int {
	for _, c := range e.Corrections {
		if c.Name == name {
			return c.Count
		}
	}
	return 0
}

// Group assignment: exact group lists, checked by hand against Benson's
// notation (the =C partner of Cd, the =O of CO and the ring neighbours of Cb
// are implied by the centre type).
func TestGroupAssignment(t *testing.T) {
	cases := []struct {
		smiles string
		want   map[string]int
	}{
		{"CC", map[string]int{"C-(C)(H)3": 2}},
		{"CCC", map[string]int{"C-(C)(H)3": 2, "C-(C)2(H)2": 1}},
		{"CC(C)C", map[string]int{"C-(C)(H)3": 3, "C-(C)3(H)": 1}},
		{"CC(C)(C)C", map[string]int{"C-(C)(H)3": 4, "C-(C)4": 1}},
		{"CCCCCCCCCC", map[string]int{"C-(C)(H)3": 2, "C-(C)2(H)2": 8}},
		{"C=C", map[string]int{"Cd-(H)2": 2}},
		{"CC=C", map[string]int{"C-(Cd)(H)3": 1, "Cd-(C)(H)": 1, "Cd-(H)2": 1}},
		{"CC(C)=C", map[string]int{"C-(Cd)(H)3": 2, "Cd-(C)2": 1, "Cd-(H)2": 1}},
		{"CCC=C", map[string]int{"C-(C)(H)3": 1, "C-(Cd)(C)(H)2": 1, "Cd-(C)(H)": 1, "Cd-(H)2": 1}},
		{"C=CC=C", map[string]int{"Cd-(H)2": 2, "Cd-(Cd)(H)": 2}},
		{"C=C=C", map[string]int{"Cd-(H)2": 2, "Ca": 1}},
		{"C#C", map[string]int{"Ct-(H)": 2}},
		{"CC#C", map[string]int{"C-(Ct)(H)3": 1, "Ct-(C)": 1, "Ct-(H)": 1}},
		{"CCC#C", map[string]int{"C-(C)(H)3": 1, "C-(Ct)(C)(H)2": 1, "Ct-(C)": 1, "Ct-(H)": 1}},
		{"C=CC#C", map[string]int{"Cd-(H)2": 1, "Cd-(Ct)(H)": 1, "Ct-(Cd)": 1, "Ct-(H)": 1}},
		{"c1ccccc1", map[string]int{"Cb-(H)": 6}},
		{"Cc1ccccc1", map[string]int{"C-(Cb)(H)3": 1, "Cb-(C)": 1, "Cb-(H)": 5}},
		{"CCc1ccccc1", map[string]int{"C-(C)(H)3": 1, "C-(Cb)(C)(H)2": 1, "Cb-(C)": 1, "Cb-(H)": 5}},
		{"c1ccc2ccccc2c1", map[string]int{"Cb-(H)": 8, "Cbf-(Cbf)(Cb)2": 2}},
		{"c1cc2cccc3ccc4cccc1c4c32", map[string]int{"Cb-(H)": 10, "Cbf-(Cbf)(Cb)2": 4, "Cbf-(Cbf)3": 2}},   // pyrene
		{"c1ccc2c(c1)ccc1ccccc12", map[string]int{"Cb-(H)": 10, "Cbf-(Cbf)(Cb)2": 2, "Cbf-(Cbf)2(Cb)": 2}}, // phenanthrene
		{"C=Cc1ccccc1", map[string]int{"Cd-(H)2": 1, "Cd-(Cb)(H)": 1, "Cb-(Cd)": 1, "Cb-(H)": 5}},
		{"C#Cc1ccccc1", map[string]int{"Ct-(H)": 1, "Ct-(Cb)": 1, "Cb-(Ct)": 1, "Cb-(H)": 5}},
		{"c1ccc(cc1)-c1ccccc1", map[string]int{"Cb-(H)": 10, "Cb-(Cb)": 2}},
		{"CO", map[string]int{"C-(O)(H)3": 1, "O-(C)(H)": 1}},
		{"CCO", map[string]int{"C-(C)(H)3": 1, "C-(O)(C)(H)2": 1, "O-(C)(H)": 1}},
		{"CC(C)O", map[string]int{"C-(C)(H)3": 2, "C-(O)(C)2(H)": 1, "O-(C)(H)": 1}},
		{"CC(C)(C)O", map[string]int{"C-(C)(H)3": 3, "C-(O)(C)3": 1, "O-(C)(H)": 1}},
		{"COC", map[string]int{"C-(O)(H)3": 2, "O-(C)2": 1}},
		{"CC=O", map[string]int{"C-(CO)(H)3": 1, "CO-(C)(H)": 1}},
		{"CCC=O", map[string]int{"C-(C)(H)3": 1, "C-(CO)(C)(H)2": 1, "CO-(C)(H)": 1}},
		{"CC(C)=O", map[string]int{"C-(CO)(H)3": 2, "CO-(C)2": 1}},
		{"CC(=O)O", map[string]int{"C-(CO)(H)3": 1, "CO-(O)(C)": 1, "O-(CO)(H)": 1}},
		{"O=CO", map[string]int{"CO-(O)(H)": 1, "O-(CO)(H)": 1}},
		{"CC(=O)OC", map[string]int{"C-(CO)(H)3": 1, "CO-(O)(C)": 1, "O-(CO)(C)": 1, "C-(O)(H)3": 1}},
		{"COO", map[string]int{"C-(O)(H)3": 1, "O-(O)(C)": 1, "O-(O)(H)": 1}},
		{"COOC", map[string]int{"C-(O)(H)3": 2, "O-(O)(C)": 2}},
		{"Oc1ccccc1", map[string]int{"O-(Cb)(H)": 1, "Cb-(O)": 1, "Cb-(H)": 5}},
		{"O=Cc1ccccc1", map[string]int{"CO-(Cb)(H)": 1, "Cb-(CO)": 1, "Cb-(H)": 5}},
		{"OCc1ccccc1", map[string]int{"O-(C)(H)": 1, "C-(O)(Cb)(H)2": 1, "Cb-(C)": 1, "Cb-(H)": 5}},
		{"c1ccoc1", map[string]int{"Cd-(Cd)(H)": 2, "Cd-(O)(H)": 2, "O-(Cd)2": 1}},
		{"C=COC", map[string]int{"Cd-(H)2": 1, "Cd-(O)(H)": 1, "O-(Cd)(C)": 1, "C-(O)(H)3": 1}},
		{"C1CCCCC1", map[string]int{"C-(C)2(H)2": 6}},
		{"C1CCOC1", map[string]int{"C-(C)2(H)2": 2, "C-(O)(C)(H)2": 2, "O-(C)2": 1}},
		{"C1=CCCCC1", map[string]int{"Cd-(C)(H)": 2, "C-(Cd)(C)(H)2": 2, "C-(C)2(H)2": 2}},
		// radicals: the groups are those of the parent
		{"C[CH2]", map[string]int{"C-(C)(H)3": 2}},
		{"[CH2]C=C", map[string]int{"C-(Cd)(H)3": 1, "Cd-(C)(H)": 1, "Cd-(H)2": 1}},
	}
	for _, c := range cases {
		t.Run(c.smiles, func(t *testing.T) {
			e := estimate(t, c.smiles, Options{})
			assert.Equal(t, c.want, groupCounts(e))
			for _, m := range e.Missing {
				// radicals report the HBI entropy/Cp increments that are not
				// tabulated; furan its ring's S/Cp (TestFuranRingFlag)
				assert.True(t, strings.HasPrefix(m.Group, "HBI dS, dCp: "), "unexpected missing %+v", m)
			}
		})
	}
}

func TestSymmetryNumber(t *testing.T) {
	cases := []struct {
		smiles string
		sigma  int
	}{
		{"C", 12}, {"CC", 18}, {"CCC", 18}, {"CCCC", 18}, {"CC(C)C", 81}, {"CC(C)(C)C", 972},
		{"C=C", 4}, {"c1ccccc1", 12}, {"Cc1ccccc1", 6}, {"C1CCCCC1", 6}, {"O", 2}, {"O=C=O", 2},
		{"CC(C)=O", 18}, {"CO", 3}, {"CCO", 3}, {"COC", 18}, {"C=O", 2}, {"C#C", 2}, {"CC=C", 3},
		{"c1ccc2ccccc2c1", 4},
		// further textbook cases
		{"C/C=C/C", 18}, {"C/C=C\\C", 18}, {"C=C=C", 4}, {"C1CC1", 6}, {"N", 3}, {"CN(C)C", 81},
		{"Cc1ccc(C)cc1", 36}, {"C1COCCO1", 2}, {"C[CH2]", 6}, {"[CH3]", 6},
	}
	for _, c := range cases {
		assert.Equal(t, c.sigma, SymmetryNumber(parse(t, c.smiles)), c.smiles)
	}
}

func TestOpticalIsomers(t *testing.T) {
	assert.Equal(t, 2, OpticalIsomers(parse(t, "CCC(C)O")), "2-butanol has one unmarked stereocentre")
	assert.Equal(t, 1, OpticalIsomers(parse(t, "CC[C@H](C)O")), "a marked centre is one enantiomer")
	assert.Equal(t, 1, OpticalIsomers(parse(t, "CC(C)CC(C)C")), "2,4-dimethylpentane has none")
	assert.Equal(t, 1, OpticalIsomers(parse(t, "CCC(CC)C")), "3-methylpentane: two equal ethyl arms")
	e := estimate(t, "CCC(C)O", Options{})
	assert.InDelta(t, R*math.Log(2), e.S298-estimate(t, "CCC(C)O", Options{OpticalIsomers: 1}).S298, 1e-9,
		"n = 2 adds exactly R ln 2")
}

// The totals must be the exact sum of the listed terms (to rounding: 1e-9).
func TestSumInvariant(t *testing.T) {
	for _, s := range []string{"CCCCCCCCCC", "CC(C)(C)CC(C)C", "C/C=C\\C", "Cc1ccccc1C", "C1CCCCC1", "C12CCC(CC1)C2",
		"CC(=O)OCC", "COc1ccccc1", "CC[CH]C", "CO[O]", "[CH2]C=C", "c1ccoc1", "OCC(O)CO", "C1OCOC1"} {
		e := estimate(t, s, Options{})
		var hf, sv float64
		var cp [7]float64
		for _, list := range [][]Term{e.Groups, e.Corrections} {
			for _, x := range list {
				hf += x.Hf298
				sv += x.S298
				for i := range cp {
					cp[i] += x.Cp[i]
				}
			}
		}
		assert.InDelta(t, hf, e.Hf298, 1e-9, s)
		assert.InDelta(t, sv, e.S298, 1e-9, s)
		for i := range cp {
			assert.InDelta(t, cp[i], e.Cp[i], 1e-9, "%s Cp[%d]", s, i)
		}
	}
}

func TestCorrections(t *testing.T) {
	cases := []struct {
		smiles, name string
		count        int
	}{
		{"CC(C)C", "gauche interaction", 0},
		{"CCC(C)C", "gauche interaction", 1},
		{"CC(C)C(C)C", "gauche interaction", 2},
		{"CC(C)(C)C(C)(C)C", "gauche interaction", 6},
		{"CCCC", "gauche interaction", 0},
		{"CC(C)(C)CC(C)C", "1,5 interaction", 1},
		{"CC(C)CC(C)C", "1,5 interaction", 0},
		{"CC(C)(C)CC(C)(C)C", "1,5 interaction", 2},
		{"C/C=C\\C", "cis interaction", 1},
		{"C/C=C/C", "cis interaction", 0},
		{"CC=CC", "cis interaction", 0}, // unspecified: trans assumed
		{"CC(C)=CC", "cis interaction", 1},
		{"C1=CCCCC1", "cis interaction", 0}, // ring double bond
		{"Cc1ccccc1C", "ortho interaction", 1},
		{"Cc1cccc(C)c1", "ortho interaction", 0},
		{"Cc1cccc(C)c1C", "ortho interaction", 2},
		{"c1ccc2c(c1)CCC2", "ortho interaction", 0}, // indane: ring correction instead
		{"C1CCCCC1", "ring strain: cyclohexane", 1},
		{"C1CC1", "ring strain: cyclopropane", 1},
		{"c1ccccc1", "ring strain: cyclohexane", 0},
		{"c1ccc2c(c1)CCC2", "ring strain: cyclopentene", 1},
		{"C1=CC=CCC1", "ring strain: 1,3-cyclohexadiene", 1},
		{"C1=CCC=CC1", "ring strain: 1,4-cyclohexadiene", 1},
		{"C1CCOC1", "ring strain: tetrahydrofuran", 1},
		{"c1ccoc1", "ring strain: furan", 1},
		{"C1CO1", "ring strain: oxirane", 1},
		{"C[CH2]", "HBI: primary", 1},
		{"C[CH]C", "HBI: secondary", 1},
		{"C[C](C)C", "HBI: tertiary", 1},
		{"[CH2]C=C", "HBI: allylic", 1},
		{"[CH2]c1ccccc1", "HBI: benzylic", 1},
		{"C=[CH]", "HBI: vinylic", 1},
		{"[c]1ccccc1", "HBI: phenyl", 1},
		{"C[C]=O", "HBI: acyl", 1},
		{"C[O]", "HBI: alkoxy", 1},
		{"[O]c1ccccc1", "HBI: phenoxy", 1},
		{"CO[O]", "HBI: peroxy", 1},
		{"O[CH2]", "HBI: alpha-hydroxy", 1},
		{"CO[CH2]", "HBI: alpha-alkoxy", 1},
		{"[CH2]CC[CH2]", "HBI: primary", 2},
		{"CC", "HBI: primary", 0},
		{"C[CH2]", "spin degeneracy R ln 2", 1},
		{"[CH2]CC[CH2]", "spin degeneracy R ln 3", 1},
		{"CC", "spin degeneracy R ln 2", 0},
	}
	for _, c := range cases {
		e := estimate(t, c.smiles, Options{})
		assert.Equal(t, c.count, correctionCount(e, c.name), "%s: %s", c.smiles, c.name)
	}
}

// HBI arithmetic: ΔHf(R•) − ΔHf(RH) = D(R–H) − ΔHf(H) exactly, and the
// entropy carries R ln 2 for the doublet.
func TestHBIArithmetic(t *testing.T) {
	rad := estimate(t, "C[CH2]", Options{})
	par := estimate(t, "CC", Options{})
	h := builtin().hbi["primary"]
	assert.InDelta(t, h.bde-hfH, rad.Hf298-par.Hf298, 1e-6)
	assert.InDelta(t, 101.1*4184-52.10*4184, rad.Hf298-par.Hf298, 1e-6, "D = 101.1, ΔHf(H) = 52.10 kcal/mol")
	// S: parent intrinsic + ΔS_HBI + R ln 2 − R ln σ(radical), plus the lost
	// C–H vibrations where no ΔS_HBI is tabulated.
	lost := 0.0
	if !h.hasSCp {
		lost = lostModes("primary", 1).S298
		assert.Less(t, lost, 0.0)
		assert.Greater(t, lost, -1.0, "the lost stretch and bends hold little entropy at 298 K")
	}
	// Ethyl's centre also turns a C–H bend into the inversion mode and
	// frees its one C–C rotor (siteChanges).
	site, ok := siteChanges(parse(t, "C[CH2]"), newGraph(parentOf(parse(t, "C[CH2]"))))
	require.True(t, ok)
	hoS := func(nu float64) float64 {
		x := secondRadiation * nu / 298.15
		return R * (x/math.Expm1(x) - math.Log(-math.Expm1(-x)))
	}
	inversion := hoS(inversionWavenumber) - hoS(lostCH[2])
	assert.InDelta(t, inversion+freedRotorS*calorie, site.S298, 1e-9)
	want := par.S298 + R*math.Log(18) + h.value.S298 + R*math.Log(2) - R*math.Log(6) + lost + site.S298
	assert.InDelta(t, want, rad.S298, 1e-9)
	assert.Equal(t, 2, rad.Multiplicity)
}

func TestMissingGroupAndUserGroup(t *testing.T) {
	e := estimate(t, "O=CC(=O)O", Options{}) // glyoxylic acid: CO-(O)(CO) is not tabulated
	require.Len(t, e.Missing, 1)
	assert.Equal(t, "CO-(O)(CO)", e.Missing[0].Group)
	assert.Equal(t, "CO-(O)(C)", e.Missing[0].Approximation, "CO is approximated by its relative C")
	approx := builtin().groups["CO-(O)(C)"]
	assert.Equal(t, 1, groupCounts(e)["CO-(O)(CO) ≈ CO-(O)(C)"])

	// A user group (written in another ligand order) fills the gap and is used.
	user := GroupValue{Name: "CO-(CO)(O)", Hf298: -90000, S298: 40, Cp: [7]float64{10, 11, 12, 13, 14, 15, 16}, Source: "test"}
	u := estimate(t, "O=CC(=O)O", Options{UserGroups: []GroupValue{user}})
	assert.Empty(t, u.Missing)
	assert.Equal(t, 1, groupCounts(u)["CO-(O)(CO)"])
	assert.InDelta(t, user.Hf298-approx.Hf298, u.Hf298-e.Hf298, 1e-6, "only that group's value changes")

	// A user group also wins over a built-in one.
	over := GroupValue{Name: "C-(H)3(C)", Hf298: 0, Source: "test"}
	a := estimate(t, "CC", Options{UserGroups: []GroupValue{over}})
	assert.InDelta(t, 0, a.Hf298, 1e-9)
}

func TestRingApproximationReported(t *testing.T) {
	e := estimate(t, "C1CC2CCC(C1)C2", Options{}) // bicyclo[3.2.1]octane: no system value
	require.NotEmpty(t, e.Missing)
	assert.Contains(t, e.Missing[0].Group, "bicyclo[3.2.1]")
	assert.Contains(t, e.Missing[0].Group, "bridged")

	// Norbornane has a tabulated whole-system strain: the ring terms plus a
	// difference term give exactly the system Hf, and nothing that changes
	// ΔHf° is missing (its S° and Cp, which the table lacks, are flagged).
	n := estimate(t, "C12CCC(CC1)C2", Options{})
	require.Len(t, n.Missing, 1)
	assert.Equal(t, ringSystemEntropyGroup+"bicyclo[2.2.1]heptane", n.Missing[0].Group)
	assert.True(t, entropyOnly(n.Missing[0]))
	var ringHf float64
	for _, c := range n.Corrections {
		if strings.HasPrefix(c.Name, "ring") {
			ringHf += c.Hf298
		}
	}
	var want float64
	for _, s := range builtin().systems {
		if s.name == "bicyclo[2.2.1]heptane" {
			want = s.value.Hf298
		}
	}
	assert.InDelta(t, want, ringHf, 1e-9)
}

// Every Cp(1500 K) entered by analogy equals Cp(1000 K) plus the published
// 1000 → 1500 K increment of the named analog (exact up to rounding, 1e-9),
// and no row repeats its 1000 K value at 1500 K unless that is the
// published value (none of the built-in rows does).
func TestCp1500ByAnalogy(t *testing.T) {
	tabs := map[string]map[string]GroupValue{"groups": builtin().groups, "corrections": builtin().corrections}
	n := 0
	for _, tab := range tabs {
		for name, v := range tab {
			_, an, ok := strings.Cut(v.Source, "1500 K by analogy with ")
			if !ok {
				continue
			}
			n++
			a, found := tab[an]
			require.True(t, found, "%s: analog %s", name, an)
			assert.NotContains(t, a.Source, "1500 K by analogy", "%s: analog must be published", name)
			assert.InDelta(t, v.Cp[5]+a.Cp[6]-a.Cp[5], v.Cp[6], 1e-9, name)
		}
	}
	assert.Positive(t, n)
	for name, v := range builtin().groups {
		assert.NotEqual(t, v.Cp[5], v.Cp[6], "%s: 1500 K equals 1000 K", name)
	}
}

func TestRingKeys(t *testing.T) {
	assert.Equal(t, 1, correctionCount(estimate(t, "O=C1CCCCC1", Options{}), "ring strain: cyclohexanone"))
	assert.Equal(t, 1, correctionCount(estimate(t, "O=C1CCCC1", Options{}), "ring strain: cyclopentanone"))
	assert.Equal(t, 1, correctionCount(estimate(t, "C1CC11CC1", Options{}), "ring system strain: spiro[2.2]pentane"))
}

func TestOutOfScope(t *testing.T) {
	_, err := Estimate(parse(t, "C[NH3+]"), Options{})
	assert.Error(t, err, "charged species")
	_, err = Estimate(parse(t, "C[Si](C)(C)C"), Options{})
	assert.Error(t, err, "element without groups or approximation")
}

func TestOptionsOverride(t *testing.T) {
	e := estimate(t, "CC", Options{Symmetry: 1, Multiplicity: 1})
	assert.Equal(t, 1, e.SymmetryNumber)
	assert.Equal(t, 1, e.Multiplicity)
	base := estimate(t, "CC", Options{})
	assert.InDelta(t, R*math.Log(18), e.S298-base.S298, 1e-9)
	// The multiplicity the structure implies is accepted when given.
	r := estimate(t, "C[CH2]", Options{Multiplicity: 2})
	assert.Equal(t, 2, r.Multiplicity)
}

func TestParseGroupName(t *testing.T) {
	for in, want := range map[string]string{
		"C-(H)3(C)":      "C-(C)(H)3",
		"C-(C)(H)(H)(H)": "C-(C)(H)3",
		"C-(H)2(C)(O)":   "C-(O)(C)(H)2",
		"C-(C)(Cd)(H)2":  "C-(Cd)(C)(H)2",
		"Cbf-(Cb)2(Cbf)": "Cbf-(Cbf)(Cb)2",
		" Ca ":           "Ca",
		"O-(H)(CO)":      "O-(CO)(H)",
	} {
		got, err := ParseGroupName(in)
		require.NoError(t, err, in)
		assert.Equal(t, want, got, in)
	}
	for _, bad := range []string{"", "X-(C)", "C-(C)(H)2", "C-(C)(H)4", "C-(Q)(H)3", "C-(C(H)3", "Cd"} {
		_, err := ParseGroupName(bad)
		assert.Error(t, err, bad)
	}
}

func TestGroupTableIsCopy(t *testing.T) {
	tab := GroupTable()
	require.NotEmpty(t, tab)
	for _, g := range tab {
		assert.NotEmpty(t, g.Source, g.Name)
	}
	tab[0].Hf298 = 1e9
	assert.NotEqual(t, 1e9, GroupTable()[0].Hf298)
}

func TestUnits(t *testing.T) {
	// C-(C)(H)3: -10.20 kcal/mol, 30.41 cal/(mol K) (Benson 1976).
	g := builtin().groups["C-(C)(H)3"]
	assert.InDelta(t, -10.20*4184, g.Hf298, 1e-6)
	assert.InDelta(t, 30.41*4.184, g.S298, 1e-9)
}

func BenchmarkEstimateC10(b *testing.B) {
	m := parse(b, "CC(C)CC(C)(C)CCCC") // C10H22, branched
	for b.Loop() {
		if _, err := Estimate(m, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkEstimateC10Aromatic(b *testing.B) {
	m := parse(b, "CCCCc1ccccc1") // butylbenzene
	for b.Loop() {
		if _, err := Estimate(m, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

func TestUncertaintyFromClass(t *testing.T) {
	e := estimate(t, "CCCC", Options{})
	assert.Equal(t, "alkane", e.Class)
	assert.InDelta(t, maeToSigma*classError("alkane")*4184, e.Uncertainty, 1e-9)
	assert.Positive(t, e.Uncertainty)
	// Every approximation widens the uncertainty: a bridged system without
	// a correction, a missing group, an unknown ring.
	base := estimate(t, "C1CCCCC1", Options{}).Uncertainty
	for _, smi := range []string{"C1CC2CCC(C1)C2", "C1=CC=C1", "C=CC(=O)C=C"} {
		w := estimate(t, smi, Options{})
		require.NotEmpty(t, w.Missing, smi)
		assert.Greater(t, w.Uncertainty, base+4184, smi)
	}
	assert.Equal(t, "radical", estimate(t, "C[CH2]", Options{}).Class)
	assert.Equal(t, "aromatic-oxygen", estimate(t, "c1ccoc1", Options{}).Class)
	assert.Equal(t, "acid-ester", estimate(t, "CC(=O)OC", Options{}).Class)
}

// The lost-vibration term: at high T each of the three modes approaches R
// (classical equipartition), at room temperature the stiff stretch is frozen.
func TestLostModes(t *testing.T) {
	tm := lostModes("primary", 1)
	// 1500 K: x = θ/T = 2.830, 1.391, 1.103 → Einstein functions x²eˣ/(eˣ−1)²
	// = 0.5339, 0.8533, 0.9045 (computed separately) → ΔCp = −2.2916 R.
	assert.InDelta(t, -2.2916*R, tm.Cp[6], 0.001*R)
	assert.Greater(t, tm.Cp[0], -1.0*R, "300 K: little of the three modes is excited")
	for i := 1; i < 7; i++ {
		assert.Less(t, tm.Cp[i], tm.Cp[i-1], "the loss grows with T")
	}
	two := lostModes("primary", 2)
	assert.InDelta(t, 2*tm.Cp[3], two.Cp[3], 1e-12)
}

// The vinoxy radical (O on a vinyl carbon) takes the resonance-stabilised
// phenoxy increment, not the alkoxy one, and says so.
func TestVinoxySite(t *testing.T) {
	e := estimate(t, "C=C[O]", Options{})
	assert.Equal(t, 1, correctionCount(e, "HBI: phenoxy"))
	found := false
	for _, m := range e.Missing {
		if strings.Contains(m.Group, "vinoxy") {
			found = true
		}
	}
	assert.True(t, found, "the approximation is reported: %+v", e.Missing)
}

// An α-carbonyl radical and its vinoxy resonance structure are one species:
// both spellings give the same numbers, and the structure estimated is named.
func TestAlphaCarbonylResonance(t *testing.T) {
	a := estimate(t, "[CH2]C=O", Options{})
	b := estimate(t, "C=C[O]", Options{})
	assert.InDelta(t, b.Hf298, a.Hf298, 1e-9)
	assert.InDelta(t, b.S298, a.S298, 1e-9)
	assert.Equal(t, b.Missing, a.Missing)
	assert.Equal(t, parse(t, "C=C[O]").Canonical(), a.Form)
	assert.Equal(t, 2, a.ResonanceForms)
	// Radicals elsewhere are untouched: ethyl keeps its primary increment.
	e := estimate(t, "C[CH2]", Options{})
	assert.Equal(t, 1, correctionCount(e, "HBI: primary"))
}
