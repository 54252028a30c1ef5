package benson

import "fmt"

// ringKey names the ring-strain correction for ring r of g: the parent
// monocycle (cyclohexane, cyclopentene, oxirane, tetrahydrofuran, furan …)
// with the same size, ring heteroatoms and number of ring double bonds. An
// aromatic bond shared with a fused benzene ring counts as one double bond
// (indane → cyclopentene, tetralin → cyclohexene, Benson 1976 practice).
// It returns "" for benzenoid rings, which carry no correction, and the
// all-carbon fallback key of the same size and unsaturation.
func (g *graph) ringKey(ri int) (key, fallback string) {
	if g.benzRing[ri] {
		return "", ""
	}
	r := g.rings[ri]
	n := len(r)
	oxy, other, aromatic, carbonyl := 0, 0, 0, 0
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
	case n == 3:
		carbo = "cyclopropene"
	case n == 4 && nd == 0:
		carbo = "cyclobutane"
	case n == 4:
		carbo = "cyclobutene"
	case n == 5 && nd == 0:
		carbo = "cyclopentane"
	case n == 5 && nd == 1:
		carbo = "cyclopentene"
	case n == 5:
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
		return fmt.Sprintf("C%d ring with %d ring carbonyls, %d double bonds", n, carbonyl, nd), carbo
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
		key = fmt.Sprintf("%d-membered ring with %d O, %d other heteroatoms, %d double bonds", n, oxy, other, nd)
	}
	return key, carbo
}

// addRingCorrections adds one ring-strain term per non-benzenoid SSSR ring.
// Polycyclic systems are treated as the sum of their rings (exact for the
// Benson practice on fused systems like decalin and indane; for bridged and
// spiro systems it is an approximation and is reported in Missing).
func addRingCorrections(g *graph, l lookup, est *Result) {
	counts := map[string]int{}
	var order []string
	for ri := range g.rings {
		key, fallback := g.ringKey(ri)
		if key == "" {
			continue
		}
		name := "ring:" + key
		if _, ok := l.corrections[name]; !ok {
			approx := ""
			if fallback != "" {
				if _, ok := l.corrections["ring:"+fallback]; ok {
					approx = "ring:" + fallback
				}
			}
			note := "no ring correction known; none applied"
			if approx != "" {
				note = "heteroatoms ignored: all-carbon ring of the same size and unsaturation used"
			}
			est.Missing = append(est.Missing, Missing{Group: name, Approximation: approx, Note: note})
			if approx == "" {
				continue
			}
			name = approx
		}
		if counts[name] == 0 {
			order = append(order, name)
		}
		counts[name]++
	}
	for _, name := range order {
		t := term(l.corrections[name], counts[name])
		t.Name = "ring strain: " + name[len("ring:"):]
		est.Corrections = append(est.Corrections, t)
	}
	// Bridged (rings sharing ≥ 3 atoms) or spiro (sharing exactly 1 atom)
	// systems: a whole-system strain from the table when one is known,
	// otherwise the sum of the ring corrections, reported in Missing.
	for i := 0; i < len(g.rings); i++ {
		for j := i + 1; j < len(g.rings); j++ {
			shared := 0
			for _, a := range g.rings[i] {
				for _, b := range g.rings[j] {
					if a == b {
						shared++
					}
				}
			}
			kind := ""
			switch {
			case shared == 1:
				kind = "spiro"
			case shared >= 3:
				kind = "bridged"
			}
			if kind == "" {
				continue
			}
			if name := g.systemKey(i, j, shared); name != "" {
				if v, ok := l.corrections["system:"+name]; ok {
					ki, _ := g.ringKey(i)
					kj, _ := g.ringKey(j)
					t := Term{Name: "ring system strain: " + name, Count: 1, Source: v.Source + "; minus the ring terms " + ki + " and " + kj}
					t.Hf298 = v.Hf298 - l.corrections["ring:"+ki].Hf298 - l.corrections["ring:"+kj].Hf298
					est.Corrections = append(est.Corrections, t)
					continue
				}
			}
			est.Missing = append(est.Missing, Missing{
				Group: fmt.Sprintf("ring system: %s %d/%d", kind, len(g.rings[i]), len(g.rings[j])),
				Note:  "no correction for the polycyclic system; the sum of its ring corrections is used",
			})
		}
	}
}

// systemKey names the saturated all-carbon bicyclic system formed by SSSR
// rings i and j sharing `shared` atoms, when it is one of those with a
// tabulated whole-system strain; "" otherwise. Only two-ring systems whose
// rings touch no third ring qualify.
func (g *graph) systemKey(i, j, shared int) string {
	ri, rj := g.rings[i], g.rings[j]
	for _, r := range [][]int{ri, rj} {
		for k, a := range r {
			if g.m.Atoms[a].Element != "C" || g.typ[a] != "C" || g.ringAtom[a] > 2 {
				return ""
			}
			if g.order(g.bondBetween(a, r[(k+1)%len(r)])) != 1 {
				return ""
			}
		}
	}
	atoms := len(ri) + len(rj) - shared
	a, b := min(len(ri), len(rj)), max(len(ri), len(rj))
	switch {
	case shared == 3 && a == 5 && b == 5 && atoms == 7:
		return "bicyclo[2.2.1]heptane"
	case shared == 1 && a == 3 && b == 3:
		return "spiro[2.2]pentane"
	}
	return ""
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
