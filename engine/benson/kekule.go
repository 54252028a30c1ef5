package benson

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"kiln.dev/kiln/engine/molecule"
)

// Kekulé structures of aromatic rings other than benzene rings.
//
// Benzenoid rings are typed Cb whatever the Kekulé structure the reader
// picked, but the atoms of other aromatic rings (pyridine, quinoline's
// hetero ring, thiophene …) are typed from the Kekulé bond orders (graph.go,
// order), and the reader's choice follows the spelling: 2-methylpyridine
// written one way has Cd-(N)(C), written another Cd-(C)(C). So that the
// estimate is a function of the graph, every Kekulé structure of such a
// molecule is estimated (up to maxKekuleForms distinct structures) and one
// is chosen by a fixed rule:
//
//  1. an estimate wins over a refusal; among estimates, the lowest ΔHf°
//     (the most stable resonance form), then the lowest S°, then the first
//     list of group names;
//  2. among refusals, an *UnsupportedError wins over a *MissingGroupError,
//     and missing groups are ranked by name;
//  3. when the Kekulé structures give different ΔHf°, the choice is flagged
//     in Missing, which widens the uncertainty.
//
// Past the bound the reader's structure is used and flagged.

// maxKekuleForms bounds the distinct Kekulé structures estimated; kekuleWork
// bounds the search for them.
const (
	maxKekuleForms = 16
	kekuleWork     = 20000
)

// kekuleForms returns the Kekulé structures of m that differ in the orders
// of aromatic bonds outside benzenoid rings (m itself among them), nil when
// there is only one; bounded reports that the search stopped at its bound.
func kekuleForms(m *molecule.Molecule) (forms []*molecule.Molecule, bounded bool) {
	aromatic := false
	for _, b := range m.Bonds {
		if b.Aromatic {
			aromatic = true
			break
		}
	}
	if !aromatic || onlyBenzenoid(m) {
		return nil, false
	}
	g := newGraph(m)
	var free []int // aromatic bonds outside benzenoid rings
	for b, bd := range m.Bonds {
		if bd.Aromatic && !g.benzBond[b] {
			free = append(free, b)
		}
	}
	if len(free) == 0 {
		return nil, false
	}
	// Atoms with a double bond in the aromatic system: every Kekulé
	// structure gives each exactly one aromatic double bond.
	need := map[int]bool{}
	for _, bd := range m.Bonds {
		if bd.Aromatic && bd.Order == 2 {
			need[bd.A], need[bd.B] = true, true
		}
	}
	var atoms []int
	for a := range need {
		atoms = append(atoms, a)
	}
	slices.Sort(atoms)
	matched := map[int]int{} // atom → its double bond
	seen := map[string]bool{}
	var orders []map[int]int
	work := 0
	var try func(k int)
	try = func(k int) {
		if bounded || len(orders) > maxKekuleForms {
			return
		}
		if work++; work > kekuleWork {
			bounded = true
			return
		}
		for k < len(atoms) {
			if _, ok := matched[atoms[k]]; !ok {
				break
			}
			k++
		}
		if k == len(atoms) {
			var key strings.Builder
			for _, b := range free {
				if matched[m.Bonds[b].A] == b {
					key.WriteByte('2')
				} else {
					key.WriteByte('1')
				}
			}
			if !seen[key.String()] {
				seen[key.String()] = true
				o := map[int]int{}
				for b, bd := range m.Bonds {
					if bd.Aromatic {
						o[b] = 1
						if matched[bd.A] == b {
							o[b] = 2
						}
					}
				}
				orders = append(orders, o)
			}
			return
		}
		a := atoms[k]
		for _, b := range m.Adj[a] {
			o := m.Other(b, a)
			if !m.Bonds[b].Aromatic || !need[o] {
				continue
			}
			if _, ok := matched[o]; ok {
				continue
			}
			matched[a], matched[o] = b, b
			try(k + 1)
			delete(matched, a)
			delete(matched, o)
		}
	}
	try(0)
	if len(orders) > maxKekuleForms {
		bounded = true
	}
	if bounded || len(orders) < 2 {
		return nil, bounded
	}
	for _, o := range orders {
		alt, err := m.WithBondOrders(o, nil)
		if err != nil {
			return nil, true
		}
		forms = append(forms, alt)
	}
	return forms, false
}

// chooseKekule estimates every form and returns the one chosen by the rule
// at the top of this file.
func chooseKekule(forms []*molecule.Molecule, opts Options) (*Result, error) {
	var best *Result
	var bestErr error
	var names string
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, f := range forms {
		e, err := estimateForm(f, opts)
		if err != nil {
			if best == nil && betterRefusal(err, bestErr) {
				bestErr = err
			}
			continue
		}
		lo, hi = min(lo, e.Hf298), max(hi, e.Hf298)
		var ns []string
		for _, t := range e.Groups {
			ns = append(ns, fmt.Sprintf("%s×%d", t.Name, t.Count))
		}
		n := strings.Join(ns, ",")
		if best == nil || e.Hf298 < best.Hf298 || e.Hf298 == best.Hf298 && (e.S298 < best.S298 || e.S298 == best.S298 && n < names) {
			best, names = e, n
		}
	}
	if best == nil {
		return nil, bestErr
	}
	if hi-lo > 1e-6 {
		best.Missing = append(best.Missing, Missing{
			Group:         "Kekulé structure of a non-benzenoid aromatic ring",
			Approximation: "the Kekulé structure of lowest ΔHf°",
			Note:          fmt.Sprintf("the groups of this aromatic ring depend on its Kekulé structure: %d structures give ΔHf° from %.2f to %.2f kcal/mol", len(forms), lo/calorie/1000, hi/calorie/1000),
		})
		best.finish()
	}
	return best, nil
}

// betterRefusal reports whether refusal a ranks before b (nil b: always):
// unsupported before missing group, missing groups by name.
func betterRefusal(a, b error) bool {
	if b == nil {
		return true
	}
	var ua, ub *UnsupportedError
	var ma, mb *MissingGroupError
	switch {
	case errors.As(a, &ua) && !errors.As(b, &ub):
		return true
	case errors.As(a, &ma) && errors.As(b, &mb):
		return ma.Group < mb.Group
	}
	return false
}

// onlyBenzenoid reports whether every ring of m with an aromatic bond is a
// benzenoid ring (six aromatic carbons, six aromatic bonds), so that no
// aromatic bond is typed from its Kekulé order. Every ring bond lies in a
// ring of the smallest set, so checking those rings is enough.
func onlyBenzenoid(m *molecule.Molecule) bool {
	for _, r := range m.Rings() {
		arom, benz := false, len(r) == 6
		for k, a := range r {
			b := m.BondBetween(a, r[(k+1)%len(r)])
			if b < 0 {
				return false
			}
			if m.Bonds[b].Aromatic {
				arom = true
			} else {
				benz = false
			}
			if at := m.Atoms[a]; at.Element != "C" || !at.Aromatic {
				benz = false
			}
		}
		if arom && !benz {
			return false
		}
	}
	return true
}
