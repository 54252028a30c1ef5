package molecule

import (
	"context"
	"math/big"
	"slices"
	"strings"
	"sync"
)

// DefaultSearchWork is the work budget of the symmetry search used by
// Canonical, CanonicalStereo, SymmetryClasses and SymmetryNumber, in
// atom-refinements (one partition refinement of an n-atom component costs
// n). Ordinary molecules need well under a thousand, cages such as C60 a few
// thousand; the budget bounds pathological inputs to roughly a tenth of a
// second, after which CanonicalContext and SymmetryNumber report
// ErrWorkLimit.
const DefaultSearchWork = 1000000

// cgraph is the heavy-atom graph seen by the symmetry search: atoms coloured
// by their properties, bonds coloured by type.
type cgraph struct {
	// scratch buffers reused by refine (a cgraph serves one search)
	keys      []uint64
	idx, next []int
	cnt       []int
	rbuf      []int // backing array of idx, next and cnt
	// backing arrays of nbr/bt, their lists and the initial colour keys,
	// kept when the graph is recycled (see cgraphs)
	lists     [][]int
	ints      []int
	ckeys     [][8]int32
	tarena    []int // holds the traces made by trace (see there)
	rep, size []int // scratch of traceInto
	ind       []int // scratch of child
	tbuf      []int // scratch trace for comparisons
	n         int
	deg       int // Σ len(nbr[i])
	nbr       [][]int
	bt        [][]int
	cell0     []int // initial partition: rank = start of the atom's colour class
}

// bondCode colours a bond: 1–4 by Kekulé order, 5 when aromatic (so Kekulé
// structures of one aromatic ring are not told apart).
func bondCode(b Bond) int {
	if b.Aromatic {
		return 5
	}
	return b.Order
}

// cgraphOf builds the coloured graph of the atoms listed (a union of
// connected components); vertex k of the graph is atom atoms[k]. local is
// scratch of length len(m.Atoms).
func (m *Molecule) cgraphOf(atoms []int, local []int) *cgraph {
	return m.cgraphOfSub(atoms, local, nil, nil)
}

// cgraphOfSub is cgraphOf for a subgraph: bonds with skip[b] set are left
// out (the atoms listed must be closed under the other bonds), and extra,
// when not nil, adds a colour per atom (indexed by atom) to the initial
// partition.
func (m *Molecule) cgraphOfSub(atoms []int, local []int, skip []bool, extra []int) *cgraph {
	n := len(atoms)
	for k, a := range atoms {
		local[a] = k
	}
	deg := 0
	for _, i := range atoms {
		for _, b := range m.Adj[i] {
			if skip == nil || !skip[b] {
				deg++
			}
		}
	}
	g := cgraphs.Get().(*cgraph)
	g.lists = grow(g.lists, 2*n)
	g.ints = grow(g.ints, 2*deg+2*n)
	g.ckeys = grow(g.ckeys, n)
	g.n, g.deg = n, deg
	g.tarena = g.tarena[:0]
	lists, ints := g.lists, g.ints
	g.nbr, g.bt = lists[:n:n], lists[n:]
	nb, bt := ints[:0:deg], ints[deg:deg:2*deg]
	for k, i := range atoms {
		s := len(nb)
		for _, b := range m.Adj[i] {
			if skip != nil && skip[b] {
				continue
			}
			nb = append(nb, local[m.Other(b, i)])
			bt = append(bt, bondCode(m.Bonds[b]))
		}
		g.nbr[k], g.bt[k] = nb[s:len(nb):len(nb)], bt[s:len(bt):len(bt)]
	}
	// Every key field is small (element number, mass number of at most
	// three digits, charge, hydrogens, radical electrons, flags, degree,
	// an extra colour numbered below the atom count): int32 keeps the order.
	keys := g.ckeys
	idx := ints[2*deg : 2*deg+n : 2*deg+n]
	for k := range idx {
		a := m.Atoms[atoms[k]]
		e, _ := elementIndex(a.Element)
		ar := 0
		if a.Aromatic {
			ar = 1
		}
		x := 0
		if extra != nil {
			x = extra[atoms[k]]
		}
		keys[k] = [8]int32{int32(e.Z), int32(a.Isotope), int32(a.Charge), int32(a.HCount), int32(a.Radical), int32(ar), int32(len(m.Adj[atoms[k]])), int32(x)}
		idx[k] = k
	}
	slices.SortFunc(idx, func(x, y int) int { return slices.Compare(keys[x][:], keys[y][:]) })
	g.cell0 = ints[2*deg+n:]
	for k, a := range idx {
		if k > 0 && keys[a] == keys[idx[k-1]] {
			g.cell0[a] = g.cell0[idx[k-1]]
		} else {
			g.cell0[a] = k
		}
	}
	return g
}

// cgraphs recycles coloured graphs with their scratch buffers: a symmetry
// analysis builds one for the molecule and one for every rigid fragment,
// each used for one search and then released (release). Only the
// buffers are shared; a graph in use belongs to one goroutine.
var cgraphs = sync.Pool{New: func() any { return new(cgraph) }}

// grow returns s resliced to length n, reallocated when its capacity is
// short (contents are not kept).
func grow[T any](s []T, n int) []T {
	if cap(s) < n {
		return make([]T, n)
	}
	return s[:n]
}

// release returns g to the pool; neither g nor any slice of it (nbr, bt,
// cell0) may be used afterwards. Partitions returned by refine are the
// caller's and stay valid; traces returned by trace are cut from g's arena
// and must not be used after release (copy one that has to outlive g).
func (g *cgraph) release() {
	g.nbr, g.bt, g.cell0 = nil, nil, nil
	cgraphs.Put(g)
}

// mix is a 64-bit finaliser (splitmix64) used to hash neighbour codes.
func mix(x uint64) uint64 {
	x += 0x9e3779b97f4a7c15
	x = (x ^ (x >> 30)) * 0xbf58476d1ce4e5b9
	x = (x ^ (x >> 27)) * 0x94d049bb133111eb
	return x ^ (x >> 31)
}

// refine returns an equitable-style refinement of rank: cells are split by a
// hash of the multiset of (neighbour cell, bond code) — the sum of mixed
// codes, which needs no sorting — until the number of cells is stable. Ranks
// are cell starts, so cells keep their order. The function depends only on
// the coloured graph and the ranks, never on atom indices, so it commutes
// with relabelling; a hash collision can only leave a cell coarser, which
// costs search time but not correctness (leaves are compared by exact
// traces).
func (g *cgraph) refine(rank []int) []int {
	n := g.n
	out := make([]int, n)
	if n == 0 {
		return out
	}
	if len(g.keys) != n {
		g.keys, g.rbuf = grow(g.keys, n), grow(g.rbuf, 3*n+1)
		g.idx, g.next, g.cnt = g.rbuf[:n:n], g.rbuf[n:2*n:2*n], g.rbuf[2*n:3*n+1]
	}
	keys, order, cnt := g.keys, g.idx, g.cnt
	cur, next := out, g.next
	copy(cur, rank)
	// order lists the atoms by rank (cells are the runs of equal rank);
	// ranks are cell starts, so a counting sort places them.
	clear(cnt)
	for _, r := range cur {
		cnt[r+1]++
	}
	for r := 1; r <= n; r++ {
		cnt[r] += cnt[r-1]
	}
	for a, r := range cur {
		order[cnt[r]] = a
		cnt[r]++
	}
	cells := 0
	for k := 0; k < n; k++ {
		if k == 0 || cur[order[k]] != cur[order[k-1]] {
			cells++
		}
	}
	// Each round splits every cell by the neighbour hash of its members,
	// sub-cells ordered by hash; sorting cell by cell is the same as sorting
	// all atoms by (rank, hash), and singletons need no work.
	for cells < n {
		c := 0
		for s := 0; s < n; {
			e := s + 1
			for e < n && cur[order[e]] == cur[order[s]] {
				e++
			}
			if e-s == 1 {
				next[order[s]] = s
				c++
				s = e
				continue
			}
			seg := order[s:e]
			for _, a := range seg {
				var h uint64
				bt := g.bt[a]
				for k, w := range g.nbr[a] {
					h += mix(uint64(cur[w]*8 + bt[k]))
				}
				keys[a] = h
			}
			if len(seg) <= 12 {
				for i := 1; i < len(seg); i++ {
					for j := i; j > 0 && keys[seg[j]] < keys[seg[j-1]]; j-- {
						seg[j], seg[j-1] = seg[j-1], seg[j]
					}
				}
			} else {
				slices.SortFunc(seg, func(x, y int) int {
					if keys[x] < keys[y] {
						return -1
					}
					if keys[x] > keys[y] {
						return 1
					}
					return 0
				})
			}
			for k, a := range seg {
				if k > 0 && keys[a] == keys[seg[k-1]] {
					next[a] = next[seg[k-1]]
				} else {
					next[a] = s + k
					c++
				}
			}
			s = e
		}
		cur, next = next, cur
		if c == cells {
			break
		}
		cells = c
	}
	if &cur[0] != &out[0] {
		copy(out, cur)
		g.next = cur
	}
	return out
}

// discrete reports whether every cell of rank is a singleton.
func discrete(rank []int, seen []bool) bool {
	clear(seen)
	for _, r := range rank {
		if seen[r] {
			return false
		}
		seen[r] = true
	}
	return true
}

func individualize(rank []int, v int) []int {
	return individualizeInto(make([]int, len(rank)), rank, v)
}

// individualizeInto writes into out (len(rank)) the partition rank with atom
// v split off in front of its cell, and returns out.
func individualizeInto(out, rank []int, v int) []int {
	copy(out, rank)
	r := rank[v]
	for a, x := range rank {
		if x == r && a != v {
			out[a] = r + 1
		}
	}
	return out
}

// targetCell returns the members (ascending atom index) of the first
// non-singleton cell, or nil for a discrete partition.
func targetCell(rank []int) []int {
	n := len(rank)
	size := make([]int, n)
	for _, r := range rank {
		size[r]++
	}
	for r := 0; r < n; r++ {
		if size[r] > 1 {
			out := make([]int, 0, size[r])
			for a, x := range rank {
				if x == r {
					out = append(out, a)
				}
			}
			return out
		}
	}
	return nil
}

// trace is a complete description of the quotient graph of an equitable
// partition: for each cell in order, its start, size and the (neighbour cell,
// bond code) list of a member. For a discrete partition it is the labelled
// graph itself (the certificate).
//
// Traces are cut from an arena that lives as long as the graph: they stay
// valid until g is released.
func (g *cgraph) trace(rank []int) []int {
	need := 3*g.n + g.deg
	if cap(g.tarena)-len(g.tarena) < need {
		g.tarena = make([]int, 0, max(8*need, 512))
	}
	k := len(g.tarena)
	out := g.traceInto(rank, g.tarena[k:k:k+need])
	g.tarena = g.tarena[:k+len(out)]
	return out[:len(out):len(out)]
}

// traceInto appends the trace of rank to dst[:0] (see trace).
func (g *cgraph) traceInto(rank []int, dst []int) []int {
	n := g.n
	if len(g.rep) < n {
		g.rep, g.size = make([]int, n), make([]int, n)
	}
	rep, size := g.rep[:n], g.size[:n]
	for i := range rep {
		rep[i] = -1
		size[i] = 0
	}
	for a, r := range rank {
		if rep[r] < 0 {
			rep[r] = a
		}
		size[r]++
	}
	out := dst[:0]
	if cap(out) < 3*n+g.deg {
		out = make([]int, 0, 3*n+g.deg) // a trace is at most this long
	}
	for r := 0; r < n; r++ {
		if rep[r] < 0 {
			continue
		}
		out = append(out, -1, r, size[r])
		s := len(out)
		a := rep[r]
		bt := g.bt[a]
		for k, w := range g.nbr[a] {
			out = append(out, rank[w]*8+bt[k])
		}
		slices.Sort(out[s:])
	}
	return out
}

// search is one run of the individualisation–refinement search with a step
// budget; gens collects automorphisms (atom permutations) found so far.
type search struct {
	g         *cgraph
	root      []int // refined initial partition
	steps     int
	budget    int
	exhausted bool
	gens      [][]int
	ctx       context.Context // nil: no cancellation
	calls     int
}

// step charges one partition refinement (work proportional to the number of
// atoms) against the budget.
func (s *search) step() bool {
	s.steps += s.g.n
	if s.steps > s.budget {
		s.exhausted = true
	}
	s.calls++
	if s.ctx != nil && s.calls%256 == 0 && s.ctx.Err() != nil {
		s.exhausted = true
	}
	return !s.exhausted
}

func (s *search) child(node []int, v int) []int {
	g := s.g
	if len(g.ind) < g.n {
		g.ind = make([]int, g.n)
	}
	return g.refine(individualizeInto(g.ind[:g.n], node, v))
}

// orbitsFixing returns a union-find root array of the orbits of the group
// generated by the automorphisms that fix every atom of path.
func (s *search) orbitsFixing(path []int) []int {
	parent := make([]int, s.g.n)
	for i := range parent {
		parent[i] = i
	}
	for _, gm := range s.gens {
		fixes := true
		for _, v := range path {
			if gm[v] != v {
				fixes = false
				break
			}
		}
		if !fixes {
			continue
		}
		for a, b := range gm {
			union(parent, a, b)
		}
	}
	for i := range parent {
		parent[i] = find(parent, i)
	}
	return parent
}

// extendOrbits merges into the union-find orb the generators from index
// seen on that fix path, and returns the new count of generators seen.
func (s *search) extendOrbits(orb []int, path []int, seen int) int {
	for _, gm := range s.gens[seen:] {
		fixes := true
		for _, v := range path {
			if gm[v] != v {
				fixes = false
				break
			}
		}
		if fixes {
			for a, b := range gm {
				union(orb, a, b)
			}
		}
	}
	return len(s.gens)
}

func find(parent []int, x int) int {
	for parent[x] != x {
		parent[x] = parent[parent[x]]
		x = parent[x]
	}
	return x
}

func union(parent []int, a, b int) {
	ra, rb := find(parent, a), find(parent, b)
	if ra < rb {
		parent[rb] = ra
	} else if rb < ra {
		parent[ra] = rb
	}
}

func (s *search) addGen(gm []int) {
	for _, h := range s.gens {
		if slices.Equal(h, gm) {
			return
		}
	}
	identity := true
	for a, b := range gm {
		if a != b {
			identity = false
			break
		}
	}
	if !identity {
		s.gens = append(s.gens, gm)
	}
}

// automorphisms computes generators of the automorphism group and the orbit
// sizes along the first path of the search tree. The group order is the
// product of the orbit sizes (orbit–stabiliser theorem over the chain of
// point stabilisers G ⊇ G_v1 ⊇ G_v1v2 ⊇ …). exact is false when the budget
// ran out.
func (s *search) automorphisms() (orbitSizes []int, exact bool) {
	g := s.g
	node := s.root
	nodes := [][]int{node}
	traces := [][]int{g.trace(node)}
	var cells [][]int
	var vs []int
	for {
		t := targetCell(node)
		if t == nil {
			break
		}
		cells = append(cells, t)
		vs = append(vs, t[0])
		if !s.step() {
			return nil, false
		}
		node = s.child(node, t[0])
		nodes = append(nodes, node)
		traces = append(traces, g.trace(node))
	}
	leaf1 := node
	inv1 := make([]int, g.n)
	for a, l := range leaf1 {
		inv1[l] = a
	}
	orbitSizes = make([]int, len(vs))
	for i := len(vs) - 1; i >= 0; i-- {
		var failed []int
		orb, seen := s.orbitsFixing(vs[:i]), len(s.gens)
		for _, w := range cells[i][1:] {
			seen = s.extendOrbits(orb, vs[:i], seen)
			if find(orb, w) == find(orb, vs[i]) {
				continue
			}
			skip := false
			for _, f := range failed {
				if find(orb, f) == find(orb, w) {
					skip = true
					break
				}
			}
			if skip {
				continue
			}
			if !s.step() {
				return nil, false
			}
			leaf := s.findEquivalent(s.child(nodes[i], w), i+1, traces)
			if s.exhausted {
				return nil, false
			}
			if leaf == nil {
				failed = append(failed, w)
				continue
			}
			gm := make([]int, g.n)
			for a, l := range leaf {
				gm[a] = inv1[l]
			}
			s.addGen(gm)
		}
		s.extendOrbits(orb, vs[:i], seen)
		for _, w := range cells[i] {
			if find(orb, w) == find(orb, vs[i]) {
				orbitSizes[i]++
			}
		}
	}
	return orbitSizes, true
}

// findEquivalent searches the subtree at node (depth d) for a leaf whose
// certificate equals the first leaf's, pruning nodes whose trace differs from
// the first path's trace at the same depth.
func (s *search) findEquivalent(node []int, d int, traces [][]int) []int {
	if d >= len(traces) {
		return nil
	}
	s.g.tbuf = s.g.traceInto(node, s.g.tbuf)
	if !slices.Equal(s.g.tbuf, traces[d]) {
		return nil
	}
	t := targetCell(node)
	if t == nil {
		return node
	}
	for _, w := range t {
		if !s.step() {
			return nil
		}
		if leaf := s.findEquivalent(s.child(node, w), d+1, traces); leaf != nil {
			return leaf
		}
		if s.exhausted {
			return nil
		}
	}
	return nil
}

// canonical returns the canonical labelling: the leaf whose sequence of
// traces (root to leaf, compared lexicographically) is smallest. Traces are
// label-invariant, so isomorphic graphs reach the same labelled graph.
// Children in one orbit of the automorphisms fixing the path are explored
// once; subtrees whose trace prefix exceeds the best leaf's are cut.
func (s *search) canonical() []int {
	g := s.g
	var best []int
	var bestTr [][]int
	var stack [][]int
	var path []int
	var dfs func(node []int)
	dfs = func(node []int) {
		tr := g.trace(node)
		stack = append(stack, tr)
		defer func() { stack = stack[:len(stack)-1] }()
		d := len(stack) - 1
		if best != nil {
			c := 0
			for k := 0; k <= d && k < len(bestTr); k++ {
				if c = slices.Compare(stack[k], bestTr[k]); c != 0 {
					break
				}
			}
			if c > 0 {
				return
			}
		}
		t := targetCell(node)
		if t == nil {
			if best != nil && slices.EqualFunc(stack, bestTr, slices.Equal) {
				inv := make([]int, g.n)
				for a, l := range best {
					inv[l] = a
				}
				gm := make([]int, g.n)
				for a, l := range node {
					gm[a] = inv[l]
				}
				s.addGen(gm)
				return
			}
			best = node
			bestTr = slices.Clone(stack)
			return
		}
		var explored []int
		orb, seen := s.orbitsFixing(path), len(s.gens)
		for _, w := range t {
			if s.exhausted {
				return
			}
			seen = s.extendOrbits(orb, path, seen)
			dup := false
			for _, u := range explored {
				if find(orb, u) == find(orb, w) {
					dup = true
					break
				}
			}
			if dup {
				continue
			}
			if !s.step() {
				return
			}
			path = append(path, w)
			dfs(s.child(node, w))
			path = path[:len(path)-1]
			explored = append(explored, w)
		}
	}
	dfs(s.root)
	return best
}

// symmetryInfo is the result of a full symmetry analysis.
type symmetryInfo struct {
	labels []int    // canonical label per atom
	gens   [][]int  // generators of the automorphism group (atom permutations)
	order  *big.Int // group order; nil for 1 (most molecules: no big.Int kept)
	exact  bool
	steps  int // largest search work spent on one component
	comps  int // number of connected components
}

// components returns the connected components (sorted atom lists).
func (m *Molecule) components() [][]int {
	n := len(m.Atoms)
	seen := make([]bool, n)
	var out [][]int
	// The components partition the atoms, so their lists share one array:
	// each list grows into the free space after the previous ones.
	buf := make([]int, n)
	for i := 0; i < n; i++ {
		if seen[i] {
			continue
		}
		seen[i] = true
		list := buf[:1]
		list[0] = i
		for k := 0; k < len(list); k++ {
			for _, b := range m.Adj[list[k]] {
				if o := m.Other(b, list[k]); !seen[o] {
					seen[o] = true
					list = append(list, o)
				}
			}
		}
		slices.Sort(list)
		out = append(out, list[:len(list):len(list)])
		buf = buf[len(list):]
	}
	return out
}

// symmetry runs the search on every connected component (work budget shared
// in equal parts), orders the components by their canonical strings and
// joins the results: identical components are exchanged by extra generators
// and multiply the group order by k! for k copies.
func (m *Molecule) symmetry(budget int, withAut bool) symmetryInfo {
	return m.symmetryCtx(nil, budget, withAut)
}

// symmetryCtx is symmetry with cancellation (ctx may be nil): a cancelled
// search ends as if its budget ran out (exact false).
func (m *Molecule) symmetryCtx(ctx context.Context, budget int, withAut bool) symmetryInfo {
	n := len(m.Atoms)
	comps := m.components()
	type compInfo struct {
		atoms  []int
		labels []int // local canonical labels
		text   string
	}
	info := symmetryInfo{labels: make([]int, n), exact: true, comps: len(comps)}
	cis := make([]compInfo, len(comps))
	per := budget / max(1, len(comps))
	local := make([]int, n)
	var seen []bool
	for c, atoms := range comps {
		g := m.cgraphOf(atoms, local)
		root := g.refine(g.cell0)
		if len(seen) < len(atoms) {
			seen = make([]bool, len(atoms))
		}
		if discrete(root, seen[:len(atoms)]) {
			// Refinement alone told every atom apart: the refined partition
			// is the only leaf of the search, and the group is trivial.
			g.release()
			for k, a := range atoms {
				info.labels[a] = root[k]
			}
			cis[c] = compInfo{atoms: atoms, labels: root}
			continue
		}
		s := &search{g: g, budget: per, root: root, ctx: ctx}
		var sizes []int
		exact := true
		if withAut {
			sizes, exact = s.automorphisms()
		}
		labels := s.canonical()
		g.release()
		if labels == nil { // budget ran out before any leaf: use the refined partition order
			labels = tieBreak(root)
		}
		info.steps = max(info.steps, s.steps)
		if !exact || s.exhausted {
			info.exact = false
		}
		for _, k := range sizes {
			if k > 1 {
				info.order = mulOrder(info.order, big.NewInt(int64(k)))
			}
		}
		for _, gm := range s.gens {
			glob := make([]int, n)
			for i := range glob {
				glob[i] = i
			}
			for k, a := range atoms {
				glob[a] = atoms[gm[k]]
			}
			info.gens = append(info.gens, glob)
		}
		for k, a := range atoms {
			info.labels[a] = labels[k]
		}
		cis[c] = compInfo{atoms: atoms, labels: labels}
	}
	if len(comps) == 1 {
		return info
	}
	// canonical text of each component alone, then order components by it
	for c := range cis {
		lab := make([]int, n)
		for i := range lab {
			lab[i] = n + i // other components after this one
		}
		for k, a := range cis[c].atoms {
			lab[a] = cis[c].labels[k]
		}
		full := m.writeSMILES(lab, false)
		if d := strings.IndexByte(full, '.'); d >= 0 {
			full = full[:d]
		}
		cis[c].text = full
	}
	slices.SortStableFunc(cis, func(a, b compInfo) int {
		if len(a.atoms) != len(b.atoms) {
			return len(a.atoms) - len(b.atoms)
		}
		return strings.Compare(a.text, b.text)
	})
	offset := 0
	for c := range cis {
		for k, a := range cis[c].atoms {
			info.labels[a] = offset + cis[c].labels[k]
		}
		offset += len(cis[c].atoms)
	}
	for c := 0; c < len(cis); {
		d := c + 1
		for d < len(cis) && cis[d].text == cis[c].text && len(cis[d].atoms) == len(cis[c].atoms) {
			d++
		}
		if d-c > 1 {
			info.order = mulOrder(info.order, new(big.Int).MulRange(1, int64(d-c)))
		}
		for e := c + 1; e < d; e++ {
			// swap component c and e atom by atom through their labels
			byLabel := func(ci compInfo) []int {
				out := make([]int, len(ci.atoms))
				for k, a := range ci.atoms {
					out[ci.labels[k]] = a
				}
				return out
			}
			x, y := byLabel(cis[c]), byLabel(cis[e])
			gm := make([]int, n)
			for i := range gm {
				gm[i] = i
			}
			for k := range x {
				gm[x[k]], gm[y[k]] = y[k], x[k]
			}
			info.gens = append(info.gens, gm)
		}
		c = d
	}
	return info
}

// mulOrder returns order × k, where a nil order stands for 1.
func mulOrder(order, k *big.Int) *big.Int {
	if order == nil {
		return k
	}
	return order.Mul(order, k)
}

// tieBreak turns a partition (ranks = cell starts) into a labelling by atom
// index within cells; used only when the search budget is exhausted.
func tieBreak(rank []int) []int {
	idx := make([]int, len(rank))
	for i := range idx {
		idx[i] = i
	}
	slices.SortStableFunc(idx, func(a, b int) int { return rank[a] - rank[b] })
	out := make([]int, len(rank))
	for k, a := range idx {
		out[a] = k
	}
	return out
}

// SymmetryClasses returns, for every atom of the graph, the number of its
// symmetry class: atoms a and b share a class exactly when an automorphism of
// the molecular graph maps a to b (orbits of the graph automorphism group;
// atoms coloured by element, isotope, charge, hydrogen count, radical
// electrons and aromaticity, bonds by order or aromaticity; stereo marks are
// ignored). Classes are numbered 0, 1, … in order of their smallest
// canonical label, so the numbering does not depend on input order. If the
// search budget (DefaultSearchWork) runs out, the classes may be finer than
// the true orbits for exotic cages; ordinary molecules never come near it.
func (m *Molecule) SymmetryClasses() []int {
	if d := m.cache(); d != nil {
		return slices.Clone(d.classes)
	}
	info := m.symmetry(DefaultSearchWork, true)
	return orbitClasses(len(m.Atoms), info.gens, info.labels)
}

func orbitClasses(n int, gens [][]int, labels []int) []int {
	scratch := make([]int, 3*n)
	parent, byLabel, num := scratch[:n:n], scratch[n:2*n:2*n], scratch[2*n:]
	for i := range parent {
		parent[i] = i
	}
	for _, gm := range gens {
		for a, b := range gm {
			union(parent, a, b)
		}
	}
	// byLabel[l] is the atom with canonical label l; walking labels upwards
	// meets each orbit first at its smallest label.
	for a, l := range labels {
		byLabel[l] = a
	}
	for i := range num {
		num[i] = -1
	}
	next := 0
	for _, a := range byLabel {
		if r := find(parent, a); num[r] < 0 {
			num[r] = next
			next++
		}
	}
	out := make([]int, n)
	for a := range out {
		out[a] = num[find(parent, a)]
	}
	return out
}

// AutomorphismCount returns the order of the automorphism group of the full
// molecular graph with every hydrogen an explicit vertex (methane 24, ethane
// 72, benzene 12, neopentane 31104). It is |Aut(H)| × Π hᵢ!, where H is the
// graph of the non-hydrogen atoms coloured as in SymmetryClasses (hydrogen
// count included) and hᵢ the hydrogen count of atom i: every automorphism of
// the full graph permutes heavy atoms preserving hydrogen counts, and the
// hydrogens on one atom can be permuted freely. Stereo is ignored (this is the
// constitutional symmetry; the external symmetry number of a rigid 3-D
// structure is a subgroup). |Aut(H)| is the product of orbit sizes along a
// chain of point stabilisers, found by a backtracking search of at most
// maxSteps partition refinements; exact is false when the budget ran out
// (the returned number is then a lower bound, 1 at least).
func (m *Molecule) AutomorphismCount(maxSteps int) (*big.Int, bool) {
	budget := maxSteps * max(1, len(m.Atoms))
	var info symmetryInfo
	// The search is deterministic: a cached run that stayed within this
	// budget on every component is exactly the run this budget would give.
	if d := m.cache(); d != nil && d.info.exact && d.info.steps <= budget/max(1, d.info.comps) {
		info = d.info
	} else {
		info = m.symmetry(budget, true)
	}
	n := big.NewInt(1)
	if info.exact && info.order != nil {
		n.Set(info.order)
	}
	for _, a := range m.Atoms {
		if a.HCount > 1 {
			n.Mul(n, new(big.Int).MulRange(1, int64(a.HCount)))
		}
	}
	return n, info.exact
}
