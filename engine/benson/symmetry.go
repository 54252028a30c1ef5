package benson

import (
	"math"
	"slices"

	"kiln.dev/kiln/engine/molecule"
)

// Symmetry number σ (external × internal rotations) from the graph.
//
// σ counts the permutations of identical atoms that rigid rotation and
// internal rotation of tops can perform. kiln enumerates the automorphisms
// of the heavy-atom graph (hydrogens as counts) and keeps those that are
// realisable as proper rotations of an idealised structure:
//
//   - tetrahedral centres (sp3 C; N with one and O with two lone pairs as
//     extra ligands) must see an even permutation of their four ligands; with
//     two or more H (or lone pairs) the H can always be permuted to fix the
//     parity, giving a factor h!·l!/2 instead of a check;
//   - other centres (planar sp2, linear sp, planar radical centres) allow any
//     permutation of their H: factor h!;
//   - an acyclic double bond keeps cis substituents cis (geometry from / \
//     marks, otherwise substituents trans); an end with two H halves the count
//     instead; allenes keep the handedness of their perpendicular planes;
//   - rings are flat except saturated six-membered rings, which are chairs:
//     a ring mapped onto itself by a rotation of k positions needs k even, by
//     a reflection i → k−i needs k odd (D3d chair instead of D6h).
//
// Checked cases (tests): methane 12, ethane 18, propane 18, n-butane 18,
// isobutane 81, neopentane 972, ethylene 4, benzene 12, toluene 6,
// cyclohexane 6, water 2, CO2 2, acetone 18, methanol 3, ethanol 3, dimethyl
// ether 18, formaldehyde 2, acetylene 2, propene 3, naphthalene 4.
// Limitation: stereocentres marked @/@@ are not used as reference
// configurations, so σ of a molecule with equivalent stereocentres (meso vs
// chiral) reflects an arbitrary one of the diastereomers.

// SymmetryNumber returns the total symmetry number σ of m (external ×
// internal), at least 1.
func SymmetryNumber(m *molecule.Molecule) int {
	if m == nil || len(m.Atoms) == 0 {
		return 1
	}
	return newSym(newGraph(m)).number()
}

// OpticalIsomers returns n = 2^k where k counts potential stereocentres (sp3
// carbon with four constitutionally different ligands) that carry no @/@@
// mark: an unmarked centre stands for both configurations, a marked one for
// the single enantiomer written.
func OpticalIsomers(m *molecule.Molecule) int {
	if m == nil || len(m.Atoms) == 0 {
		return 1
	}
	return newSym(newGraph(m)).opticalIsomers()
}

func (s *sym) opticalIsomers() int {
	m := s.g.m
	k := 0
	for _, c := range s.stereocentres() {
		if m.Atoms[c].Chirality == "" {
			k++
		}
	}
	if k > 30 {
		k = 30
	}
	return 1 << k
}

type sym struct {
	g      *graph
	n      int
	lab    []byte // n×n bond labels: 0 none, 1..3 order, 4 aromatic
	color  []int
	tetra  []bool // tetrahedral centre whose parity is checked
	lp     []int  // lone pairs counted as ligands
	static float64
	dbs    []dbUnit
	allene []alleneUnit
	chairs [][]int
	order  []int // search order
}

type dbUnit struct {
	x, y   int
	cisRef bool
}

type alleneUnit struct{ c, x, y int }

func (g *graph) allSingle(i int) bool {
	for _, b := range g.nbrBond[i] {
		if g.m.Bonds[b].Order != 1 || g.m.Bonds[b].Aromatic {
			return false
		}
	}
	return true
}

// lonePairs is the number of lone pairs kiln treats as ligands of atom i.
func (g *graph) lonePairs(i int) int {
	a := g.m.Atoms[i]
	d := len(g.nbr[i])
	if a.Radical != 0 || !g.allSingle(i) {
		return 0
	}
	switch a.Element {
	case "N", "P":
		if d+a.HCount == 3 {
			return 1
		}
	case "O", "S":
		if d+a.HCount == 2 {
			return 2
		}
	}
	return 0
}

func factorial(n int) float64 {
	f := 1.0
	for i := 2; i <= n; i++ {
		f *= float64(i)
	}
	return f
}

func newSym(g *graph) *sym {
	m := g.m
	n := len(m.Atoms)
	s := &sym{g: g, n: n, lab: make([]byte, n*n), tetra: make([]bool, n), lp: make([]int, n), static: 1}
	for _, b := range m.Bonds {
		l := byte(b.Order)
		if b.Aromatic {
			l = 4
		}
		s.lab[b.A*n+b.B], s.lab[b.B*n+b.A] = l, l
	}
	s.refine()
	for i, a := range m.Atoms {
		d, h := len(g.nbr[i]), a.HCount
		s.lp[i] = g.lonePairs(i)
		l := s.lp[i]
		switch {
		case d+h <= 1:
		case g.allSingle(i) && a.Radical == 0 && d+h+l == 4 && (a.Element != "C" || l == 0):
			if h >= 2 || l >= 2 {
				s.static *= factorial(h) * factorial(l) / 2
			} else {
				s.tetra[i] = true
			}
		default:
			s.static *= factorial(h)
		}
	}
	// double bonds and allenes
	for e, b := range m.Bonds {
		if b.Order != 2 || b.Aromatic || g.ringBond[e] {
			continue
		}
		x, y := b.A, b.B
		if g.typ[x] == "Ca" || g.typ[y] == "Ca" {
			continue
		}
		nx := len(g.nbr[x]) - 1 + m.Atoms[x].HCount + s.endLP(x)
		ny := len(g.nbr[y]) - 1 + m.Atoms[y].HCount + s.endLP(y)
		if nx != 2 || ny != 2 {
			continue
		}
		if m.Atoms[x].HCount == 2 || m.Atoms[y].HCount == 2 {
			s.static /= 2
			continue
		}
		u := dbUnit{x: x, y: y}
		lx, ly := g.ligands(x, y), g.ligands(y, x)
		sx, okx := g.sides(x, y)
		sy, oky := g.sides(y, x)
		if okx && oky && len(lx) > 0 && len(ly) > 0 {
			u.cisRef = sx[0] == sy[0]
		}
		s.dbs = append(s.dbs, u)
	}
	for c := range m.Atoms {
		if g.typ[c] != "Ca" {
			continue
		}
		var ends []int
		for k, x := range g.nbr[c] {
			if m.Bonds[g.nbrBond[c][k]].Order == 2 {
				ends = append(ends, x)
			}
		}
		if len(ends) != 2 {
			continue
		}
		x, y := ends[0], ends[1]
		if len(g.nbr[x])-1+m.Atoms[x].HCount != 2 || len(g.nbr[y])-1+m.Atoms[y].HCount != 2 {
			continue
		}
		if m.Atoms[x].HCount == 2 || m.Atoms[y].HCount == 2 {
			s.static /= 2
			continue
		}
		s.allene = append(s.allene, alleneUnit{c, x, y})
	}
	// chairs: saturated six-membered rings
	for _, r := range g.rings {
		if len(r) != 6 {
			continue
		}
		ok := true
		for k, a := range r {
			b := g.bondBetween(a, r[(k+1)%6])
			if m.Bonds[b].Order != 1 || m.Bonds[b].Aromatic || !g.allSingle(a) || m.Atoms[a].Radical != 0 {
				ok = false
			}
		}
		if ok {
			s.chairs = append(s.chairs, r)
		}
	}
	// search order: BFS per component
	// s.order doubles as the BFS queue: the atoms from head on are queued.
	seen := make([]bool, n)
	s.order = make([]int, 0, n)
	for st := 0; st < n; st++ {
		if seen[st] {
			continue
		}
		seen[st] = true
		s.order = append(s.order, st)
		for head := len(s.order) - 1; head < len(s.order); head++ {
			v := s.order[head]
			for _, w := range g.nbr[v] {
				if !seen[w] {
					seen[w] = true
					s.order = append(s.order, w)
				}
			}
		}
	}
	return s
}

func (s *sym) endLP(x int) int {
	if s.g.m.Atoms[x].Element == "N" && len(s.g.nbr[x])+s.g.m.Atoms[x].HCount == 2 {
		return 1
	}
	return 0
}

// refine computes colour classes by iterated neighbourhood refinement
// (1-dimensional Weisfeiler–Leman) from element, H count, aromaticity,
// radical, charge, isotope and degree.
func (s *sym) refine() {
	m := s.g.m
	// Every signature lives in one slab: atom i's has room for its colour
	// and one entry per neighbour (at least the 7 initial invariants).
	total := 0
	for i := range m.Atoms {
		total += max(7, len(s.g.nbr[i])+1)
	}
	slab := make([]int, total)
	sigs := make([][]int, s.n)
	for i, a := range m.Atoms {
		arom := 0
		if a.Aromatic {
			arom = 1
		}
		el := 0
		for _, c := range a.Element {
			el = el*128 + int(c)
		}
		w := max(7, len(s.g.nbr[i])+1)
		sig := slab[:7:w]
		slab = slab[w:]
		sig[0], sig[1], sig[2], sig[3], sig[4], sig[5], sig[6] = el, a.HCount, arom, a.Radical, a.Charge, a.Isotope, len(s.g.nbr[i])
		sigs[i] = sig
	}
	// Ranks alternate between two buffers: the previous colouring is read
	// while the signatures are rebuilt, then overwritten by the next ranking.
	idx := make([]int, 3*s.n)
	idx, cur, spare := idx[:s.n:s.n], idx[s.n:2*s.n:2*s.n], idx[2*s.n:]
	s.color = rankSigs(sigs, idx, cur)
	classes := count(s.color)
	for {
		for i := range m.Atoms {
			sig := sigs[i][:0]
			sig = append(sig, s.color[i])
			for _, j := range s.g.nbr[i] {
				sig = append(sig, int(s.lab[i*s.n+j])*100000+s.color[j])
			}
			slices.Sort(sig[1:])
			sigs[i] = sig
		}
		next := rankSigs(sigs, idx, spare)
		c := count(next)
		spare = s.color
		s.color = next
		if c == classes {
			return
		}
		classes = c
	}
}

// rankSigs numbers distinct signatures 0, 1, … in lexicographic order into
// out (len(sigs)), using idx (len(sigs)) as scratch, and returns out.
func rankSigs(sigs [][]int, idx, out []int) []int {
	for i := range idx {
		idx[i] = i
	}
	slices.SortFunc(idx, func(a, b int) int { return slices.Compare(sigs[a], sigs[b]) })
	r := 0
	for k, i := range idx {
		if k > 0 && slices.Compare(sigs[idx[k-1]], sigs[i]) != 0 {
			r++
		}
		out[i] = r
	}
	return out
}

func count(c []int) int {
	max := -1
	for _, x := range c {
		if x > max {
			max = x
		}
	}
	return max + 1
}

func (s *sym) number() int {
	phi := make([]int, s.n)
	used := make([]bool, s.n)
	for i := range phi {
		phi[i] = -1
	}
	var valid int
	s.search(0, phi, used, &valid)
	sigma := int(math.Round(s.static * float64(valid)))
	if sigma < 1 {
		sigma = 1
	}
	return sigma
}

func (s *sym) search(k int, phi []int, used []bool, valid *int) {
	if k == s.n {
		if s.proper(phi) {
			*valid++
		}
		return
	}
	v := s.order[k]
	try := func(w int) {
		if used[w] || s.color[w] != s.color[v] {
			return
		}
		for j := 0; j < k; j++ {
			u := s.order[j]
			if s.lab[v*s.n+u] != s.lab[w*s.n+phi[u]] {
				return
			}
		}
		phi[v], used[w] = w, true
		s.search(k+1, phi, used, valid)
		phi[v], used[w] = -1, false
	}
	// a mapped neighbour restricts the candidates to its image's neighbours
	for _, u := range s.g.nbr[v] {
		if phi[u] >= 0 {
			for _, w := range s.g.nbr[phi[u]] {
				try(w)
			}
			return
		}
	}
	for w := 0; w < s.n; w++ {
		try(w)
	}
}

// parity returns true for an even permutation given as image positions.
func parity(p []int) bool {
	inv := 0
	for i := range p {
		for j := i + 1; j < len(p); j++ {
			if p[i] > p[j] {
				inv++
			}
		}
	}
	return inv%2 == 0
}

func indexOf(xs []int, v int) int {
	for i, x := range xs {
		if x == v {
			return i
		}
	}
	return -1
}

// proper reports whether heavy-atom automorphism phi is realisable by
// rotations (see the package notes on σ).
func (s *sym) proper(phi []int) bool {
	g := s.g
	var buf [4]int
	for a := 0; a < s.n; a++ {
		if !s.tetra[a] {
			continue
		}
		b := phi[a]
		p := buf[:0]
		for _, x := range g.nbr[a] {
			p = append(p, indexOf(g.nbr[b], phi[x]))
		}
		for len(p) < 4 { // H then lone pair keep their places
			p = append(p, len(p))
		}
		if !parity(p) {
			return false
		}
	}
	for _, u := range s.dbs {
		x2, y2 := phi[u.x], phi[u.y]
		lx, ly := g.ligands(u.x, u.y), g.ligands(u.y, u.x)
		px, py := 0, 0
		if len(lx) > 0 {
			px = indexOf(g.ligands(x2, y2), phi[lx[0]])
		}
		if len(ly) > 0 {
			py = indexOf(g.ligands(y2, x2), phi[ly[0]])
		}
		// reference of the image bond, oriented as (x2, y2)
		ref := s.cisRefOf(x2, y2)
		if ((px == py) == ref) != u.cisRef {
			return false
		}
	}
	for _, u := range s.allene {
		c2 := phi[u.c]
		var img *alleneUnit
		for i := range s.allene {
			if s.allene[i].c == c2 {
				img = &s.allene[i]
			}
		}
		if img == nil {
			return false
		}
		p := buf[:0]
		for _, end := range []int{u.x, u.y} {
			e2 := phi[end]
			base := 0
			if e2 != img.x {
				base = 2
			}
			for _, l := range g.ligands(end, u.c) {
				p = append(p, base+indexOf(g.ligands(e2, c2), phi[l]))
			}
			if len(g.ligands(end, u.c)) == 1 {
				p = append(p, base+1)
			}
		}
		if !parity(p) {
			return false
		}
	}
	for _, r := range s.chairs {
		j := indexOf(r, phi[r[0]])
		if j < 0 {
			continue
		}
		j1 := indexOf(r, phi[r[1]])
		if j1 < 0 {
			continue
		}
		if j1 == (j+1)%6 {
			if j%2 != 0 {
				return false
			}
		} else if j%2 == 0 {
			return false
		}
	}
	return true
}

// cisRefOf returns the reference geometry of the double bond x=y oriented
// from x: whether the first ligands of x and of y are cis.
func (s *sym) cisRefOf(x, y int) bool {
	for _, u := range s.dbs {
		if u.x == x && u.y == y {
			return u.cisRef
		}
		if u.x == y && u.y == x {
			return u.cisRef
		}
	}
	return false
}

// stereocentres lists sp3 carbons with four ligands in pairwise different
// colour classes (at most one H).
func (s *sym) stereocentres() []int {
	g := s.g
	var out []int
	for i, a := range g.m.Atoms {
		d := len(g.nbr[i])
		if a.Element != "C" || !g.allSingle(i) || d+a.HCount != 4 || a.HCount > 1 || a.Radical != 0 {
			continue
		}
		distinct := true
		for x := 0; x < d && distinct; x++ {
			for y := x + 1; y < d; y++ {
				if s.color[g.nbr[i][x]] == s.color[g.nbr[i][y]] {
					distinct = false
					break
				}
			}
		}
		if distinct {
			out = append(out, i)
		}
	}
	return out
}
