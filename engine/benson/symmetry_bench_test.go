package benson

import (
	"testing"

	"kiln.dev/kiln/engine/molecule"
)

var symBench = []struct{ name, smiles string }{
	{"adamantane", "C1C2CC3CC1CC(C2)C3"},
	{"cubane", "C12C3C4C1C5C2C3C45"},
	{"neopentane", "CC(C)(C)C"},
	{"tetra-tert-butylmethane", "CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C"},
	{"three-ethanes", "CC.CC.CC"},
	{"five-ethanes", "CC.CC.CC.CC.CC"},
	{"ten-ethanes", "CC.CC.CC.CC.CC.CC.CC.CC.CC.CC"},
	{"C53-branched", "C(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C"},
	{"dodecahedrane", "C12C3C4C5C1C6C7C8C2C9C3C%10C4C%11C5C6C%12C7C%13C8C9C%10C%14C%11C%12C%13%14"},
}

func BenchmarkSymmetryNumberSymmetric(b *testing.B) {
	for _, c := range symBench {
		m, err := molecule.ParseSMILES(c.smiles)
		if err != nil {
			b.Fatal(c.name, err)
		}
		b.Run(c.name, func(b *testing.B) {
			for b.Loop() {
				m2, _ := molecule.ParseSMILES(c.smiles) // fresh molecule: nothing cached
				_ = m2
				_ = SymmetryNumber(m2)
			}
			_ = m
		})
	}
}
