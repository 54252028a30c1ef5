package benson

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"kiln.dev/kiln/engine/molecule"
)

// Radicals use hydrogen-bond increments (Lay, Bozzelli, Dean & Ritter,
// J. Phys. Chem. 99 (1995)). The radical R• is estimated as its parent R–H
// (the H added back at every radical site) plus, per unpaired electron, the
// increment of its site type:
//
//	ΔHf(R•) = ΔHf(RH) + D(R–H) − ΔHf(H),   ΔHf(H) = 52.10 kcal/mol
//	S(R•)   = S_int(RH) + ΔS_HBI + R ln(multiplicity) − R ln σ(R•) + R ln n(R•)
//	Cp(R•)  = Cp(RH) + ΔCp_HBI
//
// Convention: the tabulated ΔS_HBI excludes both electronic degeneracy and
// symmetry; kiln adds R ln(multiplicity) and computes σ and n on the radical
// graph itself (a radical carbon with three ligands is treated as planar,
// except one bearing two or more fluorines, which is pyramidal:
// molecule.Molecule.PyramidalRadical).
// Radical-centred groups (C•-(C)(H)2 …) are not used: the HBI route covers
// every closed-shell parent the group tables cover.
//
// Site types: primary, secondary, tertiary alkyl (by the number of carbon
// neighbours), allylic (next to Cd, Ca or Ct), benzylic (next to Cb), vinylic
// (on Cd), phenyl (on Cb), acyl (on CO), α-hydroxy and α-alkoxy (sp3 carbon
// next to O bearing H or not), α-amino, α-chloro and α-fluoro (next to N, Cl
// or F, see hetero.go), α,α-dichloro, -trichloro, -difluoro and -trifluoro
// (two or three halogens of one element, hetero_sx.go), alkoxy (on O),
// phenoxy (O on Cb), peroxy (O on O), iminoyl (a C• on an imine carbon);
// on N and S (hetero.go, hetero_n.go): aminyl (R–NH•), dialkylaminyl
// (R2N•), anilino (Ar–NH•), iminyl (R2C=N•), hydrazinyl (H2N–NH•, R2N–NH•,
// R–N•–NH2), thiyl (R–S•), arylthiyl (Ar–S•).
// Sites that only resemble one of these use the nearest one and are
// reported in Missing; where the direction and size of the error are known
// (an α-halo centre with alkyl substituents its increment was not
// measured with, a site next to a CX3 or CX2 carbon (bias.go), an
// N-substituted anilino site, an alkylated hydrazinyl site, a thiyl site
// on an unsaturated carbon) or the published bond enthalpies disagree
// (arylthiyl, (CH3)2N–NH–H), class.go widens the uncertainty by at least
// that size. Sites for which no increment is at hand and the nearest one
// is far off — an N• bonded to O, S, a halogen or a non-amine N, amidyl,
// diazenyl, an O• bonded to N or S (aminoxyl), an S• bonded to S
// (perthiyl) — are given a site name
// with no row in the HBI tables, so addHBI refuses the estimate naming the
// site and the route (a thermo block: a `group` statement cannot supply an
// increment).
//
// One answer per molecule: the site type is a function of the graph, never
// of the order in which atoms or neighbours were written. An sp3 carbon
// centre can have several stabilising neighbours at once (CH2=C(CH3)–•C(OH)–
// is allylic and α-hydroxy). The rule (common practice: the most
// delocalising neighbour dominates the C–H bond strength; the published
// increments are for singly stabilised sites only):
//
//  1. Every neighbour is classified on its own (stabilisers below); the
//     centre takes the site type of the most stabilising one — the first in
//     stabilisers, which is ordered by increasing D(R–H) of the tables
//     (allylic 88.8 < propargylic, allylic value < benzylic 89.7 <
//     α-amino 93.9 < α-hydroxy = α-alkoxy 96.1 < α-chloro 100.1 <
//     α-fluoro 101.3 < α-bromo 101.5 kcal/mol; TestStabiliserOrder
//     keeps the order and the tables in step).
//  2. A centre with two or more stabilising neighbours (of one kind or of
//     several: pentadienyl, allylic and α-hydroxy, …) is flagged in Missing
//     ("HBI: radical site with several stabilising neighbours …"), which
//     widens the uncertainty: the further stabilisation (or captodative
//     effect) of the other neighbours is not in the increment used.
//  3. An α-carbonyl centre is estimated as its C=C–O• resonance structure
//     (the enoxy resonance structure, resonance.go), whatever its other neighbours; with two
//     carbonyl neighbours the one whose oxygen has the lowest canonical
//     symmetry class (molecule.SymmetryClasses) takes the electron, and other
//     stabilising neighbours are flagged as in rule 2.
//  4. No stabilising neighbour: primary, secondary or tertiary by the number
//     of carbon neighbours.

// stabiliser is one kind of stabilising neighbour of an sp3 carbon radical
// centre: the site type it gives and the approximation note ("" when the
// increment is the site's own).
type stabiliser struct {
	kind, site, missing string
}

// stabilisers are ordered from most to least stabilising (see rule 1 above).
var stabilisers = []stabiliser{
	{"allylic", "allylic", ""},
	{"propargylic", "allylic", "propargylic radical site"},
	{"benzylic", "benzylic", ""},
	{"alpha-amino", "alpha-amino", ""},
	{"alpha-hydroxy", "alpha-hydroxy", ""},
	{"alpha-alkoxy", "alpha-alkoxy", ""},
	{"alpha-chloro", "alpha-chloro", ""},
	{"alpha-fluoro", "alpha-fluoro", ""},
	{"alpha-bromo", "alpha-bromo", ""},
	{"alpha-iodo", "alpha-bromo", "α-iodo radical site (BrCH2–H increment used)"},
}

// stabiliserOf returns the index in stabilisers of neighbour j of an sp3
// carbon radical centre, or -1 when j does not stabilise the radical.
func (g *graph) stabiliserOf(j int) int {
	kind := ""
	switch g.typ[j] {
	case "Cd", "Ca":
		kind = "allylic"
	case "Ct":
		kind = "propargylic"
	case "Cb":
		kind = "benzylic"
	case "O":
		kind = "alpha-alkoxy"
		if g.m.Atoms[j].HCount > 0 {
			kind = "alpha-hydroxy"
		}
	case "N":
		kind = "alpha-amino"
	case "Cl":
		kind = "alpha-chloro"
	case "Br":
		kind = "alpha-bromo"
	case "I":
		kind = "alpha-iodo"
	case "F":
		kind = "alpha-fluoro"
	}
	for k, s := range stabilisers {
		if s.kind == kind {
			return k
		}
	}
	return -1
}

// stabilisation returns the stabilising neighbours of sp3 carbon i: the
// best (lowest index in stabilisers, -1 for none) and a description of all
// of them in stabilisers order ("allylic, alpha-hydroxy"; "allylic ×2"),
// empty unless there are at least two.
func (g *graph) stabilisation(i int) (best int, several string) {
	best, parts, n := g.stabiliserKinds(i)
	if n < 2 {
		return best, ""
	}
	return best, strings.Join(parts, ", ")
}

// stabiliserKinds returns the best stabilising neighbour of carbon i (index in
// stabilisers, -1 for none), the kinds present in stabilisers order with
// their counts ("allylic ×2") and the number of stabilising neighbours.
func (g *graph) stabiliserKinds(i int) (best int, parts []string, n int) {
	var count [16]int
	best = -1
	for _, j := range g.nbr[i] {
		k := g.stabiliserOf(j)
		if k < 0 {
			continue
		}
		count[k]++
		n++
		if best < 0 || k < best {
			best = k
		}
	}
	for k, c := range count[:len(stabilisers)] {
		switch {
		case c == 1:
			parts = append(parts, stabilisers[k].kind)
		case c > 1:
			parts = append(parts, fmt.Sprintf("%s ×%d", stabilisers[k].kind, c))
		}
	}
	return best, parts, n
}

// severalStabilisers is the Missing entry of rule 2 for a centre with the
// stabilising neighbours described by several, estimated as site.
func severalStabilisers(several, site string) Missing {
	return Missing{
		Group:         "HBI: radical site with several stabilising neighbours (" + several + ")",
		Approximation: "HBI: " + site,
		Note:          "no increment for a radical centre stabilised from several sides: the most stabilising neighbour's increment (lowest D(R–H)) is used and the others' effect is left out",
	}
}

// unstabilisedSite starts the note of a radical site next to a conjugating
// neighbour without an increment of its own (nitrile, sulfur): the alkyl
// increment is used, which leaves out the neighbour's stabilisation, and
// class.go widens the uncertainty by widenStabiliser.
const unstabilisedSite = "alkyl increment for a stabilised radical site: "

// noIncrementRoute ends the refusal of a radical site without an increment:
// kiln's tables have no row for it and a `group` statement cannot supply
// one, so the species' thermochemistry has to be given.
const noIncrementRoute = "a `group` statement cannot supply a bond-dissociation increment: give the species a thermo block"

// disputedIncrementNote explains the flag of a site that has its own
// increment, taken from one of several published bond enthalpies that
// disagree (arylthiyl): the uncertainty is widened by their
// spread (class.go).
const disputedIncrementNote = "the site's own increment, from one of published bond enthalpies that disagree; the uncertainty is widened by their spread"

// computedIncrementNote explains the flag of a site whose own increment
// comes from one computed pair of enthalpies that a handbook value of the
// parent questions (alkylHydrazinylSite): the uncertainty is widened by
// that difference (class.go).
const computedIncrementNote = "the site's own increment, from one computed pair of enthalpies whose parent differs from the handbook value; the uncertainty is widened by that difference"

// secondaryHaloSites are the increments of α-halo centres with one alkyl
// substituent, CH3CHX–H (hbi_nsx.tsv), by the halomethane site they refine.
var secondaryHaloSites = map[string]string{
	"alpha-chloro": "secondary alpha-chloro",
	"alpha-fluoro": "secondary alpha-fluoro",
}

// alphaHaloSite returns the increment of an sp3 α-halo radical centre i
// whose best stabiliser is the halogen kind (alpha-chloro …). Increments are
// measured on XCH2–H and, for Cl and F, on CH3CHX–H; alkyl substitution at
// the centre lowers D(R–H) (a CX2/CX3 neighbour raises it instead: the
// β-polyhalo flag covers that one, bias.go). A centre with one alkyl
// neighbour takes the CH3CHX–H increment where there is one; any other
// substituted centre takes the nearest increment and is flagged
// (substitutedHaloSite).
func (g *graph) alphaHaloSite(i int, kind string) (site, missing string) {
	alkyl, other := 0, 0
	for _, j := range g.nbr[i] {
		if !g.isCarbon(j) {
			continue
		}
		switch h, _ := g.halogens(j); {
		case g.typ[j] != "C":
			other++ // an unsaturated or hetero-typed carbon
		case h < 2:
			alkyl++ // (a CX2/CX3 neighbour counts as neither)
		}
	}
	secondary, ok := secondaryHaloSites[kind]
	switch {
	case alkyl == 0 && other == 0:
		return kind, ""
	case ok && alkyl == 1 && other == 0:
		return secondary, ""
	case ok:
		return secondary, substitutedHaloSite + kind + " (the CH3CHX–H increment is used)"
	}
	return kind, substitutedHaloSite + kind + " (the XCH2–H increment is used)"
}

// substitutedHaloSite starts the note of an α-halo radical centre with a
// carbon substituent (CH3CH•Cl, CH3C•Cl2): the increment was measured on the
// halomethane (XCH2–H, X2CH–H), and alkyl substitution at the centre lowers
// D(R–H), which the increment leaves out; class.go widens the uncertainty
// by widenSubstitutedHalo.
const substitutedHaloSite = "α-halo radical site on a substituted carbon, alkyl substitution lowers D(R–H) by several kcal/mol: "

// ketenylSite names the radical site of a ketenyl radical, R–C•=C=O (its
// other resonance structure R–C≡C–O•): no increment of its own is at hand,
// and the vinylic increment (on the C=C carbon) or the alkoxy one (on the O
// of the ethynoxy structure) leaves out the delocalisation of the electron
// over C–C–O. The size of that error is shown by kiln's own data: ketene
// plus the vinylic increment gives HCCO 47.2 kcal/mol, against 42.2 in the
// reference library, so class.go widens the uncertainty by widenStabiliser
// (5 kcal/mol), as for the other stabilised sites without an increment.
const ketenylSite = "ketenyl radical site (R–C•=C=O ↔ R–C≡C–O•): no increment of its own; the delocalisation onto the C=O is left out"

// iminoylSite names the radical site on an imine carbon (C• of C=N, an
// iminoyl σ radical): its increment is H–C(H)=NH of trans-HC•=NH
// (hbi_n.tsv).
const iminoylSite = "iminoyl"

// siteOf classifies radical site i (an atom of the parent graph g). missing
// names the approximation when the site only resembles the increment used;
// several describes the stabilising neighbours of a carbon centre that has
// two or more (rule 2), "" otherwise.
func siteOf(g *graph, i int) (site, missing, several string, err error) {
	switch g.m.Atoms[i].Element {
	case "C":
		switch g.typ[i] {
		case "Cb", "Cbf":
			return "phenyl", "", "", nil
		case "Cd":
			if g.m.Atoms[i].Aromatic { // furyl, thienyl: hetero_sx.go
				return "vinylic", heteroarylSite, "", nil
			}
			for _, j := range g.nbr[i] {
				if g.typ[j] == "Ck" {
					return "vinylic", ketenylSite, "", nil
				}
			}
			return "vinylic", "", "", nil
		case "CO":
			return "acyl", "", "", nil
		case "CdN":
			// An iminoyl (imidoyl) σ radical, R–C•=N–R′ or HC•=NH: the
			// electron sits in the imine carbon's in-plane orbital, with
			// no allylic delocalisation (the aza-allyl site •C–N=C of its
			// isomer is another species). Its increment is that of
			// trans-HC•=NH, the lower of the two HC•=NH isomers, as an E/Z
			// imine takes one value.
			return iminoylSite, "", "", nil
		case "Ct", "Ca":
			return "vinylic", "ethynyl/allenyl radical site", "", nil
		}
		if g.typ[i] == "C" {
			if site, missing, ok := g.polyhaloSite(i); ok { // hetero_sx.go
				return site, missing, "", nil
			}
			if best, several := g.stabilisation(i); best >= 0 {
				s := stabilisers[best]
				site, missing := s.site, s.missing
				if missing == "" && strings.HasPrefix(s.kind, "alpha-") && s.kind != "alpha-hydroxy" && s.kind != "alpha-alkoxy" && s.kind != "alpha-amino" {
					site, missing = g.alphaHaloSite(i, s.kind)
				}
				return site, missing, several, nil
			}
		}
		carbons, carbonyl := 0, false
		for _, j := range g.nbr[i] {
			if g.isCarbon(j) {
				carbons++
			}
			if g.typ[j] == "CO" {
				carbonyl = true
			}
		}
		alkyl := "primary"
		switch {
		case carbons == 2:
			alkyl = "secondary"
		case carbons >= 3:
			alkyl = "tertiary"
		}
		if g.typ[i] != "C" {
			// nitrile, ketene or thiocarbonyl carbon: no increment at hand
			return alkyl, "radical site on a " + g.typ[i] + " carbon", "", nil
		}
		if carbonyl {
			return alkyl, "alpha-carbonyl radical site (no resonance increment)", "", nil
		}
		for _, j := range g.nbr[i] {
			switch {
			case g.typ[j] == "CN":
				return alkyl, unstabilisedSite + "alpha-cyano", "", nil
			case g.typ[j] == "NC": // isocyanide N (hetero_n.go): conjugates as a nitrile does
				return alkyl, unstabilisedSite + "alpha-isocyano", "", nil
			case g.m.Atoms[j].Element == "S":
				return alkyl, unstabilisedSite + "alpha-thio", "", nil
			}
		}
		if carbons == 0 {
			return "primary", "methyl-type radical site", "", nil
		}
		return alkyl, "", "", nil
	case "O":
		// A radical oxygen has one neighbour; were there more, the first
		// type in this order would decide.
		best := ""
		for _, j := range g.nbr[i] {
			switch el := g.m.Atoms[j].Element; el {
			case "C", "O":
			case "N":
				// Aminoxyl (nitroxide, R2N–O•) and iminoxyl sites: the
				// N lone pair makes the O–H bond of the parent
				// hydroxylamine or oxime some 30 kcal/mol weaker than an
				// alcohol's (R2NO–H about 70–75 against CH3O–H 104.6,
				// from memory); no increment at hand, so the site is
				// named without an HBI row and refused (addHBI).
				return "aminoxyl (O• bonded to N)", "", "", nil
			default:
				// O• on S (HSO-type), on a halogen …: no increment at
				// hand either; refused alike.
				return "oxyl bonded to " + el, "", "", nil
			}
			switch g.typ[j] {
			case "CdN":
				// R–C(=NR)–O•, the imidate resonance structure of an
				// amidyl radical: no increment at hand (nitrogenSite).
				return "amidyl (imidate O• structure)", "", "", nil
			case "O":
				best = "peroxy"
			case "Cb":
				if best != "peroxy" {
					best = "phenoxy"
				}
			case "Cd":
				if best == "" || best == "acyloxy" {
					best = "vinoxy"
				}
			case "CO":
				if best == "" {
					best = "acyloxy"
				}
			case "Ct":
				if best == "" {
					best = "ethynoxy"
				}
			}
		}
		switch best {
		case "peroxy", "phenoxy":
			return best, "", "", nil
		case "vinoxy":
			// An enol O–H is as weak as phenol's (the radical is
			// resonance-stabilised towards the carbonyl form).
			return "phenoxy", "vinoxy radical site (O on Cd)", "", nil
		case "acyloxy":
			return "alkoxy", "acyloxy radical site", "", nil
		case "ethynoxy":
			// R–C≡C–O• is a resonance structure of the ketenyl radical
			// R–C•=C=O: flagged alike, whichever structure is estimated.
			return "alkoxy", ketenylSite, "", nil
		}
		return "alkoxy", "", "", nil
	}
	if site, miss, ok := heteroSite(g, i); ok {
		return site, miss, "", nil
	}
	return "", "", "", fmt.Errorf("benson: radical site on %s is outside the HBI table", g.m.Atoms[i].Element)
}

// addHBI appends one correction per radical site type of m (count = number
// of unpaired electrons at sites of that type).
func addHBI(m *molecule.Molecule, g *graph, l lookup, est *Result) error {
	count := map[string]int{}
	var order []string
	for i, a := range m.Atoms {
		if a.Radical == 0 {
			continue
		}
		site, miss, several, err := siteOf(g, i)
		if err != nil {
			return fmt.Errorf("atom %d: %w", i+1, err)
		}
		// hetero_n.go; a stabilised site left without its increment (an
		// aza-allyl site) outranks the generic methyl-type note.
		if note := nitrogenSiteNote(g, i, site); note != "" && (miss == "" || strings.HasPrefix(note, unstabilisedSite)) {
			miss = note
		}
		if several != "" {
			est.Missing = append(est.Missing, severalStabilisers(several, site))
		}
		for range g.betaPolyhalo(i) { // bias.go
			est.Missing = append(est.Missing, Missing{
				Group: "HBI: " + betaPolyhaloSite, Approximation: "HBI: " + site,
				Note: "no increment for a site next to a CX3 or CX2 group; the increment of the site type is used, and the estimate is too low by several kcal/mol",
			})
		}
		if miss != "" {
			note := "no increment for this site; nearest site type used"
			switch miss {
			case arylthiylSite, dialkylHydrazinylSite:
				note = disputedIncrementNote
			case alkylHydrazinylSite:
				note = computedIncrementNote
			}
			est.Missing = append(est.Missing, Missing{
				Group: "HBI: " + miss, Approximation: "HBI: " + site,
				Note: note,
			})
		}
		if a.Radical > 1 {
			est.Missing = append(est.Missing, Missing{
				Group: fmt.Sprintf("HBI: %d unpaired electrons on one atom", a.Radical), Approximation: "HBI: " + site,
				Note: "the single-site increment is applied once per electron",
			})
		}
		if count[site] == 0 {
			order = append(order, site)
		}
		count[site] += a.Radical
	}
	slices.Sort(order) // canonical term order, whatever the atom order
	for _, site := range order {
		h, ok := l.hbi[site]
		if !ok {
			return &UnsupportedError{Reason: fmt.Sprintf("no hydrogen-bond increment is at hand for a radical site of type %s (%s)", site, noIncrementRoute)}
		}
		t := term(h.value, count[site])
		t.Name = "HBI: " + site
		est.Corrections = append(est.Corrections, t)
		if !h.hasSCp {
			est.Corrections = append(est.Corrections, lostModes(site, count[site]))
			est.Missing = append(est.Missing, Missing{
				Group:         "HBI dS, dCp: " + site,
				Approximation: siteModel,
				Note:          "no published entropy and heat-capacity increment at hand: the removed H's stretch and bends are taken out as harmonic oscillators, and at a planar centre the radical centre's inversion mode and changed internal rotors are added (a pyramidal CF2•-type centre keeps its parent's modes)",
			})
		}
	}
	if t, ok := siteChanges(m, g); ok {
		est.Corrections = append(est.Corrections, t)
	}
	return nil
}

// Statistical-mechanics changes at a radical site besides the lost X–H
// vibrations (lostModes), for sites without tabulated HBI entropy and heat
// capacity increments. Three effects, with typical values of the trade
// (common practice; magnitudes as discussed by Lay, Bozzelli, Dean & Ritter
// 1995 for their HBI derivation, numbers here from memory):
//
//   - Inversion: a non-conjugated carbon radical centre (alkyl,
//     α-hydroxy, α-alkoxy) is planar or nearly so, with a soft out-of-plane
//     (umbrella) vibration near inversionWavenumber where the sp3 parent
//     has a C–H bend near 1150 cm⁻¹; the bend is replaced by the umbrella
//     mode (harmonic oscillators), keeping the radical's mode count at
//     three below its parent's.
//   - Freed rotors: each single bond from such a centre to another carbon
//     was an internal rotor with a threefold barrier near 3 kcal/mol in the
//     parent and is nearly free next to the planar centre (barrier a few
//     tenths of a kcal/mol); a bond inside a ring is no rotor and frees
//     nothing (cyclohexyl and cyclopentyl keep only the umbrella mode).
//     Pitzer's hindered-rotor tables give S_free − S_hindered ≈ 1.0
//     cal/(mol K) at 298 K for a methyl-type top at V₀/RT ≈ 5 (freedRotorS), and the hindered rotor's Cp excess over
//     the free rotor (freedRotorCp) fades with temperature.
//   - Alkoxy: the O–H torsion of an alcohol parent is a nearly free rotor
//     (barrier ≈ 1.1 kcal/mol; reduced moment ≈ 0.67 amu·Å² gives a free-rotor
//     S of 4.2 and, with Pitzer's correction, ohRotorS ≈ 3.9 cal/(mol K)
//     without its symmetry number), not the stiff 300 cm⁻¹ torsion lostModes
//     removes for every O–H; the difference is removed here. Peroxy and
//     phenoxy parents (ROO–H, ArO–H) have stiff torsions (barriers of
//     several kcal/mol) and keep the harmonic treatment.
//   - Conjugation: at an allylic or benzylic site the bond to the π system
//     stops being a rotor (the barrier rises to 10–15 kcal/mol) and becomes
//     a torsion near inversionWavenumber: the parent's hindered-rotor S
//     (hinderedRotorS) and Cp (hinderedRotorCp) are removed and the torsion
//     added as a harmonic oscillator. Only a bond outside a ring counts: a
//     ring site conjugated through ring bonds only (cyclopentadienyl,
//     cyclopentenyl, the C-centred structure of pyrrolyl) is planar with
//     its ring in parent and radical alike, with no rotor to lose, no
//     torsion to gain and no inversion mode, so it has no change here
//     (the H atom's three modes are still taken out by lostModes). A
//     propargylic site is left alone: the methyl "rotor" of a C≡C–CH3 parent turns about the molecular axis and
//     is part of overall rotation, not an internal rotor.
//
// A pyramidal radical centre (two or more fluorines:
// molecule.Molecule.PyramidalRadical; CF3•, CHF2•, R–CF2•) has none of
// these: its umbrella mode stays stiff (inversion barriers of many
// kcal/mol) and its bonds keep their parent's hindered rotors, so
// siteChanges skips it, as the symmetry number counts it pyramidal (no
// planar flip). The α-fluoro centre (one F) is weakly pyramidal with a very
// low inversion barrier and counts as planar for σ; its increment has no
// site changes either (it is not an alkyl, α-hydroxy or α-alkoxy site).
//
// Spin degeneracy (R ln multiplicity) and the symmetry change (σ of the
// radical itself) are applied in Estimate.
const (
	inversionWavenumber = 500.0 // cm⁻¹
	freedRotorS         = 1.0   // cal/(mol K)
	hinderedRotorS      = 4.9   // cal/(mol K), methyl-type top, symmetry number excluded
	ohRotorS            = 3.9   // cal/(mol K), alcohol O–H torsion as a hindered rotor
)

var (
	// cal/(mol K) at StdTemps
	freedRotorCp    = [7]float64{0.5, 0.4, 0.3, 0.2, 0.1, 0, 0}
	hinderedRotorCp = [7]float64{2.0, 1.9, 1.7, 1.6, 1.4, 1.3, 1.1}
)

// siteChanges returns one correction with the inversion, freed-rotor and
// conjugation terms of every radical site of m (g is its parent), and false
// when there are none. The sites' changes are summed in a canonical order
// (sorted by value), so that the total does not depend on the atom order,
// not even in its last bit.
func siteChanges(m *molecule.Molecule, g *graph) (Term, bool) {
	var sites []siteDelta
	for i, a := range m.Atoms {
		if a.Radical != 1 || m.PyramidalRadical(i) {
			// A pyramidal centre (two or more fluorines) keeps a stiff
			// umbrella mode and its hindered rotors: no change here.
			continue
		}
		if d, ok := siteChange(g, i); ok {
			sites = append(sites, d)
		}
	}
	if len(sites) == 0 {
		return Term{}, false
	}
	slices.SortFunc(sites, func(x, y siteDelta) int {
		if c := cmp.Compare(x.s, y.s); c != 0 {
			return c
		}
		return slices.Compare(x.cp[:], y.cp[:])
	})
	t := Term{Name: "radical site: inversion and internal-rotor changes", Count: len(sites), Source: "statistical mechanics, typical frequencies and barriers (common practice; see radical.go)"}
	for _, d := range sites {
		t.S298 += d.s
		for c := range t.Cp {
			t.Cp[c] += d.cp[c]
		}
	}
	return t, true
}

// siteDelta is the entropy and Cp change (J/(mol K)) of one radical site.
type siteDelta struct {
	s  float64
	cp [7]float64
}

// siteChange returns the inversion, freed-rotor and conjugation change of
// radical site i (one unpaired electron) of parent graph g, and false for a
// site without one.
func siteChange(g *graph, i int) (siteDelta, bool) {
	var d siteDelta
	vib := func(sign float64) {
		d.s += sign * harmonicS(inversionWavenumber, t298)
		for i, T := range StdTemps {
			d.cp[i] += sign * harmonicCp(inversionWavenumber, T)
		}
	}
	bend := func(nu float64) { // remove one harmonic mode of wavenumber nu
		d.s -= harmonicS(nu, t298)
		for i, T := range StdTemps {
			d.cp[i] -= harmonicCp(nu, T)
		}
	}
	a := g.m.Atoms[i]
	site, _, _, err := siteOf(g, i)
	if err != nil {
		return d, false
	}
	if a.Element == "O" && site == "alkoxy" && len(g.nbr[i]) == 1 && g.typ[g.nbr[i][0]] == "C" {
		// Replace the stiff 300 cm⁻¹ torsion of lostModes by the
		// alcohol's nearly free O–H rotor.
		d.s += harmonicS(lostOH[2], t298) - ohRotorS*calorie
		return d, true
	}
	if dS, dCp, ok := heteroSiteChange(g, i, site); ok {
		d.s, d.cp = dS, dCp
		return d, true
	}
	if a.Element != "C" || g.typ[i] != "C" {
		return d, false
	}
	// rotor: a neighbour in the π system bonded by an open-chain bond, the
	// parent's internal rotor that the conjugation stiffens. A bond inside a ring is no rotor: a ring site
	// conjugated only through ring bonds (cyclopentadienyl, the 2H-pyrrolyl
	// structure of pyrrolyl, cyclohexenyl) is planar with its ring, so it
	// loses no rotor and gains no torsion (the H atom's own modes are
	// lostModes').
	rotor := false
	for k, j := range g.nbr[i] {
		switch g.typ[j] {
		case "Cd", "Ca", "Cb", "Cbf":
			if g.smallestRingThrough(g.nbrBond[i][k]) == 0 {
				rotor = true
			}
		}
	}
	if (site == "allylic" || site == "benzylic") && !rotor {
		// propargylic: no internal rotor changes; ring-conjugated:
		// none either (above)
		return d, false
	}
	switch site {
	case "primary", "secondary", "tertiary", "alpha-hydroxy", "alpha-alkoxy":
		if len(g.nbr[i]) == 0 {
			return d, false // methyl-type: no parent rotor, no sp3 skeleton
		}
		// The umbrella mode is one of the parent's bends at the centre
		// softened, not a new mode: lostModes already takes out the three
		// modes the H atom brings, so a C–H bend is replaced here (the
		// radical has 3N−6 modes, three fewer than its parent).
		vib(+1)
		bend(lostCH[2])
		for k, j := range g.nbr[i] {
			// a ring bond is no internal rotor: nothing to free
			if g.isCarbon(j) && g.order(g.nbrBond[i][k]) == 1 && len(g.nbr[j])+g.m.Atoms[j].HCount > 1 && g.smallestRingThrough(g.nbrBond[i][k]) == 0 {
				d.s += freedRotorS * calorie
				for c := range d.cp {
					d.cp[c] -= freedRotorCp[c] * calorie
				}
			}
		}
		return d, true
	case "allylic", "benzylic":
		vib(+1)
		d.s -= hinderedRotorS * calorie
		for c := range d.cp {
			d.cp[c] -= hinderedRotorCp[c] * calorie
		}
		return d, true
	}
	return d, false
}

// Wavenumbers (cm⁻¹) of the three vibrations an H atom brings to its heavy
// atom: one stretch and two bends. Typical values of the trade (common
// practice; C–H from alkane IR spectra, O–H from alcohols, the O–H torsion
// taken as a low harmonic mode).
var (
	lostCH = [3]float64{2950, 1450, 1150}
	lostOH = [3]float64{3650, 1250, 300}
)

// secondRadiation is hc/k in cm·K, the factor turning a wavenumber into a
// vibrational temperature (CODATA 2018).
const secondRadiation = 1.438776877

// lostModes is the entropy and heat-capacity change of removing the three
// vibrations of one hydrogen atom per radical site, each a harmonic
// oscillator of vibrational temperature θ = hc·ν̃/k:
//
//	ΔCp(T) = −R Σ x² eˣ/(eˣ−1)²,   ΔS(T) = −R Σ [x/(eˣ−1) − ln(1−e⁻ˣ)],   x = θ/T
//
// It stands in for the tabulated HBI S and Cp increments where none are at
// hand; ΔHf is unaffected (the HBI bond energy carries it).
func lostModes(site string, count int) Term {
	modes := lostCH
	switch site {
	case "alkoxy", "peroxy", "phenoxy":
		modes = lostOH
	}
	t := Term{Name: "radical site: lost X–H vibrations (" + site + ")", Count: count, Source: "harmonic oscillators (common practice)"}
	c := float64(count)
	for _, nu := range modes {
		t.S298 -= c * harmonicS(nu, t298)
		for i, T := range StdTemps {
			t.Cp[i] -= c * harmonicCp(nu, T)
		}
	}
	return t
}

// harmonicS is the entropy, J/(mol K), of one harmonic oscillator of
// wavenumber nu (cm⁻¹) at temperature T (K): R [x/(eˣ−1) − ln(1−e⁻ˣ)] with
// x = θ/T, θ = hc·ν̃/k (the Einstein function).
func harmonicS(nu, T float64) float64 {
	x := secondRadiation * nu / T
	return R * (x/math.Expm1(x) - math.Log(-math.Expm1(-x)))
}

// harmonicCp is the heat capacity, J/(mol K), of one harmonic oscillator of
// wavenumber nu (cm⁻¹) at temperature T (K): R x² eˣ/(eˣ−1)² (the Einstein
// function).
func harmonicCp(nu, T float64) float64 {
	x := secondRadiation * nu / T
	ex := math.Exp(x)
	return R * x * x * ex / ((ex - 1) * (ex - 1))
}
