package benson

import (
	"fmt"
	"slices"
	"sort"
	"strings"
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
	counts[ligandRank["H"]] = a.HCount
	skip := -1 // the implied partner: =C of Cd, ≡C of Ct, =O of CO
	switch centre {
	case "Cd", "CO":
		skip = g.partner(i, 2)
	case "Ct", "CN":
		skip = g.partner(i, 3)
	case "CS":
		skip = g.partnerElement(i, 2, "S")
	case "Ca", "Ck":
		return centre, counts, true
	}
	for k, j := range g.nbr[i] {
		if j == skip {
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
			if !ok {
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
// up (user groups first) and appends one Term per distinct group, in order of
// first appearance. Missing groups are replaced by their nearest relative and
// listed in est.Missing.
func addGroups(g *graph, l lookup, est *Result) error {
	type acc struct {
		centre string
		counts ligCounts
		n      int
	}
	// A molecule has few distinct groups: a linear scan of list is cheaper
	// than a map keyed by (centre, counts).
	list := make([]acc, 0, 8)
	for i := range g.m.Atoms {
		centre, counts, ok := g.groupOf(i)
		if !ok {
			if centre != "" {
				return fmt.Errorf("benson: atom %d: neighbour element %s is outside the group tables", i+1, centre)
			}
			continue
		}
		if _, known := centreLigands[centre]; !known {
			return fmt.Errorf("benson: atom %d: element %s is outside the group tables", i+1, centre)
		}
		k := slices.IndexFunc(list, func(a acc) bool { return a.centre == centre && a.counts == counts })
		if k >= 0 {
			list[k].n++
			continue
		}
		list = append(list, acc{centre, counts, 1})
	}
	if est.Groups == nil && len(list) > 0 {
		est.Groups = make([]Term, 0, len(list))
	}
	for _, a := range list {
		name := groupName(a.centre, a.counts)
		if v, ok := l.group(name); ok {
			est.Groups = append(est.Groups, term(v, a.n))
			continue
		}
		v, steps, ok := approximate(l, a.centre, a.counts)
		if !ok {
			return &MissingGroupError{Group: name}
		}
		t := term(v, a.n)
		t.Name = name + " ≈ " + v.Name
		est.Groups = append(est.Groups, t)
		est.Missing = append(est.Missing, Missing{
			Group:         name,
			Approximation: v.Name,
			Note:          "neighbour types replaced: " + strings.Join(steps, ", "),
		})
	}
	return nil
}

// MissingGroupError reports a group with neither a value nor an
// approximation: the estimate cannot be made until the user supplies the
// group (Options.UserGroups).
type MissingGroupError struct {
	Group string // trade notation, e.g. "C-(N)(C)(H)2"
}

func (e *MissingGroupError) Error() string {
	return fmt.Sprintf("benson: no value and no approximation for group %s: supply it with a `group %s` statement (hf298, s298, cp at 300…1500 K, source) or give the species a thermo block", e.Group, e.Group)
}
