package molecule

import (
	"context"
	"errors"
	"fmt"
	"math/big"
	"math/bits"
	"slices"
	"strconv"
	"strings"
	"sync"
)

// ErrWorkLimit is wrapped by every error a per-structure computation
// (symmetry search, symmetry number) returns when it ran out of its work
// budget: the structure is too symmetric or too large to analyse within the
// bound, and no number is given.
var ErrWorkLimit = errors.New("work limit reached")

// maxFragmentGroup bounds the symmetry elements of one rigid fragment that
// SymmetryNumber enumerates to choose its stereo configuration (point groups
// of organic molecules have at most 120 elements; larger groups arise only
// in artificial inputs).
const maxFragmentGroup = 5000

// maxSeeds bounds the starting elements of the configuration search.
const maxSeeds = 64

// Symmetry number σ (external × internal rotation), one rule for every
// structure.
//
// σ counts the permutations of identical atoms that rigid rotation of the
// whole molecule and rotation of its internal tops can perform (Benson,
// Thermochemical Kinetics, 2nd ed. 1976, ch. 2: σ = σ_ext·Π σ_int). kiln
// computes it from the graph alone:
//
//  1. The molecule is cut at its rotatable bonds (single, non-aromatic bonds
//     that lie on no ring) into rigid fragments: single atoms, ring systems,
//     double- and triple-bonded units. Fragments and rotatable bonds form a
//     tree per connected component.
//  2. The tree's centre (a fragment, or a rotatable bond) is the frame: a
//     central fragment contributes all its proper symmetry operations; a
//     central bond contributes 2 when its two halves are identical, 1
//     otherwise. Every other fragment is a top rotating about the bond to
//     its parent and contributes the proper operations that keep that bond
//     fixed (CH3 3, C(CH3)3 3, phenyl 2, OH 1).
//  3. The operations of a fragment are the automorphisms of its atom graph
//     (atoms coloured by element, charge, isotope, hydrogens, radical,
//     aromaticity, orbit in the whole molecule and the kind of branch on each
//     outside bond) that a proper rotation of an idealised structure can do:
//     - a tetrahedral atom (sp3; N/P with one and O/S with two lone pairs
//     counted as ligands) must see an even permutation of its four ligands;
//     when two of its outside ligands (H, lone pairs, identical branches) are
//     alike, swapping them fixes the parity and the atom contributes
//     Π k!/2 instead of a check;
//     - other atoms (trigonal, linear, radical centres) permute alike outside
//     ligands freely: Π k!; but a carbon radical centre with two or more
//     fluorines is pyramidal (PyramidalRadical) and is checked like a
//     tetrahedral atom whose singly occupied orbital is the fourth ligand
//     (CF3• σ 3, CHF2• σ 1);
//     - an acyclic double bond keeps cis partners cis (an end with two alike
//     ligands halves the count instead; the lone pair of an imine N and the
//     singly occupied orbital of a bent vinyl-type radical carbon count as
//     a ligand of its end); an allene keeps its handedness;
//     cumulene chains generalise both: with an odd number of double bonds
//     the ends are coplanar (cis/trans, butatriene D2h), with an even
//     number perpendicular (handedness, pentatetraene D2d);
//     - a carbon radical or cation centre with three σ partners next to a
//     double bond or aromatic ring is planar and shares the unpaired
//     electron (or charge) along the allylic chain: the system is one rigid
//     delocalised unit whose ends are alike when the hybrid is symmetric
//     (allyl and benzyl C2v, σ 2), and a planar end with two alike outside
//     ligands halves the count like a double-bond end;
//     - rings are planar, except a lone saturated six-membered ring, which is
//     a chair (D3d), and cages (every atom bonded to three or more atoms of
//     the fragment, three or more rings), which are 3-D: a three-connected
//     cage atom without other ligands (fullerene carbon) is checked like a
//     tetrahedral atom whose fourth ligand is its outward side;
//     - rigid 3-D fragments (cages, bridged and fused saturated rings) are
//     checked at every tetrahedral atom together: kiln picks the
//     configuration of the tetrahedral atoms and double bonds that gives the
//     most proper operations (the most symmetric stereoisomer — for a cage,
//     the only one that exists), by a search seeded at each of the first 64
//     symmetry elements in canonical order. For an achiral rigid structure
//     this keeps exactly the rotations: half of its graph automorphisms
//     (adamantane 24 → 12, cubane 48 → 24, norbornane 4 → 2). Geometries
//     that small rings cannot take are excluded first: fusions with a ring
//     of at most four atoms (or two of at most five) are cis, and small
//     bridged bicycles (at most nine atoms) have both bridgeheads "out".
//  4. Identical '.'-separated components multiply σ by k! for k copies.
//
// A molecule with a hypervalent centre (more than four σ partners and lone
// pairs: SF4, SF6, ClF3) is outside this rule; its σ is the VSEPR shape's
// when the centre is the whole molecule, and an error otherwise
// (hypervalent.go).
//
// Written configurations are used inside rigid fragments: tetrahedral
// centres marked @/@@ (@TH1/@TH2) and double bonds marked / \ fix their
// configuration relative to each other (cis-1,4-dimethylcyclohexane 9,
// trans 18), and the exchange of two identical halves across a central
// rotatable bond counts only when it keeps the written @/@@ marks (meso- and
// dl-2,3-dichlorobutane: 9 and 18). Unmarked units take the most symmetric
// choice (unmarked 2,3-dichlorobutane: 18). Branches on
// one atom count as alike when colour refinement with that atom singled out
// cannot tell them apart (exact for trees; graphs that refinement cannot
// separate are not expected in chemistry). Work is bounded: the symmetry
// search has a budget (DefaultSearchWork) and a fragment's symmetry elements
// are enumerated only up to 5000; beyond either bound the result is an error
// wrapping ErrWorkLimit, never a guess.

// SymmetryNumber returns the total symmetry number σ (external × internal)
// of m, at least 1, as an exact integer (see the rule above).
func (m *Molecule) SymmetryNumber() (*big.Int, error) {
	return m.SymmetryNumberContext(context.Background())
}

// SymmetryNumberContext is SymmetryNumber with cancellation: it returns
// ctx.Err() (wrapped) if ctx is done before the result is known.
func (m *Molecule) SymmetryNumberContext(ctx context.Context) (*big.Int, error) {
	return m.symmetryNumber(ctx, DefaultSearchWork)
}

// symmetryNumber is SymmetryNumberContext with a work budget (atom
// refinements): the whole-molecule search gets it, and the fragment searches
// share another budget of the same size.
func (m *Molecule) symmetryNumber(ctx context.Context, budget int) (*big.Int, error) {
	if len(m.Atoms) == 0 {
		return big.NewInt(1), nil
	}
	hybrid, hbonds := m.conjugatedRadical()
	if hybrid != nil {
		m = m.hybridForm(hybrid, hbonds)
	}
	info, err := m.symmetryInfo(ctx, budget)
	if err != nil {
		return nil, err
	}
	classes := m.classesOf(info, budget)
	sc := newSigmaCalc(ctx, m, classes)
	sc.hybrid = hybrid
	sc.budget = budget
	sc.gens = info.gens
	defer sc.release()
	return sc.total()
}

// release recycles sc and the whole-molecule graph it built, if any;
// nothing of sc may be used afterwards.
func (sc *sigmaCalc) release() {
	if sc.g != nil {
		sc.g.release()
	}
	bufs, out := sc.bufs, sc.outBuf
	*sc = sigmaCalc{bufs: bufs, outBuf: out}
	sigmaCalcs.Put(sc)
}

// symmetryInfo returns the full symmetry analysis of m (cached when m came
// from ParseSMILES and the budget is the default), or an error when the
// search budget ran out.
func (m *Molecule) symmetryInfo(ctx context.Context, budget int) (symmetryInfo, error) {
	var info symmetryInfo
	if d := m.cache(); d != nil && budget == DefaultSearchWork {
		info = d.info
	} else {
		info = m.symmetryCtx(ctx, budget, true)
	}
	if err := ctx.Err(); err != nil {
		return info, fmt.Errorf("symmetry of %s: %w", shortSMILES(m.SMILES), err)
	}
	if !info.exact {
		return info, fmt.Errorf("symmetry of %s: %w (more than %d refinement steps)", shortSMILES(m.SMILES), ErrWorkLimit, budget)
	}
	return info, nil
}

// classesOf returns the orbit classes of info, which symmetryInfo returned
// for m and budget: the cached ones when info came from the cache (shared:
// callers must not modify them).
func (m *Molecule) classesOf(info symmetryInfo, budget int) []int {
	if d := m.cache(); d != nil && budget == DefaultSearchWork {
		return d.classes
	}
	return orbitClasses(len(m.Atoms), info.gens, info.labels)
}

// Ligand colours of the outside positions of a fragment atom.
const (
	colOut    = -5 // the outward side of a three-connected cage atom
	colParent = -4 // the bond to the parent fragment (unique)
	colLP     = -3 // a lone pair counted as a ligand
	colSOMO   = -6 // the singly occupied σ orbital of a bent vinyl-type radical centre
	colH      = -2 // an implicit hydrogen
)

type sigmaCalc struct {
	ctx     context.Context
	m       *Molecule
	n       int
	classes []int
	rot     []bool // per bond: rotatable
	inRing  []bool // per bond: on a ring
	frag    []int  // per atom: fragment index
	frags   [][]int
	g       *cgraph // whole molecule, for branch classes
	root    []int   // refined initial partition of g
	local   []int
	lp      []int
	virtual []bool  // per atom: cage atom with a virtual outward ligand
	budget  int     // refinement steps left for the fragment searches
	gens    [][]int // generators of the whole molecule's automorphism group
	elems   [][]int // its elements, enumerated on demand (at most 5001)
	marked  []int   // atoms with a written tetrahedral mark, nil until known
	hybrid  []bool  // per atom: in a conjugated radical (or cation) system, nil if none
	outBuf  []int   // the list outside returns, reused
	bufs    sigmaBufs
	// parent bond of the fragment being analysed
	pAtom, pNbr int
}

// sigmaBufs are the backing arrays of a sigmaCalc, kept when it is
// recycled (see sigmaCalcs).
type sigmaBufs struct {
	scratch, ints []int
	flags         []bool
	frags         [][]int
}

// sigmaCalcs recycles the per-molecule state of σ (released by release):
// every estimate computes one σ.
var sigmaCalcs = sync.Pool{New: func() any { return new(sigmaCalc) }}

func newSigmaCalc(ctx context.Context, m *Molecule, classes []int) *sigmaCalc {
	n := len(m.Atoms)
	sc := sigmaCalcs.Get().(*sigmaCalc)
	bufs, out := sc.bufs, sc.outBuf
	bufs.scratch = grow(bufs.scratch, 3*n)
	bufs.flags = grow(bufs.flags, n+len(m.Bonds))
	bufs.ints = grow(bufs.ints, 3*n)
	scratch, flags := bufs.scratch, bufs.flags
	clear(flags)
	*sc = sigmaCalc{ctx: ctx, m: m, n: n, classes: classes, local: scratch[:n:n], lp: scratch[n : 2*n : 2*n], virtual: flags[:n:n],
		outBuf: out[:0], bufs: bufs}
	inRing := m.ringBondFlags()
	sc.inRing = inRing
	sc.rot = flags[n:]
	parent := scratch[2*n:]
	for i := range parent {
		parent[i] = i
	}
	for b, bd := range m.Bonds {
		sc.rot[b] = bd.Order == 1 && !bd.Aromatic && !inRing[b]
		if !sc.rot[b] {
			union(parent, bd.A, bd.B)
		}
	}
	// Fragments are numbered in order of their first atom; each lists its
	// atoms ascending, all lists in one array.
	ints := bufs.ints
	id, members := ints[n:2*n:2*n], ints[2*n:]
	sc.frag = ints[:n:n]
	for i := range id {
		id[i] = -1
	}
	var sizes []int
	for i := 0; i < n; i++ {
		r := find(parent, i)
		if id[r] < 0 {
			id[r] = len(sizes)
			sizes = append(sizes, 0)
		}
		sc.frag[i] = id[r]
		sizes[id[r]]++
	}
	sc.frags = grow(sc.bufs.frags, len(sizes))
	sc.bufs.frags = sc.frags
	start := 0
	for f, k := range sizes {
		sc.frags[f] = members[start : start : start+k]
		start += k
	}
	for i := 0; i < n; i++ {
		f := sc.frag[i]
		sc.frags[f] = append(sc.frags[f], i)
	}
	for i := range m.Atoms {
		sc.lp[i] = m.lonePairLigands(i)
	}
	return sc
}

// allSingle reports whether every bond of atom i is a non-aromatic single bond.
func (m *Molecule) allSingle(i int) bool {
	for _, b := range m.Adj[i] {
		if m.Bonds[b].Order != 1 || m.Bonds[b].Aromatic {
			return false
		}
	}
	return true
}

// lonePairLigands is the number of lone pairs counted as ligands of a
// tetrahedral atom: 1 for N and P with three σ partners, 2 for O and S with
// two, all bonds single, not a radical (common practice); and for S, Se and
// P with double bonds (sulfoxide, sulfone, phosphine oxide), the lone pairs
// their valence electrons leave (VSEPR, common practice), which makes a
// sulfoxide's sulfur pyramidal and a sulfone's tetrahedral.
func (m *Molecule) lonePairLigands(i int) int {
	a := m.Atoms[i]
	d := len(m.Adj[i])
	if m.PyramidalRadical(i) {
		return 1 // the singly occupied orbital takes the fourth position
	}
	if a.Radical != 0 {
		return 0
	}
	if !m.allSingle(i) {
		if lp, ok := m.hypervalentLonePairs(i); ok {
			return lp
		}
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

// hypervalentLonePairs returns the lone pairs of a non-aromatic S, Se or P
// atom with double (no triple) bonds, from its valence electrons, when it has
// four electron domains (σ partners + lone pairs): ok is false otherwise.
func (m *Molecule) hypervalentLonePairs(i int) (int, bool) {
	a := m.Atoms[i]
	switch a.Element {
	case "S", "Se", "P":
	default:
		return 0, false
	}
	valence, _ := valenceElectrons(a.Element, 0)
	if a.Aromatic || a.Radical != 0 {
		return 0, false
	}
	bonds := a.HCount
	for _, b := range m.Adj[i] {
		o := m.Bonds[b].Order
		if o > 2 || m.Bonds[b].Aromatic {
			return 0, false
		}
		bonds += o
	}
	free := valence - a.Charge - bonds
	if free < 0 || free%2 != 0 {
		return 0, false
	}
	lp := free / 2
	if len(m.Adj[i])+a.HCount+lp != 4 {
		return 0, false
	}
	return lp, true
}

// tetrahedral reports whether atom i is a tetrahedral centre (see the rule).
func (sc *sigmaCalc) tetrahedral(i int) bool {
	m := sc.m
	a := m.Atoms[i]
	l := sc.lp[i]
	if _, ok := m.hypervalentLonePairs(i); ok && !m.allSingle(i) {
		return true
	}
	if m.PyramidalRadical(i) {
		return true
	}
	return m.allSingle(i) && a.Radical == 0 && len(m.Adj[i])+a.HCount+l == 4 && (a.Element != "C" || l == 0)
}

// minPyramidalFluorines is the number of fluorine ligands that make a
// carbon radical centre pyramidal for the symmetry number (see
// PyramidalRadical).
const minPyramidalFluorines = 2

// PyramidalRadical reports whether atom i is a pyramidal carbon radical
// centre: a neutral carbon with one unpaired electron, three σ partners
// (hydrogens included), single non-aromatic bonds only, and at least two
// fluorine ligands. Fluorine's electronegativity puts more s character in
// the singly occupied orbital (Bent's rule, common practice): CF3• is
// pyramidal (C3v, σ 3, inversion barrier of tens of kcal/mol), and CHF2•,
// CF2R• are pyramidal with substantial barriers, while the methyl and alkyl
// radicals are planar or nearly so. A carbon radical with one fluorine
// (CH2F•, weakly pyramidal with a very low inversion barrier) or with
// chlorine, bromine or iodine ligands only (CCl3•, CH2Cl•: nearly planar,
// low barriers) is treated as planar, as are centres conjugated with a
// double bond or aromatic ring (conjugatedRadical: they are planar with it).
// A pyramidal centre counts its singly occupied orbital as a fourth
// ligand, like an amine's lone pair, so σ(CF3•) = 3 and σ(CHF2•) = 1. It is
// never a stereo unit (stereoUnit excludes radicals): with two alike
// fluorines it cannot be one.
func (m *Molecule) PyramidalRadical(i int) bool {
	a := m.Atoms[i]
	if a.Element != "C" || a.Radical != 1 || a.Charge != 0 || a.Aromatic || len(m.Adj[i])+a.HCount != 3 || !m.allSingle(i) {
		return false
	}
	f := 0
	for _, b := range m.Adj[i] {
		n := m.Other(b, i)
		if m.Atoms[n].Element == "F" {
			f++
			continue
		}
		if m.Atoms[n].Aromatic || !m.allSingle(n) {
			return false // conjugated with a π bond (allylic, benzylic, α-carbonyl): planar with it
		}
	}
	return f >= minPyramidalFluorines
}

// total is σ of the whole molecule.
func (sc *sigmaCalc) total() (*big.Int, error) {
	m := sc.m
	comps := m.components()
	sigma := oneProd()
	if len(comps) == 1 {
		s, err := sc.component(comps[0])
		if err != nil {
			return nil, err
		}
		return s.int(), nil
	}
	// Identical components share orbit classes (the search joins them), and
	// different ones share none: k copies multiply σ by k!.
	copies := map[int]int{}
	known := map[int]prod{} // σ of a component, by its key
	for _, atoms := range comps {
		key := sc.classes[atoms[0]]
		for _, a := range atoms {
			key = min(key, sc.classes[a])
		}
		copies[key]++
		sigma.mulUint(uint64(copies[key]))
		s, ok := known[key]
		if !ok {
			var err error
			if s, err = sc.component(atoms); err != nil {
				return nil, err
			}
			known[key] = s
		}
		sigma.mul(s)
	}
	return sigma.int(), nil
}

// component is σ of one connected component (atoms ascending).
func (sc *sigmaCalc) component(atoms []int) (prod, error) {
	m := sc.m
	if s, hyper, err := m.hypervalentSigma(atoms); hyper { // hypervalent.go
		if err != nil {
			return prod{}, err
		}
		p := oneProd()
		p.mulUint(uint64(s))
		return p, nil
	}
	nf := len(sc.frags)
	// fragment tree of this component; per-fragment state in slices indexed
	// by fragment (seen, degree, removed, visited)
	var fr []int
	seen := make([]bool, nf)
	for _, a := range atoms {
		if f := sc.frag[a]; !seen[f] {
			seen[f] = true
			fr = append(fr, f)
		}
	}
	type edge struct{ b, other int }
	// adjacency of the fragment tree: adj[f] lists f's rotatable bonds in
	// atom order, all lists in one array (counted first)
	deg := make([]int, nf)
	rotBonds := func(visit func(fa, fb, b int)) {
		for _, a := range atoms {
			for _, b := range m.Adj[a] {
				if sc.rot[b] && m.Bonds[b].A == a {
					visit(sc.frag[m.Bonds[b].A], sc.frag[m.Bonds[b].B], b)
				}
			}
		}
	}
	rotBonds(func(fa, fb, _ int) { deg[fa]++; deg[fb]++ })
	adj := make([][]edge, nf)
	total := 0
	for _, f := range fr {
		total += deg[f]
	}
	if total > 0 {
		edges := make([]edge, total)
		for _, f := range fr {
			adj[f], edges = edges[:0:deg[f]], edges[deg[f]:]
		}
	}
	rotBonds(func(fa, fb, b int) {
		adj[fa] = append(adj[fa], edge{b, fb})
		adj[fb] = append(adj[fb], edge{b, fa})
	})
	// centre by peeling leaves (deg holds len(adj[f]))
	left := len(fr)
	removed := make([]bool, nf)
	var layer []int
	for _, f := range fr {
		if deg[f] <= 1 {
			layer = append(layer, f)
		}
	}
	for left > 2 {
		var next []int
		for _, f := range layer {
			removed[f] = true
			left--
			for _, e := range adj[f] {
				if !removed[e.other] {
					deg[e.other]--
					if deg[e.other] == 1 {
						next = append(next, e.other)
					}
				}
			}
		}
		layer = next
	}
	var centre []int
	for _, f := range fr {
		if !removed[f] {
			centre = append(centre, f)
		}
	}
	sigma := oneProd()
	type item struct{ f, pAtom, pNbr int }
	queue := make([]item, 0, len(fr)) // every fragment is queued once
	visited := seen                   // reused: every fragment of the component is seen
	clear(visited)
	if len(centre) == 1 {
		queue = append(queue, item{centre[0], -1, -1})
		visited[centre[0]] = true
	} else {
		// central rotatable bond
		var cb int = -1
		for _, e := range adj[centre[0]] {
			if e.other == centre[1] {
				cb = e.b
			}
		}
		u, v := m.Bonds[cb].A, m.Bonds[cb].B
		if sc.classes[u] == sc.classes[v] && sc.swapKeepsMarks(u, v) {
			sigma = prod{small: 2}
		}
		queue = append(queue, item{sc.frag[u], u, v}, item{sc.frag[v], v, u})
		visited[sc.frag[u]], visited[sc.frag[v]] = true, true
	}
	for k := 0; k < len(queue); k++ {
		it := queue[k]
		s, err := sc.fragment(it.f, it.pAtom, it.pNbr)
		if err != nil {
			return prod{}, err
		}
		sigma.mul(s)
		for _, a := range sc.frags[it.f] {
			for _, b := range m.Adj[a] {
				if !sc.rot[b] {
					continue
				}
				o := m.Other(b, a)
				if f := sc.frag[o]; !visited[f] {
					visited[f] = true
					queue = append(queue, item{f, o, a})
				}
			}
		}
	}
	return sigma, nil
}

// outside lists the colours of the outside positions of atom i of the
// current fragment: rotatable-bond neighbours, hydrogens and (for
// tetrahedral atoms) lone pairs. Branch colours are orbit classes, refined
// by the partition with atom i singled out when two branches share a class.
//
// The list is valid until the next call (it reuses one buffer): every
// caller reads it at once.
func (sc *sigmaCalc) outside(i int, withLP bool) []int {
	m := sc.m
	out := sc.outBuf[:0]
	var ranks []int
	for _, b := range m.Adj[i] {
		if !sc.rot[b] {
			continue
		}
		v := m.Other(b, i)
		if i == sc.pAtom && v == sc.pNbr {
			out = append(out, colParent)
			continue
		}
		out = append(out, sc.branchColour(i, v, &ranks))
	}
	for k := 0; k < m.Atoms[i].HCount; k++ {
		out = append(out, colH)
	}
	if withLP {
		for k := 0; k < sc.lp[i]; k++ {
			out = append(out, colLP)
		}
	}
	slices.Sort(out)
	sc.outBuf = out[:0]
	return out
}

// branchColour is the colour of the branch across the rotatable bond from
// atom i to its neighbour v (not the parent): its orbit class, refined by
// the partition with i singled out when another branch of i shares the
// class. *ranks caches that partition for atom i.
func (sc *sigmaCalc) branchColour(i, v int, ranks *[]int) int {
	m := sc.m
	dup := false
	for _, b2 := range m.Adj[i] {
		if w := m.Other(b2, i); w != v && sc.rot[b2] && sc.classes[w] == sc.classes[v] && !(i == sc.pAtom && w == sc.pNbr) {
			dup = true
		}
	}
	c := sc.classes[v] * (sc.n + 1)
	if dup {
		if *ranks == nil {
			*ranks = sc.refinedAt(i)
		}
		c += (*ranks)[v] + 1
	}
	return c
}

// factorials holds k! for k ≤ 20 (the largest that fits in a uint64).
var factorials = func() (f [21]uint64) {
	f[0] = 1
	for k := 1; k < len(f); k++ {
		f[k] = f[k-1] * uint64(k)
	}
	return f
}()

// prod is a non-negative integer product of symmetry factors: a uint64
// while it fits (nearly always), exact as a big.Int beyond.
type prod struct {
	small uint64   // the value when big is nil
	big   *big.Int // the value once it exceeds the uint64 range
}

func oneProd() prod { return prod{small: 1} }

// mulUint multiplies p by k.
func (p *prod) mulUint(k uint64) {
	if p.big == nil {
		if hi, lo := bits.Mul64(p.small, k); hi == 0 {
			p.small = lo
			return
		}
		p.big = new(big.Int).SetUint64(p.small)
	}
	p.big.Mul(p.big, new(big.Int).SetUint64(k))
}

// mul multiplies p by q.
func (p *prod) mul(q prod) {
	if q.big == nil {
		p.mulUint(q.small)
		return
	}
	if p.big == nil {
		p.big = new(big.Int).SetUint64(p.small)
	}
	p.big.Mul(p.big, q.big)
}

// mulFactorial multiplies p by k!.
func (p *prod) mulFactorial(k int) {
	if k < len(factorials) {
		p.mulUint(factorials[k])
		return
	}
	if p.big == nil {
		p.big = new(big.Int).SetUint64(p.small)
	}
	p.big.Mul(p.big, new(big.Int).MulRange(1, int64(k)))
}

// halve divides p by 2, rounding down.
func (p *prod) halve() {
	if p.big == nil {
		p.small >>= 1
		return
	}
	p.big.Rsh(p.big, 1)
}

func (p prod) isZero() bool {
	if p.big == nil {
		return p.small == 0
	}
	return p.big.Sign() == 0
}

// int returns p as a new big.Int.
func (p prod) int() *big.Int {
	if p.big == nil {
		return new(big.Int).SetUint64(p.small)
	}
	return new(big.Int).Set(p.big)
}

// positionCode is the position code (see centrePositions) of neighbour v of
// atom i in the current fragment; v < 0 stands for a hydrogen.
func (sc *sigmaCalc) positionCode(i, v int) int {
	if v < 0 {
		return -(colH + 10)
	}
	b := sc.m.BondBetween(i, v)
	if b < 0 {
		return 1 << 30
	}
	if !sc.rot[b] {
		return v
	}
	if i == sc.pAtom && v == sc.pNbr {
		return -(colParent + 10)
	}
	var ranks []int
	return -(sc.branchColour(i, v, &ranks) + 10)
}

// writtenStereo returns the configuration equations {unit, ground, bit} of
// the units whose configuration the SMILES states: tetrahedral centres marked
// @/@@ (or @TH1/@TH2) and double bonds marked with / and \. The bit is the
// written configuration relative to the unit's reference; ground is a
// virtual unit, so only the relative configurations count (a molecule and
// its mirror image have the same σ).
func (sc *sigmaCalc) writtenStereo(units []unit, ground int) [][3]int {
	m := sc.m
	var out [][3]int
	var ct []CisTrans
	ctDone := false
	for k, u := range units {
		switch u.kind {
		case 't':
			a := m.Atoms[u.x]
			odd := 0
			switch a.Chirality {
			case "@", "@TH1":
			case "@@", "@TH2":
				odd = 1
			default:
				continue
			}
			if u.x >= len(m.nbrOrder) || len(m.nbrOrder[u.x]) != 4 || sc.virtual[u.x] {
				continue
			}
			pos := sc.centrePositions(u.x)
			p := make([]int, 4)
			for i, v := range m.nbrOrder[u.x] {
				p[i] = slices.Index(pos, sc.positionCode(u.x, v))
			}
			if !isPerm(p) {
				continue
			}
			out = append(out, [3]int{k, ground, permParity(p) ^ odd})
		case 'd':
			if !ctDone {
				ct, ctDone = m.DoubleBondStereo(), true
			}
			for _, c := range ct {
				bd := m.Bonds[c.Bond]
				if !((bd.A == u.x && bd.B == u.y) || (bd.A == u.y && bd.B == u.x)) {
					continue
				}
				xa, ya := c.A, c.B // marked substituents on the u.x and u.y sides
				if bd.A != u.x {
					xa, ya = c.B, c.A
				}
				ia := slices.Index(sc.endPositions(u.x, u.y), sc.positionCode(u.x, xa))
				ib := slices.Index(sc.endPositions(u.y, u.x), sc.positionCode(u.y, ya))
				if ia < 0 || ib < 0 {
					continue
				}
				bit := 0
				if (ia == ib) != c.Cis {
					bit = 1
				}
				out = append(out, [3]int{k, ground, bit})
			}
		}
	}
	return out
}

// refinedAt returns the refined partition of the whole molecule with atom i
// individualised (ranks indexed by atom).
func (sc *sigmaCalc) refinedAt(i int) []int {
	if sc.g == nil {
		all := make([]int, sc.n)
		for k := range all {
			all[k] = k
		}
		sc.g = sc.m.cgraphOf(all, make([]int, sc.n))
		sc.root = sc.g.refine(sc.g.cell0)
	}
	return sc.g.refine(individualize(sc.root, i))
}

// unit is a stereo unit whose configuration is checked under the
// fragment's symmetry elements: a tetrahedral centre (x), a double bond
// (x=y) or an allene (centre x, ends y and z).
type unit struct {
	kind    byte // 't', 'd', 'a'
	x, y, z int
}

// fragment returns the number of proper operations of fragment f (a top
// rotating about the bond pAtom–pNbr when pAtom ≥ 0) times its static factor.
func (sc *sigmaCalc) fragment(f, pAtom, pNbr int) (prod, error) {
	if err := sc.ctx.Err(); err != nil {
		return prod{}, fmt.Errorf("symmetry number: %w", err)
	}
	m := sc.m
	sc.pAtom, sc.pNbr = pAtom, pNbr
	atoms := sc.frags[f]
	static := oneProd()
	halves := 0 // factors of 2 to divide out of static
	// A cage (every atom with three or more fragment neighbours, three or
	// more rings) is three-dimensional even where its atoms are sp2.
	cage := len(atoms) >= 4
	bonds := 0
	for _, x := range atoms {
		bonds += sc.inner(x)
		cage = cage && sc.inner(x) >= 3
	}
	cage = cage && bonds/2-len(atoms)+1 >= 3
	var units []unit
	for _, x := range atoms {
		tet := sc.tetrahedral(x)
		col := sc.outside(x, tet)
		if len(atoms) == 1 && len(sc.markedAtoms()) > 0 {
			col = sc.outsideSplit(x, tet)
		}
		dup := false
		for k := 0; k < len(col); {
			e := k
			for e < len(col) && col[e] == col[k] {
				e++
			}
			if e-k > 1 {
				dup = true
				static.mulFactorial(e - k)
			}
			k = e
		}
		if tet {
			if dup {
				halves++
			} else {
				units = append(units, unit{kind: 't', x: x})
			}
		} else if cage && len(col) == 0 && sc.inner(x) == 3 {
			// a three-connected atom of a cage (fullerene carbon) points
			// its free side outwards: a fourth, virtual ligand
			units = append(units, unit{kind: 't', x: x})
			sc.virtual[x] = true
		}
	}
	// double bonds and allenes inside the fragment
	inRing := sc.inRing
	doubles := func(i int) []int {
		var out []int
		for _, b := range m.Adj[i] {
			if m.Bonds[b].Order == 2 && !m.Bonds[b].Aromatic {
				out = append(out, m.Other(b, i))
			}
		}
		return out
	}
	// cumulene chains e1=c=…=c=e2 (n double bonds; n = 1 a plain double
	// bond): ends of an odd chain lie in one plane (cis/trans like a double
	// bond, butatriene D2h), ends of an even chain are perpendicular
	// (handedness like an allene, D2d)
	for _, x := range atoms {
		if len(doubles(x)) != 1 {
			continue
		}
		chain := []int{x}
		prev, cur := x, doubles(x)[0]
		ringChain := false
		for {
			if b := m.BondBetween(prev, cur); b >= 0 && inRing[b] {
				ringChain = true
			}
			chain = append(chain, cur)
			d := doubles(cur)
			if len(d) != 2 || len(m.Adj[cur]) != 2 || m.Atoms[cur].HCount != 0 || len(chain) > len(atoms) {
				break
			}
			next := d[0]
			if next == prev {
				next = d[1]
			}
			prev, cur = cur, next
		}
		y := chain[len(chain)-1]
		n := len(chain) - 1
		if len(doubles(y)) != 1 || y < x || ringChain {
			continue
		}
		lx, ly := sc.endPositions(x, chain[1]), sc.endPositions(y, chain[n-1])
		if len(lx) != 2 || len(ly) != 2 {
			continue
		}
		if alike(lx) || alike(ly) {
			halves++
			continue
		}
		if n%2 == 1 {
			units = append(units, unit{kind: 'd', x: x, y: y})
		} else {
			units = append(units, unit{kind: 'a', x: chain[n/2], y: x, z: y})
		}
	}
	// a planar trigonal end of a conjugated radical system with two alike
	// outside ligands (benzyl CH2): exchanging them alone is a reflection,
	// like the ends of a double bond
	for _, x := range atoms {
		if sc.hybrid != nil && sc.hybrid[x] && !sc.tetrahedral(x) && len(atoms) > 1 {
			col := sc.outside(x, false)
			if len(col) == 2 && col[0] == col[1] {
				halves++
			}
		}
	}
	for ; halves > 0; halves-- {
		static.halve()
	}
	if static.isZero() {
		static = oneProd()
	}
	if len(atoms) == 1 {
		return static, nil // one atom: only the identity (a checked centre passes)
	}
	// symmetry elements of the fragment graph
	extra := make([]int, sc.n)
	keyOf := map[string]int{}
	for _, x := range atoms {
		col := sc.outside(x, false)
		var b strings.Builder
		b.WriteString(strconv.Itoa(sc.classes[x]))
		for _, c := range col {
			b.WriteByte(',')
			b.WriteString(strconv.Itoa(c))
		}
		k, ok := keyOf[b.String()]
		if !ok {
			k = len(keyOf) + 1
			keyOf[b.String()] = k
		}
		extra[x] = k
	}
	// keys are numbered in first-seen order, which depends on atom order:
	// renumber them by the sorted key text so colours are spelling-free.
	texts := make([]string, 0, len(keyOf))
	for t := range keyOf {
		texts = append(texts, t)
	}
	slices.Sort(texts)
	renum := make([]int, len(keyOf)+1)
	for r, t := range texts {
		renum[keyOf[t]] = r + 1
	}
	for _, x := range atoms {
		extra[x] = renum[extra[x]]
	}
	g := m.cgraphOfSub(atoms, sc.local, sc.rot, extra)
	defer g.release()
	root := g.refine(g.cell0)
	s := &search{g: g, budget: sc.budget, root: root, ctx: sc.ctx}
	defer func() { sc.budget -= s.steps }()
	order := oneProd()
	var labels []int
	seenBuf := make([]bool, len(atoms))
	if !discrete(root, seenBuf) {
		sizes, exact := s.automorphisms()
		if !exact {
			return prod{}, sc.limitErr()
		}
		for _, k := range sizes {
			order.mulUint(uint64(k))
		}
	}
	chair := sc.chairRing(atoms)
	if len(units) == 0 && chair == nil {
		order.mul(static)
		return order, nil
	}
	if order.big != nil || order.small > maxFragmentGroup {
		return prod{}, fmt.Errorf("symmetry number of %q: %w (a rigid fragment of %d atoms has %s symmetry elements, more than %d)",
			m.SMILES, ErrWorkLimit, len(atoms), order.int(), maxFragmentGroup)
	}
	if order.small == 1 {
		return static, nil
	}
	labels = s.canonical()
	if s.exhausted || labels == nil {
		return prod{}, sc.limitErr()
	}
	elems := groupElements(s.gens, maxFragmentGroup+1)
	// canonical order: each element as a permutation of canonical labels
	byLabel := make([]int, len(atoms))
	for k, l := range labels {
		byLabel[l] = k
	}
	canon := make([][]int, len(elems))
	for e, gm := range elems {
		p := make([]int, len(atoms))
		for l := range p {
			p[l] = labels[gm[byLabel[l]]]
		}
		canon[e] = p
	}
	idx := make([]int, len(elems))
	for i := range idx {
		idx[i] = i
	}
	slices.SortFunc(idx, func(a, b int) int { return slices.Compare(canon[a], canon[b]) })
	// constraints of each element
	type eq struct{ u, v, e int }
	var cands [][]eq
	uIndex := map[[4]int]int{}
	for k, u := range units {
		switch u.kind {
		case 't', 'a':
			uIndex[[4]int{int(u.kind), u.x, 0, 0}] = k
		case 'd':
			uIndex[[4]int{'d', u.x, u.y, 0}] = k
			uIndex[[4]int{'d', u.y, u.x, 0}] = k
		}
	}
	for _, e := range idx {
		gm := elems[e]
		phi := func(a int) int { return atoms[gm[sc.local[a]]] }
		if chair != nil && !chairProper(chair, phi) {
			continue
		}
		var eqs []eq
		ok := true
		for k, u := range units {
			img, bit, good := sc.unitImage(u, phi, uIndex, units)
			if !good {
				ok = false
				break
			}
			eqs = append(eqs, eq{k, img, bit})
		}
		if ok {
			cands = append(cands, eqs)
		}
	}
	best := 0
	nu := len(units) + 1 // the last node is the ground of written configurations
	rel := newParityRelations(nu)
	save := make([]int, 2*nu)
	fixed := append(sc.writtenStereo(units, len(units)), sc.cisFusions(units)...)
	for seed := 0; seed < len(cands) && seed < maxSeeds; seed++ {
		rel.reset()
		count := 0
		var try func(eqs []eq) bool
		try = func(eqs []eq) bool {
			copy(save, rel.par)
			copy(save[nu:], rel.bits)
			for _, q := range eqs {
				ru, pu := rel.find(q.u)
				rv, pv := rel.find(q.v)
				if ru == rv {
					if pu^pv != q.e {
						copy(rel.par, save[:nu])
						copy(rel.bits, save[nu:])
						return false
					}
					continue
				}
				rel.par[ru], rel.bits[ru] = rv, pu^pv^q.e
			}
			return true
		}
		for _, f := range fixed {
			try([]eq{{f[0], f[1], f[2]}})
		}
		if !try(cands[seed]) {
			continue
		}
		for _, eqs := range cands {
			if try(eqs) {
				count++
			}
		}
		best = max(best, count)
	}
	static.mulUint(uint64(max(best, 1)))
	return static, nil
}

func (sc *sigmaCalc) limitErr() error {
	if err := sc.ctx.Err(); err != nil {
		return fmt.Errorf("symmetry number of %q: %w", sc.m.SMILES, err)
	}
	return fmt.Errorf("symmetry number of %q: %w (work budget of %d refinement steps spent)", sc.m.SMILES, ErrWorkLimit, DefaultSearchWork)
}

// alike reports whether the two positions of a double-bond end are both
// outside the fragment and alike (for instance =CH2).
func alike(l []int) bool { return l[0] < 0 && l[0] == l[1] }

// endPositions lists the positions of double-bond end x other than its
// partner y (or, at the end of a cumulene chain, the atom it is double-bonded to): fragment atoms as atom indices (≥ 0), outside ligands as
// negative colour codes (-(colour+10)); an sp2 N keeps its lone pair.
func (sc *sigmaCalc) endPositions(x, y int) []int {
	m := sc.m
	var out []int
	for _, b := range m.Adj[x] {
		o := m.Other(b, x)
		if o == y || sc.rot[b] || (m.Bonds[b].Order == 2 && !m.Bonds[b].Aromatic) {
			continue
		}
		out = append(out, o)
	}
	for _, c := range sc.outside(x, false) {
		out = append(out, -(c + 10))
	}
	a := m.Atoms[x]
	if (a.Element == "N" || a.Element == "P") && len(m.Adj[x])+a.HCount == 2 && a.Radical == 0 && a.Charge == 0 {
		out = append(out, -(colLP + 10))
	}
	if a.Element == "C" && a.Radical == 1 && a.Charge == 0 && !a.Aromatic && len(m.Adj[x])+a.HCount == 2 {
		// A vinyl-type σ radical (R–C•=CR2) is bent at the radical carbon
		// (vinyl Cs, σ 1; common practice, as NIST-JANAF's C2H3): its
		// singly occupied orbital takes the place of a third ligand, as an
		// imine N's lone pair does, so the two partners on the other end
		// are cis and trans to it.
		out = append(out, -(colSOMO + 10))
	}
	return out
}

// centrePositions lists the four positions of tetrahedral atom x.
func (sc *sigmaCalc) centrePositions(x int) []int {
	m := sc.m
	var out []int
	for _, b := range m.Adj[x] {
		if !sc.rot[b] {
			out = append(out, m.Other(b, x))
		}
	}
	for _, c := range sc.outside(x, true) {
		out = append(out, -(c + 10))
	}
	if sc.virtual[x] {
		out = append(out, -(colOut + 10))
	}
	return out
}

// inner counts the bonds of atom x inside its fragment.
func (sc *sigmaCalc) inner(x int) int {
	k := 0
	for _, b := range sc.m.Adj[x] {
		if !sc.rot[b] {
			k++
		}
	}
	return k
}

func imagePos(k int, phi func(int) int) int {
	if k >= 0 {
		return phi(k)
	}
	return k
}

// unitImage returns the index of the image of unit u under phi and the
// configuration bit (0: the reference configuration maps onto the image's
// reference, 1: onto its mirror); good is false when the image is not a
// unit of the same kind (cannot happen for an automorphism).
func (sc *sigmaCalc) unitImage(u unit, phi func(int) int, uIndex map[[4]int]int, units []unit) (int, int, bool) {
	switch u.kind {
	case 't':
		x2 := phi(u.x)
		k, ok := uIndex[[4]int{'t', x2, 0, 0}]
		if !ok {
			return 0, 0, false
		}
		src, dst := sc.centrePositions(u.x), sc.centrePositions(x2)
		return k, permBit(src, dst, phi), true
	case 'd':
		x2, y2 := phi(u.x), phi(u.y)
		k, ok := uIndex[[4]int{'d', x2, y2, 0}]
		if !ok {
			return 0, 0, false
		}
		lx, ly := sc.endPositions(u.x, u.y), sc.endPositions(u.y, u.x)
		ix := slices.Index(sc.endPositions(x2, y2), imagePos(lx[0], phi))
		iy := slices.Index(sc.endPositions(y2, x2), imagePos(ly[0], phi))
		if ix < 0 || iy < 0 {
			return 0, 0, false
		}
		if ix != iy {
			return k, 1, true
		}
		return k, 0, true
	case 'a':
		c2 := phi(u.x)
		k, ok := uIndex[[4]int{'a', c2, 0, 0}]
		if !ok {
			return 0, 0, false
		}
		w := units[k]
		// positions y0 y1 z0 z1 of u map to those of w, end by end
		var p []int
		for _, end := range []int{u.y, u.z} {
			e2 := phi(end)
			base := 0
			if e2 != w.y {
				base = 2
			}
			dst := sc.endPositions(e2, w.x)
			for _, q := range sc.endPositions(end, u.x) {
				j := slices.Index(dst, imagePos(q, phi))
				if j < 0 {
					return 0, 0, false
				}
				p = append(p, base+j)
			}
		}
		if !isPerm(p) {
			return 0, 0, false
		}
		return k, permParity(p), true
	}
	return 0, 0, false
}

// permBit returns 0 when phi maps the position list src onto dst by an even
// permutation, 1 when odd (or when a position has no image in dst).
func permBit(src, dst []int, phi func(int) int) int {
	p := make([]int, len(src))
	for i, k := range src {
		j := slices.Index(dst, imagePos(k, phi))
		if j < 0 {
			return 1
		}
		p[i] = j
	}
	if !isPerm(p) || permParity(p) != 0 {
		return 1
	}
	return 0
}

// chairRing returns the ring order of a fragment that is one saturated
// six-membered ring (chair, D3d), or nil.
func (sc *sigmaCalc) chairRing(atoms []int) []int {
	m := sc.m
	if len(atoms) != 6 {
		return nil
	}
	for _, a := range atoms {
		if !m.allSingle(a) || m.Atoms[a].Radical != 0 {
			return nil
		}
		nin := 0
		for _, b := range m.Adj[a] {
			if !sc.rot[b] {
				nin++
			}
		}
		if nin != 2 {
			return nil
		}
	}
	ring := []int{atoms[0]}
	prev := -1
	for len(ring) < 6 {
		cur := ring[len(ring)-1]
		next := -1
		for _, b := range m.Adj[cur] {
			if o := m.Other(b, cur); !sc.rot[b] && o != prev && (len(ring) < 2 || o != ring[0]) {
				next = o
				break
			}
		}
		if next < 0 {
			return nil
		}
		prev = cur
		ring = append(ring, next)
	}
	return ring
}

// chairProper reports whether phi, mapping a chair ring onto itself, is a
// rotation of the chair: a turn by k positions needs k even, a flip i → k−i
// needs k odd.
func chairProper(ring []int, phi func(int) int) bool {
	j := slices.Index(ring, phi(ring[0]))
	j1 := slices.Index(ring, phi(ring[1]))
	if j < 0 || j1 < 0 {
		return true
	}
	if j1 == (j+1)%6 {
		return j%2 == 0
	}
	return j%2 == 1
}

// cisFusions returns the configuration equations of the checked tetrahedral
// atoms fixed by the ring geometry: cis fusions of small rings
// (cisFusionRelations) and bridgeheads of small bicycles (smallBicycles).
// Each entry is {unit a, unit b, bit}: r_a ⊕ r_b = bit.
func (sc *sigmaCalc) cisFusions(units []unit) [][3]int {
	at := map[int]int{}
	for k, u := range units {
		if u.kind == 't' {
			at[u.x] = k
		}
	}
	out := sc.m.cisFusionRelations(at, sc.centrePositions)
	return append(out, sc.smallBicycles(units, at)...)
}

// cisFusionRelations returns, for the bonds a–b between two atoms of at
// (atom → unit) that are shared by two small relevant rings (one of at most
// four atoms, or both of at most five), the configuration equation that
// makes the fusion cis: such rings cannot be trans-fused (common practice;
// housane, bicyclo[3.3.0]octane, cubane faces). positions lists the four
// positions of a tetrahedral atom. Each entry is {unit a, unit b, bit}:
// r_a ⊕ r_b = bit. Both the symmetry number and the optical isomer count
// use it.
func (m *Molecule) cisFusionRelations(at map[int]int, positions func(int) []int) [][3]int {
	var out [][3]int
	for _, bd := range m.Bonds {
		ka, oka := at[bd.A]
		kb, okb := at[bd.B]
		if !oka || !okb {
			continue
		}
		a, b := bd.A, bd.B
		// the two smallest relevant cycles through the bond
		var rs [][]int
		for _, c := range m.cycles {
			for k := range c {
				x, y := c[k], c[(k+1)%len(c)]
				if (x == a && y == b) || (x == b && y == a) {
					rs = append(rs, c)
					break
				}
			}
		}
		if len(rs) < 2 {
			continue
		}
		slices.SortStableFunc(rs, func(x, y []int) int { return len(x) - len(y) })
		r1, r2 := rs[0], rs[1]
		if !(len(r1) <= 4 || len(r2) <= 5) {
			continue
		}
		nb := func(r []int, x, not int) int {
			k := slices.Index(r, x)
			p, q := r[(k+len(r)-1)%len(r)], r[(k+1)%len(r)]
			if p == not {
				return q
			}
			return p
		}
		a1, a2 := nb(r1, a, b), nb(r2, a, b)
		b1, b2 := nb(r1, b, a), nb(r2, b, a)
		if a1 == a2 || b1 == b2 {
			continue
		}
		bit := oppositeTurnBit(positions(a), []int{b, a1, a2}, positions(b), []int{a, b1, b2})
		out = append(out, [3]int{ka, kb, bit})
	}
	return out
}

// oppositeTurnBit returns the bit of the configuration equation
// r_a ⊕ r_b = bit which says that three ligands fromA of atom a (positions
// pa) and the corresponding three ligands fromB of atom b (positions pb)
// turn one way seen from a and the other seen from b: the rings of a cis
// fusion, the bridges of an out,out bicycle. The listed ligands come first,
// then the remaining positions in their order.
func oppositeTurnBit(pa, fromA, pb, fromB []int) int {
	rest := func(p []int, xs []int) []int {
		out := slices.Clone(xs)
		for _, k := range p {
			if !slices.Contains(xs, k) {
				out = append(out, k)
			}
		}
		return out
	}
	id := func(x int) int { return x }
	return 1 ^ permBit(rest(pa, fromA), pa, id) ^ permBit(rest(pb, fromB), pb, id)
}

// smallBicycles returns the configuration equations of the bridgeheads of
// small bridged bicycles: two checked tetrahedral atoms a and b, not bonded,
// joined by three bridges of two-connected atoms with at most nine atoms in
// all (norbornane, bicyclo[2.2.2]octane, bicyclo[3.3.1]nonane), can only be
// "out,out": both bridgehead ligands point away from the bicycle (common
// practice; in,out isomers need much larger rings). Seen from a, the bridges
// turn one way; seen from b, the other.
func (sc *sigmaCalc) smallBicycles(units []unit, at map[int]int) [][3]int {
	m := sc.m
	var out [][3]int
	for _, u := range units {
		a := u.x
		if u.kind != 't' || sc.inner(a) != 3 {
			continue
		}
		var firsts, lasts []int
		end, total := -1, 0
		ok := true
		for _, bd := range m.Adj[a] {
			if sc.rot[bd] {
				continue
			}
			prev, cur := a, m.Other(bd, a)
			n := 0
			for sc.inner(cur) == 2 && n <= 10 {
				next := -1
				for _, b2 := range m.Adj[cur] {
					if o := m.Other(b2, cur); !sc.rot[b2] && o != prev {
						next = o
					}
				}
				prev, cur = cur, next
				n++
			}
			if cur == a || (end >= 0 && cur != end) || n > 10 {
				ok = false
				break
			}
			end = cur
			total += n
			firsts = append(firsts, m.Other(bd, a))
			lasts = append(lasts, prev)
		}
		kb, isUnit := at[end]
		if !ok || !isUnit || end < a || m.BondBetween(a, end) >= 0 || total+2 > 9 {
			continue
		}
		b := end
		bit := oppositeTurnBit(sc.centrePositions(a), firsts, sc.centrePositions(b), lasts)
		out = append(out, [3]int{at[a], kb, bit})
	}
	return out
}

// isPerm reports whether p is a permutation of 0…len(p)-1.
func isPerm(p []int) bool {
	seen := make([]bool, len(p))
	for _, x := range p {
		if x < 0 || x >= len(p) || seen[x] {
			return false
		}
		seen[x] = true
	}
	return true
}

// swapKeepsMarks reports whether the two identical halves on either side of
// the central bond u–v can be exchanged without changing a written
// tetrahedral configuration (@/@@): some graph automorphism mapping u to v
// maps every marked centre onto a marked centre with the same configuration.
// A meso form (halves mirror images of each other) fails. Without marks, or
// when the group is too large to search (more than 5000 elements), the
// exchange counts (most symmetric stereoisomer).
func (sc *sigmaCalc) swapKeepsMarks(u, v int) bool {
	return sc.keepsMarks([][2]int{{u, v}})
}

// marked returns the atoms with a written tetrahedral mark (cached).
func (sc *sigmaCalc) markedAtoms() []int {
	if sc.marked == nil {
		m := sc.m
		sc.marked = []int{}
		for i, a := range m.Atoms {
			if isTetraMark(a.Chirality) && i < len(m.nbrOrder) && len(m.nbrOrder[i]) == 4 {
				sc.marked = append(sc.marked, i)
			}
		}
	}
	return sc.marked
}

func isTetraMark(c string) bool { return c == "@" || c == "@@" || c == "@TH1" || c == "@TH2" }

// keepsMarks reports whether some graph automorphism maps every pair's
// first atom to its second and every marked centre onto a marked centre
// with the same configuration. Without marks, or when the group has more
// than 5000 elements, it reports true (most symmetric stereoisomer).
func (sc *sigmaCalc) keepsMarks(req [][2]int) bool {
	m := sc.m
	marked := sc.markedAtoms()
	if len(marked) == 0 || len(sc.gens) == 0 {
		return true
	}
	if sc.elems == nil {
		sc.elems = groupElements(sc.gens, maxFragmentGroup+1)
	}
	if len(sc.elems) > maxFragmentGroup {
		return true
	}
	odd := func(c string) int {
		if c == "@@" || c == "@TH2" {
			return 1
		}
		return 0
	}
next:
	for _, phi := range sc.elems {
		for _, r := range req {
			if phi[r[0]] != r[1] {
				continue next
			}
		}
		for _, x := range marked {
			y := phi[x]
			cy := m.Atoms[y].Chirality
			if y >= len(m.nbrOrder) || len(m.nbrOrder[y]) != 4 || !isTetraMark(cy) {
				continue next
			}
			p := make([]int, 4)
			for k, w := range m.nbrOrder[x] {
				img := -1
				if w >= 0 {
					img = phi[w]
				}
				p[k] = slices.Index(m.nbrOrder[y], img)
			}
			if !isPerm(p) || permParity(p)^odd(m.Atoms[x].Chirality)^odd(cy) != 0 {
				continue next
			}
		}
		return true
	}
	return false
}

// splitByMarks refines the branch colours col of the rotatable-bond
// neighbours nb of atom x (parallel lists): two alike branches stay alike
// only when an automorphism fixing x exchanges them and keeps the written
// marks (the two arms of meso-2,4-pentanediol are mirror images, not alike).
// Used for one-atom fragments, whose colours are compared only among
// themselves.
func (sc *sigmaCalc) splitByMarks(x int, nb, col []int) {
	if len(sc.markedAtoms()) == 0 {
		return
	}
	for i := range nb {
		if col[i] < 0 {
			continue
		}
		sub := 0
		for j := 0; j < i; j++ {
			if col[j] < 0 {
				continue
			}
			if col[j]/64 == col[i] && sc.keepsMarks([][2]int{{x, x}, {nb[j], nb[i]}}) {
				sub = col[j] % 64
				break
			}
			if col[j]/64 == col[i] {
				sub = max(sub, col[j]%64+1)
			}
		}
		col[i] = col[i]*64 + sub
	}
}

// outsideSplit is outside for a one-atom fragment, with alike branches
// split by splitByMarks.
func (sc *sigmaCalc) outsideSplit(i int, withLP bool) []int {
	m := sc.m
	var nb, col []int
	var ranks []int
	for _, b := range m.Adj[i] {
		if !sc.rot[b] {
			continue
		}
		v := m.Other(b, i)
		if i == sc.pAtom && v == sc.pNbr {
			nb, col = append(nb, v), append(col, colParent)
			continue
		}
		nb, col = append(nb, v), append(col, sc.branchColour(i, v, &ranks))
	}
	sc.splitByMarks(i, nb, col)
	for k := 0; k < m.Atoms[i].HCount; k++ {
		col = append(col, colH)
	}
	if withLP {
		for k := 0; k < sc.lp[i]; k++ {
			col = append(col, colLP)
		}
	}
	slices.Sort(col)
	return col
}

// conjugatedRadical marks the atoms of conjugated radical (and carbocation)
// systems: a trigonal carbon radical or cation centre (three σ partners,
// single bonds) next to a double bond or an aromatic ring is planar with it,
// and the unpaired electron (or the charge) is shared along the allylic
// chain (allyl, benzyl, pentadienyl, acetonyl). It returns nil when m has
// none; bonds marks the bonds of the systems.
func (m *Molecule) conjugatedRadical() (atoms, bonds []bool) {
	var queue []int
	for i, a := range m.Atoms {
		if a.Element == "C" && (a.Radical == 1 || (a.Charge == 1 && a.Radical == 0)) &&
			len(m.Adj[i])+a.HCount == 3 && m.allSingle(i) {
			queue = append(queue, i)
		}
	}
	var bl []int
	seen := map[int]bool{}
	for k := 0; k < len(queue); k++ {
		r := queue[k]
		if seen[r] {
			continue
		}
		seen[r] = true
		for _, b := range m.Adj[r] {
			if m.Bonds[b].Order != 1 || m.Bonds[b].Aromatic {
				continue
			}
			a := m.Other(b, r)
			if m.Atoms[a].Aromatic {
				bl = append(bl, b)
				continue
			}
			for _, b2 := range m.Adj[a] {
				if bd := m.Bonds[b2]; bd.Order == 2 && !bd.Aromatic {
					bl = append(bl, b, b2)
					queue = append(queue, m.Other(b2, a))
				}
			}
		}
	}
	if len(bl) == 0 {
		return nil, nil
	}
	atoms, bonds = make([]bool, len(m.Atoms)), make([]bool, len(m.Bonds))
	for _, b := range bl {
		bonds[b] = true
		atoms[m.Bonds[b].A], atoms[m.Bonds[b].B] = true, true
	}
	return atoms, bonds
}

// hybridForm returns a private copy of m in which the conjugated radical
// systems (atoms and bonds marked) are delocalised units: their bonds
// aromatic, their atoms aromatic without a radical flag (so the symmetry
// search sees the ends of allyl as alike, and the system is rigid). Used
// only for σ.
func (m *Molecule) hybridForm(atoms, bonds []bool) *Molecule {
	h := *m
	h.derived = nil
	h.Atoms = slices.Clone(m.Atoms)
	h.Bonds = slices.Clone(m.Bonds)
	for i := range h.Atoms {
		if atoms[i] {
			h.Atoms[i].Aromatic = true
			h.Atoms[i].Radical = 0
		}
	}
	for b := range h.Bonds {
		if bonds[b] {
			h.Bonds[b].Aromatic = true
		}
	}
	return &h
}

// parityRelations is a union–find over configuration bits whose edges carry
// a parity: find(x) returns x's root and the parity of x relative to it
// (shared by the σ configuration search and the optical-isomer count).
type parityRelations struct {
	par, bits []int
}

func newParityRelations(n int) *parityRelations {
	r := &parityRelations{par: make([]int, n), bits: make([]int, n)}
	r.reset()
	return r
}

// reset makes every node its own root with parity 0.
func (r *parityRelations) reset() {
	for i := range r.par {
		r.par[i], r.bits[i] = i, 0
	}
}

func (r *parityRelations) find(x int) (root, parity int) {
	for r.par[x] != x {
		parity ^= r.bits[x]
		x = r.par[x]
	}
	return x, parity
}

// shortSMILES quotes a SMILES for a message, cut to its first 60 characters
// (and the total length) when longer: the user wrote it, and a message that
// repeats a long input buries its reason.
func shortSMILES(s string) string {
	const keep = 60
	if r := []rune(s); len(r) > keep {
		return fmt.Sprintf("%q… (%d characters)", string(r[:keep]), len(r))
	}
	return fmt.Sprintf("%q", s)
}
