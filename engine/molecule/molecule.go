// Package molecule holds the molecular graph that every estimate starts from:
// atoms with their implicit hydrogens, bonds with Kekulé orders and aromatic
// flags, rings, radical centres, identity (a canonical form) and graph symmetry.
// It reads OpenSMILES (see ParseSMILES) and does no I/O.
//
// Everything derived from a molecule depends only on its structure, never on
// how it was written: the canonical forms, symmetry classes, the symmetry
// number σ (SymmetryNumber, one bounded computation for every structure),
// optical isomers and the ring description (RingSystemInfo). Molecules are
// immutable; derived forms (closed-shell parent, resonance structures) come
// from constructors. Every per-structure computation is bounded: searches
// have a work budget and report ErrWorkLimit instead of guessing, and the
// Context variants honour cancellation.
package molecule

import "sync"

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
// A Molecule is immutable once built: Atoms, Bonds and Adj are exported for
// reading (m.Atoms[i].HCount, m.Bonds[b].Order) and must never be written.
// Derived forms — the closed-shell parent of a radical, a resonance
// structure with moved double bonds and radical sites — are made with the
// constructors ClosedShellParent, WithHydrogenAdded and WithBondOrders, which
// redo ring and aromaticity perception; copying the struct and editing the
// copy would keep stale ring and aromaticity data and is not supported.
// Build molecules with ParseSMILES or those constructors, never as struct
// literals (a literal has no rings).
//
// Canonical forms and symmetry are computed once, on first use, and then
// shared by all goroutines. As a guard against the unsupported copy-and-edit
// pattern, a copy whose Atoms or Bonds slice was replaced recomputes them
// instead of returning the original's.
type Molecule struct {
	Atoms []Atom
	Bonds []Bond
	// Adj[i] lists the indices into Bonds of the bonds at atom i. Derived
	// forms share it with their original (connectivity does not change).
	Adj [][]int
	// SMILES is the input text the molecule was read from.
	SMILES string

	// nbrOrder[i], for atoms written with chirality, lists the neighbours in
	// written order with -1 for a hydrogen (OpenSMILES chirality reference);
	// nil when no atom has a chirality mark.
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
// again. atoms and bonds identify the slices the cache was made for (their
// first elements and lengths): a copy of the Molecule with other slices does
// not use it. Keeping identities instead of copies costs no memory per atom.
type derived struct {
	atoms  *Atom
	natoms int
	bonds  *Bond
	nbonds int

	inRing []bool // ringBondFlags, set when the molecule is built

	once    sync.Once
	info    symmetryInfo // symmetry(DefaultSearchWork, true)
	classes []int        // orbitClasses of info

	// The canonical string is written only when asked for: estimates
	// need the symmetry, not the text.
	canonOnce sync.Once
	canon     string

	stereoOnce  sync.Once
	canonStereo string
}

func first[T any](s []T) *T {
	if len(s) == 0 {
		return nil
	}
	return &s[0]
}

// newDerived records m's graph slices for the cache.
func newDerived(m *Molecule) *derived {
	return &derived{atoms: first(m.Atoms), natoms: len(m.Atoms), bonds: first(m.Bonds), nbonds: len(m.Bonds)}
}

// cache returns the computed cache of m, or nil when m has none or its
// graph slices were replaced since it was built.
func (m *Molecule) cache() *derived {
	d := m.derived
	if d == nil || d.atoms != first(m.Atoms) || d.natoms != len(m.Atoms) || d.bonds != first(m.Bonds) || d.nbonds != len(m.Bonds) {
		return nil
	}
	d.once.Do(func() {
		d.info = m.symmetry(DefaultSearchWork, true)
		d.classes = orbitClasses(len(m.Atoms), d.info.gens, d.info.labels)
	})
	return d
}

// canonical returns the canonical string of m from its cache d (see
// Canonical), written on first use.
func (m *Molecule) canonical(d *derived) string {
	d.canonOnce.Do(func() { d.canon = m.writeSMILES(d.info.labels, false) })
	return d.canon
}

// Other returns the atom at the other end of bond b from atom i.
func (m *Molecule) Other(b, i int) int {
	if m.Bonds[b].A == i {
		return m.Bonds[b].B
	}
	return m.Bonds[b].A
}
