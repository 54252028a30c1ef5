package molecule

import (
	"context"
	"fmt"
	"slices"
)

// Optical isomers n, one rule for every structure.
//
// n is the number of distinct stereoisomers the structure stands for,
// enantiomers counted apart (common practice for the R ln n term of the
// entropy: 2 for a chiral molecule written without marks, 1 for an achiral
// one or for a single written configuration). kiln counts them from the
// graph:
//
//  1. The stereo units are the tetrahedral carbon atoms (four single bonds,
//     at most one hydrogen, no radical). Each has two configurations, a bit
//     relative to its neighbours in atom order (hydrogen last).
//  2. Configurations that small rings cannot take are excluded, as for σ:
//     a bond shared by two small rings (one of at most four atoms, or both
//     of at most five) is cis-fused; two unbonded atoms joined by three
//     disjoint paths with at most nine atoms in all (the bridgeheads of a
//     small bicycle, including bicycles inside cages and polycycles) are
//     "out,out". A written @/@@ fixes its atom's configuration.
//  3. Two configurations are the same stereoisomer when an automorphism of
//     the graph maps one onto the other; n is the number of classes of the
//     allowed configurations (a meso form is one class, a chiral pair two).
//
// An unmarked 2,3-butanediol is 3 (R,R; S,S; meso), 2-methylnorbornane 4,
// 1,4-dimethylcyclohexane 2 (cis, trans), adamantane and cubane 1. The
// estimate then stands for an equimolar mixture of the n stereoisomers:
// S gains R ln n while σ is that of the most symmetric stereoisomer (see
// SymmetryNumber); where the stereoisomers' σ differ (meso 9 against 18
// for the chiral pair of 2,3-dichlorobutane) this is an approximation of at
// most R ln(σmax/σmin). Cis/trans double bonds are not counted: a double
// bond written without / \ stands for the isomer its groups describe.
// Work is bounded: at most maxOpticalWork configuration images are
// examined; beyond it the result is an error wrapping ErrWorkLimit.

// maxOpticalWork bounds configurations × automorphisms examined by
// OpticalIsomersContext.
const maxOpticalWork = 1 << 21

// maxOpticalBits bounds the free configuration bits when the graph has no
// symmetry (n = 2^bits needs no enumeration).
const maxOpticalBits = 30

// OpticalIsomers returns n, the number of stereoisomers the structure
// stands for (see the rule above), or 0 when it cannot be computed within
// the work bound (OpticalIsomersContext gives the reason).
func (m *Molecule) OpticalIsomers() int {
	n, err := m.OpticalIsomersContext(context.Background())
	if err != nil {
		return 0
	}
	return n
}

// stereoUnit reports whether atom i is a tetrahedral stereo unit: an sp3
// carbon, or a configurationally stable S, Se or P centre — a sulfoxide-type
// S/Se with three partners and a lone pair, a phosphine P with three
// partners and a lone pair, a P with four partners (inversion barriers of
// 35–45 kcal/mol, common practice; amines invert fast and are not units).
func (m *Molecule) stereoUnit(i int) bool {
	a := m.Atoms[i]
	if a.Aromatic || a.Radical != 0 || a.HCount > 1 {
		return false
	}
	switch a.Element {
	case "C":
		return len(m.Adj[i])+a.HCount == 4 && m.allSingle(i)
	case "S", "Se", "P":
		// One lone pair at most: a sulfide S (two lone pairs) is no unit.
		lp := m.stereoLonePairs(i)
		return a.HCount == 0 && lp <= 1 && len(m.Adj[i])+lp == 4
	}
	return false
}

// stereoLonePairs is the number of lone pairs that take a position of a
// stereo unit at a heavy atom (see stereoUnit): 1 or 0.
func (m *Molecule) stereoLonePairs(i int) int {
	a := m.Atoms[i]
	if a.Element == "C" {
		return 0
	}
	if lp, ok := m.hypervalentLonePairs(i); ok && !m.allSingle(i) {
		return lp
	}
	if a.Element == "P" && m.allSingle(i) && len(m.Adj[i])+a.HCount == 3 && a.Charge == 0 {
		return 1 // phosphine
	}
	return 0
}

// stereoPositions lists the four positions of a stereo unit: neighbours in
// Adj order, then -1 for a hydrogen or -2 for a lone pair.
func (m *Molecule) stereoPositions(i int) []int {
	out := m.Neighbors(i)
	out = slices.Clone(out)
	if m.Atoms[i].HCount == 1 {
		out = append(out, -1)
	}
	if m.stereoLonePairs(i) == 1 {
		out = append(out, -2)
	}
	return out
}

// OpticalIsomersContext is OpticalIsomers with cancellation and an error
// (wrapping ErrWorkLimit) when the count is beyond the work bound.
func (m *Molecule) OpticalIsomersContext(ctx context.Context) (int, error) {
	cand := make([]bool, len(m.Atoms))
	for i := range m.Atoms {
		cand[i] = m.stereoUnit(i)
	}
	if err := m.dropAlikeBranches(ctx, cand); err != nil {
		return 0, err
	}
	var units []int
	at := map[int]int{}
	for i := range m.Atoms {
		if cand[i] {
			at[i] = len(units)
			units = append(units, i)
		}
	}
	if len(units) == 0 {
		return 1, nil
	}
	k := len(units)
	ground := k // node fixed at 0: written configurations
	rel := newParityRelations(k + 1)
	relate := func(u, v, e int) bool {
		ru, pu := rel.find(u)
		rv, pv := rel.find(v)
		if ru == rv {
			return pu^pv == e
		}
		if ru == ground { // keep the ground a root
			ru, rv, pu, pv = rv, ru, pv, pu
		}
		rel.par[ru], rel.bits[ru] = rv, pu^pv^e
		return true
	}
	// written marks
	for u, x := range units {
		odd := 0
		switch m.Atoms[x].Chirality {
		case "@", "@TH1":
		case "@@", "@TH2":
			odd = 1
		default:
			continue
		}
		if x >= len(m.nbrOrder) || len(m.nbrOrder[x]) != 4 {
			continue
		}
		pos := m.stereoPositions(x)
		p := make([]int, 4)
		for i, v := range m.nbrOrder[x] {
			p[i] = slices.Index(pos, v)
		}
		if !isPerm(p) {
			continue
		}
		relate(u, ground, permParity(p)^odd)
	}
	// geometric constraints (a written structure that violates them keeps
	// its marks: constraints that contradict marks are skipped)
	rels, err := m.ringStereoRelations(ctx, units, at)
	if err != nil {
		return 0, err
	}
	for _, r := range rels {
		relate(r[0], r[1], r[2])
	}
	// free bits: roots other than the ground
	var free []int
	for u := 0; u < k; u++ {
		if r, _ := rel.find(u); r == u {
			free = append(free, u)
		}
	}
	if len(free) == 0 {
		return 1, nil
	}
	info, err := m.symmetryInfo(ctx, DefaultSearchWork)
	if err != nil {
		return 0, fmt.Errorf("optical isomers: %w", err)
	}
	if len(info.gens) == 0 {
		if len(free) > maxOpticalBits {
			return 0, fmt.Errorf("optical isomers of %q: %w (%d independent stereocentres, more than %d)", m.SMILES, ErrWorkLimit, len(free), maxOpticalBits)
		}
		return 1 << len(free), nil
	}
	if len(free) > 20 {
		return 0, fmt.Errorf("optical isomers of %q: %w (%d independent stereocentres in a symmetric graph)", m.SMILES, ErrWorkLimit, len(free))
	}
	elems := groupElements(info.gens, maxFragmentGroup+1)
	if len(elems) > maxFragmentGroup || (len(elems)<<len(free)) > maxOpticalWork {
		return 0, fmt.Errorf("optical isomers of %q: %w (%d configurations × %d automorphisms)", m.SMILES, ErrWorkLimit, 1<<len(free), len(elems))
	}
	// image of each unit under each element and the configuration flip
	type img struct{ u, bit int }
	imgs := make([][]img, len(elems))
	for e, g := range elems {
		imgs[e] = make([]img, k)
		phi := func(a int) int {
			if a < 0 {
				return a
			}
			return g[a]
		}
		for u, x := range units {
			y := g[x]
			imgs[e][u] = img{at[y], permBit(m.stereoPositions(x), m.stereoPositions(y), phi)}
		}
	}
	// configuration of every unit from the free bits
	cfg := make([]int, k)
	out := make([]int, k)
	valid := func(c []int) bool {
		for u := 0; u < k; u++ {
			r, p := rel.find(u)
			if r == ground {
				if c[u] != p {
					return false
				}
				continue
			}
			if c[u] != c[r]^p {
				return false
			}
		}
		return true
	}
	less := func(a, b []int) bool { return slices.Compare(a, b) < 0 }
	count := 0
	for mask := 0; mask < 1<<len(free); mask++ {
		if mask&1023 == 0 {
			if err := ctx.Err(); err != nil {
				return 0, fmt.Errorf("optical isomers: %w", err)
			}
		}
		for j, u := range free {
			cfg[u] = (mask >> j) & 1
		}
		for u := 0; u < k; u++ {
			r, p := rel.find(u)
			if r == ground {
				cfg[u] = p
			} else {
				cfg[u] = cfg[r] ^ p
			}
		}
		least := true
		for e := range elems {
			for u := 0; u < k; u++ {
				im := imgs[e][u]
				out[im.u] = cfg[u] ^ im.bit
			}
			if less(out, cfg) && valid(out) {
				least = false
				break
			}
		}
		if least {
			count++
		}
	}
	return max(count, 1), nil
}

// ringStereoRelations returns the configuration equations {unit, unit,
// bit} of cis fusions of small rings and of the bridgeheads of small
// bicycles (see the rule above), in the positions of stereoPositions.
func (m *Molecule) ringStereoRelations(ctx context.Context, units []int, at map[int]int) ([][3]int, error) {
	inRing := m.ringBondFlags()
	out := m.cisFusionRelations(at, m.stereoPositions)
	ringNbrs := func(x int) []int {
		var o []int
		for _, b := range m.Adj[x] {
			if inRing[b] {
				o = append(o, m.Other(b, x))
			}
		}
		return o
	}
	cageRels, inCage := m.cageRelations(units, at, inRing, ringNbrs)
	out = append(out, cageRels...)
	// small bicycles: three disjoint paths a…b with at most 7 inner atoms
	type path struct {
		first, last int
		inner       []int
	}
	steps := 0
	for ia, a := range units {
		if len(ringNbrs(a)) < 3 {
			continue
		}
		for _, b := range units[ia+1:] {
			if len(ringNbrs(b)) < 3 || m.BondBetween(a, b) >= 0 || (inCage[a] && inCage[b]) {
				continue // cage atoms are fixed by the cage's faces
			}
			// simple paths a → b with at most 7 inner atoms
			var paths []path
			var stack []int
			onPath := map[int]bool{a: true}
			var dfs func(x int) error
			dfs = func(x int) error {
				steps++
				if steps > maxOpticalWork {
					return fmt.Errorf("optical isomers of %q: %w (ring paths)", m.SMILES, ErrWorkLimit)
				}
				if steps&1023 == 0 {
					if err := ctx.Err(); err != nil {
						return fmt.Errorf("optical isomers: %w", err)
					}
				}
				for _, y := range ringNbrs(x) {
					if y == b {
						if len(stack) > 0 {
							paths = append(paths, path{stack[0], stack[len(stack)-1], slices.Clone(stack)})
						}
						continue
					}
					if onPath[y] || len(stack) >= 7 {
						continue
					}
					onPath[y] = true
					stack = append(stack, y)
					if err := dfs(y); err != nil {
						return err
					}
					stack = stack[:len(stack)-1]
					onPath[y] = false
				}
				return nil
			}
			if err := dfs(a); err != nil {
				return nil, err
			}
			disjoint := func(p, q path) bool {
				if p.first == q.first || p.last == q.last {
					return false
				}
				for _, x := range p.inner {
					if slices.Contains(q.inner, x) {
						return false
					}
				}
				return true
			}
			found := false
			for i := 0; i < len(paths) && !found; i++ {
				for j := i + 1; j < len(paths) && !found; j++ {
					if !disjoint(paths[i], paths[j]) || len(paths[i].inner)+len(paths[j].inner) > 7 {
						continue
					}
					for l := j + 1; l < len(paths) && !found; l++ {
						p, q, r := paths[i], paths[j], paths[l]
						if len(p.inner)+len(q.inner)+len(r.inner)+2 > 9 || !disjoint(p, r) || !disjoint(q, r) {
							continue
						}
						found = true
						bit := oppositeTurnBit(m.stereoPositions(a), []int{p.first, q.first, r.first},
							m.stereoPositions(b), []int{p.last, q.last, r.last})
						out = append(out, [3]int{at[a], at[b], bit})
					}
				}
			}
		}
	}
	return out, nil
}

// cageRelations returns the configuration equations of cages: ring
// systems of at least three rings in which every atom is a stereo unit with
// three ring neighbours (cubane, dodecahedrane, polyhedral CH cages). Such a
// cage is a polyhedron whose fourth ligands all point outwards, so every
// atom turns the same way around the faces: across a bond a–b on a face
// … c–a–b–e …, c→b→(third) at a and a→e→(third) at b have the same
// handedness seen from outside (the faces are the smallest relevant cycles
// through each bond).
func (m *Molecule) cageRelations(units []int, at map[int]int, inRing []bool, ringNbrs func(int) []int) ([][3]int, []bool) {
	n := len(m.Atoms)
	inCage := make([]bool, n)
	parent := make([]int, n)
	for i := range parent {
		parent[i] = i
	}
	for b, bd := range m.Bonds {
		if inRing[b] {
			union(parent, bd.A, bd.B)
		}
	}
	systems := map[int][]int{}
	for i := range m.Atoms {
		if len(ringNbrs(i)) > 0 {
			r := find(parent, i)
			systems[r] = append(systems[r], i)
		}
	}
	id := func(x int) int { return x }
	var out [][3]int
	for _, atoms := range systems {
		if len(atoms) < 4 {
			continue
		}
		cage := true
		for _, x := range atoms {
			if _, ok := at[x]; !ok || len(ringNbrs(x)) != 3 {
				cage = false
				break
			}
		}
		// three-connected atoms: bonds = 3n/2, rings = bonds − n + 1
		if !cage || 3*len(atoms)/2-len(atoms)+1 < 3 {
			continue
		}
		for _, x := range atoms {
			inCage[x] = true
		}
		order := func(x, first, second int) []int {
			p := []int{first, second}
			for _, y := range ringNbrs(x) {
				if y != first && y != second {
					p = append(p, y)
				}
			}
			for _, y := range m.stereoPositions(x) {
				if !slices.Contains(p, y) {
					p = append(p, y)
				}
			}
			return p
		}
		for _, bd := range m.Bonds {
			a, b := bd.A, bd.B
			if find(parent, a) != find(parent, atoms[0]) || !slices.Contains(ringNbrs(a), b) {
				continue
			}
			var face []int
			for _, c := range m.cycles {
				for k := range c {
					x, y := c[k], c[(k+1)%len(c)]
					if (x == a && y == b) || (x == b && y == a) {
						if face == nil || len(c) < len(face) {
							face = c
						}
						break
					}
				}
			}
			if face == nil {
				continue
			}
			nb := func(x, not int) int {
				k := slices.Index(face, x)
				p, q := face[(k+len(face)-1)%len(face)], face[(k+1)%len(face)]
				if p == not {
					return q
				}
				return p
			}
			c, e := nb(a, b), nb(b, a)
			pa, pb := m.stereoPositions(a), m.stereoPositions(b)
			out = append(out, [3]int{at[a], at[b], permBit(order(a, c, b), pa, id) ^ permBit(order(b, a, e), pb, id)})
		}
	}
	return out, inCage
}

// dropAlikeBranches clears cand[x] for the stereo units that carry two
// symmetry-equivalent acyclic branches with no stereo unit in them
// (C(CH3)2, two tert-butyls): exchanging the branches is a symmetry that
// fixes everything else, so x has one configuration. Repeated until
// nothing changes (a branch may lose its last unit). Pseudo-asymmetric
// centres (C3 of a pentitol) keep their units: their branches carry units.
func (m *Molecule) dropAlikeBranches(ctx context.Context, cand []bool) error {
	some := false
	for _, c := range cand {
		some = some || c
	}
	if !some {
		return nil
	}
	info, err := m.symmetryInfo(ctx, DefaultSearchWork)
	if err != nil {
		return fmt.Errorf("optical isomers: %w", err)
	}
	classes := m.classesOf(info, DefaultSearchWork)
	inRing := m.ringBondFlags()
	// hasUnit reports whether the branch entered from x through y holds a
	// candidate unit (acyclic branches only: the bond x–y is on no ring).
	seen := make([]bool, len(m.Atoms))
	var stack []int
	hasUnit := func(x, y int) bool {
		clear(seen)
		seen[x], seen[y] = true, true
		stack = append(stack[:0], y)
		for len(stack) > 0 {
			a := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			if cand[a] {
				return true
			}
			for _, o := range m.Neighbors(a) {
				if !seen[o] {
					seen[o] = true
					stack = append(stack, o)
				}
			}
		}
		return false
	}
	for changed := true; changed; {
		changed = false
		for x := range m.Atoms {
			if !cand[x] {
				continue
			}
			free := map[int]bool{} // classes of unit-free acyclic branches
			for _, b := range m.Adj[x] {
				if inRing[b] {
					continue
				}
				y := m.Other(b, x)
				if hasUnit(x, y) {
					continue
				}
				if free[classes[y]] {
					cand[x], changed = false, true
					break
				}
				free[classes[y]] = true
			}
		}
	}
	return nil
}
