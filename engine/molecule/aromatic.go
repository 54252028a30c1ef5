package molecule

import "slices"

// pauling holds Pauling electronegativities used to decide whether an
// exocyclic double bond takes the ring atom's π electron. Source: Pauling
// scale values as tabulated in the CRC Handbook of Chemistry and Physics,
// entered from memory. Elements not listed count as 2.0 (less than carbon).
var pauling = map[string]float64{
	"H": 2.20, "B": 2.04, "C": 2.55, "N": 3.04, "O": 3.44, "F": 3.98,
	"Si": 1.90, "P": 2.19, "S": 2.58, "Cl": 3.16, "As": 2.18, "Se": 2.55,
	"Br": 2.96, "Te": 2.1, "I": 2.66,
}

// aromaticCapable lists the elements that can be written aromatic in SMILES
// (b c n o p s, [se], [as]); only they take part in aromatic rings.
var aromaticCapable = map[string]bool{"B": true, "C": true, "N": true, "O": true, "P": true, "S": true, "Se": true, "As": true}

func electronegativity(sym string) float64 {
	if x, ok := pauling[sym]; ok {
		return x
	}
	return 2.0
}

// perceiveWith computes rings, ring systems and aromaticity of a Kekulé
// graph whose ring bonds are flagged in inRing.
func (m *Molecule) perceiveWith(inRing []bool) {
	m.rings, m.cycles = m.findRings(inRing)
	m.ringSys = ringSystems(len(m.Atoms), m.rings)
	m.perceiveAromaticity(inRing)
}

// ringSystems unites SSSR rings that share a bond (two or more atoms): fused
// and bridged rings form one system; spiro rings (one shared atom) do not.
// Each system is a sorted atom list; systems are in lexicographic order
// (by first atom, spiro partners sharing it by the atoms that follow).
func ringSystems(n int, rings [][]int) [][]int {
	if len(rings) == 0 {
		return nil
	}
	parent := make([]int, len(rings))
	for i := range parent {
		parent[i] = i
	}
	for r1 := range rings {
		for r2 := r1 + 1; r2 < len(rings); r2++ {
			shared := 0
			for _, a := range rings[r1] {
				if slices.Contains(rings[r2], a) {
					shared++
				}
			}
			if shared >= 2 {
				union(parent, r1, r2)
			}
		}
	}
	in := make([]bool, n)
	total := 0
	for _, ring := range rings {
		total += len(ring)
	}
	buf := make([]int, 0, total) // the systems' lists share one array
	out := make([][]int, 0, len(rings))
	for r := range rings {
		if find(parent, r) != r {
			continue
		}
		list := buf[len(buf):len(buf)]
		for r2, ring := range rings {
			if find(parent, r2) != r {
				continue
			}
			for _, a := range ring {
				if !in[a] {
					in[a] = true
					list = append(list, a)
				}
			}
		}
		for _, a := range list {
			in[a] = false
		}
		slices.Sort(list)
		out = append(out, list[:len(list):len(list)])
		buf = buf[:len(buf)+len(list)]
	}
	slices.SortFunc(out, slices.Compare)
	return out
}

// piContribution returns the π electrons atom i gives to a ring and whether
// it can be part of an aromatic ring at all (Hückel model on the Kekulé
// graph, close to the common toolkit default):
//   - a double bond to a ring atom: 1 electron;
//   - an exocyclic double bond to a more electronegative atom (C=O, C=N, C=S):
//     0 electrons; to a less or equally electronegative atom: not a candidate;
//   - no double bond, a lone pair and at most three σ partners (pyrrole N,
//     furan O, thiophene S, [cH-]): 2 electrons;
//   - no double bond, no nonbonding electrons and three σ partners (C⁺, B):
//     0 electrons (empty p orbital);
//   - anything else (sp3, triple bonds, cumulated double bonds, a radical
//     centre without a double bond): not a candidate.
func (m *Molecule) piContribution(i int, inRing []bool) (int, bool) {
	a := m.Atoms[i]
	if !aromaticCapable[a.Element] {
		return 0, false
	}
	doubles, ringDouble, exo := 0, false, -1
	for _, b := range m.Adj[i] {
		switch o := m.Bonds[b].Order; {
		case o >= 3:
			return 0, false
		case o == 2:
			doubles++
			if inRing[b] {
				ringDouble = true
			} else {
				exo = m.Other(b, i)
			}
		}
	}
	sigma := len(m.Adj[i]) + a.HCount
	if doubles > 1 || sigma > 3 {
		return 0, false
	}
	if ringDouble {
		return 1, true
	}
	if exo >= 0 {
		if electronegativity(m.Atoms[exo].Element) > electronegativity(a.Element) {
			return 0, true
		}
		return 0, false
	}
	ve, ok := valenceElectrons(a.Element, a.Charge)
	if !ok {
		return 0, false
	}
	nonbonding := ve - sigma
	switch {
	case a.Radical != 0:
		return 0, false
	case nonbonding >= 2:
		return 2, true
	case nonbonding == 0 && sigma == 3:
		return 0, true
	}
	return 0, false
}

// perceiveAromaticity marks atoms and bonds aromatic. Every relevant cycle
// whose atoms are all candidates and whose π count is 4n+2 is aromatic, and
// so is every union of two or three such cycles fused through shared bonds
// (azulene, and systems whose single rings fail but whose periphery obeys
// Hückel's rule). All bonds of an aromatic cycle or union become aromatic.
func (m *Molecule) perceiveAromaticity(inRing []bool) {
	for i := range m.Atoms {
		m.Atoms[i].Aromatic = false
	}
	for k := range m.Bonds {
		m.Bonds[k].Aromatic = false
	}
	if len(m.cycles) == 0 {
		return
	}
	n := len(m.Atoms)
	elec := make([]int, n)
	cand := make([]bool, n)
	for i := range m.Atoms {
		elec[i], cand[i] = m.piContribution(i, inRing)
	}
	var good [][]int
	for _, c := range m.cycles {
		ok := true
		for _, a := range c {
			if !cand[a] {
				ok = false
				break
			}
		}
		if ok {
			good = append(good, c)
		}
	}
	bondsOf := func(c []int) []int {
		out := make([]int, 0, len(c))
		for k := range c {
			if b := m.BondBetween(c[k], c[(k+1)%len(c)]); b >= 0 {
				out = append(out, b)
			}
		}
		return out
	}
	cb := make([][]int, len(good))
	for k, c := range good {
		cb[k] = bondsOf(c)
	}
	stamp := make([]int, n) // stamp[a] == tick: atom a counted in this union
	tick := 0
	var atoms []int
	mark := func(set []int) {
		tick++
		atoms = atoms[:0]
		for _, k := range set {
			for _, a := range good[k] {
				if stamp[a] != tick {
					stamp[a] = tick
					atoms = append(atoms, a)
				}
			}
		}
		e := 0
		for _, a := range atoms {
			e += elec[a]
		}
		if e%4 != 2 {
			return
		}
		for _, a := range atoms {
			m.Atoms[a].Aromatic = true
		}
		for _, k := range set {
			for _, b := range cb[k] {
				m.Bonds[b].Aromatic = true
			}
		}
	}
	shareBond := func(x, y int) bool {
		for _, b := range cb[x] {
			for _, c := range cb[y] {
				if b == c {
					return true
				}
			}
		}
		return false
	}
	for k := range good {
		mark([]int{k})
	}
	if len(good) > 30 {
		return // very large cages: single rings only (bounded work)
	}
	fused := make([][]bool, len(good))
	for x := range good {
		fused[x] = make([]bool, len(good))
		for y := range good {
			if x != y {
				fused[x][y] = shareBond(x, y)
			}
		}
	}
	for x := range good {
		for y := x + 1; y < len(good); y++ {
			if !fused[x][y] {
				continue
			}
			mark([]int{x, y})
			for z := y + 1; z < len(good); z++ {
				if fused[x][z] || fused[y][z] {
					mark([]int{x, y, z})
				}
			}
		}
	}
	// triples whose middle ring is not the lowest index: x–z–y chains with
	// x, y not fused directly
	for z := range good {
		for x := range good {
			for y := x + 1; y < len(good); y++ {
				if x == z || y == z || fused[x][y] || !fused[x][z] || !fused[y][z] {
					continue
				}
				mark([]int{x, y, z})
			}
		}
	}
}

// atomInRing reports whether atom i has a ring bond.
func (m *Molecule) atomInRing(i int, inRing []bool) bool {
	for _, b := range m.Adj[i] {
		if inRing[b] {
			return true
		}
	}
	return false
}
