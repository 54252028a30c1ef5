package molecule

import (
	"slices"
	"sort"
)

// maxRelevantCycles bounds the relevant-cycle set kept for aromaticity
// perception (polycyclic cages can have very many); the SSSR is not affected.
const maxRelevantCycles = 2000

// ringBondFlags marks the bonds that lie on a cycle (bonds that are not
// bridges of the graph). The flags of a molecule made by ParseSMILES or a
// constructor are computed once and shared: callers must not modify them.
func (m *Molecule) ringBondFlags() []bool {
	if d := m.derived; d != nil && d.inRing != nil && d.atoms == first(m.Atoms) && d.natoms == len(m.Atoms) &&
		d.bonds == first(m.Bonds) && d.nbonds == len(m.Bonds) {
		return d.inRing
	}
	return m.computeRingBondFlags()
}

// computeRingBondFlags finds the ring bonds with Tarjan's low-link DFS
// (iterative).
func (m *Molecule) computeRingBondFlags() []bool {
	n := len(m.Atoms)
	inRing := make([]bool, len(m.Bonds))
	type frame struct{ v, parentBond, next int }
	// Scratch on the stack for molecules of up to 32 atoms (nearly all).
	var (
		intBuf   [64]int
		frameBuf [32]frame
	)
	ints, stack := intBuf[:0], frameBuf[:0]
	if 2*n > len(intBuf) {
		ints, stack = make([]int, 0, 2*n), make([]frame, 0, n)
	}
	ints = ints[:2*n]
	disc, low := ints[:n:n], ints[n:]
	for i := range disc {
		disc[i] = -1
	}
	t := 0
	for root := 0; root < n; root++ {
		if disc[root] >= 0 {
			continue
		}
		disc[root], low[root] = t, t
		t++
		stack = append(stack[:0], frame{root, -1, 0})
		for len(stack) > 0 {
			f := &stack[len(stack)-1]
			if f.next < len(m.Adj[f.v]) {
				b := m.Adj[f.v][f.next]
				f.next++
				if b == f.parentBond {
					continue
				}
				w := m.Other(b, f.v)
				if disc[w] < 0 {
					disc[w], low[w] = t, t
					t++
					stack = append(stack, frame{w, b, 0})
				} else {
					inRing[b] = true // a back edge closes a cycle
					if disc[w] < low[f.v] {
						low[f.v] = disc[w]
					}
				}
				continue
			}
			v, pb := f.v, f.parentBond
			stack = stack[:len(stack)-1]
			if len(stack) > 0 {
				u := stack[len(stack)-1].v
				if low[v] < low[u] {
					low[u] = low[v]
				}
				inRing[pb] = low[v] <= disc[u]
			}
		}
	}
	return inRing
}

type cycleCand struct {
	atoms []int
	bits  []uint64
}

// findRings computes the SSSR and the relevant cycles of m.
//
// Candidates are Horton's cycles: for every ring atom v and ring bond (x,y),
// the shortest paths v→x and v→y closed by (x,y) when they meet only at v.
// Sorted by length, they are reduced over GF(2) on bond-incidence vectors: a
// cycle independent of all strictly shorter ones is relevant (Vismara 1997:
// the relevant cycles are the union of all minimum cycle bases and do not
// depend on atom order); the first independent ones form the SSSR, whose size
// is the cyclomatic number bonds − atoms + components.
func (m *Molecule) findRings(inRing []bool) (sssr, relevant [][]int) {
	n := len(m.Atoms)
	// component labels over ring bonds
	comp := make([]int, n)
	for i := range comp {
		comp[i] = -1
	}
	var comps [][]int
	// component lists partition the ring atoms: they share one array
	buf := make([]int, n)
	for i := 0; i < n; i++ {
		if comp[i] >= 0 {
			continue
		}
		hasRing := false
		for _, b := range m.Adj[i] {
			if inRing[b] {
				hasRing = true
			}
		}
		if !hasRing {
			continue
		}
		c := len(comps)
		comp[i] = c
		list := buf[:1]
		list[0] = i
		for k := 0; k < len(list); k++ {
			v := list[k]
			for _, b := range m.Adj[v] {
				if !inRing[b] {
					continue
				}
				w := m.Other(b, v)
				if comp[w] < 0 {
					comp[w] = c
					list = append(list, w)
				}
			}
		}
		slices.Sort(list)
		comps = append(comps, list[:len(list):len(list)])
		buf = buf[len(list):]
	}
	ebuf := make([]int, 0, len(m.Bonds))
	for ci, atoms := range comps {
		edges := ebuf[:0]
		for b, bd := range m.Bonds {
			if inRing[b] && comp[bd.A] == ci {
				edges = append(edges, b)
			}
		}
		s, r := m.componentRings(atoms, edges, inRing)
		sssr = append(sssr, s...)
		relevant = append(relevant, r...)
	}
	return sssr, relevant
}

func (m *Molecule) componentRings(atoms, edges []int, inRing []bool) (sssr, relevant [][]int) {
	rank := len(edges) - len(atoms) + 1
	if rank == 1 {
		// One simple cycle: walk it from its first atom.
		cyc := make([]int, 1, len(atoms))
		cyc[0] = atoms[0]
		prev := -1
		for len(cyc) < len(atoms) {
			cur := cyc[len(cyc)-1]
			for _, b := range m.Adj[cur] {
				if o := m.Other(b, cur); inRing[b] && o != prev && o != cyc[0] {
					prev = cur
					cyc = append(cyc, o)
					break
				}
			}
			if cyc[len(cyc)-1] == cur { // cannot happen in a simple cycle
				break
			}
		}
		return [][]int{cyc}, [][]int{cyc}
	}
	eIdx := make([]int, len(m.Bonds))
	for k, b := range edges {
		eIdx[b] = k
	}
	words := (len(edges) + 63) / 64
	n := len(m.Atoms)
	dist := make([]int, n)
	parent := make([]int, n)  // parent atom in BFS tree
	parentB := make([]int, n) // bond to parent
	mark := make([]int, n)
	for i := range mark {
		mark[i] = -1
	}
	var seen map[string]bool
	var cands []cycleCand
	queue := make([]int, 0, len(atoms))
	for _, v := range atoms {
		if rank == 1 && len(cands) > 0 {
			// A single cycle: the first atom's candidate is the ring, and
			// every later atom would only find it again.
			break
		}
		for _, a := range atoms {
			dist[a] = -1
		}
		dist[v], parent[v], parentB[v] = 0, -1, -1
		queue = append(queue[:0], v)
		for q := 0; q < len(queue); q++ {
			x := queue[q]
			for _, b := range m.Adj[x] {
				if !inRing[b] {
					continue
				}
				y := m.Other(b, x)
				if dist[y] < 0 {
					dist[y] = dist[x] + 1
					parent[y], parentB[y] = x, b
					queue = append(queue, y)
				}
			}
		}
		for _, b := range edges {
			x, y := m.Bonds[b].A, m.Bonds[b].B
			if parentB[x] == b || parentB[y] == b {
				continue
			}
			// path x→v marked; check y→v meets it only at v
			stamp := v*len(edges) + eIdx[b]
			for u := x; u != v; u = parent[u] {
				mark[u] = stamp
			}
			ok := true
			for u := y; u != v; u = parent[u] {
				if mark[u] == stamp {
					ok = false
					break
				}
			}
			if !ok {
				continue
			}
			bits := make([]uint64, words)
			set := func(bond int) { k := eIdx[bond]; bits[k/64] |= 1 << (k % 64) }
			set(b)
			var px, py []int
			for u := x; u != v; u = parent[u] {
				px = append(px, u)
				set(parentB[u])
			}
			for u := y; u != v; u = parent[u] {
				py = append(py, u)
				set(parentB[u])
			}
			if rank > 1 {
				key := bitsKey(bits)
				if seen[key] {
					continue
				}
				if seen == nil {
					seen = map[string]bool{}
				}
				seen[key] = true
			}
			cyc := make([]int, 0, len(px)+len(py)+1)
			cyc = append(cyc, v)
			for k := len(px) - 1; k >= 0; k-- {
				cyc = append(cyc, px[k])
			}
			cyc = append(cyc, py...)
			cands = append(cands, cycleCand{cyc, bits})
		}
	}
	sort.SliceStable(cands, func(i, j int) bool {
		if len(cands[i].atoms) != len(cands[j].atoms) {
			return len(cands[i].atoms) < len(cands[j].atoms)
		}
		return slices.Compare(cands[i].bits, cands[j].bits) < 0
	})
	// Incremental echelon basis over GF(2): each inserted vector is reduced
	// against all earlier ones, so reducing in insertion order clears pivots
	// for good, and any prefix of the basis spans the cycles inserted first.
	var basis [][]uint64
	var pivots []int
	reduce := func(v []uint64, upto int) []uint64 {
		r := slices.Clone(v)
		for k := 0; k < upto; k++ {
			p := pivots[k]
			if r[p/64]&(1<<(p%64)) != 0 {
				for w := range r {
					r[w] ^= basis[k][w]
				}
			}
		}
		return r
	}
	for i := 0; i < len(cands) && len(basis) < rank; {
		j := i
		for j < len(cands) && len(cands[j].atoms) == len(cands[i].atoms) {
			j++
		}
		shorter := len(basis)
		for k := i; k < j; k++ {
			if isZero(reduce(cands[k].bits, shorter)) {
				continue
			}
			if len(relevant) < maxRelevantCycles {
				relevant = append(relevant, cands[k].atoms)
			}
			// SSSR: take it if independent of every cycle taken so far.
			if r := reduce(cands[k].bits, len(basis)); !isZero(r) && len(basis) < rank {
				p := 0
				for w, x := range r {
					if x != 0 {
						p = w*64 + trailingZeros(x)
						break
					}
				}
				basis = append(basis, r)
				pivots = append(pivots, p)
				sssr = append(sssr, cands[k].atoms)
			}
		}
		i = j
	}
	return sssr, relevant
}

func isZero(v []uint64) bool {
	for _, x := range v {
		if x != 0 {
			return false
		}
	}
	return true
}

func trailingZeros(x uint64) int {
	n := 0
	for x&1 == 0 {
		x >>= 1
		n++
	}
	return n
}

func bitsKey(bits []uint64) string {
	b := make([]byte, 0, len(bits)*8)
	for _, x := range bits {
		for k := 0; k < 8; k++ {
			b = append(b, byte(x>>(8*k)))
		}
	}
	return string(b)
}
