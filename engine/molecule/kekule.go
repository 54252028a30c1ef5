package molecule

import (
	"fmt"
	"slices"
)

// This file turns the parsed token graph into a valence-complete Kekulé graph:
// kekulization of aromatic input, implicit hydrogens, radicals and folding of
// explicit hydrogen atoms.

// bondSumArom is the bond-order sum of atom i with bonds written aromatic
// counted as 1.
func (p *parser) bondSumArom(i int) int {
	s := 0
	for k, b := range p.bonds {
		if b.A != i && b.B != i {
			continue
		}
		if p.aromIn[k] {
			s++
		} else {
			s += b.Order
		}
	}
	return s
}

// needsDouble reports whether an atom written aromatic must take one double
// bond among its aromatic bonds: its bond sum (aromatic bonds as 1) plus
// hydrogens is below its lowest normal valence that can hold them.
// Pyrrole-type [nH], o, s and lone-pair donors end exactly on a valence and
// take none.
func needsDouble(a Atom, organic bool, sumArom int) bool {
	e, ok := elementIndex(a.Element)
	if !ok {
		return false
	}
	q := a.Charge
	total := sumArom
	if !organic {
		total += a.HCount
	} else {
		q = 0
	}
	vs, ok := valences(e, q)
	if !ok {
		return false
	}
	v, ok := lowestValence(vs, total)
	return ok && v > total
}

// kekulize assigns orders 1/2 to the bonds written aromatic so that every atom
// that needs a double bond gets exactly one (maximum matching, Edmonds'
// blossom algorithm). Failure is reported at the first atom of the aromatic
// system that cannot be satisfied.
func (p *parser) kekulize() error {
	n := len(p.atoms)
	need := make([]bool, n)
	anyArom := false
	for k := range p.bonds {
		if p.aromIn[k] {
			anyArom = true
			break
		}
	}
	if !anyArom {
		for i := range p.atoms {
			if p.atoms[i].Aromatic && needsDouble(p.atoms[i], p.organic[i], p.bondSumArom(i)) {
				return errAt(p.atoms[i].Pos, "aromatic ring cannot be kekulized")
			}
		}
		return nil
	}
	sums := make([]int, n)
	for k, b := range p.bonds {
		o := b.Order
		if p.aromIn[k] {
			o = 1
		}
		sums[b.A] += o
		sums[b.B] += o
	}
	for i := range p.atoms {
		need[i] = p.atoms[i].Aromatic && needsDouble(p.atoms[i], p.organic[i], sums[i])
	}
	// adjacency of the atoms that need a double bond, through bonds written
	// aromatic, in one backing array
	cnt := make([]int, n+1)
	for k, b := range p.bonds {
		if p.aromIn[k] && need[b.A] && need[b.B] {
			cnt[b.A+1]++
			cnt[b.B+1]++
		}
	}
	for i := 1; i <= n; i++ {
		cnt[i] += cnt[i-1]
	}
	back := make([]int, cnt[n])
	adj := make([][]int, n)
	for i := range adj {
		adj[i] = back[cnt[i]:cnt[i]:cnt[i+1]]
	}
	for k, b := range p.bonds {
		if p.aromIn[k] && need[b.A] && need[b.B] {
			adj[b.A] = append(adj[b.A], b.B)
			adj[b.B] = append(adj[b.B], b.A)
		}
	}
	edge := func(a, b int) int {
		for k, bd := range p.bonds {
			if p.aromIn[k] && ((bd.A == a && bd.B == b) || (bd.A == b && bd.B == a)) {
				return k
			}
		}
		return -1
	}
	match := maxMatching(n, adj)
	for k := range p.bonds {
		if p.aromIn[k] {
			p.bonds[k].Order = 1
		}
	}
	for i := 0; i < n; i++ {
		if need[i] && match[i] > i {
			p.bonds[edge(i, match[i])].Order = 2
		}
	}
	for i := 0; i < n; i++ {
		if need[i] && match[i] < 0 {
			// report at the first atom of this aromatic system
			first := p.aromaticSystemFirst(i)
			return errAt(p.atoms[first].Pos, "aromatic ring cannot be kekulized%s", p.kekuleHint(first))
		}
	}
	return nil
}

// kekuleHint returns advice for an aromatic system that cannot be
// kekulized (first is one of its atoms), "" for none: the usual cause is a
// pyrrole-type n written without its H (c1cc[n]c1, c1ccnc1 for pyrrole),
// which also is how the pyrrolyl radical is often attempted.
func (p *parser) kekuleHint(first int) string {
	for _, v := range p.aromaticSystem(first) {
		a := p.atoms[v]
		if a.Element != "N" || !a.Aromatic || a.HCount != 0 || a.Charge != 0 || a.Isotope != 0 {
			continue
		}
		deg := 0
		for _, b := range p.bonds {
			if b.A == v || b.B == v {
				deg++
			}
		}
		if deg == 2 {
			return ": a pyrrole-type aromatic n needs its H ([nH], as in c1cc[nH]c1) or a substituent " +
				"(a pyridine-type n needs none: then look at the ring's other atoms); " +
				"for a radical on that N write the ring in Kekulé form (pyrrolyl: [N]1C=CC=C1)"
		}
	}
	return ""
}

// aromaticSystem returns the atoms connected to i through bonds written
// aromatic, i included.
func (p *parser) aromaticSystem(i int) []int {
	seen := map[int]bool{i: true}
	out := []int{i}
	for q := 0; q < len(out); q++ {
		v := out[q]
		for k, b := range p.bonds {
			if !p.aromIn[k] || (b.A != v && b.B != v) {
				continue
			}
			if w := b.A + b.B - v; !seen[w] {
				seen[w] = true
				out = append(out, w)
			}
		}
	}
	return out
}

// aromaticSystemFirst returns the smallest atom index connected to i through
// bonds written aromatic.
func (p *parser) aromaticSystemFirst(i int) int {
	seen := map[int]bool{i: true}
	stack := []int{i}
	best := i
	for len(stack) > 0 {
		v := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if v < best {
			best = v
		}
		for k, b := range p.bonds {
			if !p.aromIn[k] || (b.A != v && b.B != v) {
				continue
			}
			w := b.A + b.B - v
			if !seen[w] {
				seen[w] = true
				stack = append(stack, w)
			}
		}
	}
	return best
}

// maxMatching returns a maximum matching of the general graph adj (match[v] =
// partner or -1): greedy start, then augmenting paths with blossom
// contraction (Edmonds 1965).
func maxMatching(n int, adj [][]int) []int {
	match := make([]int, n)
	for i := range match {
		match[i] = -1
	}
	for v := 0; v < n; v++ {
		if match[v] >= 0 {
			continue
		}
		for _, w := range adj[v] {
			if match[w] < 0 {
				match[v], match[w] = w, v
				break
			}
		}
	}
	parent := make([]int, n)
	base := make([]int, n)
	used := make([]bool, n)
	blossom := make([]bool, n)
	queue := make([]int, 0, n)
	lca := func(a, b int) int {
		seen := make([]bool, n)
		for {
			a = base[a]
			seen[a] = true
			if match[a] < 0 {
				break
			}
			a = parent[match[a]]
		}
		for {
			b = base[b]
			if seen[b] {
				return b
			}
			b = parent[match[b]]
		}
	}
	markPath := func(v, b, child int) {
		for base[v] != b {
			blossom[base[v]] = true
			blossom[base[match[v]]] = true
			parent[v] = child
			child = match[v]
			v = parent[match[v]]
		}
	}
	findPath := func(root int) int {
		for i := 0; i < n; i++ {
			used[i] = false
			parent[i] = -1
			base[i] = i
		}
		used[root] = true
		queue = append(queue[:0], root)
		for qh := 0; qh < len(queue); qh++ {
			v := queue[qh]
			for _, to := range adj[v] {
				if base[v] == base[to] || match[v] == to {
					continue
				}
				if to == root || (match[to] >= 0 && parent[match[to]] >= 0) {
					cur := lca(v, to)
					for i := range blossom {
						blossom[i] = false
					}
					markPath(v, cur, to)
					markPath(to, cur, v)
					for i := 0; i < n; i++ {
						if blossom[base[i]] {
							base[i] = cur
							if !used[i] {
								used[i] = true
								queue = append(queue, i)
							}
						}
					}
				} else if parent[to] < 0 {
					parent[to] = v
					if match[to] < 0 {
						return to
					}
					used[match[to]] = true
					queue = append(queue, match[to])
				}
			}
		}
		return -1
	}
	for v := 0; v < n; v++ {
		if match[v] >= 0 || len(adj[v]) == 0 {
			continue
		}
		u := findPath(v)
		for u >= 0 {
			pv := parent[u]
			ppv := match[pv]
			match[u], match[pv] = pv, u
			u = ppv
		}
	}
	return match
}

// assignHydrogens gives organic-subset atoms their implicit hydrogens and
// bracket atoms their radical electrons, and rejects impossible valences.
func (p *parser) assignHydrogens() error {
	sums := make([]int, len(p.atoms))
	for _, b := range p.bonds {
		sums[b.A] += b.Order
		sums[b.B] += b.Order
	}
	for i := range p.atoms {
		a := &p.atoms[i]
		e, _ := elementIndex(a.Element)
		if p.organic[i] {
			vs, _ := valences(e, 0)
			if e.Group == 17 {
				// OpenSMILES: F, Cl, Br and I written without brackets have
				// valence 1 only; higher valences need a bracket atom.
				vs = valence1
			}
			v, ok := lowestValence(vs, sums[i])
			if !ok {
				return errAt(a.Pos, "%s with valence %d%s", e.Name, sums[i], p.valenceHint(i, e, sums[i]))
			}
			a.HCount = v - sums[i]
			continue
		}
		vs, ok := valences(e, a.Charge)
		if !ok {
			continue
		}
		total := sums[i] + a.HCount
		v, ok := lowestValence(vs, total)
		if !ok {
			if a.Charge != 0 {
				return errAt(a.Pos, "%s with charge %+d and valence %d", e.Name, a.Charge, total)
			}
			return errAt(a.Pos, "%s with valence %d", e.Name, total)
		}
		a.Radical = v - total
	}
	return nil
}

// valenceHint returns advice for organic-subset atom i (element e) written
// with more bonds (sum) than its neutral valences allow, "" for none: C#O is
// carbon monoxide, written [C-]#[O+] or [C]=O; otherwise, when the bonds
// fit the atom as a cation, an atom outside brackets carries no charge and
// a charged one is written in brackets.
func (p *parser) valenceHint(i int, e element, sum int) string {
	if p.atoms[i].Element == "O" && sum == 3 {
		for _, b := range p.bonds {
			if (b.A == i || b.B == i) && b.Order == 3 && p.atoms[b.A+b.B-i].Element == "C" && len(p.atoms) == 2 {
				return " (carbon monoxide is written [C-]#[O+] or [C]=O)"
			}
		}
	}
	// an onium atom (O⁺ with three bonds); a five-bonded C is no anion
	if vs, ok := valences(e, 1); ok && slices.Contains(vs, sum) {
		return fmt.Sprintf(" (an atom outside brackets carries no charge: if it is charged, write it in brackets, as [%s+])", p.atoms[i].Element)
	}
	switch p.atoms[i].Element {
	case "Cl", "Br", "I":
		// OpenSMILES gives halogens valence 1 only.
		return " (a halogen outside brackets has one bond: write a hypervalent one in brackets, as chlorine trifluoride F[Cl](F)F, or with charges, as chlorine dioxide OClO is: [O][Cl+][O-])"
	}
	return ""
}

// foldable reports whether atom i is a plain explicit hydrogen ([H], no
// isotope, charge, class or chirality) bonded by one single bond to a
// non-hydrogen atom; such atoms become part of the neighbour's HCount.
func (p *parser) foldable(i int, deg []int, nb []int) bool {
	a := p.atoms[i]
	if a.Element != "H" || a.Isotope != 0 || a.Charge != 0 || a.Class != 0 || a.Chirality != "" || a.HCount != 0 || deg[i] != 1 {
		return false
	}
	j := nb[i]
	return p.atoms[j].Element != "H"
}

// build folds explicit hydrogens and produces the Molecule with adjacency.
func (p *parser) build() *Molecule {
	n := len(p.atoms)
	// Scratch for this function (and cnt below) shares one array.
	scratch := make([]int, 4*n+1)
	deg, nb, remap := scratch[:n:n], scratch[n:2*n:2*n], scratch[2*n:3*n:3*n]
	single := make([]bool, n)
	for _, b := range p.bonds {
		deg[b.A]++
		deg[b.B]++
		nb[b.A], nb[b.B] = b.B, b.A
		single[b.A] = b.Order == 1
		single[b.B] = b.Order == 1
	}
	m := &Molecule{SMILES: p.s}
	folded := 0
	for i := range p.atoms {
		if !p.foldable(i, deg, nb) || !single[i] {
			continue
		}
		folded++
		remap[i] = -1
		// The hydrogen is one of the neighbour's written neighbours: its
		// place in the chirality order becomes a hydrogen slot.
		j := nb[i]
		p.atoms[j].HCount++
		for k, x := range p.nbr[j] {
			if x == i {
				p.nbr[j][k] = -1
			}
		}
	}
	if folded == 0 {
		// Nothing to remove: the parser's atoms and bonds (which it no longer
		// uses) already are the molecule's, with the same indices.
		for i := range remap {
			remap[i] = i
		}
		m.Atoms = p.atoms[:n:n]
		m.Bonds = p.bonds[:len(p.bonds):len(p.bonds)]
	} else {
		m.Atoms = make([]Atom, 0, n-folded)
		m.Bonds = make([]Bond, 0, len(p.bonds))
		for i := range p.atoms {
			if remap[i] < 0 {
				continue
			}
			remap[i] = len(m.Atoms)
			m.Atoms = append(m.Atoms, p.atoms[i])
		}
		for _, b := range p.bonds {
			if remap[b.A] < 0 || remap[b.B] < 0 {
				continue
			}
			nbd := b
			nbd.A, nbd.B = remap[b.A], remap[b.B]
			m.Bonds = append(m.Bonds, nbd)
		}
	}
	// Adj lists share one backing array (capacity-limited, so an append by a
	// caller cannot run into the next atom's list).
	na := len(m.Atoms)
	chiral := false // nbrOrder is kept only when some atom has a mark
	for _, a := range m.Atoms {
		chiral = chiral || a.Chirality != ""
	}
	nl := na
	if chiral {
		nl = 2 * na
	}
	lists := make([][]int, nl)
	m.Adj = lists[:na:na]
	cnt := scratch[3*n : 3*n+na+1]
	for _, b := range m.Bonds {
		cnt[b.A+1]++
		cnt[b.B+1]++
	}
	for i := 1; i <= na; i++ {
		cnt[i] += cnt[i-1]
	}
	back := make([]int, cnt[na])
	for i := range m.Adj {
		m.Adj[i] = back[cnt[i]:cnt[i]:cnt[i+1]]
	}
	for k, b := range m.Bonds {
		m.Adj[b.A] = append(m.Adj[b.A], k)
		m.Adj[b.B] = append(m.Adj[b.B], k)
	}
	if !chiral {
		return m
	}
	m.nbrOrder = lists[na:]
	for i := range p.atoms {
		if remap[i] < 0 || p.atoms[i].Chirality == "" {
			continue
		}
		var order []int
		for _, x := range p.nbr[i] {
			if x < 0 {
				order = append(order, -1)
			} else {
				order = append(order, remap[x])
			}
		}
		// Hydrogens written inside the bracket ([C@H]) stand right after the
		// preceding atom, or first when there is none (OpenSMILES).
		if !p.organic[i] && p.bracketH[i] > 0 {
			at := 0
			if p.hadPrev[i] {
				at = 1
			}
			if at > len(order) {
				at = len(order)
			}
			order = append(order[:at], append([]int{-1}, order[at:]...)...)
		}
		// A lone pair of a three-coordinate S, Se or P centre (a
		// sulfoxide's S) takes the place an implicit hydrogen would
		// (OpenSMILES): -2, as stereoPositions names it.
		if el := p.atoms[i].Element; (el == "S" || el == "Se" || el == "P") && p.bracketH[i] == 0 && len(order) == 3 {
			at := 0
			if p.hadPrev[i] {
				at = 1
			}
			order = append(order[:at], append([]int{-2}, order[at:]...)...)
		}
		m.nbrOrder[remap[i]] = order
	}
	return m
}
