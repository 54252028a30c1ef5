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
	{"dodecahedrane", "C12C3C4C5C1C6C7C2C8C3C9C4C%10C5C6C%11C7C8C9C%10%11"},
	{"C60", "c12c3c4c5c1c1c6c7c2c2c8c3c3c9c4c4c%10c5c5c1c1c6c6c%11c7c2c2c7c8c3c3c8c9c4c4c9c%10c5c5c1c1c6c6c%11c2c2c7c3c3c8c4c4c9c5c1c1c6c2c3c41"},
}

// BenchmarkSymmetryNumberSymmetric reads and computes σ of highly symmetric
// structures afresh each time (nothing cached): cages, many identical
// components, a 53-carbon branched alkane.
func BenchmarkSymmetryNumberSymmetric(b *testing.B) {
	for _, c := range symBench {
		if _, err := molecule.ParseSMILES(c.smiles); err != nil {
			b.Fatal(c.name, err)
		}
		b.Run(c.name, func(b *testing.B) {
			for b.Loop() {
				m, _ := molecule.ParseSMILES(c.smiles) // fresh molecule: nothing cached
				_ = SymmetryNumber(m)
			}
		})
	}
}
