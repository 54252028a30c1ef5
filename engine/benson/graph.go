package benson

import (
	"sort"

	"kiln.dev/kiln/engine/molecule"
)

// graph is the per-estimate view of a molecule: neighbour lists, a smallest
// set of smallest rings, benzenoid rings and the Benson atom type of every
// atom. It is built once per call and only read afterwards.
type graph struct {
	m        *molecule.Molecule
	nbr      [][]int // neighbour atoms, in m.Adj order
	nbrBond  [][]int // bond index parallel to nbr
	rings    [][]int // SSSR, each ring as a cyclic atom sequence
	ringBond []bool  // bond is in some ring of rings
	ringAtom []int   // number of rings containing the atom
	benzRing []bool  // rings[i] is a six-membered all-carbon aromatic ring
	benzAtom []int   // number of benzenoid rings containing the atom
	benzBond []bool  // bond lies in a benzenoid ring
	typ      []string
}

func newGraph(m *molecule.Molecule) *graph {
	n := len(m.Atoms)
	g := &graph{m: m, nbr: make([][]int, n), nbrBond: make([][]int, n)}
	for i := 0; i < n; i++ {
		var adj []int
		if i < len(m.Adj) {
			adj = m.Adj[i]
		}
		for _, b := range adj {
			g.nbr[i] = append(g.nbr[i], m.Other(b, i))
			g.nbrBond[i] = append(g.nbrBond[i], b)
		}
	}
	g.findRings()
	g.ringBond = make([]bool, len(m.Bonds))
	g.ringAtom = make([]int, n)
	g.benzAtom = make([]int, n)
	g.benzBond = make([]bool, len(m.Bonds))
	g.benzRing = make([]bool, len(g.rings))
	for ri, r := range g.rings {
		benz := len(r) == 6
		for k, a := range r {
			b := g.bondBetween(a, r[(k+1)%len(r)])
			g.ringBond[b] = true
			g.ringAtom[a]++
			if m.Atoms[a].Element != "C" || !m.Atoms[a].Aromatic || !m.Bonds[b].Aromatic {
				benz = false
			}
		}
		g.benzRing[ri] = benz
		if benz {
			for k, a := range r {
				g.benzAtom[a]++
				g.benzBond[g.bondBetween(a, r[(k+1)%len(r)])] = true
			}
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
// (aromatic carbon shared by two benzenoid rings), or the element symbol.
func (g *graph) atomType(i int) string {
	a := g.m.Atoms[i]
	if a.Element != "C" {
		return a.Element
	}
	if g.benzAtom[i] >= 2 {
		return "Cbf"
	}
	if g.benzAtom[i] == 1 {
		return "Cb"
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

// findRings computes a smallest set of smallest rings: the shortest cycle
// through each bond, kept when independent (over GF(2)) of shorter ones,
// until the cyclomatic number bonds − atoms + components is reached.
func (g *graph) findRings() {
	m := g.m
	n, nb := len(m.Atoms), len(m.Bonds)
	comps := 0
	seen := make([]bool, n)
	for s := 0; s < n; s++ {
		if seen[s] {
			continue
		}
		comps++
		stack := []int{s}
		seen[s] = true
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			for _, w := range g.nbr[v] {
				if !seen[w] {
					seen[w] = true
					stack = append(stack, w)
				}
			}
		}
	}
	want := nb - n + comps
	if want <= 0 {
		return
	}
	type cand struct {
		atoms []int
		bits  []uint64
	}
	words := (nb + 63) / 64
	var cands []cand
	prev := make([]int, n)
	prevBond := make([]int, n)
	for e := 0; e < nb; e++ {
		u, v := m.Bonds[e].A, m.Bonds[e].B
		for i := range prev {
			prev[i] = -2
		}
		prev[u] = -1
		queue := []int{u}
		for len(queue) > 0 && prev[v] == -2 {
			x := queue[0]
			queue = queue[1:]
			for k, y := range g.nbr[x] {
				b := g.nbrBond[x][k]
				if b == e || prev[y] != -2 {
					continue
				}
				prev[y] = x
				prevBond[y] = b
				queue = append(queue, y)
			}
		}
		if prev[v] == -2 {
			continue
		}
		c := cand{bits: make([]uint64, words)}
		c.bits[e/64] |= 1 << (e % 64)
		for x := v; x != u; x = prev[x] {
			c.atoms = append(c.atoms, x)
			b := prevBond[x]
			c.bits[b/64] |= 1 << (b % 64)
		}
		c.atoms = append(c.atoms, u)
		cands = append(cands, c)
	}
	sort.SliceStable(cands, func(i, j int) bool { return len(cands[i].atoms) < len(cands[j].atoms) })
	var basis [][]uint64 // reduced rows, each with a distinct leading bit
	var lead []int
	for _, c := range cands {
		if len(g.rings) == want {
			break
		}
		v := append([]uint64(nil), c.bits...)
		for i, row := range basis {
			if v[lead[i]/64]&(1<<(lead[i]%64)) != 0 {
				for w := range v {
					v[w] ^= row[w]
				}
			}
		}
		l := -1
		for w := range v {
			if v[w] != 0 {
				for bit := 0; bit < 64; bit++ {
					if v[w]&(1<<bit) != 0 {
						l = w*64 + bit
						break
					}
				}
				break
			}
		}
		if l < 0 {
			continue
		}
		// keep the basis reduced on the new leading bit
		for i, row := range basis {
			if row[l/64]&(1<<(l%64)) != 0 {
				for w := range row {
					basis[i][w] ^= v[w]
				}
			}
		}
		basis = append(basis, v)
		lead = append(lead, l)
		g.rings = append(g.rings, c.atoms)
	}
}
