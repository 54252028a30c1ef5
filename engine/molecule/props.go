package molecule

import (
	"fmt"
	"slices"
	"sort"
	"strconv"
	"strings"
)

// Composition returns element symbol → number of atoms, hydrogens included
// (implicit and explicit). Isotopes count under their element ("[2H]" is H).
func (m *Molecule) Composition() map[string]int {
	c := map[string]int{}
	for _, a := range m.Atoms {
		c[a.Element]++
		if a.HCount > 0 {
			c["H"] += a.HCount
		}
	}
	return c
}

// Formula returns the neutral molecular formula in Hill order: C first, then
// H, then the other elements alphabetically; without carbon every element
// (H included) is alphabetical. Counts of 1 are omitted. The charge is not
// part of the formula (see Charge). Atoms written with a mass number keep
// it: ²H and ³H as D and T, others as [13C], each right after its element
// (CC[2H] is C2H5D, [13CH4] is [13C]H4); Composition counts elements only.
func (m *Molecule) Formula() string {
	type elCount struct {
		el  string // element, for ordering
		iso int
		n   int
	}
	var buf [8]elCount
	counts := buf[:0]
	add := func(el string, iso, n int) {
		for k := range counts {
			if counts[k].el == el && counts[k].iso == iso {
				counts[k].n += n
				return
			}
		}
		counts = append(counts, elCount{el, iso, n})
	}
	hasC := false
	for _, a := range m.Atoms {
		hasC = hasC || a.Element == "C"
		add(a.Element, a.Isotope, 1)
		if a.HCount > 0 {
			add("H", 0, a.HCount)
		}
	}
	rank := func(el string) int {
		switch {
		case hasC && el == "C":
			return 0
		case hasC && el == "H":
			return 1
		}
		return 2
	}
	slices.SortFunc(counts, func(x, y elCount) int {
		if c := rank(x.el) - rank(y.el); c != 0 {
			return c
		}
		if c := strings.Compare(x.el, y.el); c != 0 {
			return c
		}
		return x.iso - y.iso
	})
	var b strings.Builder
	b.Grow(16)
	for _, c := range counts {
		switch {
		case c.iso == 0:
			b.WriteString(c.el)
		case c.el == "H" && c.iso == 2:
			b.WriteString("D")
		case c.el == "H" && c.iso == 3:
			b.WriteString("T")
		default:
			b.WriteString("[" + strconv.Itoa(c.iso) + c.el + "]")
		}
		if c.n != 1 {
			b.WriteString(strconv.Itoa(c.n))
		}
	}
	return b.String()
}

// HillFormula writes an element composition in Hill order (see Formula).
func HillFormula(c map[string]int) string {
	var els []string
	for el, n := range c {
		if n > 0 && el != "C" && (el != "H" || c["C"] == 0) {
			els = append(els, el)
		}
	}
	sort.Strings(els)
	if c["C"] > 0 {
		head := []string{"C"}
		if c["H"] > 0 {
			head = append(head, "H")
		}
		els = append(head, els...)
	}
	var b strings.Builder
	for _, el := range els {
		b.WriteString(el)
		if c[el] != 1 {
			fmt.Fprintf(&b, "%d", c[el])
		}
	}
	return b.String()
}

// Charge returns the net formal charge (sum over atoms).
func (m *Molecule) Charge() int {
	q := 0
	for _, a := range m.Atoms {
		q += a.Charge
	}
	return q
}

// MolarMass returns the molar mass in g/mol: standard atomic weights (IUPAC
// 2021 conventional values, see AtomicWeight) for atoms without an isotope
// label and for implicit hydrogens; isotope-labelled atoms use the AME2020
// atomic mass of that isotope where kiln has it (H-1/2/3, C-12/13/14,
// N-14/15, O-16/17/18, F-19, S-32/34, Cl-35/37, Br-79/81) and otherwise their
// mass number. The electron mass of a charge is ignored.
func (m *Molecule) MolarMass() float64 {
	hw, _ := AtomicWeight("H")
	mass := 0.0
	for _, a := range m.Atoms {
		mass += float64(a.HCount) * hw
		if a.Isotope > 0 {
			if x, ok := isotopeMass[a.Element][a.Isotope]; ok {
				mass += x
			} else {
				mass += float64(a.Isotope)
			}
			continue
		}
		w, _ := AtomicWeight(a.Element)
		mass += w
	}
	return mass
}

// HeavyAtoms returns the number of non-hydrogen atoms.
func (m *Molecule) HeavyAtoms() int {
	n := 0
	for _, a := range m.Atoms {
		if a.Element != "H" {
			n++
		}
	}
	return n
}

// Rings returns the smallest set of smallest rings (SSSR): its size is the
// cyclomatic number bonds − atoms + components; each ring lists atom indices
// in ring order. When the SSSR is not unique (cubane, adamantane) one valid
// choice is returned, and which one depends on the atom order: anything that
// must not depend on the spelling (ring-strain terms) should use
// RingSystemInfo instead. The slices are shared: do not modify them.
func (m *Molecule) Rings() [][]int { return m.rings }

// RelevantCycles returns the relevant cycles (the union of all minimum cycle
// bases; each a cyclic atom sequence), which unlike the SSSR do not depend
// on the spelling, and false when their enumeration stopped at its bound
// (huge polycyclic systems), where the list is incomplete. The slices are
// shared: do not modify them.
func (m *Molecule) RelevantCycles() ([][]int, bool) {
	return m.cycles, len(m.cycles) < maxRelevantCycles
}

// RingSystems returns the ring systems: sorted atom lists of SSSR rings joined
// through shared bonds (fused or bridged). Spiro-joined rings are separate
// systems that share one atom.
func (m *Molecule) RingSystems() [][]int { return m.ringSys }

// IsInRing reports whether atom i belongs to any ring.
func (m *Molecule) IsInRing(i int) bool {
	for _, r := range m.rings {
		for _, a := range r {
			if a == i {
				return true
			}
		}
	}
	return false
}

// RingSizes returns the sizes of the relevant cycles (see RingSystem) that
// contain atom i, ascending (empty for an acyclic atom). Unlike the SSSR,
// relevant cycles do not depend on the spelling: a cubane carbon is always in
// three 4-rings.
func (m *Molecule) RingSizes(i int) []int {
	var out []int
	for _, r := range m.cycles {
		for _, a := range r {
			if a == i {
				out = append(out, len(r))
				break
			}
		}
	}
	sort.Ints(out)
	return out
}

// Neighbors returns the atoms bonded to atom i (explicit graph atoms only;
// implicit hydrogens are counted in Atoms[i].HCount).
func (m *Molecule) Neighbors(i int) []int {
	out := make([]int, 0, len(m.Adj[i]))
	for _, b := range m.Adj[i] {
		out = append(out, m.Other(b, i))
	}
	return out
}

// BondBetween returns the index into Bonds of the bond joining atoms i and j,
// or -1 when they are not bonded.
func (m *Molecule) BondBetween(i, j int) int {
	if i < 0 || i >= len(m.Adj) {
		return -1
	}
	for _, b := range m.Adj[i] {
		if m.Other(b, i) == j {
			return b
		}
	}
	return -1
}

// UnpairedElectrons returns the number of unpaired electrons in the
// highest-spin arrangement of the radical centres. Each atom contributes its
// Radical count, except that an atom of group 13 or 14 with three or more
// radical electrons keeps its valence s pair paired and contributes
// Radical − 2: the carbon atom [C] (4 → 2, ground state ³P), methylidyne [CH]
// (3 → 1, ²Π) and the boron atom [B] (3 → 1, ²P), matching their
// spectroscopic ground states (NIST-JANAF, Chase 1998, from memory). Other
// atoms keep their count: [N] 3 (⁴S), [NH] 2 (³Σ⁻), [O] 2 (³P), [CH2] 2.
func (m *Molecule) UnpairedElectrons() int {
	u := 0
	for _, a := range m.Atoms {
		r := a.Radical
		if r >= 3 {
			if e, ok := elementIndex(a.Element); ok && (e.Group == 13 || e.Group == 14) {
				r -= 2
			}
		}
		u += r
	}
	return u
}

// DefaultMultiplicity returns the spin multiplicity 2S+1 of the highest-spin
// state, UnpairedElectrons()+1: singlet 1, doublet 2, triplet 3 (one atom
// like [CH2] or two radical centres), quartet 4, … The species file may
// override it.
func (m *Molecule) DefaultMultiplicity() int { return m.UnpairedElectrons() + 1 }
