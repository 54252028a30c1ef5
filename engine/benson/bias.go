package benson

import (
	"fmt"
	"slices"
	"strings"
)

// Effects the groups are known to miss, for which no correction is at hand:
// the estimate is kept, flagged naming the effect, and its ΔHf° uncertainty
// widened by at least the size of the error the effect is known to make
// (class.go, uncertainty). No group value is changed for them.
//
//   - Vicinal polar groups (addPolarPairFlags): two nitrile or nitro groups
//     on adjacent sp3 carbons repel (a dipole–dipole interaction across the
//     C–C bond) that no group and no interaction correction carries.
//   - Crowding across a heteroatom (addCrowdingFlags): two tertiary alkyl
//     carbons (R3C–) on one divalent O or S or amine N, joined to it by
//     open-chain bonds (di-tert-butyl ether, sulfide, amine). The 1,5
//     interactions of interactions.go are counted across carbon centres
//     only, and the C–O, C–N and C–S bonds are shorter than, or about as
//     long as, a C–C bond, so the strain is larger than across a CH2.
//   - A carbon radical site next to a carbon with two or more halogens
//     (betaPolyhaloSite, addHBI in radical.go): its C–H bond is stronger
//     than the alkyl increment says.

// azineGroup names the flag of a six-membered aromatic ring with three or
// more pyridine-type N (addAzineRingFlags).
const azineGroup = "azine ring with three or more N"

// addAzineRingFlags flags every benzenoid ring holding three or more
// pyridine-type ring N (Nb): the Nb value was derived from pyridine and
// checked on the diazines (pyrimidine, pyrazine within 0.6 kcal/mol), but
// the ring N do not stay additive beyond two — 1,3,5-triazine comes out
// about 7 kcal/mol high (61.2 against 54.0, 225.9 kJ/mol, NIST Chemistry
// WebBook, from memory). class.go widens by widenAzine.
func addAzineRingFlags(g *graph, est *Result) {
	for r, ring := range g.rings {
		if !g.benzRing[r] {
			continue
		}
		n := 0
		for _, a := range ring {
			if g.typ[a] == "Nb" {
				n++
			}
		}
		if n >= 3 {
			est.Missing = append(est.Missing, Missing{
				Group:         azineGroup,
				Approximation: "the Nb group as it stands, without an N/N ring interaction",
				Note:          fmt.Sprintf("%d pyridine-type N in one six-membered ring: Nb is additive through the diazines, not beyond (1,3,5-triazine comes out about 7 kcal/mol high)", n),
			})
		}
	}
}

// polarPairSuffix ends the Approximation of a vicinal polar-group flag.
const polarPairSuffix = " without a vicinal polar-group interaction"

// polarPartner reports whether neighbour type t is a strongly polar group
// whose interaction with another on the adjacent carbon no table carries:
// a nitrile (CN) or nitro (NO2) group.
func polarPartner(t string) bool { return t == "CN" || t == "NO2" }

// addPolarPairFlags flags every pair of nitrile or nitro groups on two sp3
// carbons joined by a single bond (N≡C–CH2–CH2–C≡N, O2N–CH2–CH2–NO2,
// ring bonds included): one flag per pair, named by the two groups
// ("vicinal CN/CN"). Two such groups on one carbon are refused for want
// of a group (C-(CN)2(H)2), so only the vicinal case reaches here.
func addPolarPairFlags(g *graph, est *Result) {
	for e, b := range g.m.Bonds {
		x, y := b.A, b.B
		if g.order(e) != 1 || g.typ[x] != "C" || g.typ[y] != "C" {
			continue
		}
		for _, p := range g.nbr[x] {
			if !polarPartner(g.typ[p]) {
				continue
			}
			for _, q := range g.nbr[y] {
				if !polarPartner(g.typ[q]) {
					continue
				}
				pair := g.typ[p] + "/" + g.typ[q]
				if g.typ[q] < g.typ[p] {
					pair = g.typ[q] + "/" + g.typ[p]
				}
				est.Missing = append(est.Missing, Missing{
					Group:         "vicinal " + pair,
					Approximation: "the groups of both carbons" + polarPairSuffix,
					Note:          fmt.Sprintf("two strongly polar groups (%s) on adjacent sp3 carbons repel each other, which no group or correction carries; the estimate is too low by several kcal/mol (succinonitrile by about 5)", pair),
				})
			}
		}
	}
}

// crowdingGroup begins the Group of a crowding flag; the element follows.
const crowdingGroup = "steric crowding across "

// tertiaryAlkyl reports whether atom c, bonded to x by an open-chain
// bond, is a tertiary alkyl carbon: sp3, with three carbon neighbours
// besides x (the central carbon of a tert-butyl group).
func (g *graph) tertiaryAlkyl(c, x int) bool {
	if g.typ[c] != "C" || g.ringBond[g.bondBetween(x, c)] {
		return false
	}
	return g.carbonNeighbours(c, x) == 3
}

// addCrowdingFlags flags every pair of tertiary alkyl carbons on one
// divalent O or S or one amine N (types O, S, N): one flag per pair,
// "steric crowding across O". A pair closed into a ring through the
// heteroatom is not flagged (its substituents point away from each other,
// and the ring correction describes the ring).
func addCrowdingFlags(g *graph, est *Result) {
	for x, a := range g.m.Atoms {
		switch t := g.typ[x]; {
		case t != a.Element: // SO, NO2, Nb …: not a divalent O or S or an amine N
			continue
		case t != "O" && t != "S" && t != "N":
			continue
		}
		n := 0
		for _, c := range g.nbr[x] {
			if g.tertiaryAlkyl(c, x) {
				n++
			}
		}
		for range n * (n - 1) / 2 {
			est.Missing = append(est.Missing, Missing{
				Group:         crowdingGroup + a.Element,
				Approximation: "the groups as they stand, without a crowding correction",
				Note:          fmt.Sprintf("two tertiary alkyl groups on one %s (R3C–%s–CR3) crowd each other, which no group or correction carries; the estimate is too low by several kcal/mol (%s)", a.Element, a.Element, crowdingSeen[a.Element]),
			})
		}
	}
}

// crowdingSeen says, per element, how far the crowding flag's example
// molecule was seen to be off (class.go, widenCrowdingO …).
var crowdingSeen = map[string]string{
	"O": "di-tert-butyl ether by about 11",
	"S": "di-tert-butyl sulfide by about 6",
	"N": "no crowded amine value is at hand; the ether's size is taken",
}

// widenCrowding returns the widening (kcal/mol) of a crowding flag by the
// element it names (class.go), and false for any other flag.
func widenCrowding(m Missing) (float64, bool) {
	el, ok := strings.CutPrefix(m.Group, crowdingGroup)
	if !ok {
		return 0, false
	}
	switch el {
	case "S":
		return widenCrowdingS, true
	case "O":
		return widenCrowdingO, true
	}
	return widenCrowdingN, true
}

// betaPolyhaloSite names the flag of a carbon radical site next to an sp3
// carbon bearing two or more halogens (CF3CH2•, CCl3CH2•, CF3CH•CH3): the
// alkyl (or other) increment of the site is used, but the electron-
// withdrawing CX3/CX2 group strengthens the C–H bond at the site
// (D(CF3CH2–H) ≈ 106.7 against 101.1 kcal/mol for a primary C–H; class.go,
// widenBetaPolyhalo), so the estimate is too low.
const betaPolyhaloSite = "radical site next to a carbon with two or more halogens (β-polyhalo): the C–H bond there is several kcal/mol stronger than the increment used"

// betaPolyhalo returns the number of sp3 carbon neighbours of radical
// centre i (an sp3 carbon of the parent graph g) that bear two or more
// halogens.
func (g *graph) betaPolyhalo(i int) int {
	if g.m.Atoms[i].Element != "C" || g.typ[i] != "C" {
		return 0
	}
	n := 0
	for _, j := range g.nbr[i] {
		if g.typ[j] != "C" {
			continue
		}
		if h, _ := g.halogens(j); h >= 2 {
			n++
		}
	}
	return n
}

// arylAmineStandIn reports whether m flags a nitrogen group with a
// benzene-ring neighbour approximated by the group with a vinyl neighbour
// in its place (N-(Cb)(C)2 ≈ N-(Cd)(C)2, N-(Cb)(Cd)(H) ≈ N-(Cd)2(H)): the
// conjugation of the N lone pair with a benzene ring differs from that with
// a C=C, and the stand-in is known to err by several kcal/mol (class.go,
// widenArylAmineStandIn).
func arylAmineStandIn(m Missing) bool {
	return strings.HasPrefix(m.Group, "N-(") && strings.Contains(m.Note, "Cb→Cd")
}

// standInWarning is added to the note of a stand-in group (assign.go) whose
// replacement is known to err by more than a stand-in usually does: "" for
// the others.
func standInWarning(group string, steps []string) string {
	if strings.HasPrefix(group, "N-(") && slices.Contains(steps, "Cb→Cd") {
		return "; an N lone pair conjugates with a benzene ring otherwise than with a C=C: N-methylaniline comes out about 5 and N,N-dimethylaniline about 10 kcal/mol low"
	}
	return ""
}
