package benson

import (
	_ "embed"
	"slices"
	"strconv"

	"kiln.dev/kiln/engine/molecule"
)

// Nitrogen, sulfur and halogen groups, nitrile, ketene and thiocarbonyl
// carbons, hetero radical sites.
//
// Coverage (values and sources in groups_nsx.tsv, same columns as
// groups.tsv, loaded into the one group table): amines, aniline, hydrazines,
// primary amides, nitriles; thiols, sulfides, disulfides; F and Cl on sp3
// carbon next to carbon, Br on primary carbon, F, Cl, Br on benzene rings;
// ketenes. Radical sites on N and S and next to N, Cl and F take the bond
// dissociation enthalpies of hbi_nsx.tsv (heteroSite), thiyl sites the loss
// of the thiol's S–H rotor (heteroSiteChange). Halogens on adjacent
// carbons take interaction corrections, and polyhalogenated carbons whose
// group no handbook molecule checks are flagged (addHalogenFlags).
// Nitro, nitrate, nitrite and azine nitrogen, nitrogen rings and the azo,
// imine and nitroso types are in hetero_n.go. Everything else with N, S or
// halogens is refused, naming the group.
//
// Three carbon types are added to the Benson types of graph.go:
//
//   - CN: a carbon triple-bonded to nitrogen (nitrile). Its ≡N is implied, as
//     the ≡C partner of Ct is; it is the centre of one group, CN-(X), and a
//     neighbour type "CN" in the groups of its neighbours (C-(CN)(H)3 …). The
//     classic tables give composite cyano groups (the sp3 carbon together with
//     its C≡N); they are split here by the convention used for every other
//     unsaturated neighbour: C-(CN)(X)… = C-(C)(X)…, CN-(X) = the rest.
//   - Ck: a cumulated carbon carrying =O (ketene, R2C=C=O). Both double-bond
//     partners are implied, so its group has no written neighbours, like the
//     allene centre Ca; the =CR2 end is an ordinary Cd group, flagged when
//     it carries carbon substituents and refused when it carries a
//     heteroatom or is itself cumulated (ketene.go).
//   - CS: a carbon double-bonded to sulfur (thiocarbonyl); its =S is implied
//     as the =O of CO is. The tables have no CS group: such species are
//     refused naming the group, and a user group makes them estimable.
//
// Terminal halogens and the nitrile N are ligands only (they centre no group),
// as =O is; amine, amide and hydrazine nitrogen and divalent sulfur are group
// centres N-(…)3 and S-(…)2.

//go:embed groups_nsx.tsv
var groupsNSXTSV string

//go:embed hbi_nsx.tsv
var hbiNSXTSV string

// extraGroupTables are parsed after groups.tsv into the one group table;
// a name present twice is a defect of the tables.
var extraGroupTables = []struct{ file, text string }{
	{"groups_nsx.tsv", groupsNSXTSV},
	{"groups_n.tsv", groupsNTSV},   // hetero_n.go
	{"groups_sx.tsv", groupsSXTSV}, // hetero_sx.go
	// azole.go
	{"groups_azole.tsv", groupsAzoleTSV},
}

// heteroCarbonType returns CN for a nitrile carbon, CS for a thiocarbonyl
// carbon (C=S, whose =S is implied like the =O of CO; the tables have no CS
// group, so such species are refused naming the group, never estimated with
// the sulfur left out) and Ck for a ketene carbon, and false for any other
// atom.
func (g *graph) heteroCarbonType(i int) (string, bool) {
	doubles, toO := 0, false
	for k, b := range g.nbrBond[i] {
		j := g.nbr[i][k]
		switch g.order(b) {
		case 3:
			if g.m.Atoms[j].Element == "N" {
				return "CN", true
			}
		case 2:
			doubles++
			switch g.m.Atoms[j].Element {
			case "O":
				toO = true
			case "S":
				return "CS", true
			}
		}
	}
	if doubles == 2 && toO {
		return "Ck", true
	}
	return "", false
}

// heteroClass names the validation class of a molecule with heteroatoms
// other than oxygen: halogen (any F, Cl, Br, I), else sulfur, else nitrogen;
// carbonyl for a C/H/O ketene; "" for other C/H/O molecules.
func heteroClass(m *molecule.Molecule) string {
	var n, s, so, x bool
	for i, a := range m.Atoms {
		switch a.Element {
		case "F", "Cl", "Br", "I":
			x = true
		case "S":
			s = true
			so = so || sulfurOxo(m, i)
		case "N":
			n = true
		}
	}
	switch {
	case x:
		return "halogen"
	case so:
		// Sulfoxides and sulfones: their S=O groups (Benson's, each checked
		// on one or two molecules) err by more than the thiols and sulfides
		// that set the sulfur class's error, so they are a class of their own.
		return "sulfur oxide"
	case s:
		return "sulfur"
	case n:
		return "nitrogen"
	case ketene(m):
		return "carbonyl" // a ketene is a carbonyl compound, not an ether
	}
	return ""
}

// sulfurOxo reports whether atom i (an S) has a double bond to an oxygen.
func sulfurOxo(m *molecule.Molecule, i int) bool {
	for _, b := range m.Adj[i] {
		if bd := m.Bonds[b]; bd.Order == 2 && !bd.Aromatic && m.Atoms[m.Other(b, i)].Element == "O" {
			return true
		}
	}
	return false
}

// ketene reports whether m has a carbon double-bonded to both O and C.
func ketene(m *molecule.Molecule) bool {
	for i, a := range m.Atoms {
		if a.Element != "C" {
			continue
		}
		toO, toC := false, false
		for _, b := range m.Adj[i] {
			if m.Bonds[b].Order != 2 {
				continue
			}
			switch m.Atoms[m.Other(b, i)].Element {
			case "O":
				toO = true
			case "C":
				toC = true
			}
		}
		if toO && toC {
			return true
		}
	}
	return false
}

// addHalogenFlags adds the halogen interaction corrections
// (addHalogenInteractions, hetero_sx.go) and flags every group of a carbon
// that bears two or more halogens and is bonded to another heavy atom
// (CF2<, CF2Cl–R …) unless its value was derived from or checked against
// a molecule in which the carbon has the same neighbours
// (checkedPolyhaloGroups): the other tabulated values leave out, or were
// never checked for, the halogen–halogen interactions that make
// polyhalogenated molecules non-additive (Cohen & Benson, Chem. Rev. 93
// (1993), from memory). The estimate is kept but flagged, unless the user
// supplied the group (a `group` statement), which then carries its own
// interactions.
func addHalogenFlags(g *graph, l lookup, est *Result) {
	addHalogenInteractions(g, l, est)
	for i, a := range g.m.Atoms {
		if a.Element != "C" {
			continue
		}
		halogens, others := 0, 0
		for _, j := range g.nbr[i] {
			switch g.m.Atoms[j].Element {
			case "F", "Cl", "Br", "I":
				halogens++
			default:
				others++
			}
		}
		if halogens < 2 || others == 0 {
			continue
		}
		centre, counts, ok := g.groupOf(i)
		if !ok {
			continue
		}
		name := groupName(centre, counts)
		if _, user := l.user[name]; user {
			continue
		}
		if slices.Contains(checkedPolyhaloGroups[:], name) {
			continue
		}
		note := "polyhalogenated carbon whose tabulated group value no handbook molecule checks: its geminal/vicinal halogen interactions are not known; errors of several kcal/mol are possible"
		if seen, ok := polyhaloGroupSeen[name]; ok { // hetero_sx.go
			note += " (" + seen + ")"
		}
		est.Missing = append(est.Missing, Missing{
			Group:         name,
			Approximation: name + withoutHalogenInteractions,
			Note:          note,
		})
	}
}

// heteroSite classifies a radical site on a heteroatom other than O: on N
// (nitrogenSite, hetero_n.go) and on S (sulfurSite). missing names the
// approximation when the site only resembles the increment used; a site
// with no increment at hand gets a name with no row in the HBI tables, so
// addHBI refuses the estimate naming it. ok is false for any other element.
// Carbon sites next to N, Cl, F, Br or I (alpha-amino, alpha-chloro,
// alpha-fluoro) are classified with the other stabilising neighbours of a
// carbon centre, by one priority rule (radical.go, stabilisers).
func heteroSite(g *graph, i int) (site, missing string, ok bool) {
	switch g.m.Atoms[i].Element {
	case "N":
		site, missing := nitrogenSite(g, i) // hetero_n.go
		return site, missing, true
	case "S":
		return sulfurSite(g, i)
	}
	return "", "", false
}

// sulfurSite classifies S-centred radical site i (g is the parent graph):
//
//   - thiyl: R–S•, one sp3 carbon neighbour (CH3S–H, hbi_nsx.tsv).
//   - arylthiyl: Ar–S•, on a benzene-ring carbon (C6H5S–H, hbi_n.tsv). The
//     published PhS–H bond enthalpies disagree by about 4.5 kcal/mol (83.5
//     against about 79), so the site is flagged (arylthiylSite) and widened
//     by that spread (class.go); the alkyl CH3S–H increment, 87.4, would put
//     PhS• 4–8 kcal/mol too high.
//   - on another unsaturated carbon (vinyl, acyl, alkynyl: S• conjugated
//     with a π bond): the CH3S–H increment, flagged as a stabilised site
//     without its increment (unstabilisedSite, widened by widenStabiliser).
//   - perthiyl (S• bonded to S, RSS•) and S• bonded to N, O or a halogen,
//     or with no or several neighbours: no increment at hand — RSS–H is
//     roughly 15 kcal/mol weaker than CH3S–H (about 70 against 87.4, from
//     memory) — so the site gets a name with no HBI row and is refused.
func sulfurSite(g *graph, i int) (site, missing string, ok bool) {
	if len(g.nbr[i]) != 1 {
		return "thiyl site with " + strconv.Itoa(len(g.nbr[i])) + " neighbours", "", true
	}
	j := g.nbr[i][0]
	switch t := g.typ[j]; {
	case t == "C":
		return "thiyl", "", true
	case t == "Cb" || t == "Cbf":
		return "arylthiyl", arylthiylSite, true
	case g.isCarbon(j):
		return "thiyl", unstabilisedSite + "thiyl on a " + t + " carbon (CH3S–H increment used; conjugation weakens the S–H bond)", true
	case g.m.Atoms[j].Element == "S":
		return "perthiyl (S• bonded to S)", "", true
	}
	return "thiyl bonded to " + g.m.Atoms[j].Element, "", true
}

// arylthiylSite flags an arylthiyl site (Ar–S•): its increment rests on
// published C6H5S–H bond enthalpies that disagree by about 4.5 kcal/mol
// (hbi_n.tsv); class.go widens the uncertainty by widenArylthiyl.
const arylthiylSite = "arylthiyl radical site (Ar–S•): published C6H5S–H bond enthalpies disagree by about 4.5 kcal/mol"

// partnerElement returns the neighbour of i of the given element joined by a
// bond of the given order, or -1.
func (g *graph) partnerElement(i, order int, element string) int {
	for k, b := range g.nbrBond[i] {
		if j := g.nbr[i][k]; g.order(b) == order && g.m.Atoms[j].Element == element {
			return j
		}
	}
	return -1
}

// Thiyl radical sites (RS•) lose the parent thiol's S–H internal rotor: the
// S–H torsion of CH3SH is a nearly free rotor (barrier ≈ 1.3 kcal/mol,
// reduced moment ≈ 0.9 amu·Å², from memory), whose entropy is about
// thiolRotorS without its symmetry number (free rotor 4.5, less Pitzer's
// hindrance correction at V₀/RT ≈ 2), and whose Cp excess fades from about
// 1.6 cal/(mol K) at 300 K to the free-rotor R/2 at high temperature
// (common practice). The lost X–H vibrations (radical.go, lostModes) carry
// no torsion, so the rotor is removed here, as the O–H rotor is for alkoxy.
// An arylthiyl site (C6H5S•) loses thiophenol's S–H torsion, also a low
// barrier (about 1 kcal/mol, from memory); CH3SH's rotor values stand in.
const thiolRotorS = 4.2 // cal/(mol K)

var thiolRotorCp = [7]float64{1.6, 1.4, 1.3, 1.2, 1.1, 1.05, 1.0} // cal/(mol K) at StdTemps

// heteroSiteChange returns the entropy and Cp change (J/(mol K)) of a
// hetero radical site beyond its lost X–H vibrations, and false for sites
// with none.
func heteroSiteChange(g *graph, i int, site string) (float64, [7]float64, bool) {
	var cp [7]float64
	if (site != "thiyl" && site != "arylthiyl") || g.m.Atoms[i].Element != "S" || len(g.nbr[i]) != 1 {
		return 0, cp, false
	}
	for k := range cp {
		cp[k] = -thiolRotorCp[k] * calorie
	}
	return -thiolRotorS * calorie, cp, true
}
