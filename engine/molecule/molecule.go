// Package molecule holds the molecular graph that every estimate starts from:
// atoms with their implicit hydrogens, bonds with Kekulé orders and aromatic
// flags, rings, radical centres, identity (a canonical form) and graph symmetry.
// It reads OpenSMILES (see ParseSMILES) and does no I/O.
package molecule

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
}

// Other returns the atom at the other end of bond b from atom i.
func (m *Molecule) Other(b, i int) int {
	if m.Bonds[b].A == i {
		return m.Bonds[b].B
	}
	return m.Bonds[b].A
}
