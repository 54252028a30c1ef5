package benson

import "kiln.dev/kiln/engine/molecule"

// classify names the compound class of m (g is the closed-shell parent):
// radical; aromatic-oxygen or aromatic (any aromatic atom, with or without O);
// for other oxygenates, in priority order, peroxide (O–O), acid-ester (O–C=O),
// carbonyl, alcohol, ether; for hydrocarbons cyclic (any ring), alkyne,
// alkene (C=C or allene), alkane.
func classify(m *molecule.Molecule, g *graph) string {
	for _, a := range m.Atoms {
		if a.Radical > 0 {
			return "radical"
		}
	}
	if c := heteroClass(m); c != "" {
		return c
	}
	oxygen, benz, carbonyl, ring := false, false, false, len(g.rings) > 0
	ct, cd := false, false
	for i, a := range m.Atoms {
		switch g.typ[i] {
		case "O":
			oxygen = true
		case "Cb", "Cbf":
			benz = true
		}
		if a.Aromatic {
			benz = true
		}
		switch g.typ[i] {
		case "CO":
			carbonyl = true
		case "Ct":
			ct = true
		case "Cd", "Ca":
			cd = true
		}
	}
	if benz {
		if oxygen {
			return "aromatic-oxygen"
		}
		return "aromatic"
	}
	if oxygen {
		peroxide, acid, alcohol := false, false, false
		for i, a := range m.Atoms {
			if a.Element != "O" {
				continue
			}
			if a.HCount > 0 && len(g.nbr[i]) > 0 {
				alcohol = true
			}
			for k, j := range g.nbr[i] {
				if g.m.Atoms[j].Element == "O" {
					peroxide = true
				}
				if g.typ[j] == "CO" && g.order(g.nbrBond[i][k]) == 1 {
					acid = true
				}
			}
		}
		switch {
		case peroxide:
			return "peroxide"
		case acid:
			return "acid-ester"
		case carbonyl:
			return "carbonyl"
		case alcohol:
			return "alcohol"
		}
		return "ether"
	}
	switch {
	case ring:
		return "cyclic"
	case ct:
		return "alkyne"
	case cd:
		return "alkene"
	}
	return "alkane"
}

// classMAE is the mean absolute error of ΔHf° (kcal/mol) per class measured
// by TestAccuracy on testdata/thermo/train.tsv (116 rows, run of 2026-12-01
// after the table revision that added the missing O/CO groups, cyclic-ketone
// and bicyclic corrections; rerun `go test -run TestAccuracy/train -v` and
// update when tables change). It is the Uncertainty of an estimate of that
// class: one MAE, not 2×.
var classMAE = map[string]float64{
	"alkane": 0.42, "cyclic": 0.91, "alkene": 0.17, "alkyne": 0.46, "aromatic": 0.55,
	"alcohol": 0.22, "ether": 0.80, "carbonyl": 0.57, "acid-ester": 0.28, "peroxide": 0.76,
	"aromatic-oxygen": 0.55, "radical": 1.02,
	// Measured by TestHeteroAccuracy on the training rows of
	// testdata/thermo/nsx.tsv (unflagged estimates, run of 2026-12-03).
	"nitrogen": 0.34, "sulfur": 0.22, "halogen": 1.15,
}

// classUncertainty returns the Uncertainty (J/mol) of an estimate of class c;
// 0 when the class was not measured.
func classUncertainty(c string) float64 {
	return classMAE[c] * calorie * 1000
}
