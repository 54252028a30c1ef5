package molecule

import "fmt"

// A hypervalent centre is an atom with more than four electron domains
// (σ partners plus lone pairs): SF4 (four F and one lone pair), SF6, ClF3
// (three F and two lone pairs), IF5. The symmetry rule of SymmetryNumber
// (tetrahedral atoms checked for parity, other atoms permuting alike
// ligands freely) describes atoms with at most four domains only: it gives
// SF6 720 and SF4 12 where the point groups give 24 and 2. So a molecule
// with such a centre gets σ from the VSEPR shape of the centre when it is
// the whole molecule — one central atom with n identical terminal ligands
// and m lone pairs (AXnEm) — and an error otherwise.

// vseprSigma holds the rotational symmetry number of AXnEm with identical
// ligands, by (n, m): the order of the proper rotation group of the
// idealised VSEPR shape (common practice): linear AX2E3 D∞h 2,
// T-shaped AX3E2 C2v 2, seesaw AX4E C2v 2, square planar AX4E2 D4h 8,
// trigonal bipyramidal AX5 D3h 6, square pyramidal AX5E C4v 4, octahedral
// AX6 Oh 24, pentagonal bipyramidal AX7 D5h 10.
var vseprSigma = map[[2]int]int{
	{2, 3}: 2, {3, 2}: 2, {4, 1}: 2, {4, 2}: 8, {5, 0}: 6, {5, 1}: 4, {6, 0}: 24, {7, 0}: 10,
}

// lonePairs returns the lone pairs of atom i: its valence electrons (main
// groups 13–18) less its charge, its bonds, its hydrogens and its unpaired
// electrons, halved; ok is false outside groups 13–18.
func (m *Molecule) lonePairs(i int) (int, bool) {
	a := m.Atoms[i]
	e, ok := elementIndex(a.Element)
	if !ok || e.Group < 13 {
		return 0, false
	}
	n := e.Group - 10 - a.Charge - a.HCount - a.Radical
	for _, b := range m.Adj[i] {
		n -= m.Bonds[b].Order
	}
	if n < 0 {
		return 0, false
	}
	return n / 2, true
}

// hypervalentSigma reports whether m has a hypervalent centre and, if it
// does, σ of m (see vseprSigma) or an error saying why σ is not given.
func (m *Molecule) hypervalentSigma() (sigma int, hyper bool, err error) {
	centre := -1
	for i := range m.Atoms {
		lp, ok := m.lonePairs(i)
		if ok && len(m.Adj[i])+m.Atoms[i].HCount+lp > 4 {
			centre = i
			break
		}
	}
	if centre < 0 {
		return 0, false, nil
	}
	a := m.Atoms[centre]
	lp, _ := m.lonePairs(centre)
	n := len(m.Adj[centre])
	shape := fmt.Sprintf("%s with %d σ partners and %d lone pairs", a.Element, n+a.HCount, lp)
	if s, ok := vseprSigma[[2]int{n, lp}]; ok && a.HCount == 0 && len(m.Atoms) == n+1 && m.identicalTerminals(centre) {
		return s, true, nil
	}
	return 0, true, fmt.Errorf("symmetry number of atom %d (%s, a hypervalent centre) not derived: kiln gives it only for one central atom with identical terminal ligands", centre+1, shape)
}

// identicalTerminals reports whether every neighbour of atom c is a
// terminal atom (no other bond) bonded to c alike and identical to the
// others in element, isotope, charge, hydrogens and unpaired electrons.
func (m *Molecule) identicalTerminals(c int) bool {
	var first *Atom
	order := 0
	for _, b := range m.Adj[c] {
		j := m.Other(b, c)
		x := &m.Atoms[j]
		if len(m.Adj[j]) != 1 {
			return false
		}
		if first == nil {
			first, order = x, m.Bonds[b].Order
			continue
		}
		if x.Element != first.Element || x.Isotope != first.Isotope || x.Charge != first.Charge ||
			x.HCount != first.HCount || x.Radical != first.Radical || m.Bonds[b].Order != order {
			return false
		}
	}
	return true
}
