package benson

import (
	"fmt"
	"math/rand/v2"
	"strings"
)

// The random structure generator shared by the accounting, resonance and
// spelling tests: a random tree of bracket atoms with some multiple bonds,
// some ring closures, written as SMILES. Each test draws its own size,
// closures, radicals and charges around these pieces.

// genElement is an element the structure generator draws, with its valence
// and drawing weight.
type genElement struct {
	sym     string
	valence int
	weight  int
}

// genEdge is a bond of a generated structure: atoms a < b and the bond order.
type genEdge struct{ a, b, order int }

// genStructure is a generated structure: the atoms' elements, their free
// valences (left for hydrogens and radical sites), the tree bonds (parent
// first) and the ring-closure bonds.
type genStructure struct {
	el             []genElement
	free           []int
	tree, closures []genEdge
}

// randomTree draws up to n atoms from elements (by weight) and joins each to
// a random earlier atom with free valence, by a single bond or (one time in
// four, where both have room) a double or triple bond. It stops early when
// no earlier atom has free valence. With nonTerminalRoot a monovalent first
// draw is replaced by elements[0].
func randomTree(r *rand.Rand, elements []genElement, n int, nonTerminalRoot bool) *genStructure {
	total := 0
	for _, e := range elements {
		total += e.weight
	}
	draw := func() genElement {
		x := r.IntN(total)
		for _, e := range elements {
			if x < e.weight {
				return e
			}
			x -= e.weight
		}
		return elements[0]
	}
	s := &genStructure{el: make([]genElement, n), free: make([]int, n)}
	for i := range n {
		s.el[i] = draw()
		if nonTerminalRoot && i == 0 && s.el[i].valence == 1 {
			s.el[i] = elements[0]
		}
		s.free[i] = s.el[i].valence
		if i == 0 {
			continue
		}
		var cand []int
		for j := 0; j < i; j++ {
			if s.free[j] > 0 {
				cand = append(cand, j)
			}
		}
		if len(cand) == 0 {
			s.el, s.free = s.el[:i], s.free[:i]
			break
		}
		j := cand[r.IntN(len(cand))]
		o := 1
		if maxO := min(s.free[j], s.free[i], 3); maxO > 1 && r.IntN(4) == 0 {
			o = 2 + r.IntN(maxO-1)
		}
		s.free[i] -= o
		s.free[j] -= o
		s.tree = append(s.tree, genEdge{j, i, o})
	}
	return s
}

// addClosures makes tries attempts at a ring closure between two random
// distinct, not yet bonded atoms that both have free valence: a single bond
// or (one time in five, where both have room) a double bond.
func (s *genStructure) addClosures(r *rand.Rand, tries int) {
	n := len(s.el)
	bonded := map[[2]int]bool{}
	for _, e := range s.tree {
		bonded[[2]int{e.a, e.b}] = true
	}
	for range tries {
		a, b := r.IntN(n), r.IntN(n)
		if a > b {
			a, b = b, a
		}
		if a == b || bonded[[2]int{a, b}] || s.free[a] == 0 || s.free[b] == 0 {
			continue
		}
		o := 1
		if min(s.free[a], s.free[b]) > 1 && r.IntN(5) == 0 {
			o = 2
		}
		s.free[a] -= o
		s.free[b] -= o
		bonded[[2]int{a, b}] = true
		s.closures = append(s.closures, genEdge{a, b, o})
	}
}

// write returns prefix followed by the structure as SMILES from atom 0,
// every atom a bracket atom. atom gives the H count and charge text of atom
// i; it is called once per atom, in writing order.
func (s *genStructure) write(prefix string, atom func(i int) (h int, charge string)) string {
	n := len(s.el)
	children := make([][]genEdge, n)
	for _, e := range s.tree {
		children[e.a] = append(children[e.a], e)
	}
	ringAt := make([][]string, n)
	for k, e := range s.closures {
		d := fmt.Sprintf("%%%d", 10+k)
		sym := map[int]string{1: "", 2: "="}[e.order]
		ringAt[e.a] = append(ringAt[e.a], sym+d)
		ringAt[e.b] = append(ringAt[e.b], sym+d)
	}
	bondSym := map[int]string{1: "", 2: "=", 3: "#"}
	var b strings.Builder
	b.WriteString(prefix)
	var write func(i int)
	write = func(i int) {
		h, charge := atom(i)
		fmt.Fprintf(&b, "[%s", s.el[i].sym)
		if h > 0 {
			fmt.Fprintf(&b, "H%d", h)
		}
		b.WriteString(charge + "]")
		for _, d := range ringAt[i] {
			b.WriteString(d)
		}
		for k, e := range children[i] {
			last := k == len(children[i])-1
			if !last {
				b.WriteByte('(')
			}
			b.WriteString(bondSym[e.order])
			write(e.b)
			if !last {
				b.WriteByte(')')
			}
		}
	}
	write(0)
	return b.String()
}
