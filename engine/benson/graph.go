package benson

import "kiln.dev/kiln/engine/molecule"

// graph is the per-estimate view of a molecule: neighbour lists, the
// molecule's smallest set of smallest rings (molecule.Molecule.Rings),
// benzenoid rings and the Benson atom type of every atom. It is built once
// per call and only read afterwards.
type graph struct {
	m        *molecule.Molecule
	nbr      [][]int // neighbour atoms, in m.Adj order
	nbrBond  [][]int // bond index parallel to nbr
	rings    [][]int // m.Rings(): SSSR, each ring a cyclic atom sequence (shared, read only)
	ringBond []bool  // bond is in some ring of rings
	ringAtom []int   // number of rings containing the atom
	benzRing []bool  // rings[i] is a six-membered aromatic ring of carbons and azine N (hetero_n.go)
	benzAtom []int   // number of benzenoid rings containing the atom
	benzBond []bool  // bond lies in a benzenoid ring
	typ      []string
}

func newGraph(m *molecule.Molecule) *graph {
	n := len(m.Atoms)
	deg := 0
	for i := 0; i < n && i < len(m.Adj); i++ {
		deg += len(m.Adj[i])
	}
	rings := m.Rings()
	// One int slab and one bool slab back every per-atom and per-bond slice
	// (they are only read after this function), so a graph costs a few
	// allocations whatever the size of the molecule.
	ints := make([]int, 2*deg+2*n)
	bools := make([]bool, 2*len(m.Bonds)+len(rings))
	g := &graph{m: m, nbr: make([][]int, 2*n)}
	g.nbr, g.nbrBond = g.nbr[:n:n], g.nbr[n:]
	for i := 0; i < n; i++ {
		var adj []int
		if i < len(m.Adj) {
			adj = m.Adj[i]
		}
		d := len(adj)
		g.nbr[i], g.nbrBond[i] = ints[:d:d], ints[d:2*d:2*d]
		ints = ints[2*d:]
		for k, b := range adj {
			g.nbr[i][k] = m.Other(b, i)
			g.nbrBond[i][k] = b
		}
	}
	g.rings = rings
	nb := len(m.Bonds)
	g.ringBond, g.benzBond, g.benzRing = bools[:nb:nb], bools[nb:2*nb:2*nb], bools[2*nb:]
	g.ringAtom, g.benzAtom = ints[:n:n], ints[n:2*n:2*n]
	for ri, r := range g.rings {
		benz := len(r) == 6
		for k, a := range r {
			b := g.bondBetween(a, r[(k+1)%len(r)])
			g.ringBond[b] = true
			g.ringAtom[a]++
			if (m.Atoms[a].Element != "C" && !azineN(m, a)) || !m.Atoms[a].Aromatic || !m.Bonds[b].Aromatic {
				benz = false
			}
		}
		g.benzRing[ri] = benz
	}
	// Benzenoid rings are looked for among the relevant cycles, which do not
	// depend on the spelling: in a bridged system (a benzene ring bridged
	// across, as in a para-cyclophane-type ring) the SSSR may hold the
	// benzene ring in one atom order and not in another, which changed the
	// types of its atoms and so the groups (Cb or Cd neighbours).
	cycles, complete := m.RelevantCycles()
	if !complete || len(cycles) == 0 {
		cycles = rings
	}
	for _, r := range cycles {
		if !g.benzenoid(r) {
			continue
		}
		for k, a := range r {
			g.benzAtom[a]++
			g.benzBond[g.bondBetween(a, r[(k+1)%len(r)])] = true
		}
	}
	g.typ = make([]string, n)
	for i := range m.Atoms {
		g.typ[i] = g.atomType(i)
	}
	return g
}

// order is the bond order used for typing: aromatic bonds in benzenoid
// rings count 4 ("aromatic"), other aromatic bonds (furan, pyridine) use the
// Kekulé order the reader assigned.
func (g *graph) order(b int) int {
	if g.benzBond[b] {
		return 4
	}
	return g.m.Bonds[b].Order
}

func (g *graph) bondBetween(a, c int) int {
	for k, x := range g.nbr[a] {
		if x == c {
			return g.nbrBond[a][k]
		}
	}
	return -1
}

// atomType is the Benson type of atom i: C (sp3 carbon), Cd (alkene), Ct
// (alkyne), Ca (allene centre), CO (carbonyl), Cb (benzenoid aromatic), Cbf
// (aromatic carbon shared by two benzenoid rings), CN (nitrile carbon) and Ck
// (ketene carbon, see hetero.go), or the element symbol.
func (g *graph) atomType(i int) string {
	a := g.m.Atoms[i]
	if a.Element == "N" {
		return g.nitrogenType(i) // hetero_n.go
	}
	if a.Element != "C" {
		if t, ok := g.sulfurOxideType(i); ok { // SO, SO2: hetero_sx.go
			return t
		}
		return a.Element
	}
	if g.benzAtom[i] >= 2 {
		return "Cbf"
	}
	if g.benzAtom[i] == 1 {
		return "Cb"
	}
	if a.Charge == -1 && isocyanide(g.m, i) {
		return "Cic" // the ≡C⁻ of an isocyanide, implied by its N (hetero_n.go)
	}
	if t, ok := g.heteroCarbonType(i); ok {
		return t
	}
	if g.imineCarbon(i) { // CdN: hetero_n.go
		return "CdN"
	}
	doubles, triples, toO := 0, 0, false
	for k, b := range g.nbrBond[i] {
		switch g.order(b) {
		case 2:
			doubles++
			if g.m.Atoms[g.nbr[i][k]].Element == "O" {
				toO = true
			}
		case 3:
			triples++
		}
	}
	switch {
	case triples > 0:
		return "Ct"
	case doubles >= 2:
		return "Ca"
	case toO:
		return "CO"
	case doubles == 1:
		return "Cd"
	}
	return "C"
}

// doubleToO reports whether atom i carries a double bond to an oxygen.
func (g *graph) doubleToO(i int) bool {
	for k, b := range g.nbrBond[i] {
		if g.order(b) == 2 && g.m.Atoms[g.nbr[i][k]].Element == "O" {
			return true
		}
	}
	return false
}

// partner returns the atom joined to i by a bond of the given order, or -1.
func (g *graph) partner(i, order int) int {
	for k, b := range g.nbrBond[i] {
		if g.order(b) == order {
			return g.nbr[i][k]
		}
	}
	return -1
}

// isCarbon reports whether atom i is carbon of any type.
func (g *graph) isCarbon(i int) bool { return g.m.Atoms[i].Element == "C" }

// benzenoid reports whether cycle r is a six-membered ring of aromatic
// carbons and azine nitrogens joined by aromatic bonds.
func (g *graph) benzenoid(r []int) bool {
	if len(r) != 6 {
		return false
	}
	for k, a := range r {
		b := g.bondBetween(a, r[(k+1)%len(r)])
		if b < 0 || (g.m.Atoms[a].Element != "C" && !azineN(g.m, a)) || !g.m.Atoms[a].Aromatic || !g.m.Bonds[b].Aromatic {
			return false
		}
	}
	return true
}
