package benson

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
)

// The bound must be a bound: no measured S°298 of the reference sets lies
// below it (σ from the structure, multiplicity from its unpaired electrons).
func TestEntropyFloorBelowReference(t *testing.T) {
	n := 0
	margin, closest := math.Inf(1), ""
	defer func() { t.Logf("%d rows; smallest margin S° − floor %.1f J/(mol K) (%s)", n, margin, closest) }()
	check := func(name, smiles string, sRef float64) {
		if math.IsNaN(sRef) {
			return
		}
		m, err := molecule.ParseSMILES(smiles)
		require.NoError(t, err, name)
		sy := symmetryOf(t.Context(), m)
		require.NoError(t, sy.err, name)
		floor := entropyFloor(m, lnBig(sy.exact), m.UnpairedElectrons()+1)
		assert.LessOrEqual(t, floor, sRef*calorie, "%s (%s): floor %.1f above the measured S° %.1f J/(mol K)", name, smiles, floor, sRef*calorie)
		if d := sRef*calorie - floor; d < margin {
			margin, closest = d, name
		}
		n++
	}
	for _, file := range []string{"train", "heldout"} {
		for _, r := range readRef(t, "../../testdata/thermo/"+file+".tsv") {
			check(r.name, r.smiles, r.s)
		}
	}
	for _, r := range readRadicals(t) {
		check(r.name, r.smiles, r.s)
	}
	assert.GreaterOrEqual(t, n, 55, "reference rows with S°")
}

// The Sackur–Tetrode entropy of a bare atom is its whole S° (argon: 154.85
// J/(mol K) at 1 bar, NIST-JANAF, from memory).
func TestTranslationalEntropy(t *testing.T) {
	assert.InDelta(t, 154.85, translationalEntropy(39.948), 0.05)
}

// A cage whose ring system has no whole-system S° or Cp is flagged for both,
// with a widened S° uncertainty; a group sum below the physical bound is
// flagged as unusable. The rule holds for every table row without S°, not
// for one species.
func TestRingSystemEntropyFlags(t *testing.T) {
	l := lookupTable(nil)
	for _, sys := range l.systems {
		if sys.hasS {
			continue
		}
		t.Run(sys.name, func(t *testing.T) {
			// The parent with every ring hydrogen kept: the table's SMILES.
			m, err := molecule.ParseSMILES(sys.parent.m.Canonical())
			require.NoError(t, err)
			e, err := Estimate(m, Options{})
			require.NoError(t, err)
			var groups []string
			for _, ms := range e.Missing {
				groups = append(groups, ms.Group)
			}
			assert.Contains(t, groups, ringSystemEntropyGroup+sys.name)
			assert.Greater(t, e.UncertaintyS298, 0.0)
			floor, below := e.EntropyFloor()
			assert.Greater(t, floor, 0.0)
			assert.Equal(t, below, e.S298 < floor-0.01)
			if below {
				assert.Contains(t, groups, EntropyFloorGroup)
			}
		})
	}
}

// Cubane's group sum (8 C-(C)3(H) and five cyclobutane rings) gives S°298
// below what translation and rotation alone give; it must be flagged.
func TestCubaneEntropyFlagged(t *testing.T) {
	m, err := molecule.ParseSMILES("C12C3C4C1C5C2C3C45")
	require.NoError(t, err)
	e, err := Estimate(m, Options{})
	require.NoError(t, err)
	floor, below := e.EntropyFloor()
	require.True(t, below, "S° %.1f, floor %.1f", e.S298, floor)
	found := false
	for _, ms := range e.Missing {
		if ms.Group == EntropyFloorGroup {
			found = true
			assert.True(t, strings.Contains(ms.Note, "Sackur–Tetrode"))
		}
	}
	assert.True(t, found)
}

// An ordinary estimate is not flagged, and ΔHf°'s uncertainty is not
// widened by the S°/Cp-only flags.
func TestEntropyFlagsLeaveHfUncertainty(t *testing.T) {
	m, err := molecule.ParseSMILES("CCCC")
	require.NoError(t, err)
	e, err := Estimate(m, Options{})
	require.NoError(t, err)
	_, below := e.EntropyFloor()
	assert.False(t, below)
	assert.Zero(t, e.UncertaintyS298)
	assert.True(t, entropyOnly(Missing{Group: ringSystemEntropyGroup + "adamantane"}))
	assert.True(t, entropyOnly(Missing{Group: EntropyFloorGroup}))
}

// massMomentPairs is the pair-by-pair form of massMoment (quadratic), the
// reference the closed form is tested against.
func massMomentPairs(m *molecule.Molecule) (j, total float64) {
	type at struct {
		el     string
		mass   float64
		parent int // heavy atom an implicit H is bound to, else -1
	}
	var atoms []at
	hw, _ := molecule.AtomicWeight("H")
	for _, a := range m.Atoms {
		w, ok := molecule.AtomicWeight(a.Element)
		if !ok {
			w = 1
		}
		atoms = append(atoms, at{a.Element, w, -1})
	}
	for i, a := range m.Atoms {
		for range a.HCount {
			atoms = append(atoms, at{"H", hw, i})
		}
	}
	n := len(m.Atoms)
	order := make(map[[2]int]int, len(m.Bonds))
	for _, b := range m.Bonds {
		o := b.Order
		if b.Aromatic {
			o = 2 // between single and double: the double radius bounds it
		}
		order[[2]int{min(b.A, b.B), max(b.A, b.B)}] = o
	}
	for i := range atoms {
		total += atoms[i].mass
	}
	for i := range atoms {
		for k := i + 1; k < len(atoms); k++ {
			a, b := atoms[i], atoms[k]
			var d float64
			switch {
			case i < n && k < n:
				if o, ok := order[[2]int{i, k}]; ok {
					d = 0.9 * (radius(a.el, o) + radius(b.el, o))
				} else {
					d = radius(a.el, 1) + radius(b.el, 1)
				}
			case k >= n && b.parent == i:
				d = 0.9 * (radius(a.el, 1) + radius(b.el, 1))
			default:
				d = radius(a.el, 1) + radius(b.el, 1)
			}
			j += a.mass * b.mass * d * d
		}
	}
	return j / total, total
}

// TestMassMomentClosedForm: the linear-time massMoment equals the
// pair-by-pair sum on molecules with rings, aromatic bonds, multiple bonds,
// explicit hydrogens, heteroatoms and an element without a radius.
func TestMassMomentClosedForm(t *testing.T) {
	for _, smi := range []string{"[H][H]", "C", "CCO", "c1ccccc1", "C#CC=C", "C12C3C4C1C5C2C3C45", "ClC(Cl)=C(F)Br",
		"CC(=O)N(C)c1ccncc1", "O=S(=O)(C)C", "[2H]C([2H])([2H])O", "C[Si](C)(C)C", "[CH2]C=CC[O]", "CCCCCCCCCCCCCCCCCCCC"} {
		m, err := molecule.ParseSMILES(smi)
		require.NoError(t, err, smi)
		j, total := massMoment(m)
		wantJ, wantTotal := massMomentPairs(m)
		assert.InDelta(t, wantTotal, total, 1e-9*wantTotal, smi)
		assert.InDelta(t, wantJ, j, 1e-9*wantJ, smi)
	}
}
