package benson

import (
	_ "embed"
	"fmt"
	"slices"
	"strings"

	"kiln.dev/kiln/engine/molecule"
)

// Nitrogen beyond amines, amides and nitriles: nitro, nitrite and nitrate
// groups, aromatic nitrogen of azine rings (pyridine, pyrazine, pyrimidine),
// saturated nitrogen rings, and the nitrogen types that make azo, imine and
// nitroso compounds nameable (refused or missing, never estimated without
// their group). Values and sources in groups_n.tsv, ring corrections in
// corrections_n.tsv.
//
// Nitrogen atom types (graph.atomType asks nitrogenType):
//
//   - NO2: a nitro nitrogen, N(=O)=O. Both =O are implied partners (claimed by
//     the NO2 group, names.go impliedPartner), so the group has one written
//     neighbour: NO2-(C), NO2-(Cb), NO2-(O) (nitrate). The classic tables give
//     composite groups (the carbon, or the ester oxygen, together with its
//     NO2); they are split by the convention hetero.go uses for the nitrile:
//     C-(NO2)(X)… = C-(C)(X)…, O-(NO2)(C) = O-(C)2, NO2-(X) = the rest.
//   - NO: a nitroso nitrogen, X–N=O, with its =O implied: NO-(O) for a
//     nitrite ester, split from the composite O-(NO)(C) in the same way;
//     NO-(Cb) for nitrosoarenes, derived from nitrosobenzene with
//     Cb-(NO) = Cb-(N). Alkyl C-nitroso compounds have no group value
//     (NO-(C) is missing).
//   - Nb: the nitrogen of a six-membered aromatic ring of carbons and
//     nitrogens (pyridine-type: two ring neighbours, no H). Such a ring is
//     treated as benzenoid: its carbons are Cb with their ring neighbours
//     implied, and Nb, with no written neighbour at all, stands for "=N–" in
//     place of a Cb–H. A fused carbon next to Nb (quinoline) is
//     approximated as next to Cb, flagged.
//   - Nbb: an azine nitrogen next to another one (pyridazine, cinnoline,
//     1,2,4-triazine). The N–N interaction is large (pyridazine lies about
//     20 kcal/mol above pyrazine and pyrimidine; Pedley et al. 1986, from
//     memory) and no table gives it, so Nbb has no value: such species are
//     refused naming the group Nbb, which a `group` statement can supply.
//   - NA: an azo nitrogen (N=N), its =N partner implied as the =C of Cd:
//     NA-(C), NA-(Cb), each derived from one molecule (groups_n.tsv) with
//     C-(NA)(X) = C-(N)(X) and Cb-(NA) = Cb-(N), and flagged for it. The
//     groups describe trans azo compounds; an azo N written cis (C/N=N\C)
//     or in a ring is typed NAcis, which no group names: cis azo compounds
//     are refused (a cis isomer lies several kcal/mol above its trans
//     isomer and no cis correction is at hand). Unmarked open-chain azo
//     compounds are taken as trans.
//   - NI and CdN: the imine C=N. The imine carbon is typed CdN (imineCarbon:
//     a non-aromatic carbon whose one double bond goes to a two-coordinate,
//     non-aromatic, neutral N), never Cd, so no alkene group, cis term,
//     allylic site or alkene ring count ever applies to it; its =N partner
//     is implied (CdN-(C)(H)), as the imine N's =C partner is (NI-(C)).
//     Neighbours name them as ligands: C-(NI)(H)3, C-(CdN)(H)3. E/Z imines
//     are not told apart (the groups are those of the stable isomer).
//   - Naz, NazN (azole.go) are the "=N–" of five-membered aromatic azole
//     rings (imidazole, pyrazole, oxazole, thiazole). Nar, Nk: any other
//     aromatic ring "=N–" outside a benzenoid ring is Nar, and the N of a
//     cumulated C=N (ketenimine, isocyanate, carbodiimide) is Nk. Neither
//     is nameable: such species are refused, whichever spelling (Kekulé or
//     aromatic) is used.
//   - NC: the N⁺ of an isocyanide R–N⁺≡C⁻ in a neutral molecule, its ≡C⁻
//     (typed Cic, a ligand of no other group) implied as the ≡N of a nitrile
//     carbon is: NC-(C), derived from one molecule (groups_n.tsv), with
//     C-(NC)(X) = C-(C)(X) as for nitriles. An isocyanide is the one
//     charge-separated structure read as it is written (neutralIsocyanide).
//
// A nitro, nitrate or N-oxide unit written charge-separated (C[N+](=O)[O-],
// the usual SMILES) is read as the neutral pentavalent structure
// (CN(=O)=O) before anything else (neutralOxo): both spellings give the same
// graph, the same groups and the same symmetry number. So is a sulfoxide or
// sulfone written charge-separated (C[S+](C)[O-] as CS(C)=O). Any other
// formal charge is refused.

//go:embed groups_n.tsv
var groupsNTSV string

//go:embed corrections_n.tsv
var correctionsNTSV string

//go:embed hbi_n.tsv
var hbiNTSV string

// azineN reports whether atom a of m is a pyridine-type ring nitrogen:
// aromatic, neutral, no H, no radical, two neighbours.
func azineN(m *molecule.Molecule, a int) bool {
	at := m.Atoms[a]
	return at.Element == "N" && at.Aromatic && at.HCount == 0 && at.Charge == 0 && at.Radical == 0 && len(m.Adj[a]) == 2
}

// nitrogenType returns the Benson type of nitrogen atom i (see the file
// comment): Nb, NO2, NO, NA, NI, or N for amine-type (and nitrile) nitrogen.
func (g *graph) nitrogenType(i int) string {
	if g.m.Atoms[i].Charge == 1 && isocyanide(g.m, i) {
		return "NC" // R–N⁺≡C⁻: see the file comment
	}
	if g.benzAtom[i] > 0 {
		for _, j := range g.nbr[i] {
			if g.benzAtom[j] > 0 && azineN(g.m, j) {
				return "Nbb" // next to another ring N: no group value (see the file comment)
			}
		}
		return "Nb"
	}
	if t, ok := g.azoleNType(i); ok { // the "=N–" of an azole ring: azole.go
		return t
	}
	toO, toN, toC := 0, 0, 0
	for k, b := range g.nbrBond[i] {
		j := g.nbr[i][k]
		if g.order(b) != 2 {
			continue
		}
		switch g.m.Atoms[j].Element {
		case "O":
			if g.terminal(j) {
				toO++
			}
		case "N":
			toN++
		case "C":
			toC++
		}
	}
	deg := len(g.nbr[i]) + g.m.Atoms[i].HCount
	switch {
	case toO == 2 && toN == 0 && toC == 0 && deg == 3:
		return "NO2"
	case toO == 1 && toN == 0 && toC == 0 && deg == 2:
		return "NO"
	case toN == 1 && toO == 0 && toC == 0 && deg == 2:
		if g.cisAzo(i) {
			return "NAcis" // no group: see the file comment
		}
		return "NA"
	case toC == 1 && toO == 0 && toN == 0 && deg == 2:
		switch {
		case g.m.Atoms[i].Aromatic:
			return "Nar" // aromatic ring "=N–" outside azine and azole rings: no group (see the file comment)
		case !g.imineCarbon(g.partner(i, 2)):
			return "Nk" // cumulated C=N (ketenimine, isocyanate, carbodiimide): no group
		}
		return "NI"
	}
	return "N"
}

// imineCarbon reports whether atom i is the carbon of an open-chain or
// non-aromatic-ring imine C=N: a non-aromatic, neutral carbon whose only
// multiple bond is one double bond to a non-aromatic, neutral, two-coordinate
// nitrogen (C=NH, C=N–R) whose other bond is single. Such a carbon is typed
// CdN, never Cd (see the file comment).
func (g *graph) imineCarbon(i int) bool {
	if i < 0 || g.m.Atoms[i].Element != "C" || g.m.Atoms[i].Aromatic || g.m.Atoms[i].Charge != 0 || g.benzAtom[i] > 0 {
		return false
	}
	n, doubles := -1, 0
	for k, b := range g.nbrBond[i] {
		switch g.order(b) {
		case 1:
		case 2:
			doubles++
			if j := g.nbr[i][k]; g.m.Atoms[j].Element == "N" {
				n = j
			}
		default:
			return false
		}
	}
	if doubles != 1 || n < 0 {
		return false
	}
	a := g.m.Atoms[n]
	if a.Aromatic || a.Charge != 0 || len(g.nbr[n])+a.HCount != 2 {
		return false
	}
	for _, b := range g.nbrBond[n] {
		if o := g.order(b); o != 1 && b != g.bondBetween(i, n) {
			return false
		}
	}
	return true
}

// cisAzo reports whether azo nitrogen i (N=N) is cis: the N=N lies in a
// ring (cyclic azo compounds, 1-pyrazolines, are cis), or both nitrogens
// carry a heavy substituent and the / \ marks put them on the same side.
// Unmarked open-chain azo compounds are taken as trans, the stable isomer
// the azo groups describe.
func (g *graph) cisAzo(i int) bool {
	j := g.partner(i, 2)
	if j >= 0 && g.ringBond[g.bondBetween(i, j)] {
		return true
	}
	if j < 0 || len(g.ligands(i, j)) != 1 || len(g.ligands(j, i)) != 1 {
		return false
	}
	si, oki := g.sides(i, j)
	sj, okj := g.sides(j, i)
	return oki && okj && si[0] == sj[0]
}

// impliedTerminal reports whether neighbour k of centre i is a terminal
// atom that the centre type stands for (the =O pair of NO2, the =O of CO),
// and so is not written as a ligand.
func (g *graph) impliedTerminal(i, k int, centre string) bool {
	if centre != "NO2" && centre != "NO" {
		return false // other centres skip their one partner in groupOf
	}
	p, ok := impliedPartner[centre]
	j := g.nbr[i][k]
	return ok && g.order(g.nbrBond[i][k]) >= 2 && g.m.Atoms[j].Element == p && g.terminal(j)
}

// neutralOxo returns m with its charge-separated N⁺–O⁻ and S⁺–O⁻ units
// written as N=O and S=O (molecule.NeutralOxo), the neutral structures the
// nitro, nitrate, sulfoxide and sulfone groups describe.
func neutralOxo(m *molecule.Molecule) *molecule.Molecule { return m.NeutralOxo() }

// isocyanide reports whether atom i of m is the N⁺ or the terminal C⁻ of an
// isocyanide group, R–N⁺≡C⁻.
func isocyanide(m *molecule.Molecule, i int) bool {
	n, c := -1, -1
	switch a := m.Atoms[i]; {
	case a.Element == "N" && a.Charge == 1:
		n = i
	case a.Element == "C" && a.Charge == -1:
		c = i
	default:
		return false
	}
	for _, b := range m.Bonds {
		if b.Order != 3 {
			continue
		}
		j := -1
		switch i {
		case b.A:
			j = b.B
		case b.B:
			j = b.A
		default:
			continue
		}
		if n < 0 {
			n = j
		} else {
			c = j
		}
	}
	if n < 0 || c < 0 || m.Atoms[n].Element != "N" || m.Atoms[n].Charge != 1 || m.Atoms[c].Element != "C" || m.Atoms[c].Charge != -1 {
		return false
	}
	return len(m.Adj[c]) == 1 && m.Atoms[c].HCount == 0 && len(m.Adj[n]) == 2
}

// netCharge is the sum of the formal charges of m's atoms.
func netCharge(m *molecule.Molecule) int {
	net := 0
	for _, a := range m.Atoms {
		net += a.Charge
	}
	return net
}

// neutralIsocyanide reports whether atom i of m is the N⁺ or the ≡C⁻ of an
// isocyanide group in a neutral molecule: charges the NC groups describe
// (typed NC and Cic), not a charge-separated structure to refuse.
func neutralIsocyanide(m *molecule.Molecule, i int) bool {
	return isocyanide(m, i) && netCharge(m) == 0
}

// chargeRefusal explains why charged atom i of m is refused: an ion (net
// charge) or a charge-separated structure other than the N⁺–O⁻ and
// S⁺–O⁻ units neutralOxo rewrites and the isocyanide R–N⁺≡C⁻.
func chargeRefusal(m *molecule.Molecule, i int) error {
	net := netCharge(m)
	a := m.Atoms[i]
	if net != 0 {
		return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) has charge %+d and the species has net charge %+d: ions are outside group additivity", a.Element, a.Charge, net)}
	}
	return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) has charge %+d in a neutral charge-separated structure that no group describes (only a non-aromatic N⁺ with a terminal O⁻ and a terminal =O, as in nitro and nitrate groups, is read as N(=O)=O, and an S⁺ or S²⁺ with as many terminal O⁻, as in sulfoxides and sulfones, as S=O; amine oxides and nitrones have no groups)", a.Element, a.Charge)}
}

// addAzineFlags handles substituents on a ring carbon next to Nb (the
// 2-position of pyridine): an alkyl substituent there takes the correction
// nni:azine-alpha-alkyl of corrections_n.tsv (the Cb-(C) group is that of
// benzene, and the published azine groups put an alkyl group next to the
// ring N 1.7 kcal/mol lower); any other substituent there is flagged, its
// benzene group being used.
func addAzineFlags(g *graph, l lookup, est *Result) {
	addTableMarkFlags(l, est)
	if _, user := l.user["Nb"]; user {
		return
	}
	alkyl := 0
	var other []string
	for n := range g.m.Atoms {
		if g.typ[n] != "Nb" {
			continue
		}
		for _, c := range g.nbr[n] {
			s := g.substituent(c)
			switch {
			case s < 0:
			case g.typ[s] == "C":
				alkyl++
			default:
				other = append(other, "Cb-("+g.typ[s]+")")
			}
		}
	}
	if alkyl > 0 {
		t := term(l.corrections["nni:azine-alpha-alkyl"], alkyl)
		t.Name = "alkyl next to ring N"
		est.Corrections = append(est.Corrections, t)
	}
	for _, o := range other {
		est.Missing = append(est.Missing, Missing{
			Group:         o + " next to a ring N",
			Approximation: o + " of benzene",
			Note:          "no group for this substituent next to an azine nitrogen; the benzene group is used (the published azine groups differ from the benzene ones by up to about 2.5 kcal/mol)",
		})
	}
}

// Marks in the source column of groups_n.tsv that make every estimate
// using the group flagged (addTableMarkFlags):
//
//   - analogSCpMark: no S° or Cp of any molecule with the group was at
//     hand; they are those of the analogous group the source names. ΔHf° is
//     not affected (an entropy-only flag, class.go entropyOnly).
//   - oneMoleculeMark: ΔHf° derived from a single molecule with a
//     convention for its neighbours, not checked against a second
//     molecule of the class: the estimate's ΔHf° uncertainty is widened as
//     for a stand-in group (widenGroup, class.go).
const (
	analogSCpMark   = "S and Cp by analogy (flagged)"
	oneMoleculeMark = "from one molecule (flagged)"
)

// analogSCpGroup prefixes the flag of a group whose S° and Cp are carried
// over from an analogous group (analogSCpMark).
const analogSCpGroup = "S, Cp by analogy: "

// oneMoleculeNote ends the Approximation of the flag of a group derived
// from one molecule (oneMoleculeMark).
const oneMoleculeNote = " (derived from one molecule)"

// addTableMarkFlags flags the groups and corrections of est whose
// built-in value carries analogSCpMark or oneMoleculeMark in its source (a group the user supplied
// carries its own). One flag per group and mark.
func addTableMarkFlags(l lookup, est *Result) {
	for _, t := range slices.Concat(est.Groups, est.Corrections) {
		// The marks belong to the value used: for a stand-in
		// ("NC-(Cb) ≈ NC-(C)") that of the group after "≈".
		name, used, standIn := strings.Cut(t.Name, " ≈ ")
		if standIn {
			name = used
		}
		if _, user := l.user[name]; user {
			continue
		}
		if strings.Contains(t.Source, oneMoleculeMark) {
			est.Missing = append(est.Missing, Missing{
				Group:         name,
				Approximation: name + oneMoleculeNote,
				Note:          "ΔHf° rests on one molecule and a convention for its neighbours; source: " + t.Source,
			})
		}
		if strings.Contains(t.Source, analogSCpMark) {
			est.Missing = append(est.Missing, Missing{
				Group:         analogSCpGroup + name,
				Approximation: "S° and Cp of an analogous group",
				Note:          "no S° or Cp of a molecule with this group is at hand; ΔHf° is not affected; source: " + t.Source,
			})
		}
	}
}

// nitrogenRingKey names the ring correction of a ring whose only
// heteroatom is one amine-type nitrogen: saturated (aziridine … piperidine)
// or the pyrrole ring (five aromatic members, two double bonds: pyrrole,
// 1-alkylpyrroles; not fused to a benzene ring); "" for any other ring.
func (g *graph) nitrogenRingKey(r []int, nd, aromatic int) string {
	if !g.oneHeteroatom(r, "N") {
		return ""
	}
	if len(r) == 5 && nd == 2 && aromatic == 5 {
		if g.fusedToBenzene(r) {
			return "" // fused to a benzene ring (indole, carbazole): not the ring the correction was derived from
		}
		return "pyrrole"
	}
	if nd != 0 {
		return ""
	}
	return map[int]string{3: "aziridine", 4: "azetidine", 5: "pyrrolidine", 6: "piperidine"}[len(r)]
}

// oneHeteroatom reports whether ring r holds carbons and exactly one atom
// of element el, of the plain type el (an amine N, a divalent S).
func (g *graph) oneHeteroatom(r []int, el string) bool {
	n := 0
	for _, a := range r {
		switch g.m.Atoms[a].Element {
		case "C":
		case el:
			if g.typ[a] != el {
				return false
			}
			n++
		default:
			return false
		}
	}
	return n == 1
}

// typeNote describes an atom type that no table has and no user group can
// name (as a centre or as a neighbour), for the refusal message; "" for
// others.
func typeNote(centre string) string {
	switch centre {
	case "NazN":
		return azoleNazNNote // azole.go
	case "Nar":
		return " (an aromatic ring nitrogen \"=N–\" outside six-membered azine and five-membered azole rings: no group value and no ring correction for its ring is at hand)"
	case "Nk":
		return " (the nitrogen of a cumulated C=N, as in ketenimines, isocyanates and carbodiimides: no group value is at hand)"
	case "NAcis":
		return " (a cis azo nitrogen: the azo groups describe trans azo compounds and no cis correction is at hand — a cis isomer lies several kcal/mol above its trans isomer; give the species a thermo block)"
	}
	return ""
}

// nitrogenSite classifies N-centred radical site i (g is the parent graph,
// where the N carries its H back). Increments (hbi_nsx.tsv, hbi_n.tsv):
//
//   - aminyl: R–NH•, one sp3 carbon neighbour (CH3NH–H).
//   - dialkylaminyl: R2N•, two sp3 carbon neighbours ((CH3)2N–H 94.3 from
//     a published radical enthalpy, with which computed values agree).
//   - anilino: Ar–NH•, one benzene-ring neighbour (C6H5NH–H). With a further
//     neighbour (N-alkyl or N-aryl anilino, Ar–N•–R) the C6H5NH–H increment
//     is used and flagged (substitutedAnilinoSite): a substituent on the N
//     lowers the N–H bond as it does from CH3NH–H to (CH3)2N–H.
//   - iminyl: R2C=N• (H2C=N–H, 87.9 kcal/mol).
//   - hydrazinyl: an N• bonded to an amine N with only H or alkyl groups on
//     either N (hydrazinylSite: H2N–NH–H 83.1, computed values for the
//     alkylated sites, flagged).
//
// Every other N site has no increment at hand and is given a site name with
// no row in the HBI tables, so the estimate is refused naming it (addHBI):
//
//   - diazenyl (R–N=N•): no R–N=N–H bond enthalpy at hand.
//   - hydrazinyl sites with any other neighbour (aryl, vinyl, acyl, a hetero
//     atom) or bonded to a non-amine N: the lone pair of the neighbouring N
//     weakens the N–H bond by some 17 kcal/mol against CH3NH–H, and no
//     increment measures the further change such a group brings.
//   - oxyaminyl (an N• bonded to O: HO–NH•, RO–NR•) and thioaminyl (bonded
//     to S), haloaminyl (bonded to a halogen): no increment, and the
//     heteroatom's lone pair changes the N–H bond strength by an amount of
//     the size of the hydrazinyl case.
//   - amidyl (next to a C=O: R–C(=O)–NH•): amide N–H bonds are several
//     kcal/mol stronger than amine ones (from memory); no increment at hand.
//   - an N• next to any other unsaturated or hetero neighbour (vinyl, a
//     nitrile or alkyne carbon, an imine carbon, a nitro N …) and the bare
//     NH2• (H2N–H is 107.6 kcal/mol, not 100; NH2 is a reference-library
//     species): no increment at hand. A vinyl-type site is still estimated
//     through its other resonance structure (•C–C=N, aza-allyl) when that
//     one has its groups.
func nitrogenSite(g *graph, i int) (site, missing string) {
	switch g.typ[i] {
	case "NI", "NA":
		return map[string]string{"NI": "iminyl", "NA": "diazenyl"}[g.typ[i]], ""
	}
	if len(g.nbr[i]) == 0 {
		return "amidogen (NH2•)", ""
	}
	for _, j := range g.nbr[i] {
		if g.m.Atoms[j].Element == "N" {
			return hydrazinylSite(g, i)
		}
	}
	alkyl, aryl := 0, 0
	for _, j := range g.nbr[i] {
		switch t := g.typ[j]; {
		case t == "C":
			alkyl++
		case t == "Cb" || t == "Cbf":
			aryl++
		case t == "CO":
			return "amidyl (N• next to C=O)", ""
		case g.m.Atoms[j].Element == "O":
			return "oxyaminyl (N• bonded to O)", ""
		case g.m.Atoms[j].Element == "S":
			return "thioaminyl (N• bonded to S)", ""
		case g.m.Atoms[j].Element != "C":
			return "haloaminyl (N• bonded to " + g.m.Atoms[j].Element + ")", ""
		default:
			return "aminyl next to a " + t + " carbon", ""
		}
	}
	switch {
	case aryl == 1 && alkyl == 0:
		return "anilino", ""
	case aryl > 0:
		return "anilino", substitutedAnilinoSite
	case alkyl == 1:
		return "aminyl", ""
	}
	return "dialkylaminyl", ""
}

// hydrazinylSite classifies an N• site i bonded to an N (a hydrazine N–N
// when that N is amine-type). The increments (hbi_n.tsv) come from three
// molecules:
//
//   - hydrazinyl, H2N–NH–H (the library's N2H4 and N2H3): a site whose N
//     and other N carry only H;
//   - N′,N′-dialkylhydrazinyl, (CH3)2N–NH–H from one computed (G3B3) pair,
//     79.4, against 70.0 from a published radical enthalpy of Bozzelli &
//     Ritter: used for an NH• site whose other N carries alkyl groups,
//     flagged (dialkylHydrazinylSite) and widened by that disagreement;
//   - N-alkylhydrazinyl, CH3N(–H)–NH2 from one computed (G3B3) pair whose
//     parent lies 3.5 kcal/mol above the handbook's methylhydrazine: used
//     for an N• site that carries an alkyl group, flagged
//     (alkylHydrazinylSite), more widely when the other N is substituted.
//
// Any other neighbour of either N (aryl, vinyl, acyl, a hetero atom), a
// second N neighbour, or a non-amine N has no increment at hand: the site
// is named without a row, so the estimate is refused naming it.
func hydrazinylSite(g *graph, i int) (site, missing string) {
	const refused = "hydrazinyl (N• bonded to N)"
	j, alkyl := -1, 0
	for _, k := range g.nbr[i] {
		switch {
		case g.m.Atoms[k].Element == "N":
			if j >= 0 || g.typ[k] != "N" {
				return refused, ""
			}
			j = k
		case g.typ[k] == "C":
			alkyl++
		case g.typ[k] == "Cb" || g.typ[k] == "Cbf":
			return refused + " next to an aryl ring", ""
		default:
			return refused + " next to a " + g.typ[k] + " " + g.m.Atoms[k].Element, ""
		}
	}
	far := 0 // carbon substituents of the other N
	for _, k := range g.nbr[j] {
		if k == i {
			continue
		}
		if g.typ[k] != "C" {
			return refused + " next to an N bearing " + g.typ[k], ""
		}
		far++
	}
	switch {
	case alkyl > 0 && far == 0:
		return "N-alkylhydrazinyl", alkylHydrazinylSite
	case alkyl > 0:
		return "N-alkylhydrazinyl", substitutedHydrazinylSite
	case far == 0:
		return "hydrazinyl", ""
	}
	return "N',N'-dialkylhydrazinyl", dialkylHydrazinylSite
}

// Flags of the hydrazinyl sites whose increment rests on one computed pair
// (hydrazinylSite); class.go widens each.
const (
	// alkylHydrazinylSite: R–N•–NH2, the CH3N(–H)–NH2 increment.
	alkylHydrazinylSite = "N-alkylhydrazinyl radical site (R–N•–NH2): increment from one computed (G3B3) pair whose parent lies 3.5 kcal/mol above the handbook value"
	// substitutedHydrazinylSite: R–N•–NHR′, R–N•–NR′2, the same increment;
	// alkyl groups on the other N lower D(N–H) further (by 3.7 kcal/mol from
	// H2N–NH–H to (CH3)2N–NH–H, hbi_n.tsv).
	substitutedHydrazinylSite = "N-alkylhydrazinyl radical site whose other N is substituted: CH3N(–H)–NH2 increment (one computed pair) used; substituents on the other N lower D(N–H) by several kcal/mol"
	// dialkylHydrazinylSite: RNH–NH•, R2N–NH•, the (CH3)2N–NH–H increment,
	// whose computed and published values disagree by 9.4 kcal/mol.
	dialkylHydrazinylSite = "hydrazinyl radical site next to an alkylated N (R2N–NH•, RNH–NH•): computed and published (CH3)2N–NH–H bond enthalpies disagree by 9.4 kcal/mol"
)

// substitutedAnilinoSite flags an anilino site whose N carries a further
// substituent (Ar–N•–R): the C6H5NH–H increment is used, and the
// substituent lowers D(N–H) by about as much as from CH3NH–H to (CH3)2N–H
// (5–8.5 kcal/mol); class.go widens the uncertainty by widenSubstitutedNSite.
const substitutedAnilinoSite = "N-substituted anilino radical site (Ar–N•–R): C6H5NH–H increment used; the N substituent lowers D(N–H) by several kcal/mol"

// nitrogenSiteNote names the approximation made for a carbon radical site
// whose increment was measured without the nitrogen group next to it: a
// site on or next to an azine ring (the benzene increments are used), next
// to a nitro, nitroso or azo nitrogen (the alkyl increment is used), or next
// to the ester oxygen of a nitrate or nitrite (the α-alkoxy increment is
// used). "" when none applies.
func nitrogenSiteNote(g *graph, i int, site string) string {
	if g.m.Atoms[i].Element != "C" {
		return ""
	}
	switch site {
	case iminoylSite:
		return "" // on the imine carbon itself: its own increment (radical.go)
	case "phenyl":
		if g.inAzineRing(i) {
			return "radical site on an azine ring carbon (benzene increment used)"
		}
		return ""
	case "benzylic":
		for _, j := range g.nbr[i] {
			if g.typ[j] == "Cb" && g.inAzineRing(j) {
				return "radical site next to an azine ring (benzylic increment used)"
			}
		}
		return ""
	case "alpha-amino":
		// The increment was measured next to an amine N, whose lone pair
		// stabilises the site; an amide N or a pyrrole-type ring N shares
		// its lone pair with the C=O or the ring.
		for _, j := range g.nbr[i] {
			if g.typ[j] != "N" {
				continue
			}
			if g.m.Atoms[j].Aromatic {
				return "radical site next to a pyrrole-type ring N (α-amino increment used)"
			}
			for _, k := range g.nbr[j] {
				if g.typ[k] == "CO" {
					return "radical site next to an amide N (α-amino increment used)"
				}
			}
		}
		return ""
	}
	for _, j := range g.nbr[i] {
		switch g.typ[j] {
		case "CdN", "NI":
			// An aza-allyl site (•C–C=N, •C–N=C), delocalised as an
			// allyl radical is: flagged as a stabilised site without its
			// increment (widened as such, class.go).
			return unstabilisedSite + "next to an imine C=N"
		case "NO2", "NO", "NA":
			return "radical site next to a " + g.typ[j] + " nitrogen (alkyl increment used)"
		case "O":
			for _, k := range g.nbr[j] {
				if t := g.typ[k]; t == "NO2" || t == "NO" {
					return "radical site next to the O of a nitrate or nitrite ester (α-alkoxy increment used)"
				}
			}
		}
	}
	return ""
}

// inAzineRing reports whether atom a lies in a benzenoid ring that holds an
// azine nitrogen.
func (g *graph) inAzineRing(a int) bool {
	for ri, r := range g.rings {
		if !g.benzRing[ri] {
			continue
		}
		has, hasN := false, false
		for _, x := range r {
			has = has || x == a
			hasN = hasN || g.typ[x] == "Nb" || g.typ[x] == "Nbb"
		}
		if has && hasN {
			return true
		}
	}
	return false
}

// noStandIn reports whether neighbour type lig of a centre must not be
// replaced by its relative when a group is approximated. An acyl group on
// nitrogen (amide N) is not like an alkyl group: the tables' own amide and
// amine groups differ by about 20 kcal/mol (N-(CO)(H)2 −14.9 against
// N-(C)(H)2 +4.8, Benson 1976 Table A.3, groups_nsx.tsv), so an amide
// nitrogen group without a value (N-(CO)(C)2 of N,N-dialkylamides) is
// refused, naming it, rather than estimated as an amine nitrogen. Nor is
// an O neighbour of an O centre like a C one: the peroxide groups already
// differ from the ether groups by some 18 kcal/mol (O-(O)(C) −4.5 against
// O-(C)2 −23.2, groups.tsv), and a third O in a row (trioxides, ozone
// written as a chain) is less stable again, so the middle O of O–O–O,
// O-(O)2, is refused, naming it: its O→C stand-in put HOOOH below HOOH.
func noStandIn(centre, lig string) bool {
	return centre == "N" && lig == "CO" || centre == "O" && lig == "O"
}

// isocyanideCarbene reports whether atom i of m is a terminal carbon with two
// unpaired electrons double-bonded to a neutral nitrogen that has one other
// neighbour: R–N=C:, the carbene spelling of an isocyanide.
func isocyanideCarbene(m *molecule.Molecule, i int) bool {
	a := m.Atoms[i]
	if a.Element != "C" || a.Radical != 2 || a.HCount != 0 || a.Charge != 0 || len(m.Adj[i]) != 1 {
		return false
	}
	b := m.Adj[i][0]
	n := m.Other(b, i)
	return m.Bonds[b].Order == 2 && m.Atoms[n].Element == "N" && m.Atoms[n].Charge == 0 && len(m.Adj[n])+m.Atoms[n].HCount == 2
}
