package benson

import (
	_ "embed"
	"fmt"
	"math"
	"math/bits"
	"slices"
	"sort"
	"strconv"
	"strings"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/internal/wording"
)

// Ring systems and their strain corrections.
//
// The rule, chosen so that it depends only on the molecular graph and never
// on how the SMILES was written (nor on which smallest set of smallest rings
// a reader happens to pick):
//
//  1. Ring blocks are the biconnected components of the heavy-atom graph
//     that contain a cycle; a ring system is a set of blocks joined through
//     shared atoms (a spiro junction joins two blocks). Each block has
//     cyclomatic number c = bonds − atoms + 1.
//  2. A ring system that is isomorphic (elements, Benson atom types, bond
//     orders of its ring atoms and ring bonds) to a system of systems.tsv
//     takes that system's ΔHf correction (published or derived from an
//     experimental ΔHf), with S and Cp from its component rings.
//  3. Otherwise each block contributes component rings: the block itself
//     for c = 1; for c ≥ 2 the relevant cycles (cycles that are not sums of
//     shorter ones) when there are exactly c of them, i.e. when the minimum
//     cycle basis is unique (decalin, indane, norbornane); when it is not
//     unique (bicyclo[2.2.2]octane, cages) the multiset of minimum-basis ring
//     sizes, which every minimum basis shares, each taken as the saturated
//     carbocycle of that size.
//  4. A monocycle, or an ortho-fused system (one block, unique minimum
//     basis, rings sharing at most one bond, no ring smaller than five, no
//     non-aromatic ring fused to two aromatic rings) is the sum of its ring
//     corrections, Benson's practice (decalin, indane, tetralin), not
//     flagged. Every other system without a table value —
//     bridged, spiro, cage, or fused with a three- or four-membered ring —
//     gets the sum of its component-ring corrections and is reported in
//     Result.Missing as "ring system: …", which widens the uncertainty.
//
// Ring enumeration is bounded (maxRingWork steps per molecule); past the
// bound a block is treated as a cage (rule 3, sizes only), which is still
// independent of spelling.

//go:embed systems.tsv
var systemsTSV string

// maxRingWork bounds the cycle enumeration of one molecule.
const maxRingWork = 200000

// systemValue is one row of systems.tsv with its parsed parent structure.
type systemValue struct {
	name   string
	value  GroupValue // Hf298 only; S and Cp from component rings
	hasS   bool
	parent *graph
}

func parseSystems(text string) ([]systemValue, error) {
	var out []systemValue
	for n, line := range strings.Split(text, "\n") {
		if strings.TrimSpace(line) == "" || strings.HasPrefix(line, "#") {
			continue
		}
		f := strings.Split(line, "\t")
		if len(f) != 5 {
			return nil, fmt.Errorf("line %d: %d columns, want 5", n+1, len(f))
		}
		hf, err := strconv.ParseFloat(f[2], 64)
		if err != nil {
			return nil, fmt.Errorf("line %d: %w", n+1, err)
		}
		v := systemValue{name: f[0], value: GroupValue{Name: "system:" + f[0], Hf298: hf * calorie * 1000, Source: f[4]}}
		if f[3] != "-" {
			s, err := strconv.ParseFloat(f[3], 64)
			if err != nil {
				return nil, fmt.Errorf("line %d: %w", n+1, err)
			}
			v.value.S298, v.hasS = s*calorie, true
		}
		m, err := molecule.ParseSMILES(f[1])
		if err != nil {
			return nil, fmt.Errorf("line %d: parent %q: %w", n+1, f[1], err)
		}
		v.parent = newGraph(m)
		out = append(out, v)
	}
	return out, nil
}

// ringBlock is one biconnected component with a cycle.
type ringBlock struct {
	atoms []int // sorted
	bonds []int // sorted bond indices
	c     int   // cyclomatic number
}

// ringSys is a set of blocks joined through shared atoms.
type ringSys struct {
	blocks []ringBlock
	atoms  []int
	bonds  []int
}

// ringSystems returns the ring systems of g in order of their lowest atom.
func (g *graph) ringSystems() []ringSys {
	if len(g.rings) == 0 {
		return nil // acyclic (every cycle lies in some SSSR ring)
	}
	n := len(g.m.Atoms)
	disc := make([]int, n)
	low := make([]int, n)
	for i := range disc {
		disc[i] = -1
	}
	var stack []int // bond indices
	var blocks []ringBlock
	t := 0
	var dfs func(u, parentBond int)
	dfs = func(u, parentBond int) {
		disc[u], low[u] = t, t
		t++
		for k, v := range g.nbr[u] {
			b := g.nbrBond[u][k]
			if b == parentBond {
				continue
			}
			if disc[v] < 0 {
				stack = append(stack, b)
				dfs(v, b)
				low[u] = min(low[u], low[v])
				if low[v] >= disc[u] {
					// pop the block ending with bond b
					var bl ringBlock
					for {
						e := stack[len(stack)-1]
						stack = stack[:len(stack)-1]
						bl.bonds = append(bl.bonds, e)
						if e == b {
							break
						}
					}
					if len(bl.bonds) > 1 {
						set := map[int]bool{}
						for _, e := range bl.bonds {
							set[g.m.Bonds[e].A], set[g.m.Bonds[e].B] = true, true
						}
						for a := range set {
							bl.atoms = append(bl.atoms, a)
						}
						sort.Ints(bl.atoms)
						sort.Ints(bl.bonds)
						bl.c = len(bl.bonds) - len(bl.atoms) + 1
						blocks = append(blocks, bl)
					}
				}
			} else if disc[v] < disc[u] {
				stack = append(stack, b)
				low[u] = min(low[u], disc[v])
			}
		}
	}
	for i := range n {
		if disc[i] < 0 {
			dfs(i, -1)
		}
	}
	// Join blocks sharing an atom (union–find over blocks).
	parent := make([]int, len(blocks))
	for i := range parent {
		parent[i] = i
	}
	var find func(int) int
	find = func(x int) int {
		for parent[x] != x {
			parent[x] = parent[parent[x]]
			x = parent[x]
		}
		return x
	}
	owner := map[int]int{}
	for bi, bl := range blocks {
		for _, a := range bl.atoms {
			if o, ok := owner[a]; ok {
				parent[find(bi)] = find(o)
			} else {
				owner[a] = bi
			}
		}
	}
	byRoot := map[int]*ringSys{}
	var roots []int
	for bi, bl := range blocks {
		r := find(bi)
		s, ok := byRoot[r]
		if !ok {
			s = &ringSys{}
			byRoot[r] = s
			roots = append(roots, r)
		}
		s.blocks = append(s.blocks, bl)
		s.atoms = append(s.atoms, bl.atoms...)
		s.bonds = append(s.bonds, bl.bonds...)
	}
	out := make([]ringSys, 0, len(roots))
	for _, r := range roots {
		s := byRoot[r]
		slices.Sort(s.atoms)
		s.atoms = slices.Compact(s.atoms)
		slices.Sort(s.bonds)
		slices.SortFunc(s.blocks, func(a, b ringBlock) int { return a.atoms[0] - b.atoms[0] })
		out = append(out, *s)
	}
	slices.SortFunc(out, func(a, b ringSys) int { return a.atoms[0] - b.atoms[0] })
	return out
}

// blockRings returns the component rings of block bl (each a cyclic atom
// sequence) and whether they are the unique minimum cycle basis; when it is
// not unique, sizes holds the minimum-basis ring sizes instead. work counts
// enumeration steps against maxRingWork.
func (g *graph) blockRings(bl ringBlock, work *int) (rings [][]int, unique bool, sizes []int) {
	// SSSR rings of this block: their size multiset is that of every
	// minimum cycle basis, so the longest of them bounds the search.
	inBlock := map[int]int{}
	for k, e := range bl.bonds {
		inBlock[e] = k
	}
	var sssr [][]int
	for _, r := range g.rings {
		ok := true
		for k, a := range r {
			if _, in := inBlock[g.bondBetween(a, r[(k+1)%len(r)])]; !in {
				ok = false
				break
			}
		}
		if ok {
			sssr = append(sssr, r)
		}
	}
	for _, r := range sssr {
		sizes = append(sizes, len(r))
	}
	sort.Ints(sizes)
	if bl.c == 1 && len(sssr) == 1 {
		return sssr, true, sizes
	}
	maxLen := 0
	if len(sizes) > 0 {
		maxLen = sizes[len(sizes)-1]
	}
	if len(sizes) != bl.c || maxLen == 0 {
		return nil, false, sizes
	}
	// Enumerate every simple cycle of the block up to maxLen atoms, each
	// once (start at its lowest atom, second atom below the last).
	inAtoms := map[int]bool{}
	for _, a := range bl.atoms {
		inAtoms[a] = true
	}
	type cyc struct {
		atoms []int
		edges []uint64
	}
	words := (len(bl.bonds) + 63) / 64
	var cycles []cyc
	path := []int{}
	onPath := map[int]bool{}
	exceeded := false
	var extend func(s, u int)
	extend = func(s, u int) {
		if exceeded {
			return
		}
		*work++
		if *work > maxRingWork {
			exceeded = true
			return
		}
		for k, v := range g.nbr[u] {
			if _, in := inBlock[g.nbrBond[u][k]]; !in || !inAtoms[v] {
				continue
			}
			if v == s && len(path) >= 3 && path[1] < path[len(path)-1] {
				c := cyc{atoms: slices.Clone(path), edges: make([]uint64, words)}
				for i, a := range c.atoms {
					e := inBlock[g.bondBetween(a, c.atoms[(i+1)%len(c.atoms)])]
					c.edges[e/64] |= 1 << (e % 64)
				}
				cycles = append(cycles, c)
				continue
			}
			if v <= s || onPath[v] || len(path) >= maxLen {
				continue
			}
			path = append(path, v)
			onPath[v] = true
			extend(s, v)
			onPath[v] = false
			path = path[:len(path)-1]
		}
	}
	for _, s := range bl.atoms {
		path = append(path[:0], s)
		onPath[s] = true
		extend(s, s)
		onPath[s] = false
	}
	if exceeded {
		return nil, false, sizes
	}
	slices.SortStableFunc(cycles, func(a, b cyc) int { return len(a.atoms) - len(b.atoms) })
	// Relevant cycles: independent (over GF(2)) of all strictly shorter ones.
	basis := map[int][]uint64{} // pivot bit → reduced vector
	reduce := func(v []uint64) []uint64 {
		v = slices.Clone(v)
		for {
			p := -1
			for w, x := range v {
				if x != 0 {
					p = w*64 + bits.TrailingZeros64(x)
					break
				}
			}
			if p < 0 {
				return nil
			}
			b, ok := basis[p]
			if !ok {
				return v
			}
			for w := range v {
				v[w] ^= b[w]
			}
		}
	}
	var relevant [][]int
	for i := 0; i < len(cycles); {
		j := i
		for j < len(cycles) && len(cycles[j].atoms) == len(cycles[i].atoms) {
			j++
		}
		for _, c := range cycles[i:j] {
			if reduce(c.edges) != nil {
				relevant = append(relevant, c.atoms)
			}
		}
		for _, c := range cycles[i:j] {
			if r := reduce(c.edges); r != nil {
				p := 0
				for w, x := range r {
					if x != 0 {
						p = w*64 + bits.TrailingZeros64(x)
						break
					}
				}
				basis[p] = r
			}
		}
		i = j
	}
	if len(relevant) != bl.c {
		return nil, false, sizes
	}
	return relevant, true, sizes
}

// matchSystem reports whether ring system s of g is isomorphic to the whole
// ring skeleton of parent p (atoms with element and Benson type, bonds with
// order). The search is bounded by work.
func (g *graph) matchSystem(s ringSys, p *graph, work *int) bool {
	pm := p.m
	if len(pm.Atoms) != len(s.atoms) || len(pm.Bonds) != len(s.bonds) {
		return false
	}
	inSys := map[int]bool{}
	for _, b := range s.bonds {
		inSys[b] = true
	}
	deg := func(a int) int {
		d := 0
		for _, b := range g.nbrBond[a] {
			if inSys[b] {
				d++
			}
		}
		return d
	}
	same := func(a, x int) bool {
		return g.m.Atoms[a].Element == pm.Atoms[x].Element && g.typ[a] == p.typ[x] && deg(a) == len(p.nbr[x])
	}
	// Visit system atoms in breadth-first order so each new atom has a
	// mapped neighbour (the system is connected).
	order := []int{s.atoms[0]}
	seen := map[int]bool{s.atoms[0]: true}
	for i := 0; i < len(order); i++ {
		a := order[i]
		for k, b := range g.nbrBond[a] {
			if v := g.nbr[a][k]; inSys[b] && !seen[v] {
				seen[v] = true
				order = append(order, v)
			}
		}
	}
	if len(order) != len(s.atoms) {
		return false
	}
	mapTo := map[int]int{}
	used := make([]bool, len(pm.Atoms))
	var try func(i int) bool
	try = func(i int) bool {
		if i == len(order) {
			return true
		}
		*work++
		if *work > maxRingWork {
			return false
		}
		a := order[i]
		for x := range pm.Atoms {
			if used[x] || !same(a, x) {
				continue
			}
			ok := true
			for k, b := range g.nbrBond[a] {
				if !inSys[b] {
					continue
				}
				y, mapped := mapTo[g.nbr[a][k]]
				if !mapped {
					continue
				}
				pb := p.bondBetween(x, y)
				if pb < 0 || p.order(pb) != g.order(b) {
					ok = false
					break
				}
			}
			if !ok {
				continue
			}
			mapTo[a], used[x] = x, true
			if try(i + 1) {
				return true
			}
			delete(mapTo, a)
			used[x] = false
		}
		return false
	}
	return try(0)
}

// describe names ring system s for a report: bicyclo[x.y.z] for a single
// two-ring block, otherwise its kind, ring count and size.
func (g *graph) describe(s ringSys, kind string) string {
	rings := 0
	for _, b := range s.blocks {
		rings += b.c
	}
	if len(s.blocks) == 1 && s.blocks[0].c == 2 {
		if name := g.bicycloName(s.blocks[0]); name != "" {
			return fmt.Sprintf("%s (%s, %d ring atoms)", name, kind, len(s.atoms))
		}
	}
	return fmt.Sprintf("%s system of %d rings, %d ring atoms", kind, rings, len(s.atoms))
}

// bicycloName writes bicyclo[x.y.z] for a block with two rings: the numbers
// of atoms on the three bridges between the two bridgehead atoms.
func (g *graph) bicycloName(bl ringBlock) string {
	inB := map[int]bool{}
	for _, b := range bl.bonds {
		inB[b] = true
	}
	var heads []int
	for _, a := range bl.atoms {
		d := 0
		for _, b := range g.nbrBond[a] {
			if inB[b] {
				d++
			}
		}
		if d == 3 {
			heads = append(heads, a)
		} else if d != 2 {
			return ""
		}
	}
	if len(heads) != 2 {
		return ""
	}
	var bridges []int
	for k, b := range g.nbrBond[heads[0]] {
		if !inB[b] {
			continue
		}
		prev, cur, n := heads[0], g.nbr[heads[0]][k], 0
		for cur != heads[1] {
			n++
			next := -1
			for k2, b2 := range g.nbrBond[cur] {
				if inB[b2] && g.nbr[cur][k2] != prev {
					next = g.nbr[cur][k2]
					break
				}
			}
			if next < 0 || n > len(bl.atoms) {
				return ""
			}
			prev, cur = cur, next
		}
		bridges = append(bridges, n)
	}
	if len(bridges) != 3 {
		return ""
	}
	sort.Sort(sort.Reverse(sort.IntSlice(bridges)))
	return fmt.Sprintf("bicyclo[%d.%d.%d]", bridges[0], bridges[1], bridges[2])
}

// saturatedRing names the all-carbon saturated ring correction of a size.
func saturatedRing(n int) string {
	switch n {
	case 3:
		return "cyclopropane"
	case 4:
		return "cyclobutane"
	case 5:
		return "cyclopentane"
	case 6:
		return "cyclohexane"
	case 7:
		return "cycloheptane"
	case 8:
		return "cyclooctane"
	}
	return ""
}

// ringSystemEntropyGroup begins the flag of a ring system whose S° or Cp
// is the sum of its component rings' corrections (a polycyclic system whose
// table row has no S°, and no row has Cp). It concerns S° and Cp only.
const ringSystemEntropyGroup = "ring system S°, Cp: "

// ringSystemEntropyNote explains the flag of a ring system whose S° or Cp
// (what) is summed from its rings (sRings: their S° corrections, J/(mol K));
// withS adds the S° uncertainty it implies (widenRingShare of the summed
// correction, the same share as for an approximated strain).
func ringSystemEntropyNote(what string, sRings float64, withS bool) string {
	n := fmt.Sprintf("no whole-system %s is tabulated: the sum of the corrections of the component rings is used, which does not account for the modes a polycyclic system loses beyond its single rings", what)
	if withS {
		n += fmt.Sprintf("; S°298 uncertain by at least ±%.0f J/(mol K) (%.1f cal/(mol K))", widenRingShare*math.Abs(sRings), widenRingShare*math.Abs(sRings)/calorie)
	}
	return n
}

// ringTerm is one component ring's correction as chosen for an estimate.
type ringTerm struct {
	name string // "ring:…" key of corrections.tsv
}

// addRingCorrections adds the ring-strain terms of every ring system of g
// by the rule at the top of this file, and reports every approximation in
// est.Missing.
// multiFusedKind describes an ortho-fused system with a non-aromatic ring
// fused to two aromatic rings (fluorene, 9,10-dihydroanthracene).
const multiFusedKind = "non-aromatic ring fused to two aromatic rings"

func addRingCorrections(g *graph, l lookup, est *Result) {
	counts := map[string]int{}
	var order []string
	addRing := func(name string) {
		if counts[name] == 0 {
			order = append(order, name)
		}
		counts[name]++
	}
	sysCounts := map[string]int{}
	var sysOrder []string
	sysVal := map[string]Term{}
	work := 0
	for _, s := range g.ringSystems() {
		// Component rings of every block.
		var keys []string // "ring:…" corrections to apply (S, Cp; and ΔHf unless matched)
		allUnique, minSize, maxShared, multiFused := true, math.MaxInt, 0, false
		for _, bl := range s.blocks {
			rings, unique, sizes := g.blockRings(bl, &work)
			if !unique {
				allUnique = false
				for _, n := range sizes {
					minSize = min(minSize, n)
					if k := saturatedRing(n); k != "" {
						keys = append(keys, "ring:"+k)
					}
				}
				continue
			}
			aromatic := func(r []int) bool {
				for _, a := range r {
					if !g.m.Atoms[a].Aromatic {
						return false
					}
				}
				return true
			}
			for _, r := range rings {
				if aromatic(r) {
					continue
				}
				fusedTo := 0
				for _, q := range rings {
					if !aromatic(q) {
						continue
					}
					shared := 0
					for _, a := range r {
						if slices.Contains(q, a) {
							shared++
						}
					}
					if shared >= 2 {
						fusedTo++
					}
				}
				if fusedTo >= 2 {
					multiFused = true
				}
			}
			for i, r := range rings {
				minSize = min(minSize, len(r))
				for _, q := range rings[i+1:] {
					shared := 0
					for _, a := range r {
						if slices.Contains(q, a) {
							shared++
						}
					}
					maxShared = max(maxShared, shared)
				}
				if key := g.ringCorrection(r, l, est); key != "" {
					keys = append(keys, key)
				}
			}
		}
		slices.Sort(keys) // sums below in a canonical order
		// Whole-system value from the table?
		var matched *systemValue
		for i := range l.systems {
			if g.matchSystem(s, l.systems[i].parent, &work) {
				matched = &l.systems[i]
				break
			}
		}
		if matched != nil {
			hfRings := 0.0
			for _, k := range keys {
				hfRings += l.corrections[k].Hf298
			}
			name := "ring system strain: " + matched.name
			t, ok := sysVal[name]
			if !ok {
				t = Term{Name: name, Source: matched.value.Source + "; S and Cp: sum of the component ring corrections (common practice)"}
			}
			t.Count++
			t.Hf298 += matched.value.Hf298 - hfRings
			sRings := 0.0
			for _, k := range keys {
				sRings += l.corrections[k].S298
			}
			if matched.hasS {
				t.S298 += matched.value.S298 - sRings
			}
			// Cp is never tabulated for a whole system, S° seldom: what
			// the table lacks is the sum of the component rings, flagged.
			what := "Cp"
			if !matched.hasS {
				what = "S° and Cp"
				est.UncertaintyS298 = math.Hypot(est.UncertaintyS298, widenRingShare*math.Abs(sRings))
			}
			est.Missing = append(est.Missing, Missing{
				Group:         ringSystemEntropyGroup + matched.name,
				Approximation: "sum of component ring corrections",
				Note:          ringSystemEntropyNote(what, sRings, !matched.hasS),
			})
			sysVal[name] = t
			if sysCounts[name] == 0 {
				sysOrder = append(sysOrder, name)
			}
			sysCounts[name]++
			for _, k := range keys {
				addRing(k)
			}
			continue
		}
		for _, k := range keys {
			addRing(k)
		}
		single := len(s.blocks) == 1
		if single && s.blocks[0].c == 1 {
			continue // monocycle: its own key (flagged in ringCorrection if unknown)
		}
		kind := ""
		switch {
		case !single:
			kind = "spiro"
		case !allUnique:
			kind = "bridged or cage"
		case maxShared > 2:
			kind = "bridged"
		case minSize < 5:
			kind = "small-ring fused"
		case multiFused:
			// The ring's correction was measured with localised double
			// bonds (cyclopentadiene, cyclohexadiene), not between two
			// aromatic rings (fluorene, 9,10-dihydroanthracene).
			kind = multiFusedKind
		}
		if kind == "" {
			continue // ortho-fused, rings ≥ 5: sum of rings (Benson practice)
		}
		if kind == multiFusedKind {
			// Ortho-fused all the same: the ring corrections apply, but to
			// a ring they were not measured on (class.go widens a "ring:"
			// entry by widenRing, not by the whole-system RMS).
			est.Missing = append(est.Missing, Missing{
				Group:         "ring: " + g.describe(s, kind),
				Approximation: "sum of component ring corrections",
				Note:          "the correction of the ring between the aromatic rings was measured on the ring with localised double bonds; errors of several kcal/mol are possible",
			})
			continue
		}
		sRings := 0.0
		for _, k := range keys {
			sRings += l.corrections[k].S298
		}
		est.UncertaintyS298 = math.Hypot(est.UncertaintyS298, widenRingShare*math.Abs(sRings))
		est.Missing = append(est.Missing, Missing{
			Group:         "ring system: " + g.describe(s, kind),
			Approximation: "sum of component ring corrections",
			Note:          "no strain correction for this polycyclic system is tabulated; the sum of the corrections of its component rings is used and the uncertainty widened; " + ringSystemEntropyNote("S° and Cp", sRings, true),
		})
	}
	// Terms in a canonical order (by name), whatever the atom order.
	slices.Sort(order)
	slices.Sort(sysOrder)
	for _, name := range order {
		t := term(l.corrections[name], counts[name])
		t.Name = "ring strain: " + name[len("ring:"):]
		est.Corrections = append(est.Corrections, t)
	}
	for _, name := range sysOrder {
		est.Corrections = append(est.Corrections, sysVal[name])
	}
	addAzoleFlags(g, l, est) // azole.go
	addAceneFlag(g, est)
}

// aceneGroup begins the flag of a linearly fused benzenoid ring
// (addAceneFlag); it is a ring approximation (class.go widens it by
// widenRing).
const aceneGroup = "ring: linear (acene) fusion of benzene rings"

// addAceneFlag flags an estimate with a benzenoid ring fused to two other
// benzenoid rings across opposite bonds (the middle ring of anthracene;
// tetracene has two such rings, benz[a]anthracene one). The Cbf groups
// (Benson 1976) name a fused carbon by its neighbours only, and the
// carbons of anthracene have the neighbours of naphthalene's, from which
// the groups were derived: the extra destabilisation of linear fusion is
// in no group, and no published correction for it is at hand. Anthracene
// comes out about 3 kcal/mol below its handbook ΔHf° (55 kcal/mol, Pedley
// et al. 1986, from memory; angular phenanthrene, whose fused carbons are
// typed Cbf-(Cbf)2(Cb), is not affected). The estimate is kept, flagged.
func addAceneFlag(g *graph, est *Result) {
	benz := 0
	for _, b := range g.benzRing {
		if b {
			benz++
		}
	}
	if benz < 3 {
		return // linear fusion needs three benzenoid rings
	}
	shared := map[int]int{} // benzenoid rings per bond
	for ri, r := range g.rings {
		if !g.benzRing[ri] {
			continue
		}
		for k, a := range r {
			shared[g.bondBetween(a, r[(k+1)%len(r)])]++
		}
	}
	linear := 0
	for ri, r := range g.rings {
		if !g.benzRing[ri] || len(r) != 6 {
			continue
		}
		for k := range 3 {
			if shared[g.bondBetween(r[k], r[k+1])] > 1 && shared[g.bondBetween(r[k+3], r[(k+4)%6])] > 1 {
				linear++
				break
			}
		}
	}
	if linear == 0 {
		return
	}
	est.Missing = append(est.Missing, Missing{
		Group:         aceneGroup,
		Approximation: "Cbf groups derived from naphthalene",
		Note:          fmt.Sprintf("%s fused to two benzene rings across opposite bonds: no group or correction describes the destabilisation of linear fusion (anthracene comes out about 3 kcal/mol low)", wording.Count(linear, "benzene ring")),
	})
}

// ringCorrection returns the "ring:…" key of corrections.tsv used for ring
// r ("" for benzenoid rings and rings with neither a value nor an
// approximation) and reports approximations in est.Missing.
func (g *graph) ringCorrection(r []int, l lookup, est *Result) string {
	key, fallback := g.ringKey(r)
	if key == "" {
		return ""
	}
	name := "ring:" + key
	if _, ok := l.corrections[name]; ok {
		return name
	}
	approx := ""
	if fallback != "" {
		if _, ok := l.corrections["ring:"+fallback]; ok {
			approx = "ring:" + fallback
		}
	}
	note := "no ring correction known; none applied"
	if approx != "" {
		note = "no correction for this ring: the ring of the same size with fewer features (" + fallback + ") is used"
		if isFusedFiveRing(key) { // rings.go
			note += "; the fused ring changes the five-membered ring's aromatic stabilisation: with the single ring's correction, benzofuran came out 8.8 kcal/mol low, and benzothiophene and dibenzothiophene (which now have corrections of their own) about 10 low and 11 high"
		}
	}
	est.Missing = append(est.Missing, Missing{Group: name, Approximation: approx, Note: note})
	return approx
}
