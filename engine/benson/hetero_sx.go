package benson

import (
	_ "embed"
	"slices"
)

// Sulfur and halogen extensions of the group tables: sulfoxide and sulfone
// sulfur, thiophene-type and saturated sulfur rings, halogens on sp2 carbon,
// secondary and tertiary C–Br, ortho halogen pairs on benzene rings.
// Values and sources: groups_sx.tsv (groups) and corrections_sx.tsv (ring
// and ortho corrections), same columns and units as groups.tsv.
//
// Two sulfur types are added to the Benson types of graph.go:
//
//   - SO: a sulfur carrying one double bond to a terminal oxygen (sulfoxide,
//     R2S=O); SO2: a sulfur carrying two (sulfone, R2S(=O)2). The =O atoms
//     are implied by the type, as the =O of CO is (impliedPartner), so the
//     groups read SO-(C)2, SO2-(C)2 and, on the neighbouring carbon,
//     C-(SO)(C)(H)2, C-(SO2)(H)3 …, the notation of the classic tables.
//
// Sulfur rings get the ring corrections thiirane, thietane, thiolane and
// thiophene (sulfurRingKey); in thiophene the aromatic bonds take the Kekulé
// orders of the SMILES reader, as furan's do, so its groups are
// Cd-(S)(H), Cd-(Cd)(H) and S-(Cd)2.

//go:embed groups_sx.tsv
var groupsSXTSV string

//go:embed corrections_sx.tsv
var correctionsSXTSV string

// extraCorrectionTables are parsed after corrections.tsv into the one
// correction table.
var extraCorrectionTables = []struct{ file, text string }{
	{"corrections_sx.tsv", correctionsSXTSV},
}

// sulfurOxideType returns SO for a sulfur with one double bond to a terminal
// oxygen, SO2 for one with two, and false for any other atom (a sulfur with
// three stays type S, and its =O atoms are then refused as terminal atoms no
// group names).
func (g *graph) sulfurOxideType(i int) (string, bool) {
	if g.m.Atoms[i].Element != "S" {
		return "", false
	}
	n := 0
	for k, b := range g.nbrBond[i] {
		if j := g.nbr[i][k]; g.order(b) == 2 && g.m.Atoms[j].Element == "O" && g.terminal(j) {
			n++
		}
	}
	switch n {
	case 1:
		return "SO", true
	case 2:
		return "SO2", true
	}
	return "", false
}

// impliedOxide reports whether neighbour j of an SO or SO2 centre, joined by
// bond b, is one of the =O atoms its type stands for (not a written ligand).
func (g *graph) impliedOxide(centre string, b, j int) bool {
	if centre != "SO" && centre != "SO2" {
		return false
	}
	return g.order(b) == 2 && g.m.Atoms[j].Element == "O" && g.terminal(j)
}

// sulfurRingKey names the ring correction of a ring whose only heteroatom
// is one divalent sulfur (type S): thiirane, thietane, thiolane, thiane (3,
// 4, 5, 6 members, saturated) and thiophene (five aromatic members, two double
// bonds); "" for any other ring.
func (g *graph) sulfurRingKey(r []int, nd, aromatic int) string {
	if !g.oneHeteroatom(r, "S") {
		return ""
	}
	switch {
	case len(r) == 3 && nd == 0:
		return "thiirane"
	case len(r) == 4 && nd == 0:
		return "thietane"
	case len(r) == 5 && nd == 0:
		return "thiolane"
	case len(r) == 6 && nd == 0:
		return "thiane"
	case len(r) == 5 && nd == 2 && aromatic == 5:
		return "thiophene"
	}
	return ""
}

// orthoHalogenKeys are the ortho corrections of benzene rings for pairs of
// halogens of one element; any other ortho pair takes nni:ortho.
var orthoHalogenKeys = [...]struct{ element, key, name string }{
	{"F", "nni:ortho F/F", "ortho F/F interaction"},
	{"Cl", "nni:ortho Cl/Cl", "ortho Cl/Cl interaction"},
}

// orthoHalogen returns the index in orthoHalogenKeys of the correction for
// substituents a and b on adjacent benzene carbons, and false when the pair
// takes the general ortho correction.
func (g *graph) orthoHalogen(a, b int) (int, bool) {
	ea, eb := g.m.Atoms[a].Element, g.m.Atoms[b].Element
	if ea != eb {
		return 0, false
	}
	h := slices.IndexFunc(orthoHalogenKeys[:], func(k struct{ element, key, name string }) bool { return k.element == ea })
	return h, h >= 0
}

// withoutHalogenInteractions ends the Approximation of the polyhalogenated
// carbon flag (addHalogenFlags).
const withoutHalogenInteractions = " without halogen interactions"

// widenPolyhalogen (kcal/mol) widens the ΔHf° uncertainty per polyhalogenated
// carbon flag: measured on the training rows of testdata/thermo/nsx.tsv
// whose estimates carry k such flags and no other ΔHf° approximation, as
// sqrt(mean(d²/k)) (10 rows, 1,1-dichloroethane … CH3CF3, 2026-12-03),
// the way widenSystem is measured; TestPolyhalogenWidening recomputes it.
// The general widenGroup (2 kcal/mol) understated these errors (CH3CF3
// 10 kcal/mol off with ±2.3).
const widenPolyhalogen = 4.0

// olderChloroethyleneGroups are the vinyl-chlorine groups whose published
// ΔHf° (Benson 1976, groups_sx.tsv) rests on older chloroethylene data: with
// them vinyl chloride comes out 8.4 kcal/mol against about 5 and
// 1,2-dichloroethylene 4.2 against about 1.1. Their carbons are flagged
// (addHalogenFlags; a Cd-(Cl)2 carbon always bears two halogens and a heavy
// neighbour, so it carries the polyhalogen flag instead, whose widening
// was measured with tetrachloroethylene among its rows).
var olderChloroethyleneGroups = [...]string{"Cd-(Cl)(H)", "Cd-(Cl)2"}

// olderChloroethyleneData ends the Approximation of that flag.
const olderChloroethyleneData = " (published value, older chloroethylene data)"

// widenVinylChloride (kcal/mol) widens the ΔHf° uncertainty per
// olderChloroethyleneData flag: measured on the training rows of
// testdata/thermo/nsx.tsv whose estimates carry k such flags and no other
// ΔHf° approximation, as sqrt(mean(d²/k)) (vinyl chloride, cis- and
// trans-1,2-dichloroethylene, 2026-12-04), as widenPolyhalogen is;
// TestVinylChlorideWidening recomputes it. The errors are a bias (all
// three rows high), which a wider σ shows but does not remove.
const widenVinylChloride = 2.6

// heteroarylSite names the approximation for a σ radical site on a carbon
// of a five-membered heteroaromatic ring (2-furyl, 2-thienyl): its ring
// carbons are typed Cd, so the vinylic D(R–H) is used, although the C–H
// bonds of such rings are stronger than a vinylic one (furan's α C–H near
// 120 kcal/mol against 110.7; from memory), so the estimate is flagged.
const heteroarylSite = "σ radical on a heteroaromatic ring (vinylic increment used; the ring's C–H bond is stronger)"

// polyhaloSites are the bond-dissociation increments (hbi_nsx.tsv) of
// radical centres bearing two or three halogens of one element, measured on
// the halomethanes X2CH–H and X3C–H.
var polyhaloSites = map[string][4]string{
	"Cl": {2: "alpha-dichloro", 3: "alpha-trichloro"},
	"F":  {2: "alpha-difluoro", 3: "alpha-trifluoro"},
}

// polyhaloSite classifies an sp3 carbon radical centre i bearing two or
// three halogens of one element (Cl or F) and no other stabilising
// neighbour: its site is the X2CH–H or X3C–H increment. missing notes a
// centre that also has another heavy neighbour (CH3CCl2•): the increment is
// the halomethane's, and substitution lowers D(R–H) by a few kcal/mol. ok is
// false for any other centre (mixed halogens, bromine, a further stabilising
// neighbour), which the general stabiliser rule of radical.go handles.
func (g *graph) polyhaloSite(i int) (site, missing string, ok bool) {
	element, n, others := "", 0, 0
	for _, j := range g.nbr[i] {
		switch e := g.m.Atoms[j].Element; e {
		case "F", "Cl", "Br", "I":
			if element != "" && e != element {
				return "", "", false
			}
			element = e
			n++
		default:
			if g.stabiliserOf(j) >= 0 {
				return "", "", false
			}
			others++
		}
	}
	sites, known := polyhaloSites[element]
	if !known || n < 2 || n > 3 {
		return "", "", false
	}
	site = sites[n]
	if others > 0 {
		missing = site + " radical site on a substituted carbon (the halomethane's increment is used; substitution lowers D(R–H) by a few kcal/mol)"
	}
	return site, missing, true
}
