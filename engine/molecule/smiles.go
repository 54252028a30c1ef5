package molecule

import (
	"fmt"
	"strings"
)

// MaxHeavyAtoms is the largest number of non-hydrogen atoms ParseSMILES
// accepts; larger inputs are rejected with an error rather than processed.
const MaxHeavyAtoms = 500

// SMILESError is a positioned error from ParseSMILES.
type SMILESError struct {
	Pos int    // byte offset in the SMILES string
	Msg string // what is wrong, without the position
}

// Error implements error as "position N: msg".
func (e *SMILESError) Error() string { return fmt.Sprintf("position %d: %s", e.Pos, e.Msg) }

func errAt(pos int, format string, args ...any) *SMILESError {
	return &SMILESError{Pos: pos, Msg: fmt.Sprintf(format, args...)}
}

// bondSymbol order: '-' 1, '=' 2, '#' 3, '$' 4, ':' aromatic, '/' and '\\' 1.
func bondOrderOf(sym byte) int {
	switch sym {
	case '=':
		return 2
	case '#':
		return 3
	case '$':
		return 4
	}
	return 1
}

type ringOpen struct {
	atom   int
	sym    byte // bond symbol written at the opening end, 0 if none
	symPos int
	pos    int // byte offset of the ring-bond digit (or %)
	slot   int // index into nbr[atom] to fill on closure
}

type branch struct{ atom, pos int }

type parser struct {
	s        string
	atoms    []Atom
	bonds    []Bond
	organic  []bool  // organic-subset atom: implicit hydrogens apply
	aromIn   []bool  // per bond: written as aromatic (order from kekulization)
	nbr      [][]int // per atom: neighbours in written order (for chirality)
	hadPrev  []bool  // per atom: bonded to a preceding atom when written
	bracketH []int   // per atom: H count written inside the bracket
	heavy    int
}

// ParseSMILES reads an OpenSMILES string into a Molecule.
//
// Supported: the organic subset B C N O P S F Cl Br I with implicit hydrogens
// from the lowest normal valence ≥ the bond-order sum (B 3; C 4; N 3,5; O 2;
// P 3,5; S 2,4,6; halogens 1), aromatic b c n o p s (ring atoms only),
// bracket atoms [isotope symbol chirality Hn charge :class] including
// aromatic [se] and [as] and every OpenSMILES chirality class (@, @@,
// @TH1–2, @AL1–2, @SP1–3, @TB1–20, @OH1–30; kept verbatim), bonds - = # $ : / \, branches, ring closures 0–9 and %nn with the bond
// symbol at either end, and '.'-separated components (a '.' may stand
// inside a branch or open it, C(C.C)C and CC(.C)C, as the OpenSMILES grammar
// allows; an atom must follow every '.'). The wildcard '*' is
// rejected. Aromatic input is kekulized (maximum matching); aromaticity is then
// perceived afresh on the Kekulé graph, so Kekulé and aromatic spellings of a
// molecule give the same graph. Bracket atoms with fewer bonds+H than their
// lowest normal valence (after the charge shift of valences) carry radical
// electrons. Explicit [H] atoms bonded to one heavy atom are folded into its
// HCount. Inputs with more than MaxHeavyAtoms heavy atoms are rejected.
// Every error is a *SMILESError.
func ParseSMILES(s string) (*Molecule, error) {
	if s == "" {
		return nil, errAt(0, "empty SMILES")
	}
	p := newParser(s)
	if err := p.parse(); err != nil {
		return nil, err
	}
	if err := p.aromaticInRings(); err != nil {
		return nil, err
	}
	if err := p.kekulize(); err != nil {
		return nil, err
	}
	if err := p.assignHydrogens(); err != nil {
		return nil, err
	}
	m := p.build()
	inRing := m.computeRingBondFlags()
	m.perceiveWith(inRing)
	m.derived = newDerived(m)
	m.derived.inRing = inRing
	return m, nil
}

// newParser sizes the parser's per-atom and per-bond slices from the atom
// and ring-closure counts of a valid s (bracket atoms, organic-subset atoms and '*' outside
// brackets), so reading a valid SMILES does not regrow them and the atoms
// the molecule keeps have no unused capacity; an invalid s may need more,
// which append handles.
func newParser(s string) *parser {
	n, rc := 0, 0 // atoms, ring-closure digits and %nn labels
	inBracket := false
	for i := 0; i < len(s); i++ {
		switch c := s[i]; {
		case c == '[':
			inBracket = true
			n++
		case c == ']':
			inBracket = false
		case inBracket:
		case c >= 'A' && c <= 'Z', c == '*', c == 'b', c == 'c', c == 'n', c == 'o', c == 'p', c == 's':
			n++
		case c >= '0' && c <= '9':
			rc++
		case c == '%':
			rc++
			i += 2
		}
	}
	n = min(n, MaxHeavyAtoms+1)
	// Every atom but the first of each part is bonded to the atom before
	// it, and every ring closure (a label written twice) adds one bond.
	nb := max(n-1+(rc+1)/2, 0)
	// The bool and [][]int slices share one backing array each; their
	// capacities are limited, so an append past the estimate reallocates
	// only that slice.
	bools := make([]bool, 3*n+4)
	lists := make([][]int, n)
	return &parser{s: s,
		atoms: make([]Atom, 0, n), bonds: make([]Bond, 0, nb),
		organic: bools[:0:n], hadPrev: bools[n : n : 2*n], aromIn: bools[2*n : 2*n : 3*n+4],
		nbr:      lists[:0:n],
		bracketH: make([]int, 0, n)}
}

func (p *parser) addAtom(a Atom, organic bool) (int, error) {
	if a.Element != "H" {
		p.heavy++
		if p.heavy > MaxHeavyAtoms {
			return 0, errAt(a.Pos, "more than %d heavy atoms", MaxHeavyAtoms)
		}
	}
	p.atoms = append(p.atoms, a)
	p.organic = append(p.organic, organic)
	p.nbr = append(p.nbr, nil)
	p.hadPrev = append(p.hadPrev, false)
	p.bracketH = append(p.bracketH, a.HCount)
	return len(p.atoms) - 1, nil
}

// addBond adds the bond a–b; closure is true for a ring-closure bond, the
// only kind that can repeat an existing bond (a chain bond always reaches a
// new atom).
func (p *parser) addBond(a, b int, sym byte, pos int, closure bool) (int, error) {
	if a == b {
		return 0, errAt(pos, "ring bond from an atom to itself")
	}
	if closure {
		for k := range p.bonds {
			bd := &p.bonds[k]
			if (bd.A == a && bd.B == b) || (bd.A == b && bd.B == a) {
				return 0, errAt(pos, "second bond between the same two atoms")
			}
		}
	}
	arom := sym == ':' || (sym == 0 && p.atoms[a].Aromatic && p.atoms[b].Aromatic)
	bd := Bond{A: a, B: b, Order: bondOrderOf(sym), Pos: pos}
	if sym == '/' || sym == '\\' {
		bd.Stereo = sym
	}
	if arom {
		bd.Order = 0
	}
	p.bonds = append(p.bonds, bd)
	p.aromIn = append(p.aromIn, arom)
	return len(p.bonds) - 1, nil
}

func isBondSym(c byte) bool {
	return c == '-' || c == '=' || c == '#' || c == '$' || c == ':' || c == '/' || c == '\\'
}

func (p *parser) parse() error {
	s := p.s
	prev := -1
	var pendSym byte
	pendPos := -1
	var branches []branch
	// rings[num] is the open ring bond numbered num (open = true).
	var rings [100]ringOpen
	var ringOpenFlag [100]bool
	openRings := 0
	lastOpen := false // previous token was '('
	i := 0
	dotPos := -1 // a '.' waiting for its atom
	for i < len(s) {
		c := s[i]
		if dotPos >= 0 && (isBondSym(c) || c == '(' || c == ')' || c == '.' || isDigit(c) || c == '%') {
			return errAt(dotPos, "'.' must be followed by an atom")
		}
		switch {
		case isBondSym(c):
			if pendSym != 0 {
				return errAt(i, "two bonds in a row")
			}
			if prev < 0 {
				return errAt(i, "bond with no atom before it")
			}
			pendSym, pendPos = c, i
			i++
			lastOpen = false
			continue
		case c == '(':
			if prev < 0 {
				return errAt(i, "branch with no atom before it")
			}
			if lastOpen {
				return errAt(i, "branch starts with '('")
			}
			if pendSym != 0 {
				return errAt(pendPos, "bond before '('")
			}
			branches = append(branches, branch{prev, i})
			i++
			lastOpen = true
			continue
		case c == ')':
			if len(branches) == 0 {
				return errAt(i, "unmatched ')'")
			}
			if lastOpen {
				return errAt(i, "empty branch")
			}
			if pendSym != 0 {
				return errAt(pendPos, "bond at the end of a branch")
			}
			prev = branches[len(branches)-1].atom
			branches = branches[:len(branches)-1]
			i++
			continue
		case c == '.':
			// OpenSMILES: chain ::= chain dot branched_atom and
			// branch ::= '(' dot chain ')', so a dot may stand inside a
			// branch or open one (C(C.C)C, CC(.C)C), but an atom must
			// follow it.
			if pendSym != 0 {
				return errAt(pendPos, "bond before '.'")
			}
			if prev < 0 && !lastOpen {
				return errAt(i, "'.' with no atom before it")
			}
			prev = -1
			dotPos = i
			i++
			lastOpen = false
			continue
		case (c >= '0' && c <= '9') || c == '%':
			if prev < 0 || lastOpen {
				return errAt(i, "ring bond with no atom before it")
			}
			start := i
			var num int
			if c == '%' {
				if i+2 >= len(s) || !isDigit(s[i+1]) || !isDigit(s[i+2]) {
					return errAt(i, "'%%' must be followed by two digits")
				}
				num = int(s[i+1]-'0')*10 + int(s[i+2]-'0')
				i += 3
			} else {
				num = int(c - '0')
				i++
			}
			if ringOpenFlag[num] {
				r := &rings[num]
				if r.sym != 0 && pendSym != 0 && !compatibleRingSyms(r.sym, pendSym) {
					return errAt(pendPos, "ring bond %d written with two different bond symbols", num)
				}
				// Bonds read "A sym B" in written direction: a symbol written
				// only at the closing digit goes from the closing atom to the
				// opener; otherwise the opener's symbol is used.
				a, b, sym, pos := r.atom, prev, r.sym, r.symPos
				if r.sym == 0 && pendSym != 0 {
					a, b, sym, pos = prev, r.atom, pendSym, pendPos
				}
				if sym == 0 {
					pos = start
				}
				if _, err := p.addBond(a, b, sym, pos, true); err != nil {
					return err
				}
				if r.slot >= 0 {
					p.nbr[r.atom][r.slot] = prev
				}
				p.addNbr(prev, r.atom)
				ringOpenFlag[num] = false
				openRings--
			} else {
				slot := -1
				if p.atoms[prev].Chirality != "" {
					p.nbr[prev] = append(p.nbr[prev], -2)
					slot = len(p.nbr[prev]) - 1
				}
				rings[num] = ringOpen{atom: prev, sym: pendSym, symPos: pendPos, pos: start, slot: slot}
				ringOpenFlag[num] = true
				openRings++
			}
			pendSym, pendPos = 0, -1
			lastOpen = false
			continue
		}
		// an atom
		a, n, organic, err := p.readAtom(i)
		if err != nil {
			return err
		}
		idx, err := p.addAtom(a, organic)
		if err != nil {
			return err
		}
		if prev >= 0 {
			pos := i
			if pendSym != 0 {
				pos = pendPos
			}
			if _, err := p.addBond(prev, idx, pendSym, pos, false); err != nil {
				return err
			}
			p.addNbr(prev, idx)
			p.addNbr(idx, prev)
			p.hadPrev[idx] = true
		} else if pendSym != 0 {
			return errAt(pendPos, "bond with no atom before it")
		}
		pendSym, pendPos = 0, -1
		prev = idx
		lastOpen = false
		dotPos = -1
		i += n
	}
	if pendSym != 0 {
		return errAt(pendPos, "bond at the end of the SMILES")
	}
	if dotPos >= 0 {
		return errAt(dotPos, "SMILES ends with '.'")
	}
	if lastOpen || len(branches) > 0 {
		return errAt(branches[len(branches)-1].pos, "unclosed branch '('")
	}
	if prev < 0 {
		return errAt(len(s)-1, "SMILES ends with '.'")
	}
	if openRings > 0 {
		first := -1
		for num, r := range rings {
			if ringOpenFlag[num] && (first < 0 || r.pos < first) {
				first = r.pos
			}
		}
		return errAt(first, "unclosed ring bond")
	}
	return nil
}

// compatibleRingSyms reports whether the bond symbols written at the two ends
// of a ring closure agree. Directional single bonds '/', '\\' count as single.
func compatibleRingSyms(a, b byte) bool {
	norm := func(c byte) byte {
		if c == '/' || c == '\\' {
			return '-'
		}
		return c
	}
	return norm(a) == norm(b)
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

// readAtom reads one atom token at s[i]: an organic-subset atom or a bracket
// atom. It returns the atom, the token length and whether implicit hydrogens
// apply (organic subset).
func (p *parser) readAtom(i int) (Atom, int, bool, error) {
	s := p.s
	c := s[i]
	if c == '[' {
		a, n, err := p.readBracket(i)
		return a, n, false, err
	}
	if c == '*' {
		return Atom{}, 0, false, errAt(i, "wildcard atom '*' is not supported")
	}
	two := ""
	if i+1 < len(s) {
		two = s[i : i+2]
	}
	switch {
	case two == "Cl" || two == "Br":
		return Atom{Element: two, Pos: i, Len: 2}, 2, true, nil
	case strings.IndexByte("BCNOPSFI", c) >= 0:
		return Atom{Element: upperSymbol(s[i : i+1]), Pos: i, Len: 1}, 1, true, nil
	case strings.IndexByte("bcnops", c) >= 0:
		return Atom{Element: upperSymbol(s[i : i+1]), Aromatic: true, Pos: i, Len: 1}, 1, true, nil
	}
	if c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' {
		for _, n := range []int{2, 1} {
			if i+n > len(s) {
				continue
			}
			sym := upperSymbol(s[i : i+n])
			if _, ok := AtomicWeight(sym); ok && (n == 1 || s[i+1] >= 'a' && s[i+1] <= 'z') {
				return Atom{}, 0, false, errAt(i, "element %q must be written in brackets, as [%s]", sym, sym)
			}
		}
		return Atom{}, 0, false, errAt(i, "%q is not an element symbol: outside brackets only B, C, N, O, P, S, F, Cl, Br, I (and aromatic b, c, n, o, p, s) may be written", string(c))
	}
	return Atom{}, 0, false, errAt(i, "invalid character %q", rune(c))
}

// upperSymbol returns the element symbol for a written (possibly aromatic,
// lower-case) symbol, as a constant string so atoms do not keep the input
// alive or allocate.
func upperSymbol(sym string) string {
	switch sym {
	case "B", "b":
		return "B"
	case "C", "c":
		return "C"
	case "N", "n":
		return "N"
	case "O", "o":
		return "O"
	case "P", "p":
		return "P"
	case "S", "s":
		return "S"
	case "F":
		return "F"
	case "I":
		return "I"
	case "se":
		return "Se"
	case "as":
		return "As"
	}
	return strings.ToUpper(sym[:1]) + sym[1:]
}

func (p *parser) readBracket(start int) (Atom, int, error) {
	s := p.s
	end := strings.IndexByte(s[start:], ']')
	if end < 0 {
		return Atom{}, 0, errAt(start, "unclosed '['")
	}
	end += start
	a := Atom{Pos: start, Len: end - start + 1}
	i := start + 1
	// isotope
	j := i
	for j < end && isDigit(s[j]) {
		j++
	}
	if j > i {
		if j-i > 3 {
			return a, 0, errAt(i, "isotope mass number too long")
		}
		for k := i; k < j; k++ {
			a.Isotope = a.Isotope*10 + int(s[k]-'0')
		}
		if a.Isotope == 0 {
			return a, 0, errAt(i, "isotope mass number 0")
		}
		i = j
	}
	if i >= end {
		return a, 0, errAt(i, "bracket atom without element")
	}
	// element
	c := s[i]
	switch {
	case c == '*':
		return a, 0, errAt(i, "wildcard atom '*' is not supported")
	case c >= 'A' && c <= 'Z':
		sym := string(c)
		if i+1 < end && s[i+1] >= 'a' && s[i+1] <= 'z' {
			if _, ok := elementIndex(s[i : i+2]); ok {
				sym = s[i : i+2]
			} else {
				return a, 0, errAt(i, "unknown element %q", s[i:i+2])
			}
		}
		if _, ok := elementIndex(sym); !ok {
			return a, 0, errAt(i, "unknown element %q", sym)
		}
		a.Element = sym
		i += len(sym)
	case c >= 'a' && c <= 'z':
		var sym string
		if i+1 < end && (s[i:i+2] == "se" || s[i:i+2] == "as") {
			sym = s[i : i+2]
		} else if strings.IndexByte("bcnops", c) >= 0 {
			sym = string(c)
		} else if c == 'e' && (i+1 == end || s[i+1] == '-' || s[i+1] == '+') {
			// [e-], the electron of ion mechanisms, is not an element
			return a, 0, errAt(i, `"e" is an electron, not an element: electrons and ions are not supported (kiln estimates neutral molecules and radicals)`)
		} else {
			return a, 0, errAt(i, "unknown aromatic element %q", string(c))
		}
		a.Element = upperSymbol(sym)
		a.Aromatic = true
		i += len(sym)
	default:
		return a, 0, errAt(i, "invalid character %q in bracket atom", rune(c))
	}
	// chirality
	if i < end && s[i] == '@' {
		k, err := chiralityEnd(s, i, end)
		if err != nil {
			return a, 0, err
		}
		a.Chirality = s[i:k]
		i = k
	}
	// hydrogens
	if i < end && s[i] == 'H' {
		i++
		a.HCount = 1
		if i < end && isDigit(s[i]) {
			a.HCount = int(s[i] - '0')
			i++
		}
	}
	// charge
	if i < end && (s[i] == '+' || s[i] == '-') {
		sign := 1
		if s[i] == '-' {
			sign = -1
		}
		ch := s[i]
		i++
		n := 1
		if i < end && isDigit(s[i]) {
			n = 0
			k := i
			for i < end && isDigit(s[i]) {
				n = n*10 + int(s[i]-'0')
				i++
				if i-k > 2 {
					return a, 0, errAt(k, "charge too large")
				}
			}
		} else {
			for i < end && s[i] == ch {
				n++
				i++
			}
		}
		if n > 15 {
			return a, 0, errAt(i, "charge too large")
		}
		a.Charge = sign * n
	}
	// class
	if i < end && s[i] == ':' {
		i++
		k := i
		for i < end && isDigit(s[i]) {
			i++
		}
		if i == k || i-k > 8 {
			return a, 0, errAt(k, "bad atom class")
		}
		for _, d := range s[k:i] {
			a.Class = a.Class*10 + int(d-'0')
		}
	}
	if i != end {
		return a, 0, errAt(i, "unexpected %q in bracket atom", rune(s[i]))
	}
	return a, end - start + 1, nil
}

// chiralityClasses lists the OpenSMILES chirality classes with the largest
// permutation number each allows: tetrahedral TH1–2, allene-like AL1–2,
// square-planar SP1–3, trigonal-bipyramidal TB1–20, octahedral OH1–30.
var chiralityClasses = [...]struct {
	name string
	max  int
}{{"TH", 2}, {"AL", 2}, {"SP", 3}, {"TB", 20}, {"OH", 30}}

// chiralityEnd reads the chirality mark that starts with '@' at s[i] inside
// a bracket atom ending at end, and returns the offset just after it: "@",
// "@@", or '@' followed by a class name and a permutation number. An 'H'
// right after '@' is the hydrogen count, not a class. Any other letter after
// '@' is an error at its position (it is never read as the next token).
func chiralityEnd(s string, i, end int) (int, error) {
	k := i + 1
	if k < end && s[k] == '@' {
		return k + 1, nil
	}
	if k >= end || s[k] < 'A' || s[k] > 'Z' || s[k] == 'H' {
		return k, nil
	}
	for _, c := range chiralityClasses {
		if k+2 > end || s[k:k+2] != c.name {
			continue
		}
		d := k + 2
		n := 0
		for d < end && isDigit(s[d]) && d-k-2 < 3 {
			n = n*10 + int(s[d]-'0')
			d++
		}
		if d == k+2 {
			return 0, errAt(k, "chirality class @%s needs a number (1–%d)", c.name, c.max)
		}
		if n < 1 || n > c.max {
			return 0, errAt(k+2, "chirality @%s%d out of range (1–%d)", c.name, n, c.max)
		}
		return d, nil
	}
	j := k
	for j < end && s[j] >= 'A' && s[j] <= 'Z' {
		j++
	}
	return 0, errAt(k, "invalid chirality %q (expected @, @@, @TH1–2, @AL1–2, @SP1–3, @TB1–20 or @OH1–30)", "@"+s[k:j])
}

// aromaticInRings rejects atoms written aromatic (lower case) that lie on no
// ring: OpenSMILES aromaticity is a property of ring atoms, so "CoC" is an
// error rather than dimethyl ether.
//
// Likewise an explicit aromatic bond ':' must lie on a ring: between atoms
// on no common ring ("C:C") its order is undefined (OpenSMILES leaves ':'
// outside aromatic rings unspecified), so it is an error rather than a
// guessed single bond.
func (p *parser) aromaticInRings() error {
	arom := false
	for _, a := range p.atoms {
		arom = arom || a.Aromatic
	}
	colon := func(k int) bool {
		pos := p.bonds[k].Pos
		return p.aromIn[k] && pos >= 0 && pos < len(p.s) && p.s[pos] == ':'
	}
	for k := range p.bonds {
		arom = arom || colon(k)
	}
	if !arom {
		return nil
	}
	g := &Molecule{Atoms: p.atoms, Bonds: p.bonds, Adj: adjacency(len(p.atoms), p.bonds)}
	inRing := g.ringBondFlags()
	for i, a := range p.atoms {
		if a.Aromatic && !g.atomInRing(i, inRing) {
			return errAt(a.Pos, "aromatic atom %q not in a ring", p.s[a.Pos:a.Pos+a.Len])
		}
	}
	for k := range p.bonds {
		if colon(k) && !inRing[k] {
			return errAt(p.bonds[k].Pos, "aromatic bond ':' not in a ring (its order is undefined; write -, = or # instead)")
		}
	}
	return nil
}

// addNbr records x as the next written neighbour of atom i when i carries a
// chirality mark (the only atoms whose neighbour order matters).
func (p *parser) addNbr(i, x int) {
	if p.atoms[i].Chirality != "" {
		p.nbr[i] = append(p.nbr[i], x)
	}
}

// adjacency returns the bond lists of n atoms (indices into bonds), all in
// one backing array; each list's capacity is its length.
func adjacency(n int, bonds []Bond) [][]int {
	cnt := make([]int, n+1)
	for _, b := range bonds {
		cnt[b.A+1]++
		cnt[b.B+1]++
	}
	for i := 1; i <= n; i++ {
		cnt[i] += cnt[i-1]
	}
	back := make([]int, cnt[n])
	adj := make([][]int, n)
	for i := range adj {
		adj[i] = back[cnt[i]:cnt[i]:cnt[i+1]]
	}
	for k, b := range bonds {
		adj[b.A] = append(adj[b.A], k)
		adj[b.B] = append(adj[b.B], k)
	}
	return adj
}
