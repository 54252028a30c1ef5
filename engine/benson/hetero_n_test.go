package benson

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Pyrrole-type ring nitrogen, enamine nitrogen and N-substituted amides
// (groups_n.tsv) take their own groups, without approximation.
func TestNitrogenGroupsAssigned(t *testing.T) {
	cases := []struct {
		smiles string
		groups []string
	}{
		{"c1cc[nH]c1", []string{"Cd-(N)(H)", "Cd-(Cd)(H)", "N-(Cd)2(H)"}},
		{"Cn1cccc1", []string{"C-(N)(H)3", "Cd-(N)(H)", "Cd-(Cd)(H)", "N-(Cd)2(C)"}},
		{"Cc1ccc[nH]1", []string{"C-(Cd)(H)3", "Cd-(N)(C)", "Cd-(N)(H)", "Cd-(Cd)(H)", "N-(Cd)2(H)"}},
		{"C=CNC", []string{"Cd-(H)2", "Cd-(N)(H)", "N-(Cd)(C)(H)", "C-(N)(H)3"}},
		{"C=CN", []string{"Cd-(H)2", "Cd-(N)(H)", "N-(Cd)(H)2"}},
		{"C=CN(C)C", []string{"Cd-(H)2", "Cd-(N)(H)", "N-(Cd)(C)2", "C-(N)(H)3"}},
		{"CN(C)C=O", []string{"C-(N)(H)3", "CO-(N)(H)", "N-(CO)(C)2"}},
		{"CNC(C)=O", []string{"C-(N)(H)3", "CO-(N)(C)", "N-(CO)(C)(H)", "C-(CO)(H)3"}},
	}
	for _, c := range cases {
		e := heteroEstimate(t, c.smiles)
		assert.ElementsMatch(t, c.groups, groupNames(e), c.smiles)
		for _, m := range e.Missing {
			assert.True(t, entropyOnly(m), "%s: unexpected approximation %+v", c.smiles, m)
		}
	}
}

// The pyrrole ring correction was derived from 1-methylpyrrole
// (corrections_n.tsv), which it therefore reproduces; its S° and Cp come
// from pyrrole's rigid-rotor harmonic-oscillator values (rrho_test.go) and
// carry no flag: the ΔHf° uncertainty is the class's.
func TestPyrroleRing(t *testing.T) {
	e := heteroEstimate(t, "Cn1cccc1")
	assert.InDelta(t, 24.6, e.Hf298/calorie/1000, 0.005, "1-methylpyrrole is the molecule ring:pyrrole was derived from")
	names := map[string]bool{}
	for _, c := range e.Corrections {
		names[c.Name] = true
	}
	assert.True(t, names["ring strain: pyrrole"], "corrections %v", e.Corrections)
	require.Empty(t, e.Missing)
	plain := heteroEstimate(t, "CN(C)C") // trimethylamine: same class, no approximation
	require.Empty(t, plain.Missing)
	assert.InDelta(t, plain.Uncertainty, e.Uncertainty, 1e-9, "the ΔHf° uncertainty of the class")

	// Spelled with the N written first, or Kekulé, the same estimate.
	for _, smi := range []string{"n1(C)cccc1", "CN1C=CC=C1"} {
		o := heteroEstimate(t, smi)
		assert.InDelta(t, e.Hf298, o.Hf298, 1e-6, smi)
		assert.InDelta(t, e.S298, o.S298, 1e-6, smi)
	}

	// A pyrrole ring fused to a benzene ring (indole) is not the ring the
	// correction was derived from: the ring is flagged as approximated.
	ind := heteroEstimate(t, "c1ccc2[nH]ccc2c1")
	for _, c := range ind.Corrections {
		assert.NotEqual(t, "ring strain: pyrrole", c.Name, "indole")
	}
	ringFlag := false
	for _, x := range ind.Missing {
		ringFlag = ringFlag || strings.HasPrefix(x.Group, "ring:")
	}
	assert.True(t, ringFlag, "indole's five-membered ring is flagged: %+v", ind.Missing)
}

// Ring nitrogens without a value stay refused, naming what is missing:
// azole "=N–" outside the derived groups (azole.go: N=N in the ring, next to
// the donor O, fused to benzene) and an amide N bonded to two acyl groups.
func TestNitrogenStillRefused(t *testing.T) {
	for smi, want := range map[string]string{
		"c1c[nH]nn1":        "azole ring nitrogen double-bonded",
		"c1cnoc1":           "Naz-(O)",
		"c1ccc2[nH]cnc2c1":  "Cb-(Naz)",
		"CN(C=O)C=O":        "N-(CO)2(C)",
		"C/N=N\\C":          "cis azo nitrogen",
		"CN=O":              "NO-(C)",
		"N=Cc1ccccc1":       "Cb-(CdN)",
		"C=C=N":             "cumulated C=N",
		"CC=NO":             "O-(NI)(H)",
		"C=C[N+]#[C-]":      "Cd-(NC)(H)",
		"CN(C)[N+](=O)[O-]": "NO2-(N)",
		"C=C[N+](=O)[O-]":   "Cd-(NO2)(H)",
		"c1ccnnc1":          "Nbb",
	} {
		_, err := Estimate(parse(t, smi), Options{})
		if assert.Error(t, err, smi) {
			assert.Contains(t, err.Error(), want, smi)
		}
	}
}

// Symmetry numbers and optical isomers of the nitrogen classes: external
// rotation times internal rotors (methyl 3, tert-butyl 3, phenyl 2); the
// planar N–H and N=N, C=N frames add no external symmetry of their own
// beyond the point group (trans azo C2h and cis azo C2v: 2; imines Cs: 1).
func TestNitrogenSymmetry(t *testing.T) {
	cases := []struct {
		smiles   string
		sigma, n int
	}{
		{"C/N=N/C", 18, 1},  // trans-azomethane: C2h 2 × 3 × 3
		{"C/N=N\\C", 18, 1}, // cis-azomethane: C2v 2 × 3 × 3
		{"CC(C)(C)/N=N/C(C)(C)C", 2 * 9 * 729, 1},
		{"c1ccc(cc1)/N=N/c1ccccc1", 8, 1}, // trans-azobenzene: C2h 2 × 2 × 2
		{"C=N", 1, 1},                     // methanimine: Cs
		{"C/C=N/C", 9, 1},                 // (E)-N-methylethanimine: Cs, two methyls
		{"C/C=N\\C", 9, 1},                // (Z)
		{"CC(C)=N", 9, 1},                 // propan-2-imine: the N–H removes the C2
		{"c1cc[nH]c1", 2, 1},              // pyrrole C2v
		{"Cn1cccc1", 6, 1},
		{"CN(C)C=O", 9, 1}, // DMF: planar, the two N-methyls differ
		{"O=Nc1ccccc1", 2, 1},
		{"CC(N)/N=N/C", 9, 2}, // one stereocentre
	}
	for _, c := range cases {
		m := parse(t, c.smiles)
		assert.Equal(t, c.sigma, SymmetryNumber(m), "σ of %s", c.smiles)
		assert.Equal(t, c.n, OpticalIsomers(m), "optical isomers of %s", c.smiles)
	}
	// The estimate's entropy carries −R ln σ for the estimated classes.
	e := heteroEstimate(t, "CN(C)C=O")
	assert.Equal(t, 9, e.SymmetryNumber)
	found := false
	for _, c := range e.Corrections {
		if strings.HasPrefix(c.Name, "symmetry") {
			found = true
			assert.InDelta(t, -R*math.Log(9), c.S298, 1e-9)
		}
	}
	assert.True(t, found, "DMF has a symmetry correction")
}

// A carbon radical site next to an amide N or a pyrrole-type ring N takes
// the α-amino increment, measured next to an amine N, and says so.
func TestNitrogenRadicalSiteNotes(t *testing.T) {
	for smi, want := range map[string]string{
		"[CH2]N(C)C=O": "amide N",
		"[CH2]n1cccc1": "pyrrole-type ring N",
		"CC(=O)N[CH2]": "amide N",
	} {
		e := heteroEstimate(t, smi)
		found := false
		for _, m := range e.Missing {
			found = found || strings.Contains(m.Group, want)
		}
		assert.True(t, found, "%s: %+v", smi, e.Missing)
	}
	e := heteroEstimate(t, "CN(C)[CH2]") // amine: the increment's own kind of site
	for _, m := range e.Missing {
		assert.True(t, entropyOnly(m), "%+v", m)
	}
}
