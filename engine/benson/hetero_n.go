package benson

import (
	_ "embed"
	"fmt"

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
//     nitrite ester, split from the composite O-(NO)(C) in the same way.
//     C-nitroso compounds have no group value (NO-(C) is missing).
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
//   - NA: an azo nitrogen (N=N), its =N partner implied as the =C of Cd.
//     No azo group value is at hand: such species are refused naming the
//     group (a `group` statement makes them estimable).
//   - NI: an imine nitrogen (C=N). The imine carbon would be typed as an
//     alkene carbon, so NI is deliberately not a nameable centre: imines are
//     refused, never estimated with the C=N taken as C=C.
//
// A nitro, nitrate or N-oxide unit written charge-separated (C[N+](=O)[O-],
// the usual SMILES) is read as the neutral pentavalent structure
// (CN(=O)=O) before anything else (neutralNO): both spellings give the same
// graph, the same groups and the same symmetry number. Any other formal
// charge is refused.

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
		return "NA"
	case toC == 1 && toO == 0 && toN == 0 && deg == 2:
		return "NI"
	}
	return "N"
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

// neutralNO returns m with its charge-separated N⁺–O⁻ units written as
// N=O (molecule.NeutralNO), the pentavalent neutral structure the nitro and
// nitrate groups describe.
func neutralNO(m *molecule.Molecule) *molecule.Molecule { return m.NeutralNO() }

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

// chargeRefusal explains why charged atom i of m is refused: an ion (net
// charge) or a charge-separated structure other than the N⁺–O⁻ units
// neutralNO rewrites.
func chargeRefusal(m *molecule.Molecule, i int) error {
	net := 0
	for _, a := range m.Atoms {
		net += a.Charge
	}
	a := m.Atoms[i]
	if net == 0 && isocyanide(m, i) {
		return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) belongs to an isocyanide group, R–N⁺≡C⁻: no group value for isocyanides is at hand", a.Element)}
	}
	if net != 0 {
		return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) has charge %+d and the species has net charge %+d: ions are outside group additivity", a.Element, a.Charge, net)}
	}
	return &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf("(%s) has charge %+d in a neutral charge-separated structure that no group describes (only a non-aromatic N⁺ with a terminal O⁻ and a terminal =O, as in nitro and nitrate groups, is read as N(=O)=O; amine oxides and nitrones have no groups)", a.Element, a.Charge)}
}

// addAzineFlags handles substituents on a ring carbon next to Nb (the
// 2-position of pyridine): an alkyl substituent there takes the correction
// nni:azine-alpha-alkyl of corrections_n.tsv (the Cb-(C) group is that of
// benzene, and the published azine groups put an alkyl group next to the
// ring N 1.7 kcal/mol lower); any other substituent there is flagged, its
// benzene group being used.
func addAzineFlags(g *graph, l lookup, est *Result) {
	addPyrroleFlag(l, est)
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

// pyrroleEntropyGroup names the flag of the pyrrole ring correction's S°
// and Cp, which are carried over from furan (corrections_n.tsv): ΔHf° is
// not approximated by it, so uncertainty (class.go) does not widen ΔHf°.
const pyrroleEntropyGroup = "ring S, Cp: pyrrole"

// addPyrroleFlag flags the S° and Cp of an estimate that took the pyrrole
// ring correction (unless a group statement supplies ring:pyrrole): no S° or
// Cp of a pyrrole was used to obtain it, and the aromatic five-membered rings
// at hand disagree by several cal/(mol K) when carried over (with kiln's
// groups: furan's correction, derived from furan's S° and Cp, gives pyrrole
// 1.4 cal/(mol K) above the handbook S°, thiophene's 5.7 below).
func addPyrroleFlag(l lookup, est *Result) {
	if _, user := l.user["ring:pyrrole"]; user {
		return
	}
	for _, c := range est.Corrections {
		if c.Name == "ring strain: pyrrole" {
			est.Missing = append(est.Missing, Missing{
				Group:         pyrroleEntropyGroup,
				Approximation: "S and Cp of the furan ring correction",
				Note:          "no S° or Cp of a pyrrole ring correction is at hand; ΔHf° is not affected, S° is uncertain by several cal/(mol K)",
			})
			return
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

// typeNote describes a centre type that no table has and no user group can
// name, for the refusal message; "" for others.
func (g *graph) typeNote(i int, centre string) string {
	if n := g.azoleNote(centre); n != "" { // azole.go
		return n
	}
	if centre == "NI" && g.m.Atoms[i].Aromatic {
		return " (an aromatic ring nitrogen \"=N–\" outside six-membered azine and five-membered azole rings: no group value and no ring correction for its ring is at hand)"
	}
	if centre == "NI" {
		return " (an imine nitrogen, C=N: kiln's tables have no imine groups — the published imine-N values go with imine-carbon groups of their own, which the group notation cannot tell from an alkene carbon's)"
	}
	return ""
}

// nitrogenSite classifies the N-centred radical sites that have their own
// increment in hbi_n.tsv: anilino (C6H5NH•, an NH next to a benzene ring).
// Other N sites take the aminyl increment (hetero.go, heteroSite).
func nitrogenSite(g *graph, i, carbons int) (string, bool) {
	if carbons == 1 && len(g.nbr[i]) == 1 && g.typ[g.nbr[i][0]] == "Cb" { // g is the parent graph: the N carries NH2 there
		return "anilino", true
	}
	return "", false
}

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
// refused, naming it, rather than estimated as an amine nitrogen.
func noStandIn(centre, lig string) bool {
	return centre == "N" && lig == "CO"
}
