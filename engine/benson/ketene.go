package benson

import (
	"fmt"
	"slices"
	"strings"

	"kiln.dev/kiln/engine/molecule"
)

// Ketenes and cumulenes beyond the two groups that describe them.
//
// The ketene carbon group Ck (groups_nsx.tsv) was derived from ketene
// itself, CH2=C=O, and the allene centre Ca (groups.tsv) from allene: in
// both the cumulated carbon has plain partners. Three kinds of structure go
// beyond that:
//
//   - A substituted ketene, R2C=C=O with a carbon R: its CR2 end takes the
//     alkene group of its substitution (Cd-(C)(H), Cd-(C)2 …), which assumes
//     that a substituent stabilises the CR2 end of a ketene as it does an
//     alkene carbon. It does not: substituent effects on ketenes follow the
//     substituent's electronegativity, by σ donation to the ketene moiety,
//     and differ from those on alkenes and allenes (Gong, McAllister &
//     Tidwell, J. Am. Chem. Soc. 113 (1991) 6021, abstract). Each carbon
//     substituent there adds the correction nni:ketene-end C
//     (corrections.tsv, derived on alkyl ketenes). A substituent other than
//     an sp3 carbon (vinyl, aryl, carbonyl …), for which it was not derived,
//     is flagged, once per ketene end, and its ΔHf° uncertainty widened by
//     widenKeteneEnd per such substituent.
//   - A ketene whose CR2 end carries a heteroatom (O, N, S, halogen): the
//     alkene groups Cd-(O)(H) … carry the π donation that stabilises an
//     enol ether or enamine, while the same electronegative substituents
//     destabilise a ketene (same source), so the stand-in errs in sign and
//     the estimate is refused.
//   - A cumulated chain: a C=C=O carbon whose other partner is itself
//     cumulated (C=C=C=O, carbon suboxide O=C=C=C=O) or not a carbon
//     (isocyanate R–N=C=O, O=C=S): refused, as no group describes it. Two
//     adjacent allene centres (butatriene C=C=C=C and longer cumulenes)
//     each take the allene group Ca, which was derived with ordinary Cd
//     partners: flagged as a stand-in (widenGroup each).
//
// Every refusal ends with what the user can do: these carbons have no
// nameable group a `group` statement could supply, so it is a thermo block.

// keteneEndSuffix ends the name of the flag on the CR2 end of a ketene with
// unsaturated carbon substituents, one flag per ketene end: "1 unsaturated
// carbon substituent on the CR2 end of a ketene", "2 unsaturated carbon
// substituents …" (keteneEndFlag).
const keteneEndSuffix = " on the CR2 end of a ketene"

// cumuleneSuffix ends the name of the flag on a chain of adjacent allene
// centres, one flag per chain: "2 adjacent allene centres …" (cumuleneFlag).
const cumuleneSuffix = " adjacent allene centres (a chain of cumulated double bonds)"

// keteneEndFlag is the flag name for n unsaturated carbon substituents on
// one ketene end.
func keteneEndFlag(n int) string {
	if n == 1 {
		return "1 unsaturated carbon substituent" + keteneEndSuffix
	}
	return fmt.Sprintf("%d unsaturated carbon substituents%s", n, keteneEndSuffix)
}

// keteneEndKey is the correction per carbon substituent on the CR2 end of
// a ketene (corrections.tsv); keteneEndName names its term.
const (
	keteneEndKey  = "nni:ketene-end C"
	keteneEndName = "carbon substituent on a ketene end"
)

// cumuleneFlag is the flag name for a chain of k adjacent allene centres.
func cumuleneFlag(k int) string { return fmt.Sprintf("%d%s", k, cumuleneSuffix) }

// flagCount reads the count a flag of the given suffix starts with, and
// false for any other flag.
func flagCount(group, suffix string) (int, bool) {
	if !strings.HasSuffix(group, suffix) {
		return 0, false
	}
	var n int
	if _, err := fmt.Sscanf(group, "%d", &n); err != nil || n < 1 {
		return 0, false
	}
	return n, true
}

// widenKeteneEnd (kcal/mol) widens the ΔHf° uncertainty per unsaturated
// carbon substituent on the CR2 end of a ketene, for which the alkyl-derived
// correction is not checked. The substituents of one ketene err alike, so
// the widening adds linearly over them (uncertainty). Its size is the whole
// alkyl correction (2.9 kcal/mol, rounded up): with no molecule to check
// it, the correction may not apply at all.
const widenKeteneEnd = 3.0

// thermoBlockRoute ends a refusal for which no group statement can help
// (issue 13: every refusal says how to supply what is missing).
const thermoBlockRoute = "no `group` statement can name this carbon: give the species a thermo block"

// keteneRefusal refuses a C=C=O carbon that the ketene group Ck cannot
// describe: one whose other partner is cumulated or not a carbon, and one
// whose CR2 end carries a heteroatom. The atom is chosen by canonical
// symmetry class, as for other refusals. It works on the structure as
// written (one resonance structure), so a radical spelled as a cumulated
// ketene is estimated through its other structures.
func keteneRefusal(m *molecule.Molecule) error {
	doubles := func(i int) (n int) {
		for _, b := range m.Adj[i] {
			if m.Bonds[b].Order == 2 && !m.Bonds[b].Aromatic {
				n++
			}
		}
		return n
	}
	var refusals []atomError
	for i, a := range m.Atoms {
		if a.Element != "C" || doubles(i) != 2 {
			continue
		}
		toO, partner := -1, -1
		for _, b := range m.Adj[i] {
			if m.Bonds[b].Order != 2 || m.Bonds[b].Aromatic {
				continue
			}
			j := m.Other(b, i)
			if m.Atoms[j].Element == "O" && toO < 0 {
				toO = j
			} else {
				partner = j
			}
		}
		if toO < 0 || partner < 0 {
			continue
		}
		pe := m.Atoms[partner].Element
		var why string
		switch {
		case pe == "N":
			why = fmt.Sprintf("(C) is an isocyanate carbon (N=C=O, double bonds to atoms %d (N) and %d (O)): kiln's tables have no group for it or for the nitrogen of a cumulated C=N (the ketene group Ck describes R2C=C=O with an ordinary C=C end only); %s",
				partner+1, toO+1, thermoBlockRoute)
		case pe != "C":
			why = fmt.Sprintf("(C) is a cumulated carbon %s=C=O (double bonds to atoms %d (%s) and %d (O)): kiln's tables have no group for it (the ketene group Ck describes R2C=C=O with an ordinary C=C end only); %s",
				pe, partner+1, pe, toO+1, thermoBlockRoute)
		case doubles(partner) != 1:
			why = fmt.Sprintf("(C) is a cumulated carbon of C=C=O whose =C partner (atom %d) is itself cumulated, a chain of three or more cumulated double bonds (as in C=C=C=O or carbon suboxide O=C=C=C=O): kiln's tables have no group for such a chain (the ketene group Ck describes R2C=C=O with an ordinary C=C end only); %s",
				partner+1, thermoBlockRoute)
		default:
			if xs := heteroSubstituents(m, partner, i); xs != "" {
				// Reported on the CR2 end, the atom that lacks a group.
				refusals = append(refusals, atomError{partner, &UnsupportedError{Atom: partner + 1, Reason: fmt.Sprintf(
					"(C) is the CR2 end of a ketene (C=C=O with atoms %d and %d) carrying a heteroatom (%s): kiln's tables have no group for a ketene end with a heteroatom substituent (the alkene group with that neighbour describes a vinyl carbon, which such a substituent stabilises while it destabilises a ketene); %s",
					i+1, toO+1, xs, thermoBlockRoute)}})
			}
			continue
		}
		refusals = append(refusals, atomError{i, &UnsupportedError{Atom: i + 1, Reason: why}})
	}
	if len(refusals) == 0 {
		return nil
	}
	return canonicalRefusal(m, refusals)
}

// heteroSubstituents lists, sorted and joined by ", ", the elements other
// than carbon and hydrogen among the neighbours of c other than k ("" when
// there are none). Elements, not atoms, so that the wording does not depend
// on the atom order.
func heteroSubstituents(m *molecule.Molecule, c, k int) string {
	var els []string
	for _, b := range m.Adj[c] {
		j := m.Other(b, c)
		if e := m.Atoms[j].Element; j != k && e != "C" && e != "H" && !slices.Contains(els, e) {
			els = append(els, e)
		}
	}
	slices.Sort(els)
	return strings.Join(els, ", ")
}

// addCumulatedFlags adds the ketene-end correction per carbon substituent
// on the CR2 end of a ketene, flags its unsaturated substituents (one flag
// per ketene end, naming the alkene group used and their number) and flags
// cumulenes (one flag per chain of allene centres double-bonded to each
// other, with its length). g is the closed-shell parent graph;
// keteneRefusal has passed.
func addCumulatedFlags(g *graph, l lookup, est *Result) {
	var seen []bool // allene centres already in a reported chain
	keteneSubs := 0 // carbon substituents on all ketene ends: one correction term
	for i := range g.m.Atoms {
		switch g.typ[i] {
		case "Ck":
			j := -1
			for k, b := range g.nbrBond[i] {
				if g.order(b) == 2 && g.m.Atoms[g.nbr[i][k]].Element == "C" {
					j = g.nbr[i][k]
				}
			}
			if j < 0 || g.typ[j] != "Cd" {
				continue
			}
			centre, counts, ok := g.groupOf(j)
			if !ok {
				continue
			}
			n, unsaturated := 0, 0
			for _, x := range g.nbr[j] {
				if x != i && g.m.Atoms[x].Element == "C" {
					n++
					if g.typ[x] != "C" {
						unsaturated++
					}
				}
			}
			if n == 0 {
				continue
			}
			keteneSubs += n
			if unsaturated == 0 {
				continue
			}
			est.Missing = append(est.Missing, Missing{
				Group:         keteneEndFlag(unsaturated),
				Approximation: groupName(centre, counts) + " (the alkene value) with the ketene-end correction derived on alkyl ketenes",
				Note: "a substituent does not stabilise the CR2 end of a ketene as it does an alkene carbon; the correction for it was derived on methyl and ethyl groups, " +
					"and no ketene with an unsaturated substituent checks it; give the species a thermo block for a better value",
			})
		case "Ca":
			if seen != nil && seen[i] {
				continue
			}
			chain := g.alleneChain(i)
			if len(chain) < 2 {
				continue
			}
			if seen == nil {
				seen = make([]bool, len(g.m.Atoms))
			}
			for _, c := range chain {
				seen[c] = true
			}
			est.Missing = append(est.Missing, Missing{
				Group:         cumuleneFlag(len(chain)),
				Approximation: "Ca, the allene centre group derived from allene, for each",
				Note: "a chain of three or more cumulated double bonds (butatriene and longer cumulenes): no group for adjacent cumulated centres is at hand; " +
					"give the species a thermo block for a better value",
			})
		}
	}
	if keteneSubs > 0 {
		t := term(l.corrections[keteneEndKey], keteneSubs)
		t.Name = keteneEndName
		est.Corrections = append(est.Corrections, t)
	}
}

// alleneChain returns the allene centres (type Ca) joined to i through
// double bonds between allene centres, i included.
func (g *graph) alleneChain(i int) []int {
	chain := []int{i}
	for k := 0; k < len(chain); k++ {
		a := chain[k]
		for n, b := range g.nbrBond[a] {
			j := g.nbr[a][n]
			if g.order(b) == 2 && g.typ[j] == "Ca" && !slices.Contains(chain, j) {
				chain = append(chain, j)
			}
		}
	}
	return chain
}
