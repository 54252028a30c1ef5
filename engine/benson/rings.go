package benson

import (
	"fmt"
	"slices"
	"strings"

	"kiln.dev/kiln/internal/wording"
)

// carboFewer names the known all-carbon ring of size n with the most double
// bonds up to nd (cyclobutadiene → cyclobutene), or "".
func carboFewer(n, nd int) string {
	names := map[int][]string{
		3: {"cyclopropane", "cyclopropene"},
		4: {"cyclobutane", "cyclobutene"},
		5: {"cyclopentane", "cyclopentene", "cyclopentadiene"},
		6: {"cyclohexane", "cyclohexene", "1,3-cyclohexadiene"},
		7: {"cycloheptane", "cycloheptene"},
		8: {"cyclooctane"},
	}[n]
	if len(names) == 0 {
		return ""
	}
	return names[min(nd, len(names)-1)]
}

// ringKey names the ring-strain correction for ring r of g (a cyclic atom
// sequence): the parent monocycle (cyclohexane, cyclopentene, oxirane,
// tetrahydrofuran, furan, methylenecyclopropane …) with the same size, ring
// heteroatoms and number of ring double bonds. An aromatic bond shared with
// a fused benzene ring counts as one double bond (indane → cyclopentene,
// tetralin → cyclohexene, Benson 1976 practice). It returns "" for benzenoid
// rings, which carry no correction, and the fallback key used when the key
// has no value: the all-carbon ring of the same size and unsaturation for
// heterocycles, the same ring with fewer double bonds or without its
// exocyclic double bond for carbocycles.
func (g *graph) ringKey(r []int) (key, fallback string) {
	n := len(r)
	if n == 6 {
		benz := true
		for k, a := range r {
			if !g.benzBond[g.bondBetween(a, r[(k+1)%n])] {
				benz = false
				break
			}
		}
		if benz {
			return "", ""
		}
	}
	oxy, other, aromatic, carbonyl, exo, exoN := 0, 0, 0, 0, 0, 0
	var oPos []int
	var dbl []int // index k of ring bond r[k]–r[k+1] that is double
	for k, a := range r {
		at := g.m.Atoms[a]
		switch at.Element {
		case "C":
		case "O":
			oxy++
			oPos = append(oPos, k)
		default:
			other++
		}
		if at.Aromatic {
			aromatic++
		}
		if g.typ[a] == "CO" {
			carbonyl++
		}
		if t := g.typ[a]; t == "Cd" || t == "Ca" || t == "CdN" {
			if p := g.partner(a, 2); p >= 0 && !slices.Contains(r, p) {
				exo++
				if t == "CdN" {
					exoN++ // an exocyclic C=N (imine, iminyl)
				}
			}
		}
		b := g.bondBetween(a, r[(k+1)%n])
		if o := g.order(b); o == 2 || o == 4 {
			dbl = append(dbl, k)
		}
	}
	nd := len(dbl)
	carbo := ""
	switch {
	case n == 3 && nd == 0:
		carbo = "cyclopropane"
	case n == 3 && nd == 1:
		carbo = "cyclopropene"
	case n == 4 && nd == 0:
		carbo = "cyclobutane"
	case n == 4 && nd == 1:
		carbo = "cyclobutene"
	case n == 5 && nd == 0:
		carbo = "cyclopentane"
	case n == 5 && nd == 1:
		carbo = "cyclopentene"
	case n == 5 && nd == 2:
		carbo = "cyclopentadiene"
	case n == 6 && nd == 0:
		carbo = "cyclohexane"
	case n == 6 && nd == 1:
		carbo = "cyclohexene"
	case n == 6 && nd == 2:
		d := (dbl[1] - dbl[0] + n) % n
		if d == 2 || d == n-2 { // double bonds separated by one single bond
			carbo = "1,3-cyclohexadiene"
		} else {
			carbo = "1,4-cyclohexadiene"
		}
	case n == 7 && nd == 0:
		carbo = "cycloheptane"
	case n == 7 && nd == 1:
		carbo = "cycloheptene"
	case n == 8 && nd == 0:
		carbo = "cyclooctane"
	default:
		carbo = fmt.Sprintf("C%d ring with %d double bonds", n, nd)
	}
	if oxy == 0 && other == 0 && carbonyl == 0 {
		if exo > 0 && n <= 4 {
			// An exocyclic double bond adds strain to a small ring. The
			// corrections were measured with C=C; an exocyclic C=N takes
			// them as the approximation, flagged.
			if n == 3 && nd == 0 && exo == 1 {
				if exoN > 0 {
					return "C3 ring with an exocyclic C=N", "methylenecyclopropane"
				}
				return "methylenecyclopropane", saturatedRing(n)
			}
			return fmt.Sprintf("C%d ring with %d double bonds and %d exocyclic double bonds", n, nd, exo), carboFewer(n, nd)
		}
		if strings.HasPrefix(carbo, "C") {
			return carbo, carboFewer(n, nd)
		}
		return carbo, ""
	}
	if oxy == 0 && other == 0 {
		// ring carbonyl with exocyclic =O: cycloalkanone
		switch {
		case carbonyl == 1 && nd == 0 && n == 5:
			return "cyclopentanone", carbo
		case carbonyl == 1 && nd == 0 && n == 6:
			return "cyclohexanone", carbo
		}
		return fmt.Sprintf(carbonylRingFormat, n, carbonyl, nd), carbo
	}
	key = ""
	if other == 0 {
		switch {
		case oxy == 1 && n == 3 && nd == 0:
			key = "oxirane"
		case oxy == 1 && n == 4 && nd == 0:
			key = "oxetane"
		case oxy == 1 && n == 5 && nd == 0:
			key = "tetrahydrofuran"
		case oxy == 1 && n == 5 && nd == 2 && aromatic == 5:
			key = "furan"
		case oxy == 1 && n == 6 && nd == 0:
			key = "tetrahydropyran"
		case oxy == 2 && n == 5 && nd == 0 && (oPos[1]-oPos[0] == 2 || oPos[1]-oPos[0] == 3):
			key = "1,3-dioxolane"
		case oxy == 2 && n == 6 && nd == 0 && oPos[1]-oPos[0] == 3:
			key = "1,4-dioxane"
		}
	}
	if key == "" {
		key = g.azoleRingKey(r, nd, aromatic) // azole.go
	}
	if key == "" && oxy == 0 {
		key = g.sulfurRingKey(r, nd, aromatic) // hetero_sx.go
	}
	if key != "" && carbonyl > 0 {
		// A lactone, cyclic anhydride or carbonate (or their S analogues):
		// the ether ring's correction was derived without a ring carbonyl,
		// which changes the ring's strain and conformation (γ-butyrolactone
		// comes out about 3 kcal/mol low with tetrahydrofuran's). It is
		// used as the approximation, flagged.
		return fmt.Sprintf("%s ring with %s", key, wording.Count(carbonyl, "ring carbonyl")), key
	}
	if key == "" && oxy == 0 && carbonyl == 0 {
		key = g.nitrogenRingKey(r, nd, aromatic) // hetero_n.go
	}
	if key == "furan" || key == "thiophene" {
		// A furan or thiophene ring fused to aromatic rings: the single
		// ring's correction holds its own aromatic stabilisation, which
		// the fused rings change. The fused ring has a correction of its
		// own by the number of benzene rings it shares a bond with (one:
		// benzothiophene; two: dibenzothiophene, dibenzofuran) where a
		// parent molecule gave one; fused to any other aromatic ring (a
		// pyridine ring, thienothiophene, furofuran), or where no parent
		// gave one (benzofuran), the single ring's is used as an
		// approximation, flagged.
		switch benzene, other := g.fusedAromaticRings(r); {
		case other > 0:
			return key + fusedOtherSuffix, key
		case benzene >= 2:
			return key + fusedTwoBenzenesSuffix, key
		case benzene == 1:
			return key + fusedBenzeneSuffix, key
		}
	}
	if key == "" {
		key = fmt.Sprintf("%d-membered ring with %d O, %d other heteroatoms, %d double bonds", n, oxy, other, nd)
	}
	return key, carbo
}

// carbonylRingFormat is the key of a carbocycle with ring carbonyls and no
// correction of its own: size, ring carbonyls, ring double bonds. The
// quinone widening reads the counts back from the flag (class.go
// quinoneRing), so both use this one format.
const carbonylRingFormat = "C%d ring with %d ring carbonyls, %d double bonds"

// fusedBenzeneSuffix and fusedTwoBenzenesSuffix end the ring correction
// key of a furan or thiophene ring fused to one or to two benzene rings.
// Where the key has no correction, the single ring's is used, flagged
// (widened by widenFusedFiveRing, class.go; isFusedFiveRing).
// fusedOtherSuffix ends the key of a furan or thiophene ring fused to an
// aromatic ring that is not a carbocyclic benzene ring (a pyridine ring,
// another five-membered aromatic ring): no correction, flagged.
const (
	fusedBenzeneSuffix     = " fused to a benzene ring"
	fusedTwoBenzenesSuffix = " fused to two benzene rings"
	fusedOtherSuffix       = " fused to another aromatic ring"
)

// isFusedFiveRing reports whether a ring correction name (or key) is that
// of a furan or thiophene ring fused to another aromatic ring.
func isFusedFiveRing(name string) bool {
	return strings.HasSuffix(name, fusedBenzeneSuffix) || strings.HasSuffix(name, fusedTwoBenzenesSuffix) ||
		strings.HasSuffix(name, fusedOtherSuffix)
}

// fusedAromaticRings counts the aromatic rings of the molecule that share a
// bond with ring r: carbocyclic benzene rings, and all others (azine rings,
// aromatic five-membered rings).
func (g *graph) fusedAromaticRings(r []int) (benzene, other int) {
	for ri, s := range g.rings {
		shared := commonAtoms(r, s)
		if shared < 2 || shared == len(r) && shared == len(s) || !g.aromaticRing(s) {
			continue // not fused to r, or r itself
		}
		if g.benzRing[ri] && g.allCarbon(s) {
			benzene++
		} else {
			other++
		}
	}
	return benzene, other
}

// aromaticRing reports whether every atom of ring s is aromatic.
func (g *graph) aromaticRing(s []int) bool {
	for _, a := range s {
		if !g.m.Atoms[a].Aromatic {
			return false
		}
	}
	return true
}

// allCarbon reports whether every atom of ring s is a carbon.
func (g *graph) allCarbon(s []int) bool {
	for _, a := range s {
		if !g.isCarbon(a) {
			return false
		}
	}
	return true
}

// commonAtoms counts the atoms rings r and s have in common: two or more
// for fused rings (a shared bond), all of them for the same ring.
func commonAtoms(r, s []int) int {
	n := 0
	for _, a := range r {
		if slices.Contains(s, a) {
			n++
		}
	}
	return n
}

// fusedToBenzene reports whether a member of ring r also lies in a
// benzenoid ring.
func (g *graph) fusedToBenzene(r []int) bool {
	for _, a := range r {
		if g.benzAtom[a] > 0 {
			return true
		}
	}
	return false
}

// sameRing reports whether atoms a and b lie together in some ring.
func (g *graph) sameRing(atoms ...int) bool {
	for _, r := range g.rings {
		all := true
		for _, a := range atoms {
			in := false
			for _, x := range r {
				if x == a {
					in = true
					break
				}
			}
			if !in {
				all = false
				break
			}
		}
		if all {
			return true
		}
	}
	return false
}

// ringTriple refuses a triple bond that lies in a ring (cyclohexyne
// C1#CCCCC1, benzyne c1ccc#cc1, cyclopropyne C1#CC1), and a cumulated
// centre both of whose double bonds lie in a ring (1,2-cyclohexadiene
// C1=C=CCCC1). The Ct groups were
// derived from linear acetylenes, and the ring-strain corrections are those
// of rings without a triple bond: no table here describes a bent C≡C or the
// strain of a cycloalkyne or aryne (benzyne came out about 16 kcal/mol low
// with the 1,3-cyclohexadiene correction and an ordinary uncertainty). The
// ring is named by its size, the smallest ring through the bond, which does
// not depend on the spelling; the atom by canonical symmetry class.
func ringTriple(g *graph) error {
	var refusals []atomError
	for b, bond := range g.m.Bonds {
		if bond.Order != 3 || !g.ringBond[b] {
			continue
		}
		n := g.smallestRingThrough(b)
		for _, pair := range [][2]int{{bond.A, bond.B}, {bond.B, bond.A}} {
			i, j := pair[0], pair[1]
			refusals = append(refusals, atomError{i, &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf(
				"(%s) is triple-bonded to atom %d (%s) inside a ring of %d atoms: kiln's tables hold no ring correction for a ring containing a triple bond (cycloalkyne, aryne) and no group for a bent triple bond",
				g.m.Atoms[i].Element, j+1, g.m.Atoms[j].Element, n)}})
		}
	}
	// A cumulated carbon (allene centre) in a ring is bent the same way:
	// 1,2-cyclohexadiene took the 1,4-cyclohexadiene correction unflagged.
	for i, a := range g.m.Atoms {
		var ring []int // its double bonds, both in a ring
		for k, b := range g.nbrBond[i] {
			if bd := g.m.Bonds[b]; bd.Order == 2 && !bd.Aromatic && g.ringBond[b] {
				ring = append(ring, k)
			}
		}
		if len(ring) != 2 {
			continue
		}
		n := g.smallestRingThrough(g.nbrBond[i][ring[0]])
		x, y := g.nbr[i][ring[0]], g.nbr[i][ring[1]]
		refusals = append(refusals, atomError{i, &UnsupportedError{Atom: i + 1, Reason: fmt.Sprintf(
			"(%s) is a cumulated centre (double bonds to atoms %d and %d) inside a ring of %d atoms: kiln's tables hold no ring correction for a ring containing a cumulated double bond (cyclic allene) and no group for a bent allene",
			a.Element, min(x, y)+1, max(x, y)+1, n)}})
	}
	if len(refusals) == 0 {
		return nil
	}
	return canonicalRefusal(g.m, refusals)
}

// smallestRingThrough returns the size of the smallest ring containing bond
// b (a ring bond): one more than the shortest path between its ends that
// avoids b.
func (g *graph) smallestRingThrough(b int) int {
	from, to := g.m.Bonds[b].A, g.m.Bonds[b].B
	dist := make([]int, len(g.m.Atoms))
	for i := range dist {
		dist[i] = -1
	}
	dist[from] = 0
	queue := []int{from}
	for len(queue) > 0 {
		a := queue[0]
		queue = queue[1:]
		for k, c := range g.nbr[a] {
			if g.nbrBond[a][k] == b || dist[c] >= 0 {
				continue
			}
			dist[c] = dist[a] + 1
			if c == to {
				return dist[c] + 1
			}
			queue = append(queue, c)
		}
	}
	return 0 // not a ring bond
}

// addRingEntropyFlags flags the S° and Cp of an estimate that took the
// thiane ring correction (corrections_sx.tsv), unless a group statement
// supplies ring:thiane: its ΔHf° is derived from thiane, its S° and Cp are
// tetrahydropyran's (thianeEntropyGroup). (The furan, thiophene and pyrrole
// ring corrections once took another ring's Cp, or S° and Cp, too; theirs
// are now derived from the parent molecule's measured or rigid-rotor
// harmonic-oscillator values, corrections.tsv, corrections_sx.tsv,
// corrections_n.tsv and rrho.go, and carry no flag.)
func addRingEntropyFlags(l lookup, est *Result) {
	flags := []struct {
		correction, group, approximation, note string
	}{
		{"ring strain: thiane", thianeEntropyGroup, "S and Cp of the thiane ring correction taken as tetrahydropyran's",
			"no S° or Cp of thiane at hand; the six-membered rings with one heteroatom at hand differ in ring S by up to 2.5 cal/(mol K) (tetrahydropyran 16.3, cyclohexane 18.8); ΔHf° is not affected"},
	}
	for _, f := range flags {
		if _, user := l.user["ring:"+strings.TrimPrefix(f.correction, "ring strain: ")]; user {
			continue
		}
		for _, c := range est.Corrections {
			if c.Name == f.correction {
				est.Missing = append(est.Missing, Missing{Group: f.group, Approximation: f.approximation, Note: f.note})
				break
			}
		}
	}
}

// thianeEntropyGroup names the flag of the thiane ring correction's S° and
// Cp (tetrahydropyran's; its ΔHf° is derived from thiane, corrections_sx.tsv);
// it concerns S° and Cp only.
const thianeEntropyGroup = "ring S, Cp: thiane"
