package molecule

import (
	"slices"
)

// RingSystem describes one ring system (a block of the graph: rings joined
// through shared bonds; spiro-joined rings are separate systems) by
// properties that do not depend on how the molecule was written. Use it for
// ring-strain terms instead of Rings(), whose SSSR is one arbitrary choice
// when the smallest rings are not unique (cubane, adamantane).
//
// Atom indices refer to Molecule.Atoms and so follow the written order, but
// every list is ordered by the canonical labelling, so two spellings give
// the same lists up to the renumbering of atoms (and the same counts and
// sizes exactly).
type RingSystem struct {
	// Atoms of the system, in increasing canonical label.
	Atoms []int
	// Kind is "monocyclic" (one ring), "fused" (no two relevant cycles share
	// more than one bond: naphthalene, decalin, indane), "bridged" (some two
	// relevant cycles share two or more bonds: norbornane, adamantane,
	// bicyclo[1.1.0]butane) or "cage" (bridged or fused with every atom a
	// bridgehead and at least three rings: cubane, prismane, dodecahedrane).
	Kind string
	// Rings is the number of rings, the cyclomatic number of the system
	// (bonds − atoms + 1): the size of every minimum cycle basis.
	Rings int
	// BasisSizes are the ring sizes of a minimum cycle basis, ascending. The
	// basis itself need not be unique, but this multiset is (cubane: five 4s).
	BasisSizes []int
	// Relevant are the relevant cycles (Vismara 1997): the union of all
	// minimum cycle bases, each an atom sequence in ring order starting at
	// its lowest canonical label and going towards the lower-labelled
	// neighbour; sorted by size, then by labels. When len(Relevant) == Rings
	// the minimum cycle basis is unique and Relevant is it (cubane has six
	// relevant 4-rings for five rings, adamantane four 6-rings for three).
	Relevant [][]int
	// Bridgeheads are the atoms with three or more ring bonds inside the
	// system, in canonical order.
	Bridgeheads []int
	// Spiro lists the atoms this system shares with other ring systems.
	Spiro []int
	// Truncated is true when the system has more relevant cycles than kiln
	// keeps (maxRelevantCycles); Relevant then lists only the first ones.
	Truncated bool
}

// UniqueBasis reports whether the system has exactly one minimum cycle basis.
func (r RingSystem) UniqueBasis() bool { return !r.Truncated && len(r.Relevant) == r.Rings }

// RingSystemInfo returns the ring systems of m, ordered by the canonical
// labels of their atoms (see RingSystem). It costs one canonical
// labelling (cached for parsed molecules). The result is a new slice; its
// contents may be kept by the caller.
func (m *Molecule) RingSystemInfo() []RingSystem {
	if len(m.ringSys) == 0 {
		return nil
	}
	labels := m.canonicalLabels()
	n := len(m.Atoms)
	byLabel := func(xs []int) {
		slices.SortFunc(xs, func(a, b int) int { return labels[a] - labels[b] })
	}
	sysOf := make([]int, n)
	for i := range sysOf {
		sysOf[i] = -1
	}
	count := make([]int, n) // ring systems per atom
	for k, sys := range m.ringSys {
		for _, a := range sys {
			sysOf[a] = k
			count[a]++
		}
	}
	out := make([]RingSystem, 0, len(m.ringSys))
	for k, sys := range m.ringSys {
		in := make([]bool, n)
		for _, a := range sys {
			in[a] = true
		}
		rs := RingSystem{Atoms: slices.Clone(sys)}
		byLabel(rs.Atoms)
		bonds := 0
		for _, a := range sys {
			deg := 0
			for _, b := range m.Adj[a] {
				o := m.Other(b, a)
				if in[o] { // two atoms of one block: the bond is in it
					deg++
					if a < o {
						bonds++
					}
				}
			}
			if deg >= 3 {
				rs.Bridgeheads = append(rs.Bridgeheads, a)
			}
			if count[a] > 1 {
				rs.Spiro = append(rs.Spiro, a)
			}
		}
		byLabel(rs.Bridgeheads)
		byLabel(rs.Spiro)
		rs.Rings = bonds - len(sys) + 1
		for _, r := range m.rings {
			if in[r[0]] && in[r[1]] && m.sameSystem(r, k) {
				rs.BasisSizes = append(rs.BasisSizes, len(r))
			}
		}
		slices.Sort(rs.BasisSizes)
		for _, c := range m.cycles {
			if m.sameSystem(c, k) {
				rs.Relevant = append(rs.Relevant, orientCycle(c, labels))
			}
		}
		rs.Truncated = len(m.cycles) >= maxRelevantCycles
		slices.SortFunc(rs.Relevant, func(x, y []int) int {
			if len(x) != len(y) {
				return len(x) - len(y)
			}
			for i := range x {
				if d := labels[x[i]] - labels[y[i]]; d != 0 {
					return d
				}
			}
			return 0
		})
		rs.Kind = ringKind(m, rs)
		out = append(out, rs)
	}
	slices.SortFunc(out, func(x, y RingSystem) int {
		for i := 0; i < len(x.Atoms) && i < len(y.Atoms); i++ {
			if d := labels[x.Atoms[i]] - labels[y.Atoms[i]]; d != 0 {
				return d
			}
		}
		return len(x.Atoms) - len(y.Atoms)
	})
	return out
}

// sameSystem reports whether cycle c lies in ring system k: a cycle lies in
// one block, so two consecutive atoms in the system decide it.
func (m *Molecule) sameSystem(c []int, k int) bool {
	sys := m.ringSys[k]
	_, ok0 := slices.BinarySearch(sys, c[0])
	_, ok1 := slices.BinarySearch(sys, c[1])
	if !ok0 || !ok1 {
		return false
	}
	// c[0] and c[1] can both be in system k while the bond belongs to
	// another system only if k and that system share both atoms, which
	// blocks never do.
	return true
}

// orientCycle returns cycle c rotated to start at its lowest canonical
// label and turned towards the lower-labelled neighbour.
func orientCycle(c []int, labels []int) []int {
	n := len(c)
	s := 0
	for i := range c {
		if labels[c[i]] < labels[c[s]] {
			s = i
		}
	}
	out := make([]int, n)
	fwd := labels[c[(s+1)%n]] < labels[c[(s+n-1)%n]]
	for i := range out {
		if fwd {
			out[i] = c[(s+i)%n]
		} else {
			out[i] = c[(s-i+n)%n]
		}
	}
	return out
}

func ringKind(m *Molecule, rs RingSystem) string {
	if rs.Rings == 1 {
		return "monocyclic"
	}
	bridged := false
	for i := range rs.Relevant {
		for j := i + 1; j < len(rs.Relevant) && !bridged; j++ {
			if sharedBonds(rs.Relevant[i], rs.Relevant[j]) > 1 {
				bridged = true
			}
		}
	}
	if rs.Rings >= 3 && len(rs.Bridgeheads) == len(rs.Atoms) {
		return "cage"
	}
	if bridged {
		return "bridged"
	}
	return "fused"
}

// sharedBonds counts the bonds two cycles have in common.
func sharedBonds(x, y []int) int {
	n := 0
	for i := range x {
		a, b := x[i], x[(i+1)%len(x)]
		for j := range y {
			c, d := y[j], y[(j+1)%len(y)]
			if (a == c && b == d) || (a == d && b == c) {
				n++
				break
			}
		}
	}
	return n
}

// canonicalLabels returns the canonical label of every atom (cached for
// parsed molecules).
func (m *Molecule) canonicalLabels() []int {
	if d := m.cache(); d != nil {
		return d.info.labels
	}
	return m.symmetry(DefaultSearchWork, false).labels
}
