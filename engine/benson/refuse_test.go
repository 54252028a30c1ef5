package benson

import (
	"errors"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Structures no group can account for are refused with a reason, never
// estimated from the atoms that happen to have groups (or from nothing).
func TestRefusals(t *testing.T) {
	cases := []struct {
		smiles string
		opts   Options
		reason string // a word the message must contain
	}{
		{"F", Options{}, "no polyvalent atom"},
		{"Cl", Options{}, "no polyvalent atom"},
		{"[HH]", Options{}, "no polyvalent atom"},
		{"[H]", Options{}, "no polyvalent atom"},
		{"[Fe]", Options{}, "unsupported element Fe"},
		{"N#N=O", Options{}, "atom 2 (N) exceeds its valence: 5 bonds (triple bond to atom 1 (N), double bond to atom 3 (O)) where a neutral N has 3"},
		{"O=N#N", Options{}, "atom 2 (N) exceeds its valence: 5 bonds"},
		{"CN(C)(C)=O", Options{}, "atom 2 (N) exceeds its valence"},
		{"O=[Cl]=O", Options{}, "atom 2 (Cl) exceeds its valence: 4 bonds"},
		{"[Si]", Options{}, "unsupported element Si"},
		{"[SiH2]", Options{}, "unsupported element Si"},
		{"CP(C)C", Options{}, "unsupported element P"},
		{"[Si+]", Options{}, "unsupported element Si"},
		{"S=S", Options{}, "terminal atom"},
		{"[Li][Li]", Options{}, "unsupported element Li"},
		{"C$C", Options{}, "order 4"},
		// a triple bond inside a ring: no bent-C≡C group, no cycloalkyne or
		// aryne ring correction (the ring is named by its smallest size)
		{"C1#CCCCC1", Options{}, "atom 1 (C) is triple-bonded to atom 2 (C) inside a ring of 6 atoms"},
		{"c1ccc#cc1", Options{}, "inside a ring of 6 atoms"},
		{"C1#CC1", Options{}, "inside a ring of 3 atoms"},
		{"C1#CC2=C1O2", Options{}, "inside a ring of 4 atoms"},
		{"C1CCCCCC#CCCC1", Options{}, "inside a ring of 11 atoms"},
		{"C1=CC#CC=C1", Options{}, "inside a ring of 6 atoms"},
		// likewise a cumulated (allene) centre inside a ring, and a ring
		// radical whose every resonance structure has one
		{"C1=C=CCCC1", Options{}, "atom 2 (C) is a cumulated centre (double bonds to atoms 1 and 3) inside a ring of 6 atoms"},
		{"C1CC=C=C1", Options{}, "inside a ring of 5 atoms"},
		{"C1=C=CCCCCCC1", Options{}, "inside a ring of 9 atoms"},
		{"[CH]1C#CCCC1", Options{}, "inside a ring of 6 atoms"},
		{"[C]1=C=CCCC1", Options{}, "inside a ring of 6 atoms"},
		// cumulated ketenes: the Ck group needs an ordinary C=C end (ketene.go)
		{"O=C=C=C=O", Options{}, "atom 2 (C) is a cumulated carbon of C=C=O whose =C partner (atom 3) is itself cumulated"},
		{"O=C=C=O", Options{}, "is itself cumulated"},
		// Nitrile (CN), thiocarbonyl (CS) carbons: nameable centres whose
		// groups these molecules need are not in the tables (HCN, cyanogen
		// and CS2 are reference-library species; see hetero.go).
		{"C#N", Options{}, "no value and no approximation for group CN-(H)"},
		{"N#CC#N", Options{}, "no value and no approximation for group CN-(CN)"},
		{"C=S", Options{}, "no value and no approximation for group CS-(H)2"},
		{"S=C=S", Options{}, "no value and no approximation for group CS-(S)"},
		{"C[Si](C)(C)C", Options{}, "unsupported element Si"},
		{"C[SiH3]", Options{}, "unsupported element Si"},
		{"C[NH3+]", Options{}, "net charge +1"},
		// nitrogen (hetero_n.go): only N⁺–O⁻ units are read as N=O; other
		// charge separation, cis azo compounds and imines without a group
		// (oximes here) are refused.
		{"c1ccccc1[N+]#[C-]", Options{}, "no value and no approximation for group Cb-(NC)"},
		{"C[N+](C)(C)C.[Cl-]", Options{}, "2 disconnected parts"}, // a salt: two species, not a charge-separated one
		{"CC=NO", Options{}, "no value and no approximation for group O-(NI)(H)"},
		{"C/N=N\\C", Options{}, "cis azo nitrogen"},
		{"CCN=O", Options{}, "no value and no approximation for group C-(NO)(C)(H)2 (also missing: NO-(C))"},
		{"c1c[nH]nn1", Options{}, "1,2,3-triazole"},
		{"c1cnoc1", Options{}, "no value and no approximation for group Naz-(O)"},
		{"c1ccnnc1", Options{}, "no value and no approximation for group Nbb"},
		{"CN(C=O)C=O", Options{}, "no value and no approximation for group N-(CO)2(C)"},
		{"c1ccc2nnccc2c1", Options{}, "no value and no approximation for group Nbb"},
		{"O=O", Options{Multiplicity: 1}, "terminal atom"},
		{"CC", Options{Multiplicity: 3}, "multiplicity 3"},
		{"C[CH2]", Options{Multiplicity: 4}, "multiplicity 4 is not the one the structure implies (1 unpaired electron: multiplicity 2)"},
		{"[CH2]CC[CH2]", Options{Multiplicity: 1}, "multiplicity 1 is not the one the structure implies (2 unpaired electrons: multiplicity 3)"},
	}
	for _, c := range cases {
		t.Run(c.smiles, func(t *testing.T) {
			est, err := Estimate(parse(t, c.smiles), c.opts)
			require.Error(t, err, "%s estimated: %+v", c.smiles, est)
			assert.Contains(t, err.Error(), c.reason)
			var ue *UnsupportedError
			var me *MissingGroupError
			switch {
			case strings.HasPrefix(c.reason, "no value"):
				assert.True(t, errors.As(err, &me), "%T", err)
			case c.reason != "charge" && !strings.Contains(c.reason, "charge"):
				assert.True(t, errors.As(err, &ue), "%T", err)
			}
		})
	}
}

// Groups for a centre the built-in tables lack (here the thiocarbonyl
// carbon CS, with made-up test values) make that centre estimable with no
// other change: the support gate reads the loaded tables.
func TestSupportGateReadsTables(t *testing.T) {
	for _, c := range []struct {
		smiles, reason string
		user           []GroupValue
	}{
		{"CC(C)=S", "no value and no approximation for group CS-(C)2", []GroupValue{{Name: "CS-(C)2", Hf298: 1e3}, {Name: "C-(CS)(H)3", Hf298: -10e3}}},
		{"CCl", "no value and no approximation for group C-(Cl)(H)3", []GroupValue{{Name: "C-(Cl)(H)3", Hf298: -20e3}}},
	} {
		m := parse(t, c.smiles)
		_, err := Estimate(m, Options{})
		require.Error(t, err, c.smiles)
		assert.Contains(t, err.Error(), c.reason, c.smiles)
		e, err := Estimate(m, Options{UserGroups: c.user})
		require.NoError(t, err, c.smiles)
		// The made-up groups have no S°: the sum is below the physical
		// bound on S° and flagged so; no group is missing.
		for _, m := range e.Missing {
			assert.Equal(t, EntropyFloorGroup, m.Group, c.smiles)
		}
		want := 0.0
		for _, g := range e.Groups {
			want += g.Hf298
		}
		assert.InDelta(t, want, e.Hf298, 1e-9)
		assert.Equal(t, len(m.Atoms), coveredAtoms(t, e), c.smiles)
	}
}

// coveredAtoms checks that no atom is named by two group terms and returns
// how many atoms the group terms account for.
func coveredAtoms(t testing.TB, e *Result) int {
	t.Helper()
	seen := map[int]bool{}
	for _, g := range e.Groups {
		for _, a := range g.Atoms {
			if seen[a] {
				t.Errorf("atom %d counted twice", a+1)
			}
			seen[a] = true
		}
	}
	return len(seen)
}

// A ring radical and its resonance structure are one species: the derived
// form keeps its ring (and ring-strain term).
func TestRingRadicalResonance(t *testing.T) {
	for _, p := range [][2]string{
		{"O=C1[CH]CCC1", "[O]C1=CCCC1"},
		{"O=C1[CH]CCCC1", "[O]C1=CCCCC1"},
		{"CC(=O)[CH2]", "C=C([O])C"},
	} {
		a := estimate(t, p[0], Options{})
		b := estimate(t, p[1], Options{})
		assert.InDelta(t, b.Hf298, a.Hf298, 1e-6, p[0])
		assert.InDelta(t, b.S298, a.S298, 1e-9, p[0])
		for i := range a.Cp {
			assert.InDelta(t, b.Cp[i], a.Cp[i], 1e-9, p[0])
		}
	}
	e := estimate(t, "O=C1[CH]CCC1", Options{})
	ring := false
	for _, c := range e.Corrections {
		if strings.HasPrefix(c.Name, "ring strain") {
			ring = true
		}
	}
	assert.True(t, ring, "%+v", e.Corrections)
}

// Isotope-labelled species are refused with a reason, not estimated as
// their natural-abundance analogue.
func TestIsotopeRefused(t *testing.T) {
	for _, s := range []string{"[2H]C", "C[2H]", "[13CH3]C", "[2H]O[2H]", "[2H][2H]", "[2HH]", "[2H]"} {
		_, err := Estimate(parse(t, s), Options{})
		var ue *UnsupportedError
		require.ErrorAs(t, err, &ue, s)
		assert.Contains(t, ue.Reason, "isotope-labelled", s)
	}
}

// TestTerminalAtomRoute: a terminal atom no group accounts for is refused
// with the route (a thermo block), and a diatomic is told that no group can
// apply to it at all.
func TestTerminalAtomRoute(t *testing.T) {
	for smi, want := range map[string]string{
		"BrBr": "no atom with two heavy neighbours, so no group applies: give it a thermo block",
		"ClF":  "no atom with two heavy neighbours, so no group applies: give it a thermo block",
		"CS=S": "no group can name it: give the species a thermo block",
	} {
		_, err := Estimate(parse(t, smi), Options{})
		if assert.Error(t, err, smi) {
			assert.Contains(t, err.Error(), want, smi)
		}
	}
}

// TestHypervalentRefused: a centre with more than four electron domains
// (SF5Cl, CF3SF5, (CH3)2SF2, SOF4) is refused as such, naming the atom and
// no group (a group statement cannot name one: ParseGroupName takes
// two-coordinate S); sulfoxides, sulfones and nitro groups are not.
func TestHypervalentRefused(t *testing.T) {
	for _, c := range []struct {
		smi  string
		atom int
	}{{"FS(F)(F)(F)(F)Cl", 2}, {"FC(F)(F)S(F)(F)(F)(F)F", 5}, {"CS(C)(F)F", 2}, {"O=S(F)(F)(F)F", 2}} {
		_, err := Estimate(parse(t, c.smi), Options{})
		var ue *UnsupportedError
		require.ErrorAs(t, err, &ue, c.smi)
		assert.Equal(t, c.atom, ue.Atom, c.smi)
		assert.Contains(t, ue.Reason, "is a hypervalent centre", c.smi)
		_, perr := ParseGroupName("S-(F)5(Cl)")
		assert.Error(t, perr)
	}
	for _, smi := range []string{"CS(C)=O", "CS(C)(=O)=O", "C[N+](=O)[O-]", "C[S+](C)[O-]", "OS(=O)(=O)C"} {
		_, err := Estimate(parse(t, smi), Options{})
		if err != nil {
			assert.NotContains(t, err.Error(), "hypervalent", smi)
		}
	}
}
