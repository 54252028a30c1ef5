package molecule

import "fmt"

// A hypervalent centre is an atom with more than four electron domains
// (σ partners, lone pairs and an unpaired electron): SF4 (four F and one
// lone pair), SF6, ClF3 (three F and two lone pairs), IF5, SF5• (five F and
// the odd electron). The symmetry rule of SymmetryNumber (tetrahedral atoms
// checked for parity, other atoms permuting alike ligands freely) describes
// atoms with at most four domains only: it gives SF6 720 and SF4 12 where
// the point groups give 24 and 2. So a connected component with such a
// centre gets σ from the VSEPR shape of the centre when the centre is the
// whole component — one central atom with n identical terminal ligands that
// carry no hydrogen (no internal rotors) and m other domains (AXnEm) — and
// an error otherwise. Identical components still multiply σ by k!.

// vseprSigma holds the rotational symmetry number of AXnEm with identical
// ligands, by (n, m): the order of the proper rotation group of the
// idealised VSEPR shape (common practice): linear AX2E3 D∞h 2,
// T-shaped AX3E2 C2v 2, seesaw AX4E C2v 2, square planar AX4E2 D4h 8,
// trigonal bipyramidal AX5 D3h 6, square pyramidal AX5E C4v 4, octahedral
// AX6 Oh 24, pentagonal bipyramidal AX7 D5h 10.
var vseprSigma = map[[2]int]int{
	{2, 3}: 2, {3, 2}: 2, {4, 1}: 2, {4, 2}: 8, {5, 0}: 6, {5, 1}: 4, {6, 0}: 24, {7, 0}: 10,
}

// valenceElectrons returns the valence electrons of a main-group atom of
// element sym with formal charge q (groups 13–18: group − 10 − q); ok is
// false outside groups 13–18.
func valenceElectrons(sym string, q int) (int, bool) {
	e, ok := elementIndex(sym)
	if !ok || e.Group < 13 {
		return 0, false
	}
	return e.Group - 10 - q, true
}

// otherDomains returns the electron domains of atom i that are not bonds:
// its lone pairs, plus one for an odd (unpaired) electron; ok is false
// outside groups 13–18 or when the bonds exceed the valence electrons.
func (m *Molecule) otherDomains(i int) (int, bool) {
	a := m.Atoms[i]
	n, ok := valenceElectrons(a.Element, a.Charge)
	if !ok {
		return 0, false
	}
	n -= a.HCount
	for _, b := range m.Adj[i] {
		n -= m.Bonds[b].Order
	}
	if n < 0 {
		return 0, false
	}
	return (n + 1) / 2, true
}

// hypervalentSigma reports whether the component atoms (ascending) holds a
// hypervalent centre and, if it does, the component's σ (see vseprSigma)
// or an error saying why σ is not given.
func (m *Molecule) hypervalentSigma(atoms []int) (sigma int, hyper bool, err error) {
	centre := -1
	for _, i := range atoms {
		if m.hypervalent(i) {
			centre = i
			break
		}
	}
	if centre < 0 {
		return 0, false, nil
	}
	a := m.Atoms[centre]
	d, _ := m.otherDomains(centre)
	n := len(m.Adj[centre])
	if s, ok := vseprSigma[[2]int{n, d}]; ok && a.HCount == 0 && len(atoms) == n+1 && m.identicalTerminals(centre) {
		return s, true, nil
	}
	return 0, true, fmt.Errorf("symmetry number of atom %d (%s with %d σ partners and %d other electron domains, a hypervalent centre) not derived: kiln gives it only for one central atom with identical terminal ligands that carry no hydrogen", centre+1, a.Element, n+a.HCount, d)
}

// identicalTerminals reports whether every neighbour of atom c is a
// terminal atom without hydrogens (no other bond, no internal rotor) bonded
// to c alike and identical to the others in element, isotope, charge and
// unpaired electrons.
func (m *Molecule) identicalTerminals(c int) bool {
	var first *Atom
	order := 0
	for _, b := range m.Adj[c] {
		j := m.Other(b, c)
		x := &m.Atoms[j]
		if len(m.Adj[j]) != 1 || x.HCount != 0 {
			return false
		}
		if first == nil {
			first, order = x, m.Bonds[b].Order
			continue
		}
		if x.Element != first.Element || x.Isotope != first.Isotope || x.Charge != first.Charge ||
			x.Radical != first.Radical || m.Bonds[b].Order != order {
			return false
		}
	}
	return true
}

// HypervalentCentre returns the first atom (0-based, in atom order) with
// more than four electron domains — partners σ partners (bonded atoms and
// hydrogens) and other lone pairs or an odd electron — such as the S of SF4
// or SF6 or the Cl of ClF3; ok is false when the molecule has none.
func (m *Molecule) HypervalentCentre() (atom, partners, other int, ok bool) {
	for i := range m.Atoms {
		if m.hypervalent(i) {
			d, _ := m.otherDomains(i)
			return i, len(m.Adj[i]) + m.Atoms[i].HCount, d, true
		}
	}
	return 0, 0, 0, false
}

// hypervalent reports whether atom i has more than four electron domains.
func (m *Molecule) hypervalent(i int) bool {
	d, ok := m.otherDomains(i)
	return ok && len(m.Adj[i])+m.Atoms[i].HCount+d > 4
}
