package benson

import (
	"fmt"
	"slices"
	"sort"
	"strings"

	"kiln.dev/kiln/engine/molecule"
)

// groupOf returns the centre type and neighbour counts of atom i's group, and
// false when the atom is not polyvalent (terminal atoms such as =O, Cl and
// lone H make no group) .
func (g *graph) groupOf(i int) (string, ligCounts, bool) {
	a := g.m.Atoms[i]
	centre := g.typ[i]
	var counts ligCounts
	if len(g.nbr[i])+a.HCount < 2 {
		return "", counts, false
	}
	counts[ligandRank["H"]] = int32(a.HCount)
	skip := -1 // the implied partner: =C of Cd, ≡C of Ct, =O of CO
	switch centre {
	case "Cd", "CO", "NA", "NI", "CdN", "Naz": // NI, CdN: the imine C=N (hetero_n.go); Naz: azole.go
		skip = g.partner(i, 2)
	case "Ct", "CN", "NC": // NC: isocyanide N (hetero_n.go)
		skip = g.partner(i, 3)
	case "CS":
		skip = g.partnerElement(i, 2, "S")
	case "Ca", "Ck", "Nb", "Nbb":
		return centre, counts, true
	}
	for k, j := range g.nbr[i] {
		if j == skip || g.impliedTerminal(i, k, centre) || g.impliedOxide(centre, g.nbrBond[i][k], j) { // hetero_n.go, hetero_sx.go
			continue
		}
		if centre == "Cb" && g.benzBond[g.nbrBond[i][k]] {
			continue // ring neighbours are implied by Cb
		}
		li, ok := ligandRank[g.ligandType(j)]
		if !ok {
			return g.ligandType(j), counts, false
		}
		counts[li]++
	}
	return centre, counts, true
}

// ligandType is the type of atom j as a neighbour in a group name.
func (g *graph) ligandType(j int) string {
	return g.typ[j]
}

// relative lists, for each neighbour type, the closest type used to
// approximate a missing group, with a cost ranking the approximation
// (common practice: unsaturated carbon → its less unsaturated relative,
// carbonyl → alkyl carbon; replacing O by C is a last resort).
var relative = map[string]struct {
	to   string
	cost int
}{
	"Cbf": {"Cb", 1}, "Ca": {"Cd", 1}, "Cb": {"Cd", 1}, "Ct": {"Cd", 1},
	"Cd": {"C", 1}, "CO": {"C", 1}, "O": {"C", 3},
	"Nb": {"Cb", 2}, // azine N as a ring carbon (hetero_n.go): flagged, as every approximation
}

// approximate finds the cheapest table group reachable from (centre,
// counts) by replacing neighbour types with their relatives. It returns the
// group, the replacements made, and false if none exists.
func approximate(l lookup, centre string, counts ligCounts) (GroupValue, []string, bool) {
	type state struct {
		counts ligCounts
		cost   int
		steps  []string
	}
	seen := map[string]bool{groupName(centre, counts): true}
	frontier := []state{{counts: counts}}
	for len(frontier) > 0 {
		sort.SliceStable(frontier, func(i, j int) bool { return frontier[i].cost < frontier[j].cost })
		s := frontier[0]
		frontier = frontier[1:]
		if s.cost > 0 {
			if v, ok := l.group(groupName(centre, s.counts)); ok {
				return v, s.steps, true
			}
		}
		for li, lig := range ligandOrder {
			if s.counts[li] == 0 {
				continue
			}
			r, ok := relative[lig]
			if !ok || noStandIn(centre, lig) { // noStandIn: hetero_n.go
				continue
			}
			next := s.counts
			next[li]--
			next[ligandRank[r.to]]++
			name := groupName(centre, next)
			if seen[name] {
				continue
			}
			seen[name] = true
			steps := append(append([]string(nil), s.steps...), lig+"→"+r.to)
			frontier = append(frontier, state{counts: next, cost: s.cost + r.cost, steps: steps})
		}
	}
	return GroupValue{}, nil, false
}

// addGroups assigns a group to every polyvalent atom of g, looks the groups
// up (user groups first) and appends one Term per distinct group (Estimate
// sorts them by name). Missing groups are replaced by their nearest relative
// and listed in est.Missing.
//
// Refusals depend on the graph only, not on the atom order: every atom is
// examined; an *UnsupportedError wins over a *MissingGroupError (no user
// group can make an unsupported atom estimable), the unsupported atom
// reported is the one of lowest canonical symmetry class
// (molecule.SymmetryClasses; atoms of one class fail alike), and the missing
// group reported is the first by name.
//
// Atom accounting (enforced here, tested over a generated corpus): every
// heavy atom is either the centre of exactly one group, or a terminal atom
// (one heavy neighbour, no H) that its neighbour's group names — as a
// ligand joined by a single bond (the Cl of C-(Cl)(H)3) or as the implied
// partner of the centre type (the =O of CO, see impliedPartner). Any other
// atom makes the estimate fail with an *UnsupportedError; no atom is ever
// left out of the sum.
//
// Which centres exist is read from the loaded tables (built-in plus user
// groups, lookup.hasCentre): an element or atom type with no group at all is
// refused, and adding groups for it (a new table file or a user group)
// makes it estimable with no change here.
func addGroups(g *graph, l lookup, est *Result) error {
	type acc struct {
		centre string
		counts ligCounts
		n      int // centres
		atoms  int // atoms accounted for (centres and named terminal atoms)
	}
	n := len(g.m.Atoms)
	// A molecule has few distinct groups: a linear scan of list is cheaper
	// than a map keyed by (centre, counts).
	list := make([]acc, 0, 16)
	// owner[i] is the list index of the group that accounts for atom i
	// (-1: none yet); a second claim is an error.
	owner := make([]int, n)
	for i := range owner {
		owner[i] = -1
	}
	// Refusals found so far: at most one per atom, and missing groups.
	var refusals []atomError
	refuse := func(i int, err error) { refusals = append(refusals, atomError{i, err}) }
	var missing, newCentre []string // missing groups; those with a centre no table has
	claim := func(i, k int) {
		if owner[i] >= 0 {
			refuse(i, unsupported(g, i, "is counted by two groups"))
			return
		}
		owner[i] = k
		list[k].atoms++
	}
atoms:
	for i := range g.m.Atoms {
		for _, b := range g.nbrBond[i] {
			if o := g.m.Bonds[b].Order; o > 3 && !g.m.Bonds[b].Aromatic {
				refuse(i, unsupported(g, i, fmt.Sprintf("has a bond of order %d, which no group describes", o)))
				continue atoms
			}
		}
		centre, counts, ok := g.groupOf(i)
		if !ok {
			if centre != "" {
				refuse(i, unsupported(g, i, fmt.Sprintf("has a neighbour of type %s%s, and no group in the tables can name it", centre, typeNote(centre)))) // typeNote: hetero_n.go
			}
			continue // terminal atom: claimed by its neighbour below, or refused
		}
		if !l.hasCentre(centre) {
			if _, nameable := centreLigands[centre]; !nameable {
				refuse(i, unsupported(g, i, fmt.Sprintf("has no group: no group in the tables has a centre of type %s%s", centre, typeNote(centre))))
				continue
			}
			// A group the user can define (a `group` statement) but no
			// table has: missing, not unsupported, and reported before
			// groups whose centre is known. It still accounts for its
			// atoms.
			newCentre = append(newCentre, groupName(centre, counts))
		}
		k := slices.IndexFunc(list, func(a acc) bool { return a.centre == centre && a.counts == counts })
		if k < 0 {
			list = append(list, acc{centre: centre, counts: counts})
			k = len(list) - 1
		}
		list[k].n++
		claim(i, k)
		// Terminal atoms named by this group: the implied partner of the
		// centre type, and single-bonded terminal ligands.
		for kk, j := range g.nbr[i] {
			if !g.terminal(j) {
				continue
			}
			o := g.order(g.nbrBond[i][kk])
			if o == 1 || (o >= 2 && impliedPartner[centre] == g.m.Atoms[j].Element) {
				claim(j, k)
			}
		}
	}
	for i, k := range owner {
		if k < 0 && !slices.ContainsFunc(refusals, func(r atomError) bool { return r.atom == i }) {
			refuse(i, uncovered(g, i, 0))
		}
	}
	if len(refusals) > 0 {
		return canonicalRefusal(g.m, refusals)
	}
	// One backing array for every group's atom list.
	slab := make([]int, n)
	start := make([]int, len(list))
	off := 0
	for k := range list {
		start[k] = off
		off += list[k].atoms
	}
	fill := slices.Clone(start)
	for i, k := range owner {
		slab[fill[k]] = i
		fill[k]++
	}
	if est.Groups == nil && len(list) > 0 {
		est.Groups = make([]Term, 0, len(list))
	}
	for k, a := range list {
		name := groupName(a.centre, a.counts)
		atoms := slab[start[k] : start[k]+a.atoms : start[k]+a.atoms]
		if v, ok := l.group(name); ok {
			t := term(v, a.n)
			t.Atoms = atoms
			est.Groups = append(est.Groups, t)
			continue
		}
		v, steps, ok := approximate(l, a.centre, a.counts)
		if !ok {
			missing = append(missing, name)
			continue
		}
		t := term(v, a.n)
		t.Name = name + " ≈ " + v.Name
		t.Atoms = atoms
		est.Groups = append(est.Groups, t)
		est.Missing = append(est.Missing, Missing{
			Group:         name,
			Approximation: v.Name,
			Note:          "neighbour types replaced: " + strings.Join(steps, ", ") + standInWarning(name, steps), // bias.go
		})
	}
	if len(missing) > 0 {
		return missingGroups(newCentre, missing)
	}
	return nil
}

// missingGroups is the refusal for missing groups: the first by name of
// those with a centre no table has (the root cause), else of all; the
// others are listed in Also.
func missingGroups(newCentre, all []string) *MissingGroupError {
	slices.Sort(all)
	all = slices.Compact(all)
	first := all[0]
	if len(newCentre) > 0 {
		first = slices.Min(newCentre)
	}
	e := &MissingGroupError{Group: first}
	for _, g := range all {
		if g != first {
			e.Also = append(e.Also, g)
		}
	}
	return e
}

// atomError is a refusal found at one atom.
type atomError struct {
	atom int
	err  error
}

// canonicalRefusal returns the refusal of the atom of lowest canonical
// symmetry class (the first found among atoms of that class), so that the
// reason given does not depend on the atom order of the SMILES.
func canonicalRefusal(m *molecule.Molecule, rs []atomError) error {
	if len(rs) == 1 {
		return rs[0].err
	}
	cls := m.SymmetryClasses()
	best := rs[0]
	for _, r := range rs[1:] {
		if cls[r.atom] < cls[best.atom] {
			best = r
		}
	}
	return best.err
}

// terminal reports whether atom j makes no group of its own: one heavy
// neighbour at most and no hydrogen (=O, =S, ≡N, Cl, a lone atom).
func (g *graph) terminal(j int) bool {
	return len(g.nbr[j])+g.m.Atoms[j].HCount < 2
}

// UnsupportedError is a refusal: the structure holds an atom that no group
// of the loaded tables can account for (an element or bonding environment
// without groups, a molecule too small to have groups). Nothing is estimated.
type UnsupportedError struct {
	Atom   int    // 1-based atom number in the structure, 0 for the whole molecule
	Reason string // why, in words (no advice: callers say what to do in their own terms)
	// Element is the element of Atom when the refusal is that no group
	// holds it at all (Si, P, metals); "" for other refusals.
	Element string
}

func (e *UnsupportedError) Error() string {
	if e.Atom == 0 {
		return "benson: " + e.Reason
	}
	return fmt.Sprintf("benson: atom %d %s", e.Atom, e.Reason)
}

func unsupported(g *graph, i int, why string) error {
	return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) %s", g.m.Atoms[i].Element, why)}
}

// uncovered explains why atom i is named by c groups instead of one.
func uncovered(g *graph, i, c int) error {
	heavy := 0
	for _, x := range g.m.Atoms {
		if x.Element != "H" {
			heavy++
		}
	}
	if c > 1 {
		return unsupported(g, i, fmt.Sprintf("is counted by %d groups", c))
	}
	if len(g.nbr[i]) == 0 {
		if heavy <= 1 || len(g.m.Atoms) <= 2 {
			return &UnsupportedError{Reason: "the structure has no polyvalent atom with two or more neighbours, so no group applies (small species belong in a reference library or a thermo block)"}
		}
		return unsupported(g, i, "stands alone (no neighbours), so no group applies")
	}
	j := g.nbr[i][0]
	o := g.order(g.nbrBond[i][0])
	bond := map[int]string{1: "single", 2: "double", 3: "triple", 4: "aromatic"}[o]
	if bond == "" {
		bond = fmt.Sprintf("order-%d", o)
	}
	if heavy <= 2 {
		// A diatomic (Br2, ClF, S2): no atom has two heavy neighbours, so
		// no group can be named for it, by the tables or by a user.
		return unsupported(g, i, fmt.Sprintf("is a terminal atom (%s bond to atom %d, %s) and the species has no atom with two heavy neighbours, so no group applies: give it a thermo block from a published table", bond, j+1, g.m.Atoms[j].Element))
	}
	return unsupported(g, i, fmt.Sprintf("is a terminal atom (%s bond to atom %d, %s, type %s) that no group in the tables accounts for, and no group can name it: give the species a thermo block", bond, j+1, g.m.Atoms[j].Element, g.typ[j]))
}

// MissingGroupError reports a group with neither a value nor an
// approximation: the estimate cannot be made until the user supplies the
// group (Options.UserGroups).
type MissingGroupError struct {
	Group string   // trade notation, e.g. "C-(N)(C)(H)2"
	Also  []string // further groups the species lacks, by name
	// Form is the resonance structure (canonical SMILES) that lacks Group
	// when it is not the structure as written, and Written the reason the
	// structure as written is refused; both "" otherwise.
	Form, Written string
	// Reading is a note the caller adds on how the SMILES was read when a
	// nearby spelling is known (N(=O)=O is HNO2, and the NO2 radical is
	// in the reference library); "" for none.
	Reading string
}

func (e *MissingGroupError) Error() string {
	return fmt.Sprintf("benson: no value and no approximation for group %s%s: supply it with a `group %s` statement (hf298, s298, cp at 300…1500 K, source) or give the species a thermo block", e.Group, e.Detail(), e.Group)
}

// Detail is what the message adds after the group's name: the further
// groups missing, and the resonance structure that needs the group when
// the structure as written is refused for another reason.
func (e *MissingGroupError) Detail() string {
	d := ""
	if len(e.Also) > 0 {
		d = " (also missing: " + strings.Join(e.Also, ", ") + ")"
	}
	if e.Form != "" {
		d += fmt.Sprintf(" (needed by the resonance structure %s; the structure as written is refused: %s)", e.Form, e.Written)
	}
	if e.Reading != "" {
		d += " (" + e.Reading + ")"
	}
	return d
}
