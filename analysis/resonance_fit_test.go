package analysis

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
)

// TestResonanceSpellingsOneFit: every spelling of one species — its
// resonance structures written with the radical on different atoms
// (testdata/tester3/res.kiln and more), and random atom orders of each —
// gives the same thermochemistry, not only at 298–1500 K but also the
// classical limits, the Wilhoit tail the reaction checks follow above
// 1500 K, and the NASA-7 polynomial `fill` writes, bit for bit. Before the
// limits were taken from the estimated resonance structure
// (shapeStructure), vinoxy and benzyl got different rotor counts, hence
// different limits, tails and fits, from their two spellings. Each
// spelling is estimated in a fresh workspace so that no cache can hide a
// difference.
func TestResonanceSpellingsOneFit(t *testing.T) {
	groups := [][]string{
		{"[CH2]C=O", "C=C[O]"},                                                  // vinoxy
		{"[CH2]C=C", "C=C[CH2]"},                                                // allyl
		{"[CH2]c1ccccc1", "C=C1C=CC=C[CH]1", "C=C1C=C[CH]C=C1"},                 // benzyl
		{"[CH2]C#C", "C=C=[CH]"},                                                // propargyl
		{"[O]c1ccccc1", "O=C1C=CC=C[CH]1", "O=C1C=C[CH]C=C1"},                   // phenoxy
		{"[CH2]C=CC=C", "C=C[CH]C=C", "C=CC=C[CH2]"},                            // pentadienyl
		{"C[CH]C=C", "CC=C[CH2]"},                                               // 1-methylallyl
		{"[CH2]C(=O)C", "C=C([O])C"},                                            // acetonyl
		{"CC(C)=C[CH2]", "C[C](C)C=C"},                                          // prenyl
		{"c1ccccc1-c1ccccc1", "C1=CC=C(C=C1)C1=CC=CC=C1", "c1ccc(cc1)c1ccccc1"}, // biphenyl
	}
	r := rand.New(rand.NewPCG(4, 12))
	type thermo struct {
		cp0, cpInf     float64
		tail           [3]float64 // Cp, H, S of the reaction checks' model at 2500 K
		low, high      [7]float64
		hf, s          float64
		cp             [7]float64
		form, fitError string
	}
	get := func(smi string) thermo {
		m, err := molecule.ParseSMILES(smi)
		require.NoError(t, err, smi)
		ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fmt.Errorf("no includes") }, DefaultSettings())
		e, err := ws.EstimateMolecule(m, EstimateOptions{})
		require.NoError(t, err, smi)
		th := e.Thermo()
		x := thermo{cp0: e.cp0, cpInf: e.cpInf, hf: e.Hf298, s: e.S298, cp: e.Cp}
		c := e.curve()
		x.tail = [3]float64{c.Cp(2500), th.H(2500), th.S(2500)}
		p, _, err := e.NASA7()
		if err != nil {
			x.fitError = err.Error()
		}
		x.low, x.high = p.Low, p.High
		if e.Group != nil {
			x.form = e.Group.Form
		}
		return x
	}
	for _, g := range groups {
		ref := get(g[0])
		require.Empty(t, ref.fitError, g[0])
		var spellings []string
		for _, smi := range g {
			spellings = append(spellings, smi)
			m, err := molecule.ParseSMILES(smi)
			require.NoError(t, err)
			for range 3 {
				spellings = append(spellings, randomSpelling(m, r))
			}
		}
		for _, smi := range spellings[1:] {
			got := get(smi)
			assert.Equal(t, ref, got, "%s and %s are one species", g[0], smi)
		}
	}
}

// TestResonanceRotors: a bond is an internal rotor only if it is single in
// every resonance structure of the species; one that is double in some
// structure (allylic, benzylic, enoxy C–C) is a stiff torsion. Closed-shell
// molecules and radicals with one structure count as before.
func TestResonanceRotors(t *testing.T) {
	for _, c := range []struct {
		smi    string
		rotors int
	}{
		{"[CH2]C=C", 0},      // allyl: both C–C bonds are double in one structure
		{"C=C[O]", 0},        // vinoxy
		{"[CH2]c1ccccc1", 0}, // benzyl: ring–CH2 is double in the quinoid structures
		{"C[CH]C=C", 1},      // 1-methylallyl: the CH3–CH bond is single throughout
		{"CC[CH]C=C", 2},     // 1-ethylallyl: CH3–CH2 and CH2–CH
		{"[CH2]C(=O)C", 1},   // acetonyl: CH3–C only
		{"CCC", 2},           // propane: two methyl tops
		{"CC[CH2]", 2},       // propyl: one structure
		{"Cc1ccccc1", 1},     // toluene
		{"C=CC=C", 1},        // butadiene: closed shell, counted as before
	} {
		m, err := molecule.ParseSMILES(c.smi)
		require.NoError(t, err)
		_, _, rotors := shape(m)
		assert.Equal(t, c.rotors, rotors, c.smi)
	}
}
