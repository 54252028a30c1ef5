package benson

import (
	"fmt"
	"math"

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
// graph itself (a radical carbon with three ligands is treated as planar).
// Radical-centred groups (C•-(C)(H)2 …) are not used: the HBI route covers
// every closed-shell parent the group tables cover.
//
// Site types: primary, secondary, tertiary alkyl (by the number of carbon
// neighbours), allylic (next to Cd, Ca or Ct), benzylic (next to Cb), vinylic
// (on Cd), phenyl (on Cb), acyl (on CO), α-hydroxy and α-alkoxy (sp3 carbon
// next to O bearing H or not), alkoxy (on O), phenoxy (O on Cb), peroxy (O
// on O). Sites outside this list use the nearest one and are reported in
// Missing.

// siteOf classifies radical site i (an atom of the parent graph g).
func siteOf(g *graph, i int) (site, missing string, err error) {
	switch g.m.Atoms[i].Element {
	case "C":
		switch g.typ[i] {
		case "Cb", "Cbf":
			return "phenyl", "", nil
		case "Cd":
			return "vinylic", "", nil
		case "CO":
			return "acyl", "", nil
		case "Ct", "Ca":
			return "vinylic", "ethynyl/allenyl radical site", nil
		}
		carbons := 0
		var next []string
		for _, j := range g.nbr[i] {
			next = append(next, g.typ[j])
			if g.isCarbon(j) {
				carbons++
			}
		}
		for k, t := range next {
			switch t {
			case "Cd", "Ca":
				return "allylic", "", nil
			case "Ct":
				return "allylic", "propargylic radical site", nil
			case "Cb":
				return "benzylic", "", nil
			case "O":
				if g.m.Atoms[g.nbr[i][k]].HCount > 0 {
					return "alpha-hydroxy", "", nil
				}
				return "alpha-alkoxy", "", nil
			}
		}
		if site, miss, ok := heteroSite(g, i); ok {
			return site, miss, nil
		}
		alkyl := "primary"
		switch {
		case carbons == 2:
			alkyl = "secondary"
		case carbons >= 3:
			alkyl = "tertiary"
		}
		for _, t := range next {
			if t == "CO" {
				return alkyl, "alpha-carbonyl radical site (no resonance increment)", nil
			}
		}
		if carbons == 0 {
			return "primary", "methyl-type radical site", nil
		}
		return alkyl, "", nil
	case "O":
		for _, j := range g.nbr[i] {
			switch g.typ[j] {
			case "O":
				return "peroxy", "", nil
			case "Cb":
				return "phenoxy", "", nil
			case "Cd":
				// An enol O–H is as weak as phenol's (the radical is
				// resonance-stabilised towards the carbonyl form).
				return "phenoxy", "vinoxy radical site (O on Cd)", nil
			case "CO":
				return "alkoxy", "acyloxy radical site", nil
			}
		}
		return "alkoxy", "", nil
	}
	if site, miss, ok := heteroSite(g, i); ok {
		return site, miss, nil
	}
	return "", "", fmt.Errorf("benson: radical site on %s is outside the HBI table", g.m.Atoms[i].Element)
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
		site, miss, err := siteOf(g, i)
		if err != nil {
			return fmt.Errorf("atom %d: %w", i+1, err)
		}
		if miss != "" {
			est.Missing = append(est.Missing, Missing{
				Group: "HBI: " + miss, Approximation: "HBI: " + site,
				Note: "no increment for this site; nearest site type used",
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
	for _, site := range order {
		h, ok := l.hbi[site]
		if !ok {
			return fmt.Errorf("benson: no HBI value for site %s", site)
		}
		t := term(h.value, count[site])
		t.Name = "HBI: " + site
		est.Corrections = append(est.Corrections, t)
		if !h.hasSCp {
			est.Corrections = append(est.Corrections, lostModes(site, count[site]))
			est.Missing = append(est.Missing, Missing{
				Group:         "HBI dS, dCp: " + site,
				Approximation: "lost X–H vibrations",
				Note:          "no published entropy and heat-capacity increment at hand: the stretch and two bends of the removed H are taken out as harmonic oscillators",
			})
		}
	}
	return nil
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
		th := secondRadiation * nu
		x := th / 298.15
		t.S298 -= c * R * (x/math.Expm1(x) - math.Log(-math.Expm1(-x)))
		for i, T := range StdTemps {
			x := th / T
			ex := math.Exp(x)
			t.Cp[i] -= c * R * x * x * ex / ((ex - 1) * (ex - 1))
		}
	}
	return t
}
