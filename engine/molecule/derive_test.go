package molecule

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestClosedShellParent(t *testing.T) {
	for _, c := range [][2]string{
		{"CC[CH2]", "CCC"}, {"[c]1ccccc1", "c1ccccc1"}, {"O=C1[CH]CCC1", "O=C1CCCC1"},
		{"[CH2]", "C"}, {"C1CC[CH]C1", "C1CCCC1"}, {"CCO", "CCO"},
	} {
		m := parse(t, c[0])
		p := m.ClosedShellParent()
		want := parse(t, c[1])
		assert.Equal(t, want.Canonical(), p.Canonical(), c[0])
		assert.Equal(t, len(want.Rings()), len(p.Rings()), c[0])
		assert.Equal(t, want.RingSystemInfo(), p.RingSystemInfo(), c[0])
		for i := range p.Atoms {
			assert.Equal(t, want.Atoms[i].Aromatic, p.Atoms[i].Aromatic, "%s atom %d", c[0], i)
		}
		sw, err := want.SymmetryNumber()
		require.NoError(t, err)
		sp, err := p.SymmetryNumber()
		require.NoError(t, err)
		assert.Equal(t, sw, sp, c[0])
		// the original is untouched
		assert.Equal(t, parse(t, c[0]).Canonical(), m.Canonical())
	}
}

func TestWithHydrogenAdded(t *testing.T) {
	m := parse(t, "[CH2]C[CH2]")
	p, err := m.WithHydrogenAdded(0)
	require.NoError(t, err)
	assert.Equal(t, parse(t, "CC[CH2]").Canonical(), p.Canonical())
	assert.Equal(t, 1, p.UnpairedElectrons())
	_, err = m.WithHydrogenAdded(1)
	assert.ErrorContains(t, err, "no radical electron")
	_, err = m.WithHydrogenAdded(7)
	assert.ErrorContains(t, err, "out of range")
}

// TestResonanceKeepsRing builds the enoxy resonance structure of a ring
// α-carbonyl radical and checks it is the molecule written that way, ring
// data included.
func TestResonanceKeepsRing(t *testing.T) {
	m := parse(t, "O=C1[CH]CCC1") // atoms: O0 C1 C2(radical) C3 C4 C5
	co := m.BondBetween(0, 1)
	cc := m.BondBetween(1, 2)
	alt, err := m.WithBondOrders(map[int]int{co: 1, cc: 2}, map[int]int{0: 1, 2: 0})
	require.NoError(t, err)
	want := parse(t, "[O]C1=CCCC1")
	assert.Equal(t, want.Canonical(), alt.Canonical())
	assert.Equal(t, want.RingSystemInfo(), alt.RingSystemInfo())
	require.Len(t, alt.Rings(), 1)
	assert.Len(t, alt.Rings()[0], 5)
	assert.Equal(t, []int{5}, alt.RingSizes(1))
	// valence must be kept
	_, err = m.WithBondOrders(map[int]int{cc: 2}, nil)
	assert.ErrorContains(t, err, "valence")
	_, err = m.WithBondOrders(map[int]int{99: 1}, nil)
	assert.ErrorContains(t, err, "out of range")
}

// WithCharges rewrites a charge-separated unit as its neutral structure
// (same canonical form as the neutral spelling) and refuses changes that
// alter the net charge or break a valence.
func TestWithCharges(t *testing.T) {
	m, err := ParseSMILES("C[N+](=O)[O-]")
	require.NoError(t, err)
	n := -1
	for i, a := range m.Atoms {
		if a.Element == "N" {
			n = i
		}
	}
	var o, b = -1, -1
	for _, bb := range m.Adj[n] {
		j := m.Other(bb, n)
		if m.Atoms[j].Charge == -1 {
			o, b = j, bb
		}
	}
	require.GreaterOrEqual(t, o, 0)
	d, err := m.WithCharges(map[int]int{n: 0, o: 0}, map[int]int{b: 2})
	require.NoError(t, err)
	want, err := ParseSMILES("CN(=O)=O")
	require.NoError(t, err)
	assert.Equal(t, want.Canonical(), d.Canonical())
	assert.Equal(t, 1, m.Atoms[n].Charge, "the original is unchanged")

	_, err = m.WithCharges(map[int]int{n: 0}, nil)
	assert.ErrorContains(t, err, "net charge")
	_, err = m.WithCharges(map[int]int{n: 0, o: 0}, nil)
	assert.ErrorContains(t, err, "valence")
}
