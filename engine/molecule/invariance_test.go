package molecule

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// invarianceSet holds molecules whose derived quantities must not depend on
// how they are written: polycyclics, cages, spiro, fused and bridged
// systems, radicals, stereo and acyclic controls.
var invarianceSet = []string{
	// cages and bridged polycyclics
	"C1C2CC3CC1CC(C2)C3",     // adamantane
	"C12C3C4C1C5C2C3C45",     // cubane
	"C12C3C1C23",             // tetrahedrane
	"C1CC2CCC1CC2",           // bicyclo[2.2.2]octane
	"C1CC2CCC1C2",            // norbornane
	"C1=CC2CCC1C2",           // norbornene
	"C1CC2C=CC1C2",           // norbornene, other ring
	"C1C2CC12",               // bicyclo[1.1.0]butane
	"C1CC2C1C2",              // bicyclo[2.1.0]pentane
	"C1C2CC1C2",              // bicyclo[1.1.1]pentane
	"C1CC2CC1C2",             // bicyclo[2.1.1]hexane
	"CC12CCC(CC1)C(C)(C)O2",  // 1,8-cineole
	"C1C2C3C4C1C5C2C3C45",    // a C9 cage
	"C12C3C4C5C1C6C2C3C4C56", // pentaprismane
	"C1C2CC3CC1C(C2)C3",      // noradamantane-like tricycle
	"C1CC2CC3CCC1C2C3",       // tricyclic
	"C1CC23CCC12CC3",         // propellane-like
	"OC1C2CC3CC1CC(C2)C3",    // 2-adamantanol
	"CC12CC3CC(CC(C3)C1)C2",  // 1-methyladamantane
	"C1C2C3C1C23",            // bicyclo[1.1.0]… tricyclic C5
	// fused
	"C1CCC2CCCCC2C1",             // decalin
	"C1CCC2CCCC2C1",              // hydrindane
	"C1CC2CCCC2C1",               // bicyclo[3.3.0]octane
	"c1ccc2ccccc2c1",             // naphthalene
	"c1ccc2c(c1)ccc1ccccc12",     // phenanthrene
	"c1ccc2cc3ccccc3cc2c1",       // anthracene
	"c1ccc2c(c1)CCC2",            // indane
	"c1ccc2c(c1)CCCC2",           // tetralin
	"c1cc2ccc3cccc4ccc(c1)c2c34", // pyrene
	"C1=CC2=CC=CC2=C1",           // pentalene-like
	"c1ccc2[nH]ccc2c1",           // indole
	"O=C1CCC2CCCCC2C1",           // decalone
	// spiro
	"C1CC12CC2",         // spiropentane
	"C1CC2(C1)CCC2",     // spiro[3.3]heptane
	"C1CCC2(CC1)CCCCC2", // spiro[5.5]undecane
	"C1CC2(C1)CCCC2",    // spiro[3.4]octane
	"C1CCC2(C1)OCCO2",   // a spiroketal
	// monocycles and ring radicals
	"C1CCCCC1", "C1CCCCCC1", "C1CCCCCCC1", "C1CC1", "C1CCC1", "C1=CCCC1", "c1ccccc1",
	"O=C1[CH]CCC1", "[O]C1=CCCC1", "C1CC[CH]C1", "[c]1ccccc1", "C1COCCO1", "C=C1CC1",
	"CC1CCC(C)CC1", "CC1CCCCC1C",
	// acyclic, stereo and radicals
	"CC(C)(C)C", "CC(C)C", "CCCC", "CC(C)(C)C(C)(C)C", "CCC(C)O", "CC(Cl)C(C)Cl",
	"C/C=C/C", "C/C=C\\C", "CC=C=CC", "C=CC=C", "CC(C)(C)O[O]", "C[CH]C", "CC(=O)O",
	"N[C@@H](C)C(=O)O", "C[C@H](O)[C@@H](C)O",
	"CC.CC.CC", "c1ccccc1.c1ccccc1",
	"C[C@H]1CC[C@H](C)CC1", "C[C@H]1CC[C@@H](C)CC1", "C[C@H]1C[C@@H]1C", "C[C@H]1C[C@H]1C",
	"F/C=C/C=C/F", "F/C=C\\C=C/F", "C[C@@H]1CC2CCC1C2",
}

// TestSpellingInvariance respells every molecule of invarianceSet at random
// (random atom order, ring-closure digits and branch layout; aromatic and
// Kekulé forms) and checks that canonical forms, σ, optical isomers,
// symmetry classes (as a function of canonical labels) and the ring
// description are all the same, in any order of evaluation.
func TestSpellingInvariance(t *testing.T) {
	require.GreaterOrEqual(t, len(invarianceSet), 50)
	rng := rand.New(rand.NewPCG(12, 34))
	for _, smi := range invarianceSet {
		m := parse(t, smi)
		want := derivedSummary(t, m)
		for k := 0; k < 6; k++ {
			s := randomSMILES(m, rng, k%2 == 1)
			m2, err := ParseSMILES(s)
			require.NoError(t, err, "%s respelled as %s", smi, s)
			assert.Equal(t, want, derivedSummary(t, m2), "%s respelled as %s", smi, s)
		}
	}
}

// derivedSummary renders every derived quantity of m in terms of canonical
// labels, so that equal summaries mean equal answers.
func derivedSummary(t *testing.T, m *Molecule) string {
	t.Helper()
	var b strings.Builder
	// ask in an unusual order first: results must not depend on it
	rings := m.RingSystemInfo()
	sigma, err := m.SymmetryNumber()
	require.NoError(t, err, m.SMILES)
	labels := m.canonicalLabels()
	fmt.Fprintf(&b, "canon %s\nstereo %s\nsigma %s\noptical %d\n", m.Canonical(), m.CanonicalStereo(), sigma, m.OpticalIsomers())
	classes := m.SymmetryClasses()
	byLabel := make([]int, len(labels))
	for a, l := range labels {
		byLabel[l] = classes[a]
	}
	fmt.Fprintf(&b, "classes %v\n", byLabel)
	lab := func(xs []int) []int {
		out := make([]int, len(xs))
		for i, a := range xs {
			out[i] = labels[a]
		}
		return out
	}
	for _, r := range rings {
		fmt.Fprintf(&b, "ring %s rings=%d basis=%v atoms=%v bridgeheads=%v spiro=%v unique=%v\n",
			r.Kind, r.Rings, r.BasisSizes, lab(r.Atoms), lab(r.Bridgeheads), lab(r.Spiro), r.UniqueBasis())
		for _, c := range r.Relevant {
			fmt.Fprintf(&b, "  cycle %v\n", lab(c))
		}
	}
	sc := slices.Clone(m.PotentialStereocentres())
	fmt.Fprintf(&b, "stereocentres %v\n", sortedInts(lab(sc)))
	return b.String()
}

func sortedInts(xs []int) []int { slices.Sort(xs); return xs }

func TestRingSystemInfo(t *testing.T) {
	cases := []struct {
		smiles string
		want   string // kind rings basis relevant-count bridgeheads spiro
	}{
		{"C1CCCCC1", "monocyclic 1 [6] 1 0 0"},
		{"c1ccc2ccccc2c1", "fused 2 [6 6] 2 2 0"},
		{"C1CC2CCC1C2", "bridged 2 [5 5] 2 2 0"},
		{"C1C2CC3CC1CC(C2)C3", "bridged 3 [6 6 6] 4 4 0"},
		{"C12C3C4C1C5C2C3C45", "cage 5 [4 4 4 4 4] 6 8 0"},
		{"C1C2CC12", "fused 2 [3 3] 2 2 0"}, // bicyclo[1.1.0]: a zero bridge is a fusion
	}
	for _, c := range cases {
		rs := parse(t, c.smiles).RingSystemInfo()
		require.Len(t, rs, 1, c.smiles)
		r := rs[0]
		got := fmt.Sprintf("%s %d %v %d %d %d", r.Kind, r.Rings, r.BasisSizes, len(r.Relevant), len(r.Bridgeheads), len(r.Spiro))
		assert.Equal(t, c.want, got, c.smiles)
	}
	rs := parse(t, "C1CC12CC2").RingSystemInfo()
	require.Len(t, rs, 2, "spiropentane: two systems sharing one atom")
	assert.Equal(t, rs[0].Spiro, rs[1].Spiro)
	assert.Len(t, rs[0].Spiro, 1)
	assert.Nil(t, parse(t, "CCO").RingSystemInfo())
}
