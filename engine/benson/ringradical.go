package benson

import (
	"fmt"
	"slices"
	"strings"

	"kiln.dev/kiln/engine/molecule"
)

// Ring radicals. The open-chain hydrogen-bond increments do not describe a
// radical site whose geometry a small ring constrains, nor one delocalised
// around a ring:
//
//   - in a 3- or 4-membered ring the radical carbon cannot relax towards
//     planarity as an open-chain one does (cyclopropane's C–H is ~8 kcal/mol
//     stronger than a secondary C–H), and
//   - a radical whose electron runs around an odd ring through a double bond
//     at every other atom (cyclopropenyl, cyclopentadienyl,
//     cycloheptatrienyl) has a cyclic delocalisation no allylic increment
//     holds (cyclopentadiene's C–H is ~7 kcal/mol weaker than propene's).
//
// Where a published C–H bond enthalpy of the ring parent is at hand
// (ringSiteBDE, cyclopentadienylBDE) the site's increment is replaced by it:
// a correction term ΔHf = D(ring) − D(increment used) is added. The value is
// unflagged for the parent site itself (an unsubstituted all-carbon ring, the
// plain alkyl or ring-conjugated site it was measured on); any other site in
// a small or cyclically conjugated ring — substituted, heteroatom ring,
// vinylic or allylic in the small ring, ring sizes without a value — is
// reported in Missing with the approximation used, which widens the
// uncertainty like any missing ring correction (class.go). Only
// monoradicals are treated; ΔS and ΔCp are left to the site model.

// ringBDE is a published C–H bond dissociation enthalpy (kcal/mol, 298 K).
type ringBDE struct {
	d      float64
	parent string
	source string
}

// ringSiteBDE holds the sp3 C–H bond enthalpies of the small cycloalkanes,
// by ring size.
var ringSiteBDE = map[int]ringBDE{
	3: {106.3, "cyclopropane", "Luo, Comprehensive Handbook of Chemical Bond Energies (2007), cyclopropane C–H (from memory)"},
	4: {96.5, "cyclobutane", "Luo (2007), cyclobutane C–H (from memory; uncertain by about 1 kcal/mol)"},
}

// cyclopentadienylBDE is the C–H bond enthalpy of cyclopentadiene's CH2.
var cyclopentadienylBDE = ringBDE{81.5, "cyclopentadiene", "Luo (2007), cyclopentadiene C5H5–H (from memory; uncertain by about 1.5 kcal/mol)"}

// addRingRadical appends the ring-radical correction or flag of m's radical
// site (see above); est already holds the site's HBI term.
func addRingRadical(m *molecule.Molecule, est *Result) {
	site := -1
	for i, a := range m.Atoms {
		if a.Radical > 0 {
			if site >= 0 {
				return // monoradicals only
			}
			site = i
		}
	}
	if site < 0 || m.Atoms[site].Element != "C" || !m.IsInRing(site) {
		return
	}
	hbi := slices.IndexFunc(est.Corrections, func(t Term) bool {
		return strings.HasPrefix(t.Name, "HBI: ") && t.Count == 1
	})
	if hbi < 0 {
		return
	}
	used := est.Corrections[hbi]
	siteType := strings.TrimPrefix(used.Name, "HBI: ")
	flagged := slices.ContainsFunc(est.Missing, func(x Missing) bool {
		return strings.HasPrefix(x.Group, "HBI: ") // the increment itself was a stand-in
	})

	if ring := cyclicConjugation(m, site); ring != nil {
		n := len(ring)
		if n == 5 && allCarbon(m, ring) {
			est.Corrections = append(est.Corrections, bdeCorrection(cyclopentadienylBDE, used, "cyclically delocalised 5-ring"))
			// The measured bond enthalpy replaces the increment and
			// whatever it left out (e.g. a second allylic neighbour):
			// the increment's own flags no longer apply.
			est.Missing = slices.DeleteFunc(est.Missing, func(x Missing) bool { return strings.HasPrefix(x.Group, "HBI: ") })
			if substituted(m, ring) {
				est.Missing = append(est.Missing, Missing{
					Group:         "ring radical: substituted or hetero cyclopentadienyl site",
					Approximation: "C–H bond enthalpy of " + cyclopentadienylBDE.parent,
					Note:          "the parent ring's bond enthalpy is used for a substituted ring",
				})
			}
			return
		}
		est.Missing = append(est.Missing, Missing{
			Group:         fmt.Sprintf("ring radical: radical delocalised around a %d-membered ring", n),
			Approximation: "HBI: " + siteType,
			Note:          "no bond enthalpy at hand for a cyclically conjugated radical of this ring: the open-chain increment is used",
		})
		return
	}

	size := 0
	for _, s := range m.RingSizes(site) {
		if size == 0 || s < size {
			size = s
		}
	}
	v, ok := ringSiteBDE[size]
	if !ok {
		return
	}
	switch siteType {
	case "primary", "secondary", "tertiary":
		est.Corrections = append(est.Corrections, bdeCorrection(v, used, fmt.Sprintf("%d-membered ring", size)))
		ring := smallestRing(m, site, size)
		if siteType != "secondary" || !allCarbon(m, ring) || flagged {
			est.Missing = append(est.Missing, Missing{
				Group:         fmt.Sprintf("ring radical: substituted or hetero %d-membered ring site", size),
				Approximation: "C–H bond enthalpy of " + v.parent,
				Note:          "the parent ring's bond enthalpy is used for this ring site",
			})
		}
	default:
		est.Missing = append(est.Missing, Missing{
			Group:         fmt.Sprintf("ring radical: %s site in a %d-membered ring", siteType, size),
			Approximation: "HBI: " + siteType,
			Note:          "no bond enthalpy at hand for this site in a small ring: the open-chain increment is used",
		})
	}
}

// bdeCorrection replaces the increment used by a published bond enthalpy.
func bdeCorrection(v ringBDE, used Term, what string) Term {
	return Term{
		Name:   "ring radical: " + what + " (C–H bond enthalpy of " + v.parent + ")",
		Count:  1,
		Hf298:  (v.d*1000*calorie - hfH) - used.Hf298,
		Source: v.source,
	}
}

// cyclicConjugation returns an odd ring of m through site whose other atoms
// are paired by double bonds inside the ring (the electron runs around the
// ring), or nil. Rings with aromatic atoms are not considered: their double
// bonds are those of one Kekulé structure, not of the molecule.
func cyclicConjugation(m *molecule.Molecule, site int) []int {
	for _, r := range m.Rings() {
		if len(r)%2 == 0 || !slices.Contains(r, site) {
			continue
		}
		if slices.ContainsFunc(r, func(j int) bool { return m.Atoms[j].Aromatic }) {
			// a benzo-fused ring's double bonds are one Kekulé
			// structure's: the site is benzylic, not cyclic
			continue
		}
		paired := 0
		for _, j := range r {
			if j == site {
				continue
			}
			for _, b := range m.Adj[j] {
				if m.Bonds[b].Order == 2 && slices.Contains(r, m.Other(b, j)) {
					paired++
					break
				}
			}
		}
		if paired == len(r)-1 {
			return r
		}
	}
	return nil
}

// smallestRing returns a ring of the given size through site.
func smallestRing(m *molecule.Molecule, site, size int) []int {
	for _, r := range m.Rings() {
		if len(r) == size && slices.Contains(r, site) {
			return r
		}
	}
	return nil
}

func allCarbon(m *molecule.Molecule, ring []int) bool {
	for _, i := range ring {
		if m.Atoms[i].Element != "C" {
			return false
		}
	}
	return len(ring) > 0
}

// substituted reports whether an atom of ring has a heavy neighbour
// outside it, or belongs to another ring.
func substituted(m *molecule.Molecule, ring []int) bool {
	for _, i := range ring {
		for _, j := range m.Neighbors(i) {
			if !slices.Contains(ring, j) {
				return true
			}
		}
	}
	return false
}
