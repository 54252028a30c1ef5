package molecule

import (
	"context"
	"errors"
	"math/big"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// sigmaCases are total symmetry numbers σ = σ_ext·Π σ_int. Rigid molecules
// take the order of the rotational subgroup of their point group (textbook
// values, e.g. Herzberg; adamantane T_d, cubane O_h, bicyclo[2.2.2]octane
// D_3h, norbornane C_2v); flexible ones multiply by their tops (Benson 1976,
// ch. 2: neopentane 12·3⁴ = 972, isobutane 3·3³ = 81). Entered from memory /
// common practice.
var sigmaCases = []struct {
	smiles string
	sigma  int64
}{
	{"C", 12}, {"CC", 18}, {"CCC", 18}, {"CCCC", 18}, {"CC(C)C", 81}, {"CC(C)(C)C", 972},
	{"C=C", 4}, {"c1ccccc1", 12}, {"Cc1ccccc1", 6}, {"C1CCCCC1", 6}, {"O", 2}, {"O=C=O", 2},
	{"CC(C)=O", 18}, {"CO", 3}, {"CCO", 3}, {"COC", 18}, {"C=O", 2}, {"C#C", 2}, {"CC=C", 3},
	{"c1ccc2ccccc2c1", 4}, {"C/C=C/C", 18}, {"C/C=C\\C", 18}, {"C=C=C", 4}, {"C1CC1", 6}, {"N", 3},
	{"CN(C)C", 81}, {"Cc1ccc(C)cc1", 36}, {"C1COCCO1", 2}, {"C[CH2]", 6}, {"[CH3]", 6},
	// sulfoxide S pyramidal (C_s: 1·3·3), sulfone S tetrahedral (C_2v: 2·3·3),
	// phosphine oxide C_3v (3·3³): lone pairs from the valence electrons
	{"CS(C)=O", 9}, {"O=S(C)C", 9}, {"CS(C)(=O)=O", 18}, {"CCS(=O)(=O)CC", 18}, {"CP(C)(C)=O", 81},
	// rigid polycyclics and cages (rotational subgroup of the point group)
	{"C1C2CC3CC1CC(C2)C3", 12}, // adamantane, T_d → T
	{"C12C3C4C1C5C2C3C45", 24}, // cubane, O_h → O
	{"C1CC2CCC1CC2", 6},        // bicyclo[2.2.2]octane, D_3h → D_3
	{"C1CC2CCC1C2", 2},         // norbornane, C_2v → C_2
	{"C1C2CCC1CC2", 2},         // norbornane, another spelling
	{"C1CC2CC1C2", 2},          // bicyclo[2.1.1]hexane, C_2v → C_2
	{"C1CC2C1C2", 1},           // bicyclo[2.1.0]pentane (housane), C_s: cis-fused only
	{"C1C2CC12", 2},            // bicyclo[1.1.0]butane, C_2v → C_2
	{"C1C2CC1C2", 6},           // bicyclo[1.1.1]pentane, D_3h → D_3
	{"C1CC12CC2", 4},           // spiropentane, D_2d → D_2
	{"C1CCC2CCCCC2C1", 2},      // decalin (trans C_2h / cis C_2)
	{"C1CC2CCCC2C1", 2},        // cis-bicyclo[3.3.0]octane, C_2v → C_2
	{"C1CC2CCC2C1", 1},         // cis-bicyclo[3.2.0]heptane, C_s
	{"C12C3C1C23", 12},         // tetrahedrane, T_d → T
	{"C1CC11CC1", 4},           // spiropentane, another spelling
	{"C1CC2(C1)CCC2", 4},       // spiro[3.3]heptane, D_2d → D_2
	{"C1CC2(C1)CCCC2", 2},      // spiro[3.4]octane, C_2v → C_2
	{"C1CCC2CCCCC2C1", 2},      // decalin, another spelling
	{"C12C3C4C5C1C6C7C2C8C3C9C4C%10C5C6C%11C7C8C9C%10%11", 60},                                                                                 // dodecahedrane, I_h → I
	{"c12c3c4c5c1c1c6c7c2c2c8c3c3c9c4c4c%10c5c5c1c1c6c6c%11c7c2c2c7c8c3c3c8c9c4c4c9c%10c5c5c1c1c6c6c%11c2c2c7c3c3c8c4c4c9c5c1c1c6c2c3c41", 60}, // C60, I_h → I
	{"C12C3C4C1C5C2C3C45", 24},                     // cubane again (cage rule)
	{"c1cc2ccc3ccc4ccc5ccc6ccc1c1c2c3c4c5c61", 12}, // coronene, D_6h (planar, not a cage)
	{"C1=CC2CCC1C2", 1},                            // norbornene, C_s
	{"C12C3C1C1C2C31", 6},                          // prismane, D_3h → D_3
	{"C1=CC2CCC1CC2", 2},                           // bicyclo[2.2.2]oct-2-ene, C_2v → C_2
	{"C1CC2CCCC(C1)C2", 2},                         // bicyclo[3.3.1]nonane, C_2v → C_2
	{"[H][H]", 2}, {"O=O", 2}, {"[C-]#[O+]", 1}, {"Cl", 1}, {"CCl", 3}, {"ClC(Cl)(Cl)Cl", 12},
	{"FC(F)F", 3}, {"C=CC=C", 2}, {"CC(C)=C", 18}, {"CC#C", 3},
	{"CC.CC", 2 * 18 * 18}, // two identical components: 2!·18²
	// hypervalent centres, by VSEPR shape (hypervalent.go): seesaw SF4 C_2v,
	// octahedral SF6 O_h → O, T-shaped ClF3 C_2v, square pyramidal ClF5 and
	// IF5 C_4v, pentagonal bipyramidal IF7 D_5h → D_5; SO2F2 (four domains)
	// stays with the tetrahedral rule, C_2v
	{"FS(F)(F)F", 2}, {"FS(F)(F)(F)(F)F", 24}, {"F[Cl](F)F", 2}, {"F[Cl](F)(F)(F)F", 4},
	{"F[I](F)(F)(F)F", 4}, {"F[I](F)(F)(F)(F)(F)F", 10}, {"O=S(=O)(F)F", 2},
	// the odd electron of a radical is a domain: SF5• square pyramidal C_4v;
	// identical hypervalent components multiply by k! (2!·24²)
	{"F[S](F)(F)(F)F", 4}, {"FS(F)(F)(F)(F)F.FS(F)(F)(F)(F)F", 2 * 24 * 24},
}

// TestHypervalentSigmaRefused: a hypervalent centre that is not the whole
// molecule, or whose ligands differ, gets no σ (the rule for atoms with at
// most four electron domains would give a wrong one: SF5Cl 120, CF3SF5 360).
func TestHypervalentSigmaRefused(t *testing.T) {
	// ligands with H have internal rotors the VSEPR σ leaves out: (CH3)4S
	// would be 2 where its methyl tops make it 162
	for _, smi := range []string{"FS(F)(F)(F)(F)Cl", "FC(F)(F)S(F)(F)(F)(F)F", "FS(F)(F)C", "CS(C)(C)C", "C[S+](C)(C)(C)C"} {
		_, err := parse(t, smi).SymmetryNumber()
		require.Error(t, err, smi)
		assert.Contains(t, err.Error(), "hypervalent centre", smi)
	}
}

func TestSymmetryNumberTable(t *testing.T) {
	for _, c := range sigmaCases {
		m := parse(t, c.smiles)
		s, err := m.SymmetryNumber()
		require.NoError(t, err, c.smiles)
		assert.Equal(t, c.sigma, s.Int64(), c.smiles)
	}
}

// TestSymmetryNumberBounded checks that highly symmetric inputs finish fast
// (the bound is checked by benchmarks; here only that they finish and give
// exact, non-overflowing numbers).
func TestSymmetryNumberBounded(t *testing.T) {
	tenEthanes := strings.TrimSuffix(strings.Repeat("CC.", 10), ".")
	m := parse(t, tenEthanes)
	s, err := m.SymmetryNumber()
	require.NoError(t, err)
	want := new(big.Int).MulRange(1, 10) // 10!
	want.Mul(want, new(big.Int).Exp(big.NewInt(18), big.NewInt(10), nil))
	assert.Equal(t, want.String(), s.String())

	// 40-carbon highly branched alkane: C(C(C(C)(C)C)(C(C)(C)C))… — all
	// methyl tops, σ far beyond int64 would be wrong to wrap around.
	tbu := "C(C)(C)C"
	big40 := "C(C(" + tbu + ")(" + tbu + ")" + tbu + ")(C(" + tbu + ")(" + tbu + ")" + tbu + ")(C(" + tbu + ")(" + tbu + ")" + tbu + ")C(" + tbu + ")(" + tbu + ")" + tbu
	m = parse(t, big40)
	require.Equal(t, 53, m.HeavyAtoms())
	s, err = m.SymmetryNumber()
	require.NoError(t, err)
	// centre T-symmetric: 12; each of 4 quaternary arms: 3; each of 12 tBu: 3;
	// 36 methyls: 3 each → 12·3^(4+12+36)
	want = new(big.Int).Mul(big.NewInt(12), new(big.Int).Exp(big.NewInt(3), big.NewInt(52), nil))
	assert.Equal(t, want.String(), s.String())

	// a cancelled context gives an error, never a number
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	_, err = parse(t, "C12C3C4C1C5C2C3C45").SymmetryNumberContext(ctx)
	require.Error(t, err)
	assert.True(t, errors.Is(err, context.Canceled))
	_ = time.Second
}

func TestOpticalIsomersMolecule(t *testing.T) {
	assert.Equal(t, 2, parse(t, "CCC(C)O").OpticalIsomers())
	assert.Equal(t, 1, parse(t, "CC[C@H](C)O").OpticalIsomers())
	assert.Equal(t, 1, parse(t, "CC(C)CC(C)C").OpticalIsomers())
	assert.Equal(t, 1, parse(t, "CCC(CC)C").OpticalIsomers())
	assert.Equal(t, 1, parse(t, "C1C2CC3CC1CC(C2)C3").OpticalIsomers(), "adamantane bridgeheads have two alike ring paths")
	// Configurationally stable heteroatom centres: a sulfoxide S with three
	// different partners and its lone pair, a phosphine P; not a sulfone S
	// (two alike O), not an amine N (fast inversion).
	assert.Equal(t, 2, parse(t, "CCS(C)=O").OpticalIsomers(), "ethyl methyl sulfoxide")
	assert.Equal(t, 1, parse(t, "CS(C)=O").OpticalIsomers())
	assert.Equal(t, 1, parse(t, "CCS(C)(=O)=O").OpticalIsomers())
	assert.Equal(t, 2, parse(t, "CCP(C)c1ccccc1").OpticalIsomers(), "ethylmethylphenylphosphine")
	assert.Equal(t, 1, parse(t, "CCN(C)CCC").OpticalIsomers(), "amine N inverts")
	assert.Equal(t, 4, parse(t, "CC(O)CS(C)=O").OpticalIsomers())
	assert.Equal(t, 1, parse(t, "CSSC").OpticalIsomers(), "a sulfide S (two lone pairs) is no stereo unit")
	assert.Equal(t, 1, parse(t, "CCSC").OpticalIsomers())
}

func TestCanonicalContext(t *testing.T) {
	m := parse(t, "C1C2CC3CC1CC(C2)C3")
	c, err := m.CanonicalContext(context.Background())
	require.NoError(t, err)
	assert.Equal(t, m.Canonical(), c)
	// an uncached copy with a cancelled context refuses instead of guessing
	p := *m
	p.Atoms = append([]Atom(nil), m.Atoms...)
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	_, err = p.CanonicalContext(ctx)
	assert.ErrorIs(t, err, context.Canceled)
}

// TestSymmetryWorkLimit checks that a search that runs out of its budget is
// an error wrapping ErrWorkLimit, never a number.
func TestSymmetryWorkLimit(t *testing.T) {
	for _, s := range []string{"C12C3C4C1C5C2C3C45", "C1C2CC3CC1CC(C2)C3", "CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C"} {
		m := parse(t, s)
		_, err := m.symmetryNumber(context.Background(), 10)
		require.Error(t, err, s)
		assert.ErrorIs(t, err, ErrWorkLimit, s)
		sg, err := m.symmetryNumber(context.Background(), DefaultSearchWork)
		require.NoError(t, err, s)
		assert.Positive(t, sg.Sign())
	}
}

// TestSymmetryNumberWrittenStereo checks that configurations written with
// @/@@ inside a rigid fragment are used: the two 1,4-dimethylcyclohexanes
// are trans (C_2h, σ_ext 2) and cis (C_s, σ_ext 1), so their σ differ by 2,
// and an unmarked spelling takes the more symmetric one.
func TestSymmetryNumberWrittenStereo(t *testing.T) {
	sigma := func(s string) int64 {
		v, err := parse(t, s).SymmetryNumber()
		require.NoError(t, err, s)
		return v.Int64()
	}
	a, b := sigma("C[C@H]1CC[C@H](C)CC1"), sigma("C[C@H]1CC[C@@H](C)CC1")
	assert.ElementsMatch(t, []int64{9, 18}, []int64{a, b})
	assert.Equal(t, int64(18), sigma("CC1CCC(C)CC1"))
	// cis/trans-1,2-dimethylcyclopropane: cis C_s (1), trans C_2 (2)
	c, d := sigma("C[C@H]1C[C@H]1C"), sigma("C[C@H]1C[C@@H]1C")
	assert.ElementsMatch(t, []int64{9, 18}, []int64{c, d})
}

// TestSymmetryNumberMeso checks the exchange of identical halves against
// written marks: (2R,3R)-2,3-dichlorobutane has a C2 axis (σ = 2·3·3), the
// meso form only a mirror or inversion centre (σ = 3·3).
func TestSymmetryNumberMeso(t *testing.T) {
	sigma := func(s string) int64 {
		v, err := parse(t, s).SymmetryNumber()
		require.NoError(t, err, s)
		return v.Int64()
	}
	// CIP labels from RDKit 2022.09: (S,S) and (S,R) = meso
	assert.Equal(t, int64(18), sigma("C[C@H](Cl)[C@H](C)Cl"), "(2S,3S)")
	assert.Equal(t, int64(9), sigma("C[C@H](Cl)[C@@H](C)Cl"), "meso")
	assert.Equal(t, int64(18), sigma("Cl[C@@H](C)[C@@H](Cl)C"), "(2S,3S) written from the other end")
	assert.Equal(t, int64(9), sigma("Cl[C@@H](C)[C@H](Cl)C"), "meso written from the other end")
	assert.Equal(t, int64(18), sigma("CC(Cl)C(C)Cl"), "unmarked: most symmetric")
	// a central CH2 between two marked centres: 2,4-pentanediol
	// (S,S) C2: 2·3·3; meso C_s: 3·3 (CIP labels from RDKit 2022.09)
	assert.Equal(t, int64(18), sigma("C[C@H](O)C[C@H](C)O"), "(2S,4S)")
	assert.Equal(t, int64(9), sigma("C[C@H](O)C[C@@H](C)O"), "meso")
	assert.Equal(t, int64(18), sigma("CC(O)CC(C)O"), "unmarked")
}

// Optical isomers count stereoisomers, not 2^centres: small bicycles keep
// their bridgeheads out,out, small fused rings are cis, cages are fixed,
// meso forms count once. Expected values: stereoisomers by hand from the
// geometric rule (common practice), cross-checked with RDKit stereoisomer
// enumeration with embedding (testdata/smiles/optical.tsv, see
// make_optical.py; RDKit also lists a trans-fused cyclobutane on
// norbornane for C1CC2CC1C1CCC21, which kiln's cis rule excludes).
func TestOpticalIsomersRingSystems(t *testing.T) {
	for _, c := range []struct {
		smi  string
		want int
	}{
		{"CC1CC2CCC1C2", 4},     // 2-methylnorbornane: exo/endo × enantiomers
		{"C1CC2CC1C1CCC21", 2},  // cyclobutane cis-fused on norbornane: exo, endo (both Cs)
		{"C1CC2C3CC1C3C2", 2},   // one chiral pair
		{"CC1C2CC2C1C", 4},      // 2,3-dimethylhousane
		{"OC1C2CC3C(C2)C13", 2}, // syn/anti OH on a chiral-free cage
		{"C12C3C4C5C1C6C7C8C2C9C3C%10C4C%11C5C6C%12C7C%13C8C9C%10C%11C%12%13", 1},
		{"C12C3C4C5C1C6C7C2C8C3C9C4C%10C5C6C%11C7C8C9C%10%11", 1}, // dodecahedrane
		{"C12C3C1C1C2C31", 1}, // prismane
		{"C12C3C4C5C1C1C6C7C2C2C8C3C3C9C4C4C%10C5C5C1C1C6C6C%11C7C2C2C7C8C3C3C8C9C4C4C9C%10C5C5C1C1C6C6C%11C2C2C7C3C3C8C4C4C9C5C1C1C6C2C3C41", 1}, // C60H60
		{"OC1C(O)C(O)C(O)C(O)C1O", 9}, // inositols: 8 achiral + 1 chiral pair
		{"CC12C3C4C1C5C2C3C45", 1},    // methylcubane
		{"C1C2CC3CC1CC(C2)C3", 1},     // adamantane
		{"CC(O)C(C)O", 3},             // R,R; S,S; meso
		{"C[C@H](O)[C@@H](C)O", 1},    // meso written
		{"C[C@H](O)[C@H](C)O", 1},     // one enantiomer written
		{"OC(C(O)C(O)=O)C(O)=O", 3},   // tartaric acid
		{"CC1CCC(C)CC1", 2},           // cis, trans
		{"CC1CCCC2CCCCC12", 8},        // decalin fusion may be trans
	} {
		n, err := parse(t, c.smi).OpticalIsomersContext(context.Background())
		require.NoError(t, err, c.smi)
		assert.Equal(t, c.want, n, c.smi)
	}
}

// A radical or cation centre conjugated with a π system is planar and part
// of the rigid fragment (no free CH2 top); cumulenes with an odd number of
// double bonds are planar, with an even number twisted. Point groups:
// common practice (textbook structures).
func TestSymmetryConjugatedRadicalsCumulenes(t *testing.T) {
	for _, c := range []struct {
		smi  string
		want int64
	}{
		{"[CH2]c1ccccc1", 2},   // benzyl C2v
		{"[CH2+]c1ccccc1", 2},  // benzyl cation C2v
		{"C=C[CH2]", 2},        // allyl C2v
		{"[CH2]C=CC=C", 2},     // pentadienyl C2v, either spelling
		{"C=C[CH]C=C", 2},      //
		{"[CH2]C(=O)C", 3},     // acetonyl: planar CH2, methyl top 3
		{"[CH2]C(C)=C", 6},     // 2-methylallyl: C2v × methyl 3
		{"C=C(C=C)[CH2]", 2},   // cross-conjugated ends differ from CH2
		{"C[CH2]", 6},          // ethyl: no π system, CH2 stays a top
		{"C=C=C=C", 4},         // butatriene D2h
		{"C=C=C", 4},           // allene D2d
		{"C=C=C=C=C", 4},       // pentatetraene D2d
		{"FC(F)=C=C=C(F)F", 4}, // D2h
		{"C=C", 4},
	} {
		s, err := parse(t, c.smi).SymmetryNumber()
		require.NoError(t, err, c.smi)
		assert.Equal(t, c.want, s.Int64(), c.smi)
	}
}

// A carbon radical centre with two or more fluorines is pyramidal
// (PyramidalRadical): CF3• C3v σ 3, CHF2• Cs σ 1, CF3CF2• and CH3CF2• 3 (the
// CX3 top only). One fluorine (CH2F•, weakly pyramidal, very low inversion
// barrier), chlorine only (CCl3•, nearly planar) and alkyl centres stay
// planar; so does a CF2 centre conjugated with a double bond (allylic,
// planar with the π system). Point groups from common structural chemistry
// (Bent's rule; the pyramidal fluoromethyl radicals).
func TestPyramidalRadicalSigma(t *testing.T) {
	for _, c := range []struct {
		smiles string
		sigma  int64
	}{
		{"F[C](F)F", 3}, {"F[CH]F", 1}, {"FC(F)(F)[C](F)F", 3}, {"F[C](F)C(F)(F)F", 3},
		{"C[C](F)F", 3}, {"FC[C](F)F", 1}, {"F[C](F)Cl", 1},
		{"[CH2]F", 2}, {"C[CH]F", 3}, {"Cl[C](Cl)Cl", 6}, {"Cl[CH]Cl", 2}, {"F[C](Cl)Cl", 2},
		{"[CH3]", 6}, {"C[C](C)C", 162}, {"FC(F)=C[C](F)F", 2},
	} {
		m, err := ParseSMILES(c.smiles)
		require.NoError(t, err, c.smiles)
		s, err := m.SymmetryNumber()
		require.NoError(t, err, c.smiles)
		assert.Equal(t, c.sigma, s.Int64(), c.smiles)
		assert.Equal(t, 1, m.OpticalIsomers(), "%s: a radical centre is no stereo unit", c.smiles)
	}
}

// A vinyl-type σ radical is bent at the radical carbon: the partners on
// the other end are cis and trans to its singly occupied orbital (vinyl Cs,
// σ 1, as NIST-JANAF's C2H3), while a π radical next to a double bond
// (allyl, propargyl) stays a planar delocalised unit and an aryl σ radical
// keeps its ring's symmetry.
func TestVinylRadicalSigma(t *testing.T) {
	for _, c := range []struct {
		smiles string
		sigma  int64
	}{
		{"C=[CH]", 1}, {"C=[C]C", 3}, {"ClC(Cl)=[C]Cl", 1}, {"FC(F)=[C]F", 1}, {"CC(C)=[CH]", 9},
		{"C=C[CH2]", 2}, {"C#C[CH2]", 2}, {"c1ccc[c]c1", 2}, {"C=C", 4}, {"C=N", 1},
	} {
		m, err := ParseSMILES(c.smiles)
		require.NoError(t, err, c.smiles)
		s, err := m.SymmetryNumber()
		require.NoError(t, err, c.smiles)
		assert.Equal(t, c.sigma, s.Int64(), c.smiles)
	}
}
