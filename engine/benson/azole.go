package benson

import (
	_ "embed"
	"slices"
)

// Azoles: five-membered aromatic rings with one donor atom (an N–H or
// N–R, O or S, which gives the ring two π electrons) and one or more
// "=N–" ring nitrogens (imidazole, pyrazole, oxazole, thiazole,
// 1,2,4-triazole).
//
// The ring is typed from its Kekulé structure, as pyrrole, furan and
// thiophene are (kekule.go): the carbons are Cd, the donor is N, O or S,
// and a "=N–" (aromatic, neutral, no H, two ring neighbours, not in a
// benzenoid ring) is Naz, a centre whose double-bond partner is implied,
// like the =C of Cd, so its group names its one other ring neighbour:
// Naz-(Cd), Naz-(N). Naz stands for "=N–" in place of a ring Cd–H, as the
// azine nitrogen Nb does for a Cb–H; the groups of its ring neighbours are
// those next to a Cd by convention (groups_azole.tsv). The ring takes the
// correction of its parent ring with the same donor (azoleRingKey); the
// Naz values were derived with the pyrrole correction from imidazole and
// pyrazole (groups_azole.tsv), so an azole ring with an O donor (oxazole)
// transfers them, and one with an S donor (thiazole) transfers them
// untested and is flagged (addAzoleFlags).
//
// Not covered, refused naming what is missing: a "=N–" double-bonded to
// another ring nitrogen in the Kekulé structure (NazN: 1H-1,2,3-triazole,
// tetrazoles), whose N=N ring term no train molecule or table gives; a
// "=N–" next to the donor O or S (isoxazole, isothiazole: Naz-(O),
// Naz-(S)) or next to another "=N–" (1,3,4-oxadiazole: Naz-(Naz)); azoles
// fused to a benzene ring (benzimidazole: Cb-(Naz)).

//go:embed groups_azole.tsv
var groupsAzoleTSV string

// azoleNType returns the type of nitrogen atom i when it is the "=N–" of
// an azole ring (see the file comment): Naz when its Kekulé double bond
// goes to a carbon, NazN when it goes to another nitrogen; false for any
// other nitrogen.
func (g *graph) azoleNType(i int) (string, bool) {
	a := g.m.Atoms[i]
	if a.Element != "N" || !a.Aromatic || a.HCount != 0 || a.Charge != 0 || a.Radical != 0 || len(g.nbr[i]) != 2 || g.benzAtom[i] > 0 {
		return "", false
	}
	inFive := slices.ContainsFunc(g.rings, func(r []int) bool {
		return len(r) == 5 && slices.Contains(r, i) && !slices.ContainsFunc(r, func(x int) bool { return !g.m.Atoms[x].Aromatic })
	})
	if !inFive {
		return "", false
	}
	switch p := g.partner(i, 2); {
	case p < 0:
		return "", false
	case g.m.Atoms[p].Element == "N":
		return "NazN", true
	}
	return "Naz", true
}

// azoleNazNNote explains the refusal of an NazN centre (typeNote, hetero_n.go).
const azoleNazNNote = " (an azole ring nitrogen double-bonded to another ring nitrogen, as in 1H-1,2,3-triazole and tetrazoles: kiln's azole groups were derived on rings whose \"=N–\" is double-bonded to carbon, and no table or train molecule gives the N=N ring term)"

// azoleRingKey names the ring correction of an azole ring r (five aromatic
// members, two double bonds, at least one Naz, exactly one donor atom
// N, O or S, the others carbon; not fused to a benzene ring): the parent
// ring of its donor, pyrrole, furan or thiophene. "" for any other ring.
func (g *graph) azoleRingKey(r []int, nd, aromatic int) string {
	if len(r) != 5 || nd != 2 || aromatic != 5 || g.fusedToBenzene(r) {
		return ""
	}
	naz, donor := 0, ""
	for _, a := range r {
		switch t := g.typ[a]; t {
		case "Naz":
			naz++
		case "Cd":
		case "N", "O", "S":
			if donor != "" {
				return ""
			}
			donor = t
		default:
			return ""
		}
	}
	if naz == 0 {
		return ""
	}
	return map[string]string{"N": "pyrrole", "O": "furan", "S": "thiophene"}[donor]
}

// thiazoleGroup names the flag of an azole ring with an S donor
// (addAzoleFlags).
const thiazoleGroup = "Naz in a ring with an S donor (thiazole type)"

// addAzoleFlags flags an estimate with an azole ring whose donor is S: the
// Naz values were derived on N-donor rings (imidazole, pyrazole) and are
// used on it untested. A user group for any Naz group of the estimate
// removes the flag.
func addAzoleFlags(g *graph, l lookup, est *Result) {
	for _, t := range est.Groups {
		if _, user := l.user[t.Name]; user && len(t.Name) > 3 && t.Name[:3] == "Naz" {
			return
		}
	}
	for _, r := range g.rings {
		nd, aromatic := 0, 0
		for k, a := range r {
			if g.m.Atoms[a].Aromatic {
				aromatic++
			}
			if o := g.order(g.bondBetween(a, r[(k+1)%len(r)])); o == 2 || o == 4 {
				nd++
			}
		}
		if g.azoleRingKey(r, nd, aromatic) == "thiophene" {
			est.Missing = append(est.Missing, Missing{
				Group:         thiazoleGroup,
				Approximation: "Naz groups derived on imidazole and pyrazole, with the thiophene ring correction",
				Note:          "no thiazole-type molecule was used or tested for the azole nitrogen groups; thiazole itself comes out about 7.7 kcal/mol low",
			})
			return
		}
	}
}
