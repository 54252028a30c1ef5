package molecule

import (
	"errors"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func parse(t testing.TB, s string) *Molecule {
	t.Helper()
	m, err := ParseSMILES(s)
	require.NoError(t, err, s)
	return m
}

func TestHydrogenCounts(t *testing.T) {
	cases := []struct {
		smiles string
		h      []int
	}{
		{"CCO", []int{3, 2, 1}},
		{"C=C", []int{2, 2}},
		{"C#N", []int{1, 0}},
		{"c1ccccc1", []int{1, 1, 1, 1, 1, 1}},
		{"c1cc[nH]c1", []int{1, 1, 1, 1, 1}},
		{"n1ccccc1", []int{0, 1, 1, 1, 1, 1}},
		{"o1cccc1", []int{0, 1, 1, 1, 1}},
		{"c1ccc2ccccc2c1", []int{1, 1, 1, 0, 1, 1, 1, 1, 0, 1}},
		{"CS(C)=O", []int{3, 0, 3, 0}},        // S valence 4
		{"OS(=O)(=O)O", []int{1, 0, 0, 0, 1}}, // S valence 6
		{"CP(C)C", []int{3, 0, 3, 3}},         // P valence 3
		{"C[H]", []int{4}},                    // explicit H folded
		{"[H]C([H])([H])[H]", []int{4}},       // all folded
		{"[NH4+]", []int{4}},                  // bracket count
		{"B", []int{3}},                       // borane
		{"ClC(Cl)Cl", []int{0, 1, 0, 0}},      // two-letter organic atom
		{"[CH2]=C", []int{2, 2}},              // bracket atom with H
		{"O=c1cccc[nH]1", []int{0, 0, 1, 1, 1, 1, 1}},
	}
	for _, c := range cases {
		m := parse(t, c.smiles)
		require.Len(t, m.Atoms, len(c.h), c.smiles)
		for i, a := range m.Atoms {
			assert.Equal(t, c.h[i], a.HCount, "%s atom %d", c.smiles, i)
		}
	}
}

func TestRadicalsAndMultiplicity(t *testing.T) {
	cases := []struct {
		smiles             string
		radicals, unpaired int
		mult               int
	}{
		{"[CH3]", 1, 1, 2},
		{"C[CH]C", 1, 1, 2},
		{"[O]", 2, 2, 3},   // O atom, ³P
		{"C[O]", 1, 1, 2},  // methoxy
		{"[CH2]", 2, 2, 3}, // methylene, triplet ground state
		{"[C]", 4, 2, 3},   // C atom: s pair kept paired, ³P
		{"[CH]", 3, 1, 2},  // methylidyne ²Π
		{"[N]", 3, 3, 4},   // N atom ⁴S
		{"[NH]", 2, 2, 3},
		{"[O][O]", 2, 2, 3},     // triplet O2
		{"[CH2][CH2]", 2, 2, 3}, // biradical on two atoms
		{"[CH2]C=C", 1, 1, 2},   // allyl
		{"CCO", 0, 0, 1},
		{"[Na+].[Cl-]", 0, 0, 1}, // no valence rule for metals
		{"[H]", 1, 1, 2},
		{"[c]1ccccc1", 1, 1, 2}, // phenyl
		{"[OH-]", 0, 0, 1},
		{"[CH3+]", 0, 0, 1},
		{"[CH3-]", 0, 0, 1},
	}
	for _, c := range cases {
		m := parse(t, c.smiles)
		r := 0
		for _, a := range m.Atoms {
			r += a.Radical
		}
		assert.Equal(t, c.radicals, r, "%s radical electrons", c.smiles)
		assert.Equal(t, c.unpaired, m.UnpairedElectrons(), "%s unpaired", c.smiles)
		assert.Equal(t, c.mult, m.DefaultMultiplicity(), "%s multiplicity", c.smiles)
	}
}

func TestErrors(t *testing.T) {
	cases := []struct {
		smiles string
		pos    int
		msg    string
	}{
		{"", 0, "empty"},
		{"C1CC", 1, "unclosed ring"},
		{"CC(C", 2, "unclosed branch"},
		{"[Xx]", 1, "unknown element"},
		{"CC)", 2, "unmatched ')'"},
		{"C%1C", 1, "'%' must be followed by two digits"},
		{"=CC", 0, "bond with no atom"},
		{"CC=", 2, "bond at the end"},
		{"C==C", 2, "two bonds in a row"},
		{"C?C", 1, "invalid character"},
		{"c1cccc1", 0, "aromatic ring cannot be kekulized"},
		{"CCc1cccc1", 2, "aromatic ring cannot be kekulized"},
		{"C(C)(C)(C)(C)C", 0, "carbon with valence 5"},
		{"CO(C)C", 1, "oxygen with valence 3"},
		{"O=Cl[O]", 2, "chlorine with valence 3 (a halogen outside brackets has one bond: write a hypervalent one in brackets, as chlorine trifluoride F[Cl](F)F, or with charges, as chlorine dioxide OClO is: [O][Cl+][O-])"},
		{"[CH5]", 0, "carbon with valence 5"},
		{"*C", 0, "wildcard"},
		{"C=1CC-1", 5, "two different bond symbols"},
		{"C11", 2, "itself"},
		{"C12CC12", 6, "second bond"},
		{"C()C", 2, "empty branch"},
		{"[C", 0, "unclosed '['"},
		{"C.", 1, "ends with '.'"},
		{"Xe", 0, "must be written in brackets, as [Xe]"},
		{"CXe", 1, "must be written in brackets, as [Xe]"},
		{"CCX", 2, `"X" is not an element symbol`},
		{"xyz", 0, `"x" is not an element symbol`},
	}
	for _, c := range cases {
		se := requireSMILESError(t, c.smiles, c.pos, c.msg)
		assert.True(t, strings.HasPrefix(se.Error(), "position "), c.smiles)
	}
}

func TestLimits(t *testing.T) {
	_, err := ParseSMILES(strings.Repeat("C", MaxHeavyAtoms))
	require.NoError(t, err, "exactly the limit is accepted")
	_, err = ParseSMILES(strings.Repeat("C", MaxHeavyAtoms+1))
	require.Error(t, err)
	assert.Contains(t, err.Error(), "heavy atoms")
	// deep branch nesting and many rings must not panic
	deep := strings.Repeat("C(", 400) + "C" + strings.Repeat(")", 400)
	m, err := ParseSMILES(deep)
	require.NoError(t, err)
	assert.Equal(t, 401, m.HeavyAtoms())
	_, err = ParseSMILES(strings.Repeat("C(", 400))
	require.Error(t, err)
	_, err = ParseSMILES("C%99CC%99")
	require.NoError(t, err)
}

func TestFormulaCompositionMass(t *testing.T) {
	cases := []struct {
		smiles, formula string
		charge          int
		mass            float64
	}{
		// masses: sums of IUPAC 2021 conventional weights (C 12.011, H 1.008,
		// O 15.999, N 14.007, Cl 35.45); exact to rounding, tolerance 1e-9.
		{"CCO", "C2H6O", 0, 2*12.011 + 6*1.008 + 15.999},
		{"O", "H2O", 0, 2*1.008 + 15.999},
		{"Cl", "ClH", 0, 1.008 + 35.45},
		{"[NH4+]", "H4N", 1, 4*1.008 + 14.007},
		{"CC(=O)[O-]", "C2H3O2", -1, 2*12.011 + 3*1.008 + 2*15.999},
		{"[2H]O[2H]", "D2O", 0, 2*2.01410177812 + 15.999},
		{"[13CH4]", "[13C]H4", 0, 13.00335483507 + 4*1.008},
		{"C[18OH]", "CH4[18O]", 0, 12.011 + 4*1.008 + 17.99915961286},
		{"[Na+].[Cl-]", "ClNa", 0, 22.98976928 + 35.45},
	}
	for _, c := range cases {
		m := parse(t, c.smiles)
		assert.Equal(t, c.formula, m.Formula(), c.smiles)
		assert.Equal(t, c.charge, m.Charge(), c.smiles)
		assert.InDelta(t, c.mass, m.MolarMass(), 1e-9, c.smiles)
	}
	comp := parse(t, "OCC(O)=O").Composition()
	assert.Equal(t, map[string]int{"C": 2, "H": 4, "O": 3}, comp)
}

func TestRings(t *testing.T) {
	cases := []struct {
		smiles  string
		rings   []int // ring sizes, sorted
		systems int
	}{
		{"CCC", nil, 0},
		{"C1CCCCC1", []int{6}, 1},
		{"C1CC2CCC1C2", []int{5, 5}, 1},                 // norbornane
		{"C1C2CC3CC1CC(C2)C3", []int{6, 6, 6}, 1},       // adamantane
		{"C12C3C4C1C5C2C3C45", []int{4, 4, 4, 4, 4}, 1}, // cubane: 5 of 6 faces
		{"C1CCC2(CC1)CCCC2", []int{5, 6}, 2},            // spiro: two systems
		{"c1ccc(cc1)-c1ccccc1", []int{6, 6}, 2},
		{"c1ccc2ccccc2c1", []int{6, 6}, 1},
	}
	for _, c := range cases {
		m := parse(t, c.smiles)
		var sizes []int
		for _, r := range m.Rings() {
			sizes = append(sizes, len(r))
			for k := range r { // ring order: consecutive atoms bonded
				assert.GreaterOrEqual(t, m.BondBetween(r[k], r[(k+1)%len(r)]), 0, c.smiles)
			}
		}
		assert.ElementsMatch(t, c.rings, sizes, c.smiles)
		assert.Len(t, m.RingSystems(), c.systems, c.smiles)
	}
	m := parse(t, "CC1CC2CCC1C2")
	assert.False(t, m.IsInRing(0))
	assert.True(t, m.IsInRing(1))
	assert.Equal(t, []int{5}, m.RingSizes(1))
	assert.Equal(t, []int{5, 5}, m.RingSizes(3), "bridgehead in both rings")
	assert.ElementsMatch(t, []int{0, 2, 6}, m.Neighbors(1))
	assert.Equal(t, -1, m.BondBetween(0, 2))
}

func TestAromaticity(t *testing.T) {
	cases := []struct {
		smiles string
		arom   int
		why    string
	}{
		{"C1=CC=CC=C1", 6, "benzene from Kekulé input"},
		{"O=C1C=CC=CC=C1", 7, "tropone: C=O carbon gives 0 π electrons, 6 in ring"},
		{"O=C1C=CC=C1", 0, "cyclopentadienone: 4 π electrons"},
		{"C=C1C=CC=C1", 0, "fulvene: exocyclic C=C takes the electron"},
		{"C1=CC=C2C=CC=C2C=C1", 10, "azulene: 10 π electrons over the fused pair"},
		{"C1=CC=CC=CC=C1", 0, "cyclooctatetraene: 8 π electrons"},
		{"c1ccc2c(c1)-c1ccccc1-2", 12, "biphenylene: the 4-ring is not aromatic"},
		{"O=C1C=CC(=O)C=C1", 0, "p-benzoquinone"},
		{"C1=CC=C[CH+]C=C1", 7, "tropylium: empty p orbital"},
		{"[cH-]1cccc1", 5, "cyclopentadienide"},
		{"C1=CC=CC1", 0, "cyclopentadiene: sp3 CH2"},
		{"c1ccc2c(c1)CCC2", 6, "indane"},
	}
	for _, c := range cases {
		m := parse(t, c.smiles)
		n := 0
		for _, a := range m.Atoms {
			if a.Aromatic {
				n++
			}
		}
		assert.Equal(t, c.arom, n, "%s: %s", c.smiles, c.why)
	}
}

func TestCanonicalEquivalences(t *testing.T) {
	same := [][]string{
		{"OCC", "CCO", "C(O)C", "[H]OC([H])([H])C"},
		{"C(C)(C)C", "CC(C)C"},
		{"c1ccccc1", "C1=CC=CC=C1", "C1C=CC=CC=1", "c1cc2ccccc2cc1.[Xe]"[:0] + "C=1C=CC=CC=1"},
		{"C1CCCCC1", "C%10CCCCC%10", "C1CCC2.C12"[:0] + "C9CCCCC9"},
		{"c1ccc2ccccc2c1", "C1=CC=C2C=CC=CC2=C1", "c1cccc2c1cccc2"},
		{"c1cc[nH]c1", "C1=CNC=C1", "[nH]1cccc1"},
		{"O=c1cccc[nH]1", "O=C1C=CC=CN1"},
		{"[O-][N+](=O)C", "C[N+](=O)[O-]"},
		{"C.O", "O.C"},
	}
	for _, group := range same {
		want := parse(t, group[0]).Canonical()
		for _, s := range group[1:] {
			assert.Equal(t, want, parse(t, s).Canonical(), "%s vs %s", group[0], s)
		}
	}
	different := []string{"CCO", "COC", "CC=O", "C=CO", "c1ccccc1", "C1=CCC=CC1", "[CH3]", "C", "[CH2]", "[13CH4]", "[CH3+]", "C[O]", "CO", "C/C=C/C", "CC=CC", "C=CCC"}
	seen := map[string]string{}
	for _, s := range different {
		c := parse(t, s).Canonical()
		if prev, ok := seen[c]; ok {
			// cis/trans isomers only differ in CanonicalStereo
			if !(strings.Contains(s, "/") || strings.Contains(prev, "/")) {
				t.Errorf("%s and %s share canonical %s", prev, s, c)
			}
		}
		seen[c] = s
	}
}

func TestStereo(t *testing.T) {
	trans, cis := parse(t, "F/C=C/F"), parse(t, "F/C=C\\F")
	assert.Equal(t, trans.Canonical(), cis.Canonical(), "Canonical is stereo-free")
	assert.NotEqual(t, trans.CanonicalStereo(), cis.CanonicalStereo())
	assert.Equal(t, trans.CanonicalStereo(), parse(t, "F\\C=C\\F").CanonicalStereo(), "F\\C=C\\F is trans too")
	assert.Equal(t, cis.CanonicalStereo(), parse(t, "C(\\F)=C\\F").CanonicalStereo())
	assert.Equal(t, trans.CanonicalStereo(), parse(t, "C(\\F)=C/F").CanonicalStereo())
	ds := trans.DoubleBondStereo()
	require.Len(t, ds, 1)
	assert.False(t, ds[0].Cis)
	require.Len(t, cis.DoubleBondStereo(), 1)
	assert.True(t, cis.DoubleBondStereo()[0].Cis)

	s1, r1 := parse(t, "C[C@H](O)CC"), parse(t, "C[C@@H](O)CC")
	assert.Equal(t, s1.Canonical(), r1.Canonical())
	assert.NotEqual(t, s1.CanonicalStereo(), r1.CanonicalStereo())
	// the same centre written from another neighbour
	// (checked against RDKit 2022.09: both give CC[C@H](C)O)
	assert.Equal(t, s1.CanonicalStereo(), parse(t, "CC[C@H](C)O").CanonicalStereo())
	assert.NotEqual(t, s1.CanonicalStereo(), parse(t, "CC[C@@H](C)O").CanonicalStereo())
	assert.Equal(t, s1.CanonicalStereo(), parse(t, "O[C@@H](C)CC").CanonicalStereo())
	assert.Equal(t, []int{1}, s1.Stereocentres())

	assert.Equal(t, []int{1}, parse(t, "CC(O)CC").PotentialStereocentres())
	assert.Empty(t, parse(t, "CC(C)CC").PotentialStereocentres(), "two methyls alike")
	assert.Equal(t, []int{1, 2}, parse(t, "OC(C(O)C(O)=O)C(O)=O").PotentialStereocentres(), "tartaric acid")
	assert.Empty(t, parse(t, "C1CCCCC1").PotentialStereocentres())
}

func TestAutomorphismCount(t *testing.T) {
	cases := []struct {
		smiles string
		n      int64
	}{
		{"C", 24},            // methane: S4 on the hydrogens
		{"CC", 72},           // ethane: 2 × 3! × 3!
		{"c1ccccc1", 12},     // benzene: D6 on the ring
		{"CC(C)(C)C", 31104}, // neopentane: 4! × (3!)^4
		{"O", 2},
		{"[H][H]", 2},
		{"O=C=O", 2},
		{"C=C", 8},                      // 2 × 2! × 2!
		{"C12C3C4C1C5C2C3C45", 48},      // cubane Oh on the cage
		{"C1C2CC3CC1CC(C2)C3", 24 * 64}, // adamantane: Td × (2!)^6
		{"C.C", 2 * 24 * 24},            // two identical components
		{"CCO", 12},
	}
	for _, c := range cases {
		n, exact := parse(t, c.smiles).AutomorphismCount(10000)
		assert.True(t, exact, c.smiles)
		assert.Equal(t, c.n, n.Int64(), c.smiles)
	}
	// budget exhaustion is reported, not hidden
	_, exact := parse(t, "CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C").AutomorphismCount(2)
	assert.False(t, exact)
}

func TestSymmetryClasses(t *testing.T) {
	m := parse(t, "CCC")
	cls := m.SymmetryClasses()
	assert.Equal(t, cls[0], cls[2])
	assert.NotEqual(t, cls[0], cls[1])
	// numbering does not depend on input order
	assert.ElementsMatch(t, parse(t, "CC(C)O").SymmetryClasses(), parse(t, "OC(C)C").SymmetryClasses())
}

// randomSMILES re-emits m as a valid SMILES with a random atom order (and so
// random ring-closure numbers and branch layout), aromatic or Kekulé.
func randomSMILES(m *Molecule, rng *rand.Rand, kekule bool) string {
	labels := rng.Perm(len(m.Atoms))
	return m.writeSMILESOpts(labels, true, kekule)
}

func TestCanonicalUnderRandomRespelling(t *testing.T) {
	fixtures := loadFixtures(t)
	rng := rand.New(rand.NewPCG(1, 2))
	tested := 0
	for _, fx := range fixtures {
		if fx.rdkitError != "" {
			continue
		}
		m := parse(t, fx.smiles)
		want, wantSt := m.Canonical(), m.CanonicalStereo()
		for k := 0; k < 8; k++ {
			s := randomSMILES(m, rng, k%2 == 1)
			m2, err := ParseSMILES(s)
			require.NoError(t, err, "%s respelled as %s", fx.smiles, s)
			assert.Equal(t, want, m2.Canonical(), "%s respelled as %s", fx.smiles, s)
			assert.Equal(t, wantSt, m2.CanonicalStereo(), "%s respelled as %s", fx.smiles, s)
			assert.Equal(t, m.Formula(), m2.Formula())
		}
		tested++
	}
	assert.GreaterOrEqual(t, tested, 100)
}

// thirtyAtoms is a 30-heavy-atom drug-like SMILES with two aromatic rings.
const thirtyAtoms = "CC(C)Cc1ccc(cc1)C(C)C(=O)OCCN1CCN(CC1)c1ncc(C)cn1"

func BenchmarkParse30Atoms(b *testing.B) {
	m := parse(b, thirtyAtoms)
	require.Equal(b, 30, m.HeavyAtoms())
	b.ReportAllocs()
	for b.Loop() {
		m, err := ParseSMILES(thirtyAtoms)
		if err != nil {
			b.Fatal(err)
		}
		_ = m.Canonical()
	}
}

func BenchmarkSymmetry(b *testing.B) {
	for _, s := range []string{thirtyAtoms, "CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C", "c1cc2ccc3ccc4ccc5ccc6ccc1c1c2c3c4c5c61"} {
		m := parse(b, s)
		b.Run(s, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				_ = m.SymmetryClasses()
				_, _ = m.AutomorphismCount(10000)
			}
		})
	}
}

// BenchmarkSmallSpecies measures what reading one typical mechanism species
// costs: parse (rings, aromaticity) + Canonical + SymmetryClasses.
func BenchmarkSmallSpecies(b *testing.B) {
	for _, s := range []string{"CCO", "CC(C)C[CH2]", "c1ccccc1C", "O=CC(C)OO", "C1CCCCC1", "[OH]"} {
		b.Run(s, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				m, err := ParseSMILES(s)
				if err != nil {
					b.Fatal(err)
				}
				_ = m.Canonical()
				_ = m.SymmetryClasses()
			}
		})
	}
}

// BenchmarkMechanism20k reads 20,000 species SMILES of the sizes typical of
// a combustion mechanism (cycled from a fixed list, each parsed afresh) and
// takes Canonical, CanonicalStereo and SymmetryClasses of each; the time per
// op is for all 20,000.
func BenchmarkMechanism20k(b *testing.B) {
	list := []string{"[H]", "[H][H]", "O", "[OH]", "O=O", "[O]O", "OO", "C", "[CH3]", "CC", "C[CH2]", "C=C",
		"C#C", "CCC", "CC=C", "C[CH]C", "CCCC", "CC(C)C", "CC(C)C[CH2]", "CCCCCCC", "CC(C)CC(C)(C)C", "CCO",
		"CC=O", "C[C]=O", "O=CC(C)OO", "CCOO", "CCO[O]", "CC(=O)CC", "C1CCCCC1", "C1CCOC1", "c1ccccc1",
		"c1ccccc1C", "c1ccccc1O", "c1ccc2ccccc2c1", "C=CC=C", "CC(C)(C)O[O]", "COC", "OC=O", "O=C=O", "[C-]#[O+]"}
	b.ReportAllocs()
	for b.Loop() {
		for k := 0; k < 20000; k++ {
			m, err := ParseSMILES(list[k%len(list)])
			if err != nil {
				b.Fatal(err)
			}
			_ = m.Canonical()
			_ = m.CanonicalStereo()
			_ = m.SymmetryClasses()
		}
	}
}

// BenchmarkSymmetryUncached measures the symmetry search itself (the cached
// results behind Canonical and SymmetryClasses are bypassed).
func BenchmarkSymmetryUncached(b *testing.B) {
	for _, s := range []string{thirtyAtoms, "CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C", "c1cc2ccc3ccc4ccc5ccc6ccc1c1c2c3c4c5c61"} {
		m := parse(b, s)
		b.Run(s, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				_ = m.symmetry(DefaultSearchWork, true)
			}
		})
	}
}

// TestCacheFollowsChanges checks that a changed copy of a parsed molecule
// (as a caller building a closed-shell parent does) gets results for its
// own graph, not the cached ones of the original, and that the original's
// cache is unaffected.
func TestCacheFollowsChanges(t *testing.T) {
	m := parse(t, "CC[CH2]")
	want := parse(t, "CCC")
	require.NotEqual(t, want.Canonical(), m.Canonical())
	p := *m
	p.Atoms = append([]Atom(nil), m.Atoms...)
	for i := range p.Atoms {
		p.Atoms[i].HCount += p.Atoms[i].Radical
		p.Atoms[i].Radical = 0
	}
	assert.Equal(t, want.Canonical(), p.Canonical())
	assert.Equal(t, want.SymmetryClasses(), p.SymmetryClasses())
	assert.Equal(t, parse(t, "[CH2]CC").Canonical(), m.Canonical())
	// repeated calls return equal, independent slices
	c1 := m.SymmetryClasses()
	c1[0] = 99
	assert.NotEqual(t, 99, m.SymmetryClasses()[0])
}

// BenchmarkRead30Atoms measures reading alone (tokens, kekulization,
// hydrogens, rings, aromaticity); canonical form and symmetry are computed
// only when asked for.
func BenchmarkRead30Atoms(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := ParseSMILES(thirtyAtoms); err != nil {
			b.Fatal(err)
		}
	}
}

// The formula keeps written mass numbers; the composition counts elements.
func TestFormulaIsotopes(t *testing.T) {
	for smi, want := range map[string]string{
		"CC[2H]":                "C2H5D",
		"[2H]C([2H])([2H])[2H]": "CD4",
		"[2H]O[2H]":             "D2O",
		"[13CH4]":               "[13C]H4",
		"C[13CH3]":              "C[13C]H6",
		"[3H]Cl":                "ClT",
		"CCO":                   "C2H6O",
	} {
		m := parse(t, smi)
		assert.Equal(t, want, m.Formula(), smi)
	}
	assert.Equal(t, "C2H6", HillFormula(parse(t, "CC[2H]").Composition()))
}

// requireSMILESError parses smiles, requires a *SMILESError, asserts its
// position and that its message contains msg, and returns it.
func requireSMILESError(t *testing.T, smiles string, pos int, msg string) *SMILESError {
	t.Helper()
	_, err := ParseSMILES(smiles)
	require.Error(t, err, smiles)
	var se *SMILESError
	require.True(t, errors.As(err, &se), smiles)
	assert.Equal(t, pos, se.Pos, "%q: %v", smiles, err)
	assert.Contains(t, se.Msg, msg, smiles)
	return se
}
