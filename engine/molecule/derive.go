package molecule

import (
	"fmt"
	"slices"
)

// ClosedShellParent returns the molecule with every radical electron
// replaced by a hydrogen on the same atom (the parent used by the
// hydrogen-bond-increment method: CC[CH2] → CCC). A molecule without radical
// electrons is returned as is.
func (m *Molecule) ClosedShellParent() *Molecule {
	atoms := slices.Clone(m.Atoms)
	changed := false
	for i := range atoms {
		if atoms[i].Radical > 0 {
			atoms[i].HCount += atoms[i].Radical
			atoms[i].Radical = 0
			changed = true
		}
	}
	if !changed {
		return m
	}
	return m.derive(atoms, slices.Clone(m.Bonds))
}

// WithHydrogenAdded returns the molecule with one radical electron of atom i
// replaced by a hydrogen (CC[CH2] with i = 2 → CCC). It is an error when atom
// i carries no radical electron.
func (m *Molecule) WithHydrogenAdded(i int) (*Molecule, error) {
	if i < 0 || i >= len(m.Atoms) {
		return nil, fmt.Errorf("add hydrogen: atom %d out of range (%d atoms)", i, len(m.Atoms))
	}
	if m.Atoms[i].Radical == 0 {
		return nil, fmt.Errorf("add hydrogen: atom %d (%s) has no radical electron", i, m.Atoms[i].Element)
	}
	atoms := slices.Clone(m.Atoms)
	atoms[i].HCount++
	atoms[i].Radical--
	return m.derive(atoms, slices.Clone(m.Bonds)), nil
}

// WithHydrogenRemoved returns the molecule with one hydrogen of atom i
// replaced by a radical electron (CCC with i = 2 → CC[CH2]), the inverse of
// WithHydrogenAdded. It is an error when atom i carries no hydrogen.
func (m *Molecule) WithHydrogenRemoved(i int) (*Molecule, error) {
	if i < 0 || i >= len(m.Atoms) {
		return nil, fmt.Errorf("remove hydrogen: atom %d out of range (%d atoms)", i, len(m.Atoms))
	}
	if m.Atoms[i].HCount == 0 {
		return nil, fmt.Errorf("remove hydrogen: atom %d (%s) has no hydrogen", i, m.Atoms[i].Element)
	}
	atoms := slices.Clone(m.Atoms)
	atoms[i].HCount--
	atoms[i].Radical++
	return m.derive(atoms, slices.Clone(m.Bonds)), nil
}

// ImplicitHydrogens reports whether the hydrogens of atom i were implied by
// the SMILES (an atom written outside brackets takes the hydrogens its
// ordinary valence leaves) rather than written in a bracket atom.
func (m *Molecule) ImplicitHydrogens(i int) bool {
	a := m.Atoms[i]
	return a.HCount > 0 && a.Pos >= 0 && a.Pos < len(m.SMILES) && m.SMILES[a.Pos] != '['
}

// WithBondOrders returns a resonance structure of m: bond b gets order
// orders[b] (1, 2 or 3) and atom i gets radicals[i] radical electrons, all
// other bonds and atoms unchanged. Every atom must keep its valence (bond
// orders + hydrogens + radical electrons), so •C–C=O → C=C–O• is accepted and
// a change that creates or loses electrons is an error. Changed bonds lose
// their cis/trans marks. Rings and aromaticity are perceived afresh.
func (m *Molecule) WithBondOrders(orders map[int]int, radicals map[int]int) (*Molecule, error) {
	bonds := slices.Clone(m.Bonds)
	atoms := slices.Clone(m.Atoms)
	for b, o := range orders {
		if b < 0 || b >= len(bonds) {
			return nil, fmt.Errorf("resonance structure: bond %d out of range (%d bonds)", b, len(bonds))
		}
		if o < 1 || o > 3 {
			return nil, fmt.Errorf("resonance structure: bond order %d (want 1, 2 or 3)", o)
		}
		if bonds[b].Order != o {
			bonds[b].Order = o
			bonds[b].Stereo = 0
		}
	}
	for i, r := range radicals {
		if i < 0 || i >= len(atoms) || r < 0 {
			return nil, fmt.Errorf("resonance structure: bad radical count %d for atom %d", r, i)
		}
		atoms[i].Radical = r
	}
	for i := range atoms {
		before, after := m.Atoms[i].Radical, atoms[i].Radical
		for _, b := range m.Adj[i] {
			before += m.Bonds[b].Order
			after += bonds[b].Order
		}
		if before != after {
			return nil, fmt.Errorf("resonance structure: atom %d (%s) would change valence from %d to %d", i, atoms[i].Element, before, after)
		}
	}
	return m.derive(atoms, bonds), nil
}

// derive builds a molecule with the same connectivity as m and the given
// atoms and bonds (fresh slices owned by the result): rings and ring systems
// are shared with m (they depend on connectivity only), aromaticity is
// perceived afresh, and the result gets its own cache.
func (m *Molecule) derive(atoms []Atom, bonds []Bond) *Molecule {
	d := &Molecule{Atoms: atoms, Bonds: bonds, Adj: m.Adj, SMILES: m.SMILES,
		nbrOrder: m.nbrOrder, rings: m.rings, cycles: m.cycles, ringSys: m.ringSys}
	// The connectivity is m's: so are the ring bonds.
	inRing := m.ringBondFlags()
	d.perceiveAromaticity(inRing)
	d.derived = newDerived(d)
	d.derived.inRing = inRing
	return d
}

// WithCharges returns a charge-shifted structure of m: atom i gets formal
// charge charges[i] and bond b order orders[b] (1, 2 or 3), all other atoms
// and bonds unchanged (C[N+](=O)[O-] → CN(=O)=O). The net charge must stay
// the same, and every atom whose charge or bonds change must end on a normal
// valence for its new charge (bond orders + hydrogens + radical electrons).
// Changed bonds lose their cis/trans marks. Rings and aromaticity are
// perceived afresh.
func (m *Molecule) WithCharges(charges map[int]int, orders map[int]int) (*Molecule, error) {
	atoms := slices.Clone(m.Atoms)
	bonds := slices.Clone(m.Bonds)
	net := 0
	touched := map[int]bool{}
	for i, q := range charges {
		if i < 0 || i >= len(atoms) {
			return nil, fmt.Errorf("charge-shifted structure: atom %d out of range (%d atoms)", i, len(atoms))
		}
		net += q - atoms[i].Charge
		atoms[i].Charge = q
		touched[i] = true
	}
	if net != 0 {
		return nil, fmt.Errorf("charge-shifted structure: net charge would change by %+d", net)
	}
	for b, o := range orders {
		if b < 0 || b >= len(bonds) {
			return nil, fmt.Errorf("charge-shifted structure: bond %d out of range (%d bonds)", b, len(bonds))
		}
		if o < 1 || o > 3 {
			return nil, fmt.Errorf("charge-shifted structure: bond order %d (want 1, 2 or 3)", o)
		}
		if bonds[b].Order != o {
			bonds[b].Order = o
			bonds[b].Stereo = 0
			bonds[b].Aromatic = false
		}
		touched[bonds[b].A], touched[bonds[b].B] = true, true
	}
	for i := range touched {
		e, ok := elementIndex(atoms[i].Element)
		if !ok {
			return nil, fmt.Errorf("charge-shifted structure: atom %d: unknown element %s", i, atoms[i].Element)
		}
		total := atoms[i].HCount + atoms[i].Radical
		for _, b := range m.Adj[i] {
			total += bonds[b].Order
		}
		vs, ok := valences(e, atoms[i].Charge)
		if !ok || !slices.Contains(vs, total) {
			return nil, fmt.Errorf("charge-shifted structure: atom %d (%s, charge %+d) would have valence %d", i, atoms[i].Element, atoms[i].Charge, total)
		}
	}
	return m.derive(atoms, bonds), nil
}

// NeutralOxo returns m with its charge-separated oxo units written with
// double bonds, atom indices unchanged:
//
//   - a nitro, nitrate or N-oxide N⁺–O⁻ unit — a non-aromatic N⁺
//     single-bonded to a terminal O⁻ (no H, no radical, no isotope label)
//     that also has a double bond to a terminal O — as N=O: the one
//     structure for the charge-separated and the pentavalent spellings
//     (C[N+](=O)[O-] and CN(=O)=O);
//   - a sulfoxide or sulfone S⁺–O⁻ unit — a non-aromatic S of charge +1 or
//     +2 with as many single-bonded terminal O⁻ — as S=O: C[S+](C)[O-] is
//     CS(C)=O and C[S+2]([O-])([O-])C is CS(C)(=O)=O, the structures the
//     SO and SO2 groups describe (the charge-separated form is how many
//     databases and toolkits write them).
//
// An amine oxide or nitrone keeps its charges (and is refused as a
// charge-separated structure no group names). m itself is returned when it
// has no such unit or when the rewritten structure would break a valence
// rule.
func (m *Molecule) NeutralOxo() *Molecule {
	var charges, orders map[int]int
	set := func(i, j, b int) {
		if charges == nil {
			charges, orders = map[int]int{}, map[int]int{}
		}
		charges[j], orders[b] = 0, 2
	}
	for i, a := range m.Atoms {
		if a.Aromatic {
			continue
		}
		var want int // O⁻ partners to take
		switch {
		case a.Element == "N" && a.Charge == 1:
			// Only nitro/nitrate-type units, where the N⁺ already has a
			// double bond to a terminal O.
			oxo := false
			for _, b := range m.Adj[i] {
				j := m.Other(b, i)
				if m.Atoms[j].Element == "O" && m.Bonds[b].Order == 2 && len(m.Adj[j]) == 1 && m.Atoms[j].Charge == 0 {
					oxo = true
				}
			}
			if oxo {
				want = 1
			}
		case a.Element == "S" && (a.Charge == 1 || a.Charge == 2):
			want = a.Charge
		}
		var partners [][2]int // (atom, bond)
		for _, b := range m.Adj[i] {
			j := m.Other(b, i)
			o := m.Atoms[j]
			if o.Element != "O" || o.Charge != -1 || m.Bonds[b].Order != 1 || len(m.Adj[j]) != 1 || o.HCount != 0 || o.Radical != 0 || o.Isotope != 0 {
				continue
			}
			partners = append(partners, [2]int{j, b})
		}
		if want == 0 || len(partners) < want || (a.Element == "S" && len(partners) != want) {
			continue // a sulfur with O⁻ left over is an ion or an ylide: kept
		}
		for _, p := range partners[:want] {
			set(i, p[0], p[1])
		}
		charges[i] = 0
	}
	if charges == nil {
		return m
	}
	n, err := m.WithCharges(charges, orders)
	if err != nil {
		return m
	}
	return n
}
