// Package molecule holds the molecular graph that every estimate starts from:
// atoms with their implicit hydrogens, bonds with Kekulé orders and aromatic
// flags, rings, radical centres, identity (a canonical form) and graph symmetry.
// It reads OpenSMILES (see ParseSMILES) and does no I/O.
package molecule

import (
	"slices"
	"sync"
)

// Atom is one heavy (or explicitly written) atom of the graph. Hydrogens that
// are implicit in the SMILES are not atoms of the graph: they are counted in
// HCount. Explicit [H] atoms attached to a heavy atom are folded into HCount of
// their neighbour; only H atoms that stand alone ([H][H], [H]) remain atoms.
type Atom struct {
	Element   string // element symbol, capitalised: "C", "O", "Cl", "Se"
	Isotope   int    // mass number, 0 when unspecified
	Charge    int    // formal charge
	HCount    int    // total attached hydrogens (implicit + bracket count + folded explicit H)
	Aromatic  bool   // member of an aromatic ring after perception
	Radical   int    // number of unpaired electrons on this atom (0, 1, 2 …)
	Chirality string // "", "@", "@@" (other OpenSMILES classes kept verbatim)
	Class     int    // atom class (the :n in a bracket atom), 0 when absent
	Pos       int    // byte offset of the atom's first character in the SMILES
	Len       int    // byte length of the atom's token in the SMILES
}

// Bond joins atoms A and B (indices into Molecule.Atoms). Order is the Kekulé
// order 1, 2, 3 or 4 — aromatic bonds carry the order of one Kekulé structure
// and Aromatic=true after perception. Stereo is '/', '\\' or 0 as written
// next to the bond; A and B are in written direction, so the bond reads
// "A Stereo B" (for a ring closure whose symbol stands only at the closing
// digit, A is the closing atom).
type Bond struct {
	A, B     int
	Order    int
	Aromatic bool
	Stereo   byte
	Pos      int // byte offset of the bond symbol or of the later atom when implicit
}

// Molecule is a molecular graph: possibly several '.'-separated components.
//
// A Molecule from ParseSMILES is meant to be read-only: its canonical forms
// and symmetry classes are computed once, on first use, and then shared by
// all goroutines. If Atoms or Bonds are changed or replaced afterwards (or a
// changed copy is made), the cached results no longer match and are
// recomputed on every call instead.
type Molecule struct {
	Atoms []Atom
	Bonds []Bond
	// Adj[i] lists the indices into Bonds of the bonds at atom i.
	Adj [][]int
	// SMILES is the input text the molecule was read from.
	SMILES string

	// nbrOrder[i], for atoms written with chirality, lists the neighbours in
	// written order with -1 for a hydrogen (OpenSMILES chirality reference).
	nbrOrder [][]int
	// rings is the SSSR (atom indices in ring order); cycles the relevant
	// cycles used for aromaticity; ringSys the fused/bridged ring systems.
	rings   [][]int
	cycles  [][]int
	ringSys [][]int

	// derived caches results computed from the graph (nil for a Molecule
	// not made by ParseSMILES). It is a pointer so that copies of a
	// Molecule share it; it records the graph it was computed for.
	derived *derived
}

// derived holds the graph-dependent results that callers ask for again and
// again. atoms and bonds are snapshots taken at parse time: the cache serves
// only a Molecule whose Atoms and Bonds still equal them.
type derived struct {
	atoms []Atom
	bonds []Bond

	once    sync.Once
	info    symmetryInfo // symmetry(DefaultSearchWork, true)
	canon   string
	classes []int

	stereoOnce  sync.Once
	canonStereo string
}

// newDerived snapshots m's graph for the cache.
func newDerived(m *Molecule) *derived {
	return &derived{atoms: slices.Clone(m.Atoms), bonds: slices.Clone(m.Bonds)}
}

// cache returns the computed cache of m, or nil when m has none or its
// graph changed since parsing.
func (m *Molecule) cache() *derived {
	d := m.derived
	if d == nil || !slices.Equal(d.atoms, m.Atoms) || !slices.Equal(d.bonds, m.Bonds) {
		return nil
	}
	d.once.Do(func() {
		d.info = m.symmetry(DefaultSearchWork, true)
		d.canon = m.writeSMILES(d.info.labels, false)
		d.classes = orbitClasses(len(m.Atoms), d.info.gens, d.info.labels)
	})
	return d
}

// Other returns the atom at the other end of bond b from atom i.
func (m *Molecule) Other(b, i int) int {
	if m.Bonds[b].A == i {
		return m.Bonds[b].B
	}
	return m.Bonds[b].A
}
